import { describe, expect, it } from "vitest";
import { makeGraph } from "../graph";
import { Budget } from "../verdict";
import { parseGraph } from "../input/parse";
import { cycle, path, star, starlike, complete, affineD, affineA, completeBipartite } from "../input/constructors";
import { isConnected, isBipartite, isTree, isForest, containsCycle, recheckConnected, recheckBipartite, recheckTree, recheckContainsCycle } from "./structure";
import { maxDegree, recheckMaxDegree, branchVertices, recheckBranchVertices, starlikeLegs, recheckStarlikeLegs } from "./degree-structure";

/** A deep copy of a certificate with one numeric entry changed (the first entry of the named array). */
function tamper(certificate: unknown, field: string, index = 0, delta = 1): unknown {
  const copy = JSON.parse(JSON.stringify(certificate)) as Record<string, unknown>;
  const arr = copy[field] as number[];
  arr[index] = (arr[index] + delta) % Math.max(arr.length, 2);
  return copy;
}

/** Expects the verdict's status, and that its certificate re-checks (the offline checker's view); returns the verdict. */
function settled<V extends { status: string; certificate?: unknown }>(v: V, status: string, recheck: (certificate: unknown) => { status: string }): V {
  expect(v.status).toBe(status);
  expect(recheck(v.certificate).status).toBe("verified");
  return v;
}

describe("connectivity", () => {
  it("verifies a path and re-checks its spanning tree; a changed parent is rejected", () => {
    const g = path(6);
    const v = settled(isConnected(g), "verified", (c) => recheckConnected(g, c));
    const bad = JSON.parse(JSON.stringify(v.certificate));
    bad.parent[5] = 2; // 2 is not adjacent to 5 in P6
    expect(recheckConnected(g, bad).status).toBe("refuted");
  });

  it("refutes a disjoint union with a component labelling that re-checks", () => {
    const g = parseGraph("path(3) + cycle(4)");
    const v = settled(isConnected(g), "refuted", (c) => recheckConnected(g, c));
    const merged = JSON.parse(JSON.stringify(v.certificate));
    merged.component = merged.component.map(() => 0); // one label everywhere proves nothing
    expect(recheckConnected(g, merged).status).toBe("refuted");
    expect(recheckConnected(g, tamper(v.certificate, "component", 3)).status).toBe("refuted");
  });

  it("returns undecided, not an exception, when the budget runs out", () => {
    expect(isConnected(path(1000), new Budget(50)).status).toBe("undecided");
  });

  it("rejects malformed certificates with a reason", () => {
    const r = recheckConnected(path(3), { kind: "forest", parent: [-1, 0] });
    expect(r.status).toBe("refuted");
    expect(r.reason).toMatch(/3 entries/);
  });
});

describe("bipartite", () => {
  it("even cycles and complete bipartite graphs are bipartite, with a colouring that re-checks", () => {
    // C_2k and K_{a,b} are bipartite (common practice).
    for (const g of [cycle(8), completeBipartite(3, 4), starlike([1, 2, 5])]) {
      const v = settled(isBipartite(g), "verified", (c) => recheckBipartite(g, c));
      expect(recheckBipartite(g, tamper(v.certificate, "colour", 0)).status).toBe("refuted");
    }
  });

  it("odd cycles and loops refute bipartiteness with an odd cycle", () => {
    // C_7 and K_4 contain odd cycles; a loop is an odd cycle of length 1 (convention stated in structure.ts).
    for (const g of [cycle(7), complete(4), parseGraph("0 1\n1 1")]) {
      const v = isBipartite(g);
      expect(v.status).toBe("refuted");
      expect(v.certificate?.kind).toBe("cycle");
      expect(recheckBipartite(g, v.certificate).status).toBe("verified");
    }
    const c7 = cycle(7);
    expect(recheckBipartite(c7, { kind: "cycle", cycle: [0, 1, 2, 3, 4, 5] }).status).toBe("refuted");
  });
});

describe("trees, forests and cycles", () => {
  it("verifies trees and re-checks them with the edge count", () => {
    const g = affineD(9);
    const v = settled(isTree(g), "verified", (c) => recheckTree(g, c));
    // Same spanning tree but one extra edge: the edge count argument must fail.
    const h = makeGraph(g.n, [...g.edges, { u: 0, v: 9 }]);
    expect(recheckTree(h, v.certificate).status).toBe("refuted");
  });

  it("multiple edges and loops are cycles of length 2 and 1", () => {
    const double = affineA(1);
    const v = isTree(double);
    expect(v.status).toBe("refuted");
    expect(v.certificate).toEqual({ kind: "cycle", cycle: [0, 1] });
    expect(containsCycle(affineA(0)).status).toBe("verified");
    expect(recheckContainsCycle(affineA(0), { kind: "cycle", cycle: [0] }).status).toBe("verified");
    expect(recheckContainsCycle(path(2), { kind: "cycle", cycle: [0, 1] }).status).toBe("refuted");
  });

  it("finds a genuine cycle in a graph with a long cycle", () => {
    const g = parseGraph("0 1\n1 2\n2 3\n3 4\n4 5\n5 0\n5 6");
    const v = containsCycle(g);
    expect(v.status).toBe("verified");
    expect(v.certificate?.kind === "cycle" && v.certificate.cycle.length).toBe(6);
    expect(recheckContainsCycle(g, v.certificate).status).toBe("verified");
  });

  it("a forest is not a tree; disconnection refutes tree but not forest", () => {
    const g = parseGraph("path(3) + star(3)");
    expect(isForest(g).status).toBe("verified");
    const t = settled(isTree(g), "refuted", (c) => recheckTree(g, c));
    expect(recheckTree(g, t.certificate, false).status).toBe("refuted");
  });
});

describe("degrees, branch vertices and legs", () => {
  it("maximum degree with a witness; a wrong maximum is rejected", () => {
    const g = star(5); // K_{1,5}: Δ = 5 (common practice)
    expect(maxDegree(g, "<=", 4).status).toBe("refuted");
    const v = settled(maxDegree(g, ">=", 5), "verified", (c) => recheckMaxDegree(g, c));
    expect(recheckMaxDegree(g, { ...v.certificate, maxDegree: 4, neighbours: [1, 2, 3, 4] }).status).toBe("refuted");
  });

  it("counts vertices of degree ≥ 3", () => {
    const g = affineD(7); // D̃_7 has two vertices of degree 3 (Brouwer & Haemers §3.1.1, section number from memory)
    const v = branchVertices(g, 2);
    expect(v.status).toBe("verified");
    expect(v.certificate?.branchVertices).toEqual([1, 4]);
    expect(recheckBranchVertices(g, v.certificate).status).toBe("verified");
    expect(recheckBranchVertices(g, { kind: "branch-vertices", branchVertices: [1] }).status).toBe("refuted");
    expect(branchVertices(path(5), 1).status).toBe("refuted");
  });

  it("reads the legs of Ẽ8 = T(1,2,5) and re-checks them", () => {
    // Ẽ8 is the star-like tree T(1,2,5) (Bourbaki Ch. 6 plates; Brouwer & Haemers §3.1.1, section number from memory).
    const g = starlike([1, 2, 5]);
    const v = starlikeLegs(g, [5, 2, 1]);
    expect(v.status).toBe("verified");
    expect(v.certificate).toEqual({ kind: "legs", centre: 5, legs: [[4, 3, 2, 1, 0], [6, 7], [8]] });
    expect(recheckStarlikeLegs(g, v.certificate).status).toBe("verified");
    const bad = JSON.parse(JSON.stringify(v.certificate));
    bad.legs[1] = [7, 6];
    expect(recheckStarlikeLegs(g, bad).status).toBe("refuted");
    expect(starlikeLegs(g, [1, 2, 4]).status).toBe("refuted");
  });

  it("refutes star-likeness for paths, two-branch trees and cyclic graphs, with re-checkable reasons", () => {
    for (const g of [path(5), affineD(6), cycle(5), parseGraph("star(3) + path(2)")]) {
      const v = settled(starlikeLegs(g), "refuted", (c) => recheckStarlikeLegs(g, c));
    }
  });
});
