/** A reviewer invited to chosen cases sees those cases (and their sub-cases) only, in pages' data and in every read route. */
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";

vi.mock("next-auth", async (importOriginal) => ({ ...(await importOriginal<typeof import("next-auth")>()), getServerSession: vi.fn() }));

import { actAs, demoProofId, params, userIdOf } from "./helpers";
import { closeSequelize } from "@/lib/db";
import { models } from "@/models";
import * as casesRoute from "@/app/api/proofs/[proofId]/cases/route";
import * as claimsRoute from "@/app/api/proofs/[proofId]/claims/route";
import * as stepRoute from "@/app/api/proofs/[proofId]/steps/[stepId]/route";
import * as diffRoute from "@/app/api/proofs/[proofId]/steps/[stepId]/diff/route";
import { flattenCaseTree, type CaseNode } from "@/lib/proof-tree";

let proofId: number;
let reviewerId: number;
let scopedCase: { id: number; title: string };
let inside: number; // a step in the scoped case
let outside: number; // a step elsewhere

beforeAll(async () => {
  proofId = await demoProofId();
  reviewerId = await userIdOf("reviewer");
  const { Case, Step, ReviewerScope } = models();
  const cases = await Case.findAll({ where: { proofId, deletedAt: null }, order: [["id", "ASC"]] });
  const top = cases.filter((c) => c.parentId === null);
  const withChildren = top.find((c) => cases.some((k) => k.parentId === c.id))!;
  scopedCase = { id: withChildren.id, title: withChildren.title };
  const other = top.find((c) => c.id !== withChildren.id)!;
  inside = (await Step.findOne({ where: { caseId: withChildren.id } }))!.id;
  outside = (await Step.findOne({ where: { caseId: other.id } }))!.id;
  await ReviewerScope.create({ proofId, userId: reviewerId, caseId: withChildren.id });
});

afterAll(async () => {
  await models().ReviewerScope.destroy({ where: { proofId, userId: reviewerId } });
  await closeSequelize();
});

const get = (url: string) => new Request(`http://localhost${url}`);

describe("case-scoped reviewer", () => {
  it("sees only the chosen case and its sub-cases in the case tree, with their real numbers", async () => {
    await actAs("reviewer");
    const res = await casesRoute.GET(get(`/api/proofs/${proofId}/cases`), params({ proofId: String(proofId) }));
    expect(res.status).toBe(200);
    const { cases } = (await res.json()) as { cases: CaseNode<{ id: number; parentId: number | null; position: number; title: string }>[] };
    expect(cases.map((c) => c.title)).toEqual([scopedCase.title]);
    const all = flattenCaseTree(cases);
    expect(all.length).toBeGreaterThan(1); // the sub-cases come along
    expect(all.every((c) => c.number.startsWith(cases[0].number))).toBe(true);

    // An author of the same proof still sees every case.
    await actAs("author");
    const full = await (await casesRoute.GET(get(`/api/proofs/${proofId}/cases`), params({ proofId: String(proofId) }))).json();
    expect(full.cases.length).toBeGreaterThan(1);
  });

  it("gets 403 for a step outside the scope and 200 inside it, on every step read route", async () => {
    await actAs("reviewer");
    const p = (stepId: number) => params({ proofId: String(proofId), stepId: String(stepId) });
    expect((await stepRoute.GET(get("/x"), p(outside))).status).toBe(403);
    expect((await diffRoute.GET(get("/x?from=1&to=1"), p(outside))).status).toBe(403);
    expect((await stepRoute.GET(get("/x"), p(inside))).status).toBe(200);
  });

  it("lists only claims of visible steps", async () => {
    await actAs("reviewer");
    const scoped = await (await claimsRoute.GET(get("/x"), params({ proofId: String(proofId) }))).json();
    await actAs("editor");
    const all = await (await claimsRoute.GET(get("/x"), params({ proofId: String(proofId) }))).json();
    expect(all.claims.length).toBeGreaterThan(scoped.claims.length);
    const visibleSteps = new Set(scoped.claims.map((c: { stepId: number }) => c.stepId));
    expect(visibleSteps.has(outside)).toBe(false);
  });
});
