import "server-only";
import { Op } from "sequelize";
import { models } from "@/models";
import { getSequelize } from "@/lib/db";
import { invalid, notFound, conflict } from "@/lib/errors";
import { batchStatement } from "@/lib/core/claims/batch";
import { CHECKER_VERSION } from "@/lib/core/claims/claims";
import { NumberFormatError } from "@/lib/core/arithmetic/rational";
import { JsonPathError } from "@/lib/core/path-error";
import {
  batchChunkSize,
  QueueUnavailable,
  queueBatchChunks,
  verificationQueue,
  batchJobId,
  bounded,
  verificationService,
  type VerificationService,
} from "@/lib/jobs/queue";
import { batchColumns, listEntries, statementOf } from "@/lib/jobs/batch";
import { fileStore } from "@/lib/storage";
import { graphListText } from "@/lib/uploads/detect";
import { readEnv } from "@/lib/env";
import { sha256Hex } from "@/lib/core/digest";
import { parseGraph6, writeSparse6 } from "@/lib/core/input/graph6";
import type { SnapshotBatch } from "@/lib/export/snapshot";
import type { BatchStatement } from "@/lib/core/claims/batch";
import type { CreateBatchInput } from "@/lib/validations/batch";
import type { BatchClaim, BatchResult, BatchStatus, BatchVerdict } from "@/models/batch-claim";

/**
 * Batch claims: the web side. Creating one counts the graphs of the file, stores the batch and queues
 * its chunks for the workers (when Redis is away the batch waits `queued`; the workers' sweep queues
 * it when Redis is back). Progress, cancel and results are read from the database.
 */

export interface BatchView {
  id: number;
  stepId: number;
  fileId: number;
  fileName: string | null;
  statement: string;
  kind: BatchClaim["kind"];
  op: string;
  bound: string;
  status: BatchStatus;
  total: number;
  done: number;
  verified: number;
  refuted: number;
  undecided: number;
  unreadable: number;
  /** Enumeration batches: classes of the enumeration the list does not name. */
  missing: number;
  /** refuted + undecided + unreadable: the graphs for which the statement is not established. */
  failing: number;
  /** Graphs per second since the first chunk started; null before. */
  rate: number | null;
  /** Seconds left at that rate; null when unknown or finished. */
  etaSeconds: number | null;
  checkerVersion: string;
  /** Why graphs were left undecided (a chunk whose check failed for good); null when none. */
  note: string | null;
  createdAt: string;
  startedAt: string | null;
  finishedAt: string | null;
}

export function batchView(b: BatchClaim, fileName: string | null = null, now = Date.now()): BatchView {
  const started = b.startedAt?.getTime() ?? null;
  const end = b.finishedAt?.getTime() ?? now;
  const rate = started !== null && b.done > 0 && end > started ? b.done / ((end - started) / 1000) : null;
  const active = b.status === "queued" || b.status === "running";
  return {
    id: b.id,
    stepId: b.stepId,
    fileId: b.fileId,
    fileName,
    statement: b.statement,
    kind: b.kind,
    op: b.op,
    bound: b.bound,
    status: b.status,
    total: b.total,
    done: b.done,
    verified: b.verified,
    refuted: b.refuted,
    undecided: b.undecided,
    unreadable: b.unreadable,
    missing: b.missing,
    failing: b.refuted + b.undecided + b.unreadable,
    rate,
    etaSeconds: active && rate ? Math.ceil((b.total - b.done) / rate) : null,
    checkerVersion: b.checkerVersion,
    note: b.note ?? null,
    createdAt: b.createdAt.toISOString(),
    startedAt: b.startedAt?.toISOString() ?? null,
    finishedAt: b.finishedAt?.toISOString() ?? null,
  };
}

export async function createBatch(proofId: number, stepId: number, userId: number, input: CreateBatchInput): Promise<{ batch: BatchView; queued: boolean }> {
  const { StepFile, BatchClaim, AuditEvent } = models();
  const file = await StepFile.findByPk(input.fileId);
  if (!file || file.stepId !== stepId) throw invalid("Choose a file uploaded to this step.", [{ path: "fileId", message: "not a file of this step" }]);
  if (file.kind !== "graph-list" || !file.graphFormat)
    throw invalid("A batch claim runs over a graph list; this file is not one.", [{ path: "fileId", message: `${file.name} is a ${file.description}` }]);
  const { fileId: _file, ...statementInput } = input;
  const wanted = statementInput as BatchStatement;
  let statement: string;
  try {
    statement = batchStatement(wanted);
  } catch (e) {
    const path =
      wanted.kind === "spectral-radius-bound"
        ? "bound"
        : wanted.kind === "identified-as"
          ? "families"
          : wanted.kind === "enumeration-exactly"
            ? "vertices"
            : "patterns";
    if (e instanceof JsonPathError)
      throw invalid(`The ${e.path === "vertices" ? "number of vertices" : e.path} does not fit.`, [{ path: e.path, message: e.detail }]);
    if (e instanceof NumberFormatError || e instanceof Error)
      throw invalid(path === "bound" ? "The bound does not read." : `The ${path} do not read.`, [{ path, message: e.message }]);
    throw e;
  }
  const total = (await listEntries(file.sha256, file.graphFormat)).length;
  if (total === 0) throw invalid("The file lists no graph.", [{ path: "fileId", message: "no graph in the list" }]);
  const batch = await getSequelize().transaction(async (transaction) => {
    const row = await BatchClaim.create(
      {
        stepId,
        fileId: file.id,
        ...batchColumns(wanted),
        statement,
        total,
        chunkSize: batchChunkSize(),
        checkerVersion: CHECKER_VERSION,
        createdBy: userId,
      },
      { transaction },
    );
    await AuditEvent.create(
      { proofId, actorId: userId, action: "batch.created", subjectType: "step", subjectId: stepId, detail: `${statement} (${file.name}, ${total} graphs)` },
      { transaction },
    );
    return row;
  });
  const chunks = Array.from({ length: Math.ceil(total / batch.chunkSize) }, (_, k) => k);
  let queued = true;
  try {
    await queueBatchChunks(batch.id, chunks);
  } catch (e) {
    if (!(e instanceof QueueUnavailable)) throw e;
    queued = false;
  }
  return { batch: batchView(batch, file.name), queued };
}

/**
 * Whether verification can go on for these batches: asked of the queue only while one is unfinished
 * (Redis away or no worker: the page says verification is paused, and the batch waits); null otherwise.
 */
export async function batchesVerification(batches: readonly BatchView[]): Promise<VerificationService | null> {
  return batches.some((b) => b.status === "queued" || b.status === "running") ? verificationService() : null;
}

/** The batch, if it belongs to this proof; 404 otherwise. */
export async function loadBatch(proofId: number, batchId: number): Promise<{ batch: BatchView; stepId: number }> {
  const { BatchClaim, StepFile, Step, Case } = models();
  const row = await BatchClaim.findByPk(batchId);
  const step = row ? await Step.findByPk(row.stepId, { attributes: ["id", "caseId"] }) : null;
  const c = step ? await Case.findByPk(step.caseId, { attributes: ["proofId"] }) : null;
  if (!row || !c || c.proofId !== proofId) throw notFound("This batch claim");
  const file = await StepFile.findByPk(row.fileId, { attributes: ["name"] });
  return { batch: batchView(row, file?.name ?? null), stepId: row.stepId };
}

export async function listStepBatches(stepId: number): Promise<BatchView[]> {
  const { BatchClaim, StepFile } = models();
  const rows = await BatchClaim.findAll({ where: { stepId }, order: [["id", "DESC"]] });
  const files = new Map(
    (await StepFile.findAll({ where: { id: { [Op.in]: rows.map((r) => r.fileId) } }, attributes: ["id", "name"] })).map((f) => [f.id, f.name]),
  );
  return rows.map((r) => batchView(r, files.get(r.fileId) ?? null));
}

/** Stops a batch: chunks not yet stored do nothing; results already stored stay. */
export async function cancelBatch(proofId: number, batchId: number, userId: number): Promise<BatchView> {
  const { BatchClaim, AuditEvent } = models();
  const row = await getSequelize().transaction(async (transaction) => {
    const b = await BatchClaim.findByPk(batchId, { transaction, lock: transaction.LOCK.UPDATE });
    if (!b) throw notFound("This batch claim");
    if (b.status === "done" || b.status === "cancelled") throw conflict(`This batch claim is already ${b.status === "done" ? "finished" : "cancelled"}.`);
    await b.update({ status: "cancelled", finishedAt: new Date() }, { transaction });
    await AuditEvent.create(
      { proofId, actorId: userId, action: "batch.cancelled", subjectType: "step", subjectId: b.stepId, detail: `${b.statement} after ${b.done} of ${b.total}` },
      { transaction },
    );
    return b;
  });
  // Waiting chunks are removed if Redis answers; any that run anyway find the batch cancelled.
  const chunks = Math.ceil(row.total / row.chunkSize);
  await bounded(async () => {
    for (let k = 0; k < chunks; k++) await (await verificationQueue().getJob(batchJobId(batchId, k)))?.remove().catch(() => undefined);
  }, 5_000).catch(() => undefined);
  return batchView(row);
}

export interface BatchResultView {
  entry: number;
  line: number;
  verdict: BatchVerdict;
  graph6: string | null;
  /** sparse6 of a graph with loops or multiple edges (then graph6 is null). */
  sparse6: string | null;
  vertices: number | null;
  edges: number | null;
  method: string | null;
  reason: string | null;
  certificate: unknown;
}

const resultView = (r: BatchResult): BatchResultView => ({
  entry: r.entry,
  line: r.line,
  verdict: r.verdict,
  graph6: r.graph6,
  sparse6: r.sparse6,
  vertices: r.vertices,
  edges: r.edges,
  method: r.method,
  reason: r.reason,
  certificate: r.certificate ? JSON.parse(r.certificate) : null,
});

/** Results in list order; `failing` keeps those whose verdict is not `verified`. */
export async function batchResults(
  batchId: number,
  options: { failing?: boolean; offset?: number; limit?: number; certificates?: boolean } = {},
): Promise<BatchResultView[]> {
  const rows = await models().BatchResult.findAll({
    where: { batchId, ...(options.failing ? { verdict: { [Op.ne]: "verified" } } : {}) },
    order: [["entry", "ASC"]],
    offset: options.offset ?? 0,
    ...(options.limit ? { limit: options.limit } : {}),
    ...(options.certificates === false ? { attributes: { exclude: ["certificate"] } } : {}),
  });
  return rows.map(resultView);
}

/** The results as CSV (RFC 4180 quoting): line, verdict, graph6, sparse6, vertices, edges, method, reason. */
export function resultsCsv(rows: readonly BatchResultView[]): string {
  const q = (v: unknown) => {
    const s = v === null || v === undefined ? "" : String(v);
    return /[",\r\n]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s;
  };
  const head = ["line", "verdict", "graph6", "sparse6", "vertices", "edges", "method", "reason"];
  return (
    [head.join(","), ...rows.map((r) => [r.line, r.verdict, r.graph6, r.sparse6, r.vertices, r.edges, r.method, r.reason].map(q).join(","))].join("\r\n") +
    "\r\n"
  );
}

/**
 * The failing graphs that read, one per line: `graph6` writes the simple ones (graph6 cannot say a loop or a
 * multiple edge), `sparse6` every one (a simple graph re-written in sparse6). Unreadable lines have no graph to write.
 */
export function failuresFile(rows: readonly BatchResultView[], format: "graph6" | "sparse6"): string {
  const failing = rows.filter((r) => r.verdict !== "verified");
  const names =
    format === "graph6" ? failing.map((r) => r.graph6) : failing.map((r) => r.sparse6 ?? (r.graph6 === null ? null : writeSparse6(parseGraph6(r.graph6))));
  return names.filter((n): n is string => n !== null).join("\n") + "\n";
}

/**
 * The step's batch claims as a certified export carries them (lib/core/batch-check.ts re-checks them
 * offline): the list's text as the workers read it, with its digest, and every graph's verdict and
 * certificate. Batches in the order they were made.
 */
export async function exportedBatches(stepIds: readonly number[]): Promise<Map<number, SnapshotBatch[]>> {
  const { BatchClaim, BatchResult, StepFile } = models();
  const out = new Map<number, SnapshotBatch[]>();
  if (stepIds.length === 0) return out;
  const rows = await BatchClaim.findAll({ where: { stepId: [...stepIds] }, order: [["id", "ASC"]] });
  for (const b of rows) {
    const file = await StepFile.findByPk(b.fileId);
    if (!file?.graphFormat) continue;
    const bytes = await fileStore().get(file.sha256);
    // A list gone from the store cannot be exported with its batch: say which one, rather than fail as a server error.
    if (!bytes)
      throw conflict(
        `The graph list "${file.name}" of batch claim ${b.id} is missing from the file store, so the batch cannot be exported. Upload the list again or ask the site's administrator to restore the file.`,
      );
    const text = graphListText(bytes, readEnv().CAIRN_UPLOAD_MAX_BYTES * 4);
    const results = await BatchResult.findAll({ where: { batchId: b.id }, order: [["entry", "ASC"]], attributes: ["entry", "line", "verdict", "certificate"] });
    const batch: SnapshotBatch = {
      statement: statementOf(b),
      words: b.statement,
      status: b.status,
      file: { name: file.name, format: file.graphFormat, text, textSha256: sha256Hex(text), sha256: file.sha256 },
      counts: { total: b.total, verified: b.verified, refuted: b.refuted, undecided: b.undecided, unreadable: b.unreadable, missing: b.missing },
      results: results.map((r) => ({ entry: r.entry, line: r.line, verdict: r.verdict, certificate: r.certificate ? JSON.parse(r.certificate) : null })),
      checkerVersion: b.checkerVersion,
    };
    out.set(b.stepId, [...(out.get(b.stepId) ?? []), batch]);
  }
  return out;
}
