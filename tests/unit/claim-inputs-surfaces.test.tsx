/**
 * Every claim kind shows its inputs on every surface: the claim card, the claims table (short form,
 * expandable), the print view and the LaTeX export, all from the one display model of
 * lib/core/claims/claim-display.ts; the method shown is the one that decided, with the certificate kind beside it.
 * The table of examples is keyed by claim kind, so a new kind without an example does not compile.
 *
 * graph6 codes are worked out by hand from McKay's format description (formats.txt: N(n) = n + 63, then
 * the upper triangle column by column, six bits a byte, + 63): P3 = "Bg", K3 = "Bw", C4 (0-1-2-3-0) = "Cl",
 * K1,3 centred at 0 = "Cs", P2 = "A_", P1 = "@".
 */
import { verifiedClaim } from "./export-fixture";
import { describe, expect, it } from "vitest";
import { renderToStaticMarkup } from "react-dom/server";
import { CLAIM_KINDS, validateClaim, type ClaimKind } from "@/lib/core/claims/claim-schema";
import { verifyClaim } from "@/lib/core/claims/claims";
import { claimInputsView } from "@/lib/core/claims/claim-display";
import { certificateKindOf, methodWithoutCertificate } from "@/lib/core/certificates/certificate-kind";
import { sha256Hex } from "@/lib/core/digest";
import { writeGraph6 } from "@/lib/core/input/graph6";
import { path } from "@/lib/core/input/constructors";
import { buildBundle } from "@/lib/export/bundle";
import { documentOf } from "@/lib/export/document";
import { renderLatex } from "@/lib/export/latex";
import { escapeLine } from "@/lib/export/latex-escape";
import { compileLatex } from "@/lib/export/pdf";
import type { ProofSnapshot, SnapshotClaim } from "@/lib/export/snapshot";
import type { ClaimRowView } from "@/lib/data/claim-lists";
import type { ClaimView } from "@/lib/data/claim-views";
import { ClaimCard } from "@/components/claims/claim-card";
import { ClaimsTable } from "@/components/proof/claims-table";
import { PrintDocument } from "@/components/export/print-document";

const P3 = { format: "edges", text: "0 1\n1 2" };
const C4 = { format: "edges", text: "0 1\n1 2\n2 3\n3 0" };
const K3 = { format: "edges", text: "0 1\n1 2\n0 2" };
const CLAW = { format: "edges", text: "0 1\n0 2\n0 3" };

/** Per kind: a claim and the texts of its inputs that every surface must show. */
const EXAMPLES: { [K in ClaimKind]: { claim: Record<string, unknown>; shows: string[] } } = {
  "spectral-radius-bound": { claim: { graph: P3, op: "<", bound: "2" }, shows: ["Bg", "ρ(G) < b", "bound b"] },
  // A·x = (3/2, 2, 3/2) ≤ 2·(1, 3/2, 1) entrywise.
  "vector-certificate": { claim: { graph: P3, vector: ["1", "3/2", "1"], relation: "<=", bound: "2" }, shows: ["Bg", "1, 3/2, 1", "A·x ≤ b·x entrywise"] },
  subgraph: { claim: { pattern: P3, host: C4, embedding: [0, 1, 2] }, shows: ["Bg", "Cl", "0 → 0, 1 → 1, 2 → 2", "pattern H", "host G"] },
  exclusion: { claim: { host: P3, patterns: [K3] }, shows: ["Bg", "Bw", "excluded pattern H1"] },
  // K1,3 is the Dynkin diagram D4 (Bourbaki, Lie Groups and Lie Algebras Ch. VI, Plate IV).
  identification: { claim: { graph: CLAW, family: "D4" }, shows: ["Cs", "D4", "family"] },
  // χ(P3) = x³ − 2x (Brouwer & Haemers, Spectra of Graphs §1.4.4: eigenvalues 0, ±√2).
  "characteristic-polynomial": { claim: { graph: P3, coefficients: ["1", "0", "-2", "0"] }, shows: ["Bg", "1, 0, -2, 0"] },
  // A3 = P3 has Coxeter number 4 and exponents 1, 2, 3 (Bourbaki Plate I).
  eigenvalues: { claim: { graph: P3, h: 4, multiset: [1, 2, 3] }, shows: ["Bg", "1, 2, 3", "multiset of m"] },
  structure: { claim: { graph: CLAW, predicate: "max-degree", parameter: 3 }, shows: ["Cs", "max-degree", "parameter"] },
  // A3 = P3: h = 4, |W(A3)| = 4! = 24 (Humphreys, Reflection Groups and Coxeter Groups, Table 2.4).
  "dynkin-data": { claim: { type: "A3", graph: P3, coxeterNumber: 4, weylGroupOrder: "24" }, shows: ["Bg", "Coxeter number h", "24"] },
  // Trees on ≤ 4 vertices: a path, or Δ ≥ 3 (K1,3 is the only other tree on 4 vertices; OEIS A000055).
  coverage: {
    claim: {
      maxVertices: 4,
      setting: "tree",
      cases: [
        { label: "3.1", condition: { predicate: "path" } },
        { label: "3.2", condition: { predicate: "max-degree", relation: ">=", value: 3 } },
      ],
    },
    shows: ["3.1: G is a path", "at most N vertices", "larger graph"],
  },
  // Connected graphs on ≤ 3 vertices with ρ < 2: P1, P2, P3 (K3 has ρ = 2).
  enumeration: {
    claim: { maxVertices: 3, op: "<", bound: "2", graphs: [{ format: "named", text: "path(1)" }, { format: "named", text: "path(2)" }, P3] },
    shows: ["@, A_, Bg", "at most N vertices", "connected simple graphs"],
  },
};

const checked = (kind: string, claim: Record<string, unknown>): SnapshotClaim => verifiedClaim({ kind, ...claim });

/** The card's view as lib/data/claim-views builds it (that module reads the database, so it is not imported here). */
function cardView(c: SnapshotClaim, id: number): ClaimView {
  const certificate = c.certificate ? JSON.parse(c.certificate) : null;
  return {
    id,
    stepId: 1,
    position: 1,
    kind: c.kind,
    status: c.status,
    statement: c.statement,
    method: methodWithoutCertificate(c.method ?? ""),
    certificateKind: certificateKindOf(c.kind, certificate)?.words ?? null,
    reason: c.reason,
    digest: c.digest,
    input: JSON.parse(c.input),
    inputs: claimInputsView(c.input, certificate),
    certificate: c.certificate ? { summary: "certificate", bytes: c.certificate.length, preview: "" } : null,
    checkerVersion: c.checkerVersion,
    decidedBy: null,
    progress: null,
    checkedByName: "Ada Quenby",
    checkedAt: c.checkedAt,
    createdAt: "2026-11-30T10:00:00.000Z",
    picture: null,
  };
}

function rowView(c: SnapshotClaim, id: number): ClaimRowView {
  const v = cardView(c, id);
  return {
    id,
    stepId: 1,
    stepNumber: "1(a)",
    caseNumber: "1",
    caseTitle: "One case",
    kind: v.kind,
    status: v.status,
    statement: v.statement,
    method: v.method,
    certificateKind: v.certificateKind,
    inputs: v.inputs,
    checkedAt: v.checkedAt,
  };
}

function snapshotOf(claims: SnapshotClaim[]): ProofSnapshot {
  return {
    id: 1,
    title: "Inputs on every surface",
    statement: "A statement.",
    requiredApprovals: 1,
    members: [{ name: "Ada Quenby", role: "author" }],
    cases: [
      {
        id: 10,
        number: "1",
        depth: 0,
        title: "One case",
        condition: "Always.",
        children: [],
        steps: claims.map((c, i) => ({ id: 100 + i, position: i + 1, revision: null, authorIds: [1], reviews: [], claims: [c] })),
      },
    ],
  };
}

const decode = (html: string) =>
  html
    .replace(/&lt;/g, "<")
    .replace(/&gt;/g, ">")
    .replace(/&quot;/g, '"')
    .replace(/&#x27;/g, "'")
    .replace(/&amp;/g, "&");
/** The LaTeX with its break opportunities removed, so a code split across them reads as one string. */
const flat = (tex: string) => tex.replace(/\\allowbreak\{\}/g, "");

const claims = Object.fromEntries(CLAIM_KINDS.map((k) => [k, checked(k, EXAMPLES[k].claim)])) as Record<ClaimKind, SnapshotClaim>;
const doc = documentOf(
  buildBundle(snapshotOf(CLAIM_KINDS.map((k) => claims[k])), { kind: "draft", exportedAt: "2026-12-01T10:00:00.000Z", exportedBy: "Ada Quenby" }),
);
const tex = flat(renderLatex(doc));
const print = decode(renderToStaticMarkup(<PrintDocument doc={doc} />));
const table = decode(renderToStaticMarkup(<ClaimsTable proofId={1} claims={CLAIM_KINDS.map((k, i) => rowView(claims[k], i + 1))} />));

describe("claim inputs on every surface, for every claim kind", () => {
  it("has an example for every kind", () => {
    for (const kind of CLAIM_KINDS) expect(EXAMPLES[kind], kind).toBeDefined();
  });
  it("the .tex with every kind's inputs compiles with pdflatex (so the PDF carries the appendix)", async () => {
    const { pdf, log } = await compileLatex(renderLatex(doc), { runs: 1 });
    expect(pdf.subarray(0, 5).toString()).toBe("%PDF-");
    expect(log).not.toMatch(/^! /m);
  }, 120_000);
  for (const kind of CLAIM_KINDS)
    describe(kind, () => {
      const c = claims[kind];
      const card = decode(renderToStaticMarkup(<ClaimCard claim={cardView(c, 1)} proofId={1} canRecheck={false} canWithdraw={false} onChanged={() => {}} />));
      const method = methodWithoutCertificate(c.method!);
      const words = certificateKindOf(kind, JSON.parse(c.certificate!))!.words;
      it("is decided, so a method and a certificate are shown", () => expect(c.status).not.toBe("undecided"));
      it("card shows the inputs, and the method with its certificate kind", () => {
        expect(card).toContain('data-testid="claim-card-inputs"');
        for (const s of EXAMPLES[kind].shows) expect(card, s).toContain(s);
        expect(card).toContain(`${method}<span class="text-stone-600"> · certificate: ${words}</span>`);
      });
      it("table shows the inputs in short form and in full when expanded", () => {
        const row = table.slice(table.indexOf(`<span class="font-mono text-xs">${kind}</span>`));
        expect(row).toContain('data-testid="claim-inputs-short"');
        for (const s of EXAMPLES[kind].shows) expect(row.slice(0, row.indexOf("</tr>")), s).toContain(s);
        expect(row.slice(0, row.indexOf("</tr>"))).toContain(`· certificate: ${words}`);
      });
      it("print view shows the inputs in its appendix, with method and certificate kind", () => {
        const at = print.indexOf(`data-claim-item="${doc.cases[0].steps[CLAIM_KINDS.indexOf(kind)].claims[0].id}"`);
        expect(at).toBeGreaterThan(print.indexOf('data-testid="print-claim-inputs"'));
        const section = print.slice(at, print.indexOf("</article>", at));
        for (const s of EXAMPLES[kind].shows) expect(section, s).toContain(s);
        expect(section).toContain(`by ${method}; certificate: ${words}.`);
      });
      it(".tex shows the inputs in its appendix, escaped, with method and certificate kind", () => {
        const appendix = tex.slice(tex.indexOf("\\section*{Appendix: claim inputs}"));
        const id = doc.cases[0].steps[CLAIM_KINDS.indexOf(kind)].claims[0].id;
        const section = appendix.slice(appendix.indexOf(escapeLine(id)), appendix.indexOf("\\subsection*", appendix.indexOf(escapeLine(id)) + 1) >>> 0);
        for (const s of EXAMPLES[kind].shows) expect(section, s).toContain(escapeLine(s));
        expect(section).toContain(`by ${escapeLine(method)}; certificate: ${escapeLine(words)}.`);
        expect(tex).toContain(`by ${escapeLine(method)} (certificate: ${escapeLine(words)})`);
      });
    });
});

describe("large inputs and certificate vectors", () => {
  // P300: 300 vertices, 299 edges, degrees 2 (298 times) and 1 (twice).
  const edges = Array.from({ length: 299 }, (_, i) => `${i} ${i + 1}`).join("\n");
  const big = checked("structure", { graph: { format: "edges", text: edges }, predicate: "tree" });
  const view = claimInputsView(big.input);

  it("summarise a graph over 200 vertices by order, size, degree sequence and graph6 digest, with a download on the card", () => {
    const g = view.entries[0].type === "graph" ? view.entries[0].graph : null;
    expect(view.large).toBe(true);
    expect(g).toMatchObject({ order: 300, size: 299, degreeSequence: "(2×298, 1×2)", entered: null, encoded: null, large: true });
    expect(g!.digest).toBe(sha256Hex(writeGraph6(path(300))));
    const card = renderToStaticMarkup(<ClaimCard claim={cardView(big, 7)} proofId={3} canRecheck={false} canWithdraw={false} onChanged={() => {}} />);
    expect(card).toContain('href="/api/proofs/3/claims/7/input"');
    expect(card).toContain("order 300, size 299");
    expect(card).not.toContain("298 299"); // the edge list itself is not inlined
    const bigTex = flat(renderLatex(documentOf(buildBundle(snapshotOf([big]), { kind: "draft", exportedAt: "2026-12-01T10:00:00.000Z", exportedBy: "Ada" }))));
    expect(bigTex).toContain("Large input (");
    expect(bigTex).toContain(g!.digest.slice(0, 8));
  });

  it("show the vector a Rayleigh certificate carries, so 'the vector x' of the reason is in the document", () => {
    // ρ(K1,5) = √5 > 2 (Brouwer & Haemers §1.4.1): the tree elimination stops and leaves a vector.
    const star = checked("spectral-radius-bound", { graph: { format: "named", text: "star(5)" }, op: ">", bound: "2" });
    const evidence = JSON.parse(star.certificate!).evidence as { kind: string; vector: [number, string][] };
    expect(evidence.kind).toBe("rayleigh");
    const d = documentOf(buildBundle(snapshotOf([star]), { kind: "draft", exportedAt: "2026-12-01T10:00:00.000Z", exportedBy: "Ada" }));
    const t = flat(renderLatex(d));
    const p = decode(renderToStaticMarkup(<PrintDocument doc={d} />));
    const entries = evidence.vector.map(([v, x]) => `${v}: ${x}`).join(", ");
    expect(p).toContain("certificate: Rayleigh vector x");
    expect(p).toContain(entries);
    expect(t).toContain(escapeLine(entries));
    expect(t).toContain("(certificate: Rayleigh vector)");
  });
});
