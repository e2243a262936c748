import { describe, expect, it } from "vitest";
import { eigs } from "mathjs";
import { makeGraph, type Graph } from "../graph";
import { parseGraph } from "../input/parse";
import { identifySmith, recheckIdentification } from "./identify";
import { parseFamilyName, SMITH_FAMILIES, type SmithFamily } from "./smith-families";
import { starlike, star, dynkinE, affineE } from "../input/constructors";
import { validateClaim } from "../claims/claim-schema";
import { verifyClaim } from "../claims/claims";

/** The same graph with vertices renumbered by a fixed pseudo-random permutation (LCG shuffle). */
function relabel(g: Graph, seed = 7): Graph {
  const perm = Array.from({ length: g.n }, (_, i) => i);
  let x = seed >>> 0;
  for (let i = g.n - 1; i > 0; i--) {
    x = (Math.imul(1664525, x) + 1013904223) >>> 0;
    const j = Math.floor((x / 2 ** 32) * (i + 1));
    [perm[i], perm[j]] = [perm[j], perm[i]];
  }
  return makeGraph(
    g.n,
    g.edges.map((e) => ({ u: perm[e.u], v: perm[e.v], m: e.m })),
  );
}

/** Floating-point spectral radius, for display-style cross-checks far from the threshold only. */
function floatRadius(g: Graph): number {
  const a = Array.from({ length: g.n }, () => new Array<number>(g.n).fill(0));
  for (const e of g.edges) {
    a[e.u][e.v] = e.m;
    a[e.v][e.u] = e.m;
  }
  const values = eigs(a).values as unknown as number[];
  return Math.max(...values.map((v) => Math.abs(v)));
}

describe("identification of every family", () => {
  const cases: Array<[SmithFamily, number[]]> = [
    ["A", [1, 2, 5, 30]],
    ["D", [4, 5, 9]],
    ["E", [6, 7, 8]],
    ["loop_path", [1, 2, 6]],
    ["A~", [0, 1, 2, 3, 11]],
    ["D~", [4, 5, 6, 13]],
    ["E~", [6, 7, 8]],
    ["loop_path2", [2, 3, 7]],
    ["fork_loop", [3, 4, 8]],
  ];
  for (const [family, sizes] of cases)
    for (const p of sizes)
      it(`recognises ${family}(${p}) after relabelling, and the certificate re-checks`, () => {
        const g = relabel(SMITH_FAMILIES[family].build(p), p * 31 + family.length);
        const v = identifySmith(g);
        expect(v.status).toBe("verified");
        expect(v.certificate).toMatchObject({ kind: "isomorphism", family, parameter: p });
        expect(recheckIdentification(g, v.certificate).status).toBe("verified");
        // Changing one entry of the bijection breaks it (two G-vertices on one family vertex, or a wrong edge).
        if (g.n >= 2 && v.certificate?.kind === "isomorphism") {
          const bad = { ...v.certificate, bijection: [...v.certificate.bijection] };
          bad.bijection[0] = bad.bijection[1];
          expect(recheckIdentification(g, bad).status).toBe("refuted");
        }
      });

  it("the affine members and loop families have ρ = 2 or < 2 as their class says (float cross-check)", () => {
    // ρ(A_n) = 2cos(π/(n+1)) (Brouwer & Haemers §1.4.4); ρ(E8) = 2cos(π/30) (Coxeter number 30, Bourbaki Ch. 6 plate VII);
    // tadpole loop_path(n): 2cos(π/(2n+1)) (from memory: the folding of A_2n); affine members: 2 (Smith 1970).
    expect(floatRadius(SMITH_FAMILIES.A.build(5))).toBeCloseTo(2 * Math.cos(Math.PI / 6), 9);
    expect(floatRadius(dynkinE(8))).toBeCloseTo(2 * Math.cos(Math.PI / 30), 9);
    expect(floatRadius(SMITH_FAMILIES.loop_path.build(3))).toBeCloseTo(2 * Math.cos(Math.PI / 7), 9);
    for (const g of [affineE(7), SMITH_FAMILIES.loop_path2.build(4), SMITH_FAMILIES.fork_loop.build(5), SMITH_FAMILIES["A~"].build(0)])
      expect(floatRadius(g)).toBeCloseTo(2, 9);
  });
});

describe("family claims and non-identification", () => {
  it("checks a stated family", () => {
    expect(identifySmith(dynkinE(7), "E7").status).toBe("verified");
    const v = identifySmith(dynkinE(7), "E8");
    expect(v.status).toBe("refuted");
    expect(v.reason).toMatch(/E7/);
    expect(identifySmith(affineE(8), "affine E8").status).toBe("verified");
    expect(identifySmith(affineE(8), "E9").status).toBe("verified"); // E9 = Ẽ8 in texts that continue E6, E7, E8
    expect(() => identifySmith(dynkinE(7), "E10")).toThrow(/not a family name/);
  });

  const forbidden: Array<[string, string, number, RegExp]> = [
    // T(a,b,c) with 1/(a+1)+1/(b+1)+1/(c+1) ≤ 1 contains Ẽ6, Ẽ7 or Ẽ8 (J. H. Smith 1970; Brouwer & Haemers §3.1.1, section number from memory).
    ["starlike(1,2,6)", "E~", 8, /1\/2 \+ 1\/3 \+ 1\/7 ≤ 1/],
    ["starlike(2,2,3)", "E~", 6, /contains Ẽ6/],
    ["starlike(1,3,4)", "E~", 7, /contains Ẽ7/],
    ["star(5)", "D~", 4, /degree 5/],
    ["two_branch(1,2; 3; 1,1)", "D~", 7, /distance 3/],
    ["complete(4)", "A~", 2, /cycle/],
    ["cycle(6) + path(1)", "", 0, /not connected/],
  ];
  for (const [text, family, parameter, reason] of forbidden)
    it(`${text} is in no family (${family || "disconnected"})`, () => {
      const g = relabel(parseGraph(text, "named"));
      const v = identifySmith(g);
      expect(v.status).toBe("refuted");
      expect(v.reason).toMatch(reason);
      if (family) expect(v.certificate).toMatchObject({ kind: "forbidden-subgraph", family, parameter });
      expect(recheckIdentification(g, v.certificate).status).toBe("verified");
    });

  it("the forbidden-subgraph argument really means ρ > 2 (float cross-check far from 2)", () => {
    // ρ(K_{1,5}) = √5 (ρ(K_{1,n}) = √n: Brouwer & Haemers §1.4, from memory); T(1,2,6) lies just above 2 (Smith 1970).
    expect(floatRadius(star(5))).toBeCloseTo(Math.sqrt(5), 9);
    expect(floatRadius(starlike([1, 2, 6]))).toBeGreaterThan(2.0001);
  });

  it("rejects a forbidden-subgraph certificate that is not proper, or names a ρ < 2 family", () => {
    const g = affineE(8);
    const identity = Array.from({ length: 9 }, (_, i) => i);
    expect(recheckIdentification(g, { kind: "forbidden-subgraph", family: "E~", parameter: 8, embedding: identity }).status).toBe("refuted");
    expect(recheckIdentification(g, { kind: "forbidden-subgraph", family: "E", parameter: 8, embedding: identity.slice(0, 8) }).status).toBe("refuted");
    expect(recheckIdentification(g, { kind: "isomorphism", family: "E~", parameter: 7, bijection: identity }).status).toBe("refuted");
  });
});

describe("family names", () => {
  it("reads the usual spellings", () => {
    expect(parseFamilyName("E7")).toEqual({ family: "E", parameter: 7 });
    expect(parseFamilyName("Ẽ8")).toEqual({ family: "E~", parameter: 8 });
    expect(parseFamilyName("affine D5")).toEqual({ family: "D~", parameter: 5 });
    expect(parseFamilyName("D̃_4")).toEqual({ family: "D~", parameter: 4 });
    expect(parseFamilyName("A~(0)")).toEqual({ family: "A~", parameter: 0 });
    expect(parseFamilyName("tadpole 3")).toEqual({ family: "loop_path", parameter: 3 });
    expect(parseFamilyName("D3")).toBeNull();
    expect(parseFamilyName("F4")).toBeNull();
  });
});

describe("diagram names as the literature writes them", () => {
  it("every spelling of affine E8 names the same diagram: T(1,2,5) by arm lengths, T_{2,3,6} by vertex counts with the centre (Bourbaki Plate VII; Brouwer & Haemers §3.1.1)", () => {
    for (const t of [
      "E~8",
      "E~(8)",
      "E8~",
      "Ẽ8",
      "Ẽ_8",
      "\\tilde{E}_8",
      "\\tilde E_8",
      "affine E8",
      "E_8^{(1)}",
      "E8^(1)",
      "E9",
      "E_9",
      "T(1,2,5)",
      "T_{2,3,6}",
      "T[2,3,6]",
    ])
      expect(parseFamilyName(t), t).toEqual({ family: "E~", parameter: 8 });
    // E8 itself: T(1,2,4) by arm lengths = T_{2,3,5} by vertex counts (Bourbaki Plate VII).
    for (const t of ["E8", "E_8", "E(8)", "E_{8}", "T(1,2,4)", "T_{2,3,5}", "T_2,3,5"]) expect(parseFamilyName(t), t).toEqual({ family: "E", parameter: 8 });
    expect(parseFamilyName("T(1,1,3)")).toEqual({ family: "D", parameter: 6 }); // D_n = T(1,1,n-3)
    expect(parseFamilyName("T(2,2,3)")).toBeNull(); // not a family (it contains Ẽ6 = T(2,2,2))
    expect(parseFamilyName("E10")).toBeNull();
  });
  it("the named graph input reads them too, and the graphs are the same", () => {
    const same = (a: string, b: string) =>
      expect(JSON.stringify(parseGraph(a).edges.length) + parseGraph(a).n, a).toBe(JSON.stringify(parseGraph(b).edges.length) + parseGraph(b).n);
    for (const t of ["affine E8", "Ẽ8", "E9", "T(1,2,5)", "T_{2,3,6}"]) same(t, "E~(8)");
    expect(parseGraph("T_{3,3,3}").n).toBe(7); // Ẽ6 = T(2,2,2) has 7 vertices
    expect(parseGraph("T(2,2,3)").n).toBe(8);
    expect(() => parseGraph("T_{0,2,3}")).toThrow(/including the centre/);
  });
  it("identification claims accept the literature's names", () => {
    for (const family of ["E9", "T_{2,3,6}", "Ẽ8"])
      expect(
        verifyClaim(validateClaim({ format: "cairn-claim/1", kind: "identification", graph: { format: "named", text: "starlike(1,2,5)" }, family })).verdict
          .status,
        family,
      ).toBe("verified");
  });
  it("eigenvalue claims by type: exponents of E7 with its Coxeter number 18 (Bourbaki Plate VI: 1, 5, 7, 9, 11, 13, 17)", () => {
    const c = validateClaim({
      format: "cairn-claim/1",
      kind: "eigenvalues",
      graph: { format: "named", text: "E(7)" },
      h: "Coxeter number of E7",
      multiset: "exponents of E_7",
    });
    expect(c).toMatchObject({ h: 18, multiset: [1, 5, 7, 9, 11, 13, 17] });
    expect(verifyClaim(c).verdict.status).toBe("verified");
    // D5: h = 8, exponents 1, 3, 4, 5, 7 (Bourbaki Plate IV).
    expect(
      validateClaim({
        format: "cairn-claim/1",
        kind: "eigenvalues",
        graph: { format: "named", text: "D(5)" },
        h: "coxeter number of D5",
        multiset: "exponents of D5",
      }),
    ).toMatchObject({ h: 8, multiset: [1, 3, 4, 5, 7] });
    expect(() =>
      validateClaim({ format: "cairn-claim/1", kind: "eigenvalues", graph: { format: "named", text: "E(7)" }, h: "Coxeter number of E9", multiset: [1] }),
    ).toThrow(/"E9" is not a finite Dynkin type/);
    expect(() =>
      validateClaim({ format: "cairn-claim/1", kind: "eigenvalues", graph: { format: "named", text: "E(7)" }, h: "eighteen", multiset: [1] }),
    ).toThrow(/expected a number or text like "Coxeter number of E7"/);
  });
});
