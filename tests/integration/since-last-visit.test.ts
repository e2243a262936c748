/**
 * "Since your last visit" (issue 15): what others changed after a member's mark, listed with links to the
 * exact place. A referee limited to case 1 never sees a change outside it (case 2, the statement, the
 * rounds); on a blind proof the authors see "Referee k", never a referee's name or address; "mark as
 * seen" clears the list up to the newest change it showed. The route's 401 / 403 / 404 / 422.
 */
import { beforeAll, describe, expect, it, vi } from "vitest";

vi.mock("next-auth", async (importOriginal) => ({ ...(await importOriginal<typeof import("next-auth")>()), getServerSession: vi.fn() }));

import { getServerSession } from "next-auth";
import { actAs, jsonRequest, params } from "./helpers";
import { reviewProofsForFile, latestRevision } from "./review-fixtures";
import { models } from "@/models";
import { openRound, recordDecision, saveReportDraft, submitReport } from "@/lib/data/rounds";
import * as changes from "@/app/api/proofs/[proofId]/changes/route";
import * as revisions from "@/app/api/proofs/[proofId]/steps/[stepId]/revisions/route";
import * as reviews from "@/app/api/proofs/[proofId]/steps/[stepId]/reviews/route";
import * as statementComments from "@/app/api/proofs/[proofId]/statement/comments/route";
import * as conditionComments from "@/app/api/proofs/[proofId]/cases/[caseId]/comments/route";

interface Change {
  id: number;
  kind: string;
  sentence: string;
  href: string;
  at: string;
}
interface Changes {
  since: string;
  items: Change[];
  more: number;
  stepIds: number[];
  caseIds: number[];
}

const stamp = Date.now();
const GALE = { name: "Gale Fenwick", email: `gale.fenwick.visit.${stamp}@moorfield.example` };
const HOLLIS = { name: "Hollis Varga", email: `hollis.varga.visit.${stamp}@moorfield.example` };
const [fx] = reviewProofsForFile(["since last visit"], { afterDrop: () => models().User.destroy({ where: { id: [galeId, hollisId] } }) });
let galeId = 0;
let hollisId = 0;
const P = () => String(fx.proofId);

async function actAsUser(id: number) {
  const u = (await models().User.findByPk(id))!;
  vi.mocked(getServerSession).mockResolvedValue({
    user: { id: String(u.id), name: u.name, email: u.email, role: "member", sessionVersion: u.sessionVersion },
    expires: "2999-01-01",
  });
}
const list = async (): Promise<{ status: number; body: Changes }> => {
  const res = await changes.GET(new Request("http://localhost/x"), params({ proofId: P() }));
  return { status: res.status, body: await res.json() };
};
const markSeen = (through: unknown) => changes.POST(jsonRequest("/x", "POST", { through }), params({ proofId: P() }));

async function revise(key: string) {
  const res = await revisions.POST(
    jsonRequest("/x", "POST", { baseRevisionId: (await latestRevision(fx.steps[key])).id, body: `Step ${key}, revised: $x^2 \\ge 0$ for real $x$.` }),
    params({ proofId: P(), stepId: String(fx.steps[key]) }),
  );
  expect(res.status).toBe(201);
}

beforeAll(async () => {
  const { User, ProofMember, ReviewerScope, Proof } = models();
  galeId = (await User.create({ email: GALE.email, name: GALE.name, passwordHash: null, role: "member" })).id;
  hollisId = (await User.create({ email: HOLLIS.email, name: HOLLIS.name, passwordHash: null, role: "member" })).id;
  await ProofMember.create({ proofId: fx.proofId, userId: galeId, role: "reviewer" });
  await ProofMember.create({ proofId: fx.proofId, userId: hollisId, role: "reviewer" });
  await ReviewerScope.create({ proofId: fx.proofId, userId: hollisId, caseId: fx.cases["1"] });
  await Proof.update({ blindReview: true }, { where: { id: fx.proofId } });
  // Everyone's mark a second ago: everything below is a change for someone.
  await ProofMember.update({ seenThrough: new Date(Date.now() - 1000) }, { where: { proofId: fx.proofId } });

  // The author revises a step of each top-level case; Gale disputes in case 2 and comments on the statement and case 2's condition;
  // Celia vouches for step 1.1; Hollis comments on case 1's condition; a round with Gale's report and a decision.
  await actAs("author");
  await revise("1.1");
  await revise("2.2");
  await actAsUser(galeId);
  expect(
    (
      await reviews.POST(
        jsonRequest("/x", "POST", { revisionId: (await latestRevision(fx.steps["2.2"])).id, verdict: "dispute", comment: "Which $x$?" }),
        params({ proofId: P(), stepId: String(fx.steps["2.2"]) }),
      )
    ).status,
  ).toBe(201);
  expect((await statementComments.POST(jsonRequest("/x", "POST", { body: "All real $x$?" }), params({ proofId: P() }))).status).toBe(201);
  expect(
    (await conditionComments.POST(jsonRequest("/x", "POST", { body: "Is 4 large?" }), params({ proofId: P(), caseId: String(fx.cases["2"]) }))).status,
  ).toBe(201);
  await actAs("reviewer");
  expect(
    (
      await reviews.POST(
        jsonRequest("/x", "POST", { revisionId: (await latestRevision(fx.steps["1.1"])).id, verdict: "vouch" }),
        params({ proofId: P(), stepId: String(fx.steps["1.1"]) }),
      )
    ).status,
  ).toBe(201);
  await actAsUser(hollisId);
  expect(
    (await conditionComments.POST(jsonRequest("/x", "POST", { body: "Fine for $n \\le 3$." }), params({ proofId: P(), caseId: String(fx.cases["1"]) }))).status,
  ).toBe(201);
  await openRound(fx.proofId, fx.ids.editor, new Date(Date.now() + 7 * 86_400_000));
  await saveReportDraft(fx.proofId, 1, galeId, { body: "Report.", recommendation: "minor_revision", editorNote: "" });
  await submitReport(fx.proofId, 1, galeId);
  await recordDecision(
    fx.proofId,
    1,
    { id: fx.ids.editor, name: "Dov Ashgrove" },
    { decision: "minor_revision", letter: "Please revise.", attachReports: true },
  );
});

describe("since your last visit", () => {
  it("shows a referee limited to case 1 only the changes in case 1, never their own", async () => {
    await actAsUser(hollisId);
    const { status, body } = await list();
    expect(status).toBe(200);
    const text = JSON.stringify(body.items);
    // In scope: the author's revision of step 1.1 and Celia's vouch for it (names: Hollis is a referee, the lens numbers the others).
    expect(body.items.map((c) => c.kind).sort()).toEqual(["revision", "vouch"]);
    expect(body.stepIds).toEqual([fx.steps["1.1"]]);
    expect(body.caseIds).toEqual([fx.cases["1"]]);
    for (const c of body.items) expect(c.href).toMatch(new RegExp(`^/proofs/${fx.proofId}/steps/${fx.steps["1.1"]}(#review)?$`));
    // Out of scope, all of it: case 2's revision, dispute and condition thread, the statement, the round, the report, the decision.
    for (const outside of ["case 2", "statement", "report", "decision", "round", "Is 4 large"]) expect(text).not.toContain(outside);
    expect(text).not.toContain("Fine for"); // nor the body of their own comment (no comment text is listed, and their own change is left out)
    expect(body.items.some((c) => c.kind === "comment")).toBe(false);
  });

  it("shows the authors every change by others with a link to its place, and referees only as 'Referee k'", async () => {
    await actAs("author");
    const { body } = await list();
    const text = JSON.stringify(body);
    for (const secret of [GALE.name, GALE.email, HOLLIS.name, HOLLIS.email, "Celia Marwood", "celia.marwood@"]) expect(text).not.toContain(secret);
    expect(text).toContain("Referee");
    const kinds = new Set(body.items.map((c) => c.kind));
    for (const k of ["vouch", "dispute", "comment", "report", "decision"]) expect(kinds.has(k), k).toBe(true);
    // Their own revisions are not news to them.
    expect(body.items.some((c) => c.kind === "revision")).toBe(false);
    const hrefs = body.items.map((c) => c.href);
    expect(hrefs).toContain(`/proofs/${fx.proofId}#statement-comments`);
    expect(hrefs).toContain(`/proofs/${fx.proofId}#case-2-comments`);
    expect(hrefs).toContain(`/proofs/${fx.proofId}#case-1-comments`);
    expect(hrefs).toContain(`/proofs/${fx.proofId}/steps/${fx.steps["2.2"]}#review`);
    expect(hrefs).toContain(`/proofs/${fx.proofId}/rounds`);
    expect(body.stepIds.sort()).toEqual([fx.steps["1.1"], fx.steps["2.2"]].sort());
    // Newest first.
    const times = body.items.map((c) => c.at);
    expect([...times].sort().reverse()).toEqual(times);
  });

  it("shows the editor the names", async () => {
    await actAs("editor");
    const text = JSON.stringify((await list()).body.items);
    expect(text).toContain(GALE.name);
    expect(text).toContain("Ada Quenby saved revision 2");
  });

  it("clears the list on 'mark as seen' up to the newest change shown; a later change is listed again", async () => {
    await actAs("coauthor");
    const first = (await list()).body;
    expect(first.items.length).toBeGreaterThan(3);
    const ok = await markSeen(first.items[0].at);
    expect(ok.status).toBe(200);
    expect((await ok.json()).seenThrough).toBe(first.items[0].at);
    expect((await list()).body.items).toEqual([]);
    // Moving the mark back, or past now, does neither.
    expect((await markSeen("2001-01-01T00:00:00.000Z")).status).toBe(200);
    expect((await list()).body.items).toEqual([]);
    const future = await markSeen("2999-01-01T00:00:00.000Z");
    expect(new Date((await future.json()).seenThrough).getTime()).toBeLessThanOrEqual(Date.now());
    await new Promise((r) => setTimeout(r, 5));
    await actAs("author");
    await revise("2.1");
    await actAs("coauthor");
    const again = (await list()).body;
    expect(again.items.map((c) => c.kind)).toEqual(["revision"]);
    expect(again.stepIds).toEqual([fx.steps["2.1"]]);
  });

  it("401 without a session, 404 for no such proof, 403 for a non-member, 422 for a moment that is not one", async () => {
    await actAs(null);
    expect((await list()).status).toBe(401);
    expect((await markSeen(new Date().toISOString())).status).toBe(401);
    await actAs("outsider");
    expect((await list()).status).toBe(403);
    expect((await markSeen(new Date().toISOString())).status).toBe(403);
    await actAs("author");
    expect((await changes.GET(new Request("http://localhost/x"), params({ proofId: "999999999" }))).status).toBe(404);
    for (const bad of ["yesterday", 12, null, "2026-13-45T00:00:00Z"]) {
      const res = await markSeen(bad);
      expect(res.status, String(bad)).toBe(422);
      expect((await res.json()).error.issues[0].path).toBe("through");
    }
  });
});
