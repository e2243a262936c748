import "server-only";
import { models } from "@/models";
import { getSequelize } from "@/lib/db";
import { AppError, notFound } from "@/lib/errors";
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
}

const view = (proofId: number, f: StepFile & { uploader?: { name: string } | null }): StepFileView => ({
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
});

export async function listStepFiles(proofId: number, stepId: number): Promise<StepFileView[]> {
  const { StepFile, User } = models();
  const rows = await StepFile.findAll({ where: { stepId }, include: [{ model: User, as: "uploader", attributes: ["name"] }], order: [["id", "ASC"]] });
  return rows.map((r) => view(proofId, r as StepFile & { uploader?: { name: string } }));
}

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
  /** Run inside the row's transaction (an upload in parts deletes its own row there); throwing undoes the row. */
  within?: (transaction: Transaction) => Promise<void>,
): Promise<{ file: StepFileView; duplicate: boolean; storedNew: boolean }> {
  const { StepFile, AuditEvent } = models();
  const put = await fileStore().put(bytes);
  const result = await getSequelize().transaction(async (transaction) => {
    await within?.(transaction);
    const existing = await StepFile.findOne({ where: { stepId, sha256: put.sha256 }, transaction, lock: transaction.LOCK.UPDATE });
    if (existing) return { row: existing, duplicate: true };
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
    return { row, duplicate: false };
  });
  // The orphan sweep may have removed these bytes between `put` (which found them stored) and the commit
  // (they were named by no row then); the row is committed now, so storing them again closes that gap.
  if (!put.created && !(await fileStore().has(put.sha256))) await fileStore().put(bytes);
  const withUploader = await StepFile.findByPk(result.row.id, { include: [{ model: models().User, as: "uploader", attributes: ["name"] }] });
  return { file: view(proofId, withUploader as StepFile & { uploader?: { name: string } }), duplicate: result.duplicate, storedNew: put.created };
}

/** The file's row and the step it belongs to; 404 unless it is a file of this proof. */
export async function loadStepFile(proofId: number, fileId: number): Promise<StepFileView> {
  const { StepFile, Step, Case } = models();
  const row = await StepFile.findByPk(fileId);
  const step = row ? await Step.findByPk(row.stepId, { attributes: ["id", "caseId"] }) : null;
  const c = step ? await Case.findByPk(step.caseId, { attributes: ["proofId"] }) : null;
  if (!row || !c || c.proofId !== proofId) throw notFound("This file");
  return view(proofId, row);
}

/** The stored bytes of a file row (null only if the store lost them). */
export const readStoredFile = (sha256: string): Promise<Uint8Array | null> => fileStore().get(sha256);

/** Whether any row names this object (for the orphan sweep). */
export async function isFileNamed(sha256: string): Promise<boolean> {
  return (await models().StepFile.count({ where: { sha256 } })) > 0;
}
