/**
 * Fuzz of every route handler that reads a JSON body (issue 10, the suite): fast-check sends random and
 * mutated bodies (valid bodies with fields deleted, retyped or replaced, random JSON, random text, cut-off
 * JSON, prototype keys, wrong content types) as a member allowed to call the route. Each answer must be
 * below 500; each refusal (4xx) must carry the one error shape and leave the row count of every table
 * unchanged; a body that is not JSON or not sent as JSON must be refused (before the fix of defect 3 a
 * JSON body sent as text/plain was accepted). A mutated body that happens to be valid may be accepted
 * (2xx): the counts are then taken again.
 *
 * The routes are enumerated from the file tree (every app/**\/route.ts that calls readBody), so a new JSON
 * route without a fuzz target fails the first test. CAIRN_FUZZ_RUNS sets the bodies per target (default 60).
 */
import { readdirSync, readFileSync, statSync } from "node:fs";
import { join, relative } from "node:path";
import fc from "fast-check";
import { QueryTypes } from "sequelize";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";

vi.mock("next-auth", async (importOriginal) => ({ ...(await importOriginal<typeof import("next-auth")>()), getServerSession: vi.fn() }));

import bcrypt from "bcryptjs";
import { getServerSession } from "next-auth";
import { actAs, params, userIdOf } from "./helpers";
import { addCase, addStep, draftProof, dropProofs } from "./workspace-fixture";
import { closeSequelize, getSequelize } from "@/lib/db";
import { models } from "@/models";
import { verificationSettled } from "@/lib/data/claims";
import { createInvitation } from "@/lib/data/invitations";
import * as proofsRoute from "@/app/api/proofs/route";
import * as proofRoute from "@/app/api/proofs/[proofId]/route";
import * as casesRoute from "@/app/api/proofs/[proofId]/cases/route";
import * as caseRoute from "@/app/api/proofs/[proofId]/cases/[caseId]/route";
import * as stepsRoute from "@/app/api/proofs/[proofId]/cases/[caseId]/steps/route";
import * as stepRoute from "@/app/api/proofs/[proofId]/steps/[stepId]/route";
import * as revisionsRoute from "@/app/api/proofs/[proofId]/steps/[stepId]/revisions/route";
import * as stepClaimsRoute from "@/app/api/proofs/[proofId]/steps/[stepId]/claims/route";
import * as commentsRoute from "@/app/api/proofs/[proofId]/steps/[stepId]/comments/route";
import * as statementCommentsRoute from "@/app/api/proofs/[proofId]/statement/comments/route";
import * as conditionCommentsRoute from "@/app/api/proofs/[proofId]/cases/[caseId]/comments/route";
import * as changesRoute from "@/app/api/proofs/[proofId]/changes/route";
import * as reviewsRoute from "@/app/api/proofs/[proofId]/steps/[stepId]/reviews/route";
import * as disputeRoute from "@/app/api/proofs/[proofId]/disputes/[reviewId]/route";
import * as exportsRoute from "@/app/api/proofs/[proofId]/exports/route";
import * as invitationsRoute from "@/app/api/proofs/[proofId]/invitations/route";
import * as tokenRoute from "@/app/api/invitations/[token]/route";
import * as settingsRoute from "@/app/api/proofs/[proofId]/settings/route";
import * as scopeRoute from "@/app/api/proofs/[proofId]/settings/scopes/[userId]/route";
import * as policyRoute from "@/app/api/proofs/[proofId]/review-policy/route";
import * as roundsRoute from "@/app/api/proofs/[proofId]/rounds/route";
import * as reportRoute from "@/app/api/proofs/[proofId]/rounds/[round]/report/route";
import * as refereeRoute from "@/app/api/proofs/[proofId]/rounds/[round]/referees/[userId]/route";
import * as decisionRoute from "@/app/api/proofs/[proofId]/rounds/[round]/decision/route";
import * as notificationsRoute from "@/app/api/notifications/route";
import * as preferencesRoute from "@/app/api/notifications/preferences/route";
import * as passwordRoute from "@/app/api/account/password/route";
import * as ownerRoute from "@/app/api/proofs/[proofId]/owner/route";
import * as batchesRoute from "@/app/api/proofs/[proofId]/steps/[stepId]/batches/route";
import * as partUploadsRoute from "@/app/api/proofs/[proofId]/steps/[stepId]/uploads/route";

const RUNS = Number(process.env.CAIRN_FUZZ_RUNS ?? 60);
const ERROR_CODES = [
  "bad_request",
  "unauthenticated",
  "forbidden",
  "not_found",
  "conflict",
  "invalid",
  "too_large",
  "unsupported_media_type",
  "rate_limited",
  "unavailable",
];

type Call = (request: Request, context: { params: Promise<Record<string, string>> }) => Promise<Response>;
interface Target {
  /** The route file, relative to app/, and the method. */
  file: string;
  method: string;
  who: string | null;
  call: Call;
  params: () => Record<string, string>;
  /** A body the route accepts (mutations start from it). */
  valid: () => unknown;
}

/** Every route file under app/api that reads a JSON body, with the methods that do. */
function jsonRoutes(dir = "app/api"): string[] {
  return readdirSync(dir).flatMap((name) => {
    const path = join(dir, name);
    if (statSync(path).isDirectory()) return jsonRoutes(path);
    return name === "route.ts" && readFileSync(path, "utf8").includes("readBody(") ? [relative("app", path)] : [];
  });
}

let proofId: string;
let caseId: number;
let doomedCaseId: number;
let step: { id: number; revisionId: number };
let disputeId: number;
let reviewerId: number;
let token: string;
const FUZZ_USER = { email: "fuzz.account@tarnhollow.example", name: "Pia Quillfeather" };
let fuzzUserId: number;
const spectral = { format: "cairn-claim/1", kind: "spectral-radius-bound", graph: { format: "named", text: "path(3)" }, op: "<", bound: "2" };

const P = () => ({ proofId });
/** The value of each dynamic segment of a target's path (a target may give its own params instead). */
const segments = (): Record<string, string> => ({
  proofId,
  caseId: String(caseId),
  stepId: String(step.id),
  reviewId: String(disputeId),
  userId: String(reviewerId),
  round: "1",
  token,
});
/** A fuzz target: "METHOD path" of the route under app/api, who calls it, the handler, a body it accepts, and its params (by default, from the path). */
function target(route: string, who: string | null, call: unknown, valid: Target["valid"], params?: Target["params"]): Target {
  const [method, path] = route.split(" ");
  const names = [...path.matchAll(/\[(\w+)\]/g)].map((m) => m[1]);
  return {
    file: `api/${path}/route.ts`,
    method,
    who,
    call: call as Call,
    params: params ?? (() => Object.fromEntries(names.map((n) => [n, segments()[n]]))),
    valid,
  };
}
const TARGETS: Target[] = [
  target("POST proofs", "author", proofsRoute.POST, () => ({ title: "Fuzzed proof", statement: "All $x$." })),
  target("PATCH proofs/[proofId]", "author", proofRoute.PATCH, () => ({ title: "Fuzz target", statement: "A statement." })),
  target("POST proofs/[proofId]/cases", "author", casesRoute.POST, () => ({ title: "A case", condition: "$n > 2$", parentId: caseId })),
  target("PATCH proofs/[proofId]/cases/[caseId]", "author", caseRoute.PATCH, () => ({
    title: "Renamed",
    condition: "$n$ odd",
    predicate: JSON.stringify({ predicate: "max-degree", relation: "<=", value: 2 }),
  })),
  target(
    "DELETE proofs/[proofId]/cases/[caseId]",
    "author",
    caseRoute.DELETE,
    () => ({ confirm: false }),
    () => ({ proofId, caseId: String(doomedCaseId) }),
  ),
  target("POST proofs/[proofId]/cases/[caseId]/steps", "author", stepsRoute.POST, () => ({ body: "A new step." })),
  target("PATCH proofs/[proofId]/steps/[stepId]", "author", stepRoute.PATCH, () => ({ move: "up" })),
  target("POST proofs/[proofId]/steps/[stepId]/revisions", "author", revisionsRoute.POST, () => ({ baseRevisionId: step.revisionId, body: "Revised text." })),
  target("POST proofs/[proofId]/steps/[stepId]/claims", "author", stepClaimsRoute.POST, () => ({ claims: [spectral] })),
  // No graph list is uploaded to this step: every body ends in a 4xx (a missing file is a 404), never a 5xx.
  target("POST proofs/[proofId]/steps/[stepId]/batches", "author", batchesRoute.POST, () => ({ fileId: 2147483000, op: "<", bound: "sqrt(2+sqrt(5))" })),
  // Starting an upload in parts: a valid body makes an upload row (nothing stored until its parts are sent and it is finished).
  target("POST proofs/[proofId]/steps/[stepId]/uploads", "author", partUploadsRoute.POST, () => ({
    name: "trees-12.g6",
    size: 20000,
    sha256: "0".repeat(64),
    kind: "graph-list",
  })),
  target("POST proofs/[proofId]/steps/[stepId]/comments", "author", commentsRoute.POST, () => ({ body: "A comment." })),
  target("POST proofs/[proofId]/statement/comments", "reviewer", statementCommentsRoute.POST, () => ({ body: "Is $n \\ge 1$ meant?", parentId: null })),
  target("POST proofs/[proofId]/changes", "editor", changesRoute.POST, () => ({ through: new Date().toISOString() })),
  target("POST proofs/[proofId]/cases/[caseId]/comments", "author", conditionCommentsRoute.POST, () => ({
    body: "The condition reads $n > 2$.",
    parentId: null,
  })),
  target("POST proofs/[proofId]/steps/[stepId]/reviews", "reviewer", reviewsRoute.POST, () => ({
    revisionId: step.revisionId,
    verdict: "dispute",
    comment: "Why?",
  })),
  target("POST proofs/[proofId]/disputes/[reviewId]", "author", disputeRoute.POST, () => ({ to: "answered", comment: "Because." })),
  target("POST proofs/[proofId]/exports", "editor", exportsRoute.POST, () => ({ kind: "draft" })),
  target("POST proofs/[proofId]/invitations", "editor", invitationsRoute.POST, () => ({
    email: "fuzz.invitee@example.org",
    scope: "cases",
    caseIds: [caseId],
  })),
  target("PATCH proofs/[proofId]/settings", "editor", settingsRoute.PATCH, () => ({ requiredApprovals: 2 })),
  target("PUT proofs/[proofId]/settings/scopes/[userId]", "editor", scopeRoute.PUT, () => ({ caseIds: [caseId] })),
  target("PATCH proofs/[proofId]/review-policy", "editor", policyRoute.PATCH, () => ({ blind: false, remindBeforeDays: 3, remindAfterDays: 2 })),
  target("POST proofs/[proofId]/rounds", "editor", roundsRoute.POST, () => ({ dueAt: "2099-06-30" })),
  target("PUT proofs/[proofId]/rounds/[round]/report", "reviewer", reportRoute.PUT, () => ({
    body: "The report.",
    recommendation: "minor_revision",
    editorNote: "A note.",
  })),
  target("PATCH proofs/[proofId]/rounds/[round]/referees/[userId]", "editor", refereeRoute.PATCH, () => ({ dueAt: "2099-07-31" })),
  target("POST proofs/[proofId]/rounds/[round]/decision", "editor", decisionRoute.POST, () => ({
    decision: "minor_revision",
    letter: "Dear authors.",
    attachReports: true,
  })),
  target("POST notifications", "author", notificationsRoute.POST, () => ({ ids: [1, 2] })),
  target("PUT notifications/preferences", "author", preferencesRoute.PUT, () => ({ kind: "assigned", email: true })),
  target("POST invitations/[token]", null, tokenRoute.POST, () => ({ name: "Quin Ashby", password: "a long enough password" })),
  // Last: a valid body that names an author or editor hands the proof over.
  target("PUT proofs/[proofId]/owner", "author", ownerRoute.PUT, () => ({ userId: reviewerId })),
  target("POST account/password", FUZZ_USER.email, passwordRoute.POST, () => ({
    currentPassword: "not the password at all",
    newPassword: "another long password",
  })),
];

/** Row counts of every table a refused request could half-write (all of them, but the sign-in throttle, which counts failed password checks on purpose). */
async function rowCounts(): Promise<Record<string, number>> {
  const sq = getSequelize();
  const tables = (
    await sq.query<{ t: string }>(
      "SELECT table_name AS t FROM information_schema.tables WHERE table_schema = DATABASE() AND table_type = 'BASE TABLE' AND table_name NOT IN ('SequelizeMeta', 'sign_in_throttles') ORDER BY 1",
      { type: QueryTypes.SELECT },
    )
  ).map((r) => r.t);
  const [row] = await sq.query<Record<string, number>>(`SELECT ${tables.map((t) => `(SELECT COUNT(*) FROM \`${t}\`) AS \`${t}\``).join(", ")}`, {
    type: QueryTypes.SELECT,
  });
  return Object.fromEntries(Object.entries(row).map(([k, v]) => [k, Number(v)]));
}

// ---- bodies ----------------------------------------------------------------------------------------
const odd = fc.oneof(
  fc.constantFrom<unknown>(
    null,
    true,
    false,
    0,
    -1,
    1.5,
    2 ** 53,
    2 ** 60,
    -(2 ** 31),
    1e308,
    "",
    "   ",
    "0",
    "-1",
    "true",
    "null",
    "up",
    "x".repeat(70_000),
    [],
    {},
    [null],
    [[]],
    { "": 1 },
  ),
  fc.integer(),
  fc.double({ noNaN: true }),
  fc.string({ unit: "binary", maxLength: 40 }),
  fc.jsonValue({ maxDepth: 2 }),
);

/** Leaf paths of a valid body: ["title"], ["claims", 0, "graph", "text"], … */
function paths(value: unknown, prefix: Array<string | number> = []): Array<Array<string | number>> {
  if (Array.isArray(value)) return [prefix, ...value.flatMap((v, i) => paths(v, [...prefix, i]))];
  if (value && typeof value === "object") return [...(prefix.length ? [prefix] : []), ...Object.entries(value).flatMap(([k, v]) => paths(v, [...prefix, k]))];
  return [prefix];
}

function mutate(valid: unknown, edits: Array<{ path: Array<string | number>; op: "set" | "delete" | "wrap"; value: unknown }>): unknown {
  const body = structuredClone(valid);
  for (const { path, op, value } of edits) {
    if (path.length === 0) continue;
    let parent = body as Record<string | number, unknown>;
    for (const key of path.slice(0, -1)) {
      if (!parent || typeof parent !== "object") break;
      parent = parent[key] as Record<string | number, unknown>;
    }
    if (!parent || typeof parent !== "object") continue;
    const last = path.at(-1)!;
    if (op === "delete") delete parent[last];
    else if (op === "wrap") parent[last] = [parent[last]];
    else parent[last] = value;
  }
  return body;
}

/** `refuse`: a body no route may accept whatever its state (not JSON, or not sent as JSON). */
interface Body {
  text: string;
  type: string;
  refuse?: boolean;
}
function bodies(valid: unknown): fc.Arbitrary<Body> {
  const leafs = [...paths(valid), ["unexpected"], ["__proto__"]];
  const edit = fc.record({
    path: fc.constantFrom(...leafs),
    op: fc.constantFrom("set" as const, "set" as const, "delete" as const, "wrap" as const),
    value: odd,
  });
  const json = (text: string): Body => ({ text, type: "application/json" });
  const validText = JSON.stringify(valid);
  return fc.oneof(
    { weight: 6, arbitrary: fc.array(edit, { minLength: 1, maxLength: 3 }).map((edits) => json(JSON.stringify(mutate(valid, edits)))) },
    { weight: 2, arbitrary: fc.jsonValue({ maxDepth: 3 }).map((v) => json(JSON.stringify(v))) },
    { weight: 1, arbitrary: fc.string({ unit: "binary", maxLength: 300 }).map(json) },
    { weight: 1, arbitrary: fc.nat({ max: Math.max(0, validText.length - 1) }).map((n) => ({ ...json(validText.slice(0, n)), refuse: true })) },
    {
      weight: 1,
      arbitrary: fc
        .constantFrom(
          `{"__proto__":{"admin":true},"constructor":{"prototype":{"x":1}}}`,
          `${validText.slice(0, -1)},"__proto__":{"role":"admin"}}`,
          `[${validText}]`,
          `${validText}${validText}`,
          "\uFEFF" + validText,
        )
        .map(json),
    },
    {
      weight: 1,
      arbitrary: fc
        .constantFrom("text/plain", "", "application/x-www-form-urlencoded", "multipart/form-data; boundary=x", "application/jsonx", "text/json")
        .map((type) => ({ text: validText, type, refuse: true })),
    },
  );
}

// ---- checks ---------------------------------------------------------------------------------------
const tally = { requests: 0, refused: 0, accepted: 0, statuses: {} as Record<number, number> };

function assertErrorShape(status: number, text: string, where: string) {
  let body: unknown;
  try {
    body = JSON.parse(text);
  } catch {
    throw new Error(`${where}: ${status} with a body that is not JSON: ${text.slice(0, 200)}`);
  }
  expect(Object.keys(body as object), where).toEqual(["error"]);
  const error = (body as { error: { code: unknown; message: unknown; issues?: unknown } }).error;
  expect(ERROR_CODES, `${where}: ${text.slice(0, 300)}`).toContain(error.code);
  expect(typeof error.message === "string" && error.message.length > 10, where).toBe(true);
  expect(error.message as string, where).not.toMatch(/sequelize|SqlError|\bSQL\b|TypeError|undefined|\n\s+at /);
  if (error.issues !== undefined)
    for (const issue of error.issues as Array<{ path: unknown; message: unknown }>)
      expect(typeof issue.path === "string" && typeof issue.message === "string", where).toBe(true);
}

async function settleClaims(text: string) {
  const claims = (JSON.parse(text) as { claims?: Array<{ id: number }> }).claims ?? [];
  for (const c of claims) await verificationSettled(c.id);
}

beforeAll(async () => {
  proofId = await draftProof("Fuzz target");
  reviewerId = await userIdOf("reviewer");
  await models().ProofMember.create({ proofId: Number(proofId), userId: await userIdOf("editor"), role: "editor" });
  caseId = await addCase(proofId, "Fuzzed case");
  doomedCaseId = await addCase(proofId, "A case with a step, deleted only when confirmed");
  await addStep(proofId, doomedCaseId, "Keeps the case from going without a confirmation.");
  step = await addStep(proofId, caseId, "Let $T$ be a tree. Then $\\rho(T) < 2$.");
  await addStep(proofId, caseId, "A second step, so that moves have somewhere to go.");
  await actAs("reviewer");
  const dispute = await reviewsRoute.POST(
    new Request("http://localhost/x", {
      method: "POST",
      headers: { "content-type": "application/json" },
      body: JSON.stringify({ revisionId: step.revisionId, verdict: "dispute", comment: "Why $< 2$?" }),
    }),
    params({ proofId, stepId: String(step.id) }),
  );
  expect(dispute.status).toBe(201);
  disputeId = (await dispute.json()).reviewId;
  await actAs("editor");
  const round = await roundsRoute.POST(
    new Request("http://localhost/x", { method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify({ dueAt: "2099-05-31" }) }),
    params({ proofId }),
  );
  expect(round.status).toBe(201);
  const editor = { id: await userIdOf("editor"), name: "Editor", email: "e@example.org", role: "member" as const };
  token = (await createInvitation(Number(proofId), editor, { email: "fuzz.accept@example.org", scope: "proof", role: "reviewer" })).token;
  await models().User.destroy({ where: { email: FUZZ_USER.email } });
  fuzzUserId = (await models().User.create({ ...FUZZ_USER, passwordHash: await bcrypt.hash("the fuzz user's password", 4) })).id;
});

afterAll(async () => {
  console.log(
    `[fuzz] ${tally.requests} requests on ${TARGETS.length} JSON routes: ${tally.refused} refused (4xx), ${tally.accepted} accepted; statuses ${JSON.stringify(tally.statuses)}`,
  );
  await dropProofs([proofId]);
  await models().User.destroy({ where: { id: fuzzUserId } });
  await models().Invitation.destroy({ where: { email: "fuzz.accept@example.org" } });
  await closeSequelize();
});

async function actAsTarget(who: string | null) {
  if (who === null || !who.includes("@")) return actAs(who);
  const u = (await models().User.findOne({ where: { email: who } }))!;
  vi.mocked(getServerSession).mockResolvedValue({
    user: { id: String(u.id), name: u.name, email: u.email, role: u.role, sessionVersion: u.sessionVersion },
    expires: "2999-01-01",
  });
}

describe("fuzz of the JSON routes", () => {
  it("has a target for every route handler that reads a JSON body", () => {
    const covered = new Set(TARGETS.map((t) => t.file));
    expect(jsonRoutes().filter((f) => !covered.has(f))).toEqual([]);
  });

  for (const target of TARGETS) {
    it(`${target.method} ${target.file}: never 5xx; refusals have the one error shape and change no row`, async () => {
      await actAsTarget(target.who);
      let before = await rowCounts();
      await fc.assert(
        fc.asyncProperty(bodies(target.valid()), async (body) => {
          const where = `${target.method} ${target.file} with ${body.type || "no type"} ${JSON.stringify(body.text.slice(0, 200))}`;
          const request = new Request(`http://localhost/api/${target.file}`, {
            method: target.method,
            headers: body.type ? { "content-type": body.type } : {},
            body: body.text,
          });
          const res = await target.call(request, params(target.params()));
          const text = await res.text();
          tally.requests++;
          tally.statuses[res.status] = (tally.statuses[res.status] ?? 0) + 1;
          expect(res.status, `${where} → ${text.slice(0, 300)}`).toBeLessThan(500);
          if (body.refuse) expect(res.status, `${where} must be refused → ${text.slice(0, 300)}`).toBeGreaterThanOrEqual(400);
          if (res.status >= 400) {
            tally.refused++;
            assertErrorShape(res.status, text, where);
            expect(await rowCounts(), `${where} → ${res.status} changed rows`).toEqual(before);
          } else {
            tally.accepted++;
            if (target.call === stepClaimsRoute.POST) await settleClaims(text);
            before = await rowCounts();
          }
        }),
        { numRuns: RUNS },
      );
    }, 300_000);
  }
});
