/**
 * Concurrency invariants (issue 10, defects 1 and 8): parallel wrong-password sign-ins lock the
 * address; parallel step creates, case creates and claim attaches give unique consecutive
 * positions; of two racing saves of one step exactly one wins and the other gets 409.
 */
import { beforeAll, describe, expect, it, vi } from "vitest";

vi.mock("next-auth", async (importOriginal) => ({ ...(await importOriginal<typeof import("next-auth")>()), getServerSession: vi.fn() }));

import { actAs, jsonRequest, params, closeAfterAll } from "./helpers";
import { addStep, draftCaseStep, dropProofs } from "./workspace-fixture";
import { models } from "@/models";
import { authenticate, MAX_FAILURES } from "@/lib/data/users";
import { verificationSettled } from "@/lib/data/claims";
import { DEMO_PASSWORD, demoPeople } from "@/seeders/demo-content";
import * as stepsRoute from "@/app/api/proofs/[proofId]/cases/[caseId]/steps/route";
import * as casesRoute from "@/app/api/proofs/[proofId]/cases/route";
import * as claimsRoute from "@/app/api/proofs/[proofId]/steps/[stepId]/claims/route";
import * as revisionsRoute from "@/app/api/proofs/[proofId]/steps/[stepId]/revisions/route";
import * as stepRoute from "@/app/api/proofs/[proofId]/steps/[stepId]/route";

let proofId: string;
let caseId: number;

closeAfterAll(() => dropProofs([proofId]), { pool: true });
beforeAll(async () => {
  ({ proofId, caseId } = await draftCaseStep("Concurrency test", "Trees with a vertex of degree 3"));
});

const consecutive = (n: number) => Array.from({ length: n }, (_, i) => i + 1);

describe("sign-in lockout under parallel attempts", () => {
  it("25 concurrent wrong passwords lock the address; the right password is then refused", async () => {
    const email = demoPeople.find((p) => p.key === "coauthor")!.email;
    await models().SignInThrottle.destroy({ where: {} });
    const outcomes = await Promise.all(
      Array.from({ length: 25 }, (_, i) =>
        authenticate(email, `wrong-${i}`).then(
          (u) => (u === null ? "refused" : "signed-in"),
          (e: { code?: string; message?: string }) => e.code ?? `error: ${e.message}`,
        ),
      ),
    );
    // At most MAX_FAILURES attempts get as far as the password check; the rest are turned away.
    expect(outcomes.filter((o) => o.startsWith("error"))).toEqual([]);
    expect(outcomes.filter((o) => o === "refused").length).toBeLessThanOrEqual(MAX_FAILURES);
    expect(outcomes.filter((o) => o === "rate_limited").length).toBeGreaterThanOrEqual(25 - MAX_FAILURES);
    expect(outcomes).not.toContain("signed-in");
    await expect(authenticate(email, DEMO_PASSWORD)).rejects.toMatchObject({ code: "rate_limited", status: 429 });
    await models().SignInThrottle.destroy({ where: {} });
    expect(await authenticate(email, DEMO_PASSWORD)).toMatchObject({ email });
  });
});

describe("positions under concurrent writes", () => {
  it("20 parallel step creates in one case take places 1..20, each once", async () => {
    await actAs("author");
    const results = await Promise.all(
      Array.from({ length: 20 }, (_, i) =>
        stepsRoute.POST(jsonRequest("/x", "POST", { body: `Step ${i}: $\\rho(T) \\le 2$.` }), params({ proofId, caseId: String(caseId) })),
      ),
    );
    expect(results.map((r) => r.status)).toEqual(Array(20).fill(201));
    const positions = (await models().Step.findAll({ where: { caseId } })).map((s) => s.position).sort((a, b) => a - b);
    expect(positions).toEqual(consecutive(20));
  });

  it("moving steps still works with the places unique", async () => {
    await actAs("author");
    const before = (await models().Step.findAll({ where: { caseId }, order: [["position", "ASC"]] })).map((s) => s.id);
    const moves = await Promise.all(
      [before[3], before[10], before[15]].map((id) => stepRoute.PATCH(jsonRequest("/x", "PATCH", { move: "up" }), params({ proofId, stepId: String(id) }))),
    );
    expect(moves.map((r) => r.status)).toEqual([200, 200, 200]);
    const after = await models().Step.findAll({ where: { caseId }, order: [["position", "ASC"]] });
    expect(after.map((s) => s.position)).toEqual(consecutive(20));
    expect(after.map((s) => s.id).slice(2, 4)).toEqual([before[3], before[2]]);
  });

  it("12 parallel case creates under one parent take places 1..12, each once", async () => {
    await actAs("author");
    const results = await Promise.all(
      Array.from({ length: 12 }, (_, i) =>
        casesRoute.POST(jsonRequest("/x", "POST", { title: `Sub-case ${i}`, condition: "", parentId: caseId }), params({ proofId })),
      ),
    );
    expect(results.map((r) => r.status)).toEqual(Array(12).fill(201));
    const positions = (await models().Case.findAll({ where: { parentId: caseId } })).map((c) => c.position).sort((a, b) => a - b);
    expect(positions).toEqual(consecutive(12));
  });

  it("10 parallel claim attaches (2 claims each) on one step take places 1..20, each once", async () => {
    await actAs("author");
    const { id: stepId } = await addStep(proofId, caseId, "$K_{1,4} \\subseteq T$.");
    // ρ(K_{1,k}) = √k (a star with k leaves), from memory; K_{1,4} has ρ = 2.
    const claim = (k: number) => ({
      format: "cairn-claim/1",
      kind: "spectral-radius-bound",
      graph: { format: "named", text: `star(${k})` },
      op: "<=",
      bound: `sqrt(${k})`,
    });
    const results = await Promise.all(
      Array.from({ length: 10 }, (_, i) =>
        claimsRoute.POST(jsonRequest("/x", "POST", { claims: [claim(i + 1), claim(i + 2)] }), params({ proofId, stepId: String(stepId) })),
      ),
    );
    expect(results.map((r) => r.status)).toEqual(Array(10).fill(202));
    const rows = await models().Claim.findAll({ where: { stepId } });
    expect(rows.map((c) => c.position).sort((a, b) => a - b)).toEqual(consecutive(20));
    for (const r of rows) await verificationSettled(r.id);
  });
});

describe("two racing saves of one step", () => {
  it("exactly one wins (201); the other gets 409 with the winner's revision", async () => {
    const step = await addStep(proofId, caseId, "The first text.");
    await actAs("author");
    for (let round = 0; round < 3; round++) {
      const latest = await models().StepRevision.findOne({ where: { stepId: step.id }, order: [["number", "DESC"]] });
      const base = latest!.id;
      const go = (body: string) => revisionsRoute.POST(jsonRequest("/x", "POST", { baseRevisionId: base, body }), params({ proofId, stepId: String(step.id) }));
      const [a, b] = await Promise.all([go(`A${round}`), go(`B${round}`)]);
      expect([a.status, b.status].sort()).toEqual([201, 409]);
      const loser = a.status === 409 ? a : b;
      expect((await loser.json()).error.latest.number).toBe(round + 2);
    }
    expect(await models().StepRevision.count({ where: { stepId: step.id } })).toBe(4);
  });
});
