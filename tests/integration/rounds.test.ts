/**
 * Review rounds, referees' reports, editor-only notes, decisions, the editor's desk, blind review and
 * reminders, through the route handlers against a real MariaDB and the local mail fake.
 */
import { beforeAll, describe, expect, it, vi } from "vitest";

vi.mock("next-auth", async (importOriginal) => ({ ...(await importOriginal<typeof import("next-auth")>()), getServerSession: vi.fn() }));

import { getServerSession } from "next-auth";
import { actAs, demoProofId, jsonRequest, params } from "./helpers";
import { reviewProofsForFile, mailsTo, revise, waitForMail } from "./review-fixtures";
import { models } from "@/models";
import { stepLabel } from "@/lib/proof-tree";
import { sendDueReminders } from "@/lib/data/reminders";
import * as rounds from "@/app/api/proofs/[proofId]/rounds/route";
import * as oneRound from "@/app/api/proofs/[proofId]/rounds/[round]/route";
import * as report from "@/app/api/proofs/[proofId]/rounds/[round]/report/route";
import * as submit from "@/app/api/proofs/[proofId]/rounds/[round]/report/submit/route";
import * as corrections from "@/app/api/proofs/[proofId]/rounds/[round]/report/corrections/route";
import * as note from "@/app/api/proofs/[proofId]/rounds/[round]/reports/[reportId]/note/route";
import * as refereeDue from "@/app/api/proofs/[proofId]/rounds/[round]/referees/[userId]/route";
import * as decision from "@/app/api/proofs/[proofId]/rounds/[round]/decision/route";
import * as policy from "@/app/api/proofs/[proofId]/review-policy/route";
import * as desk from "@/app/api/proofs/[proofId]/desk/route";
import * as proofRoute from "@/app/api/proofs/[proofId]/route";
import * as invitationsRoute from "@/app/api/proofs/[proofId]/invitations/route";
import * as disputesRoute from "@/app/api/proofs/[proofId]/disputes/route";
import * as stepReviews from "@/app/api/proofs/[proofId]/steps/[stepId]/reviews/route";
import * as stepComments from "@/app/api/proofs/[proofId]/steps/[stepId]/comments/route";
import { getAuthorQueue } from "@/lib/data/review-queues";
import { listProofEvents } from "@/lib/data/audit";
import { refereeLens } from "@/lib/data/blind";
import { loadSnapshot } from "@/lib/data/exports";

const [fx] = reviewProofsForFile(["rounds"], { afterDrop: () => models().User.destroy({ where: { id: galeId } }) });
const stamp = Date.now();
/** A second referee, made for this file (the demo has one). */
const GALE = { name: "Gale Fenwick", email: `gale.fenwick.${stamp}@moorfield.example` };
let galeId = 0;
const CELIA = { name: "Celia Marwood", email: "celia.marwood@tarnhollow.example" };
const NOTE_CELIA = `Between us: the bound in case 2 looks borrowed ${stamp}.`;
const NOTE_GALE = `Editor only: I know the authors ${stamp}.`;

async function actAsGale() {
  vi.mocked(getServerSession).mockResolvedValue({
    user: { id: String(galeId), name: GALE.name, email: GALE.email, role: "member", sessionVersion: 1 },
    expires: "2999-01-01",
  });
}

const P = () => String(fx.proofId);
const openRound = (body: unknown, proofId = P()) => rounds.POST(jsonRequest("/x", "POST", body), params({ proofId }));
const listRounds = (proofId = P()) => rounds.GET(jsonRequest("/x", "GET"), params({ proofId }));
const getRound = (round: string, proofId = P()) => oneRound.GET(jsonRequest("/x", "GET"), params({ proofId, round }));
const saveDraft = (round: string, body: unknown) => report.PUT(jsonRequest("/x", "PUT", body), params({ proofId: P(), round }));
const submitDraft = (round: string) => submit.POST(jsonRequest("/x", "POST"), params({ proofId: P(), round }));
const correct = (round: string) => corrections.POST(jsonRequest("/x", "POST"), params({ proofId: P(), round }));
const readNote = (round: string, reportId: number) => note.GET(jsonRequest("/x", "GET"), params({ proofId: P(), round, reportId: String(reportId) }));
const moveDue = (round: string, userId: number, body: unknown) =>
  refereeDue.PATCH(jsonRequest("/x", "PATCH", body), params({ proofId: P(), round, userId: String(userId) }));
const decide = (round: string, body: unknown) => decision.POST(jsonRequest("/x", "POST", body), params({ proofId: P(), round }));
const setPolicy = (body: unknown) => policy.PATCH(jsonRequest("/x", "PATCH", body), params({ proofId: P() }));
const readDesk = (proofId = P()) => desk.GET(jsonRequest("/x", "GET"), params({ proofId }));
const inDays = (d: number) => new Date(Date.now() + d * 86_400_000).toISOString();

beforeAll(async () => {
  const gale = await models().User.create({ email: GALE.email, name: GALE.name, passwordHash: null, role: "member" });
  galeId = gale.id;
  await models().ProofMember.create({ proofId: fx.proofId, userId: galeId, role: "reviewer" });
});

describe("opening a round", () => {
  it("refuses anonymous (401), a non-member, an author and a referee (403), a missing proof (404), bad or past dates (422)", async () => {
    await actAs(null);
    expect((await openRound({ dueAt: inDays(10) })).status).toBe(401);
    for (const who of ["outsider", "author", "reviewer"]) {
      await actAs(who);
      expect((await openRound({ dueAt: inDays(10) })).status, who).toBe(403);
    }
    await actAs("author");
    expect((await (await openRound({ dueAt: inDays(10) })).json()).error.message).toMatch(/Only an editor/);
    await actAs("editor");
    expect((await openRound({ dueAt: inDays(10) }, "999999")).status).toBe(404);
    const bad = await openRound({ dueAt: "next Tuesday" });
    expect(bad.status).toBe(422);
    expect((await bad.json()).error.issues[0].path).toBe("dueAt");
    expect((await openRound({ dueAt: "2001-01-01" })).status).toBe(422);
    expect(await models().ReviewRound.count({ where: { proofId: fx.proofId } })).toBe(0);
  });

  it("opens round 1 for the editor, with every referee due on its date, and refuses a second open round (409)", async () => {
    await actAs("editor");
    const res = await openRound({ dueAt: inDays(14).slice(0, 10) });
    expect(res.status).toBe(201);
    expect((await res.json()).number).toBe(1);
    const again = await openRound({ dueAt: inDays(20) });
    expect(again.status).toBe(409);
    expect((await again.json()).error.round).toEqual({ number: 1, state: "open" });
    const view = (await (await getRound("1")).json()).round;
    expect(view.referees.map((r: { referee: string }) => r.referee).sort()).toEqual([CELIA.name, GALE.name].sort());
    expect(view.referees.every((r: { standing: { progress: string } }) => r.standing.progress === "not started")).toBe(true);
  });

  it("lets every member read the rounds (200) and nobody else (401/403/404)", async () => {
    await actAs(null);
    expect((await listRounds()).status).toBe(401);
    await actAs("outsider");
    expect((await listRounds()).status).toBe(403);
    for (const who of ["author", "coauthor", "reviewer", "editor"]) {
      await actAs(who);
      expect((await listRounds()).status, who).toBe(200);
    }
    expect((await getRound("7")).status).toBe(404);
    expect((await getRound("round-one")).status).toBe(404);
  });
});

describe("reports", () => {
  it("are written by referees only: 401, 403 for authors and editors, 404 for a missing round, 422 for a bad recommendation", async () => {
    await actAs(null);
    expect((await saveDraft("1", { body: "x" })).status).toBe(401);
    for (const who of ["author", "editor", "outsider"]) {
      await actAs(who);
      expect((await saveDraft("1", { body: "x" })).status, who).toBe(403);
      expect((await submitDraft("1")).status, who).toBe(403);
      expect((await correct("1")).status, who).toBe(403);
    }
    await actAs("reviewer");
    expect((await saveDraft("9", { body: "x" })).status).toBe(404);
    const bad = await saveDraft("1", { recommendation: "weak accept" });
    expect(bad.status).toBe(422);
    expect((await bad.json()).error.issues[0].path).toBe("recommendation");
    expect((await saveDraft("1", "not json")).status).toBe(422);
  });

  it("are saved as drafts that nobody else reads, and a draft without a recommendation cannot be submitted (422)", async () => {
    await actAs("reviewer");
    expect((await submitDraft("1")).status).toBe(409); // nothing to submit yet
    const saved = await saveDraft("1", { body: "The argument of case $2$ is sound, but see step 2.1.", editorNote: NOTE_CELIA });
    expect(saved.status).toBe(200);
    expect((await saved.json()).report).toMatchObject({ version: 1, state: "draft", recommendation: null });
    const incomplete = await submitDraft("1");
    expect(incomplete.status).toBe(422);
    expect((await incomplete.json()).error.issues.map((i: { path: string }) => i.path)).toEqual(["recommendation"]);
    await actAs("editor");
    const asEditor = (await (await getRound("1")).json()).round;
    expect(asEditor.reports).toEqual([]);
    expect(asEditor.referees.find((r: { referee: string }) => r.referee === CELIA.name).standing.progress).toBe("drafting");
  });

  it("are submitted once; afterwards read-only (409), and a correction is a new version with the old one kept", async () => {
    await actAs("reviewer");
    expect((await saveDraft("1", { recommendation: "minor_revision" })).status).toBe(200);
    const sub = await submitDraft("1");
    expect(sub.status).toBe(200);
    expect((await sub.json()).report).toMatchObject({ version: 1, state: "submitted", recommendation: "minor_revision" });
    const locked = await saveDraft("1", { body: "changed my mind" });
    expect(locked.status).toBe(409);
    expect((await locked.json()).error).toMatchObject({ reason: "submitted", version: 1 });
    expect((await submitDraft("1")).status).toBe(409);
    const fix = await correct("1");
    expect(fix.status).toBe(201);
    expect((await fix.json()).report).toMatchObject({ version: 2, state: "draft", recommendation: "minor_revision" });
    expect((await correct("1")).status).toBe(409); // the draft exists: edit it
    expect((await saveDraft("1", { body: "The argument of case $2$ is sound; step 2.1 needs the bound stated." })).status).toBe(200);
    expect((await submitDraft("1")).status).toBe(200);
    const mine = (await (await getRound("1")).json()).round.myVersions;
    expect(mine.map((v: { version: number; state: string }) => [v.version, v.state])).toEqual([
      [2, "submitted"],
      [1, "submitted"],
    ]);
    expect(mine[1].body).toBe("The argument of case $2$ is sound, but see step 2.1.");
  });

  it("keep the editor-only note from other referees (403) and authors (403), and out of every response they get", async () => {
    await actAsGale();
    expect((await saveDraft("1", { body: "Fine as it stands.", recommendation: "accept", editorNote: NOTE_GALE })).status).toBe(200);
    expect((await submitDraft("1")).status).toBe(200);
    const celiaReport = await models().RefereeReport.findOne({ where: { refereeId: fx.ids.reviewer, version: 2 } });
    const galeReport = await models().RefereeReport.findOne({ where: { refereeId: galeId } });
    expect((await readNote("1", celiaReport!.id)).status).toBe(403);
    expect((await (await readNote("1", celiaReport!.id)).json()).error.message).toMatch(/editors only/);
    expect((await readNote("1", galeReport!.id)).status).toBe(200);
    for (const who of ["author", "coauthor"]) {
      await actAs(who);
      expect((await readNote("1", celiaReport!.id)).status, who).toBe(403);
    }
    await actAs("outsider");
    expect((await readNote("1", celiaReport!.id)).status).toBe(403);
    await actAs(null);
    expect((await readNote("1", celiaReport!.id)).status).toBe(401);
    await actAs("editor");
    const asEditor = await readNote("1", celiaReport!.id);
    expect(asEditor.status).toBe(200);
    expect((await asEditor.json()).editorNote).toBe(NOTE_CELIA);
    expect((await readNote("1", 99_999_999)).status).toBe(404);
    const editorView = JSON.stringify(await (await listRounds()).json());
    expect(editorView).toContain(NOTE_CELIA);
    // Nobody but the editors and the note's own referee gets it in any response.
    for (const who of ["author", "coauthor", "reviewer"]) {
      await actAs(who);
      const text = JSON.stringify(await (await listRounds()).json()) + JSON.stringify(await (await getRound("1")).json());
      expect(text, who).not.toContain(NOTE_GALE);
      if (who !== "reviewer") expect(text, who).not.toContain(NOTE_CELIA);
    }
    await actAsGale();
    expect(JSON.stringify(await (await listRounds()).json())).not.toContain(NOTE_CELIA);
  });
});

describe("due dates and the editor's desk", () => {
  it("lets only the editor move a referee's due date (401/403/404/422), and the desk shows who is late", async () => {
    await actAs(null);
    expect((await moveDue("1", galeId, { dueAt: inDays(3) })).status).toBe(401);
    await actAs("reviewer");
    expect((await moveDue("1", galeId, { dueAt: inDays(3) })).status).toBe(403);
    await actAs("editor");
    expect((await moveDue("1", fx.ids.author, { dueAt: inDays(3) })).status).toBe(404); // not a referee
    expect((await moveDue("4", galeId, { dueAt: inDays(3) })).status).toBe(404);
    expect((await moveDue("1", galeId, { dueAt: "soon" })).status).toBe(422);
    const late = await models().User.create({ email: `hal.ormsby.${stamp}@moorfield.example`, name: "Hal Ormsby", passwordHash: null, role: "member" });
    try {
      await models().ProofMember.create({ proofId: fx.proofId, userId: late.id, role: "reviewer" });
      expect((await moveDue("1", late.id, { dueAt: inDays(-2) })).status).toBe(200);
      const d = (await (await readDesk()).json()).desk;
      expect(d.late.map((r: { referee: string }) => r.referee)).toEqual(["Hal Ormsby"]);
      expect(d.late[0].standing).toMatchObject({ late: true, daysLate: 2 });
      expect(d.reports.map((r: { referee: string }) => r.referee).sort()).toEqual([CELIA.name, GALE.name].sort());
    } finally {
      await models().ProofMember.destroy({ where: { proofId: fx.proofId, userId: late.id } });
      await models().RoundReferee.destroy({ where: { userId: late.id } });
      await models().AuditEvent.destroy({ where: { proofId: fx.proofId, action: "round.due_date_set" } });
      await late.destroy();
    }
  });

  it("is the editors' alone (401, 403 for authors and referees, 404) and lists open disputes with their age", async () => {
    await actAs(null);
    expect((await readDesk()).status).toBe(401);
    for (const who of ["author", "reviewer", "outsider"]) {
      await actAs(who);
      expect((await readDesk()).status, who).toBe(403);
    }
    await actAs("editor");
    expect((await readDesk("999999")).status).toBe(404);
    const rev = await models().StepRevision.findOne({ where: { stepId: fx.steps["2.1"] } });
    const old = new Date(Date.now() - 5 * 86_400_000 - 60_000);
    const r = await models().Review.create({
      stepId: fx.steps["2.1"],
      revisionId: rev!.id,
      reviewerId: fx.ids.reviewer,
      verdict: "dispute",
      disputeState: "raised",
    });
    await models().Review.update({ updatedAt: old, createdAt: old }, { where: { id: r.id }, silent: true });
    const d = (await (await readDesk()).json()).desk;
    expect(d.disputes).toHaveLength(1);
    expect(d.disputes[0]).toMatchObject({ stepLabel: stepLabel("2", 1), ageDays: 5, reviewerName: CELIA.name });
    await r.destroy();
  });
});

describe("decisions", () => {
  it("are the editor's: 401, 403 for authors and referees, 404, 422 without a letter or with an unknown decision", async () => {
    await actAs(null);
    expect((await decide("1", { decision: "minor_revision", letter: "x" })).status).toBe(401);
    for (const who of ["author", "reviewer"]) {
      await actAs(who);
      expect((await decide("1", { decision: "minor_revision", letter: "x" })).status, who).toBe(403);
    }
    await actAs("editor");
    expect((await decide("3", { decision: "minor_revision", letter: "x" })).status).toBe(404);
    expect((await decide("1", { decision: "minor_revision", letter: "  " })).status).toBe(422);
    expect((await decide("1", { decision: "revise and resubmit", letter: "x" })).status).toBe(422);
    expect((await models().ReviewRound.findOne({ where: { proofId: fx.proofId, number: 1 } }))!.closedAt).toBeNull();
  });

  it("close the round, mail the letter with the reports (never the notes) to the authors, and a late submission gets 409 with the round's state", async () => {
    await actAs("editor");
    const letter = `Dear authors, please state the bound in step 2.1 ($\\rho < 2$). ${stamp}`;
    const res = await decide("1", { decision: "minor_revision", letter, attachReports: true });
    expect(res.status).toBe(201);
    expect((await res.json()).decision).toMatchObject({ decision: "minor_revision", label: "minor revision" });
    const mail = await waitForMail("ada.quenby@tarnhollow.example", /Decision on round 1 .*minor revision/);
    expect(mail.text).toContain(letter);
    expect(mail.text).toContain("step 2.1 needs the bound stated");
    expect(mail.text).toContain(`Report of ${CELIA.name}`);
    expect(mail.text).not.toContain(NOTE_CELIA);
    expect(mail.text).not.toContain(NOTE_GALE);
    await waitForMail("bram.theroux@tarnhollow.example", /Decision on round 1/);
    expect(mailsTo("dov.ashgrove@tarnhollow.example").some((m) => m.text.includes(letter))).toBe(false);
    expect((await decide("1", { decision: "accept", letter: "again" })).status).toBe(409);

    await actAs("reviewer");
    const lateSubmit = await submitDraft("1");
    expect(lateSubmit.status).toBe(409);
    const body = await lateSubmit.json();
    expect(body.error.round).toMatchObject({ number: 1, state: "decided" });
    expect(body.error.message).toMatch(/Round 1 is closed/);
    expect((await saveDraft("1", { body: "late" })).status).toBe(409);
    await actAs("editor");
    expect((await moveDue("1", galeId, { dueAt: inDays(3) })).status).toBe(409);
  });

  it("let the authors read the attached reports after the decision, and round 2 starts from the latest revisions", async () => {
    await actAs("author");
    const r1 = (await (await getRound("1")).json()).round;
    expect(r1.state).toBe("decided");
    expect(r1.decision.letter).toContain("please state the bound");
    expect(r1.reports).toHaveLength(2);
    expect(r1.reports.every((r: { editorNote?: string }) => r.editorNote === undefined)).toBe(true);
    await revise(fx.steps["2.1"], fx.ids.author, "Step 2.1: the bound $\\rho(G) < 2$ holds since $G \\subseteq E_8$.");
    await actAs("editor");
    const opened = await openRound({ dueAt: inDays(10) });
    expect(opened.status).toBe(201);
    expect((await opened.json()).number).toBe(2);
    const r2 = (await (await getRound("2")).json()).round;
    expect(r2.changedSincePreviousDecision).toEqual([{ stepId: fx.steps["2.1"], label: stepLabel("2", 1), revisions: 1 }]);
    expect(r2.reports).toEqual([]);
  });
});

describe("blind review", () => {
  it("is the editor's setting (401, 403 even for the proof's owner, 422)", async () => {
    await actAs(null);
    expect((await setPolicy({ blind: true })).status).toBe(401);
    for (const who of ["author", "reviewer"]) {
      await actAs(who);
      expect((await setPolicy({ blind: true })).status, who).toBe(403);
    }
    await actAs("editor");
    expect((await setPolicy({})).status).toBe(422);
    expect((await setPolicy({ remindBeforeDays: -1 })).status).toBe(422);
    expect((await setPolicy({ blind: "yes" })).status).toBe(422);
  });

  it("switched on after the reports were written, hides referee names and addresses from authors at once; editors keep them", async () => {
    await actAs("author");
    const before = JSON.stringify(await (await listRounds()).json());
    expect(before).toContain(CELIA.name);
    await actAs("editor");
    const res = await setPolicy({ blind: true });
    expect(res.status).toBe(200);
    expect(await res.json()).toMatchObject({ blind: true });
    for (const who of ["author", "coauthor"]) {
      await actAs(who);
      const text = JSON.stringify(await (await listRounds()).json()) + JSON.stringify(await (await getRound("1")).json());
      for (const secret of [CELIA.name, CELIA.email, GALE.name, GALE.email, `"refereeId":${galeId}`, `"refereeId":${fx.ids.reviewer}`])
        expect(text, `${who} sees ${secret}`).not.toContain(secret);
      expect(text).toContain("Referee 1");
      expect(text).toContain("Referee 2");
    }
    await actAs("editor");
    const editorText = JSON.stringify(await (await listRounds()).json());
    expect(editorText).toContain(CELIA.name);
    expect(editorText).toContain(GALE.name);
  });

  it("keeps referee names and addresses out of every author-visible API response, queue, timeline and export; editors still see them", async () => {
    // Gale disputes step 2.2 with a comment; Celia vouches for step 1.1: both leave their names in many places.
    const { Review, Comment, StepRevision, DisputeTransition, AuditEvent } = models();
    const rev22 = (await StepRevision.findOne({ where: { stepId: fx.steps["2.2"] } }))!;
    const rev11 = (await StepRevision.findOne({ where: { stepId: fx.steps["1.1"] } }))!;
    const d = await Review.create({ stepId: fx.steps["2.2"], revisionId: rev22.id, reviewerId: galeId, verdict: "dispute", disputeState: "raised" });
    await DisputeTransition.create({ reviewId: d.id, actorId: galeId, fromState: null, toState: "raised" });
    await Comment.create({
      proofId: fx.proofId,
      caseId: fx.cases["2"],
      stepId: fx.steps["2.2"],
      reviewId: d.id,
      parentId: null,
      revisionId: rev22.id,
      authorId: galeId,
      body: "Which bound is meant here?",
    });
    await Review.create({ stepId: fx.steps["1.1"], revisionId: rev11.id, reviewerId: fx.ids.reviewer, verdict: "vouch", disputeState: null });
    await AuditEvent.create({
      proofId: fx.proofId,
      actorId: galeId,
      action: "review.disputed",
      subjectType: "step",
      subjectId: fx.steps["2.2"],
      detail: "dispute opened",
    });

    const secrets = [CELIA.name, CELIA.email, GALE.name, GALE.email];
    const surfaces = async (who: string) => {
      const viewer = (await actAs(who))!;
      const role = who === "editor" ? "editor" : "author";
      const step = (stepId: number) => params({ proofId: P(), stepId: String(stepId) });
      return [
        JSON.stringify(await (await proofRoute.GET(jsonRequest("/x", "GET"), params({ proofId: P() }))).json()),
        JSON.stringify(await (await disputesRoute.GET(jsonRequest("/x", "GET"), params({ proofId: P() }))).json()),
        JSON.stringify(await (await stepReviews.GET(jsonRequest("/x", "GET"), step(fx.steps["2.2"]))).json()),
        JSON.stringify(await (await stepReviews.GET(jsonRequest("/x", "GET"), step(fx.steps["1.1"]))).json()),
        JSON.stringify(await (await stepComments.GET(jsonRequest("/x", "GET"), step(fx.steps["2.2"]))).json()),
        JSON.stringify(await (await listRounds()).json()),
        JSON.stringify((await getAuthorQueue(viewer)).filter((r) => r.proofId === fx.proofId)), // the demo proof is not blind
        JSON.stringify(await listProofEvents(fx.proofId, 500, await refereeLens(fx.proofId, { id: viewer, role }))),
      ].join("\n");
    };
    for (const who of ["author", "coauthor"]) {
      const text = await surfaces(who);
      for (const secret of secrets) expect(text, `${who} sees ${secret}`).not.toContain(secret);
      expect(text).toMatch(/Referee [12]/);
    }
    // The owner (an author) no longer manages referees on a blind proof: that would show their names and addresses.
    await actAs("author");
    // The owner still lists (and sends) co-author and editor invitations, but no referee invitation is among them.
    const ownerInvites = await invitationsRoute.GET(jsonRequest("/x", "GET"), params({ proofId: P() }));
    expect(ownerInvites.status).toBe(200);
    expect((await ownerInvites.json()).invitations.filter((i: { role: string }) => i.role === "reviewer")).toEqual([]);
    const ownerInvitesReferee = await invitationsRoute.POST(
      jsonRequest("/x", "POST", { email: "someone@moorfield.example", scope: "proof" }),
      params({ proofId: P() }),
    );
    expect(ownerInvitesReferee.status).toBe(403);
    expect((await ownerInvitesReferee.json()).error.message).toMatch(/refereed blind/);
    const snapshot = JSON.stringify(await loadSnapshot(fx.proofId));
    for (const secret of secrets) expect(snapshot, `the export names ${secret}`).not.toContain(secret);
    const editorText = await surfaces("editor");
    expect(editorText).toContain(GALE.name);
    expect(editorText).toContain(CELIA.name);
    await Review.destroy({ where: { id: d.id } });
    await Review.destroy({ where: { stepId: fx.steps["1.1"], reviewerId: fx.ids.reviewer } });
  });
});

describe("reminders", () => {
  it("go out once per referee, round and kind, even when a run crashes half-way", async () => {
    await actAs("editor");
    await setPolicy({ remindBeforeDays: 3, remindAfterDays: 1 });
    // Round 2: Celia is due in two days ("before" is due), Gale was due two days ago ("after" is due).
    expect((await moveDue("2", fx.ids.reviewer, { dueAt: inDays(2) })).status).toBe(200);
    expect((await moveDue("2", galeId, { dueAt: inDays(-2) })).status).toBe(200);
    const round2 = (await models().ReviewRound.findOne({ where: { proofId: fx.proofId, number: 2 } }))!;
    const rows = () => models().RoundReminder.findAll({ where: { roundId: round2.id } });
    const title = (await models().Proof.findByPk(fx.proofId))!.title;
    const reminderMails = (email: string, word: string) => mailsTo(email).filter((m) => m.subject.includes(`${word}: your report for round 2 of “${title}`));

    await expect(sendDueReminders(new Date(), { crashAfter: 1 })).rejects.toThrow(/test crash/);
    expect(await rows()).toHaveLength(1); // the first reminder committed with its queued mail, the second not yet
    await sendDueReminders(new Date()); // the restart
    await sendDueReminders(new Date()); // and another run: nothing new
    expect((await rows()).map((r) => [r.userId, r.kind]).sort()).toEqual(
      [
        [fx.ids.reviewer, "before"],
        [galeId, "after"],
      ].sort(),
    );
    const overdue = await waitForMail(GALE.email, /Overdue: your report for round 2/);
    expect(overdue.text).toMatch(/was due on \d{4}-\d{2}-\d{2}, 2 days ago/);
    await waitForMail(CELIA.email, /Reminder: your report for round 2/);
    await new Promise((r) => setTimeout(r, 500));
    expect(reminderMails(GALE.email, "Overdue")).toHaveLength(1);
    expect(reminderMails(CELIA.email, "Reminder")).toHaveLength(1);

    // A submitted report stops the reminders: five days on, Celia gets no "after" reminder.
    await actAs("reviewer");
    await saveDraft("2", { body: "All fixed.", recommendation: "accept" });
    expect((await submitDraft("2")).status).toBe(200);
    await sendDueReminders(new Date(Date.now() + 5 * 86_400_000));
    expect(await rows()).toHaveLength(2);
  });
});

describe("the demo", () => {
  it("shows the Tarn Hollow proof in round 2, with round 1's report and decision readable by the authors and the note not", async () => {
    const proofId = String(await demoProofId());
    await actAs("author");
    const seen = (await (await listRounds(proofId)).json()).rounds;
    expect(seen.map((r: { number: number; state: string }) => [r.number, r.state])).toEqual([
      [1, "decided"],
      [2, "open"],
    ]);
    expect(seen[0].decision).toMatchObject({ decision: "minor_revision", editor: "Dov Ashgrove" });
    expect(seen[0].reports).toHaveLength(1);
    expect(seen[0].reports[0]).toMatchObject({ referee: CELIA.name, recommendation: "minor_revision" });
    expect(JSON.stringify(seen)).not.toMatch(/Nothing confidential/);
    expect(seen[1].reports).toEqual([]); // Celia's round-2 report is a draft
    await actAs("editor");
    const d = (await (await readDesk(proofId)).json()).desk;
    expect(d.current).toMatchObject({ number: 2, state: "open" });
    expect(d.decisions).toHaveLength(1);
    expect(d.disputes.length).toBeGreaterThanOrEqual(1);
  });
});
