/**
 * Comments on the statement and on each case's condition (issue 15): the two routes' 401 / 404 / 403 /
 * 422 / 409 per role, threads with replies, the audit sentence, the notices, and a case-limited referee
 * who reads and writes only on the conditions of their cases.
 */
import { beforeAll, describe, expect, it, vi } from "vitest";

vi.mock("next-auth", async (importOriginal) => ({ ...(await importOriginal<typeof import("next-auth")>()), getServerSession: vi.fn() }));

import { getServerSession } from "next-auth";
import { actAs, jsonRequest, params } from "./helpers";
import { reviewProofsForFile } from "./review-fixtures";
import { models } from "@/models";
import { listProofEvents } from "@/lib/data/audit";
import * as statement from "@/app/api/proofs/[proofId]/statement/comments/route";
import * as condition from "@/app/api/proofs/[proofId]/cases/[caseId]/comments/route";
import * as proofRoute from "@/app/api/proofs/[proofId]/route";
import * as stepComments from "@/app/api/proofs/[proofId]/steps/[stepId]/comments/route";

type Node = { id: number; authorName: string; body: string; replies: Node[] };
const HOLLIS = { name: "Hollis Varga", email: `hollis.varga.${Date.now()}@moorfield.example` };
const [fx, other] = reviewProofsForFile(["place comments", "place comments, other"], { afterDrop: () => models().User.destroy({ where: { id: hollisId } }) });
let hollisId = 0;
const P = () => String(fx.proofId);

async function actAsHollis() {
  const u = (await models().User.findByPk(hollisId))!;
  vi.mocked(getServerSession).mockResolvedValue({
    user: { id: String(u.id), name: u.name, email: u.email, role: "member", sessionVersion: u.sessionVersion },
    expires: "2999-01-01",
  });
}

const get = (p: Record<string, string>, onCase: boolean) => (onCase ? condition.GET : statement.GET)(new Request("http://localhost/x"), params(p as never));
const post = (p: Record<string, string>, body: unknown, onCase: boolean) =>
  (onCase ? condition.POST : statement.POST)(jsonRequest("/x", "POST", body), params(p as never));
const onStatement = () => ({ proofId: P() });
const onCase = (key: string) => ({ proofId: P(), caseId: String(fx.cases[key]) });
const counts = async () => ({ comments: await models().Comment.count(), events: await models().AuditEvent.count() });

beforeAll(async () => {
  // Hollis referees case 1 only (and so sees nothing of case 2, nor the statement's discussion).
  hollisId = (await models().User.create({ email: HOLLIS.email, name: HOLLIS.name, passwordHash: null, role: "member" })).id;
  await models().ProofMember.create({ proofId: fx.proofId, userId: hollisId, role: "reviewer" });
  await models().ReviewerScope.create({ proofId: fx.proofId, userId: hollisId, caseId: fx.cases["1"] });
});

describe("comments on the statement and on conditions", () => {
  it("401 without a session, 404 for no such proof or case (or a case of another proof), 403 for a non-member", async () => {
    await actAs(null);
    expect((await get(onStatement(), false)).status).toBe(401);
    expect((await post(onCase("1"), { body: "x" }, true)).status).toBe(401);
    await actAs("author");
    expect((await get({ proofId: "999999999" }, false)).status).toBe(404);
    expect((await get({ proofId: P(), caseId: "999999999" }, true)).status).toBe(404);
    expect((await get({ proofId: P(), caseId: "abc" }, true)).status).toBe(404);
    expect((await post({ proofId: P(), caseId: String(other.cases["1"]) }, { body: "x" }, true)).status).toBe(404);
    await actAs("outsider");
    const refused = await post(onStatement(), { body: "x" }, false);
    expect(refused.status).toBe(403);
    expect((await refused.json()).error.message).toMatch(/not a member/);
    expect((await get(onCase("1"), true)).status).toBe(403);
  });

  it("lets every whole-proof role comment and reply on the statement, in threads, with an audit sentence and notices", async () => {
    const before = await counts();
    await actAs("author");
    const first = await post(onStatement(), { body: "Is $x$ real here?" }, false);
    expect(first.status).toBe(201);
    const { id } = await first.json();
    for (const who of ["coauthor", "reviewer", "editor"]) {
      await actAs(who);
      expect((await post(onStatement(), { body: `Reply from the ${who}.`, parentId: id }, false)).status).toBe(201);
    }
    const after = await counts();
    expect(after.comments - before.comments).toBe(4);
    expect(after.events - before.events).toBe(4);
    await actAs("author");
    const thread = await (await get(onStatement(), false)).json();
    expect(thread.text).toBe("Every $x$ is fine.");
    expect(thread.digest).toMatch(/^[0-9a-f]{64}$/);
    expect(thread.comments).toHaveLength(1);
    expect((thread.comments[0] as Node).replies.map((r) => r.body)).toEqual(["Reply from the coauthor.", "Reply from the reviewer.", "Reply from the editor."]);
    const events = await listProofEvents(fx.proofId, 10);
    expect(events.filter((e) => e.action === "comment.added").map((e) => e.sentence)).toContain("Ada Quenby commented on the statement.");
    // The authors hear of the others' comments (never of their own), in a sentence that names no one.
    const notices = await models().Notification.findAll({ where: { proofId: fx.proofId, kind: "comment_added" } });
    const to = (userId: number) => notices.filter((n) => n.userId === userId).length;
    expect(to(fx.ids.author)).toBe(3);
    expect(to(fx.ids.coauthor)).toBe(3); // the author's own comment, the reviewer's and the editor's replies
    expect(to(hollisId)).toBe(0);
    expect(notices[0].message).toMatch(/^A new comment on the statement of “place comments/);
    expect(notices[0].link).toBe(`/proofs/${fx.proofId}#statement-comments`);
  });

  it("keeps a case-limited referee to the conditions of their cases: 403 on the statement and on other cases", async () => {
    await actAsHollis();
    const before = await counts();
    const statementRefusal = await get(onStatement(), false);
    expect(statementRefusal.status).toBe(403);
    expect((await statementRefusal.json()).error.message).toMatch(/some of its cases only/);
    expect((await post(onStatement(), { body: "x" }, false)).status).toBe(403);
    for (const key of ["2", "2.1"]) {
      expect((await get(onCase(key), true)).status).toBe(403);
      expect((await post(onCase(key), { body: "x" }, true)).status).toBe(403);
    }
    expect(await counts()).toEqual(before);
    const mine = await post(onCase("1"), { body: "Should this be $n < 3$?" }, true);
    expect(mine.status).toBe(201);
    // An author answers; Hollis (who wrote there) hears of it, the editor (who did not) does not.
    await actAs("author");
    const answer = await post(onCase("1"), { body: "No: $n \\le 3$ includes the triangle.", parentId: (await mine.json()).id }, true);
    expect(answer.status).toBe(201);
    const notices = await models().Notification.findAll({ where: { proofId: fx.proofId, kind: "comment_added", userId: hollisId } });
    expect(notices.map((n) => n.message)).toEqual([expect.stringMatching(/^A new comment on the condition of case 1 \(“Small”\)/)]);
    expect(notices[0].link).toBe(`/proofs/${fx.proofId}#case-1-comments`);
    await actAsHollis();
    const thread = await (await get(onCase("1"), true)).json();
    expect(thread.text).toBe("$n \\le 3$");
    expect(thread.comments[0].authorName).toBe(HOLLIS.name);
    expect(thread.comments[0].replies[0].body).toMatch(/includes the triangle/);
    // Conditions keep their threads apart: case 2's is empty.
    await actAs("editor");
    expect((await (await get(onCase("2"), true)).json()).comments).toEqual([]);
    const sentences = (await listProofEvents(fx.proofId, 5)).map((e) => e.sentence);
    expect(sentences).toContain("Ada Quenby commented on the condition of case 1, “Small”.");
  });

  it("422 for an empty or oversized body, a bad digest, or a reply to a comment elsewhere; 415 for a body not sent as JSON", async () => {
    await actAs("author");
    const stepComment = await stepComments.POST(jsonRequest("/x", "POST", { body: "On a step." }), params({ proofId: P(), stepId: String(fx.steps["1.1"]) }));
    expect(stepComment.status).toBe(201);
    const onStatementId = (await (await post(onStatement(), { body: "Top." }, false)).json()).id;
    const before = await counts();
    for (const [body, onTheCase, field] of [
      [{ body: "   " }, false, "body"],
      [{ body: "x".repeat(20_001) }, true, "body"],
      [{ body: "x", digest: "abc" }, false, "digest"],
      [{ body: "x", parentId: -1 }, true, "parentId"],
      [{ body: "x", parentId: onStatementId }, true, "parentId"],
      [{ body: "x", parentId: (await stepComment.json()).id }, false, "parentId"],
    ] as const) {
      const res = await post(onTheCase ? onCase("1") : onStatement(), body, onTheCase);
      expect(res.status, JSON.stringify(body).slice(0, 60)).toBe(422);
      const error = (await res.json()).error;
      expect(error.code).toBe("invalid");
      expect(error.issues.map((i: { path: string }) => i.path)).toContain(field);
    }
    const text = await statement.POST(new Request("http://localhost/x", { method: "POST", body: "hello" }), params({ proofId: P() }));
    expect(text.status).toBe(415);
    expect(await counts()).toEqual(before);
  });

  it("409 when the statement or condition was edited after the writer read it; nothing is written", async () => {
    await actAs("reviewer");
    const read = await (await get(onStatement(), false)).json();
    const readCase = await (await get(onCase("2"), true)).json();
    await actAs("author");
    expect((await proofRoute.PATCH(jsonRequest("/x", "PATCH", { statement: "Every real $x$ is fine." }), params({ proofId: P() }))).status).toBe(200);
    await models().Case.update({ condition: "$n \\ge 4$" }, { where: { id: fx.cases["2"] } });
    await actAs("reviewer");
    const before = await counts();
    const stale = await post(onStatement(), { body: "About $x$.", digest: read.digest }, false);
    expect(stale.status).toBe(409);
    const body = (await stale.json()).error;
    expect(body.message).toMatch(/statement was edited/);
    expect(body.text).toBe("Every real $x$ is fine.");
    const staleCase = await post(onCase("2"), { body: "About $n$.", digest: readCase.digest }, true);
    expect(staleCase.status).toBe(409);
    expect((await staleCase.json()).error.message).toMatch(/condition was edited/);
    expect(await counts()).toEqual(before);
    // Read again, post again: accepted.
    const fresh = await (await get(onStatement(), false)).json();
    expect((await post(onStatement(), { body: "About $x$.", digest: fresh.digest }, false)).status).toBe(201);
  });

  it("404 on the condition of a deleted case, or of a case under one", async () => {
    await models().Case.update({ deletedAt: new Date() }, { where: { id: fx.cases["2"] } });
    await actAs("author");
    expect((await get(onCase("2"), true)).status).toBe(404);
    expect((await post(onCase("2.1"), { body: "x" }, true)).status).toBe(404);
    await models().Case.update({ deletedAt: null }, { where: { id: fx.cases["2"] } });
  });
});
