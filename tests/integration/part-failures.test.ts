/**
 * Parts of a claim checked in parts that throw (faults injected with CAIRN_TEST_FAULTS, read by the workers only
 * under NODE_ENV=test): a part that throws is tried again by BullMQ and the claim is decided once, as a single job
 * decides it, and while it is tried again the API and the claim card say which part, on which attempt and after what
 * failure; a part that throws on every attempt leaves the claim undecided, saying which part failed, how often
 * and why (in the API and on the claim card; the sweep settles it likewise when that was lost), and a re-check runs
 * it again. Each test runs its own worker on a queue prefix of its own, so the suite's shared worker never takes
 * these jobs.
 */
import { describe, expect, it, vi } from "vitest";

vi.mock("next-auth", async (importOriginal) => ({ ...(await importOriginal<typeof import("next-auth")>()), getServerSession: vi.fn() }));

import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { actAs, params, workersPerTest } from "./helpers";
import { claimJobsStep, A000055, A001349 } from "./claim-jobs-fixture";
import { models } from "@/models";
import { verificationSettled } from "@/lib/data/claims";
import type { ClaimView } from "@/lib/data/claim-views";
import { claimPartJobId, partRetries, verificationQueue } from "@/lib/jobs/queue";
import { partsFor, sweepClaimParts } from "@/lib/jobs/claim-parts";
import { validateClaim, verifyClaim } from "@/lib/core";
import { Budget } from "@/lib/core/verdict";
import { ClaimCard } from "@/components/claims/claim-card";
import * as claimRoute from "@/app/api/proofs/[proofId]/claims/[claimId]/route";
import * as recheckRoute from "@/app/api/proofs/[proofId]/claims/[claimId]/recheck/route";

const { workers, saved } = workersPerTest(["REDIS_URL", "CAIRN_QUEUE_PREFIX"]);
const step = claimJobsStep("Parts that fail", workers);

// Connected graphs on ≤ 7 vertices, none listed (refuted, every class counted): 2 parts. Trees on ≤ 13 vertices: 4 parts.
const graphs7 = { format: "cairn-claim/1", kind: "enumeration", maxVertices: 7, op: "<", bound: "7", graphs: [] };
const trees13 = { format: "cairn-claim/1", kind: "enumeration", setting: "tree", maxVertices: 13, op: "<=", bound: "100", graphs: [] };
/** What one job in this process gives for the claim: the single-job path the parts must agree with. */
const single = (claim: object) => verifyClaim(validateClaim(claim), { budget: new Budget(1e12) });
const partRows = (id: number, round = 0) => models().ClaimPart.findAll({ where: { claimId: id, verifyRound: round }, order: [["part", "ASC"]] });
const partJob = (id: number, part: number, round = 0) => verificationQueue().getJob(claimPartJobId(id, round, part));
const fault = (part: number, attempt: number) => `fault injected by CAIRN_TEST_FAULTS into part ${part}, attempt ${attempt}`;

describe("a part that throws", () => {
  it("is tried again, stored once, and the claim is decided once with the certificate and digest of a single job", async () => {
    process.env.CAIRN_QUEUE_PREFIX = `${saved.CAIRN_QUEUE_PREFIX}-partretry`;
    // Part 2 of each claim throws on its first two attempts and computes on its third (the last BullMQ allows).
    const w = step.worker({ CAIRN_TEST_FAULTS: "part:2@1,part:2@2" });
    const name = await step.nameOf(w);
    const claims = [graphs7, trees13];
    expect(claims.map((c) => partsFor(validateClaim(c)))).toEqual([2, 4]);
    const ids = (await step.attach(claims)).claims.map((c) => c.id);
    for (const id of ids) await verificationSettled(id);

    for (const [i, id] of ids.entries()) {
      const row = (await step.claimRow(id))!;
      const want = single(claims[i]);
      expect(row.status).toBe(want.verdict.status);
      expect(JSON.parse(row.certificate!)).toEqual(want.verdict.certificate);
      expect(row.digest).toBe(want.digest);
      expect(row.decidedBy).toBe(name);
      expect(await step.decisions(id)).toBe(1);
      // Every part stored once, by the one worker; part 2's job failed twice before it stored the part.
      const parts = await partRows(id);
      expect(parts.map((p) => p.part)).toEqual([...Array(partsFor(validateClaim(claims[i]))).keys()]);
      expect(parts.every((p) => p.worker === name && p.undecided === null)).toBe(true);
      expect((await partJob(id, 1))!.attemptsMade).toBeGreaterThanOrEqual(2);
      expect((await partJob(id, 0))!.stacktrace ?? []).toEqual([]);
      for (const attempt of [1, 2])
        expect(w.output.some((l) => l.includes(`claim-${id}-r0-p1 failed (attempt ${attempt} of 3): ${fault(2, attempt)}`))).toBe(true);
      expect(w.output.some((l) => l.includes(`fault injected`) && l.includes(`claim-${id}-r0-p1 failed (attempt 3`))).toBe(false);
    }
    // Connected graphs on ≤ 7 vertices: OEIS A001349. Trees on ≤ 13 vertices: OEIS A000055.
    expect(JSON.parse((await step.claimRow(ids[0]))!.certificate!).evidence.counts).toEqual(A001349.slice(0, 7));
    expect(JSON.parse((await step.claimRow(ids[1]))!.certificate!).evidence.counts).toEqual(A000055.slice(0, 13));
  }, 300_000);

  it("while it is tried again, the API and the claim card say which part, on which attempt of how many, and after what failure", async () => {
    process.env.CAIRN_QUEUE_PREFIX = `${saved.CAIRN_QUEUE_PREFIX}-partretrying`;
    // Part 2 throws on its first two attempts; BullMQ waits 1 s, then 2 s, before trying it again (exponential backoff):
    // the window in which the claim is read here, every 100 ms, through the API.
    const w = step.worker({ CAIRN_TEST_FAULTS: "part:2@1,part:2@2" });
    await w.ready;
    const id = (await step.attach([graphs7])).claims[0].id;
    await actAs("author");
    const read = async () =>
      (await (await claimRoute.GET(new Request("http://localhost/x"), params({ proofId: step.proofId(), claimId: String(id) }))).json()).claim as ClaimView;
    let seen: ClaimView | undefined;
    for (const deadline = Date.now() + 120_000; !seen && Date.now() < deadline;) {
      const view = await read();
      if (view.status !== "pending") break;
      if (view.progress?.parts?.retrying?.length) seen = view;
      else await new Promise((r) => setTimeout(r, 100));
    }
    expect(seen, "the claim was never read while its part 2 was being tried again").toBeDefined();
    const parts = seen!.progress!.parts!;
    expect(parts.of).toBe(2);
    expect(parts.retrying).toHaveLength(1);
    const [retry] = parts.retrying!;
    // The attempt it is on follows the attempt that failed last, whose reason is given.
    expect(retry).toMatchObject({ part: 2, of: 2, attempts: 3 });
    expect([2, 3]).toContain(retry.attempt);
    expect(retry.after).toBe(fault(2, retry.attempt - 1));
    expect(retry.words).toBe(`part 2 of 2 is being tried again (attempt ${retry.attempt} of 3) after: ${fault(2, retry.attempt - 1)}`);
    // The card says the same, with what happens if every attempt fails.
    const card = renderToStaticMarkup(
      createElement(ClaimCard, { claim: seen!, proofId: Number(step.proofId()), canRecheck: true, canWithdraw: true, onChanged: () => {} }),
    );
    expect(card).toContain(`${parts.done} of 2 parts done; ${retry.words}.`);
    expect(card).toContain("a part that fails on every attempt leaves the claim undecided with its reason, and a re-check runs it again");

    // The third attempt computes the part: the claim is decided once, as a single job decides it; the part is no longer said to be tried again.
    await verificationSettled(id);
    const row = (await step.claimRow(id))!;
    const want = single(graphs7);
    expect(row.status).toBe(want.verdict.status);
    expect(row.digest).toBe(want.digest);
    expect(await step.decisions(id)).toBe(1);
    expect(await partRetries(id, 0, 2, [1])).toEqual([]);
    // Connected graphs on ≤ 7 vertices: OEIS A001349.
    expect(JSON.parse(row.certificate!).evidence.counts).toEqual(A001349.slice(0, 7));
  }, 300_000);

  it("on every attempt: the claim is undecided saying which part failed, how often and why, on the card too; a re-check decides it", async () => {
    process.env.CAIRN_QUEUE_PREFIX = `${saved.CAIRN_QUEUE_PREFIX}-partfail`;
    const failing = step.worker({ CAIRN_TEST_FAULTS: "part:2@*" });
    await failing.ready;
    const id = (await step.attach([graphs7])).claims[0].id;
    await verificationSettled(id);
    const reason = `part 2 of 2 failed 3 times (${fault(2, 3)}), so the claim could not be decided; re-check to try again`;
    expect(await step.claimRow(id)).toMatchObject({ status: "undecided", method: "worker", reason, certificate: null, verifyRound: 0 });
    expect(await step.decisions(id)).toBe(1);
    // Part 1 was stored; part 2 never was, and its job failed for good after three attempts.
    expect((await partRows(id)).map((p) => p.part)).toEqual([0]);
    const job = (await partJob(id, 1))!;
    expect(await job.getState()).toBe("failed");
    expect(job.attemptsMade).toBe(3);
    // Failed for good, it is no longer said to be tried again.
    expect(await partRetries(id, 0, 2, [1])).toEqual([]);

    // The API and the claim card say the same, with the re-check button for the author.
    await actAs("author");
    const shown = (await (await claimRoute.GET(new Request("http://localhost/x"), params({ proofId: step.proofId(), claimId: String(id) }))).json())
      .claim as ClaimView;
    expect(shown).toMatchObject({ status: "undecided", method: "worker", reason });
    const card = renderToStaticMarkup(
      createElement(ClaimCard, { claim: shown, proofId: Number(step.proofId()), canRecheck: true, canWithdraw: true, onChanged: () => {} }),
    );
    expect(card).toContain("why undecided");
    expect(card).toContain(reason);
    expect(card).toContain("Re-check");

    // The sweep settles it the same way when the failed event's settling was lost (the row put back to pending here).
    const checkedBy = (await step.claimRow(id))!.checkedBy!;
    await models().Claim.unscoped().update({ status: "pending", method: null, reason: null }, { where: { id } });
    expect(await sweepClaimParts({ claimId: id, round: 0, checkedBy }, 2)).toBe("settled");
    expect(await step.claimRow(id)).toMatchObject({ status: "undecided", method: "worker", reason, certificate: null, verifyRound: 0 });
    expect(await step.decisions(id)).toBe(2);

    // With the fault gone (a worker without it), the author's re-check decides the claim in a new round, as a single job does.
    failing.stop("SIGKILL");
    const healthy = step.worker();
    const name = await step.nameOf(healthy);
    const res = await recheckRoute.POST(new Request("http://localhost/x", { method: "POST" }), params({ proofId: step.proofId(), claimId: String(id) }));
    expect(res.status).toBe(202);
    expect((await res.json()).claim).toMatchObject({ status: "pending" });
    await verificationSettled(id);
    const row = (await step.claimRow(id))!;
    const want = single(graphs7);
    expect(row).toMatchObject({ status: want.verdict.status, verifyRound: 1, decidedBy: name });
    expect(JSON.parse(row.certificate!)).toEqual(want.verdict.certificate);
    expect(await step.decisions(id)).toBe(3);
    expect((await partRows(id, 1)).map((p) => p.part)).toEqual([0, 1]);
    // Connected graphs on ≤ 7 vertices: OEIS A001349.
    expect(JSON.parse(row.certificate!).evidence.counts).toEqual(A001349.slice(0, 7));
  }, 300_000);
});
