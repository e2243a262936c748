import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";

vi.mock("next-auth", async (importOriginal) => ({ ...(await importOriginal<typeof import("next-auth")>()), getServerSession: vi.fn() }));

import { actAs, demoProofId, expectStatusAs, jsonRequest, params, userIdOf } from "./helpers";
import { closeSequelize } from "@/lib/db";
import { models } from "@/models";
import { checkBundle } from "@/lib/core/certificates/bundle";
import { compileLatex } from "@/lib/export/pdf";
import { createHash } from "node:crypto";
import { mkdtempSync, rmSync, statSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { verifiedClaim, claimRow } from "../unit/export-fixture";
import * as exportsRoute from "@/app/api/proofs/[proofId]/exports/route";
import * as exportRoute from "@/app/api/proofs/[proofId]/exports/[exportId]/route";
import * as bundleRoute from "@/app/api/proofs/[proofId]/exports/[exportId]/bundle/route";
import * as texRoute from "@/app/api/proofs/[proofId]/exports/[exportId]/tex/route";
import * as pdfRoute from "@/app/api/proofs/[proofId]/exports/[exportId]/pdf/route";
import * as checkerRoute from "@/app/api/proofs/[proofId]/exports/checker/route";
import * as archiveRoute from "@/app/api/proofs/[proofId]/exports/[exportId]/archive/route";
import { strFromU8, unzipSync } from "fflate";
import { spawnSync } from "node:child_process";
import { claimSetText, digestOfRevision } from "@/lib/review/revisions";

const EVIL = String.raw`Settled \input{/etc/passwd} & 100% #1 _x_ $\write18{ls}$`;
let proofId: number; // a proof of this file's own, made ready to certify
let stepId: number;
let revisionId: number;

const list = (id: number) => exportsRoute.GET(new Request(`http://localhost/api/proofs/${id}/exports`), params({ proofId: String(id) }));
const create = (id: number, body: unknown) => exportsRoute.POST(jsonRequest(`/api/proofs/${id}/exports`, "POST", body), params({ proofId: String(id) }));
const file = (route: { GET: (r: Request, c: { params: Promise<{ proofId: string; exportId: string }> }) => Promise<Response> }, id: number, exportId: number) =>
  route.GET(new Request(`http://localhost/api/proofs/${id}/exports/${exportId}`), params({ proofId: String(id), exportId: String(exportId) }));

beforeAll(async () => {
  process.env.CAIRN_PDF_CACHE = mkdtempSync(join(tmpdir(), "cairn-pdf-cache-"));
  const { Proof, ProofMember, Case, Step, StepRevision, Claim, Review } = models();
  const [author, reviewer, editor] = await Promise.all([userIdOf("author"), userIdOf("reviewer"), userIdOf("editor")]);
  const proof = await Proof.create({ title: EVIL, statement: "**Theorem.** Every $E_8$ is a tree.", createdBy: author });
  proofId = proof.id;
  await ProofMember.bulkCreate([
    { proofId, userId: author, role: "author" },
    { proofId, userId: reviewer, role: "reviewer" },
    { proofId, userId: editor, role: "editor" },
  ]);
  const c = await Case.create({ proofId, parentId: null, position: 1, title: "The only case", condition: "$G = E_8$" });
  const step = await Step.create({ caseId: c.id, position: 1 });
  stepId = step.id;
  const rev = await StepRevision.create({
    stepId,
    number: 1,
    body: String.raw`Step text \immediate\write18{rm -rf /} with $\rho(E_8) < 2$.`,
    authorId: author,
  });
  revisionId = rev.id;
  const v = verifiedClaim({ kind: "structure", graph: { format: "named", text: "E(8)" }, predicate: "tree" });
  const claim = await Claim.create(claimRow(v, stepId, author));
  // The revision covers the claim (as attaching it through the API would record), and the vouch that revision's digest.
  const covered = [{ id: claim.id, position: 1, kind: claim.kind, statement: claim.statement, digest: claim.digest!, status: claim.status }];
  const digest = digestOfRevision(rev.number, rev.body, covered);
  await rev.update({ claimSet: claimSetText(covered), digest });
  await Review.create({ stepId, revisionId, reviewerId: reviewer, verdict: "vouch", disputeState: null, digest });
});

afterAll(async () => {
  await models().Proof.destroy({ where: { id: proofId } });
  await closeSequelize();
  rmSync(process.env.CAIRN_PDF_CACHE!, { recursive: true, force: true });
});

describe("GET /api/proofs/:proofId/exports", () => {
  it("401 anonymous, 403 non-member, 404 unknown proof", async () => {
    await actAs(null);
    expect((await list(proofId)).status).toBe(401);
    await actAs("outsider");
    expect((await list(proofId)).status).toBe(403);
    await actAs("author");
    expect((await list(999_999)).status).toBe(404);
  });

  it("any member sees the certification state", async () => {
    await actAs("reviewer");
    const res = await list(proofId);
    expect(res.status).toBe(200);
    expect((await res.json()).certification).toEqual({ state: "ready to certify", blockers: [] });
  });
});

describe("POST /api/proofs/:proofId/exports", () => {
  it("401 anonymous, 403 non-member and reviewer (wrong role), 404 unknown proof", async () => {
    await actAs(null);
    expect((await create(proofId, { kind: "draft" })).status).toBe(401);
    await actAs("outsider");
    expect((await create(proofId, { kind: "draft" })).status).toBe(403);
    await actAs("reviewer");
    const wrongRole = await create(proofId, { kind: "draft" });
    expect(wrongRole.status).toBe(403);
    expect((await wrongRole.json()).error.message).toMatch(/author or editor/);
    await actAs("author");
    expect((await create(999_999, { kind: "draft" })).status).toBe(404);
  });

  it("422 for a missing or unknown kind and for a body that is not JSON", async () => {
    await actAs("author");
    const bad = await create(proofId, { kind: "final" });
    expect(bad.status).toBe(422);
    expect((await bad.json()).error.issues[0].path).toBe("kind");
    expect((await create(proofId, {})).status).toBe(422);
    expect((await create(proofId, "{not json")).status).toBe(422);
  });

  it("certifies a settled proof; the bundle re-checks, the LaTeX escapes the title and compiles, every file downloads", async () => {
    await actAs("editor");
    const res = await create(proofId, { kind: "certified" });
    expect(res.status).toBe(201);
    const { export: made } = await res.json();
    expect(made).toMatchObject({ kind: "certified", createdByName: "Dov Ashgrove", claimCount: 1 });
    expect(made.manifestDigest).toMatch(/^[0-9a-f]{64}$/);

    const listed = await (await list(proofId)).json();
    expect(listed.exports[0]).toMatchObject({ id: made.id, manifestDigest: made.manifestDigest, kind: "certified" });
    expect((await (await file(exportRoute, proofId, made.id)).json()).export.manifestDigest).toBe(made.manifestDigest);

    const bundleRes = await file(bundleRoute, proofId, made.id);
    expect(bundleRes.headers.get("content-disposition")).toContain(`cairn-proof-${proofId}-export-${made.id}-certified.json`);
    const bundle = await bundleRes.json();
    expect(bundle.manifestDigest).toBe(made.manifestDigest);
    const report = checkBundle(bundle, "downloaded");
    expect(report.exitCode).toBe(0);
    expect(report.lines.find((l) => l.label === "claim 1(a)#1")?.status).toBe("verified");

    const tex = await (await file(texRoute, proofId, made.id)).text();
    expect(tex).toContain(String.raw`Settled \textbackslash{}input\{/etc/passwd\} \& 100\% \#1 \_x\_`);
    expect(tex).toContain(String.raw`\textbackslash{}immediate\textbackslash{}write18\{rm -rf /\}`);
    expect(tex).not.toContain("DRAFT");
    expect(tex).toContain("Celia Marwood & 1 &");
    const { pdf } = await compileLatex(tex);
    expect(pdf.subarray(0, 5).toString()).toBe("%PDF-");

    const pdfRes = await file(pdfRoute, proofId, made.id);
    expect(pdfRes.status).toBe(200);
    expect(pdfRes.headers.get("content-type")).toBe("application/pdf");
    const first = Buffer.from(await pdfRes.arrayBuffer());
    expect(first.subarray(0, 5).toString()).toBe("%PDF-");
    // Compiled once, then kept under the SHA-256 of the source: the second download is the same file, not a new run.
    const cached = join(process.env.CAIRN_PDF_CACHE!, `${createHash("sha256").update(tex).digest("hex")}.pdf`);
    const before = statSync(cached).mtimeMs;
    const again = Buffer.from(await (await file(pdfRoute, proofId, made.id)).arrayBuffer());
    expect(again.equals(first)).toBe(true);
    expect(statSync(cached).mtimeMs).toBe(before);
  }, 120_000);

  it("refuses a certified export while a dispute is open (409 naming the step), and a draft is still possible and marked draft", async () => {
    const { Review } = models();
    const dispute = await Review.create({ stepId, revisionId, reviewerId: await userIdOf("editor"), verdict: "dispute", disputeState: "raised" });
    try {
      await actAs("author");
      const refused = await create(proofId, { kind: "certified" });
      expect(refused.status).toBe(409);
      const body = await refused.json();
      expect(body.error.code).toBe("conflict");
      expect(body.error.message).toContain("Step 1(a) has 1 open dispute.");
      expect(body.error.blockers).toContain("Step 1(a) has 1 open dispute.");

      const draft = await create(proofId, { kind: "draft" });
      expect(draft.status).toBe(201);
      const { export: made } = await draft.json();
      expect(made.kind).toBe("draft");
      const tex = await (await file(texRoute, proofId, made.id)).text();
      expect(tex).toContain(String.raw`\fancyhead[R]{\small \textbf{DRAFT --- not certified}}`);
      const bundle = await (await file(bundleRoute, proofId, made.id)).json();
      expect(bundle.export).toMatchObject({ kind: "draft", proofState: "in progress" });
      expect(bundle.items.find((i: { id: string }) => i.id === "step 1(a)").data.reviews).toContainEqual(
        expect.objectContaining({ verdict: "dispute", disputeState: "raised" }),
      );
    } finally {
      await dispute.destroy();
    }
  });

  it("exports a draft of the seeded proof whose digests all re-check", async () => {
    const demo = await demoProofId();
    await actAs("coauthor");
    const res = await create(demo, { kind: "draft" });
    expect(res.status).toBe(201);
    const { export: made } = await res.json();
    const bundle = await (await file(bundleRoute, demo, made.id)).json();
    expect(bundle.items.filter((i: { type: string }) => i.type === "case")).toHaveLength(5);
    const report = checkBundle(bundle, "demo");
    expect(report.lines.find((l) => l.label === "manifest")?.status).toBe("verified");
    expect(report.lines.some((l) => l.text.includes("CHANGED"))).toBe(false);
  });
});

describe("export files", () => {
  it("404 for an export of another proof and for an unknown export; 401 and 403 on downloads", async () => {
    await actAs("author");
    const mine = (await (await list(proofId)).json()).exports[0].id;
    const demo = await demoProofId();
    expect((await file(bundleRoute, demo, mine)).status).toBe(404);
    expect((await file(texRoute, proofId, 999_999)).status).toBe(404);
    expect((await file(exportRoute, proofId, 999_999)).status).toBe(404);
    await actAs(null);
    expect((await file(pdfRoute, proofId, mine)).status).toBe(401);
    await actAs("outsider");
    expect((await file(bundleRoute, proofId, mine)).status).toBe(403);
    expect((await file(texRoute, proofId, mine)).status).toBe(403);
  });

  it("403 for a reviewer invited to chosen cases only: an export shows every case", async () => {
    const { ReviewerScope, Case } = models();
    const reviewer = await userIdOf("reviewer");
    const only = await Case.findOne({ where: { proofId } });
    const scope = await ReviewerScope.create({ proofId, userId: reviewer, caseId: only!.id });
    try {
      await actAs("reviewer");
      const mine = (await models().ProofExport.findOne({ where: { proofId } }))!.id;
      const listed = await list(proofId);
      expect(listed.status).toBe(403);
      expect((await listed.json()).error.message).toMatch(/share the whole proof/);
      expect((await file(bundleRoute, proofId, mine)).status).toBe(403);
      expect((await file(texRoute, proofId, mine)).status).toBe(403);
    } finally {
      await scope.destroy();
    }
  });

  it("answers 503 with what to do when pdflatex is missing", async () => {
    await actAs("author");
    const mine = (await (await list(proofId)).json()).exports[0].id;
    const path = process.env.PATH;
    process.env.PATH = "/nonexistent";
    try {
      const res = await file(pdfRoute, proofId, mine);
      expect(res.status).toBe(503);
      expect((await res.json()).error.message).toMatch(/pdflatex is not installed.*texlive-latex-base/);
    } finally {
      process.env.PATH = path;
    }
  });

  it("offers the self-contained checker to members only", async () => {
    const get = () => checkerRoute.GET(new Request(`http://localhost/api/proofs/${proofId}/exports/checker`), params({ proofId: String(proofId) }));
    await expectStatusAs(get, { nobody: 401, outsider: 403 });
    await actAs("reviewer");
    const res = await get();
    expect(res.status).toBe(200);
    const script = await res.text();
    expect(script.startsWith("#!/usr/bin/env node")).toBe(true);
    expect(script).toContain("cairn-bundle/1");
    expect(script).not.toMatch(/^import .* from "(?!node:)/m); // nothing outside Node's own modules
  }, 60_000);

  it("packs everything for an offline re-check in one .zip, and the checker in it passes the bundle in it", async () => {
    const made = (await models().ProofExport.findOne({ where: { proofId }, order: [["id", "ASC"]] }))!;
    const get = () => archiveRoute.GET(new Request("http://localhost/x"), params({ proofId: String(proofId), exportId: String(made.id) }));
    await actAs("outsider");
    expect((await get()).status).toBe(403);
    await actAs("reviewer");
    const res = await get();
    expect(res.status).toBe(200);
    expect(res.headers.get("content-type")).toBe("application/zip");
    expect(res.headers.get("content-disposition")).toContain(`cairn-proof-${proofId}-export-${made.id}-${made.kind}.zip`);
    const files = unzipSync(new Uint8Array(await res.arrayBuffer()));
    const folder = `cairn-export-${made.id}`;
    expect(
      Object.keys(files)
        .filter((k) => !k.endsWith("/"))
        .sort(),
    ).toEqual(["README.txt", "bundle.json", "cairn-check.mjs", "proof.pdf", "proof.tex"].map((f) => `${folder}/${f}`));
    expect(strFromU8(files[`${folder}/bundle.json`])).toBe(made.bundle);
    expect(strFromU8(files[`${folder}/proof.pdf`].subarray(0, 5))).toBe("%PDF-");
    const readme = strFromU8(files[`${folder}/README.txt`]);
    expect(readme).toContain(`Manifest digest (SHA-256): ${made.manifestDigest}`);
    expect(readme).toContain("node cairn-check.mjs bundle.json");
    expect(readme).toMatch(/stays with the authors and the referees/);
    // Unpacked in an empty folder, with nothing but Node.js, the checker passes the bundle (exit 0).
    const dir = mkdtempSync(join(tmpdir(), "cairn-archive-"));
    try {
      for (const name of ["bundle.json", "cairn-check.mjs"]) writeFileSync(join(dir, name), files[`${folder}/${name}`]);
      const run = spawnSync(process.execPath, ["cairn-check.mjs", "bundle.json"], { cwd: dir, encoding: "utf8", timeout: 60_000 });
      expect(run.status, run.stdout + run.stderr).toBe(0);
      expect(run.stdout).toMatch(/verified/);
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  }, 120_000);
});
