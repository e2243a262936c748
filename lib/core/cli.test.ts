import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { checkFile, EXIT_MALFORMED, EXIT_NOT_VERIFIED, EXIT_OK, formatReport, main } from "./cli";
import { validateClaim } from "./claims/claim-schema";
import { verifyClaim } from "./claims/claims";
import { intervalSparseInertia } from "./spectral/interval-elimination";
import { FLOAT_FRONT_DEGREE } from "./spectral/sparse-inertia";
import { rat } from "./arithmetic/rational";
import { prismWorkload, workloadGraph } from "../../tests/bench/workloads";

const FIXTURES = join(import.meta.dirname, "../../tests/fixtures/claims");
const scratch = mkdtempSync(join(tmpdir(), "cairn-cli-"));

function writeJson(name: string, value: unknown): string {
  const path = join(scratch, name);
  writeFileSync(path, typeof value === "string" ? value : JSON.stringify(value));
  return path;
}

describe("offline checker", () => {
  it("prints one line per claim and a summary; a refuted claim makes the exit code 1", () => {
    const report = checkFile(join(FIXTURES, "structure.json"));
    const text = formatReport(report);
    // C5 is not bipartite (it is an odd cycle; common practice), the other four claims hold.
    expect(text).toMatch(/✗ refuted\s+C5-bipartite/);
    expect(text).toMatch(/✓ verified\s+E8-legs\s+G is the star-like tree T\(1,2,4\)/);
    expect(text.split("\n").at(-1)).toBe("5 checked: 4 verified, 1 refuted, 0 undecided");
    expect(report.exitCode).toBe(EXIT_NOT_VERIFIED);
  });

  it("exits 0 when everything is verified", async () => {
    const path = writeJson("ok.json", { format: "cairn-claim/1", kind: "structure", graph: { format: "named", text: "path(3)" }, predicate: "tree" });
    expect(await main([path], () => {})).toBe(EXIT_OK);
  });

  it("names the JSON path of a malformed claim and exits 2, still checking the others", () => {
    const report = checkFile(join(FIXTURES, "malformed.json"));
    expect(report.exitCode).toBe(EXIT_MALFORMED);
    expect(report.lines[0].status).toBe("verified");
    expect(report.lines[1]).toMatchObject({ status: "malformed", label: "bad-op" });
    expect(report.lines[1].text).toContain("$.claims[1].op");
  });

  it("reports a file that is not JSON as malformed", () => {
    const report = checkFile(writeJson("broken.json", "{ not json"));
    expect(report.exitCode).toBe(EXIT_MALFORMED);
    expect(report.lines[0].text).toContain("not valid JSON");
  });

  it("reports a graph that does not parse with the path of its text", () => {
    const path = writeJson("bad-graph.json", [{ format: "cairn-claim/1", kind: "structure", graph: { format: "edges", text: "0 1\n1" }, predicate: "tree" }]);
    const report = checkFile(path);
    expect(report.exitCode).toBe(EXIT_MALFORMED);
    expect(report.lines[0].text).toMatch(/^\$\[0\]\.graph\.text: /);
  });

  it("undecided counts against the exit code", async () => {
    const path = writeJson("big.json", { format: "cairn-claim/1", kind: "structure", graph: { format: "named", text: "path(1000)" }, predicate: "connected" });
    const out: string[] = [];
    expect(await main(["--steps", "10", path], (s) => out.push(s))).toBe(EXIT_NOT_VERIFIED);
    expect(out.join("\n")).toContain("? undecided");
  });

  it("re-checks a carried certificate and says whether it matches", () => {
    const claim = { format: "cairn-claim/1", kind: "structure", graph: { format: "named", text: "path(3)" }, predicate: "connected" };
    const good = { kind: "structure", outcome: "verified", evidence: { kind: "forest", parent: [-1, 0, 1] } };
    const bad = { kind: "structure", outcome: "verified", evidence: { kind: "forest", parent: [-1, 0, 0] } };
    const okReport = checkFile(writeJson("cert-ok.json", { ...claim, certificate: good }));
    expect(okReport.lines[0].certificate?.matches).toBe(true);
    expect(okReport.exitCode).toBe(EXIT_OK);
    const badReport = checkFile(writeJson("cert-bad.json", { ...claim, certificate: bad }));
    expect(badReport.lines[0].status).toBe("verified");
    expect(badReport.lines[0].certificate?.matches).toBe(false);
    expect(formatReport(badReport)).toContain("certificate does NOT match");
    expect(badReport.exitCode).toBe(EXIT_NOT_VERIFIED);
  });

  it("re-checks a coverage claim from the file alone (conditions and certificate in it); a dropped uncovered graph is caught", () => {
    // Connected graphs on ≤ 4 vertices (OEIS A001349: 1, 1, 2, 6); the bipartite ones miss K3, the paw, the diamond and K4 (elementary).
    const claim = validateClaim({ format: "cairn-claim/1", kind: "coverage", maxVertices: 4, cases: [{ condition: { predicate: "bipartite" } }] });
    const certificate = verifyClaim(claim).verdict.certificate as { evidence: { uncovered: string[] } };
    expect(certificate.evidence.uncovered).toHaveLength(4);
    const ok = checkFile(writeJson("coverage-ok.json", { ...claim, certificate }));
    expect(ok.lines[0].status).toBe("refuted");
    expect(ok.lines[0].certificate?.matches).toBe(true);
    const dropped = { ...certificate, evidence: { ...certificate.evidence, uncovered: certificate.evidence.uncovered.slice(1) } };
    expect(checkFile(writeJson("coverage-bad.json", { ...claim, certificate: dropped })).lines[0].certificate?.matches).toBe(false);
  });

  it("--verbose prints the reason and notes of each verdict", async () => {
    const out: string[] = [];
    await main(["--verbose", join(FIXTURES, "structure.json")], (s) => out.push(s));
    expect(out.join("\n")).toMatch(/\n    · a spanning tree exists and G has exactly n − 1 = 7 edges/);
  });

  it("--json prints a machine-readable report", async () => {
    const out: string[] = [];
    await main(["--json", join(FIXTURES, "structure.json")], (s) => out.push(s));
    const parsed = JSON.parse(out.join("\n"));
    expect(parsed.reports[0].lines).toHaveLength(5);
    expect(parsed.reports[0].exitCode).toBe(EXIT_NOT_VERIFIED);
  });

  it("re-checks an inertia certificate whose steps are 2×2 pivots (b = 0 on a bipartite prism) and rejects one with a pair's sign changed", () => {
    // The prism C_12 □ K_2 at b = 0: every pivot of −A is 0, the float run pivots on edges (interval-elimination.ts).
    const g = workloadGraph(prismWorkload(12));
    const run = intervalSparseInertia(g, rat(0), FLOAT_FRONT_DEGREE, () => {})!;
    const evidence = {
      kind: "inertia",
      at: "0",
      engine: "sparse",
      steps: run.steps,
      signs: run.signs,
      positive: run.positive,
      negative: run.negative,
      zero: run.zero,
    };
    // ρ(G) ≤ 0 is false: the certificate shows a negative value of 0·I − A.
    const claim = {
      format: "cairn-claim/1",
      kind: "spectral-radius-bound",
      graph: { format: "edges", text: g.edges.map((e) => `${e.u} ${e.v}`).join("\n") },
      op: "<=",
      bound: "0",
    };
    const ok = checkFile(writeJson("pairs-ok.json", { ...claim, certificate: { kind: "spectral-radius-bound", outcome: "refuted", evidence } }));
    expect(ok.lines[0].status).toBe("refuted");
    expect(ok.lines[0].certificate?.matches, ok.lines[0].certificate?.text).toBe(true);
    const i = run.signs.indexOf("±");
    const signs = `${run.signs.slice(0, i)}+${run.signs.slice(i + 1)}`;
    const bad = checkFile(
      writeJson("pairs-bad.json", { ...claim, certificate: { kind: "spectral-radius-bound", outcome: "refuted", evidence: { ...evidence, signs } } }),
    );
    expect(bad.lines[0].certificate?.matches).toBe(false);
    expect(formatReport(bad)).toContain("certificate does NOT match");
  });

  it("stored certificates keep re-checking (a change of certificate format must not orphan old claims)", () => {
    // with-certificates.json holds claims with certificates from an earlier run of this checker.
    const report = checkFile(join(FIXTURES, "with-certificates.json"));
    expect(report.lines).toHaveLength(8);
    for (const line of report.lines) expect(line.certificate?.matches, `${line.label}: ${line.certificate?.text}`).toBe(true);
  });

  it("re-checks a dynkin-data certificate and rejects one with a tampered |W|", () => {
    // |W(E8)| = 696729600 (Humphreys, Reflection Groups and Coxeter Groups, Table 2.4).
    const claim = { format: "cairn-claim/1", kind: "dynkin-data", type: "E8", weylGroupOrder: "696729600" };
    const fresh = verifyClaim(validateClaim(claim));
    expect(fresh.verdict.status).toBe("verified");
    const certificate = fresh.verdict.certificate as { evidence: Record<string, unknown> };
    const good = checkFile(writeJson("dynkin-good.json", { ...claim, certificate }));
    expect(good.lines[0].certificate?.matches).toBe(true);
    expect(good.exitCode).toBe(EXIT_OK);
    const forged = { ...certificate, evidence: { ...certificate.evidence, weylGroupOrder: "696729601" } };
    const bad = checkFile(writeJson("dynkin-bad.json", { ...claim, certificate: forged }));
    expect(bad.lines[0].status).toBe("verified"); // the claim itself is still verified afresh …
    expect(bad.lines[0].certificate?.matches).toBe(false); // … but the carried certificate is rejected
    expect(bad.lines[0].certificate?.text).toMatch(/weylGroupOrder/);
    expect(bad.exitCode).toBe(EXIT_NOT_VERIFIED);
  });

  it("re-checks an exported G2 dynkin-data claim from the file alone and names a forged entry", () => {
    // G2 (Bourbaki, Plate IX): highest root 3α1 + 2α2, exponents 1, 5, h = 6; |W(G2)| = 12, the dihedral group of order 12
    // (Humphreys, Reflection Groups and Coxeter Groups, Table 2.4).
    const claim = { format: "cairn-claim/1", kind: "dynkin-data", type: "G2", marks: [3, 2], exponents: [1, 5], weylGroupOrder: "12" };
    const fresh = verifyClaim(validateClaim(claim));
    expect(fresh.verdict.status).toBe("verified");
    const certificate = fresh.verdict.certificate as { evidence: Record<string, unknown> };
    const good = checkFile(writeJson("g2-good.json", { format: "cairn-claims/1", claims: [{ ...claim, certificate }] }));
    expect(good.lines[0]).toMatchObject({ status: "verified", certificate: { matches: true } });
    expect(good.exitCode).toBe(EXIT_OK);
    // The Coxeter graph's characteristic polynomial of G2 is x² − 3 (M = [[0, √3], [√3, 0]]); x² − 2 is B2's.
    expect(certificate.evidence.coxeterGraphCharpoly).toEqual(["1", "0", "-3"]);
    const forged = { ...certificate, evidence: { ...certificate.evidence, coxeterGraphCharpoly: ["1", "0", "-2"] } };
    const bad = checkFile(writeJson("g2-bad.json", { ...claim, certificate: forged }));
    expect(bad.lines[0].certificate?.matches).toBe(false);
    expect(bad.lines[0].certificate?.text).toMatch(/coxeterGraphCharpoly/);
    expect(bad.exitCode).toBe(EXIT_NOT_VERIFIED);
    // A claim with a wrong |W| is refuted by the checker itself (exit 1), naming the value.
    const wrong = checkFile(writeJson("g2-wrong.json", { ...claim, weylGroupOrder: "24" }));
    expect(wrong.lines[0].status).toBe("refuted");
    expect(formatReport(wrong, true)).toMatch(/\|W\(G2\)\| = 12, not 24/);
  });

  it("rejects unknown options with exit 2", async () => {
    expect(await main(["--frobnicate"], () => {})).toBe(EXIT_MALFORMED);
  });
});
