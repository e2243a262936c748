import { describe, expect, it } from "vitest";
import { spawnSync } from "node:child_process";
import { Budget } from "../verdict";
import { canonicalKeyOf } from "./canonical-label";
import { type EnumerationSetting } from "./augmentation";
import { enumeratePart, mergeParts } from "./augmentation-parts";
import { checkCoverage, coveragePart, mergeCoverageParts, coverageVerdict, recheckCoverage, type CoverageCase } from "./coverage";
import { validateCondition } from "./case-condition";

// Connected graphs on n = 1..8 vertices: OEIS A001349.
const A001349 = [1, 1, 2, 6, 21, 112, 853, 11117];
// Trees on n = 1..14 vertices: OEIS A000055.
const A000055 = [1, 1, 1, 2, 3, 6, 11, 23, 47, 106, 235, 551, 1301, 3159];

const budget = () => new Budget(1e12);
const partsOf = (maxVertices: number, setting: EnumerationSetting, of: number, collect = false) =>
  Array.from({ length: of }, (_, i) => enumeratePart({ maxVertices, setting, collect, budget: budget() }, i, of));

/** Counts of `geng -c n` (Debian's nauty), read from its ">Z … graphs generated" line; null when geng is not installed. */
function gengCount(n: number): number | null {
  for (const cmd of ["nauty-geng", "geng"]) {
    const r = spawnSync(cmd, ["-c", "-u", String(n)], { encoding: "utf8" });
    if (r.error) continue;
    const m = /(\d+) graphs generated/.exec(r.stderr);
    if (m) return Number(m[1]);
  }
  return null;
}

describe("enumeration in independent parts", () => {
  it("parts of the connected graphs on ≤ 8 vertices add up to OEIS A001349 for several numbers of parts", () => {
    for (const of of [2, 3, 7]) {
      const parts = partsOf(8, { kind: "simple" }, of);
      const merged = mergeParts(parts);
      expect(merged.counts).toEqual(A001349);
      // Below the split level the work is shared: more than one part finds graphs on 8 vertices.
      expect(parts.filter((p) => p.counts[7] > 0).length).toBeGreaterThan(1);
    }
  });

  it("parts of the trees on ≤ 14 vertices add up to OEIS A000055", () => {
    for (const of of [3, 5]) expect(mergeParts(partsOf(14, { kind: "tree" }, of)).counts).toEqual(A000055);
  });

  it("the parts are a partition: every class is produced by exactly one part (connected graphs on ≤ 7 vertices, trees on ≤ 12)", () => {
    for (const [N, setting, of] of [
      [7, { kind: "simple" }, 4],
      [12, { kind: "tree" }, 6],
    ] as const) {
      const parts = partsOf(N, setting, of, true);
      const owner = new Map<string, number>();
      for (const p of parts)
        for (const g of p.levels!.flat()) {
          const k = canonicalKeyOf(g);
          expect(owner.has(k), `class found by parts ${owner.get(k)} and ${p.part}`).toBe(false);
          owner.set(k, p.part);
        }
      const whole = enumeratePart({ maxVertices: N, setting, budget: budget() }, 0, 1);
      expect(owner.size).toBe(whole.levels!.flat().length);
      for (const g of whole.levels!.flat()) expect(owner.has(canonicalKeyOf(g))).toBe(true);
    }
  });

  it("merged counts per n agree with nauty's geng -c (when installed)", () => {
    const merged = mergeParts(partsOf(8, { kind: "simple" }, 4)).counts;
    const geng = merged.map((_, i) => gengCount(i + 1));
    if (geng.some((c) => c === null)) return; // nauty not installed: A001349 above still checks the counts
    expect(merged).toEqual(geng);
  });

  it("parts of a multigraph enumeration (loops and double edges) add up to the whole", () => {
    const setting: EnumerationSetting = { kind: "multigraph", maxMultiplicity: 2, maxLoop: 1 };
    const whole = enumeratePart({ maxVertices: 5, setting, collect: false, budget: budget() }, 0, 1).counts;
    expect(whole[4]).toBeGreaterThan(0);
    expect(mergeParts(partsOf(5, setting, 3)).counts).toEqual(whole);
  });

  it("refuses to merge a missing, repeated or foreign part", () => {
    const parts = partsOf(5, { kind: "simple" }, 3);
    expect(() => mergeParts(parts.slice(0, 2))).toThrow(/part 2 of 3 is missing/);
    expect(() => mergeParts([...parts, parts[1]])).toThrow(/part 1 is given twice/);
    expect(() => mergeParts([...parts.slice(0, 2), partsOf(5, { kind: "simple" }, 4)[2]])).toThrow(/one of 4 parts, not of 3/);
  });
});

describe("coverage streamed and in parts", () => {
  const leaky: CoverageCase[] = [
    { label: "Δ ≤ 2", condition: validateCondition({ predicate: "max-degree", relation: "<=", value: 2 }) },
    { label: "triangle", condition: validateCondition({ predicate: "contains", graph: "Bw" }) },
  ];

  it("the merged parts give the single-process certificate (counts per sub-case, uncovered graphs up to isomorphism)", () => {
    const single = checkCoverage(7, leaky, budget());
    expect(single.status).toBe("refuted");
    const merged = mergeCoverageParts([0, 1, 2].map((i) => coveragePart(7, leaky, "simple", i, 3, budget())));
    expect(merged.orders).toEqual(A001349.slice(0, 7));
    expect(merged.covered).toEqual(single.certificate!.covered);
    expect(merged.uncoveredTotal).toBe(single.certificate!.uncovered.length);
    const keys = (xs: string[]) => xs.map((t) => canonicalKeyOf(parseG6(t))).sort();
    expect(keys(merged.uncovered)).toEqual(keys(single.certificate!.uncovered));
    // The merged certificate re-checks as the single-process run's outcome.
    expect(recheckCoverage(7, leaky, "refuted", merged, budget()).status).toBe("verified");
  });

  it("keeps at most the cap of uncovered graphs per order but counts them all, and the capped list re-checks", () => {
    const full = coveragePart(7, leaky, "simple", 0, 1, budget());
    const capped = coveragePart(7, leaky, "simple", 0, 1, budget(), 3);
    expect(capped.uncoveredTotal).toBe(full.uncoveredTotal);
    expect(capped.uncovered.every((l) => l.length <= 3)).toBe(true);
    const cert = mergeCoverageParts([capped], 5);
    expect(cert.uncovered.length).toBe(5);
    const v = coverageVerdict(7, leaky, "simple", cert);
    expect(v.reason).toMatch(new RegExp(`^${full.uncoveredTotal} of the .*, and \\d+ more \\(the first 5 in the certificate\\)`));
  });

  it("re-checks a certificate cut at the cap from another split: each listed graph is tested, and a covered one is named", () => {
    // "Δ ≤ 2" alone leaves 996 − 12 = 984 connected graphs on ≤ 7 vertices uncovered (OEIS A001349 sums to 996;
    // 7 paths and 5 cycles have Δ ≤ 2), more than the cap of 500.
    const only: CoverageCase[] = [leaky[0]];
    const cert = mergeCoverageParts([0, 1, 2, 3].map((i) => coveragePart(7, only, "simple", i, 4, budget())));
    expect(cert.uncoveredTotal).toBe(984);
    expect(cert.uncovered.length).toBe(500);
    expect(recheckCoverage(7, only, "refuted", cert, budget()).status).toBe("verified");
    // The path on 3 vertices ("Bg" in graph6: edges 0–2, 1–2) has Δ = 2, so it is covered.
    const smuggled = { ...cert, uncovered: ["Bg", ...cert.uncovered.slice(1)] };
    expect(recheckCoverage(7, only, "refuted", smuggled, budget()).reason).toMatch(/certificate\.uncovered\[0\] satisfies Δ ≤ 2/);
    const repeated = { ...cert, uncovered: [cert.uncovered[1], ...cert.uncovered.slice(1)] };
    expect(recheckCoverage(7, only, "refuted", repeated, budget()).reason).toMatch(/repeats a graph/);
    expect(recheckCoverage(7, only, "refuted", { ...cert, uncoveredTotal: 983 }, budget()).reason).toMatch(/uncoveredTotal must be 984/);
  });
});

import { parseGraph6 as parseG6 } from "../input/graph6";

import { generateConnected } from "./augmentation";
import { parseBound } from "../arithmetic/bound";
import { validateClaim } from "../claims/claim-schema";
import { claimPart, verifyClaim } from "../claims/claims";

describe("merged parts give the single run's result exactly", () => {
  it("the same graphs in the same order, and the same statistics, as one run (connected graphs on ≤ 7 vertices; ρ ≤ 3 on ≤ 8)", () => {
    for (const spectral of [undefined, { op: "<=" as const, bound: parseBound("3") }]) {
      const N = spectral ? 8 : 7;
      const whole = generateConnected({ maxVertices: N, spectral, budget: budget() });
      for (const of of [2, 3, 7]) {
        const parts = Array.from({ length: of }, (_, index) => generateConnected({ maxVertices: N, spectral, part: { index, of }, budget: budget() }));
        const merged = mergeParts(parts.map((r, i) => ({ part: i, parts: of, counts: r.counts, levels: r.levels, origins: r.origins, stats: r.stats })));
        expect(merged.levels.map((l) => l.map((g) => canonicalKeyOf(g)))).toEqual(whole.levels.map((l) => l.map((g) => canonicalKeyOf(g))));
        // Same labelled graphs, not only the same classes.
        expect(JSON.stringify(merged.levels)).toBe(JSON.stringify(whole.levels));
        for (const k of ["candidates", "labellings", "rowSum", "vector", "elimination"] as const) expect(merged.stats[k], k).toBe(whole.stats[k]);
      }
      // Connected graphs on n ≤ 7 vertices: OEIS A001349.
      if (!spectral) expect(whole.counts).toEqual(A001349.slice(0, 7));
    }
  });

  const claimOf = (o: Record<string, unknown>) => validateClaim({ format: "cairn-claim/1", ...o });
  const inParts = (claim: ReturnType<typeof validateClaim>, of: number) =>
    Array.from({ length: of }, (_, i) => {
      const r = claimPart(claim, i, of, { budget: budget() });
      if (!("result" in r)) throw new Error(r.undecided);
      // The parts travel as JSON between workers and the database.
      return JSON.parse(JSON.stringify(r.result)) as unknown;
    });
  const same = (claim: ReturnType<typeof validateClaim>, of: number) => {
    const single = verifyClaim(claim, { budget: budget() });
    const merged = verifyClaim(claim, { budget: budget(), parts: inParts(claim, of) });
    // Everything but the steps counted by this process's budget (the parts counted theirs; steps are not stored with a verdict).
    const { steps: _a, ...m } = merged.verdict;
    const { steps: _b, ...s } = single.verdict;
    expect(m).toEqual(s);
    expect(merged.digest).toBe(single.digest);
    return single.verdict;
  };

  it("enumeration claims: verified, refuted by a missing graph, refuted by a stray one — verdict and certificate as one job gives them", () => {
    const trees = generateConnected({ maxVertices: 10, setting: { kind: "tree" }, budget: budget() }).levels.flat();
    const listed = trees.map((g) => ({ format: "graph6", text: writeGraph6(g) }));
    const all = claimOf({ kind: "enumeration", setting: "tree", maxVertices: 10, op: "<=", bound: "100", graphs: listed });
    const v = same(all, 3);
    expect(v.status).toBe("verified");
    // Trees on n ≤ 10 vertices: OEIS A000055.
    expect((v.certificate!.evidence as { counts: number[] }).counts).toEqual(A000055.slice(0, 10));
    const missing = same(claimOf({ kind: "enumeration", setting: "tree", maxVertices: 10, op: "<=", bound: "100", graphs: listed.slice(0, -1) }), 4);
    expect(missing.status).toBe("refuted");
    expect(missing.reason).toMatch(/is not listed/);
    // Connected graphs on ≤ 7 vertices, none listed: refuted, all 996 (OEIS A001349) in the certificate.
    const none = same(claimOf({ kind: "enumeration", maxVertices: 7, op: "<", bound: "7", graphs: [] }), 2);
    expect(none.status).toBe("refuted");
    expect((none.certificate!.evidence as { counts: number[] }).counts).toEqual(A001349.slice(0, 7));
    // The path P4 ("Ch" in graph6) has ρ = 2cos(π/5) ≈ 1.618 (Brouwer & Haemers §1.4.4), so it is not among ρ < 1.5.
    same(claimOf({ kind: "enumeration", maxVertices: 8, op: "<", bound: "3/2", graphs: [{ format: "graph6", text: "Ch" }] }), 2);
    // Loops and double edges (sparse6 texts in the certificate).
    same(claimOf({ kind: "enumeration", setting: "multigraph", maxMultiplicity: 2, maxLoop: 1, maxVertices: 4, op: "<=", bound: "5", graphs: [] }), 3);
  });

  it("coverage claims: the same counts per sub-case and the same uncovered graphs in the same order, also when cut at the cap", () => {
    const leaky = [
      { label: "Δ ≤ 2", condition: { predicate: "max-degree", relation: "<=", value: 2 } },
      { label: "triangle", condition: { predicate: "contains", graph: "Bw" } },
    ];
    const v = same(claimOf({ kind: "coverage", maxVertices: 7, cases: leaky }), 3);
    expect(v.status).toBe("refuted");
    // Δ ≤ 2 alone leaves 984 of the 996 connected graphs on ≤ 7 vertices uncovered (see above): more than the cap.
    const capped = same(claimOf({ kind: "coverage", maxVertices: 7, cases: [leaky[0]] }), 5);
    expect((capped.certificate!.evidence as { uncoveredTotal: number }).uncoveredTotal).toBe(984);
    const covering = same(claimOf({ kind: "coverage", setting: "tree", maxVertices: 12, cases: [{ condition: { predicate: "tree" } }] }), 2);
    expect(covering.status).toBe("verified");
    // Trees on ≤ 12 vertices: 1+1+1+2+3+6+11+23+47+106+235+551 = 987 (OEIS A000055).
    expect(covering.reason).toMatch(/^All 987 graphs/);
  });

  it("refuses parts of another split or a missing part at the claim level", () => {
    const claim = claimOf({ kind: "enumeration", maxVertices: 6, op: "<", bound: "7", graphs: [] });
    const three = inParts(claim, 3);
    expect(() => verifyClaim(claim, { budget: budget(), parts: three.slice(1) })).toThrow(/part 0 of 3 is missing/);
    expect(() => verifyClaim(claim, { budget: budget(), parts: [three[0], three[0], three[2]] })).toThrow(/part 0 is given twice/);
  });
});

import { writeGraph6 } from "../input/graph6";
