/**
 * The overview for reading a proof: under each step its claims and its review (who vouched at which
 * revision, superseded vouches, unresolved disputes with their state), with referees named as the viewer
 * may see them (blind: "Referee k" for authors) and only the cases a case-limited referee may see; and
 * the proof list's standing of each proof (drafting, in review round N, decided) with its open disputes.
 */
import { describe, expect, it, vi } from "vitest";

vi.mock("next-auth", async (importOriginal) => ({ ...(await importOriginal<typeof import("next-auth")>()), getServerSession: vi.fn() }));

import { actAs, jsonRequest, params } from "./helpers";
import { reviewProofsForFile, latestRevision, revise } from "./review-fixtures";
import { models } from "@/models";
import { digestOfRevision } from "@/lib/review/revisions";
import { flattenCaseTree, stepLabel } from "@/lib/proof-tree";
import { openRound, recordDecision } from "@/lib/data/rounds";
import type { StepView } from "@/lib/data/cases";
import * as casesRoute from "@/app/api/proofs/[proofId]/cases/route";
import * as proofsRoute from "@/app/api/proofs/route";
import * as reviews from "@/app/api/proofs/[proofId]/steps/[stepId]/reviews/route";

const CELIA = "Celia Marwood";
const [fx] = reviewProofsForFile(["overview review"]);

const p = (stepId: number) => params({ proofId: String(fx.proofId), stepId: String(stepId) });
const verdict = async (stepId: number, body: Record<string, unknown>) => {
  const res = await reviews.POST(jsonRequest("/x", "POST", body), p(stepId));
  expect(res.status, JSON.stringify(await res.clone().json())).toBe(201);
};
const vouchLatest = async (stepId: number) => {
  const r = await latestRevision(stepId);
  await verdict(stepId, { verdict: "vouch", revisionId: r.id, digest: digestOfRevision(r.number, r.body, []) });
};
/** The overview as the signed-in person gets it from the API, with each step found by its label. */
const overview = async () => {
  const body = await (await casesRoute.GET(new Request("http://localhost/x"), params({ proofId: String(fx.proofId) }))).json();
  const steps = new Map<string, StepView>();
  for (const c of flattenCaseTree(body.cases as Parameters<typeof flattenCaseTree>[0]))
    (c as unknown as { steps: StepView[] }).steps.forEach((s, j) => steps.set(stepLabel(c.number, j + 1), s));
  return { body, steps };
};
const listed = async () =>
  (
    (await (await proofsRoute.GET(new Request("http://localhost/api/proofs"), params({}))).json()).proofs as Array<{
      id: number;
      standing: unknown;
      openDisputes: number;
    }>
  ).find((x) => x.id === fx.proofId)!;

describe("the overview shows each step's review", () => {
  it("lists who vouched at which revision, superseded vouches and unresolved disputes with their state", async () => {
    await actAs("reviewer");
    await vouchLatest(fx.steps["1.1"]);
    await vouchLatest(fx.steps["2.1"]);
    await verdict(fx.steps["2.2"], { verdict: "dispute", revisionId: (await latestRevision(fx.steps["2.2"])).id, comment: "Why is $x$ real?" });
    await revise(fx.steps["2.1"], fx.ids.author);

    await actAs("author");
    const { steps, body } = await overview();
    expect(body.requiredApprovals).toBe(1);
    expect(steps.get(stepLabel("1", 1))!.review).toEqual({ vouches: [{ name: CELIA, revision: 1, superseded: false }], disputes: [] });
    expect(steps.get(stepLabel("1", 1))!.vouches).toBe(1);
    // Revision 2 of step 2(a) supersedes the vouch given on revision 1: listed, marked, not counted.
    expect(steps.get(stepLabel("2", 1))!.review.vouches).toEqual([{ name: CELIA, revision: 1, superseded: true }]);
    expect(steps.get(stepLabel("2", 1))!.vouches).toBe(0);
    const disputes = steps.get(stepLabel("2", 2))!.review.disputes;
    expect(disputes).toEqual([{ id: expect.any(Number), name: CELIA, state: "raised", revision: 1 }]);
    expect(steps.get(stepLabel("2.1", 1))!.review).toEqual({ vouches: [], disputes: [] });
    // Case 2 reads disputed, and the step that says why is in it.
    expect(body.cases.find((c: { number: string }) => c.number === "2").state).toBe("disputed");

    // An answered dispute is still unresolved and listed with its new state; a withdrawn one leaves the list.
    await models().Review.update({ disputeState: "answered" }, { where: { id: disputes[0].id } });
    expect((await overview()).steps.get(stepLabel("2", 2))!.review.disputes.map((d) => d.state)).toEqual(["answered"]);
    await models().Review.update({ disputeState: "withdrawn" }, { where: { id: disputes[0].id } });
    expect((await overview()).steps.get(stepLabel("2", 2))!.review.disputes).toEqual([]);
    await models().Review.update({ disputeState: "raised" }, { where: { id: disputes[0].id } });
  });

  it("names referees 'Referee k' to authors of a blind proof, never by name or id; the editor sees the name", async () => {
    await models().Proof.update({ blindReview: true }, { where: { id: fx.proofId } });
    try {
      await actAs("coauthor");
      const { body, steps } = await overview();
      const text = JSON.stringify(body);
      expect(text).not.toContain(CELIA);
      expect(text).not.toContain(`"reviewerId"`);
      expect(steps.get(stepLabel("1", 1))!.review.vouches).toEqual([{ name: "Referee 1", revision: 1, superseded: false }]);
      expect(steps.get(stepLabel("2", 2))!.review.disputes[0].name).toBe("Referee 1");
      await actAs("editor");
      expect((await overview()).steps.get(stepLabel("1", 1))!.review.vouches[0].name).toBe(CELIA);
    } finally {
      await models().Proof.update({ blindReview: false }, { where: { id: fx.proofId } });
    }
  });

  it("shows a case-limited referee only their cases' steps, claims and reviews", async () => {
    const scope = await models().ReviewerScope.create({ proofId: fx.proofId, userId: fx.ids.reviewer, caseId: fx.cases["2.1"] });
    try {
      await actAs("reviewer");
      const { steps } = await overview();
      expect([...steps.keys()]).toEqual([stepLabel("2.1", 1)]);
      // The dispute on step 2(b) lies outside the scope: the proof list does not count it for this referee.
      expect((await listed()).openDisputes).toBe(0);
    } finally {
      await scope.destroy();
    }
  });
});

describe("the proof list shows where each proof stands", () => {
  it("reads drafting, then in review round 1, then decided, with the open disputes counted", async () => {
    await actAs("author");
    expect(await listed()).toMatchObject({ standing: { stage: "drafting" }, openDisputes: 1 });
    const editor = { id: fx.ids.editor, name: "Dov Ashgrove" };
    await openRound(fx.proofId, editor.id, new Date(Date.now() + 14 * 86_400_000));
    expect((await listed()).standing).toEqual({ stage: "in review", round: 1 });
    await recordDecision(fx.proofId, 1, editor, { decision: "minor_revision", letter: "Please argue why $x$ is real.", attachReports: false });
    expect((await listed()).standing).toEqual({ stage: "decided", round: 1, decision: "minor_revision" });
    // A dispute under a deleted case no longer counts.
    await models().Case.update({ deletedAt: new Date() }, { where: { id: fx.cases["2"] } });
    expect((await listed()).openDisputes).toBe(0);
    await models().Case.update({ deletedAt: null }, { where: { id: fx.cases["2"] } });
  });
});
