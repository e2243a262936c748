import { describe, expect, it } from "vitest";
import { checkEnumeration, enumerateConnected, isomorphic, recheckEnumeration } from "./enumeration";
import { parseBound } from "../arithmetic/bound";
import { Budget } from "../verdict";
import { parseGraph } from "../input/parse";
import { identifySmith } from "./identify";
import { parseGraph6, writeGraph6 } from "../input/graph6";

// Smith's theorem (J. H. Smith 1970; Brouwer & Haemers, Spectra of Graphs, Thm 3.1.3): the connected
// graphs with ρ < 2 are A_n (n ≥ 1), D_n (n ≥ 4), E6, E7, E8; with ρ = 2 they are the cycles C_n
// (n ≥ 3), D̃_n (n ≥ 4, on n + 1 vertices, K_{1,4} = D̃4), Ẽ6, Ẽ7, Ẽ8 (on 7, 8, 9 vertices).
// Counted by order n = 1..9 (our tally of that list):
const BELOW_2 = [1, 1, 1, 2, 2, 3, 3, 3, 2]; // A_n; D_n from n = 4; E_n for n = 6, 7, 8
const AT_MOST_2 = [1, 1, 2, 3, 4, 5, 6, 6, 5]; // plus C_n from 3, D̃ from 5 vertices, Ẽ6/Ẽ7/Ẽ8 at 7/8/9

const budget = () => new Budget(1e9);
const graphs = (texts: string[]) => texts.map((t) => parseGraph(t, "named"));

describe("enumeration of connected graphs with small spectral radius", () => {
  it("finds Smith's graphs with ρ < 2 on up to 9 vertices, and nothing else", () => {
    const { levels } = enumerateConnected(9, "<", parseBound("2"), budget());
    expect(levels.map((l) => l.length)).toEqual(BELOW_2);
    // Each one is identified as a Dynkin diagram by the independent identification check.
    for (const g of levels.flat()) expect(identifySmith(g, undefined, budget()).status).toBe("verified");
  });

  it("finds the affine diagrams too with ρ ≤ 2", () => {
    const { levels } = enumerateConnected(9, "<=", parseBound("2"), budget());
    expect(levels.map((l) => l.length)).toEqual(AT_MOST_2);
  });

  const dynkinUpTo7 = ["A(1)", "A(2)", "A(3)", "A(4)", "D(4)", "A(5)", "D(5)", "A(6)", "D(6)", "E(6)", "A(7)", "D(7)", "E(7)"];

  it("verifies a correct list, with a certificate that re-checks by repeating the enumeration", () => {
    const listed = graphs(dynkinUpTo7);
    const v = checkEnumeration(7, "<", "2", listed, budget());
    expect(v.status).toBe("verified");
    expect(v.certificate!.counts).toEqual(BELOW_2.slice(0, 7));
    expect(recheckEnumeration(7, "<", "2", listed, "verified", v.certificate, budget()).status).toBe("verified");
    expect(recheckEnumeration(7, "<", "2", listed, "refuted", v.certificate, budget()).status).toBe("refuted");
    const forged = { ...v.certificate!, counts: [1, 1, 1, 2, 2, 3, 2] };
    expect(recheckEnumeration(7, "<", "2", listed, "verified", forged, budget()).status).toBe("refuted");
    // The graphs are compared up to isomorphism: another labelling of E7 (as the checker of another
    // version might write it) still re-checks; the cycle C7 (ρ = 2) in its place does not.
    const e7 = v.certificate!.graph6.findIndex((t) => isomorphic(parseGraph6(t), parseGraph("E(7)", "named"), budget()));
    expect(e7).toBeGreaterThanOrEqual(0);
    const relabelled = { ...v.certificate!, graph6: v.certificate!.graph6.map((t, i) => (i === e7 ? writeGraph6(parseGraph("E(7)", "named")) : t)) };
    expect(recheckEnumeration(7, "<", "2", listed, "verified", relabelled, budget()).status).toBe("verified");
    const wrong = { ...v.certificate!, graph6: v.certificate!.graph6.map((t, i) => (i === e7 ? writeGraph6(parseGraph("cycle(7)", "named")) : t)) };
    expect(recheckEnumeration(7, "<", "2", listed, "verified", wrong, budget()).reason).toMatch(/graph6\[\d+\] is not one of the graphs/);
  });

  it("refutes a list with a graph missing, one too many, or one twice, and says which", () => {
    const missing = checkEnumeration(7, "<", "2", graphs(dynkinUpTo7.filter((t) => t !== "E(7)")), budget());
    expect(missing.status).toBe("refuted");
    expect(missing.reason).toMatch(/a graph on 7 vertices \(graph6 .+\) with ρ < 2 is not listed/);
    const extra = checkEnumeration(7, "<", "2", graphs([...dynkinUpTo7, "cycle(5)"]), budget());
    expect(extra.status).toBe("refuted");
    expect(extra.reason).toMatch(/listed graph 14 .* does not have ρ < 2/);
    const twice = checkEnumeration(7, "<", "2", graphs([...dynkinUpTo7, "path(4)"]), budget());
    expect(twice.reason).toMatch(/listed graphs 4 and 14 are isomorphic/);
    // Smith's list up to 7 vertices has 1+1+1+2+2+3+3 = 13 graphs (BELOW_2 above); said once, "found" once.
    expect(missing.reason).toMatch(
      /; the enumeration found 13 graph\(s\) \(1 on 1, 1 on 2, 1 on 3, 2 on 4, 2 on 5, 3 on 6, 3 on 7\), after \d+ exact checks\.$/,
    );
    expect(missing.reason).not.toMatch(/found.*found/);
  });

  it("refutes a list of trees with ρ < 2 up to 20 vertices that leaves out E8, naming it", () => {
    // Smith's list (Brouwer & Haemers Thm 3.1.3): the trees with ρ < 2 on at most 20 vertices are A_1..A_20,
    // D_4..D_20, E6, E7, E8 — 39 trees.
    const names = [...Array.from({ length: 20 }, (_, i) => `A(${i + 1})`), ...Array.from({ length: 17 }, (_, i) => `D(${i + 4})`), "E(6)", "E(7)", "E(8)"];
    const full = checkEnumeration(20, "<", "2", graphs(names), budget(), "tree");
    expect(full.status).toBe("verified");
    expect(full.statement).toMatch(/^the trees on at most 20 vertices/);
    expect(recheckEnumeration(20, "<", "2", graphs(names), "verified", full.certificate, budget(), "tree").status).toBe("verified");
    const missing = checkEnumeration(20, "<", "2", graphs(names.filter((t) => t !== "E(8)")), budget(), "tree");
    expect(missing.status).toBe("refuted");
    const g6 = /a graph on 8 vertices \(graph6 (\S+)\) with ρ < 2 is not listed/.exec(missing.reason)![1];
    expect(isomorphic(parseGraph6(g6), parseGraph("E(8)", "named"), budget())).toBe(true);
    // A cycle is not a tree.
    expect(checkEnumeration(6, "<=", "2", graphs(["cycle(5)"]), budget(), "tree").reason).toMatch(/listed graph 1 has a cycle; this claim is about trees/);
  });
});
