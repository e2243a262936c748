import { describe, expect, it, vi } from "vitest";

vi.mock("next-auth", async (importOriginal) => ({ ...(await importOriginal<typeof import("next-auth")>()), getServerSession: vi.fn() }));

import { actAs, jsonRequest, params, expectStatusAs } from "./helpers";
import { reviewProofsForFile, waitForMail } from "./review-fixtures";
import { models } from "@/models";
import { authenticate } from "@/lib/data/users";
import { hashToken } from "@/lib/data/invitations";
import * as invitations from "@/app/api/proofs/[proofId]/invitations/route";
import * as invitationRetry from "@/app/api/proofs/[proofId]/invitations/[invitationId]/route";
import * as accept from "@/app/api/invitations/[token]/route";
import * as scopes from "@/app/api/proofs/[proofId]/settings/scopes/[userId]/route";
import * as reviews from "@/app/api/proofs/[proofId]/steps/[stepId]/reviews/route";
import { visibleCaseIds } from "@/lib/access";

const [fx, other] = reviewProofsForFile(["invitations", "other"]);

const invite = (proofId: number, body: unknown) =>
  invitations.POST(jsonRequest(`/api/proofs/${proofId}/invitations`, "POST", body), params({ proofId: String(proofId) }));
const tokenFrom = (text: string) => /\/invitations\/([A-Za-z0-9_-]+)/.exec(text)![1];
const acceptAs = (token: string, body: unknown = {}) => accept.POST(jsonRequest(`/api/invitations/${token}`, "POST", body), params({ token }));

describe("POST /api/proofs/[proofId]/invitations", () => {
  it("refuses anonymous (401), a non-member (403), a member without the editor role (403), a missing proof (404)", async () => {
    const body = { email: "someone@elsewhere.example", scope: "proof" };
    await actAs(null);
    expect((await invite(fx.proofId, body)).status).toBe(401);
    await actAs("outsider");
    expect((await invite(fx.proofId, body)).status).toBe(403);
    await actAs("reviewer");
    const wrongRole = await invite(fx.proofId, body);
    expect(wrongRole.status).toBe(403);
    expect((await wrongRole.json()).error.message).toMatch(/editor or the proof's owner/);
    await actAs("editor");
    expect((await invite(999_999, body)).status).toBe(404);
    expect(await models().Invitation.count({ where: { proofId: fx.proofId } })).toBe(0);
  });

  it("answers 422 for a bad address, for chosen cases without a case, and for a case of another proof", async () => {
    await actAs("editor");
    const bad = await invite(fx.proofId, { email: "not-an-address", scope: "proof" });
    expect(bad.status).toBe(422);
    expect((await bad.json()).error.issues[0].path).toBe("email");
    expect((await invite(fx.proofId, { email: "a@b.example", scope: "cases", caseIds: [] })).status).toBe(422);
    const foreign = await invite(fx.proofId, { email: "a@b.example", scope: "cases", caseIds: [other.cases["1"]] });
    expect(foreign.status).toBe(422);
    expect((await foreign.json()).error.issues[0].path).toBe("caseIds");
    expect(await models().Invitation.count({ where: { proofId: fx.proofId } })).toBe(0);
  });

  it("refuses to invite an existing member (409)", async () => {
    await actAs("editor");
    const res = await invite(fx.proofId, { email: "ada.quenby@tarnhollow.example", scope: "proof" });
    expect(res.status).toBe(409);
    expect((await res.json()).error.message).toMatch(/already an author/);
  });

  it("sends a real e-mail through SMTP whose link creates an account and joins as a reviewer of the chosen case only", async () => {
    await actAs("editor");
    const email = `iris.penhallow.${Date.now()}@moorfield.example`;
    const res = await invite(fx.proofId, { email, scope: "cases", caseIds: [fx.cases["2"]] });
    expect(res.status).toBe(201);
    expect((await res.json()).mailStatus).toBe("sent");

    const mail = await waitForMail(email, /invites you to review/);
    expect(mail.text).toContain("case 2 of the proof");
    const token = tokenFrom(mail.text);
    expect(mail.text).toContain(`${process.env.NEXTAUTH_URL ?? "http://localhost:3000"}/invitations/${token}`);
    expect(await models().Invitation.count({ where: { tokenHash: token } })).toBe(0); // only the hash is stored

    await actAs(null);
    const preview = await accept.GET(new Request(`http://localhost/api/invitations/${token}`), params({ token }));
    expect(preview.status).toBe(200);
    expect((await preview.json()).invitation).toMatchObject({ email, state: "waiting", accountExists: false, scope: "cases 2" });

    const weak = await acceptAs(token, { name: "Iris Penhallow", password: "short" });
    expect(weak.status).toBe(422);
    expect(await models().User.count({ where: { email } })).toBe(0);

    const ok = await acceptAs(token, { name: "Iris Penhallow", password: "a long enough password" });
    expect(ok.status).toBe(200);
    const joined = await ok.json();
    expect(joined).toMatchObject({ proofId: fx.proofId, accountCreated: true });
    expect(await authenticate(email, "a long enough password")).toMatchObject({ name: "Iris Penhallow" });
    const member = await models().ProofMember.findOne({ where: { proofId: fx.proofId, userId: joined.userId } });
    expect(member?.role).toBe("reviewer");
    // Case 2 and its sub-case 2.1, not case 1.
    expect([...(await visibleCaseIds(fx.proofId, joined.userId))!].sort()).toEqual([fx.cases["2"], fx.cases["2.1"]].sort());
    expect(await models().Notification.count({ where: { userId: joined.userId, kind: "assigned" } })).toBe(1);

    // The link works once.
    const again = await acceptAs(token, { name: "Someone Else", password: "another long password" });
    expect(again.status).toBe(409);
    expect((await again.json()).error.message).toMatch(/already used/);
    expect(await models().ProofMember.count({ where: { proofId: fx.proofId } })).toBe(5);
  });

  it("keeps a case-limited reviewer out of other cases until the editor shares the whole proof", async () => {
    const { User } = models();
    const iris = await User.findOne({ where: { name: "Iris Penhallow" }, order: [["id", "DESC"]] });
    const { getServerSession } = await import("next-auth");
    vi.mocked(getServerSession).mockResolvedValue({
      user: { id: String(iris!.id), name: iris!.name, email: iris!.email, role: "member", sessionVersion: 1 },
      expires: "2999-01-01",
    });
    const stepIn = fx.steps["2.1.1"];
    const stepOut = fx.steps["1.1"];
    const get = (stepId: number) => reviews.GET(new Request("http://localhost/x"), params({ proofId: String(fx.proofId), stepId: String(stepId) }));
    expect((await get(stepIn)).status).toBe(200);
    const outside = await get(stepOut);
    expect(outside.status).toBe(403);
    expect((await outside.json()).error.message).toMatch(/not asked to review/);

    const share = () =>
      scopes.DELETE(new Request("http://localhost/x", { method: "DELETE" }), params({ proofId: String(fx.proofId), userId: String(iris!.id) }));
    expect((await share()).status).toBe(403); // a reviewer cannot widen their own scope
    await actAs("editor");
    expect((await share()).status).toBe(200);
    expect(await visibleCaseIds(fx.proofId, iris!.id)).toBeNull();
  });

  it("refuses an expired link (409) and changes nothing", async () => {
    await actAs("editor");
    const email = `expired.${Date.now()}@moorfield.example`;
    expect((await invite(fx.proofId, { email, scope: "proof" })).status).toBe(201);
    const token = tokenFrom((await waitForMail(email, /invites you/)).text);
    await models().Invitation.update({ expiresAt: new Date(Date.now() - 1000) }, { where: { tokenHash: hashToken(token) } });
    await actAs(null);
    const res = await acceptAs(token, { name: "Late Comer", password: "a long enough password" });
    expect(res.status).toBe(409);
    expect((await res.json()).error.message).toMatch(/expired/);
    expect(await models().User.count({ where: { email } })).toBe(0);
  });

  it("revokes a waiting invitation: its link stops working, its mail is not retried, nothing joins", async () => {
    await actAs("editor");
    const email = `wrong.address.${Date.now()}@moorfield.example`;
    const created = await invite(fx.proofId, { email, scope: "proof" });
    expect(created.status).toBe(201);
    const { id } = await created.json();
    const token = tokenFrom((await waitForMail(email, /invites you/)).text);
    const revoke = () =>
      invitationRetry.DELETE(new Request("http://localhost/x", { method: "DELETE" }), params({ proofId: String(fx.proofId), invitationId: String(id) }));
    // Only an editor or the proof's owner may revoke.
    await expectStatusAs(revoke, { reviewer: 403, editor: 200 });
    expect((await revoke()).status).toBe(409); // already revoked
    const listed = await (await invitations.GET(new Request("http://localhost/x"), params({ proofId: String(fx.proofId) }))).json();
    expect(listed.invitations.find((i: { id: number }) => i.id === id)).toMatchObject({ state: "revoked" });
    expect(
      (await invitationRetry.POST(new Request("http://localhost/x", { method: "POST" }), params({ proofId: String(fx.proofId), invitationId: String(id) })))
        .status,
    ).toBe(409);
    await actAs(null);
    expect((await (await accept.GET(new Request("http://localhost/x"), params({ token }))).json()).invitation).toMatchObject({ state: "revoked" });
    const res = await acceptAs(token, { name: "Wrong Person", password: "a long enough password" });
    expect(res.status).toBe(409);
    expect((await res.json()).error).toMatchObject({ reason: "revoked", message: expect.stringMatching(/withdrawn by the proof's editor/) });
    expect(await models().User.count({ where: { email } })).toBe(0);
    expect(await models().AuditEvent.count({ where: { action: "invitation.revoked", subjectId: id } })).toBe(1);
  });

  it("cannot revoke an accepted invitation (409)", async () => {
    await actAs("editor");
    const email = `joined.${Date.now()}@moorfield.example`;
    const { id } = await (await invite(fx.proofId, { email, scope: "proof" })).json();
    const token = tokenFrom((await waitForMail(email, /invites you/)).text);
    await actAs(null);
    expect((await acceptAs(token, { name: "Joined Reviewer", password: "a long enough password" })).status).toBe(200);
    await actAs("editor");
    const res = await invitationRetry.DELETE(
      new Request("http://localhost/x", { method: "DELETE" }),
      params({ proofId: String(fx.proofId), invitationId: String(id) }),
    );
    expect(res.status).toBe(409);
    expect((await res.json()).error.message).toMatch(/already accepted/);
  });

  it("accepts while signed in only as the invited address, and asks an existing account to sign in", async () => {
    await actAs("editor");
    const res = await invite(other.proofId, { email: "fen.calloway@tarnhollow.example", scope: "proof" });
    expect(res.status).toBe(201);
    const token = tokenFrom((await waitForMail("fen.calloway@tarnhollow.example", /invites you/)).text);
    await actAs(null);
    const signedOut = await acceptAs(token, { name: "Fen", password: "a long enough password" });
    expect(signedOut.status).toBe(409);
    expect((await signedOut.json()).error.message).toMatch(/sign in/);
    await actAs("admin");
    expect((await acceptAs(token)).status).toBe(403);
    await actAs("outsider");
    const ok = await acceptAs(token);
    expect(ok.status).toBe(200);
    expect((await ok.json()).accountCreated).toBe(false);
  });

  it("answers 404 for an unknown link", async () => {
    await actAs(null);
    const token = "x".repeat(43);
    expect((await accept.GET(new Request("http://localhost/x"), params({ token }))).status).toBe(404);
    expect((await acceptAs(token, {})).status).toBe(404);
  });
});

describe("GET invitations and DELETE a reviewer's case limits", () => {
  it("lists reviewer invitations for editors only (401, 403 non-member and referee; a co-author sees co-author invitations only)", async () => {
    const list = () => invitations.GET(new Request("http://localhost/x"), params({ proofId: String(fx.proofId) }));
    await expectStatusAs(list, { nobody: 401, outsider: 403, reviewer: 403 });
    await actAs("coauthor");
    const coauthors = await list();
    expect(coauthors.status).toBe(200);
    expect((await coauthors.json()).invitations).toEqual([]); // every invitation here is a referee's
    await actAs("editor");
    const res = await list();
    expect(res.status).toBe(200);
    expect((await res.json()).invitations.find((i: { state: string }) => i.state === "accepted")).toBeTruthy();
  });

  it("DELETE settings/scopes/[userId]: 401, 404 for someone who is not a reviewer", async () => {
    const share = (userId: number) =>
      scopes.DELETE(new Request("http://localhost/x", { method: "DELETE" }), params({ proofId: String(fx.proofId), userId: String(userId) }));
    await actAs(null);
    expect((await share(fx.ids.reviewer)).status).toBe(401);
    await actAs("editor");
    expect((await share(fx.ids.author)).status).toBe(404);
    expect((await share(fx.ids.reviewer)).status).toBe(200);
  });
});

describe("when the mail server is down", () => {
  it("stores the invitation, shows the mail as not sent yet, and sends it on retry", async () => {
    const realSmtp = process.env.SMTP_URL;
    process.env.SMTP_URL = "smtp://127.0.0.1:9"; // nothing listens on the discard port here
    const email = `offline.${Date.now()}@moorfield.example`;
    try {
      await actAs("editor");
      const res = await invite(fx.proofId, { email, scope: "proof" });
      expect(res.status).toBe(201);
      expect((await res.json()).mailStatus).toBe("pending");
    } finally {
      process.env.SMTP_URL = realSmtp;
    }
    const list = await invitations.GET(new Request("http://localhost/x"), params({ proofId: String(fx.proofId) }));
    const row = (await list.json()).invitations.find((i: { email: string }) => i.email === email);
    expect(row.mail).toMatchObject({ status: "pending", attempts: 1 });
    expect(row.mail.lastError).toBeTruthy();

    const retry = (proofId: number, id: number) =>
      invitationRetry.POST(new Request("http://localhost/x", { method: "POST" }), params({ proofId: String(proofId), invitationId: String(id) }));
    await actAs("author"); // the proof's owner may retry too
    expect((await retry(fx.proofId, row.id)).status).toBe(200);
    await actAs("reviewer");
    expect((await retry(fx.proofId, row.id)).status).toBe(403);
    await actAs("editor");
    expect((await retry(other.proofId, row.id)).status).toBe(404);
    const mail = await waitForMail(email, /invites you/);
    expect(mail.text).toMatch(/\/invitations\/[A-Za-z0-9_-]{40,}/);
    const after = await invitations.GET(new Request("http://localhost/x"), params({ proofId: String(fx.proofId) }));
    expect((await after.json()).invitations.find((i: { email: string }) => i.email === email).mail.status).toBe("sent");
  });
});
