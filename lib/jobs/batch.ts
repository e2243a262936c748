/**
 * Batch claims on the job engine: a batch over a graph list is split into chunks of CHUNK_SIZE graphs,
 * one BullMQ job per chunk (job id `batch-<id>-c<k>`, so queueing a chunk twice is harmless). A worker
 * checks its chunk in-process with the exact core (lib/core/claims/batch.ts), then stores the chunk's results
 * and moves the batch's counts in one transaction, under the batch row's lock, skipping a chunk whose
 * results are already there: a chunk run twice after a worker died decides each graph exactly once.
 * A cancelled batch's remaining chunks do nothing.
 */
import { QueryTypes, type Transaction } from "sequelize";
import { duplicateReason, enumerationFormat, enumerationWords, settleEnumeration, type EnumerationBatchStatement } from "../core/claims/batch-enumeration";
import { getSequelize } from "../db";
import { models } from "../../models";
import { fileStore } from "../storage";
import { readEnv } from "../env";
import { graphListText } from "../uploads/detect";
import { readListedGraph, splitGraphList, type GraphListEntry, type GraphListFormat } from "../core/input/graph-list";
import { checkListedGraphs, listedShape, type BatchStatement, type ListedResult } from "../core/claims/batch";
import type { Relation } from "../core/claims/claim-schema";
import { JOB_ATTEMPTS, MAX_STALLED, type BatchJobData } from "./queue";

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

/** The columns that store a statement: op and bound for ρ statements, the rest as JSON in `params`. */
export function batchColumns(s: BatchStatement): { kind: BatchStatement["kind"]; op: string; bound: string; params: string | null } {
  if (s.kind === "spectral-radius-bound") return { kind: s.kind, op: s.op, bound: s.bound, params: null };
  const { kind, ...params } = s;
  return { kind, op: "", bound: "", params: JSON.stringify(params) };
}

/** The statement a batch row stores (the inverse of batchColumns). */
export function statementOf(b: { kind: BatchStatement["kind"]; op: string; bound: string; params: string | null }): BatchStatement {
  if (b.kind === "spectral-radius-bound") return { kind: b.kind, op: b.op as Relation, bound: b.bound };
  const p = JSON.parse(b.params ?? "{}") as { patterns?: string[]; induced?: boolean; families?: string[] };
  if (b.kind === "identified-as") return { kind: b.kind, families: (p.families ?? []) as Extract<BatchStatement, { kind: "identified-as" }>["families"] };
  if (b.kind === "enumeration-exactly") return { kind: b.kind, ...(p as Omit<Extract<BatchStatement, { kind: "enumeration-exactly" }>, "kind">) };
  return { kind: b.kind, patterns: p.patterns ?? [], induced: p.induced ?? false };
}

/** Runs one chunk; returns how many graphs it decided (0 when cancelled or already done). */
export async function runBatchChunk(data: BatchJobData, workerName: string): Promise<{ decided: number }> {
  const { BatchClaim, StepFile } = models();
  const batch = await BatchClaim.findByPk(data.batchId);
  if (!batch || batch.status === "cancelled" || batch.status === "done") return { decided: 0 };
  const file = await StepFile.findByPk(batch.fileId);
  if (!file || !file.graphFormat) throw new Error(`batch ${batch.id}: its file is gone or not a graph list`);
  const entries = await listEntries(file.sha256, file.graphFormat);
  const from = data.chunk * batch.chunkSize;
  const to = Math.min(from + batch.chunkSize, entries.length);
  if (from >= to) return { decided: 0 };
  if (batch.status === "queued") await BatchClaim.update({ status: "running", startedAt: new Date() }, { where: { id: batch.id, status: "queued" } });
  const results = checkListedGraphs(entries, file.graphFormat, statementOf(batch), from, to, readEnv().CAIRN_VERIFY_STEP_LIMIT);
  return storeChunk(batch.id, from, to, results, workerName);
}

/**
 * Stores a chunk's results and moves the batch's counts in one transaction under the batch row's lock;
 * nothing when the chunk's results are already there (a chunk run twice) or the batch is over.
 * `note` is added to the batch's own note (why graphs were left undecided).
 */
async function storeChunk(
  batchId: number,
  from: number,
  to: number,
  results: readonly ListedResult[],
  decidedBy: string,
  note?: string,
): Promise<{ decided: number }> {
  const { BatchClaim, BatchResult } = models();
  return getSequelize().transaction(async (transaction) => {
    const locked = await BatchClaim.findByPk(batchId, { transaction, lock: transaction.LOCK.UPDATE });
    if (!locked || locked.status === "cancelled" || locked.status === "done") return { decided: 0 };
    const there = await getSequelize().query<{ n: number }>("SELECT COUNT(*) AS n FROM batch_results WHERE batch_id = ? AND entry >= ? AND entry < ?", {
      replacements: [batchId, from, to],
      type: QueryTypes.SELECT,
      transaction,
    });
    if (Number(there[0].n) > 0) return { decided: 0 };
    await BatchResult.bulkCreate(
      results.map((r) => ({ batchId, ...r, decidedBy })),
      { transaction },
    );
    const tally = { verified: 0, refuted: 0, undecided: 0, unreadable: 0 };
    for (const r of results) tally[r.verdict]++;
    const done = locked.done + results.length;
    // The last chunk of an enumeration batch settles the whole list: repeated classes, classes not listed.
    const settled = done >= locked.total && locked.kind === "enumeration-exactly" ? await settleListedEnumeration(locked, tally, transaction) : null;
    await locked.update(
      {
        done,
        verified: locked.verified + tally.verified,
        refuted: locked.refuted + tally.refuted,
        undecided: locked.undecided + tally.undecided,
        unreadable: locked.unreadable + tally.unreadable,
        ...(note || settled?.note ? { note: [locked.note, note, settled?.note].filter(Boolean).join("\n").slice(0, 60_000) } : {}),
        ...(settled ? { missing: settled.missing } : {}),
        status: done >= locked.total ? "done" : "running",
        startedAt: locked.startedAt ?? new Date(),
        ...(done >= locked.total ? { finishedAt: new Date() } : {}),
      },
      { transaction },
    );
    return { decided: results.length };
  });
}

/** Why a chunk's job failed for good, in words a person can act on. */
export function chunkFailure(failedReason: string | undefined): string {
  return /stalled/i.test(failedReason ?? "")
    ? `the verification worker stopped ${MAX_STALLED + 1} times while checking these graphs (killed, or out of memory)`
    : `the check of these graphs failed ${JOB_ATTEMPTS} times (${(failedReason ?? "no reason given").slice(0, 300)})`;
}

/**
 * A chunk whose job failed for good (its worker died too often, or it threw on every try): its graphs
 * become `undecided` with the reason, so the batch still ends and says why, and no graph is left
 * without a verdict. Does nothing when the chunk's results are already stored.
 */
export async function settleFailedChunk(data: BatchJobData, failedReason: string | undefined, decidedBy: string): Promise<{ decided: number }> {
  const { BatchClaim, StepFile } = models();
  const batch = await BatchClaim.findByPk(data.batchId);
  if (!batch || batch.status === "cancelled" || batch.status === "done") return { decided: 0 };
  const from = data.chunk * batch.chunkSize;
  const to = Math.min(from + batch.chunkSize, batch.total);
  if (from >= to) return { decided: 0 };
  const why = chunkFailure(failedReason);
  // Lines and graphs when the list still reads (the file may be what is missing); line 0 when unknown.
  let entries: GraphListEntry[] | null = null;
  const file = await StepFile.findByPk(batch.fileId);
  if (file?.graphFormat) entries = await listEntries(file.sha256, file.graphFormat).catch(() => null);
  const results: ListedResult[] = [];
  for (let i = from; i < to; i++) {
    const entry = entries?.[i];
    let shape: Pick<ListedResult, "graph6" | "sparse6" | "vertices" | "edges"> = { graph6: null, sparse6: null, vertices: null, edges: null };
    if (entry && file?.graphFormat)
      try {
        const g = readListedGraph(entry, file.graphFormat);
        shape = listedShape(g);
      } catch {
        // left without its graph; the reason below says why it is undecided
      }
    results.push({
      entry: i,
      line: entry?.line ?? 0,
      verdict: "undecided",
      ...shape,
      method: "worker",
      reason: `${why}; re-run the batch to try again`,
      certificate: null,
    });
  }
  return storeChunk(batch.id, from, to, results, decidedBy, `graphs ${from + 1}–${to} of the list left undecided: ${why}`);
}

/**
 * Settles an enumeration batch once every graph is decided (inside the transaction that stores the last
 * chunk): a later listing of a class already listed becomes refuted, naming the first; the classes not
 * listed are counted and the first few named in the note. `tally` is the last chunk's, moved accordingly.
 */
async function settleListedEnumeration(
  batch: { id: number; kind: string; op: string; bound: string; params: string | null },
  tally: Record<ListedResult["verdict"], number>,
  transaction: Transaction,
): Promise<{ missing: number; note: string | null }> {
  const { BatchResult } = models();
  const statement = statementOf(batch as Parameters<typeof statementOf>[0]) as EnumerationBatchStatement;
  const rows = await BatchResult.findAll({ where: { batchId: batch.id }, attributes: ["entry", "line", "verdict", "certificate"], transaction });
  const { duplicates, missing } = settleEnumeration(
    statement,
    rows.map((r) => ({ entry: r.entry, line: r.line, verdict: r.verdict, certificate: r.certificate ? JSON.parse(r.certificate) : null })),
  );
  for (const d of duplicates) {
    await BatchResult.update({ verdict: "refuted", reason: duplicateReason(d.firstLine) }, { where: { batchId: batch.id, entry: d.entry }, transaction });
    tally.verified--;
    tally.refuted++;
  }
  const note = missing.length
    ? `${missing.length} of the ${enumerationWords(statement)} ${missing.length === 1 ? "is" : "are"} not listed, e.g. (${enumerationFormat(statement)}) ${missing.slice(0, 5).join(" ")}`
    : null;
  return { missing: missing.length, note };
}
