/**
 * The blind sweep: on a blind proof where two referees have vouched, disputed, commented, reported, been
 * given due dates, and one has been removed, every surface an author can reach — each GET route of the
 * proof (JSON, LaTeX, bundle, archive), the notifications, the timeline, the author queue and every
 * message in the mail fake about the proof — is read as each author and searched for the referees'
 * names, their e-mail addresses and their numeric user ids (in an id field, or as "member #N").
 * The pages' HTML is swept by the browser test tests/e2e/blind-pages.test.ts.
 */
import { beforeAll, describe, expect, it, vi } from "vitest";

vi.mock("next-auth", async (importOriginal) => ({ ...(await importOriginal<typeof import("next-auth")>()), getServerSession: vi.fn() }));

import { existsSync, readFileSync } from "node:fs";
import { strFromU8, unzipSync } from "fflate";
import { getServerSession } from "next-auth";
import { actAs, jsonRequest, params } from "./helpers";
import { reviewProofsForFile, latestRevision } from "./review-fixtures";
import { models } from "@/models";
import { listProofEvents } from "@/lib/data/audit";
import { refereeLens } from "@/lib/data/blind";
import { getAuthorQueue } from "@/lib/data/review-queues";
import { openRound, recordDecision, saveReportDraft, setRefereeDue, submitReport } from "@/lib/data/rounds";
import * as proofs from "@/app/api/proofs/route";
import * as proofRoute from "@/app/api/proofs/[proofId]/route";
import * as cases from "@/app/api/proofs/[proofId]/cases/route";
import * as claims from "@/app/api/proofs/[proofId]/claims/route";
import * as disputes from "@/app/api/proofs/[proofId]/disputes/route";
import * as disputeMove from "@/app/api/proofs/[proofId]/disputes/[reviewId]/route";
import * as settings from "@/app/api/proofs/[proofId]/settings/route";
import * as invitations from "@/app/api/proofs/[proofId]/invitations/route";
import * as rounds from "@/app/api/proofs/[proofId]/rounds/route";
import * as oneRound from "@/app/api/proofs/[proofId]/rounds/[round]/route";
import * as desk from "@/app/api/proofs/[proofId]/desk/route";
import * as exportsRoute from "@/app/api/proofs/[proofId]/exports/route";
import * as oneExport from "@/app/api/proofs/[proofId]/exports/[exportId]/route";
import * as bundle from "@/app/api/proofs/[proofId]/exports/[exportId]/bundle/route";
import * as tex from "@/app/api/proofs/[proofId]/exports/[exportId]/tex/route";
import * as archive from "@/app/api/proofs/[proofId]/exports/[exportId]/archive/route";
import * as step from "@/app/api/proofs/[proofId]/steps/[stepId]/route";
import * as stepClaims from "@/app/api/proofs/[proofId]/steps/[stepId]/claims/route";
import * as comments from "@/app/api/proofs/[proofId]/steps/[stepId]/comments/route";
import * as reviews from "@/app/api/proofs/[proofId]/steps/[stepId]/reviews/route";
import * as revisions from "@/app/api/proofs/[proofId]/steps/[stepId]/revisions/route";
import * as oneRevision from "@/app/api/proofs/[proofId]/steps/[stepId]/revisions/[number]/route";
import * as diff from "@/app/api/proofs/[proofId]/steps/[stepId]/diff/route";
import * as notifications from "@/app/api/notifications/route";
import * as members from "@/app/api/proofs/[proofId]/members/[userId]/route";
import * as changesSince from "@/app/api/proofs/[proofId]/changes/route";
import * as statementComments from "@/app/api/proofs/[proofId]/statement/comments/route";
import * as conditionComments from "@/app/api/proofs/[proofId]/cases/[caseId]/comments/route";

const stamp = Date.now();
const CELIA = { name: "Celia Marwood", email: "celia.marwood@tarnhollow.example" };
const GALE = { name: "Gale Fenwick", email: `gale.fenwick.sweep.${stamp}@moorfield.example` };
const [fx] = reviewProofsForFile(["blind sweep"], { afterDrop: () => models().User.destroy({ where: { id: galeId } }) });
let galeId = 0;
let exportId = 0;
let title = "";

async function actAsUser(id: number) {
  const u = (await models().User.findByPk(id))!;
  vi.mocked(getServerSession).mockResolvedValue({
    user: { id: String(u.id), name: u.name, email: u.email, role: "member", sessionVersion: u.sessionVersion },
    expires: "2999-01-01",
  });
}

type Get = (r: Request, c: { params: Promise<Record<string, string>> }) => Promise<Response>;
const read = async (get: Get, p: Record<string, string>, query = ""): Promise<{ status: number; text: string }> => {
  const res = await get(new Request(`http://localhost/x${query}`), params(p));
  const type = res.headers.get("content-type") ?? "";
  if (type.includes("zip")) {
    const files = unzipSync(new Uint8Array(await res.arrayBuffer()));
    return {
      status: res.status,
      text: Object.entries(files)
        .map(([name, data]) => `${name}\n${name.endsWith(".pdf") ? "" : strFromU8(data)}`)
        .join("\n"),
    };
  }
  return { status: res.status, text: await res.text() };
};

beforeAll(async () => {
  title = (await models().Proof.findByPk(fx.proofId))!.title;
  galeId = (await models().User.create({ email: GALE.email, name: GALE.name, passwordHash: null, role: "member" })).id;
  await models().ProofMember.create({ proofId: fx.proofId, userId: galeId, role: "reviewer" });
  await models().Proof.update({ blindReview: true }, { where: { id: fx.proofId } });
  const P = String(fx.proofId);

  // Celia vouches for step 1.1; Gale disputes step 2.2 and comments; the author answers the dispute.
  await actAs("reviewer");
  const vouch = await reviews.POST(
    jsonRequest("/x", "POST", { revisionId: (await latestRevision(fx.steps["1.1"])).id, verdict: "vouch" }),
    params({ proofId: P, stepId: String(fx.steps["1.1"]) }),
  );
  expect(vouch.status).toBe(201);
  await actAsUser(galeId);
  const dispute = await reviews.POST(
    jsonRequest("/x", "POST", { revisionId: (await latestRevision(fx.steps["2.2"])).id, verdict: "dispute", comment: "Which bound is meant here?" }),
    params({ proofId: P, stepId: String(fx.steps["2.2"]) }),
  );
  expect(dispute.status).toBe(201);
  const disputeId = (await models().Review.findOne({ where: { stepId: fx.steps["2.2"], reviewerId: galeId } }))!.id;
  expect(
    (await comments.POST(jsonRequest("/x", "POST", { body: "I mean the bound in the second line." }), params({ proofId: P, stepId: String(fx.steps["2.2"]) })))
      .status,
  ).toBe(201);
  // Gale also comments on the statement and on case 2's condition; the author answers on the statement (Gale is notified).
  const onStatement = await statementComments.POST(jsonRequest("/x", "POST", { body: "Is the statement about all $x$?" }), params({ proofId: P }));
  expect(onStatement.status).toBe(201);
  const onCondition = await conditionComments.POST(
    jsonRequest("/x", "POST", { body: "Does $n > 3$ include $n = 4$?" }),
    params({ proofId: P, caseId: String(fx.cases["2"]) }),
  );
  expect(onCondition.status).toBe(201);
  await actAs("author");
  expect(
    (await statementComments.POST(jsonRequest("/x", "POST", { body: "Yes, all real $x$.", parentId: (await onStatement.json()).id }), params({ proofId: P })))
      .status,
  ).toBe(201);
  expect(
    (
      await disputeMove.POST(
        jsonRequest("/x", "POST", { to: "answered", comment: "The second line: $x^2 \\ge 0$." }),
        params({ proofId: P, reviewId: String(disputeId) }),
      )
    ).status,
  ).toBe(200);

  // A round: due dates, both reports, a decision with the reports attached (mailed to the authors).
  await openRound(fx.proofId, fx.ids.editor, new Date(Date.now() + 7 * 86_400_000));
  await setRefereeDue(fx.proofId, 1, galeId, fx.ids.editor, new Date(Date.now() + 9 * 86_400_000));
  for (const [id, rec] of [
    [fx.ids.reviewer, "minor_revision"],
    [galeId, "major_revision"],
  ] as const) {
    await saveReportDraft(fx.proofId, 1, id, { body: "Report text.", recommendation: rec, editorNote: "for the editors" });
    await submitReport(fx.proofId, 1, id);
  }
  await recordDecision(
    fx.proofId,
    1,
    { id: fx.ids.editor, name: "Dov Ashgrove" },
    { decision: "minor_revision", letter: "Please revise step 2.2.", attachReports: true },
  );

  // The editor removes Gale (her dispute and report stay), and an author makes a draft export.
  await actAs("editor");
  expect((await members.DELETE(new Request("http://localhost/x", { method: "DELETE" }), params({ proofId: P, userId: String(galeId) }))).status).toBe(200);
  await actAs("author");
  const made = await exportsRoute.POST(jsonRequest("/x", "POST", { kind: "draft" }), params({ proofId: P }));
  expect(made.status).toBe(201);
  exportId = (await made.json()).export.id;
});

/** Every surface an author reaches, as text, labelled. */
async function authorSurfaces(viewerId: number): Promise<Array<[string, string]>> {
  const P = String(fx.proofId);
  const out: Array<[string, string]> = [];
  const add = async (label: string, get: Get, p: Record<string, string>, query = "") => {
    const { status, text } = await read(get, p, query);
    out.push([`${label} (${status})`, text]);
  };
  await add("GET /api/proofs", proofs.GET as Get, {});
  await add("proof", proofRoute.GET as Get, { proofId: P });
  await add("cases", cases.GET as Get, { proofId: P });
  await add("claims", claims.GET as Get, { proofId: P });
  await add("disputes", disputes.GET as Get, { proofId: P });
  await add("settings", settings.GET as Get, { proofId: P });
  await add("invitations", invitations.GET as Get, { proofId: P });
  await add("rounds", rounds.GET as Get, { proofId: P });
  await add("round 1", oneRound.GET as Get, { proofId: P, round: "1" });
  await add("desk", desk.GET as Get, { proofId: P });
  await add("exports", exportsRoute.GET as Get, { proofId: P });
  for (const [name, get] of [
    ["export", oneExport.GET],
    ["bundle", bundle.GET],
    ["tex", tex.GET],
    ["archive", archive.GET],
  ] as const)
    await add(name, get as Get, { proofId: P, exportId: String(exportId) });
  await add("statement comments", statementComments.GET as Get, { proofId: P });
  await add("changes since the last visit", changesSince.GET as Get, { proofId: P });
  for (const [key, caseId] of Object.entries(fx.cases))
    await add(`case ${key} condition comments`, conditionComments.GET as Get, { proofId: P, caseId: String(caseId) });
  for (const [key, stepId] of Object.entries(fx.steps)) {
    const s = { proofId: P, stepId: String(stepId) };
    await add(`step ${key}`, step.GET as Get, s);
    await add(`step ${key} claims`, stepClaims.GET as Get, s);
    await add(`step ${key} comments`, comments.GET as Get, s);
    await add(`step ${key} reviews`, reviews.GET as Get, s);
    await add(`step ${key} revisions`, revisions.GET as Get, s);
    await add(`step ${key} revision 1`, oneRevision.GET as Get, { ...s, number: "1" });
    await add(`step ${key} diff`, diff.GET as Get, s, "?from=1&to=1");
  }
  const mine = await (await (notifications.GET as unknown as Get)(new Request("http://localhost/api/notifications"), params({}))).json();
  out.push(["notifications", JSON.stringify(mine.notifications.filter((n: { proofId: number }) => n.proofId === fx.proofId))]);
  const lens = await refereeLens(fx.proofId, { id: viewerId, role: "author" });
  out.push(["timeline", JSON.stringify(await listProofEvents(fx.proofId, 500, lens))]);
  out.push(["author queue", JSON.stringify((await getAuthorQueue(viewerId)).filter((r) => r.proofId === fx.proofId))]);
  return out;
}

/** The messages in the mail fake to this address about this proof. */
function mailsAbout(to: string): Array<[string, string]> {
  const file = process.env.CAIRN_MAIL_STORE!;
  const all = existsSync(file)
    ? readFileSync(file, "utf8")
        .split("\n")
        .filter(Boolean)
        .map((l) => JSON.parse(l) as { to: string[]; subject: string; text: string })
    : [];
  return all.filter((m) => m.to.includes(to) && (m.subject + m.text).includes(title)).map((m) => [`mail “${m.subject}”`, `${m.subject}\n${m.text}`]);
}

const ID_KEYS =
  /^(userId|reviewerId|refereeId|authorId|actorId|memberId|editorId|createdBy|invitedBy|usedBy|removedBy|revokedBy|withdrawnBy|checkedBy|subjectId)$/;

/** Id fields in JSON whose value is a referee's user id (a subjectId counts when its subject is a member). */
function idLeaks(text: string, ids: number[]): string[] {
  const found: string[] = [];
  const walk = (v: unknown, path: string) => {
    if (Array.isArray(v)) v.forEach((x, i) => walk(x, `${path}[${i}]`));
    else if (v && typeof v === "object") {
      const o = v as Record<string, unknown>;
      for (const [k, x] of Object.entries(o)) {
        if (ID_KEYS.test(k) && typeof x === "number" && ids.includes(x) && (k !== "subjectId" || o.subjectType === "member")) found.push(`${path}.${k} = ${x}`);
        walk(x, `${path}.${k}`);
      }
    }
  };
  try {
    walk(JSON.parse(text), "$");
  } catch {
    // not JSON (LaTeX, mail text): only the textual forms below apply
  }
  for (const id of ids) for (const m of text.matchAll(new RegExp(`(member|user|reviewer|referee) #${id}\\b`, "gi"))) found.push(m[0]);
  return found;
}

describe("blind sweep", () => {
  it("shows the authors no referee name, e-mail address or user id on any surface, while using 'Referee k'", async () => {
    const secrets = [CELIA.name, CELIA.email, GALE.name, GALE.email];
    const ids = [fx.ids.reviewer, galeId];
    let surfaces = 0;
    for (const who of ["author", "coauthor"] as const) {
      const viewerId = (await actAs(who))!;
      const email = who === "author" ? "ada.quenby@tarnhollow.example" : "bram.theroux@tarnhollow.example";
      const all = [...(await authorSurfaces(viewerId)), ...mailsAbout(email)];
      const leaks: string[] = [];
      for (const [label, text] of all) {
        for (const secret of secrets) if (text.includes(secret)) leaks.push(`${who}: ${label} shows ${secret}`);
        for (const leak of idLeaks(text, ids)) leaks.push(`${who}: ${label} reveals a referee's user id: ${leak}`);
      }
      expect(leaks).toEqual([]);
      const joined = all.map(([, t]) => t).join("\n");
      // The sweep read real content: the referees appear, numbered, and the decision mail reached the authors.
      expect(joined).toContain("Referee 1");
      expect(joined).toContain("Referee 2");
      expect(joined).toContain("Which bound is meant here?");
      expect(joined).toContain("Is the statement about all $x$?");
      expect(joined).toContain("Does $n > 3$ include $n = 4$?");
      expect(all.some(([label]) => label.startsWith("mail"))).toBe(true);
      expect(all.filter(([label]) => label.endsWith("(200)")).length).toBeGreaterThan(30);
      surfaces += all.length;
    }
    expect(surfaces).toBeGreaterThan(80);
  });

  it("shows the editor the names (the sweep would see a leak if there were one)", async () => {
    const viewerId = (await actAs("editor"))!;
    const text = (await authorSurfaces(viewerId)).map(([, t]) => t).join("\n");
    expect(text).toContain(CELIA.name);
    expect(text).toContain(GALE.name);
  });
});
