import "server-only";
import { models } from "@/models";
import { getSequelize } from "@/lib/db";
import { AppError, invalid, notFound } from "@/lib/errors";
import { readEnv } from "@/lib/env";
import { readFileBody, zodIssues } from "@/lib/http";
import { uploadQuerySchema } from "@/lib/validations/upload";
import { detectFile, UnpackedTooLarge, UnsupportedContent } from "@/lib/uploads/detect";
import { fileStore } from "@/lib/storage";
import type { DetectedFile, FileKind } from "@/lib/uploads/detect";
import type { Transaction } from "sequelize";
import type { GraphListFormat } from "@/lib/core/input/graph-list";
import type { StepFile } from "@/models/step-file";

/**
 * Files uploaded to steps. Saving writes the bytes to the file store first (content-addressed: stored
 * once, whoever uploads them to whichever step), then the row in a transaction with its audit event.
 * A failure between the two leaves an object that no row names, which is harmless (the next upload
 * of the same bytes reuses it) and is removed by the orphan sweep; a row never names a missing object.
 */

export interface StepFileView {
  id: number;
  stepId: number;
  name: string;
  kind: FileKind;
  mediaType: string;
  description: string;
  size: number;
  sha256: string;
  graphFormat: GraphListFormat | null;
  graphCount: number | null;
  uploadedBy: number;
  uploaderName: string | null;
  createdAt: string;
  /** Where a member downloads it. */
  href: string;
  /** The claims it was uploaded to (a claim's files are files of its step, linked to the claim). */
  claimIds: number[];
}

const view = (proofId: number, f: StepFile & { uploader?: { name: string } | null }, claimIds: number[] = []): StepFileView => ({
  id: f.id,
  stepId: f.stepId,
  name: f.name,
  kind: f.kind,
  mediaType: f.mediaType,
  description: f.description,
  size: f.size,
  sha256: f.sha256,
  graphFormat: f.graphFormat,
  graphCount: f.graphCount,
  uploadedBy: f.uploadedBy,
  uploaderName: f.uploader?.name ?? null,
  createdAt: f.createdAt.toISOString(),
  href: `/api/proofs/${proofId}/files/${f.id}`,
  claimIds,
});

/** The claims each of these files is linked to. */
async function claimLinks(fileIds: number[], transaction?: Transaction): Promise<Map<number, number[]>> {
  const links = new Map<number, number[]>();
  if (fileIds.length === 0) return links;
  for (const l of await models().ClaimFile.findAll({ where: { fileId: fileIds }, order: [["claimId", "ASC"]], transaction }))
    links.set(l.fileId, [...(links.get(l.fileId) ?? []), l.claimId]);
  return links;
}

export async function listStepFiles(proofId: number, stepId: number): Promise<StepFileView[]> {
  const { StepFile, User } = models();
  const rows = await StepFile.findAll({ where: { stepId }, include: [{ model: User, as: "uploader", attributes: ["name"] }], order: [["id", "ASC"]] });
  const links = await claimLinks(rows.map((r) => r.id));
  return rows.map((r) => view(proofId, r as StepFile & { uploader?: { name: string } }, links.get(r.id)));
}

/** The files uploaded to this claim (files of its step linked to it). */
export async function listClaimFiles(proofId: number, stepId: number, claimId: number): Promise<StepFileView[]> {
  return (await listStepFiles(proofId, stepId)).filter((f) => f.claimIds.includes(claimId));
}

/** For saveStepFile's `within`: links the file row to the claim (once). */
export const linkToClaim = (claimId: number) => async (transaction: Transaction, row: StepFile) => {
  await models().ClaimFile.findOrCreate({ where: { claimId, fileId: row.id }, defaults: { claimId, fileId: row.id }, transaction });
};

/** A display name for the stored row: the uploaded name without folders or control characters. */
export function cleanFileName(name: string | null | undefined): string {
  const base = (name ?? "").split(/[\\/]/).pop() ?? "";
  const clean = base
    .replace(/[\x00-\x1f\x7f"]/g, "")
    .trim()
    .slice(0, 200);
  return clean || "upload";
}

/** Unpacked gzip may be this many times the upload limit. */
const UNPACK_FACTOR = 4;

/**
 * What the uploaded bytes are, decided by their content: 415 for content Cairn does not take (or that
 * contradicts the `kind` the uploader chose), 413 when gzip unpacks past UNPACK_FACTOR × the limit.
 */
export function acceptUpload(bytes: Uint8Array, limit: number, kind?: FileKind | null): DetectedFile {
  try {
    return detectFile(bytes, limit * UNPACK_FACTOR, kind ?? undefined);
  } catch (e) {
    if (e instanceof UnsupportedContent) throw new AppError("unsupported_media_type", e.message);
    if (e instanceof UnpackedTooLarge)
      throw new AppError(
        "too_large",
        `The gzip file unpacks to more than ${UNPACK_FACTOR} × the upload limit (${e.limit} bytes); nothing was saved. Split the list into several files.`,
        undefined,
        { limitBytes: e.limit },
      );
    throw e;
  }
}

/**
 * Stores the file and its row; `duplicate` when this step already had these bytes (its existing row
 * is returned and nothing new is written).
 */
export async function saveStepFile(
  proofId: number,
  stepId: number,
  userId: number,
  name: string,
  bytes: Uint8Array,
  detected: DetectedFile,
  /** Run inside the row's transaction with the row (an upload in parts deletes its own row there, a claim's upload links it); throwing undoes the row. */
  within?: (transaction: Transaction, row: StepFile) => Promise<void>,
): Promise<{ file: StepFileView; duplicate: boolean; storedNew: boolean }> {
  const { StepFile, AuditEvent } = models();
  const put = await fileStore().put(bytes);
  const result = await getSequelize().transaction(async (transaction) => {
    const existing = await StepFile.findOne({ where: { stepId, sha256: put.sha256 }, transaction, lock: transaction.LOCK.UPDATE });
    if (existing) {
      await within?.(transaction, existing);
      return { row: existing, duplicate: true };
    }
    const row = await StepFile.create(
      {
        stepId,
        sha256: put.sha256,
        size: put.size,
        name: cleanFileName(name),
        kind: detected.kind,
        mediaType: detected.mediaType,
        description: detected.description,
        graphFormat: detected.graphFormat,
        graphCount: detected.graphCount,
        uploadedBy: userId,
      },
      { transaction },
    );
    await AuditEvent.create(
      { proofId, actorId: userId, action: "file.uploaded", subjectType: "step", subjectId: stepId, detail: `${row.name}: ${detected.description}` },
      { transaction },
    );
    await within?.(transaction, row);
    return { row, duplicate: false };
  });
  // The orphan sweep may have removed these bytes between `put` (which found them stored) and the commit
  // (they were named by no row then); the row is committed now, so storing them again closes that gap.
  if (!put.created && !(await fileStore().has(put.sha256))) await fileStore().put(bytes);
  const withUploader = await StepFile.findByPk(result.row.id, { include: [{ model: models().User, as: "uploader", attributes: ["name"] }] });
  const links = await claimLinks([result.row.id]);
  return {
    file: view(proofId, withUploader as StepFile & { uploader?: { name: string } }, links.get(result.row.id)),
    duplicate: result.duplicate,
    storedNew: put.created,
  };
}

/** The file's row and the step it belongs to; 404 unless it is a file of this proof. */
export async function loadStepFile(proofId: number, fileId: number): Promise<StepFileView> {
  const { StepFile, Step, Case } = models();
  const row = await StepFile.findByPk(fileId);
  const step = row ? await Step.findByPk(row.stepId, { attributes: ["id", "caseId"] }) : null;
  const c = step ? await Case.findByPk(step.caseId, { attributes: ["proofId"] }) : null;
  if (!row || !c || c.proofId !== proofId) throw notFound("This file");
  return view(proofId, row, (await claimLinks([row.id])).get(row.id));
}

/** The stored bytes of a file row (null only if the store lost them). */
export const readStoredFile = (sha256: string): Promise<Uint8Array | null> => fileStore().get(sha256);

/** Whether any row names this object (for the orphan sweep). */
export async function isFileNamed(sha256: string): Promise<boolean> {
  return (await models().StepFile.count({ where: { sha256 } })) > 0;
}

/**
 * A one-request upload: the raw bytes are the body, `?name=` the file's name and `?kind=` optionally what the uploader
 * means (422 without a name). 413 past CAIRN_UPLOAD_MAX_BYTES, 415 by content; then stored as saveStepFile does.
 */
export async function receiveUpload(
  request: Request,
  proofId: number,
  stepId: number,
  userId: number,
  within?: (transaction: Transaction, row: StepFile) => Promise<void>,
): Promise<{ file: StepFileView; duplicate: boolean }> {
  const query = uploadQuerySchema.safeParse(Object.fromEntries(new URL(request.url).searchParams));
  if (!query.success) throw invalid("Say which file this is.", zodIssues(query.error));
  const limit = readEnv().CAIRN_UPLOAD_MAX_BYTES;
  const bytes = await readFileBody(request, limit);
  const detected = acceptUpload(bytes, limit, query.data.kind);
  const { file, duplicate } = await saveStepFile(proofId, stepId, userId, query.data.name, bytes, detected, within);
  return { file, duplicate };
}
