/** Steps: immutable revisions, the stale-base 409 with the newer revision, history and diff. */
import { beforeAll, describe, expect, it, vi } from "vitest";

vi.mock("next-auth", async (importOriginal) => ({ ...(await importOriginal<typeof import("next-auth")>()), getServerSession: vi.fn() }));

import { actAs, jsonRequest, params, closeAfterAll, expectStatusAs } from "./helpers";
import { addStep, draftCaseStep, dropProofs } from "./workspace-fixture";
import { models } from "@/models";
import * as stepsRoute from "@/app/api/proofs/[proofId]/cases/[caseId]/steps/route";
import * as stepRoute from "@/app/api/proofs/[proofId]/steps/[stepId]/route";
import * as revisionsRoute from "@/app/api/proofs/[proofId]/steps/[stepId]/revisions/route";
import * as revisionRoute from "@/app/api/proofs/[proofId]/steps/[stepId]/revisions/[number]/route";
import * as diffRoute from "@/app/api/proofs/[proofId]/steps/[stepId]/diff/route";

let proofId: string;
let caseId: number;
let step: { id: number; revisionId: number };

closeAfterAll(() => dropProofs([proofId]));
beforeAll(async () => {
  ({ proofId, caseId } = await draftCaseStep("Workspace steps test", "Exactly one branch vertex"));
  step = await addStep(proofId, caseId, "Let $T = T(a,b,c)$.\n\nThen $\\rho(T) \\le 2$.");
});

const save = (body: unknown, stepId = String(step.id)) =>
  revisionsRoute.POST(jsonRequest(`/api/proofs/${proofId}/steps/${stepId}/revisions`, "POST", body), params({ proofId, stepId }));

describe("POST .../cases/[caseId]/steps", () => {
  it("adds a step with revision 1; 401, 403 reviewer, 403 non-member, 404 case, 422 empty body", async () => {
    const post = (body: unknown, c = String(caseId)) => stepsRoute.POST(jsonRequest("/x", "POST", body), params({ proofId, caseId: c }));
    await actAs("author");
    const ok = await post({ body: "Second step: $\\lambda_1 < 2$." });
    expect(ok.status).toBe(201);
    const { step: s } = await ok.json();
    expect((await models().StepRevision.findByPk(s.revisionId))!.number).toBe(1);
    expect((await post({ body: "   " })).status).toBe(422);
    expect((await post({ body: "x" }, "987654")).status).toBe(404);
    await expectStatusAs(() => post({ body: "x" }), { nobody: 401, reviewer: 403, outsider: 403 });
  });
});

describe("revisions", () => {
  it("saves a new immutable revision based on the latest (201) and keeps the old one", async () => {
    await actAs("author");
    const res = await save({ baseRevisionId: step.revisionId, body: "Let $T = T(a,b,c)$ with $a \\le b \\le c$.\n\nThen $\\rho(T) \\le 2$." });
    expect(res.status).toBe(201);
    const { revision } = await res.json();
    expect(revision).toMatchObject({ number: 2, baseRevisionId: step.revisionId, authorName: "Ada Quenby" });
    expect((await models().StepRevision.findByPk(step.revisionId))!.body).toBe("Let $T = T(a,b,c)$.\n\nThen $\\rho(T) \\le 2$.");
  });

  it("answers 409 with the newer revision when the base is stale, writes nothing, and accepts a knowing overwrite", async () => {
    await actAs("author");
    const before = await models().StepRevision.count({ where: { stepId: step.id } });
    const stale = await save({ baseRevisionId: step.revisionId, body: "My edit from an old copy." });
    expect(stale.status).toBe(409);
    const { error } = await stale.json();
    expect(error.code).toBe("conflict");
    expect(error.latest).toMatchObject({ number: 2, body: expect.stringContaining("a \\le b \\le c") });
    expect(await models().StepRevision.count({ where: { stepId: step.id } })).toBe(before);
    const overwrite = await save({ baseRevisionId: error.latest.id, body: "My edit from an old copy." });
    expect(overwrite.status).toBe(201);
    expect((await overwrite.json()).revision.number).toBe(3);
  });

  it("lets exactly one of two simultaneous saves on the same base win", async () => {
    await actAs("author");
    const latest = await models().StepRevision.findOne({ where: { stepId: step.id }, order: [["number", "DESC"]] });
    const [a, b] = await Promise.all([save({ baseRevisionId: latest!.id, body: "A" }), save({ baseRevisionId: latest!.id, body: "B" })]);
    expect([a.status, b.status].sort()).toEqual([201, 409]);
  });

  it("401, 403 reviewer, 403 non-member, 404 step, 422 without a base or with a base from another step", async () => {
    await actAs(null);
    expect((await save({ baseRevisionId: step.revisionId, body: "x" })).status).toBe(401);
    await actAs("reviewer");
    const denied = await save({ baseRevisionId: step.revisionId, body: "x" });
    expect(denied.status).toBe(403);
    await actAs("outsider");
    expect((await save({ baseRevisionId: step.revisionId, body: "x" })).status).toBe(403);
    await actAs("author");
    expect((await save({ baseRevisionId: step.revisionId, body: "x" }, "987654")).status).toBe(404);
    const noBase = await save({ body: "x" });
    expect(noBase.status).toBe(422);
    expect((await noBase.json()).error.issues[0].path).toBe("baseRevisionId");
    const other = await models().StepRevision.findOne({ where: { stepId: { [(await import("sequelize")).Op.ne]: step.id } } });
    expect((await save({ baseRevisionId: other!.id, body: "x" })).status).toBe(422);
  });

  it("lists the history newest first, shows one revision, and diffs any two; members only", async () => {
    await actAs("reviewer");
    const list = await revisionsRoute.GET(new Request("http://localhost/x"), params({ proofId, stepId: String(step.id) }));
    expect(list.status).toBe(200);
    const numbers = (await list.json()).revisions.map((r: { number: number }) => r.number);
    expect(numbers[numbers.length - 1]).toBe(1);
    expect(numbers[0]).toBeGreaterThanOrEqual(4);
    const one = await revisionRoute.GET(new Request("http://localhost/x"), params({ proofId, stepId: String(step.id), number: "1" }));
    expect((await one.json()).revision.body).toContain("T(a,b,c)$.");
    const diff = await diffRoute.GET(new Request("http://localhost/x?from=1&to=2"), params({ proofId, stepId: String(step.id) }));
    expect(diff.status).toBe(200);
    const parts = (await diff.json()).diff.parts as Array<{ value: string; added: boolean; removed: boolean }>;
    expect(parts.find((p) => p.removed)?.value).toBe("Let $T = T(a,b,c)$.\n");
    expect(parts.find((p) => p.added)?.value).toContain("a \\le b \\le c");
    expect((await diffRoute.GET(new Request("http://localhost/x?from=1"), params({ proofId, stepId: String(step.id) }))).status).toBe(422);
    expect((await diffRoute.GET(new Request("http://localhost/x?from=1&to=99"), params({ proofId, stepId: String(step.id) }))).status).toBe(404);
    const full = await stepRoute.GET(new Request("http://localhost/x"), params({ proofId, stepId: String(step.id) }));
    expect((await full.json()).step).toMatchObject({ number: "1(a)", caseTitle: "Exactly one branch vertex" });
    expect((await revisionRoute.GET(new Request("http://localhost/x"), params({ proofId, stepId: String(step.id), number: "99" }))).status).toBe(404);
    expect((await stepRoute.GET(new Request("http://localhost/x"), params({ proofId, stepId: "987654" }))).status).toBe(404);
    await actAs("outsider");
    expect((await stepRoute.GET(new Request("http://localhost/x"), params({ proofId, stepId: String(step.id) }))).status).toBe(403);
    expect((await revisionRoute.GET(new Request("http://localhost/x"), params({ proofId, stepId: String(step.id), number: "1" }))).status).toBe(403);
    expect((await revisionsRoute.GET(new Request("http://localhost/x"), params({ proofId, stepId: String(step.id) }))).status).toBe(403);
    await actAs(null);
    expect((await revisionRoute.GET(new Request("http://localhost/x"), params({ proofId, stepId: String(step.id), number: "1" }))).status).toBe(401);
    expect((await stepRoute.GET(new Request("http://localhost/x"), params({ proofId, stepId: String(step.id) }))).status).toBe(401);
    await actAs(null);
    expect((await diffRoute.GET(new Request("http://localhost/x?from=1&to=2"), params({ proofId, stepId: String(step.id) }))).status).toBe(401);
  });
});
