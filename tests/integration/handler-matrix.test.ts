/// <reference types="vite/client" />
/**
 * The permission matrix of the route handlers and server actions (issue 10, the suite), generated from the
 * file tree: every exported method of every app/**\/route.ts and every exported function of every server
 * action file ("use server") × the nine standings (anonymous, signed in without any proof, member of another
 * proof only, site admin, case-limited referee, referee, co-author, owner, editor). The expected outcome of
 * every cell is in EXPECTED below, one table; a handler or action that appears in the file tree without a row
 * fails the first test. The pages have their own matrix (tests/e2e/access-matrix.test.ts).
 *
 * How a cell is run. Handlers are called directly with a Request, as the other integration tests do, and with
 * next-auth's getServerSession mocked to the standing's person (with their current session version): every
 * access decision after that (membership, role, owner, case scope) is read from MariaDB by the handler itself
 * through lib/access, exactly as in production. A state-changing call sends a JSON body no schema accepts (a bare
 * string), so a standing that passes the access check gets a 400 from validation and nothing is written; the
 * access refusals (401, 403, 404) all come before the body is read (lib/access: 401 → 404 → 403 → body).
 * Handlers without a body (cancel, restore, recheck, remove, submit, …) do act for an allowed standing; the
 * fixture proof is then built afresh before the next cell.
 *
 * The server action is called as an exported function with the same mocked session, not over HTTP by its
 * Next action id: Next's action endpoint only decodes the arguments and calls this very function, and the
 * access check (proofAccess in lib/access) is inside the function, so the direct call runs every line of the
 * check that a forged POST with the action id would reach, without depending on a build's action manifest.
 *
 * Outcomes: "ok" = past the access check (any status below 500 other than 401/403/404: 2xx, or 400/409/422 from
 * the body or the state); 401, 403, 404 = refused with that status; "skip" = not run here (next-auth's own
 * endpoints, which answer everyone by design and are driven through a browser in tests/e2e/sign-in.test.ts
 * and tests/e2e/session-end.test.ts).
 */
import { readdirSync, readFileSync, statSync } from "node:fs";
import { join, relative } from "node:path";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";

vi.mock("next-auth", async (importOriginal) => ({ ...(await importOriginal<typeof import("next-auth")>()), getServerSession: vi.fn() }));
// revalidatePath needs a running Next server; the action's access check runs before it.
vi.mock("next/cache", async (importOriginal) => ({ ...(await importOriginal<typeof import("next/cache")>()), revalidatePath: vi.fn() }));

import bcrypt from "bcryptjs";
import { getServerSession } from "next-auth";
import { actAs, jsonRequest, params, userIdOf } from "./helpers";
import { addCase, addStep, draftProof, dropProofs } from "./workspace-fixture";
import { closeSequelize } from "@/lib/db";
import { closeQueue } from "@/lib/jobs/queue";
import { models } from "@/models";
import { ACCESS } from "@/lib/access/rules";
import { createInvitation } from "@/lib/data/invitations";
import { unauthenticated } from "@/lib/errors";

const ROLES = ["anonymous", "nonmember", "otherProof", "admin", "caseLimited", "reviewer", "coauthor", "owner", "editor"] as const;
type Role = (typeof ROLES)[number];
type Outcome = "ok" | 401 | 403 | 404 | "skip";

// ---- the table ------------------------------------------------------------------------------------------
const row = (o: Outcome, over: Partial<Record<Role, Outcome>> = {}) => ({
  ...(Object.fromEntries(ROLES.map((r) => [r, o])) as Record<Role, Outcome>),
  ...over,
});
/** Anyone, signed in or not. */
const PUBLIC = row("ok");
/** Any signed-in person; nothing of a proof. */
const SIGNED_IN = row("ok", { anonymous: 401 });
/** The proof's members whose proof role is among `roles`; `owner` also when the owner rule of lib/access/rules.ts says so. */
function members(roles: Array<"author" | "reviewer" | "editor">, opts: { owner?: boolean; caseLimited?: Outcome } = {}): Record<Role, Outcome> {
  const r = (role: "author" | "reviewer" | "editor"): Outcome => (roles.includes(role) ? "ok" : 403);
  return {
    anonymous: 401,
    nonmember: 403,
    otherProof: 403,
    admin: 403,
    caseLimited: opts.caseLimited ?? r("reviewer"),
    reviewer: r("reviewer"),
    coauthor: r("author"),
    owner: opts.owner || roles.includes("author") ? "ok" : 403,
    editor: r("editor"),
  };
}
const ALL_MEMBERS = members(["author", "reviewer", "editor"]);
const AUTHORS = members(["author"]);
/** The whole proof (exports): a case-limited referee is refused. */
const WHOLE_PROOF = members(["author", "reviewer", "editor"], { caseLimited: 403 });

/**
 * The one table: "METHOD route file" (relative to app/) and "action file#export" → outcome per standing.
 * Case, step and claim routes are called on a case or step inside the case-limited referee's case; the out-of-scope
 * answers are in OUT_OF_SCOPE below.
 */
const EXPECTED: Record<string, Record<Role, Outcome>> = {
  "GET api/auth/[...nextauth]/route.ts": row("skip"),
  "POST api/auth/[...nextauth]/route.ts": row("skip"),
  "GET api/health/route.ts": PUBLIC,
  "POST api/account/password/route.ts": SIGNED_IN,
  "GET api/invitations/[token]/route.ts": PUBLIC,
  "POST api/invitations/[token]/route.ts": PUBLIC,
  "GET api/notifications/route.ts": SIGNED_IN,
  "POST api/notifications/route.ts": SIGNED_IN,
  "GET api/notifications/preferences/route.ts": SIGNED_IN,
  "PUT api/notifications/preferences/route.ts": SIGNED_IN,
  "GET api/proofs/route.ts": SIGNED_IN,
  "POST api/proofs/route.ts": SIGNED_IN,
  "GET api/proofs/[proofId]/route.ts": ALL_MEMBERS,
  "PATCH api/proofs/[proofId]/route.ts": AUTHORS,
  "GET api/proofs/[proofId]/cases/route.ts": ALL_MEMBERS,
  "POST api/proofs/[proofId]/cases/route.ts": AUTHORS,
  "PATCH api/proofs/[proofId]/cases/[caseId]/route.ts": AUTHORS,
  "DELETE api/proofs/[proofId]/cases/[caseId]/route.ts": AUTHORS,
  "POST api/proofs/[proofId]/cases/[caseId]/restore/route.ts": AUTHORS,
  "POST api/proofs/[proofId]/cases/[caseId]/steps/route.ts": AUTHORS,
  "GET api/proofs/[proofId]/cases/[caseId]/comments/route.ts": ALL_MEMBERS,
  "POST api/proofs/[proofId]/cases/[caseId]/comments/route.ts": ALL_MEMBERS,
  // The statement belongs to the whole proof: a case-limited referee neither reads nor writes its comments.
  "GET api/proofs/[proofId]/statement/comments/route.ts": WHOLE_PROOF,
  "POST api/proofs/[proofId]/statement/comments/route.ts": WHOLE_PROOF,
  // What changed since the member's last visit (a case-limited referee: her cases only), and "mark as seen".
  "GET api/proofs/[proofId]/changes/route.ts": ALL_MEMBERS,
  "POST api/proofs/[proofId]/changes/route.ts": ALL_MEMBERS,
  "GET api/proofs/[proofId]/steps/[stepId]/route.ts": ALL_MEMBERS,
  "PATCH api/proofs/[proofId]/steps/[stepId]/route.ts": AUTHORS,
  "GET api/proofs/[proofId]/steps/[stepId]/revisions/route.ts": ALL_MEMBERS,
  "POST api/proofs/[proofId]/steps/[stepId]/revisions/route.ts": AUTHORS,
  "GET api/proofs/[proofId]/steps/[stepId]/revisions/[number]/route.ts": ALL_MEMBERS,
  "GET api/proofs/[proofId]/steps/[stepId]/diff/route.ts": ALL_MEMBERS,
  "GET api/proofs/[proofId]/steps/[stepId]/claims/route.ts": ALL_MEMBERS,
  "POST api/proofs/[proofId]/steps/[stepId]/claims/route.ts": AUTHORS,
  "GET api/proofs/[proofId]/steps/[stepId]/comments/route.ts": ALL_MEMBERS,
  "POST api/proofs/[proofId]/steps/[stepId]/comments/route.ts": ALL_MEMBERS,
  "GET api/proofs/[proofId]/steps/[stepId]/reviews/route.ts": ALL_MEMBERS,
  "POST api/proofs/[proofId]/steps/[stepId]/reviews/route.ts": members(["reviewer"]),
  "GET api/proofs/[proofId]/steps/[stepId]/files/route.ts": ALL_MEMBERS,
  "POST api/proofs/[proofId]/steps/[stepId]/files/route.ts": AUTHORS,
  // Files of a claim: read like the files of its step, uploaded by its uploaders.
  // Attaching the claims of an uploaded claims file (the fixture's file is a graph list: 422 past the access check).
  "POST api/proofs/[proofId]/files/[fileId]/claims/route.ts": AUTHORS,
  "GET api/proofs/[proofId]/claims/[claimId]/files/route.ts": ALL_MEMBERS,
  "POST api/proofs/[proofId]/claims/[claimId]/files/route.ts": AUTHORS,
  // Uploads in parts: the uploaders only (authors and the owner), like a one-request upload.
  "POST api/proofs/[proofId]/steps/[stepId]/uploads/route.ts": AUTHORS,
  "GET api/proofs/[proofId]/steps/[stepId]/uploads/[uploadId]/route.ts": AUTHORS,
  "DELETE api/proofs/[proofId]/steps/[stepId]/uploads/[uploadId]/route.ts": AUTHORS,
  "PUT api/proofs/[proofId]/steps/[stepId]/uploads/[uploadId]/parts/[part]/route.ts": AUTHORS,
  "POST api/proofs/[proofId]/steps/[stepId]/uploads/[uploadId]/finish/route.ts": AUTHORS,
  "GET api/proofs/[proofId]/steps/[stepId]/batches/route.ts": ALL_MEMBERS,
  "POST api/proofs/[proofId]/steps/[stepId]/batches/route.ts": AUTHORS,
  "GET api/proofs/[proofId]/batches/[batchId]/route.ts": ALL_MEMBERS,
  "GET api/proofs/[proofId]/batches/[batchId]/results/route.ts": ALL_MEMBERS,
  "POST api/proofs/[proofId]/batches/[batchId]/cancel/route.ts": AUTHORS,
  "GET api/proofs/[proofId]/claims/route.ts": ALL_MEMBERS,
  "GET api/proofs/[proofId]/claims/[claimId]/route.ts": ALL_MEMBERS,
  "DELETE api/proofs/[proofId]/claims/[claimId]/route.ts": AUTHORS,
  "GET api/proofs/[proofId]/claims/[claimId]/input/route.ts": ALL_MEMBERS,
  "POST api/proofs/[proofId]/claims/[claimId]/cancel/route.ts": members(["author", "editor"]),
  "POST api/proofs/[proofId]/claims/[claimId]/recheck/route.ts": members(["author", "editor"]),
  "GET api/proofs/[proofId]/files/[fileId]/route.ts": ALL_MEMBERS,
  "GET api/proofs/[proofId]/disputes/route.ts": ALL_MEMBERS,
  "POST api/proofs/[proofId]/disputes/[reviewId]/route.ts": ALL_MEMBERS,
  "GET api/proofs/[proofId]/desk/route.ts": members(["editor"]),
  "GET api/proofs/[proofId]/exports/route.ts": WHOLE_PROOF,
  "POST api/proofs/[proofId]/exports/route.ts": members(["author", "editor"]),
  // The offline checker script is the same for every proof and holds none of its text: any member, in scope or not.
  "GET api/proofs/[proofId]/exports/checker/route.ts": ALL_MEMBERS,
  "GET api/proofs/[proofId]/exports/[exportId]/route.ts": WHOLE_PROOF,
  "GET api/proofs/[proofId]/exports/[exportId]/archive/route.ts": WHOLE_PROOF,
  "GET api/proofs/[proofId]/exports/[exportId]/bundle/route.ts": WHOLE_PROOF,
  "GET api/proofs/[proofId]/exports/[exportId]/pdf/route.ts": WHOLE_PROOF,
  "GET api/proofs/[proofId]/exports/[exportId]/tex/route.ts": WHOLE_PROOF,
  // The invitations a member may manage: a referee invites no one.
  "GET api/proofs/[proofId]/invitations/route.ts": members(["author", "editor"], { owner: true }),
  "POST api/proofs/[proofId]/invitations/route.ts": members(["author", "editor"], { owner: true }),
  "POST api/proofs/[proofId]/invitations/[invitationId]/route.ts": members(["editor"], { owner: true }),
  "DELETE api/proofs/[proofId]/invitations/[invitationId]/route.ts": members(["editor"], { owner: true }),
  "DELETE api/proofs/[proofId]/members/[userId]/route.ts": members(["editor"], { owner: true }),
  "PUT api/proofs/[proofId]/owner/route.ts": members([], { owner: true }),
  "GET api/proofs/[proofId]/settings/route.ts": ALL_MEMBERS,
  "PATCH api/proofs/[proofId]/settings/route.ts": members(["editor"], { owner: true }),
  "PUT api/proofs/[proofId]/settings/scopes/[userId]/route.ts": members(["editor"], { owner: true }),
  "DELETE api/proofs/[proofId]/settings/scopes/[userId]/route.ts": members(["editor"], { owner: true }),
  // Blind review and reminders: editors only (an owning author does not set how their own proof is refereed).
  "PATCH api/proofs/[proofId]/review-policy/route.ts": members(["editor"]),
  "GET api/proofs/[proofId]/rounds/route.ts": ALL_MEMBERS,
  "POST api/proofs/[proofId]/rounds/route.ts": members(["editor"]),
  "GET api/proofs/[proofId]/rounds/[round]/route.ts": ALL_MEMBERS,
  "POST api/proofs/[proofId]/rounds/[round]/decision/route.ts": members(["editor"]),
  "PATCH api/proofs/[proofId]/rounds/[round]/referees/[userId]/route.ts": members(["editor"]),
  "PUT api/proofs/[proofId]/rounds/[round]/report/route.ts": members(["reviewer"]),
  "POST api/proofs/[proofId]/rounds/[round]/report/submit/route.ts": members(["reviewer"]),
  "POST api/proofs/[proofId]/rounds/[round]/report/corrections/route.ts": members(["reviewer"]),
  // The editors and the report's own referee (the fixture's submitted report is the demo referee's).
  "GET api/proofs/[proofId]/rounds/[round]/reports/[reportId]/note/route.ts": { ...members(["editor"]), reviewer: "ok" },
  "action (workspace)/proofs/[proofId]/export/actions.ts#createExportAction": members(["author", "editor"], { caseLimited: 403 }),
};

/** The case and step routes again, on a case or step outside the case-limited referee's case: she is refused (403), everyone else as above. */
const OUT_OF_SCOPE = Object.keys(EXPECTED).filter((k) => /\[caseId\]|\[stepId\]|\[claimId\]|\[fileId\]|\[batchId\]/.test(k) && !k.startsWith("action"));

// ---- the file tree ----------------------------------------------------------------------------------------
const METHODS = ["GET", "HEAD", "POST", "PUT", "PATCH", "DELETE", "OPTIONS"];

function walk(dir: string, keep: (path: string) => boolean): string[] {
  return readdirSync(dir).flatMap((name) => {
    const path = join(dir, name);
    if (statSync(path).isDirectory()) return walk(path, keep);
    return keep(path) ? [path] : [];
  });
}

/** "METHOD file" for every method a route file exports, whether as `export const GET`, `export async function GET` or `export { handler as GET }`. */
function handlersInTree(): string[] {
  return walk("app", (p) => p.endsWith("/route.ts")).flatMap((path) => {
    const src = readFileSync(path, "utf8");
    const found = new Set<string>();
    for (const m of src.matchAll(/export\s+(?:const|async\s+function|function)\s+([A-Z]+)\b/g)) found.add(m[1]);
    for (const block of src.matchAll(/export\s*\{([^}]*)\}/g)) for (const m of block[1].matchAll(/as\s+([A-Z]+)\b/g)) found.add(m[1]);
    return [...found].filter((m) => METHODS.includes(m)).map((m) => `${m} ${relative("app", path)}`);
  });
}

/** "action file#name" for every exported function of every server action file. */
function actionsInTree(): string[] {
  return walk("app", (p) => /\.tsx?$/.test(p) && /^\s*["']use server["']/.test(readFileSync(p, "utf8"))).flatMap((path) =>
    [...readFileSync(path, "utf8").matchAll(/export\s+(?:async\s+)?function\s+(\w+)/g)].map((m) => `action ${relative("app", path)}#${m[1]}`),
  );
}

const routeModules = import.meta.glob("/app/**/route.ts");
const actionModules = import.meta.glob("/app/**/actions.ts");

// ---- the people and the proof -----------------------------------------------------------------------------
const ADDED = {
  nonmember: { name: "Ivo Lindqvist", email: "ivo.lindqvist.matrix@tarnhollow.example" },
  caseLimited: { name: "Wren Halloway", email: "wren.halloway.matrix@tarnhollow.example" },
  leaver: { name: "Tamsin Orrel", email: "tamsin.orrel.matrix@tarnhollow.example" },
};
const people = {} as Record<Exclude<Role, "anonymous"> | "leaver", number>;
const madeProofs: string[] = [];

interface Fixture {
  proofId: string;
  caseIn: number;
  caseOut: number;
  stepIn: number;
  stepOut: number;
  claimIn: number;
  claimOut: number;
  fileIn: number;
  fileOut: number;
  batchIn: number;
  batchOut: number;
  uploadIn: number;
  uploadOut: number;
  exportId: number;
  reviewId: number;
  invitationId: number;
  token: string;
  reportId: number;
}
let fx: Fixture | null = null;

async function as(role: Role | "leaver"): Promise<void> {
  if (role === "anonymous") {
    await actAs(null);
    return;
  }
  const u = (await models().User.findByPk(people[role]))!;
  vi.mocked(getServerSession).mockResolvedValue({
    user: { id: String(u.id), name: u.name, email: u.email, role: u.role, sessionVersion: u.sessionVersion },
    expires: "2999-01-01",
  });
}

async function ok(res: Response, what: string): Promise<Record<string, unknown>> {
  if (res.status >= 300) throw new Error(`fixture: ${what} answered ${res.status} ${await res.text()}`);
  return (await res.json()) as Record<string, unknown>;
}

async function load(file: string) {
  const mod = await routeModules[`/app/${file}`]();
  return mod as Record<string, (request: Request, context: { params: Promise<Record<string, string>> }) => Promise<Response>>;
}

/** A fresh proof with everything the routes name: cases in and out of the case-limited referee's scope, steps, claims, files, batches, an export, a dispute, an invitation, a round with a report. */
async function buildFixture(): Promise<Fixture> {
  const proofId = await draftProof(`Handler matrix ${Date.now()}`);
  madeProofs.push(proofId);
  const pid = Number(proofId);
  const { ProofMember, ReviewerScope } = models();
  await ProofMember.bulkCreate([
    { proofId: pid, userId: people.coauthor, role: "author" },
    { proofId: pid, userId: people.editor, role: "editor" },
    { proofId: pid, userId: people.caseLimited, role: "reviewer" },
    { proofId: pid, userId: people.leaver, role: "reviewer" },
  ]);
  const caseIn = await addCase(proofId, "Matrix case in scope");
  const caseOut = await addCase(proofId, "Matrix case out of scope");
  await ReviewerScope.create({ proofId: pid, userId: people.caseLimited, caseId: caseIn });
  const stepIn = await addStep(proofId, caseIn, "Every leg has length at most $2$.");
  const stepOut = await addStep(proofId, caseOut, "The tree has at most one vertex of degree $3$.");

  await actAs("author");
  const claims = await load("api/proofs/[proofId]/steps/[stepId]/claims/route.ts");
  const claim = { format: "cairn-claim/1", kind: "spectral-radius-bound", graph: { format: "named", text: "path(3)" }, op: "<", bound: "2" };
  const claimOf = async (stepId: number) =>
    (
      (await ok(await claims.POST(jsonRequest("/x", "POST", { claims: [claim] }), params({ proofId, stepId: String(stepId) })), "claim")).claims as Array<{
        id: number;
      }>
    )[0].id;
  const files = await load("api/proofs/[proofId]/steps/[stepId]/files/route.ts");
  const upload = async (stepId: number) =>
    (
      (
        await ok(
          await files.POST(
            new Request("http://localhost/x?name=two-paths.g6", { method: "POST", body: "Bg\nCh\n" }),
            params({ proofId, stepId: String(stepId) }),
          ),
          "upload",
        )
      ).file as { id: number }
    ).id;
  const batches = await load("api/proofs/[proofId]/steps/[stepId]/batches/route.ts");
  const batchOf = async (stepId: number, fileId: number) =>
    (
      (await ok(await batches.POST(jsonRequest("/x", "POST", { fileId, op: "<", bound: "2" }), params({ proofId, stepId: String(stepId) })), "batch"))
        .batch as { id: number }
    ).id;
  const claimIn = await claimOf(stepIn.id);
  const claimOut = await claimOf(stepOut.id);
  const fileIn = await upload(stepIn.id);
  const fileOut = await upload(stepOut.id);
  const batchIn = await batchOf(stepIn.id, fileIn);
  const batchOut = await batchOf(stepOut.id, fileOut);
  // An upload in parts of 10 bytes (one part), started and never sent.
  const starts = await load("api/proofs/[proofId]/steps/[stepId]/uploads/route.ts");
  const uploadOf = async (stepId: number) =>
    (
      (await ok(await starts.POST(jsonRequest("/x", "POST", { name: "later.g6", size: 10 }), params({ proofId, stepId: String(stepId) })), "upload in parts"))
        .upload as { id: number }
    ).id;
  const uploadIn = await uploadOf(stepIn.id);
  const uploadOut = await uploadOf(stepOut.id);

  // Attaching claims made a new revision of each step: the dispute is on the latest.
  const latest = (await models().StepRevision.findOne({ where: { stepId: stepIn.id }, order: [["number", "DESC"]] }))!;
  await as("reviewer");
  const reviews = await load("api/proofs/[proofId]/steps/[stepId]/reviews/route.ts");
  const dispute = await ok(
    await reviews.POST(
      jsonRequest("/x", "POST", { revisionId: latest.id, verdict: "dispute", comment: "Why at most $2$?" }),
      params({ proofId, stepId: String(stepIn.id) }),
    ),
    "dispute",
  );

  await as("editor");
  const exportsRoute = await load("api/proofs/[proofId]/exports/route.ts");
  const made = await ok(await exportsRoute.POST(jsonRequest("/x", "POST", { kind: "draft" }), params({ proofId })), "export");
  const invitations = await load("api/proofs/[proofId]/invitations/route.ts");
  const invited = await ok(
    await invitations.POST(
      jsonRequest("/x", "POST", { email: `matrix.invitee.${Date.now()}@example.org`, scope: "proof", role: "reviewer" }),
      params({ proofId }),
    ),
    "invitation",
  );
  const rounds = await load("api/proofs/[proofId]/rounds/route.ts");
  await ok(await rounds.POST(jsonRequest("/x", "POST", { dueAt: "2099-05-31" }), params({ proofId })), "round");
  const editor = { id: people.editor, name: "Editor", email: "e@example.org", role: "member" as const };
  const { token } = await createInvitation(pid, editor, { email: `matrix.token.${Date.now()}@example.org`, scope: "proof", role: "reviewer" });

  await as("reviewer");
  const report = await load("api/proofs/[proofId]/rounds/[round]/report/route.ts");
  const saved = await ok(
    await report.PUT(
      jsonRequest("/x", "PUT", { body: "The report.", recommendation: "minor_revision", editorNote: "A note." }),
      params({ proofId, round: "1" }),
    ),
    "report",
  );
  const submit = await load("api/proofs/[proofId]/rounds/[round]/report/submit/route.ts");
  await ok(await submit.POST(new Request("http://localhost/x", { method: "POST" }), params({ proofId, round: "1" })), "report submission");
  return {
    proofId,
    caseIn,
    caseOut,
    stepIn: stepIn.id,
    stepOut: stepOut.id,
    claimIn,
    claimOut,
    fileIn,
    fileOut,
    batchIn,
    batchOut,
    uploadIn,
    uploadOut,
    exportId: (made.export as { id: number }).id,
    reviewId: dispute.reviewId as number,
    invitationId: invited.id as number,
    token,
    reportId: (saved.report as { id: number }).id,
  };
}

/** The route parameters of a cell; `out` puts the step, claim, file and batch outside the case-limited referee's scope. */
function paramsFor(file: string, f: Fixture, out: boolean): Record<string, string> {
  const all: Record<string, string> = {
    proofId: f.proofId,
    caseId: String(out ? f.caseOut : f.caseIn),
    stepId: String(out ? f.stepOut : f.stepIn),
    claimId: String(out ? f.claimOut : f.claimIn),
    fileId: String(out ? f.fileOut : f.fileIn),
    batchId: String(out ? f.batchOut : f.batchIn),
    uploadId: String(out ? f.uploadOut : f.uploadIn),
    part: "1",
    exportId: String(f.exportId),
    reviewId: String(f.reviewId),
    invitationId: String(f.invitationId),
    token: f.token,
    reportId: String(f.reportId),
    round: "1",
    number: "1",
    // The member a DELETE removes is a referee of this proof only; the referee-scope and due-date routes name the referees.
    userId: String(file.includes("/members/") ? people.leaver : file.includes("/scopes/") ? people.caseLimited : people.reviewer),
  };
  return Object.fromEntries([...file.matchAll(/\[(\w+)\]/g)].map(([, k]) => [k, all[k]]));
}

const ACCESS_REFUSALS = new Set([...Object.values(ACCESS).map((r) => r.refusal), "You are not a member of this proof."]);

/** One cell: the outcome, and whether it changed state (so that the fixture is rebuilt before the next cell). */
async function runCell(key: string, role: Role, f: Fixture, out: boolean): Promise<{ got: Outcome | string; wrote: boolean }> {
  await as(role);
  if (key.startsWith("action ")) {
    const [file, name] = key.slice("action ".length).split("#");
    const mod = (await actionModules[`/app/${file}`]()) as Record<string, (...args: unknown[]) => Promise<{ ok: boolean; message?: string }>>;
    const result = await mod[name](Number(f.proofId), "draft");
    if (result.ok) return { got: "ok", wrote: true };
    const message = result.message ?? "";
    if (message === unauthenticated().message) return { got: 401, wrote: false };
    if (/ was not found\.$/.test(message)) return { got: 404, wrote: false };
    if (ACCESS_REFUSALS.has(message) || /needs the .* role/.test(message)) return { got: 403, wrote: false };
    return { got: "ok", wrote: false };
  }
  const [method, file] = key.split(" ");
  const handler = (await load(file))[method];
  const hasBody = method !== "GET" && method !== "DELETE";
  const request = new Request(`http://localhost/${file}`, {
    method,
    ...(hasBody ? { headers: { "content-type": "application/json" }, body: JSON.stringify("not a body any route accepts") } : {}),
  });
  const res = await handler(request, params(paramsFor(file, f, out)));
  const status = res.status;
  await res.arrayBuffer();
  if (status >= 500) return { got: `${status}`, wrote: false };
  if (status === 401 || status === 403 || status === 404) return { got: status, wrote: false };
  return { got: "ok", wrote: method !== "GET" && status < 300 };
}

beforeAll(async () => {
  for (const key of ["owner", "coauthor", "reviewer", "editor", "admin", "otherProof"] as const)
    people[key] = await userIdOf(({ owner: "author", otherProof: "outsider" } as Record<string, string>)[key] ?? key);
  const hash = await bcrypt.hash("a matrix password nobody types", 4);
  for (const [key, person] of Object.entries(ADDED)) {
    await models().User.destroy({ where: { email: person.email } });
    people[key as keyof typeof ADDED] = (await models().User.create({ ...person, passwordHash: hash })).id;
  }
  // The member of another proof has one of her own.
  const other = await draftProof(`Another proof ${Date.now()}`);
  madeProofs.push(other);
  await models().ProofMember.create({ proofId: Number(other), userId: people.otherProof, role: "author" });
}, 120_000);

afterAll(async () => {
  await dropProofs(madeProofs);
  await models().User.destroy({ where: { email: Object.values(ADDED).map((p) => p.email) } });
  await closeQueue();
  await closeSequelize();
});

describe("the permission matrix of route handlers and server actions", () => {
  it("has an expected outcome for every handler method and server action in the file tree, and no stale row", () => {
    const inTree = [...handlersInTree(), ...actionsInTree()].sort();
    expect(inTree.length).toBeGreaterThan(70);
    expect(Object.keys(EXPECTED).sort()).toEqual(inTree);
    // Every row names all nine standings.
    for (const [key, r] of Object.entries(EXPECTED)) expect(Object.keys(r).sort(), key).toEqual([...ROLES].sort());
  });

  it("answers every handler × standing as the table says, and refuses the case-limited referee outside her case", async () => {
    const mismatches: string[] = [];
    let cells = 0;
    let rebuilt = 0;
    const variants: Array<[string, boolean]> = [
      ...Object.keys(EXPECTED).map((k): [string, boolean] => [k, false]),
      ...OUT_OF_SCOPE.map((k): [string, boolean] => [k, true]),
    ];
    for (const [key, out] of variants) {
      const expected = { ...EXPECTED[key], ...(out && EXPECTED[key].caseLimited === "ok" ? { caseLimited: 403 as Outcome } : {}) };
      for (const role of ROLES) {
        if (expected[role] === "skip") continue;
        if (!fx) {
          fx = await buildFixture();
          rebuilt++;
        }
        cells++;
        const { got, wrote } = await runCell(key, role, fx, out);
        if (got !== expected[role]) mismatches.push(`${key}${out ? " (step outside the scope)" : ""} as ${role}: expected ${expected[role]}, got ${got}`);
        if (wrote) fx = null;
      }
    }
    console.log(
      `[access matrix] handlers and actions: ${variants.length} variants (${Object.keys(EXPECTED).length} rows + ${OUT_OF_SCOPE.length} out of scope) × ${ROLES.length} standings = ${cells} cells run, ${mismatches.length} mismatches; fixture built ${rebuilt}×`,
    );
    expect(mismatches).toEqual([]);
  }, 900_000);
});
