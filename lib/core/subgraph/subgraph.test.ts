import { describe, expect, it } from "vitest";
import fc from "fast-check";
import type { Graph } from "../graph";
import { buildGraph } from "../input/graph-build";
import { Budget } from "../verdict";
import { parseGraph } from "../input/parse";
import { affineA, affineD, affineE, complete, cycle, disjointUnion, dynkinE, path, star, starlike } from "../input/constructors";
import { embedTreeInForest } from "./tree-embedding";
import { sweep } from "../families/structure";
import { checkEmbedding, excludeSubgraphs, findSubgraph, recheckExclusion, recheckSubgraph } from "./subgraph";

const PETERSEN = parseGraph("IheA@GUAo"); // graph6 of the Petersen graph, from memory; parse.test.ts checks girth 5

/**
 * Brute force over all injections V(H) → V(G), the definition itself (common practice): an injection is kept
 * when checkEmbedding accepts it; an H-edge back to an earlier vertex whose images are not adjacent prunes early.
 */
function bruteForce(h: Graph, g: Graph, induced: boolean): boolean {
  const phi: number[] = [];
  const used = new Set<number>();
  const adjacent = (a: number, b: number) => g.edges.some((e) => (e.u === a && e.v === b) || (e.u === b && e.v === a));
  const extend = (u: number): boolean => {
    if (u === h.n) return checkEmbedding(h, g, phi, induced) === null;
    for (let x = 0; x < g.n; x++) {
      if (used.has(x)) continue;
      if (!h.edges.every((e) => e.v !== u || e.u >= u || adjacent(phi[e.u], x))) continue;
      phi[u] = x;
      used.add(x);
      if (extend(u + 1)) return true;
      used.delete(x);
    }
    return false;
  };
  return extend(0);
}

describe("finding embeddings", () => {
  it("finds C5 in the Petersen graph and the embedding re-checks; a changed entry is rejected", () => {
    // The Petersen graph has girth 5, so it contains C5 (common practice; from memory).
    const v = findSubgraph(cycle(5), PETERSEN);
    expect(v.status).toBe("verified");
    const phi = v.certificate?.kind === "embedding" ? v.certificate.embedding : [];
    expect(checkEmbedding(cycle(5), PETERSEN, phi)).toBeNull();
    expect(recheckSubgraph(cycle(5), PETERSEN, v.certificate).status).toBe("verified");
    const bad = { kind: "embedding", embedding: [...phi] };
    bad.embedding[0] = phi[2]; // no longer injective
    expect(recheckSubgraph(cycle(5), PETERSEN, bad).status).toBe("refuted");
  });

  it("proves C4 absent from the Petersen graph by exhaustive search (girth 5)", () => {
    // Girth of the Petersen graph is 5 (common practice; from memory).
    const v = findSubgraph(cycle(4), PETERSEN);
    expect(v.status).toBe("refuted");
    expect(v.method).toBe("exhaustive backtracking search");
    expect(recheckSubgraph(cycle(4), PETERSEN, v.certificate).status).toBe("verified");
  });

  it("respects multiplicities and loops", () => {
    const triple = parseGraph("0 1 3\n1 2");
    expect(findSubgraph(affineA(1), triple).status).toBe("verified"); // double edge under a triple edge
    expect(findSubgraph(affineA(1), triple, { induced: true }).status).toBe("refuted"); // 2 ≠ 3
    expect(findSubgraph(affineA(1), path(5)).status).toBe("refuted");
    expect(findSubgraph(parseGraph("0 0 2"), parseGraph("0 1\n1 1 1")).status).toBe("refuted"); // loop weight 2 > 1
  });

  it("distinguishes subgraphs from induced subgraphs", () => {
    // P3 is a subgraph of K3 but not an induced one (common practice).
    expect(findSubgraph(path(3), complete(3)).status).toBe("verified");
    const v = findSubgraph(path(3), complete(3), { induced: true });
    expect(v.status).toBe("refuted");
    expect(recheckSubgraph(path(3), complete(3), v.certificate, true).status).toBe("verified");
    expect(recheckSubgraph(path(3), complete(3), { kind: "embedding", embedding: [0, 1, 2] }, true).status).toBe("refuted");
    // C4 is an induced subgraph of K_{2,3} (common practice).
    expect(findSubgraph(cycle(4), parseGraph("complete_bipartite(2,3)"), { induced: true }).status).toBe("verified");
  });

  it("finds Ẽ8 = T(1,2,5) in T(1,2,6) by the spider arm test", () => {
    const g = starlike([1, 2, 6]);
    const v = findSubgraph(affineE(8), g);
    expect(v.status).toBe("verified");
    expect(v.method).toMatch(/spider/);
    expect(recheckSubgraph(affineE(8), g, v.certificate).status).toBe("verified");
  });
});

describe("absence arguments", () => {
  it("the degree count decides K_{1,4} ⊄ path, and a changed argument is rejected", () => {
    const v = findSubgraph(star(4), path(1000));
    expect(v.status).toBe("refuted");
    expect(v.certificate).toEqual({ kind: "absence", argument: { kind: "degree-count", threshold: 4, inPattern: 1, inHost: 0 } });
    expect(recheckSubgraph(star(4), path(1000), v.certificate).status).toBe("verified");
    const bad = { kind: "absence", argument: { kind: "degree-count", threshold: 3, inPattern: 1, inHost: 0 } };
    expect(recheckSubgraph(star(4), path(1000), bad).status).toBe("refuted");
    expect(recheckSubgraph(star(3), affineD(6), v.certificate).status).toBe("refuted"); // K_{1,3} is present there
  });

  it("arm lengths decide Ẽ8 ⊄ D̃_n", () => {
    const g = affineD(200);
    const v = findSubgraph(affineE(8), g);
    expect(v.status).toBe("refuted");
    expect(v.certificate).toEqual({ kind: "absence", argument: { kind: "spider-arms", legs: [1, 2, 5] } });
    expect(recheckSubgraph(affineE(8), g, v.certificate).status).toBe("verified");
  });

  it("a connected pattern must fit in one component", () => {
    const v = findSubgraph(path(4), parseGraph("path(3) + path(3)"));
    expect(v.certificate).toEqual({ kind: "absence", argument: { kind: "component-fit", components: 2 } });
  });

  it("a cycle never fits in a forest", () => {
    const v = findSubgraph(cycle(3), path(10));
    expect(v.certificate).toEqual({ kind: "absence", argument: { kind: "cycle-in-forest" } });
  });

  it("an exhausted budget gives undecided", () => {
    expect(findSubgraph(cycle(4), PETERSEN, { budget: new Budget(20) }).status).toBe("undecided");
  });
});

describe("exclusion", () => {
  const affine = [affineD(4), affineE(6), affineE(7), affineE(8)];
  const names = ["D̃4", "Ẽ6", "Ẽ7", "Ẽ8"];

  it("E8 contains none of D̃4, Ẽ6, Ẽ7, Ẽ8", () => {
    // E8 = T(1,2,4) has ρ < 2 and so contains no affine diagram (J. H. Smith 1970; Brouwer & Haemers §3.1.1, section number from memory).
    const g = dynkinE(8);
    const v = excludeSubgraphs(g, affine, { patternNames: names });
    expect(v.status).toBe("verified");
    expect(recheckExclusion(g, affine, v.certificate).status).toBe("verified");
    const c = JSON.parse(JSON.stringify(v.certificate));
    c.absent.pop();
    expect(recheckExclusion(g, affine, c).status).toBe("refuted");
  });

  it("T(1,2,6) contains Ẽ8, found with an embedding", () => {
    const g = starlike([1, 2, 6]);
    const v = excludeSubgraphs(g, affine, { patternNames: names });
    expect(v.status).toBe("refuted");
    expect(v.certificate?.found?.index).toBe(3);
    expect(recheckExclusion(g, affine, v.certificate).status).toBe("verified");
    const c = JSON.parse(JSON.stringify(v.certificate));
    c.found.embedding[0] = c.found.embedding[1];
    expect(recheckExclusion(g, affine, c).status).toBe("refuted");
  });
});

describe("search agrees with brute force (property)", () => {
  const small = (maxN: number) =>
    fc.integer({ min: 1, max: maxN }).chain((n) =>
      fc
        .array(fc.record({ u: fc.integer({ min: 0, max: n - 1 }), v: fc.integer({ min: 0, max: n - 1 }), m: fc.integer({ min: 1, max: 2 }) }), { maxLength: 9 })
        .map((edges) =>
          buildGraph(
            n,
            edges.filter((e) => e.u !== e.v || e.m === 1),
          ),
        ),
    );

  it("for subgraphs and induced subgraphs of small multigraphs with loops", () => {
    fc.assert(
      fc.property(small(4), small(6), fc.boolean(), (h, g, induced) => {
        const v = findSubgraph(h, g, { induced });
        expect(v.status).toBe(bruteForce(h, g, induced) ? "verified" : "refuted");
        expect(recheckSubgraph(h, g, v.certificate, induced).status).toBe("verified");
      }),
      { numRuns: 400 },
    );
  });

  it("for trees inside forests, where the spider arm test decides", () => {
    const tree = (maxN: number) =>
      fc.integer({ min: 1, max: maxN }).chain((n) =>
        fc.array(fc.nat(), { minLength: n - 1, maxLength: n - 1 }).map((parents) =>
          buildGraph(
            n,
            parents.map((p, i) => ({ u: p % (i + 1), v: i + 1 })),
          ),
        ),
      );
    fc.assert(
      fc.property(tree(6), tree(9), (h, g) => {
        const v = findSubgraph(h, g);
        expect(v.status).toBe(bruteForce(h, g, false) ? "verified" : "refuted");
      }),
      { numRuns: 300 },
    );
  });

  it("handles a pattern with 2·10⁵ vertices", () => {
    const v = findSubgraph(path(200_000), starlike([100_000, 100_000, 3]));
    expect(v.status).toBe("verified");
  });
});

describe("odd cycles and bipartite hosts", () => {
  it("C5 is absent from a 40×40 grid because the grid is bipartite", () => {
    // Grid graphs are bipartite (colour by i + j parity; common practice), and C5 is an odd cycle.
    const lines: string[] = [];
    const id = (i: number, j: number) => i * 40 + j;
    for (let i = 0; i < 40; i++)
      for (let j = 0; j < 40; j++) {
        if (i + 1 < 40) lines.push(`${id(i, j)} ${id(i + 1, j)}`);
        if (j + 1 < 40) lines.push(`${id(i, j)} ${id(i, j + 1)}`);
      }
    const grid = parseGraph(lines.join("\n"));
    const v = findSubgraph(cycle(5), grid);
    expect(v.certificate).toEqual({ kind: "absence", argument: { kind: "odd-cycle-in-bipartite" } });
    expect(recheckSubgraph(cycle(5), grid, v.certificate).status).toBe("verified");
    expect(findSubgraph(cycle(6), grid).status).toBe("verified");
  });
});

describe("tree dynamic programme (Matula 1978) against brute force", () => {
  const tree = (minN: number, maxN: number) =>
    fc.integer({ min: minN, max: maxN }).chain((n) =>
      fc.array(fc.nat(), { minLength: n - 1, maxLength: n - 1 }).map((parents) =>
        buildGraph(
          n,
          parents.map((p, i) => ({ u: p % (i + 1), v: i + 1 })),
        ),
      ),
    );
  const forest = fc.tuple(tree(1, 6), tree(1, 5)).map(([a, b]) => disjointUnion(a, b));

  it("decides every small tree in every small forest, with a valid embedding", () => {
    fc.assert(
      fc.property(tree(1, 6), forest, (h, g) => {
        const budget = new Budget();
        const phi = embedTreeInForest(h, g, sweep(g, budget), budget);
        const brute = bruteForce(h, g, false);
        expect(phi !== null).toBe(brute);
        if (Array.isArray(phi)) expect(checkEmbedding(h, g, phi)).toBeNull();
      }),
      { numRuns: 300 },
    );
  });

  it("decides D̃ patterns the search cannot finish: D̃8 is absent from a star of forks", () => {
    // Centre with 1000 legs a–b, a–c: every two branch vertices are at distance ≤ 2, D̃8 needs distance 4.
    const edges: Array<{ u: number; v: number }> = [];
    let n = 1;
    for (let i = 0; i < 1000; i++) {
      const a = n++,
        b = n++,
        c = n++;
      edges.push({ u: 0, v: a }, { u: a, v: b }, { u: a, v: c });
    }
    const g = buildGraph(n, edges);
    const v = findSubgraph(affineD(8), g);
    expect(v.certificate).toEqual({ kind: "absence", argument: { kind: "tree-dp" } });
    expect(recheckSubgraph(affineD(8), g, v.certificate).status).toBe("verified");
    const w = findSubgraph(affineD(6), g); // D̃6: branch vertices at distance 2, present (a – centre – a')
    expect(w.status).toBe("verified");
    expect(recheckSubgraph(affineD(6), g, w.certificate).status).toBe("verified");
  });
});
