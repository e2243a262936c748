/**
 * Batch claims when things go wrong: a worker killed (SIGKILL) mid-batch leaves its chunk to a second
 * worker and every graph is decided exactly once, with the same verdicts as a check in this process;
 * with Redis stopped mid-batch the batch waits, the step's and the batch's progress say verification
 * is paused, a batch started meanwhile waits `queued`, and both finish once Redis is back; a chunk that
 * fails for good ends the batch with its graphs undecided and the reason; the scheduled file sweep
 * removes stored files no row names and rows whose file is missing.
 * The kill and outage parts run their own workers on queue prefixes of their own (the outage part on
 * its own Redis), so the suite's shared worker never takes their jobs.
 */
import { beforeAll, describe, expect, it, vi } from "vitest";

vi.mock("next-auth", async (importOriginal) => ({ ...(await importOriginal<typeof import("next-auth")>()), getServerSession: vi.fn() }));

import { utimes } from "node:fs/promises";
import path from "node:path";
import { QueryTypes } from "sequelize";
import { actAs, closeAfterAll, jsonRequest, params, workersPerTest } from "./helpers";
import { draftCaseStep, dropProofs } from "./workspace-fixture";
import { getSequelize } from "@/lib/db";
import { models } from "@/models";
import { verificationQueue, FILE_SWEEP_SCHEDULER } from "@/lib/jobs/queue";
import { listEntries } from "@/lib/jobs/batch";
import { checkListedGraphs } from "@/lib/core/claims/batch";
import { fileStore, sha256Hex } from "@/lib/storage";
import { LocalStore } from "@/lib/storage/local";
import { sweepStoredFiles } from "@/lib/data/file-sweep";
import { randomGraph6List } from "../bench/batch-throughput";
import { startTestWorker, until, type TestWorker } from "../support/workers";
import { ownRedisForTest } from "../support/redis";
import * as filesRoute from "@/app/api/proofs/[proofId]/steps/[stepId]/files/route";
import * as batchesRoute from "@/app/api/proofs/[proofId]/steps/[stepId]/batches/route";
import * as batchRoute from "@/app/api/proofs/[proofId]/batches/[batchId]/route";

let proofId: string;
let stepId: string;
const { workers, saved } = workersPerTest(["REDIS_URL", "CAIRN_QUEUE_PREFIX", "CAIRN_BATCH_CHUNK"]);
// Short locks, so that a dead worker's chunk is taken over within seconds rather than the default 30 s.
const fast = { CAIRN_JOB_LOCK_MS: "2000", CAIRN_JOB_STALLED_CHECK_MS: "1000" };

closeAfterAll(() => dropProofs([proofId]));
beforeAll(async () => {
  ({ proofId, stepId } = await draftCaseStep("Batch robustness test", "Random graphs", "A search over random graphs."));
});

const worker = (env: Record<string, string> = {}) => {
  const w = startTestWorker({ ...process.env, CAIRN_SWEEP_AFTER_MS: "600000", ...fast, ...env }, `.data/batch-robustness-worker-${workers.length}.log`);
  workers.push(w);
  return w;
};
const nameOf = async (w: TestWorker) => {
  await w.ready;
  return /\] (\S+) is taking verification jobs/.exec(w.output.join("\n"))![1];
};
const upload = async (text: string, name: string) => {
  await actAs("author");
  const res = await filesRoute.POST(new Request(`http://localhost/x?name=${name}`, { method: "POST", body: text }), params({ proofId, stepId }));
  expect(res.status, await res.clone().text()).toBe(201);
  return (await res.json()).file as { id: number; sha256: string };
};
const start = async (body: unknown) => {
  await actAs("author");
  const res = await batchesRoute.POST(jsonRequest("/x", "POST", body), params({ proofId, stepId }));
  expect(res.status, await res.clone().text()).toBe(202);
  return (await res.json()) as { batch: { id: number; total: number }; queued: boolean };
};
const progress = async (batchId: number) =>
  (await batchRoute.GET(new Request("http://localhost/x"), params({ proofId, batchId: String(batchId) }))).json() as Promise<{
    batch: { status: string; done: number; total: number; verified: number; refuted: number; undecided: number; unreadable: number; note: string | null };
    verification: { paused: boolean; message: string | null } | null;
  }>;
const row = (batchId: number) => models().BatchClaim.findByPk(batchId);

/** Each entry decided once (the key is (batch, entry)), all of them, and the counts agree with the rows. */
async function decidedExactlyOnce(batchId: number) {
  const b = (await row(batchId))!;
  const [counts] = await getSequelize().query<{ n: number; entries: number; verified: number; refuted: number; undecided: number }>(
    `SELECT COUNT(*) AS n, COUNT(DISTINCT entry) AS entries, SUM(verdict = 'verified') AS verified, SUM(verdict = 'refuted') AS refuted,
            SUM(verdict = 'undecided') AS undecided FROM batch_results WHERE batch_id = ?`,
    { replacements: [batchId], type: QueryTypes.SELECT },
  );
  expect(b.status).toBe("done");
  expect(Number(counts.n)).toBe(b.total);
  expect(Number(counts.entries)).toBe(b.total);
  expect([b.done, b.verified, b.refuted, b.undecided]).toEqual([b.total, Number(counts.verified), Number(counts.refuted), Number(counts.undecided)]);
  return b;
}

/** The verdicts stored for the batch are those of the same check run here, graph by graph. */
async function sameVerdictsAsHere(batchId: number, sha256: string, op: "<", bound: string) {
  const entries = await listEntries(sha256, "graph6");
  const here = checkListedGraphs(entries, "graph6", { kind: "spectral-radius-bound", op, bound }, 0, entries.length, 200_000_000).map((r) => r.verdict);
  const stored = (await models().BatchResult.findAll({ where: { batchId }, order: [["entry", "ASC"]], attributes: ["verdict"] })).map((r) => r.verdict);
  expect(stored).toEqual(here);
}

describe("a worker killed mid-batch", () => {
  it("leaves its chunk to a second worker; every graph is decided exactly once, with the verdicts of a check run here", async () => {
    process.env.CAIRN_QUEUE_PREFIX = `${saved.CAIRN_QUEUE_PREFIX}-batch-kill`;
    process.env.CAIRN_BATCH_CHUNK = "200";
    // 3000 graphs G(12, 1/2) (the bench's LCG stream, another seed); ρ < 6 holds for some and not others.
    const file = await upload(randomGraph6List(3000, 12, 4242), "random-kill.g6");
    const first = worker();
    const firstName = await nameOf(first);
    const { batch } = await start({ fileId: file.id, op: "<", bound: "6" });
    expect(batch.total).toBe(3000);
    await until("the first worker to store a chunk", async () => ((await row(batch.id))?.done ?? 0) > 0, 120_000);
    first.stop("SIGKILL");
    const killedAt = (await row(batch.id))!.done;
    expect(killedAt).toBeLessThan(3000);
    const second = worker();
    const secondName = await nameOf(second);
    await until("the batch to finish", async () => (await row(batch.id))?.status === "done", 180_000);
    await decidedExactlyOnce(batch.id);
    const by = await getSequelize().query<{ decidedBy: string; n: number }>(
      "SELECT decided_by AS decidedBy, COUNT(*) AS n FROM batch_results WHERE batch_id = ? GROUP BY decided_by",
      {
        replacements: [batch.id],
        type: QueryTypes.SELECT,
      },
    );
    expect(by.map((r) => r.decidedBy).sort()).toEqual([firstName, secondName].sort());
    expect(Number(by.find((r) => r.decidedBy === secondName)!.n)).toBe(3000 - killedAt);
    await sameVerdictsAsHere(batch.id, file.sha256, "<", "6");
  }, 360_000);
});

describe("Redis stopped mid-batch", () => {
  it("the batch waits and the pages say verification is paused; a batch started meanwhile waits queued; both finish once Redis is back", async () => {
    const redis = await ownRedisForTest("cairn-batch-outage");
    process.env.CAIRN_BATCH_CHUNK = "200";
    const w = worker({ CAIRN_SWEEP_AFTER_MS: "500", CAIRN_SWEEP_INTERVAL_MS: "500" });
    const name = await nameOf(w);
    const file = await upload(randomGraph6List(3000, 12, 777), "random-outage.g6");
    const { batch } = await start({ fileId: file.id, op: "<", bound: "6" });
    await until("a chunk to be stored", async () => ((await row(batch.id))?.done ?? 0) > 0, 120_000);

    redis.down();
    // The chunk in hand may still be stored (MariaDB is up); after that the batch waits.
    await new Promise((r) => setTimeout(r, 4_000));
    const waiting = (await row(batch.id))!.done;
    await actAs("reviewer");
    const during = await progress(batch.id);
    expect(during.batch.status).toBe("running");
    expect(during.verification).toMatchObject({ paused: true, message: expect.stringMatching(/Verification is paused: the job queue cannot be reached/) });
    const stepList = await (await batchesRoute.GET(new Request("http://localhost/x"), params({ proofId, stepId }))).json();
    expect(stepList.verification).toMatchObject({ paused: true });

    // Started while Redis is away: stored, not queued, waiting.
    const later = await start({ fileId: file.id, op: "<", bound: "5" });
    expect(later.queued).toBe(false);
    expect((await row(later.batch.id))!.status).toBe("queued");
    await new Promise((r) => setTimeout(r, 3_000));
    expect((await row(batch.id))!.done).toBe(waiting);
    expect(waiting).toBeLessThan(3000);
    expect((await row(later.batch.id))!).toMatchObject({ status: "queued", done: 0 });

    await redis.up();
    await until(
      "both batches to finish after Redis came back",
      async () => (await row(batch.id))?.status === "done" && (await row(later.batch.id))?.status === "done",
      240_000,
    );
    await decidedExactlyOnce(batch.id);
    const second = await decidedExactlyOnce(later.batch.id);
    expect(second.note).toBeNull();
    const deciders = await models().BatchResult.count({ where: { batchId: later.batch.id, decidedBy: name } });
    expect(deciders).toBe(3000);
    await sameVerdictsAsHere(batch.id, file.sha256, "<", "6");
    await actAs("reviewer");
    expect((await progress(batch.id)).verification).toBeNull();
  }, 480_000);
});

describe("a chunk that fails for good", () => {
  it("ends the batch with its graphs undecided and the reason, instead of leaving it running", async () => {
    // The suite's worker takes this batch. Its file's bytes are gone from the store before any worker
    // read them, so every chunk throws on each of its tries.
    process.env.CAIRN_BATCH_CHUNK = "4";
    const text = "D?{\nD]w\nDB{\nD^{\nD~{\nDqK\n"; // six graphs on 5 vertices (graph6)
    const file = await upload(text, "lost.g6");
    expect(await listEntries(file.sha256, "graph6")).toHaveLength(6); // counted here, before the bytes go
    await fileStore().delete(file.sha256);
    const { batch } = await start({ fileId: file.id, op: "<", bound: "2" });
    await until("the batch to end", async () => (await row(batch.id))?.status === "done", 120_000);
    await actAs("reviewer");
    const { batch: b } = await progress(batch.id);
    expect(b).toMatchObject({ status: "done", done: 6, verified: 0, refuted: 0, undecided: 6 });
    // Two chunks (4 + 2 graphs), each noted with the reason.
    expect(b.note!.split("\n")).toEqual([
      expect.stringMatching(/^graphs \d–\d of the list left undecided: the check of these graphs failed 3 times \(.*missing from the file store\)$/),
      expect.stringMatching(/^graphs \d–\d of the list left undecided: the check of these graphs failed 3 times/),
    ]);
    const results = await models().BatchResult.findAll({ where: { batchId: batch.id } });
    expect(results.map((r) => r.entry).sort()).toEqual([0, 1, 2, 3, 4, 5]);
    for (const r of results) expect(r).toMatchObject({ verdict: "undecided", method: "worker", reason: expect.stringMatching(/re-run the batch/) });
  }, 180_000);
});

describe("the scheduled file sweep", () => {
  it("is scheduled once for all workers, removes stored files no row names and rows whose file is missing, keeps rows a batch refers to", async () => {
    // The suite's worker scheduled it (upserted on start).
    const scheduler = await verificationQueue().getJobScheduler(FILE_SWEEP_SCHEDULER);
    expect(scheduler).toMatchObject({ every: 3_600_000 });

    const store = fileStore();
    const orphanBytes = new TextEncoder().encode(`no row names this ${Date.now()}\n`);
    const orphan = await store.put(orphanBytes);
    const kept = await upload("A?\n", "kept.g6"); // a row with its file: stays
    const lost = await upload("B?\n", "lost-row.g6"); // a row whose file goes: removed
    await store.delete(lost.sha256);
    const young = await store.put(new TextEncoder().encode(`young orphan ${Date.now()}\n`));
    // Age the orphan and the rows by an hour and a minute; the young object (an upload in flight) stays young.
    expect(store).toBeInstanceOf(LocalStore); // the integration tests run the local driver (lib/storage/storage.test.ts runs both)
    const old = new Date(Date.now() - 3_660_000);
    await utimes(path.join((store as LocalStore).root, orphan.sha256.slice(0, 2), orphan.sha256.slice(2, 4), orphan.sha256), old, old);
    await getSequelize().query("UPDATE step_files SET created_at = ? WHERE step_id = ?", { replacements: [old, Number(stepId)] });
    const report = await sweepStoredFiles(3_600_000);
    expect(report.objectsRemoved).toBeGreaterThanOrEqual(1);
    expect(await store.has(orphan.sha256)).toBe(false);
    expect(await store.has(young.sha256)).toBe(true);
    expect(await store.has(kept.sha256)).toBe(true);
    expect(sha256Hex(orphanBytes)).toBe(orphan.sha256);
    expect(await models().StepFile.findByPk(kept.id)).not.toBeNull();
    expect(await models().StepFile.findByPk(lost.id)).toBeNull();
    expect(await models().AuditEvent.count({ where: { action: "file.lost", subjectId: Number(stepId) } })).toBe(1);
    // The file of the batch whose chunks failed above is missing too, but its batch refers to it: kept.
    expect(report.rowsKept).toBeGreaterThanOrEqual(1);
    expect(await models().StepFile.count({ where: { name: "lost.g6", stepId: Number(stepId) } })).toBe(1);
    await store.delete(young.sha256);
  }, 60_000);
});
