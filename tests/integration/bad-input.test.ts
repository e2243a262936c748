/**
 * Bad input on every route that takes input: malformed JSON, a JSON array/number/null instead of an
 * object, wrong field types, 1 MB strings, nonsense ids in the path and query, ids of rows of another
 * proof, unknown enum values, missing fields. Each must be a 4xx with the one error body
 * `{ error: { code, message } }`, and must write nothing.
 */
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";

vi.mock("next-auth", async (importOriginal) => ({ ...(await importOriginal<typeof import("next-auth")>()), getServerSession: vi.fn() }));

import { getServerSession } from "next-auth";
import { actAs, jsonRequest, params, userIdOf } from "./helpers";
import { addCase, addStep, draftProof, dropProofs } from "./workspace-fixture";
import { closeSequelize } from "@/lib/db";
import { models } from "@/models";
import { verificationSettled } from "@/lib/data/claims";
import { BODY_LIMITS } from "@/lib/http";
import * as proofsRoute from "@/app/api/proofs/route";
import * as proofRoute from "@/app/api/proofs/[proofId]/route";
import * as casesRoute from "@/app/api/proofs/[proofId]/cases/route";
import * as caseRoute from "@/app/api/proofs/[proofId]/cases/[caseId]/route";
import * as stepsRoute from "@/app/api/proofs/[proofId]/cases/[caseId]/steps/route";
import * as stepRoute from "@/app/api/proofs/[proofId]/steps/[stepId]/route";
import * as revisionsRoute from "@/app/api/proofs/[proofId]/steps/[stepId]/revisions/route";
import * as revisionRoute from "@/app/api/proofs/[proofId]/steps/[stepId]/revisions/[number]/route";
import * as diffRoute from "@/app/api/proofs/[proofId]/steps/[stepId]/diff/route";
import * as stepClaimsRoute from "@/app/api/proofs/[proofId]/steps/[stepId]/claims/route";
import * as claimRoute from "@/app/api/proofs/[proofId]/claims/[claimId]/route";
import * as recheckRoute from "@/app/api/proofs/[proofId]/claims/[claimId]/recheck/route";
import * as commentsRoute from "@/app/api/proofs/[proofId]/steps/[stepId]/comments/route";
import * as reviewsRoute from "@/app/api/proofs/[proofId]/steps/[stepId]/reviews/route";
import * as disputeRoute from "@/app/api/proofs/[proofId]/disputes/[reviewId]/route";
import * as exportsRoute from "@/app/api/proofs/[proofId]/exports/route";
import * as exportRoute from "@/app/api/proofs/[proofId]/exports/[exportId]/route";
import * as invitationsRoute from "@/app/api/proofs/[proofId]/invitations/route";
import * as invitationRoute from "@/app/api/proofs/[proofId]/invitations/[invitationId]/route";
import * as tokenRoute from "@/app/api/invitations/[token]/route";
import * as settingsRoute from "@/app/api/proofs/[proofId]/settings/route";
import * as scopeRoute from "@/app/api/proofs/[proofId]/settings/scopes/[userId]/route";
import * as notificationsRoute from "@/app/api/notifications/route";
import * as preferencesRoute from "@/app/api/notifications/preferences/route";

const MB = "x".repeat(1_000_000);
/** Bodies that are not a JSON object at all (raw strings are sent as they are). */
const NOT_OBJECTS: unknown[] = ["{not json", "", "[]", "[1,2]", "42", "null", '"text"', "true"];
/** Path ids that name nothing: non-numeric, zero, negative, fractional, huge. */
const BAD_IDS = ["abc", "0", "-1", "1.5", "1e3", "99999999999", "4294967296", " 1", "0x10"];

let proofId: string; // the proof under test: Ada author, Celia and Esme reviewers, Dov editor
let otherProofId: string; // a second proof whose rows must not be reachable through the first
let caseId: number;
let step: { id: number; revisionId: number };
let other: {
  caseId: number;
  step: { id: number; revisionId: number };
  commentId: number;
  disputeId: number;
  claimId: number;
  invitationId: number;
  exportId: number;
};
let disputeId: number;
let approvalId: number;

/** A 4xx with exactly the one error body shape; returns the error for further checks. */
async function expectError(res: Response, status?: number): Promise<{ code: string; message: string; issues?: Array<{ path: string; message: string }> }> {
  const text = await res.text();
  expect(res.status, text.slice(0, 300)).toBeGreaterThanOrEqual(400);
  expect(res.status, text.slice(0, 300)).toBeLessThan(500);
  if (status !== undefined) expect(res.status, text.slice(0, 300)).toBe(status);
  const body = JSON.parse(text) as { error: { code: string; message: string } };
  expect(body).toEqual({ error: expect.objectContaining({ code: expect.any(String), message: expect.any(String) }) });
  expect(body.error.message.length).toBeGreaterThan(10);
  expect(body.error.message).not.toMatch(/sequelize|sql|stack|TypeError|undefined/i);
  return body.error as never;
}

const req = (method: string, body?: unknown, url = "/x") => jsonRequest(url, method, body);
/** 422 for a body the route reads and refuses; 413 for one over the route's size limit (never read whole). */
const within = (body: unknown, limit: number) => (JSON.stringify(body).length > limit ? 413 : 422);

/** The tables a bad request could half-write: the name a count goes by, and the model. */
const COUNTED = {
  proofs: "Proof",
  cases: "Case",
  steps: "Step",
  revisions: "StepRevision",
  claims: "Claim",
  reviews: "Review",
  comments: "Comment",
  exports: "ProofExport",
  invitations: "Invitation",
  mails: "OutgoingMail",
  notifications: "Notification",
  audit: "AuditEvent",
} as const;

/** Counts of every table a bad request could half-write. */
async function rowCounts(): Promise<Record<keyof typeof COUNTED, number>> {
  const m = models();
  const counts = await Promise.all(Object.entries(COUNTED).map(async ([name, model]) => [name, await (m[model] as { count(): Promise<number> }).count()]));
  return Object.fromEntries(counts);
}

beforeAll(async () => {
  proofId = await draftProof("Bad input test");
  otherProofId = await draftProof("Bad input test: the other proof");
  await models().ProofMember.create({ proofId: Number(proofId), userId: await userIdOf("editor"), role: "editor" });
  await models().ProofMember.create({ proofId: Number(proofId), userId: await userIdOf("admin"), role: "reviewer" }); // a second reviewer
  caseId = await addCase(proofId, "Exactly one branch vertex");
  step = await addStep(proofId, caseId, "Let $T = T(a,b,c)$. Then $\\rho(T) \\le 2$.");

  const otherCase = await addCase(otherProofId, "A case of the other proof");
  const otherStep = await addStep(otherProofId, otherCase, "A step of the other proof.");
  await actAs("author");
  const claim = await stepClaimsRoute.POST(
    req("POST", { claims: [{ format: "cairn-claim/1", kind: "spectral-radius-bound", graph: { format: "named", text: "path(3)" }, op: "<", bound: "2" }] }),
    params({ proofId: otherProofId, stepId: String(otherStep.id) }),
  );
  expect(claim.status).toBe(202);
  // Its verdict (stored by a worker process, with an audit event) must be in before rows are counted.
  const claimId: number = (await claim.json()).claims[0].id;
  await verificationSettled(claimId);
  const invitation = await invitationsRoute.POST(req("POST", { email: "invitee.other@example.org", scope: "proof" }), params({ proofId: otherProofId }));
  expect(invitation.status).toBe(201);
  const otherExport = await exportsRoute.POST(req("POST", { kind: "draft" }), params({ proofId: otherProofId }));
  expect(otherExport.status).toBe(201);
  await actAs("reviewer");
  // Attaching the claim made revision 2 of the step (a revision is text plus claims): dispute that one.
  const otherLatest = await models().StepRevision.findOne({ where: { stepId: otherStep.id }, order: [["number", "DESC"]] });
  const otherDispute = await reviewsRoute.POST(
    req("POST", { revisionId: otherLatest!.id, verdict: "dispute", comment: "The case split misses T(1,1,1)." }),
    params({ proofId: otherProofId, stepId: String(otherStep.id) }),
  );
  expect(otherDispute.status).toBe(201);
  const otherComment = await commentsRoute.POST(
    req("POST", { body: "A comment on the other proof." }),
    params({ proofId: otherProofId, stepId: String(otherStep.id) }),
  );
  expect(otherComment.status).toBe(201);
  other = {
    caseId: otherCase,
    step: otherStep,
    commentId: (await otherComment.json()).id,
    disputeId: (await otherDispute.json()).reviewId,
    claimId,
    invitationId: (await invitation.json()).id,
    exportId: (await otherExport.json()).export.id,
  };

  // In the proof under test: one dispute by the reviewer and one approval by the second reviewer.
  const dispute = await reviewsRoute.POST(
    req("POST", { revisionId: step.revisionId, verdict: "dispute", comment: "Why is $a \\le b$?" }),
    params({ proofId, stepId: String(step.id) }),
  );
  expect(dispute.status).toBe(201);
  disputeId = (await dispute.json()).reviewId;
  await actAs("admin");
  const approval = await reviewsRoute.POST(req("POST", { revisionId: step.revisionId, verdict: "vouch" }), params({ proofId, stepId: String(step.id) }));
  expect(approval.status).toBe(201);
  approvalId = (await approval.json()).reviewId;
});

afterAll(async () => {
  await dropProofs([proofId, otherProofId]);
  await closeSequelize();
});

describe("bodies that are not JSON objects", () => {
  it("answer 422 on every route that reads a body, and write nothing", async () => {
    const before = await rowCounts();
    const sid = String(step.id);
    const calls: Array<[string, string, (body: unknown) => Promise<Response>]> = [
      ["author", "POST /api/proofs", (b) => proofsRoute.POST(req("POST", b), params({}))],
      ["author", "PATCH /api/proofs/[proofId]", (b) => proofRoute.PATCH(req("PATCH", b), params({ proofId }))],
      ["author", "POST cases", (b) => casesRoute.POST(req("POST", b), params({ proofId }))],
      ["author", "PATCH case", (b) => caseRoute.PATCH(req("PATCH", b), params({ proofId, caseId: String(caseId) }))],
      ["author", "DELETE case", (b) => caseRoute.DELETE(req("DELETE", b), params({ proofId, caseId: String(caseId) }))],
      ["author", "POST steps", (b) => stepsRoute.POST(req("POST", b), params({ proofId, caseId: String(caseId) }))],
      ["author", "POST revisions", (b) => revisionsRoute.POST(req("POST", b), params({ proofId, stepId: sid }))],
      ["author", "POST claims", (b) => stepClaimsRoute.POST(req("POST", b), params({ proofId, stepId: sid }))],
      ["author", "POST comments", (b) => commentsRoute.POST(req("POST", b), params({ proofId, stepId: sid }))],
      ["reviewer", "POST reviews", (b) => reviewsRoute.POST(req("POST", b), params({ proofId, stepId: sid }))],
      ["author", "POST dispute move", (b) => disputeRoute.POST(req("POST", b), params({ proofId, reviewId: String(disputeId) }))],
      ["editor", "POST exports", (b) => exportsRoute.POST(req("POST", b), params({ proofId }))],
      ["editor", "POST invitations", (b) => invitationsRoute.POST(req("POST", b), params({ proofId }))],
      ["editor", "PATCH settings", (b) => settingsRoute.PATCH(req("PATCH", b), params({ proofId }))],
      ["author", "POST notifications", (b) => notificationsRoute.POST(req("POST", b), params({}))],
      ["author", "PUT notification preferences", (b) => preferencesRoute.PUT(req("PUT", b), params({}))],
    ];
    for (const [who, name, call] of calls) {
      await actAs(who);
      for (const body of NOT_OBJECTS) {
        const res = await call(body);
        const error = await expectError(res, 422).catch((e: Error) => {
          throw new Error(`${name} with body ${JSON.stringify(body)}: ${e.message}`);
        });
        expect(error.code, name).toBe("invalid");
      }
    }
    await actAs(null);
    for (const body of NOT_OBJECTS) await expectError(await tokenRoute.POST(req("POST", body), params({ token: "a".repeat(43) })));
    expect(await rowCounts()).toEqual(before);
  });
});

describe("wrong field types, missing fields, unknown enum values, 1 MB strings", () => {
  it("proofs and cases", async () => {
    const before = await rowCounts();
    await actAs("author");
    for (const body of [
      {},
      { title: "T" },
      { title: 5, statement: "S" },
      { title: ["T"], statement: "S" },
      { title: MB, statement: "S" },
      { title: "T", statement: MB },
      { title: "   ", statement: "S" },
    ])
      expect((await expectError(await proofsRoute.POST(req("POST", body), params({})), 422)).issues?.length).toBeGreaterThan(0);
    for (const body of [{}, { title: null }, { statement: 7 }, { title: MB }, { statement: MB }])
      await expectError(await proofRoute.PATCH(req("PATCH", body), params({ proofId })), 422);
    for (const body of [
      {},
      { title: 1 },
      { title: MB },
      { title: "C", condition: MB },
      { title: "C", condition: 3 },
      { title: "C", parentId: "1" },
      { title: "C", parentId: -1 },
      { title: "C", parentId: 1.5 },
      { title: "C", parentId: 2 ** 60 },
    ])
      await expectError(await casesRoute.POST(req("POST", body), params({ proofId })), within(body, BODY_LIMITS.small));
    const patchCase = (body: unknown, c = String(caseId)) => caseRoute.PATCH(req("PATCH", body), params({ proofId, caseId: c }));
    for (const body of [
      {},
      { move: "sideways" },
      { move: 1 },
      { title: "" },
      { title: MB },
      { condition: MB },
      { parentId: "x" },
      { confirm: "yes", move: "up" },
    ])
      await expectError(await patchCase(body), within(body, BODY_LIMITS.small));
    await expectError(await caseRoute.DELETE(req("DELETE", { confirm: "yes" }), params({ proofId, caseId: String(caseId) })), 422);
    expect(await rowCounts()).toEqual(before);
  });

  it("steps, revisions, claims, comments", async () => {
    const before = await rowCounts();
    const sid = String(step.id);
    await actAs("author");
    for (const body of [{}, { body: 5 }, { body: ["a"] }, { body: MB }, { body: "  \n " }])
      await expectError(await stepsRoute.POST(req("POST", body), params({ proofId, caseId: String(caseId) })), 422);
    for (const body of [
      { body: "x" },
      { baseRevisionId: "1", body: "x" },
      { baseRevisionId: step.revisionId, body: MB },
      { baseRevisionId: step.revisionId },
      { baseRevisionId: -3, body: "x" },
      { baseRevisionId: 2 ** 60, body: "x" },
      { baseRevisionId: 99999999999, body: "x" },
    ])
      await expectError(await revisionsRoute.POST(req("POST", body), params({ proofId, stepId: sid })), 422);
    const attach = (body: unknown, url = "/x") => stepClaimsRoute.POST(req("POST", body, url), params({ proofId, stepId: sid }));
    const spectral = { format: "cairn-claim/1", kind: "spectral-radius-bound", graph: { format: "named", text: "path(3)" }, op: "<", bound: "2" };
    for (const body of [
      {},
      { claims: "x" },
      { claims: [] },
      { claims: [1] },
      { claims: [null] },
      { claims: [[]] },
      { claims: Array(21).fill(spectral) },
      { claims: [{}] },
      { claims: [{ ...spectral, kind: "nope" }] },
      { claims: [{ ...spectral, op: "≈" }] },
      { claims: [{ ...spectral, bound: MB }] },
      { claims: [{ ...spectral, graph: { format: "named", text: MB } }] },
      { claims: [{ ...spectral, graph: { format: "named", text: 5 } }] },
      { claims: [spectral, { ...spectral, graph: null }] },
    ])
      await expectError(await attach(body), 422);
    const named = await expectError(await attach({ claims: [spectral, { ...spectral, graph: { format: "edges", text: 12 } }] }), 422);
    expect(named.issues?.[0].path).toBe("claims.1.graph.text");
    await expectError(await attach({ claims: [{ ...spectral, kind: "nope" }] }, "/x?wait=abc"), 422);
    for (const body of [
      {},
      { body: "" },
      { body: 3 },
      { body: MB },
      { body: "Reply", parentId: "1" },
      { body: "Reply", parentId: -1 },
      { body: "Reply", reviewId: 0 },
      { body: "Reply", reviewId: approvalId },
      { body: "Reply", parentId: 2 ** 60 },
    ])
      await expectError(await commentsRoute.POST(req("POST", body), params({ proofId, stepId: sid })), 422);
    expect(await rowCounts()).toEqual(before);
  });

  it("verdicts, dispute moves, exports, settings", async () => {
    const before = await rowCounts();
    const sid = String(step.id);
    await actAs("reviewer");
    for (const body of [
      {},
      { verdict: "vouch" },
      { revisionId: "1", verdict: "vouch" },
      { revisionId: step.revisionId, verdict: "maybe" },
      { revisionId: step.revisionId, verdict: "dispute" },
      { revisionId: step.revisionId, verdict: "dispute", comment: "   " },
      { revisionId: step.revisionId, verdict: "dispute", comment: MB },
      { revisionId: 2 ** 60, verdict: "vouch" },
      { revisionId: 99999999999, verdict: "vouch" },
    ])
      await expectError(await reviewsRoute.POST(req("POST", body), params({ proofId, stepId: sid })), 422);
    await actAs("author");
    for (const body of [{}, { to: "sideways" }, { to: 1 }, { to: "answered", comment: 5 }, { to: "answered", comment: MB }])
      await expectError(await disputeRoute.POST(req("POST", body), params({ proofId, reviewId: String(disputeId) })), 422);
    await actAs("editor");
    for (const body of [{}, { kind: "final" }, { kind: 1 }, { kind: ["draft"] }])
      await expectError(await exportsRoute.POST(req("POST", body), params({ proofId })), 422);
    for (const body of [
      {},
      { requiredApprovals: "3" },
      { requiredApprovals: 0 },
      { requiredApprovals: -1 },
      { requiredApprovals: 10 },
      { requiredApprovals: 2.5 },
      { requiredApprovals: 1e308 },
      { requiredApprovals: null },
    ])
      await expectError(await settingsRoute.PATCH(req("PATCH", body), params({ proofId })), 422);
    expect(await rowCounts()).toEqual(before);
  });

  it("invitations, notifications, preferences", async () => {
    const before = await rowCounts();
    await actAs("editor");
    const invite = (body: unknown) => invitationsRoute.POST(req("POST", body), params({ proofId }));
    for (const body of [
      {},
      { email: "someone@example.org" },
      { email: "not an address", scope: "proof" },
      { email: 5, scope: "proof" },
      { email: "someone@example.org", scope: "everything" },
      { email: "someone@example.org", scope: "cases" },
      { email: "someone@example.org", scope: "cases", caseIds: [] },
      { email: "someone@example.org", scope: "cases", caseIds: ["abc"] },
      { email: "someone@example.org", scope: "cases", caseIds: [-1] },
      { email: "someone@example.org", scope: "cases", caseIds: "1" },
    ])
      await expectError(await invite(body), 422);
    // Addresses longer than an e-mail address can be (254 characters), up to 1 MB.
    for (const email of [`${"a".repeat(250)}@example.org`, `${"a".repeat(64)}@${"b".repeat(200)}.example.org`, `${MB}@example.org`]) {
      const body = { email, scope: "proof" };
      const error = await expectError(await invite(body), within(body, BODY_LIMITS.small));
      if (error.code === "invalid") expect(error.issues?.[0].path).toBe("email");
      else expect(error.message).toContain("64 KiB");
    }
    await actAs("author");
    for (const body of [{}, { ids: "some" }, { ids: [] }, { ids: [-1] }, { ids: ["1"] }, { ids: [1.5] }, { ids: Array(501).fill(1) }])
      await expectError(await notificationsRoute.POST(req("POST", body), params({})), 422);
    for (const body of [{}, { kind: "nope", email: true }, { kind: "assigned" }, { kind: "assigned", email: "yes" }, { kind: MB, email: false }])
      await expectError(await preferencesRoute.PUT(req("PUT", body), params({})), within(body, BODY_LIMITS.small));
    await actAs(null);
    for (const body of [{ name: MB, password: "long enough password" }, { name: "New Person", password: MB }, { name: 5 }])
      await expectError(await tokenRoute.POST(req("POST", body), params({ token: "a".repeat(43) })));
    expect(await rowCounts()).toEqual(before);
  });
});

describe("nonsense ids in the path and the query", () => {
  it("answer 404 for every id segment", async () => {
    const sid = String(step.id);
    for (const bad of BAD_IDS) {
      await actAs("author");
      const get = new Request("http://localhost/x");
      await expectError(await proofRoute.GET(get, params({ proofId: bad })), 404);
      await expectError(await casesRoute.GET(get, params({ proofId: bad })), 404);
      await expectError(await casesRoute.POST(req("POST", { title: "C" }), params({ proofId: bad })), 404);
      await expectError(await caseRoute.PATCH(req("PATCH", { title: "C" }), params({ proofId, caseId: bad })), 404);
      await expectError(await caseRoute.DELETE(req("DELETE", { confirm: true }), params({ proofId, caseId: bad })), 404);
      await expectError(await stepsRoute.POST(req("POST", { body: "S" }), params({ proofId, caseId: bad })), 404);
      await expectError(await stepRoute.GET(get, params({ proofId, stepId: bad })), 404);
      await expectError(await revisionsRoute.POST(req("POST", { baseRevisionId: step.revisionId, body: "S" }), params({ proofId, stepId: bad })), 404);
      await expectError(await revisionRoute.GET(get, params({ proofId, stepId: sid, number: bad })), 404);
      await expectError(await stepClaimsRoute.GET(get, params({ proofId, stepId: bad })), 404);
      await expectError(await claimRoute.GET(get, params({ proofId, claimId: bad })), 404);
      await expectError(await recheckRoute.POST(req("POST"), params({ proofId, claimId: bad })), 404);
      await expectError(await commentsRoute.POST(req("POST", { body: "C" }), params({ proofId, stepId: bad })), 404);
      await expectError(await disputeRoute.POST(req("POST", { to: "answered" }), params({ proofId, reviewId: bad })), 404);
      await expectError(await exportRoute.GET(get, params({ proofId, exportId: bad })), 404);
      await expectError(await invitationRoute.POST(req("POST"), params({ proofId, invitationId: bad })), 404);
      await expectError(await scopeRoute.DELETE(req("DELETE"), params({ proofId, userId: bad })), 404);
      await actAs("reviewer");
      await expectError(await reviewsRoute.POST(req("POST", { revisionId: step.revisionId, verdict: "vouch" }), params({ proofId, stepId: bad })), 404);
    }
    for (const token of ["", "short", "a".repeat(101), "../../etc/passwd-aaaaaaaaaaaaaaa", "a".repeat(43)]) {
      await expectError(await tokenRoute.GET(new Request("http://localhost/x"), params({ token })), 404);
    }
  });

  it("a diff query that names no two revisions is a 422, a revision that does not exist a 404", async () => {
    await actAs("reviewer");
    const diff = (query: string) => diffRoute.GET(new Request(`http://localhost/x${query}`), params({ proofId, stepId: String(step.id) }));
    for (const q of [
      "",
      "?from=abc&to=1",
      "?from=1&to=abc",
      "?from=-1&to=1",
      "?from=0&to=1",
      "?from=1.5&to=1",
      "?from=1&to=1e999",
      "?from=1&to=99999999999999999999",
      "?from=&to=",
      `?from=${"9".repeat(10_000)}&to=1`,
    ])
      expect((await expectError(await diff(q), 422)).code).toBe("invalid");
    await expectError(await diff("?from=1&to=4294967296"), 404);
    const wait = await stepClaimsRoute.POST(req("POST", { claims: [{}] }, "/x?wait=-99999999999999999999"), params({ proofId, stepId: String(step.id) }));
    await expectError(wait, 403); // a reviewer may not attach claims, whatever the query
  });
});

describe("ids of rows that belong to another proof", () => {
  it("are 404 in the path and 422 in the body, and nothing is written", async () => {
    const before = await rowCounts();
    const get = new Request("http://localhost/x");
    await actAs("author");
    await expectError(await caseRoute.PATCH(req("PATCH", { title: "Stolen" }), params({ proofId, caseId: String(other.caseId) })), 404);
    await expectError(await caseRoute.DELETE(req("DELETE", { confirm: true }), params({ proofId, caseId: String(other.caseId) })), 404);
    await expectError(await stepsRoute.POST(req("POST", { body: "S" }), params({ proofId, caseId: String(other.caseId) })), 404);
    await expectError(await casesRoute.POST(req("POST", { title: "C", parentId: other.caseId }), params({ proofId })), 422);
    await expectError(await caseRoute.PATCH(req("PATCH", { parentId: other.caseId, confirm: true }), params({ proofId, caseId: String(caseId) })), 422);
    await expectError(await stepRoute.GET(get, params({ proofId, stepId: String(other.step.id) })), 404);
    await expectError(
      await revisionsRoute.POST(req("POST", { baseRevisionId: other.step.revisionId, body: "S" }), params({ proofId, stepId: String(step.id) })),
      422,
    );
    await expectError(
      await revisionsRoute.POST(req("POST", { baseRevisionId: other.step.revisionId, body: "S" }), params({ proofId, stepId: String(other.step.id) })),
      404,
    );
    await expectError(await revisionRoute.GET(get, params({ proofId, stepId: String(other.step.id), number: "1" })), 404);
    await expectError(await diffRoute.GET(new Request("http://localhost/x?from=1&to=1"), params({ proofId, stepId: String(other.step.id) })), 404);
    await expectError(await stepClaimsRoute.GET(get, params({ proofId, stepId: String(other.step.id) })), 404);
    await expectError(
      await stepClaimsRoute.POST(
        req("POST", { claims: [{ format: "cairn-claim/1", kind: "spectral-radius-bound", graph: { format: "named", text: "path(3)" }, op: "<", bound: "2" }] }),
        params({ proofId, stepId: String(other.step.id) }),
      ),
      404,
    );
    await expectError(await claimRoute.GET(get, params({ proofId, claimId: String(other.claimId) })), 404);
    await expectError(await recheckRoute.POST(req("POST"), params({ proofId, claimId: String(other.claimId) })), 404);
    await expectError(await commentsRoute.POST(req("POST", { body: "Reply", parentId: other.commentId }), params({ proofId, stepId: String(step.id) })), 422);
    await expectError(await commentsRoute.POST(req("POST", { body: "Reply", reviewId: other.disputeId }), params({ proofId, stepId: String(step.id) })), 422);
    await expectError(await commentsRoute.GET(get, params({ proofId, stepId: String(other.step.id) })), 404);
    await expectError(await disputeRoute.POST(req("POST", { to: "answered", comment: "Fixed." }), params({ proofId, reviewId: String(other.disputeId) })), 404);
    await expectError(await disputeRoute.POST(req("POST", { to: "answered" }), params({ proofId, reviewId: String(approvalId) })), 404);
    await expectError(await invitationRoute.POST(req("POST"), params({ proofId, invitationId: String(other.invitationId) })), 404);
    await expectError(
      await invitationsRoute.POST(req("POST", { email: "someone@example.org", scope: "cases", caseIds: [other.caseId] }), params({ proofId })),
      422,
    );
    await expectError(await scopeRoute.DELETE(req("DELETE"), params({ proofId, userId: String(await userIdOf("outsider")) })), 404);
    await expectError(await exportRoute.GET(get, params({ proofId, exportId: String(other.exportId) })), 404);
    await actAs("reviewer");
    await expectError(
      await reviewsRoute.POST(req("POST", { revisionId: other.step.revisionId, verdict: "vouch" }), params({ proofId, stepId: String(step.id) })),
      422,
    );
    await expectError(
      await reviewsRoute.POST(req("POST", { revisionId: step.revisionId, verdict: "vouch" }), params({ proofId, stepId: String(other.step.id) })),
      404,
    );
    expect(await rowCounts()).toEqual(before);
  });
});

describe("long but valid input is not a server error", () => {
  it("inviting to a proof whose title is 300 characters long, by an inviter with a long name", async () => {
    await actAs("author");
    const title = `${"Trees of spectral radius at most 2 ".repeat(9)}`.slice(0, 299) + "∎";
    expect(title.length).toBe(300);
    const patched = await proofRoute.PATCH(req("PATCH", { title }), params({ proofId }));
    expect(patched.status).toBe(200);
    // The inviter's name comes from the session; names may be up to 120 characters long.
    const editorId = await userIdOf("editor");
    const longName = `Dov ${"Ashgrove-Longname ".repeat(7)}`.slice(0, 120);
    vi.mocked(getServerSession).mockResolvedValue({
      user: { id: String(editorId), name: longName, email: "dov.ashgrove@tarnhollow.example", role: "member", sessionVersion: 1 },
      expires: "2999-01-01",
    });
    const res = await invitationsRoute.POST(req("POST", { email: "long.title.invitee@example.org", scope: "proof" }), params({ proofId }));
    expect(res.status, await res.clone().text()).toBe(201);
    const { id } = await res.json();
    const inv = (await models().Invitation.findByPk(id))!;
    const mail = (await models().OutgoingMail.findByPk(inv.mailId!))!;
    expect(mail.subject.length).toBeLessThanOrEqual(300);
    expect(mail.subject).toContain("“Trees of spectral radius");
    expect(mail.subject.endsWith("…”")).toBe(true);
    expect(mail.textBody).toContain(title);
    expect(mail.textBody).toContain(longName);
  });
});
