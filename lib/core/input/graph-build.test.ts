import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { makeGraph, type Graph } from "../graph";
import { buildGraph } from "./graph-build";
import { parseSparse6, writeSparse6, parseGraph6, writeGraph6 } from "./graph6";
import { multiplicity } from "../certificates/certificate-check";

const multigraph = fc.integer({ min: 1, max: 40 }).chain((n) =>
  fc.tuple(
    fc.constant(n),
    fc.array(fc.record({ u: fc.integer({ min: 0, max: n - 1 }), v: fc.integer({ min: 0, max: n - 1 }), m: fc.integer({ min: 1, max: 3 }) }), {
      maxLength: 60,
    }),
  ),
);

describe("buildGraph", () => {
  it("gives exactly makeGraph's normalised graph (property, common practice: same contract)", () => {
    fc.assert(
      fc.property(multigraph, ([n, edges]) => {
        expect(buildGraph(n, edges)).toEqual(makeGraph(n, edges));
      }),
      { numRuns: 500 },
    );
  });

  it("rejects what makeGraph rejects, with the same message", () => {
    expect(() => buildGraph(2, [{ u: 0, v: 2 }])).toThrow("edge (0, 2) names a vertex outside 0..1");
    expect(() => buildGraph(2, [{ u: 0, v: 1, m: 0 }])).toThrow(/multiplicity 0/);
  });
});

describe("sparse6 and graph6 round trips (property)", () => {
  it("sparse6 preserves every multigraph with loops", () => {
    fc.assert(
      fc.property(multigraph, ([n, edges]) => {
        const g = buildGraph(n, edges);
        expect(parseSparse6(writeSparse6(g))).toEqual(g);
      }),
      { numRuns: 500 },
    );
  });

  it("graph6 preserves every simple graph", () => {
    fc.assert(
      fc.property(multigraph, ([n, edges]) => {
        const g = buildGraph(
          n,
          edges.filter((e) => e.u !== e.v).map((e) => ({ u: e.u, v: e.v })),
        );
        const simple = buildGraph(
          n,
          g.edges.map((e) => ({ u: e.u, v: e.v })),
        );
        expect(parseGraph6(writeGraph6(simple))).toEqual(simple);
      }),
      { numRuns: 300 },
    );
  });
});

describe("multiplicity look-up", () => {
  it("is right even for a graph literal whose edges are not in normalised order", () => {
    const g: Graph = {
      n: 4,
      edges: [
        { u: 2, v: 3, m: 1 },
        { u: 0, v: 3, m: 2 },
        { u: 0, v: 1, m: 1 },
        { u: 1, v: 1, m: 1 },
      ],
    };
    expect([multiplicity(g, 3, 0), multiplicity(g, 0, 1), multiplicity(g, 1, 1), multiplicity(g, 1, 3), multiplicity(g, 3, 2)]).toEqual([2, 1, 1, 0, 1]);
  });
});
