/**
 * Batch claims on the job engine: a batch over a graph list is split into chunks of CHUNK_SIZE graphs,
 * one BullMQ job per chunk (job id `batch-<id>-c<k>`, so queueing a chunk twice is harmless). A worker
 * checks its chunk in-process with the exact core (lib/core/claims/batch.ts), then stores the chunk's results
 * and moves the batch's counts in one transaction, under the batch row's lock, skipping a chunk whose
 * results are already there: a chunk run twice after a worker died decides each graph exactly once.
 * A cancelled batch's remaining chunks do nothing.
 */
import { QueryTypes } from "sequelize";
import { getSequelize } from "../db";
import { models } from "../../models";
import { fileStore } from "../storage";
import { readEnv } from "../env";
import { graphListText } from "../uploads/detect";
import { splitGraphList, type GraphListEntry, type GraphListFormat } from "../core/input/graph-list";
import { checkListedGraphs } from "../core/claims/batch";
import type { Relation } from "../core/claims/claim-schema";
import type { BatchJobData } from "./queue";

/** The list's entries, kept per file digest for the life of the worker (a batch's chunks share them). */
const cache = new Map<string, { format: GraphListFormat; entries: GraphListEntry[] }>();

export async function listEntries(sha256: string, format: GraphListFormat): Promise<GraphListEntry[]> {
  const key = `${sha256}:${format}`;
  const hit = cache.get(key);
  if (hit) return hit.entries;
  const bytes = await fileStore().get(sha256);
  if (!bytes) throw new Error(`the uploaded file ${sha256.slice(0, 12)}… is missing from the file store`);
  const entries = splitGraphList(graphListText(bytes, readEnv().CAIRN_UPLOAD_MAX_BYTES * 4), format);
  if (cache.size > 8) cache.clear();
  cache.set(key, { format, entries });
  return entries;
}

/** Runs one chunk; returns how many graphs it decided (0 when cancelled or already done). */
export async function runBatchChunk(data: BatchJobData, workerName: string): Promise<{ decided: number }> {
  const { BatchClaim, BatchResult, StepFile } = models();
  const batch = await BatchClaim.findByPk(data.batchId);
  if (!batch || batch.status === "cancelled" || batch.status === "done") return { decided: 0 };
  const file = await StepFile.findByPk(batch.fileId);
  if (!file || !file.graphFormat) throw new Error(`batch ${batch.id}: its file is gone or not a graph list`);
  const entries = await listEntries(file.sha256, file.graphFormat);
  const from = data.chunk * batch.chunkSize;
  const to = Math.min(from + batch.chunkSize, entries.length);
  if (from >= to) return { decided: 0 };
  if (batch.status === "queued") await BatchClaim.update({ status: "running", startedAt: new Date() }, { where: { id: batch.id, status: "queued" } });
  const results = checkListedGraphs(
    entries,
    file.graphFormat,
    { kind: "spectral-radius-bound", op: batch.op as Relation, bound: batch.bound },
    from,
    to,
    readEnv().CAIRN_VERIFY_STEP_LIMIT,
  );
  return getSequelize().transaction(async (transaction) => {
    const locked = await BatchClaim.findByPk(batch.id, { transaction, lock: transaction.LOCK.UPDATE });
    if (!locked || locked.status === "cancelled" || locked.status === "done") return { decided: 0 };
    const there = await getSequelize().query<{ n: number }>("SELECT COUNT(*) AS n FROM batch_results WHERE batch_id = ? AND entry >= ? AND entry < ?", {
      replacements: [batch.id, from, to],
      type: QueryTypes.SELECT,
      transaction,
    });
    if (Number(there[0].n) > 0) return { decided: 0 };
    await BatchResult.bulkCreate(
      results.map((r) => ({ batchId: batch.id, ...r, decidedBy: workerName })),
      { transaction },
    );
    const tally = { verified: 0, refuted: 0, undecided: 0, unreadable: 0 };
    for (const r of results) tally[r.verdict]++;
    const done = locked.done + results.length;
    await locked.update(
      {
        done,
        verified: locked.verified + tally.verified,
        refuted: locked.refuted + tally.refuted,
        undecided: locked.undecided + tally.undecided,
        unreadable: locked.unreadable + tally.unreadable,
        ...(done >= locked.total ? { status: "done" as const, finishedAt: new Date() } : {}),
      },
      { transaction },
    );
    return { decided: results.length };
  });
}
