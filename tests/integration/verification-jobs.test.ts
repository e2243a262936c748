/**
 * Verification as BullMQ jobs in worker processes: a worker killed mid-check (SIGKILL) leaves its job
 * to another worker and the claim is decided exactly once; with Redis stopped claims wait `pending`
 * and the step says verification is paused, then they are checked when Redis is back; cancel; large
 * enumeration and coverage claims checked in parts shared by two workers (the verdict a single job
 * gives, the parts counted in the pending display, no verdict for a claim withdrawn meanwhile).
 * Each part runs its own workers on a queue prefix of its own (and the outage part its own Redis),
 * so the suite's shared worker never takes these jobs.
 */
import { describe, expect, it, vi } from "vitest";

vi.mock("next-auth", async (importOriginal) => ({ ...(await importOriginal<typeof import("next-auth")>()), getServerSession: vi.fn() }));

import { actAs, params, expectStatusAs, workersPerTest } from "./helpers";
import { claimJobsStep, A000055, A001349 } from "./claim-jobs-fixture";
import { models } from "@/models";
import { verificationSettled } from "@/lib/data/claims";
import { claimJobProgress, verificationService } from "@/lib/jobs/queue";
import { parseClaimSet } from "@/lib/review/revisions";
import { until } from "../support/workers";
import { ownRedisForTest } from "../support/redis";
import * as claimsRoute from "@/app/api/proofs/[proofId]/steps/[stepId]/claims/route";
import * as cancelRoute from "@/app/api/proofs/[proofId]/claims/[claimId]/cancel/route";
import * as claimRoute from "@/app/api/proofs/[proofId]/claims/[claimId]/route";
import { pendingProgress } from "@/lib/data/claim-jobs";
import { claimPartJobId, verificationQueue } from "@/lib/jobs/queue";
import { partsFor } from "@/lib/jobs/claim-parts";
import { validateClaim, verifyClaim } from "@/lib/core";
import { Budget } from "@/lib/core/verdict";

const { workers, saved } = workersPerTest(["REDIS_URL", "CAIRN_QUEUE_PREFIX"]);
const step = claimJobsStep("Verification jobs test", workers);
const { attach, claimRow, decisions, nameOf, worker } = step;
const named = (text: string) => ({ format: "named", text });
// ρ(K_{1,5}) = √5 exactly (a star with k leaves has spectral radius √k; from memory, common knowledge).
const quick = { format: "cairn-claim/1", kind: "spectral-radius-bound", graph: named("star(5)"), op: ">=", bound: "sqrt(5)" };
// Several seconds of exhaustive enumeration here. The empty list is refuted: K₁ has ρ = 0 ≤ the bound
// and is not listed (from the definition of the claim).
const slow = { format: "cairn-claim/1", kind: "enumeration", maxVertices: 9, op: "<=", bound: "sqrt(2+sqrt(5))", graphs: [] };

const stepClaims = async () => (await claimsRoute.GET(new Request("http://localhost/x"), params({ proofId: step.proofId(), stepId: step.stepId() }))).json();
/** The claim's status as the step's latest revision records it (what a vouch would cover). */
const inLatestRevision = async (claimId: number) => {
  const r = await models().StepRevision.findOne({ where: { stepId: Number(step.stepId()) }, order: [["number", "DESC"]] });
  return parseClaimSet(r!.claimSet).find((c) => c.id === claimId)?.status;
};

describe("a worker killed mid-check", () => {
  it("leaves the job to another worker, and the claim is decided exactly once", async () => {
    process.env.CAIRN_QUEUE_PREFIX = `${saved.CAIRN_QUEUE_PREFIX}-kill`;
    // Short locks so that the dead worker's job is noticed within seconds, not the default 30 s.
    const fast = { CAIRN_JOB_LOCK_MS: "2000", CAIRN_JOB_STALLED_CHECK_MS: "1000" };
    const first = worker(fast);
    const firstName = await nameOf(first);
    const { claims } = await attach([slow]);
    const id = claims[0].id;
    const row = await claimRow(id);
    await until("the first worker to take the job", async () => (await claimJobProgress(id, row!.verifyRound))?.state === "checking");
    expect((await claimJobProgress(id, row!.verifyRound))?.worker).toBe(firstName);
    // Killed before the second worker starts (its start-up takes seconds on a busy host, long enough for the
    // first to finish the check otherwise); the second takes the job over once the dead worker's lock runs out.
    first.stop("SIGKILL");
    const second = worker(fast);
    const secondName = await nameOf(second);
    await verificationSettled(id);
    const decided = await claimRow(id);
    expect(decided).toMatchObject({ status: "refuted", decidedBy: secondName, checkerVersion: expect.stringMatching(/^cairn-check\//) });
    expect(await decisions(id)).toBe(1);
    // The worker carried the verdict into the step's revision (which recorded the claim pending).
    expect(await inLatestRevision(id)).toBe("refuted");
    expect(first.output.join("\n")).not.toMatch(new RegExp(`claim ${id} decided`));
    expect(second.output.join("\n")).toMatch(new RegExp(`claim ${id} decided`));
  }, 240_000);
});

describe("cancel", () => {
  it("stops a running check: undecided with who cancelled, no verdict stored afterwards; 409 when nothing is pending; 401/403", async () => {
    process.env.CAIRN_QUEUE_PREFIX = `${saved.CAIRN_QUEUE_PREFIX}-cancel`;
    const w = worker();
    await w.ready;
    const { claims } = await attach([slow]);
    const id = claims[0].id;
    await until("the job to start", async () => (await claimJobProgress(id, 0))?.state === "checking");
    const cancel = () => cancelRoute.POST(new Request("http://localhost/x", { method: "POST" }), params({ proofId: step.proofId(), claimId: String(id) }));
    await expectStatusAs(cancel, { nobody: 401, reviewer: 403 });
    await actAs("author");
    const res = await cancel();
    expect(res.status).toBe(200);
    expect((await res.json()).claim).toMatchObject({ status: "undecided", method: "cancelled", reason: expect.stringMatching(/cancelled by Ada Quenby/) });
    await until("the worker to stop the check", async () => w.output.some((l) => l.includes(`claim ${id} no longer pending`)));
    expect(await claimRow(id)).toMatchObject({ status: "undecided", method: "cancelled" });
    expect(await decisions(id)).toBe(0);
    // A cancelled check is `undecided` in the step's revision too, so a vouch does not wait for it.
    expect(await inLatestRevision(id)).toBe("undecided");
    expect((await cancel()).status).toBe(409);
  }, 120_000);
});

describe("Redis stopped", () => {
  it("claims wait pending and the step says verification is paused; they are checked when Redis is back", async () => {
    const redis = await ownRedisForTest("cairn-outage");
    const w = worker({ CAIRN_SWEEP_AFTER_MS: "500", CAIRN_SWEEP_INTERVAL_MS: "500" });
    await w.ready;
    const before = await attach([quick]);
    await verificationSettled(before.claims[0].id);
    expect(await claimRow(before.claims[0].id)).toMatchObject({ status: "verified" });

    redis.down();
    const t0 = Date.now();
    const during = await attach([quick]);
    // The attach itself does not wait for Redis beyond its short bound.
    expect(Date.now() - t0).toBeLessThan(5_000);
    expect(during.status).toBe(202);
    const id = during.claims[0].id;
    expect(await verificationService()).toMatchObject({
      paused: true,
      message: expect.stringMatching(/Verification is paused: the job queue cannot be reached/),
    });
    const listed = await stepClaims();
    expect(listed.verification).toMatchObject({ paused: true });
    await new Promise((r) => setTimeout(r, 3_000));
    expect(await claimRow(id)).toMatchObject({ status: "pending" });

    await redis.up();
    await until("the claim to be decided after Redis came back", async () => (await claimRow(id))?.status !== "pending", 60_000);
    expect(await claimRow(id)).toMatchObject({ status: "verified", decidedBy: await nameOf(w) });
    expect(await decisions(id)).toBe(1);
    expect(await until("the worker to reconnect", async () => !(await verificationService()).paused)).toBe(true);
  }, 180_000);
});

const partRows = (id: number) => models().ClaimPart.findAll({ where: { claimId: id }, order: [["part", "ASC"]] });
const twoWorkers = async (prefix: string) => {
  process.env.CAIRN_QUEUE_PREFIX = `${saved.CAIRN_QUEUE_PREFIX}-${prefix}`;
  return Promise.all([worker(), worker()].map(nameOf));
};
/** What one job in this process gives for the claim: the single-job path the parts must agree with. */
const single = (claim: object) => verifyClaim(validateClaim(claim), { budget: new Budget(1e12) }).verdict;

const trees14 = { format: "cairn-claim/1", kind: "enumeration", setting: "tree", maxVertices: 14, op: "<=", bound: "100", graphs: [] };
const graphs7 = { format: "cairn-claim/1", kind: "enumeration", maxVertices: 7, op: "<", bound: "7", graphs: [] };
const treeSplit = {
  format: "cairn-claim/1",
  kind: "coverage",
  setting: "tree",
  maxVertices: 12,
  cases: [
    { label: "a path", condition: { predicate: "path" } },
    { label: "one branch vertex", condition: { predicate: "branch-vertices", relation: "=", value: 1 } },
    { label: "two or more", condition: { predicate: "branch-vertices", relation: ">=", value: 2 } },
  ],
};

describe("claims checked in parts", () => {
  it("two workers take different parts; the verdicts and certificates are a single job's; progress counts the parts", async () => {
    const names = await twoWorkers("share");
    expect(new Set(names).size).toBe(2);
    const claims = [trees14, graphs7, treeSplit];
    expect(claims.map((c) => partsFor(validateClaim(c)))).toEqual([8, 2, 2]);
    const ids = (await attach(claims)).claims.map((c) => c.id);
    for (const id of ids) await verificationSettled(id);

    for (const [i, id] of ids.entries()) {
      const row = (await claimRow(id))!;
      const want = single(claims[i]);
      expect(row.status).toBe(want.status);
      // Stored as a single job stores them (statement and method cut to their columns).
      expect(row.statement).toBe(want.statement.slice(0, 500));
      expect(row.method).toBe(want.method.slice(0, 200));
      expect(row.reason!.startsWith(want.reason!)).toBe(true);
      expect(JSON.parse(row.certificate!)).toEqual(want.certificate);
      expect(await decisions(id)).toBe(1);
      const parts = await partRows(id);
      expect(parts.map((p) => p.part)).toEqual([...Array(partsFor(validateClaim(claims[i]))).keys()]);
      expect(parts.every((p) => names.includes(p.worker) && p.undecided === null)).toBe(true);
      // The claim job said how many parts it handed out; the pending display reads "k of K parts done".
      const progress = await claimJobProgress(id, row.verifyRound);
      expect(progress?.parts).toEqual({ done: 0, of: parts.length });
      const shown = await pendingProgress([{ id, status: "pending", verifyRound: row.verifyRound }]);
      expect(shown.get(id)?.parts).toEqual({ done: parts.length, of: parts.length });
    }
    // Both workers computed parts (eight parts of the trees on ≤ 14 vertices, two workers waiting for them).
    const byWorker = new Set((await Promise.all(ids.map(partRows))).flat().map((p) => p.worker));
    expect(byWorker).toEqual(new Set(names));

    // Trees on ≤ 14 vertices (OEIS A000055), all missing from the empty list: refuted, every one counted.
    expect(JSON.parse((await claimRow(ids[0]))!.certificate!).evidence.counts).toEqual(A000055);
    // Connected graphs on ≤ 7 vertices (OEIS A001349; nauty's geng -c agrees, lib/core/families/parts.test.ts).
    expect(JSON.parse((await claimRow(ids[1]))!.certificate!).evidence.counts).toEqual(A001349.slice(0, 7));
    // The split of the trees covers all 987 trees on ≤ 12 vertices (OEIS A000055: 1+1+1+2+3+6+11+23+47+106+235+551).
    expect((await claimRow(ids[2]))!.status).toBe("verified");
    expect((await claimRow(ids[2]))!.reason).toMatch(/^All 987 graphs/);
  }, 300_000);

  it("a worker killed while it computes a part: another worker takes the part over, and the claim is decided once, as a single job decides it", async () => {
    process.env.CAIRN_QUEUE_PREFIX = `${saved.CAIRN_QUEUE_PREFIX}-partkill`;
    // Short locks so that the dead worker's part is noticed within seconds, not the default 30 s.
    const fast = { CAIRN_JOB_LOCK_MS: "2000", CAIRN_JOB_STALLED_CHECK_MS: "1000" };
    const first = worker(fast);
    const firstName = await nameOf(first);
    // Connected graphs on ≤ 8 vertices, none listed: 4 parts.
    const claim = { format: "cairn-claim/1", kind: "enumeration", maxVertices: 8, op: "<", bound: "8", graphs: [] };
    expect(partsFor(validateClaim(claim))).toBe(4);
    const id = (await attach([claim])).claims[0].id;
    const partState = (p: number) =>
      verificationQueue()
        .getJob(claimPartJobId(id, 0, p))
        .then((j) => j?.getState());
    const running = await until("a part to be running on the first worker", async () => {
      for (const p of [0, 1, 2, 3]) if ((await partState(p)) === "active") return { part: p };
      return null;
    });
    first.stop("SIGKILL");
    const second = worker(fast);
    const secondName = await nameOf(second);
    await verificationSettled(id);
    const row = (await claimRow(id))!;
    const want = single(claim);
    expect(row.status).toBe(want.status);
    expect(JSON.parse(row.certificate!)).toEqual(want.certificate);
    expect(row.decidedBy).toBe(secondName);
    expect(await decisions(id)).toBe(1);
    // Every part stored once. The part cut off by the kill is computed again by the second worker — unless the first
    // stored it in the few milliseconds between the look and the kill; the second worker computes the parts left either way.
    const parts = await partRows(id);
    expect(parts.map((p) => p.part)).toEqual([0, 1, 2, 3]);
    expect(parts.every((p) => [firstName, secondName].includes(p.worker))).toBe(true);
    expect(parts.some((p) => p.worker === secondName)).toBe(true);
    const cut = parts.find((p) => p.part === running.part)!;
    if (cut.worker === secondName) {
      const job = await verificationQueue().getJob(claimPartJobId(id, 0, running.part));
      expect((job?.stalledCounter ?? 0) + (job?.attemptsMade ?? 0)).toBeGreaterThan(0);
    }
    // Connected graphs on ≤ 8 vertices: OEIS A001349 (1, 1, 2, 6, 21, 112, 853, 11117).
    expect(JSON.parse(row.certificate!).evidence.counts).toEqual(A001349.slice(0, 8));
  }, 300_000);

  it("a claim withdrawn while its parts run gets no verdict", async () => {
    await twoWorkers("withdraw");
    // Connected graphs on ≤ 8 vertices: 4 parts of a few seconds on a busy host.
    const claim = { format: "cairn-claim/1", kind: "enumeration", maxVertices: 8, op: "<", bound: "8", graphs: [] };
    expect(partsFor(validateClaim(claim))).toBe(4);
    const id = (await attach([claim])).claims[0].id;
    await until("the first part to be stored", async () => (await partRows(id)).length > 0, 120_000);
    await actAs("author");
    const res = await claimRoute.DELETE(new Request("http://localhost/x", { method: "DELETE" }), params({ proofId: step.proofId(), claimId: String(id) }));
    expect(res.status).toBe(200);
    // Every part job ends (computed before the withdrawal, stopped during it, or skipped after it); then look again.
    await until(
      "every part job to end",
      async () => {
        const states = await Promise.all([0, 1, 2, 3].map(async (p) => (await verificationQueue().getJob(claimPartJobId(id, 0, p)))?.getState()));
        return states.every((s) => s === "completed");
      },
      120_000,
    );
    const row = (await claimRow(id))!;
    expect(row.withdrawnAt).not.toBeNull();
    expect(row.status).toBe("pending");
    expect(row.certificate).toBeNull();
    expect(await decisions(id)).toBe(0);
    expect(workers.some((w) => w.output.some((l) => l.includes(`claim ${id}`) && l.includes("claim decided")))).toBe(false);
  }, 300_000);
});
