import { describe, expect, it, vi } from "vitest";

vi.mock("next-auth", async (importOriginal) => ({ ...(await importOriginal<typeof import("next-auth")>()), getServerSession: vi.fn() }));

import { actAs, jsonRequest, params, userIdOf, expectStatusAs } from "./helpers";
import { reviewProofsForFile, latestRevision, revise, waitForMail } from "./review-fixtures";
import { models } from "@/models";
import { getReviewerQueue, getAuthorQueue, getReadiness, getReviewerProgress } from "@/lib/data/review-queues";
import * as reviews from "@/app/api/proofs/[proofId]/steps/[stepId]/reviews/route";
import * as comments from "@/app/api/proofs/[proofId]/steps/[stepId]/comments/route";
import * as disputes from "@/app/api/proofs/[proofId]/disputes/route";
import * as dispute from "@/app/api/proofs/[proofId]/disputes/[reviewId]/route";
import * as settings from "@/app/api/proofs/[proofId]/settings/route";

const [fx, other] = reviewProofsForFile(["verdicts", "verdicts-other"]);

const p = (proofId: number, stepId?: number) => params({ proofId: String(proofId), stepId: String(stepId ?? "") });
const verdict = (proofId: number, stepId: number, body: unknown) => reviews.POST(jsonRequest("/x", "POST", body), p(proofId, stepId));
const panel = async (proofId: number, stepId: number) => (await (await reviews.GET(new Request("http://localhost/x"), p(proofId, stepId))).json()).review;
const move = (proofId: number, reviewId: number, body: unknown) =>
  dispute.POST(jsonRequest("/x", "POST", body), params({ proofId: String(proofId), reviewId: String(reviewId) }));
const comment = (proofId: number, stepId: number, body: unknown) => comments.POST(jsonRequest("/x", "POST", body), p(proofId, stepId));
const reviewCount = () => models().Review.count();

describe("verdicts: POST /api/proofs/[proofId]/steps/[stepId]/reviews", () => {
  it("lets the invited reviewer approve the latest revision (201), and again is a no-op (200)", async () => {
    const rev = await latestRevision(fx.steps["1.1"]);
    await actAs("reviewer");
    const res = await verdict(fx.proofId, fx.steps["1.1"], { revisionId: rev.id, verdict: "vouch" });
    expect(res.status).toBe(201);
    const again = await verdict(fx.proofId, fx.steps["1.1"], { revisionId: rev.id, verdict: "vouch" });
    expect(again.status).toBe(200);
    expect((await again.json()).created).toBe(false);
    const view = await panel(fx.proofId, fx.steps["1.1"]);
    expect(view.status).toMatchObject({ vouches: 1, vouched: true, settled: true });
    expect(view.vouches[0]).toMatchObject({ reviewerName: "Celia Marwood", revisionNumber: 1, stale: false });
  });

  it("refuses anonymous (401), non-members (403), editors and authors (403: only invited reviewers), and a missing step (404)", async () => {
    const rev = await latestRevision(fx.steps["2.2"]);
    const body = { revisionId: rev.id, verdict: "vouch" };
    const before = await reviewCount();
    await actAs(null);
    expect((await verdict(fx.proofId, fx.steps["2.2"], body)).status).toBe(401);
    await actAs("outsider");
    expect((await verdict(fx.proofId, fx.steps["2.2"], body)).status).toBe(403);
    await actAs("editor");
    const editor = await verdict(fx.proofId, fx.steps["2.2"], body);
    expect(editor.status).toBe(403);
    expect((await editor.json()).error.message).toMatch(/Only invited reviewers/);
    await actAs("author");
    expect((await verdict(fx.proofId, fx.steps["2.2"], body)).status).toBe(403);
    await actAs("reviewer");
    expect((await verdict(fx.proofId, 999_999, body)).status).toBe(404);
    expect(await reviewCount()).toBe(before);
  });

  it("never lets a reviewer approve a step they wrote a revision of (403)", async () => {
    const { ids } = fx;
    const rev = await revise(fx.steps["2.2"], ids.reviewer, "The reviewer's own wording.");
    await actAs("reviewer");
    const res = await verdict(fx.proofId, fx.steps["2.2"], { revisionId: rev.id, verdict: "vouch" });
    expect(res.status).toBe(403);
    expect((await res.json()).error.message).toMatch(/own step/);
    expect((await panel(fx.proofId, fx.steps["2.2"])).can.verdict).toBe(false);
  });

  it("answers 422 for a dispute without a comment, a bad verdict, and a revision of another step; 404 for a step of another proof", async () => {
    const rev = await latestRevision(fx.steps["2.1"]);
    const before = await reviewCount();
    await actAs("reviewer");
    const noComment = await verdict(fx.proofId, fx.steps["2.1"], { revisionId: rev.id, verdict: "dispute", comment: "   " });
    expect(noComment.status).toBe(422);
    expect((await noComment.json()).error.issues).toEqual([{ path: "comment", message: "Say what is wrong: a dispute needs a comment." }]);
    expect((await verdict(fx.proofId, fx.steps["2.1"], { revisionId: rev.id, verdict: "maybe" })).status).toBe(422);
    expect((await verdict(fx.proofId, fx.steps["2.1"], "not json")).status).toBe(422);
    const otherRev = await latestRevision(fx.steps["1.1"]);
    expect((await verdict(fx.proofId, fx.steps["2.1"], { revisionId: otherRev.id, verdict: "vouch" })).status).toBe(422);
    expect((await verdict(fx.proofId, other.steps["1.1"], { revisionId: (await latestRevision(other.steps["1.1"])).id, verdict: "vouch" })).status).toBe(404);
    expect(await reviewCount()).toBe(before);
  });

  it("marks an approval stale after an edit, refuses a verdict on the stale revision (409), and queues the step for re-review", async () => {
    const stepId = fx.steps["1.1"];
    const old = await latestRevision(stepId);
    await revise(stepId, fx.ids.author);
    await actAs("reviewer");
    const view = await panel(fx.proofId, stepId);
    expect(view.latestRevision.number).toBe(2);
    expect(view.vouches[0]).toMatchObject({ revisionNumber: 1, stale: true });
    expect(view.status).toMatchObject({ vouches: 0, supersededVouches: 1, vouched: false });

    const before = await reviewCount();
    const stale = await verdict(fx.proofId, stepId, { revisionId: old.id, verdict: "vouch" });
    expect(stale.status).toBe(409);
    const body = await stale.json();
    expect(body.error.message).toMatch(/Revision 1 is no longer the latest: revision 2 is, and since revision 1 the text changed/);
    expect(body.error.changed).toEqual({ text: true, claimsAdded: [], claimsWithdrawn: [], claimsRedecided: [] });
    expect(body.error.latestRevisionNumber).toBe(2);
    expect(await reviewCount()).toBe(before);

    const queue = await getReviewerQueue(fx.ids.reviewer);
    expect(queue.steps.find((r) => r.stepId === stepId)).toMatchObject({ reason: "vouch superseded", revision: 2, stepLabel: "1(a)" });
    expect((await verdict(fx.proofId, stepId, { revisionId: (await latestRevision(stepId)).id, verdict: "vouch" })).status).toBe(201);
    expect((await getReviewerQueue(fx.ids.reviewer)).steps.find((r) => r.stepId === stepId)).toBeUndefined();
  });
});

describe("a dispute from open to closed", () => {
  let disputeId: number;
  const stepKey = "2.1";

  it("opens with a comment, notifies the authors in the app and by e-mail", async () => {
    const rev = await latestRevision(fx.steps[stepKey]);
    await actAs("reviewer");
    const res = await verdict(fx.proofId, fx.steps[stepKey], { revisionId: rev.id, verdict: "dispute", comment: "Why is $x^2 \\ge 0$ enough here?" });
    expect(res.status).toBe(201);
    disputeId = (await res.json()).reviewId;
    const view = await panel(fx.proofId, fx.steps[stepKey]);
    expect(view.disputes[0]).toMatchObject({ id: disputeId, state: "raised", reviewerName: "Celia Marwood" });
    expect(view.disputes[0].thread[0].body).toContain("x^2");
    expect(view.status.openDisputes).toBe(1);
    expect(view.can).toMatchObject({ verdict: true, ownDisputeOpen: true });
    const { Notification } = models();
    for (const id of [fx.ids.author, fx.ids.coauthor])
      expect(await Notification.count({ where: { userId: id, kind: "dispute_raised", stepId: fx.steps[stepKey] } })).toBe(1);
    expect(await Notification.count({ where: { userId: fx.ids.reviewer, kind: "dispute_raised", stepId: fx.steps[stepKey] } })).toBe(0);
    const mail = await waitForMail("ada.quenby@tarnhollow.example", /A new dispute on your step/);
    expect(mail.text).toContain(`/queue/${fx.proofId}/${fx.steps[stepKey]}`);
    expect((await getAuthorQueue(fx.ids.author)).find((d) => d.disputeId === disputeId)).toMatchObject({ state: "raised", stepLabel: "2(a)" });
  });

  it("refuses a second dispute and an approval while it is unresolved (409)", async () => {
    const rev = await latestRevision(fx.steps[stepKey]);
    await actAs("reviewer");
    expect((await verdict(fx.proofId, fx.steps[stepKey], { revisionId: rev.id, verdict: "dispute", comment: "Again" })).status).toBe(409);
    const approve = await verdict(fx.proofId, fx.steps[stepKey], { revisionId: rev.id, verdict: "vouch" });
    expect(approve.status).toBe(409);
    expect((await approve.json()).error.message).toMatch(/withdraw it before vouching/);
  });

  it("only authors mark it answered; the reviewer cannot (403), nor can a non-member (403) or anonymous (401)", async () => {
    const answered = () => move(fx.proofId, disputeId, { to: "answered" });
    await expectStatusAs(answered, { nobody: 401, outsider: 403 });
    await actAs("reviewer");
    const res = await answered();
    expect(res.status).toBe(403);
    expect((await res.json()).error.message).toMatch(/Only the proof's authors/);
    await expectStatusAs(answered, { editor: 403 });
  });

  it("answers 422 for a bad target and 404 for a dispute of another proof or an approval", async () => {
    await actAs("author");
    expect((await move(fx.proofId, disputeId, { to: "settled" })).status).toBe(422);
    expect((await move(other.proofId, disputeId, { to: "answered" })).status).toBe(404);
    const approval = await models().Review.findOne({ where: { verdict: "vouch" } });
    expect((await move(fx.proofId, approval!.id, { to: "withdrawn" })).status).toBe(404);
  });

  it("the author replies in the thread, revises the step and marks it answered; the reviewer is notified", async () => {
    await actAs("author");
    const reply = await comment(fx.proofId, fx.steps[stepKey], { body: "Because $x$ is real; see the new revision.", reviewId: disputeId });
    expect(reply.status).toBe(201);
    await revise(fx.steps[stepKey], fx.ids.author, "For real $x$, $x^2 \\ge 0$.");
    const res = await move(fx.proofId, disputeId, { to: "answered", comment: "Revised in revision 2." });
    expect(res.status).toBe(200);
    expect((await res.json()).state).toBe("answered");
    expect(await models().Notification.count({ where: { userId: fx.ids.reviewer, kind: "dispute_answered" } })).toBeGreaterThanOrEqual(1);
    expect((await getReviewerQueue(fx.ids.reviewer)).answered.find((d) => d.disputeId === disputeId)).toBeTruthy();
    const again = await move(fx.proofId, disputeId, { to: "answered" });
    expect(again.status).toBe(409);
  });

  it("the author cannot withdraw it (403); the referee upholds it; an editor withdraws it; withdrawn cannot be answered (409)", async () => {
    // Each move as who makes it, with the status it gets.
    for (const [who, body, status] of [
      ["author", { to: "withdrawn" }, 403],
      ["reviewer", { to: "upheld", comment: "Not yet: what about complex $x$?" }, 200],
      ["author", { to: "answered" }, 200],
      ["editor", { to: "withdrawn" }, 200],
    ] as const)
      await expectStatusAs(() => move(fx.proofId, disputeId, body), { [who]: status });
    await actAs("author");
    const res = await move(fx.proofId, disputeId, { to: "answered" });
    expect(res.status).toBe(409);
    expect((await res.json()).error.message).toMatch(/This dispute is withdrawn; it cannot be answered from there/);
  });

  it("records every transition with who and when, and an append-only audit trail", async () => {
    const transitions = await models().DisputeTransition.findAll({ where: { reviewId: disputeId }, order: [["id", "ASC"]] });
    expect(transitions.map((t) => `${t.fromState ?? "∅"}→${t.toState}`)).toEqual([
      "∅→raised",
      "raised→answered",
      "answered→upheld",
      "upheld→answered",
      "answered→withdrawn",
    ]);
    expect(transitions.map((t) => t.actorId)).toEqual([fx.ids.reviewer, fx.ids.author, fx.ids.reviewer, fx.ids.author, fx.ids.editor]);
    expect(transitions.every((t) => t.createdAt instanceof Date)).toBe(true);
    const actions = (await models().AuditEvent.findAll({ where: { proofId: fx.proofId }, order: [["id", "ASC"]] })).map((e) => e.action);
    expect(actions).toEqual(
      expect.arrayContaining(["review.vouched", "review.disputed", "dispute.answered", "dispute.upheld", "dispute.withdrawn", "comment.added"]),
    );
    await actAs("reviewer");
    const view = await panel(fx.proofId, fx.steps[stepKey]);
    expect(view.disputes[0].transitions).toHaveLength(5);
    expect(view.disputes[0].thread.length).toBe(4); // the dispute, the reply, the answer note, the reopen note
  });

  it("lists the proof's disputes for members", async () => {
    await actAs("coauthor");
    const res = await disputes.GET(new Request("http://localhost/x"), p(fx.proofId));
    expect(res.status).toBe(200);
    expect((await res.json()).disputes.find((d: { disputeId: number }) => d.disputeId === disputeId).state).toBe("withdrawn");
    await actAs("outsider");
    expect((await disputes.GET(new Request("http://localhost/x"), p(fx.proofId))).status).toBe(403);
  });
});

describe("comments: POST /api/proofs/[proofId]/steps/[stepId]/comments", () => {
  it("adds a comment and a reply; refuses a reply to another step's comment (422) and a step of another proof (404)", async () => {
    await actAs("coauthor");
    const first = await comment(fx.proofId, fx.steps["2.2"], { body: "Is $\\rho(T) < 2$ used here?" });
    expect(first.status).toBe(201);
    const { id } = await first.json();
    await actAs("reviewer");
    expect((await comment(fx.proofId, fx.steps["2.2"], { body: "Yes, see case 1.", parentId: id })).status).toBe(201);
    const before = await models().Comment.count();
    const wrongParent = await comment(fx.proofId, fx.steps["1.1"], { body: "Reply elsewhere", parentId: id });
    expect(wrongParent.status).toBe(422);
    expect((await wrongParent.json()).error.issues[0].path).toBe("parentId");
    expect((await comment(fx.proofId, other.steps["1.1"], { body: "Wrong proof" })).status).toBe(404);
    expect((await comment(fx.proofId, fx.steps["2.2"], { body: "  " })).status).toBe(422);
    await actAs(null);
    expect((await comment(fx.proofId, fx.steps["2.2"], { body: "x" })).status).toBe(401);
    await actAs("outsider");
    expect((await comment(fx.proofId, fx.steps["2.2"], { body: "x" })).status).toBe(403);
    expect(await models().Comment.count()).toBe(before);

    await actAs("author");
    const list = await (await comments.GET(new Request("http://localhost/x"), p(fx.proofId, fx.steps["2.2"]))).json();
    expect(list.comments[0].replies[0]).toMatchObject({ authorName: "Celia Marwood", body: "Yes, see case 1." });
  });
});

describe("readiness roll-up", () => {
  it("settles a case when its steps are vouched at the latest revision as required, with no open dispute", async () => {
    const r = await getReadiness(fx.proofId);
    const byNumber = Object.fromEntries(r.cases.map((c) => [c.number, c]));
    expect(byNumber["1"].state).toBe("settled");
    expect(byNumber["2"].state).toBe("under review");
    expect(r.state).toBe("in progress");
  });

  it("lets an editor require more vouches (422 outside 1–9, 403 for others), which unsettles the case", async () => {
    const patch = (body: unknown) => settings.PATCH(jsonRequest("/x", "PATCH", body), p(fx.proofId));
    await actAs("coauthor");
    expect((await patch({ requiredApprovals: 2 })).status).toBe(403);
    await actAs(null);
    expect((await patch({ requiredApprovals: 2 })).status).toBe(401);
    await actAs("editor");
    expect((await patch({ requiredApprovals: 0 })).status).toBe(422);
    expect((await patch({ requiredApprovals: 10 })).status).toBe(422);
    expect((await patch({ requiredApprovals: 2 })).status).toBe(200);
    const res = await settings.GET(new Request("http://localhost/x"), p(fx.proofId));
    const body = await res.json();
    expect(body.requiredApprovals).toBe(2);
    expect(body.readiness.cases.find((c: { number: string }) => c.number === "1").state).toBe("under review");
    expect((await patch({ requiredApprovals: 1 })).status).toBe(200);
  });

  it("makes the proof ready to certify once every case is settled, and a refuted claim blocks it", async () => {
    await actAs("reviewer");
    for (const key of ["2.1", "2.1.1"]) {
      const stepId = fx.steps[key];
      const res = await verdict(fx.proofId, stepId, { revisionId: (await latestRevision(stepId)).id, verdict: "vouch" });
      expect(res.status).toBe(201);
    }
    // Step 2.2 has a revision by Celia, so her approval can never count: a second reviewer is needed.
    expect(await getReadiness(fx.proofId)).toMatchObject({ state: "in progress" });
    await models().ProofMember.create({ proofId: fx.proofId, userId: await userIdOf("admin"), role: "reviewer" });
    await actAs("admin");
    expect((await verdict(fx.proofId, fx.steps["2.2"], { revisionId: (await latestRevision(fx.steps["2.2"])).id, verdict: "vouch" })).status).toBe(201);
    expect((await getReadiness(fx.proofId)).state).toBe("ready to certify");
    const claim = await models().Claim.create({
      stepId: fx.steps["1.1"],
      kind: "spectral-radius-bound",
      input: "{}",
      status: "refuted",
      createdBy: fx.ids.author,
    } as never);
    const r = await getReadiness(fx.proofId);
    expect(r.cases.find((c) => c.number === "1")!.state).toBe("claim failing");
    expect(r.state).toBe("in progress");
    await claim.destroy();
  });

  it("gives editors per-reviewer progress", async () => {
    const rows = await getReviewerProgress([fx.proofId]);
    expect(rows.find((r) => r.reviewerId === fx.ids.reviewer)).toMatchObject({ scope: "whole proof", inScope: 4, vouched: 3, unresolvedDisputes: 0 });
    expect(rows.find((r) => r.reviewerName === "Esme Pollard")).toMatchObject({ inScope: 4, vouched: 1 });
  });
});
