import "server-only";
/**
 * Uploads in parts, for files too large for one request (our own protocol, see README "Uploads in parts"):
 *   start  — POST …/steps/:stepId/uploads {name, size, sha256?, kind?}: 413 past the upload limit; answers the part size;
 *   parts  — PUT …/uploads/:uploadId/parts/:n with the raw bytes: every part but the last is exactly the part size;
 *            sending a part again replaces it (a retry is harmless);
 *   resume — GET …/uploads/:uploadId: which parts the server has;
 *   finish — POST …/uploads/:uploadId/finish: assembles the parts, checks size, SHA-256 and type by content, stores the
 *            file once by its SHA-256, and in ONE transaction creates the file's row and deletes the upload's;
 *   abandon — DELETE …/uploads/:uploadId.
 * Parts are staged under the data folder (lib/uploads/parts.ts). Until the finish commits there is no file row, and the
 * assembled object is written before that row (lib/data/files.ts), so an upload stopped at any point leaves no row without
 * its file; what it leaves (staged parts, an object no row names) is removed by the scheduled file sweep.
 */
import { models } from "@/models";
import { AppError, invalid, notFound } from "@/lib/errors";
import { readEnv } from "@/lib/env";
import { Op } from "sequelize";
import { sizeName, uploadTooLarge } from "@/lib/http";
import { acceptUpload, cleanFileName, linkToClaim, saveStepFile, type StepFileView } from "./files";
import { assembleParts, partCount, partLength, receivedParts, removeStaging, stagedUploads, writePart } from "@/lib/uploads/parts";
import { sha256Hex } from "@/lib/storage";
import type { PartUpload } from "@/models/part-upload";
import type { FileKind } from "@/lib/uploads/detect";

export interface PartUploadView {
  id: number;
  stepId: number;
  name: string;
  size: number;
  partSize: number;
  parts: number;
  /** The parts the server has, ascending. */
  received: number[];
  /** The parts still to send, ascending. */
  missing: number[];
}

const view = async (u: PartUpload): Promise<PartUploadView> => {
  const parts = partCount(u.size, u.partSize);
  const received = (await receivedParts(u.id)).filter((n) => n <= parts);
  const have = new Set(received);
  return {
    id: u.id,
    stepId: u.stepId,
    name: u.name,
    size: u.size,
    partSize: u.partSize,
    parts,
    received,
    missing: Array.from({ length: parts }, (_, i) => i + 1).filter((n) => !have.has(n)),
  };
};

export async function startPartUpload(
  stepId: number,
  userId: number,
  input: { name: string; size: number; sha256?: string; kind?: FileKind; claimId?: number },
): Promise<PartUploadView> {
  const env = readEnv();
  if (input.size > env.CAIRN_UPLOAD_MAX_BYTES) throw uploadTooLarge(env.CAIRN_UPLOAD_MAX_BYTES);
  if (input.claimId !== undefined) {
    const claim = await models().Claim.findByPk(input.claimId, { attributes: ["id", "stepId"] });
    if (!claim || claim.stepId !== stepId) throw invalid("This claim is not on this step.", [{ path: "claimId", message: "a claim of this step" }]);
  }
  const row = await models().PartUpload.create({
    stepId,
    userId,
    claimId: input.claimId ?? null,
    name: cleanFileName(input.name),
    kind: input.kind ?? null,
    size: input.size,
    partSize: env.CAIRN_UPLOAD_PART_BYTES,
    sha256: input.sha256 ?? null,
  });
  return view(row);
}

/** The upload, if it is one on this step; 404 otherwise (finished, abandoned, swept, or another step's). */
async function loadUpload(stepId: number, uploadId: number): Promise<PartUpload> {
  const row = await models().PartUpload.findByPk(uploadId);
  if (!row || row.stepId !== stepId) throw notFound("This upload");
  return row;
}

export const describePartUpload = async (stepId: number, uploadId: number): Promise<PartUploadView> => view(await loadUpload(stepId, uploadId));

/** Reads part `n` from the request and stages it: 400 for a part number the upload does not have or a part of the wrong length. */
export async function receivePart(stepId: number, uploadId: number, n: number, readBody: (limit: number) => Promise<Uint8Array>) {
  const u = await loadUpload(stepId, uploadId);
  const parts = partCount(u.size, u.partSize);
  if (!Number.isInteger(n) || n < 1 || n > parts)
    throw new AppError(
      "bad_request",
      `There is no part ${Number.isNaN(n) ? "with that number" : n} in this upload: its parts are numbered 1 to ${parts} (${sizeName(u.partSize)} each, the last one shorter).`,
    );
  const expected = partLength(u.size, u.partSize, n);
  const wrongLength = (got: string) =>
    new AppError(
      "bad_request",
      `Part ${n} must be exactly ${expected} bytes (the upload of ${u.size} bytes in parts of ${u.partSize}); it was ${got}. Send it again.`,
    );
  let bytes: Uint8Array;
  try {
    bytes = await readBody(expected);
  } catch (e) {
    if (e instanceof AppError && e.code === "too_large") throw wrongLength("longer");
    throw e;
  }
  if (bytes.byteLength !== expected) throw wrongLength(`${bytes.byteLength} bytes`);
  await writePart(u.id, n, bytes);
  u.changed("updatedAt", true);
  await u.save({ fields: ["updatedAt"] });
  return view(u);
}

/**
 * Finishes the upload: 409 naming the parts still missing, 413 past the upload limit (as it is now), 409 when the
 * bytes' SHA-256 is not the one declared, 415 by content; otherwise the file is stored and its row made, and the
 * upload's row deleted in the same transaction, then its staged parts.
 */
export async function finishPartUpload(proofId: number, stepId: number, userId: number, uploadId: number): Promise<{ file: StepFileView; duplicate: boolean }> {
  const u = await loadUpload(stepId, uploadId);
  const described = await view(u);
  if (described.missing.length > 0) {
    const shown = described.missing.slice(0, 20).join(", ") + (described.missing.length > 20 ? ` and ${described.missing.length - 20} more` : "");
    throw new AppError(
      "conflict",
      `The upload is not complete: part${described.missing.length === 1 ? "" : "s"} ${shown} of ${described.parts} ${described.missing.length === 1 ? "is" : "are"} missing. Send ${described.missing.length === 1 ? "it" : "them"}, then finish again.`,
      undefined,
      { missing: described.missing },
    );
  }
  const limit = readEnv().CAIRN_UPLOAD_MAX_BYTES;
  const bytes = await assembleParts(u.id, described.parts);
  if (bytes.byteLength > limit) throw uploadTooLarge(limit);
  const sha256 = sha256Hex(bytes);
  if (u.sha256 && u.sha256 !== sha256)
    throw new AppError(
      "conflict",
      `The parts put together have SHA-256 ${sha256}, not the ${u.sha256} declared at the start: a part was damaged on the way. Send the parts again, then finish.`,
    );
  const detected = acceptUpload(bytes, limit, u.kind);
  const saved = await saveStepFile(proofId, stepId, userId, u.name, bytes, detected, async (transaction, row) => {
    const gone = await models().PartUpload.destroy({ where: { id: u.id }, transaction });
    if (!gone) throw new AppError("conflict", "This upload was finished or abandoned meanwhile; nothing more was saved.");
    if (u.claimId) await linkToClaim(u.claimId)(transaction, row);
  });
  await removeStaging(u.id);
  return { file: saved.file, duplicate: saved.duplicate };
}

export async function abandonPartUpload(stepId: number, uploadId: number): Promise<void> {
  const u = await loadUpload(stepId, uploadId);
  await u.destroy();
  await removeStaging(u.id);
}

/**
 * For the scheduled sweep: removes uploads in parts untouched for `olderThanMs` (their rows and staged parts), and staged
 * folders of uploads that have no row (finished or abandoned while a part was being written). Returns how many went.
 */
export async function sweepPartUploads(olderThanMs: number, now = Date.now()): Promise<number> {
  const { PartUpload } = models();
  const cutoff = new Date(now - olderThanMs);
  let removed = 0;
  for (const u of await PartUpload.findAll({ where: { updatedAt: { [Op.lt]: cutoff } } })) {
    await u.destroy();
    await removeStaging(u.id);
    removed++;
  }
  for (const s of await stagedUploads()) {
    if (s.modified >= cutoff) continue;
    if (await PartUpload.findByPk(s.uploadId, { attributes: ["id"] })) continue;
    await removeStaging(s.uploadId);
    removed++;
  }
  return removed;
}
