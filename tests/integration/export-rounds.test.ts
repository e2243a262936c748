/**
 * Rounds and decisions in the export: the bundle carries one "round" item per round (what the authors
 * may read of it: decision, letter, attached reports' recommendations; never an editor-only note), the
 * LaTeX source and the PDF list them, and a blind proof names its referees "Referee 1, 2" there.
 */
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";

vi.mock("next-auth", async (importOriginal) => ({ ...(await importOriginal<typeof import("next-auth")>()), getServerSession: vi.fn() }));

import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { actAs, jsonRequest, params, userIdOf } from "./helpers";
import { closeSequelize } from "@/lib/db";
import { models } from "@/models";
import { checkBundle } from "@/lib/core/certificates/bundle";
import { compileLatex } from "@/lib/export/pdf";
import { claimSetText, digestOfRevision } from "@/lib/review/revisions";
import { openRound, recordDecision, saveReportDraft, submitReport } from "@/lib/data/rounds";
import { verifiedClaim, claimRow } from "../unit/export-fixture";
import * as exportsRoute from "@/app/api/proofs/[proofId]/exports/route";
import * as bundleRoute from "@/app/api/proofs/[proofId]/exports/[exportId]/bundle/route";
import * as texRoute from "@/app/api/proofs/[proofId]/exports/[exportId]/tex/route";

const stamp = Date.now();
const GALE = { name: "Gale Fenwick", email: `gale.fenwick.export.${stamp}@moorfield.example` };
const CELIA = { name: "Celia Marwood", email: "celia.marwood@tarnhollow.example" };
const NOTE = `editor-only remark ${stamp}`;
let proofId = 0;
let ids: Record<"author" | "reviewer" | "editor" | "gale", number>;

const create = (body: unknown) => exportsRoute.POST(jsonRequest(`/api/proofs/${proofId}/exports`, "POST", body), params({ proofId: String(proofId) }));
const file = (route: { GET: (r: Request, c: { params: Promise<{ proofId: string; exportId: string }> }) => Promise<Response> }, exportId: number) =>
  route.GET(new Request(`http://localhost/x`), params({ proofId: String(proofId), exportId: String(exportId) }));

async function report(round: number, refereeId: number, recommendation: "accept" | "minor_revision", body: string) {
  await saveReportDraft(proofId, round, refereeId, { body, recommendation, editorNote: NOTE });
  await submitReport(proofId, round, refereeId);
}

beforeAll(async () => {
  process.env.CAIRN_PDF_CACHE = mkdtempSync(join(tmpdir(), "cairn-pdf-cache-"));
  const { Proof, ProofMember, Case, Step, StepRevision, Claim, Review, User } = models();
  const gale = await User.create({ email: GALE.email, name: GALE.name, passwordHash: null, role: "member" });
  ids = { author: await userIdOf("author"), reviewer: await userIdOf("reviewer"), editor: await userIdOf("editor"), gale: gale.id };
  const proof = await Proof.create({ title: `Rounds in the export ${stamp}`, statement: "Every $E_8$ is a tree.", createdBy: ids.author });
  proofId = proof.id;
  await ProofMember.bulkCreate([
    { proofId, userId: ids.author, role: "author" },
    { proofId, userId: ids.reviewer, role: "reviewer" },
    { proofId, userId: ids.editor, role: "editor" },
  ]);
  await ProofMember.create({ proofId, userId: ids.gale, role: "reviewer" }); // joins after Celia: Referee 2
  // A settled proof (as in export-routes.test.ts): one case, one step, one verified claim, one vouch on the revision's digest.
  const c = await Case.create({ proofId, parentId: null, position: 1, title: "The only case", condition: "$G = E_8$" });
  const step = await Step.create({ caseId: c.id, position: 1 });
  const rev = await StepRevision.create({ stepId: step.id, number: 1, body: "Since $E_8$ has no cycle, it is a tree.", authorId: ids.author });
  const v = verifiedClaim({ kind: "structure", graph: { format: "named", text: "E(8)" }, predicate: "tree" });
  const claim = await Claim.create(claimRow(v, step.id, ids.author));
  const covered = [{ id: claim.id, position: 1, kind: claim.kind, statement: claim.statement, digest: claim.digest!, status: claim.status }];
  const digest = digestOfRevision(rev.number, rev.body, covered);
  await rev.update({ claimSet: claimSetText(covered), digest });
  await Review.create({ stepId: step.id, revisionId: rev.id, reviewerId: ids.reviewer, verdict: "vouch", disputeState: null, digest });

  // Round 1: both referees report, the editor asks for a minor revision with the reports attached.
  const editor = { id: ids.editor, name: "Dov Ashgrove" };
  await openRound(proofId, ids.editor, new Date(Date.now() + 7 * 86_400_000));
  await report(1, ids.reviewer, "minor_revision", "Fix the notation in case 1.");
  await report(1, ids.gale, "accept", "Fine as it stands.");
  await recordDecision(proofId, 1, editor, { decision: "minor_revision", letter: "Please revise: the notation of $E_8$ in case 1.", attachReports: true });
  // Round 2: both recommend accepting; the editor accepts, this time without attaching the reports.
  await openRound(proofId, ids.editor, new Date(Date.now() + 14 * 86_400_000));
  await report(2, ids.reviewer, "accept", "Thank you for the revision.");
  await report(2, ids.gale, "accept", "Still fine.");
  await recordDecision(proofId, 2, editor, { decision: "accept", letter: "Accepted.", attachReports: false });
});

afterAll(async () => {
  await models().Proof.destroy({ where: { id: proofId } });
  await models().User.destroy({ where: { id: ids.gale } });
  await closeSequelize();
  rmSync(process.env.CAIRN_PDF_CACHE!, { recursive: true, force: true });
});

describe("rounds and decisions in the export", () => {
  it("a blind proof's certified export lists both rounds and decisions with referees as Referee 1, 2; it re-checks and compiles", async () => {
    await models().Proof.update({ blindReview: true }, { where: { id: proofId } });
    await actAs("editor");
    const res = await create({ kind: "certified" });
    expect(res.status).toBe(201);
    const { export: made } = await res.json();
    const bundleText = await (await file(bundleRoute, made.id)).text();
    const bundle = JSON.parse(bundleText);
    expect(checkBundle(bundle, "downloaded").exitCode).toBe(0);
    const rounds = bundle.items.filter((i: { type: string }) => i.type === "round");
    expect(rounds.map((r: { id: string }) => r.id)).toEqual(["round 1", "round 2"]);
    expect(rounds[0].data.decision).toMatchObject({ decision: "minor_revision", editor: "Dov Ashgrove", reportsAttached: true });
    expect(rounds[0].data.reports).toEqual([
      expect.objectContaining({ referee: "Referee 1", recommendation: "minor_revision", body: "Fix the notation in case 1." }),
      expect.objectContaining({ referee: "Referee 2", recommendation: "accept" }),
    ]);
    // Round 2's reports were not attached to its decision: the authors (and so the export) do not have them.
    expect(rounds[1].data).toMatchObject({ decision: { decision: "accept", reportsAttached: false }, reports: [] });
    for (const secret of [CELIA.name, CELIA.email, GALE.name, GALE.email, NOTE, "editorNote", "refereeId"]) expect(bundleText, secret).not.toContain(secret);

    const tex = await (await file(texRoute, made.id)).text();
    expect(tex).toContain(String.raw`\section*{Review rounds and decisions}`);
    expect(tex).toContain(String.raw`\subsection*{Round 1}`);
    expect(tex).toContain(String.raw`\textbf{Decision: minor revision}, by Dov Ashgrove`);
    expect(tex).toContain("Referee 1 (report version 1");
    expect(tex).toContain("recommends minor revision.");
    expect(tex).toContain(String.raw`\textbf{Decision: accept}`);
    expect(tex).toContain("The referees' reports were not attached to this decision.");
    for (const secret of [CELIA.name, GALE.name, NOTE]) expect(tex, secret).not.toContain(secret);
    const { pdf } = await compileLatex(tex);
    expect(pdf.subarray(0, 5).toString()).toBe("%PDF-");
  }, 120_000);

  it("without blind review the export names the referees", async () => {
    await models().Proof.update({ blindReview: false }, { where: { id: proofId } });
    await actAs("author");
    const res = await create({ kind: "draft" });
    expect(res.status).toBe(201);
    const tex = await (await file(texRoute, (await res.json()).export.id)).text();
    expect(tex).toContain("Celia Marwood (report version 1");
    expect(tex).toContain("Gale Fenwick (report version 1");
    expect(tex).not.toContain(NOTE);
  });
});
