/**
 * Membership: inviting co-authors and editors by e-mail (the referee invitation, generalised), removing
 * members (their vouches and disputes stay, attributed), handing over ownership; each change in the
 * audit trail. Route handlers against a real MariaDB and the local mail fake.
 */
import { describe, expect, it, vi } from "vitest";

vi.mock("next-auth", async (importOriginal) => ({ ...(await importOriginal<typeof import("next-auth")>()), getServerSession: vi.fn() }));

import { getServerSession } from "next-auth";
import { actAs, jsonRequest, params, expectStatusAs } from "./helpers";
import { makeProof, reviewProofsForFile, latestRevision, waitForMail } from "./review-fixtures";
import { models } from "@/models";
import { listProofEvents } from "@/lib/data/audit";
import { refereeLens } from "@/lib/data/blind";
import * as invitations from "@/app/api/proofs/[proofId]/invitations/route";
import * as oneInvitation from "@/app/api/proofs/[proofId]/invitations/[invitationId]/route";
import * as accept from "@/app/api/invitations/[token]/route";
import * as members from "@/app/api/proofs/[proofId]/members/[userId]/route";
import * as owner from "@/app/api/proofs/[proofId]/owner/route";
import * as proofRoute from "@/app/api/proofs/[proofId]/route";

const [fx] = reviewProofsForFile(["membership"]);
const stamp = Date.now();

const invite = (proofId: number, body: unknown) =>
  invitations.POST(jsonRequest(`/api/proofs/${proofId}/invitations`, "POST", body), params({ proofId: String(proofId) }));
const listInvitations = (proofId: number) =>
  invitations.GET(new Request(`http://localhost/api/proofs/${proofId}/invitations`), params({ proofId: String(proofId) }));
const tokenFrom = (text: string) => /\/invitations\/([A-Za-z0-9_-]+)/.exec(text)![1];
const acceptAs = (token: string, body: unknown = {}) => accept.POST(jsonRequest(`/api/invitations/${token}`, "POST", body), params({ token }));
const remove = (proofId: number, userId: number | string) =>
  members.DELETE(
    new Request(`http://localhost/api/proofs/${proofId}/members/${userId}`, { method: "DELETE" }),
    params({ proofId: String(proofId), userId: String(userId) }),
  );
const handOver = (proofId: number, body: unknown) => owner.PUT(jsonRequest(`/api/proofs/${proofId}/owner`, "PUT", body), params({ proofId: String(proofId) }));
const events = async (proofId: number, action: string) => (await listProofEvents(proofId)).filter((e) => e.action === action);

async function actAsUser(id: number) {
  const u = (await models().User.findByPk(id))!;
  vi.mocked(getServerSession).mockResolvedValue({
    user: { id: String(u.id), name: u.name, email: u.email, role: "member", sessionVersion: u.sessionVersion },
    expires: "2999-01-01",
  });
}

async function newPerson(name: string): Promise<number> {
  const u = await models().User.create({
    email: `${name.toLowerCase().replace(/\W+/g, ".")}.${stamp}@moorfield.example`,
    name,
    passwordHash: null,
    role: "member",
  });
  return u.id;
}

describe("inviting co-authors and editors", () => {
  it("refuses anonymous (401), a missing proof (404), an outsider and a referee (403, before the body is read)", async () => {
    const body = { email: `nobody.${stamp}@moorfield.example`, scope: "proof", role: "author" };
    await actAs(null);
    expect((await invite(fx.proofId, body)).status).toBe(401);
    await actAs("author");
    expect((await invite(999_999, body)).status).toBe(404);
    await actAs("outsider");
    expect((await invite(fx.proofId, body)).status).toBe(403);
    await actAs("reviewer");
    const referee = await invite(fx.proofId, { nonsense: true });
    expect(referee.status).toBe(403);
    expect((await referee.json()).error.message).toMatch(/editor or the proof's owner/);
    expect(await models().Invitation.count({ where: { proofId: fx.proofId } })).toBe(0);
  });

  it("answers 422 for an unknown role and for a co-author invited to chosen cases", async () => {
    await actAs("editor");
    const role = await invite(fx.proofId, { email: `x.${stamp}@moorfield.example`, scope: "proof", role: "boss" });
    expect(role.status).toBe(422);
    expect((await role.json()).error.issues[0].path).toBe("role");
    const cased = await invite(fx.proofId, { email: `x.${stamp}@moorfield.example`, scope: "cases", caseIds: [fx.cases["1"]], role: "author" });
    expect(cased.status).toBe(422);
    expect((await cased.json()).error.issues[0].path).toBe("scope");
    expect(await models().Invitation.count({ where: { proofId: fx.proofId } })).toBe(0);
  });

  it("lets a co-author (not the owner) invite co-authors but neither editors nor referees (403)", async () => {
    await actAs("coauthor");
    const editor = await invite(fx.proofId, { email: `ed.${stamp}@moorfield.example`, scope: "proof", role: "editor" });
    expect(editor.status).toBe(403);
    expect((await editor.json()).error.message).toMatch(/invites editors/);
    expect((await invite(fx.proofId, { email: `ref.${stamp}@moorfield.example`, scope: "proof" })).status).toBe(403);
    expect(await models().Invitation.count({ where: { proofId: fx.proofId } })).toBe(0);
  });

  it("sends a co-author invitation whose link makes the person an author; both ends are in the audit trail", async () => {
    await actAs("coauthor");
    const email = `wren.ashby.${stamp}@moorfield.example`;
    const res = await invite(fx.proofId, { email, scope: "proof", role: "author" });
    expect(res.status).toBe(201);
    expect(await res.json()).toMatchObject({ role: "author", mailStatus: "sent" });
    const mail = await waitForMail(email, /invites you to co-author/);
    expect(mail.text).toContain("as a co-author");
    expect(mail.text).not.toMatch(/to review/);

    // The co-author sees the author invitations only; the editor sees them all.
    const seen = await (await listInvitations(fx.proofId)).json();
    expect(seen.invitations.map((i: { role: string }) => i.role)).toEqual(["author"]);

    await actAs(null);
    const joined = await acceptAs(tokenFrom(mail.text), { name: "Wren Ashby", password: "a long enough password" });
    expect(joined.status).toBe(200);
    const { userId } = await joined.json();
    expect((await models().ProofMember.findOne({ where: { proofId: fx.proofId, userId } }))?.role).toBe("author");
    expect(await models().ReviewerScope.count({ where: { proofId: fx.proofId, userId } })).toBe(0);
    expect((await events(fx.proofId, "invitation.sent")).at(0)?.detail).toBe(`${email}; as co-author`);
    expect((await events(fx.proofId, "invitation.accepted")).at(0)?.detail).toBe("joined as co-author");
  });

  it("lets the owner and editors invite editors; the link makes the person an editor", async () => {
    await actAs("author"); // the owner
    const email = `olwen.tarrant.${stamp}@moorfield.example`;
    const res = await invite(fx.proofId, { email, scope: "proof", role: "editor" });
    expect(res.status).toBe(201);
    const mail = await waitForMail(email, /invites you to act as editor for/);
    expect(mail.text).toContain("as an editor");
    await actAs(null);
    const joined = await acceptAs(tokenFrom(mail.text), { name: "Olwen Tarrant", password: "a long enough password" });
    expect(joined.status).toBe(200);
    expect((await models().ProofMember.findOne({ where: { proofId: fx.proofId, userId: (await joined.json()).userId } }))?.role).toBe("editor");
  });

  it("refuses a co-author revoking an editor invitation (403), and lets the editor revoke it", async () => {
    await actAs("editor");
    const email = `late.editor.${stamp}@moorfield.example`;
    const { id } = await (await invite(fx.proofId, { email, scope: "proof", role: "editor" })).json();
    const revoke = () =>
      oneInvitation.DELETE(new Request("http://localhost/x", { method: "DELETE" }), params({ proofId: String(fx.proofId), invitationId: String(id) }));
    await expectStatusAs(revoke, { coauthor: 403, editor: 200 });
    expect((await revoke()).status).toBe(409);
  });

  it("refuses an invitation for a role the person already holds differently (409 on accepting)", async () => {
    await actAs("editor");
    const email = `two.roles.${stamp}@moorfield.example`;
    const tokens: string[] = [];
    for (const role of ["author", "reviewer"]) {
      expect((await invite(fx.proofId, { email, scope: "proof", role })).status).toBe(201);
      tokens.push(tokenFrom((await waitForMail(email, role === "author" ? /co-author/ : /to review/)).text));
    }
    await actAs(null);
    const first = await acceptAs(tokens[0], { name: "Tam Roles", password: "a long enough password" });
    expect(first.status).toBe(200);
    await actAsUser((await first.json()).userId);
    const second = await acceptAs(tokens[1]);
    expect(second.status).toBe(409);
    expect((await second.json()).error.message).toMatch(/already an author/);
  });
});

describe("removing members", () => {
  it("refuses anonymous (401), a missing proof (404), an outsider (403), a non-member (404), a co-author removing others (403)", async () => {
    await actAs(null);
    expect((await remove(fx.proofId, fx.ids.reviewer)).status).toBe(401);
    await actAs("editor");
    expect((await remove(999_999, fx.ids.reviewer)).status).toBe(404);
    expect((await remove(fx.proofId, fx.ids.outsider)).status).toBe(404);
    expect((await remove(fx.proofId, "abc")).status).toBe(404);
    await actAs("outsider");
    expect((await remove(fx.proofId, fx.ids.reviewer)).status).toBe(403);
    await actAs("coauthor");
    const res = await remove(fx.proofId, fx.ids.reviewer);
    expect(res.status).toBe(403);
    expect((await res.json()).error.message).toMatch(/removes members/);
    expect(await models().ProofMember.count({ where: { proofId: fx.proofId, userId: fx.ids.reviewer } })).toBe(1);
  });

  it("refuses removing the owner, even by an editor, with 409", async () => {
    await actAs("editor");
    const res = await remove(fx.proofId, fx.ids.author);
    expect(res.status).toBe(409);
    expect((await res.json()).error).toMatchObject({ reason: "owner" });
  });

  it("keeps a removed referee's vouch and dispute in the record, attributed, and logs the removal", async () => {
    const own = await makeProof("removal");
    const { Review } = models();
    const vouch = await Review.create({
      stepId: own.steps["1.1"],
      revisionId: (await latestRevision(own.steps["1.1"])).id,
      reviewerId: own.ids.reviewer,
      verdict: "vouch",
      disputeState: null,
    });
    const dispute = await Review.create({
      stepId: own.steps["2.1"],
      revisionId: (await latestRevision(own.steps["2.1"])).id,
      reviewerId: own.ids.reviewer,
      verdict: "dispute",
      disputeState: "raised",
    });
    await actAs("editor");
    const res = await remove(own.proofId, own.ids.reviewer);
    expect(res.status).toBe(200);
    expect(await res.json()).toMatchObject({ removed: own.ids.reviewer, role: "reviewer" });
    expect(await models().ProofMember.count({ where: { proofId: own.proofId, userId: own.ids.reviewer } })).toBe(0);
    expect(await Review.count({ where: { id: [vouch.id, dispute.id], reviewerId: own.ids.reviewer } })).toBe(2);
    const [event] = await events(own.proofId, "member.removed");
    expect(event).toMatchObject({ actorName: "Dov Ashgrove", subjectType: "member", subjectId: own.ids.reviewer, detail: "Celia Marwood (reviewer)" });
    // The removed referee no longer reaches the proof.
    await actAs("reviewer");
    expect((await proofRoute.GET(new Request("http://localhost/x"), params({ proofId: String(own.proofId) }))).status).toBe(403);
    // Removing twice: no longer a member.
    await actAs("editor");
    expect((await remove(own.proofId, own.ids.reviewer)).status).toBe(404);
  });

  it("lets a member leave; on a blind proof the owner cannot remove a referee, and numbering survives a removal", async () => {
    const own = await makeProof("blind removal");
    const second = await newPerson("Ines Carrow");
    await models().ProofMember.create({ proofId: own.proofId, userId: second, role: "reviewer" });
    await models().Proof.update({ blindReview: true }, { where: { id: own.proofId } });
    const lensBefore = await refereeLens(own.proofId, { id: own.ids.author, role: "author" });
    expect(lensBefore.name(second, "Ines Carrow")).toBe("Referee 2");

    await actAs("author"); // the owner, an author
    const refused = await remove(own.proofId, own.ids.reviewer);
    expect(refused.status).toBe(403);
    expect((await refused.json()).error.message).toMatch(/refereed blind/);

    await actAs("reviewer"); // leaving
    expect((await remove(own.proofId, own.ids.reviewer)).status).toBe(200);
    expect((await events(own.proofId, "member.left")).length).toBe(1);
    // Referee 2 stays Referee 2, and the one who left is still hidden from the authors.
    const lensAfter = await refereeLens(own.proofId, { id: own.ids.author, role: "author" });
    expect(lensAfter.name(second, "Ines Carrow")).toBe("Referee 2");
    expect(lensAfter.name(own.ids.reviewer, "Celia Marwood")).toBe("Referee 1");
    expect(lensAfter.hides(own.ids.reviewer)).toBe(true);
    // The removal's event shows the authors neither the name nor the id.
    const authorsView = (await listProofEvents(own.proofId, 500, lensAfter)).find((e) => e.action === "member.left")!;
    expect(authorsView.detail).toBeNull();
    expect(authorsView.actorName).toBe("Referee 1");
  });
});

describe("handing over ownership", () => {
  it("refuses anonymous (401), a missing proof (404), an editor who does not own the proof (403)", async () => {
    await actAs(null);
    expect((await handOver(fx.proofId, { userId: fx.ids.coauthor })).status).toBe(401);
    await actAs("author");
    expect((await handOver(999_999, { userId: fx.ids.coauthor })).status).toBe(404);
    await actAs("editor");
    const res = await handOver(fx.proofId, { userId: fx.ids.editor });
    expect(res.status).toBe(403);
    expect((await res.json()).error.message).toMatch(/Only the proof's owner/);
  });

  it("answers 422 for a body without a user id, 404 for a non-member, 409 for a referee or the owner", async () => {
    await actAs("author");
    for (const body of [{}, { userId: "two" }, { userId: -1 }]) expect((await handOver(fx.proofId, body)).status).toBe(422);
    expect((await handOver(fx.proofId, { userId: fx.ids.outsider })).status).toBe(404);
    const referee = await handOver(fx.proofId, { userId: fx.ids.reviewer });
    expect(referee.status).toBe(409);
    expect((await referee.json()).error.message).toMatch(/referee cannot own/);
    expect((await handOver(fx.proofId, { userId: fx.ids.author })).status).toBe(409);
    expect((await models().Proof.findByPk(fx.proofId))!.createdBy).toBe(fx.ids.author);
  });

  it("hands the proof to a co-author: the new owner may invite editors and remove members, the old one no longer hands it over", async () => {
    await actAs("author");
    const res = await handOver(fx.proofId, { userId: fx.ids.coauthor });
    expect(res.status).toBe(200);
    expect((await models().Proof.findByPk(fx.proofId))!.createdBy).toBe(fx.ids.coauthor);
    expect((await events(fx.proofId, "member.owner_changed")).at(0)).toMatchObject({
      actorName: "Ada Quenby",
      detail: "ownership handed to Bram Theroux (co-author)",
    });
    expect((await handOver(fx.proofId, { userId: fx.ids.author })).status).toBe(403);
    // The former owner can now be removed; the new one cannot.
    await actAs("coauthor");
    expect((await invite(fx.proofId, { email: `new.owner.editor.${stamp}@moorfield.example`, scope: "proof", role: "editor" })).status).toBe(201);
    expect((await remove(fx.proofId, fx.ids.coauthor)).status).toBe(409);
    expect((await remove(fx.proofId, fx.ids.author)).status).toBe(200);
    expect((await models().FormerMember.findOne({ where: { proofId: fx.proofId, userId: fx.ids.author } }))?.role).toBe("author");
  });
});
