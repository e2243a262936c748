import "server-only";
/**
 * The scheduled sweep of uploaded files (a repeatable job on the verification queue, run by whichever
 * worker takes it; lib/jobs/worker.ts schedules it). Uploads write the object first and the row after
 * (lib/data/files.ts), so an upload cut short can leave an object that no row names: those older than
 * the age below are deleted. The other way round, a row whose object is gone (a store restored from an
 * older backup, an object removed by hand) is reported, and deleted when nothing refers to it; a row a
 * batch claim was made over is kept, so the batch keeps its file's name, and the worker says so. Uploads in parts
 * untouched for the same age are abandoned: their rows and staged parts are removed (lib/data/part-uploads.ts).
 */
import { QueryTypes } from "sequelize";
import { getSequelize } from "@/lib/db";
import { models } from "@/models";
import { fileStore, sweepOrphans } from "@/lib/storage";
import { isFileNamed } from "./files";
import { sweepPartUploads } from "./part-uploads";
import { recordEvent } from "./audit";

export interface FileSweepReport {
  /** Objects no row named, deleted. */
  objectsRemoved: number;
  /** Rows whose object was missing, deleted. */
  rowsRemoved: number;
  /** Rows whose object is missing but that a batch claim refers to (kept). */
  rowsKept: number;
  /** Uploads in parts never finished (rows and staged parts), removed. */
  uploadsRemoved: number;
}

/** Only files older than this are touched: an upload in flight has its object before its row. */
export const fileSweepAge = (): number => Number(process.env.CAIRN_FILE_SWEEP_AGE_MS) || 3_600_000;

export async function sweepStoredFiles(olderThanMs = fileSweepAge(), now = Date.now()): Promise<FileSweepReport> {
  const store = fileStore();
  // Unfinished uploads in parts first: their staged parts are not in the store, and no row names them.
  const uploadsRemoved = await sweepPartUploads(olderThanMs, now);
  const objectsRemoved = await sweepOrphans(store, isFileNamed, olderThanMs, now);
  const rows = await getSequelize().query<{ id: number; sha256: string; stepId: number; name: string; proofId: number; batches: number }>(
    `SELECT f.id, f.sha256, f.step_id AS stepId, f.name, c.proof_id AS proofId,
            (SELECT COUNT(*) FROM batch_claims b WHERE b.file_id = f.id) AS batches
     FROM step_files f JOIN steps s ON s.id = f.step_id JOIN cases c ON c.id = s.case_id
     WHERE f.created_at < ? ORDER BY f.id`,
    { replacements: [new Date(now - olderThanMs)], type: QueryTypes.SELECT },
  );
  let rowsRemoved = 0,
    rowsKept = 0;
  for (const r of rows) {
    if (await store.has(r.sha256)) continue;
    if (Number(r.batches) > 0) {
      rowsKept++;
      continue;
    }
    await getSequelize().transaction(async (transaction) => {
      const gone = await models().StepFile.destroy({ where: { id: r.id }, transaction });
      if (gone)
        await recordEvent(
          {
            proofId: r.proofId,
            actorId: null,
            action: "file.lost",
            subjectType: "step",
            subjectId: r.stepId,
            detail: `${r.name}: its stored bytes were missing`,
          },
          transaction,
        );
      rowsRemoved += gone;
    });
  }
  return { objectsRemoved, rowsRemoved, rowsKept, uploadsRemoved };
}
