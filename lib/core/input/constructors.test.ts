import { describe, expect, it } from "vitest";
import { makeGraph, GraphError } from "../graph";
import { parseGraph } from "./parse";
import { sha256Hex, graphDigest, valueDigest } from "../digest";
import { canonicalJson, graphJson, CanonicalJsonError } from "./canonical";
import { affineA, affineD, affineE, dynkinD, dynkinE, forkLoop, loopPath, path, star, starlike, twoBranch, cycle, completeBipartite } from "./constructors";

/** The benchmark digest: "u v\n" per edge in generation order, first 16 hex digits of SHA-256. */
const benchDigest = (edges: Array<[number, number]>) => sha256Hex(edges.map(([u, v]) => `${u} ${v}\n`).join("")).slice(0, 16);

/** T(1,2,k) by the benchmark rule: path 0..k+2 plus (k, k+3). */
function benchT12k(k: number): Array<[number, number]> {
  const edges: Array<[number, number]> = [];
  for (let i = 0; i < k + 2; i++) edges.push([i, i + 1]);
  edges.push([k, k + 3]);
  return edges;
}

describe("constructors follow the benchmark layouts", () => {
  it("extended E8 = T(1,2,5) and K_{1,4}: benchmark digests and our vertex numbering", () => {
    // Digests from BENCH-WORKLOADS.md (the project's shared workload table).
    expect(benchDigest(benchT12k(5))).toBe("69beba24bea93427");
    expect(
      benchDigest([
        [0, 1],
        [0, 2],
        [0, 3],
        [0, 4],
      ]),
    ).toBe("9ee64e6554036144");
    expect(graphJson(affineE(8))).toBe(
      graphJson(
        makeGraph(
          9,
          benchT12k(5).map(([u, v]) => ({ u, v })),
        ),
      ),
    );
    expect(graphJson(star(4))).toBe(
      graphJson(
        makeGraph(
          5,
          [
            [0, 1],
            [0, 2],
            [0, 3],
            [0, 4],
          ].map(([u, v]) => ({ u, v })),
        ),
      ),
    );
  });

  it("T(1,2,k) for n = 20, 50, 100, 200 matches the benchmark digests", () => {
    const table: Array<[number, string]> = [
      [20, "60118d01c8181288"],
      [50, "f40d7fe3d5c834b1"],
      [100, "0c6d046406a48b8c"],
      [200, "232d24d07e25dabe"],
    ];
    for (const [n, digest] of table) {
      const edges = benchT12k(n - 4);
      expect(benchDigest(edges)).toBe(digest);
      expect(graphJson(starlike([1, 2, n - 4]))).toBe(
        graphJson(
          makeGraph(
            n,
            edges.map(([u, v]) => ({ u, v })),
          ),
        ),
      );
    }
  });

  it("D̃ on N vertices is the path 0..N−3 forked at both ends", () => {
    for (const N of [5, 6, 10]) {
      const edges: Array<{ u: number; v: number }> = [];
      for (let i = 0; i < N - 3; i++) edges.push({ u: i, v: i + 1 });
      edges.push({ u: 1, v: N - 2 }, { u: N - 4, v: N - 1 });
      expect(graphJson(affineD(N - 1))).toBe(graphJson(makeGraph(N, edges)));
    }
    expect(graphJson(twoBranch(1, 1, 3, 1, 1))).toBe(graphJson(affineD(7)));
  });
});

describe("family sizes", () => {
  it("have the vertex and edge counts of the diagrams", () => {
    // Vertex counts: D_n and E_n have n vertices, affine X̃_n has n + 1 (Bourbaki Ch. 6 plates I–IX);
    // trees have n − 1 edges, Ã_n (n ≥ 2) is the cycle C_{n+1} (common practice).
    expect([dynkinD(6).n, dynkinE(7).n, affineE(6).n, affineE(7).n, affineE(8).n, affineD(5).n]).toEqual([6, 7, 7, 8, 9, 6]);
    expect([dynkinE(7).edges.length, affineE(7).edges.length]).toEqual([6, 7]);
    expect(affineA(4).edges.length).toBe(5);
    expect(affineA(0).edges).toEqual([{ u: 0, v: 0, m: 2 }]);
    expect(affineA(1).edges).toEqual([{ u: 0, v: 1, m: 2 }]);
    expect(loopPath(3).edges).toEqual([
      { u: 0, v: 0, m: 1 },
      { u: 0, v: 1, m: 1 },
      { u: 1, v: 2, m: 1 },
    ]);
    expect(forkLoop(4).edges.map((e) => [e.u, e.v])).toEqual([
      [0, 0],
      [0, 1],
      [1, 2],
      [1, 3],
    ]);
  });

  it("rejects parameters outside a family", () => {
    expect(() => dynkinD(3)).toThrow(GraphError);
    expect(() => dynkinE(9)).toThrow(/6, 7, 8/);
    expect(() => path(0)).toThrow(/≥ 1/);
    expect(() => cycle(2)).toThrow(/≥ 3/);
  });
});

describe("named syntax", () => {
  it("builds unions left to right and accepts comments and brackets", () => {
    const g = parseGraph("(path(2) + star(2)) # a P2 and a P3\n + A~(0)", "named");
    expect(g.n).toBe(2 + 3 + 1);
    expect(g.edges.map((e) => [e.u, e.v, e.m])).toEqual([
      [0, 1, 1],
      [2, 3, 1],
      [2, 4, 1],
      [5, 5, 2],
    ]);
  });

  it("names line and column of mistakes", () => {
    const cases: Array<[string, number, number, RegExp]> = [
      ["path(3) +\n  cycle(2)", 2, 3, /≥ 3/],
      ["complete_bipartite(2)", 1, 20, /2 integers/],
      ["two_branch(1,1,3,1,1)", 1, 12, /groups/],
      ["path(3) path(2)", 1, 9, /unexpected/],
      ["E~(x)", 1, 4, /integer/],
    ];
    for (const [text, line, column, message] of cases) {
      let error: unknown;
      try {
        parseGraph(text, "named");
      } catch (e) {
        error = e;
      }
      expect(error, text).toBeInstanceOf(GraphError);
      const e = error as GraphError;
      expect([e.line, e.column], text).toEqual([line, column]);
      expect(e.message).toMatch(message);
    }
  });

  it("refuses sizes beyond the limit instead of exhausting memory", () => {
    expect(() => parseGraph("complete(100000)", "named")).toThrow(/edges/);
    expect(() => parseGraph("path(99999999999)", "named")).toThrow(/limit/);
  });
});

describe("canonical JSON and digests", () => {
  it("sorts keys, drops whitespace and writes BigInt as strings", () => {
    expect(canonicalJson({ b: [1, { d: 2, c: "x" }], a: 10n ** 30n, z: undefined })).toBe('{"a":"1000000000000000000000000000000","b":[1,{"c":"x","d":2}]}');
    expect(() => canonicalJson({ x: 0.5 })).toThrow(CanonicalJsonError);
    expect(() => canonicalJson({ x: Number.MAX_SAFE_INTEGER + 1 })).toThrow(/safe integers/);
  });

  it("is deterministic for graphs and independent of edge input order", () => {
    const g1 = makeGraph(3, [
      { u: 2, v: 1 },
      { u: 0, v: 1 },
    ]);
    const g2 = makeGraph(3, [
      { u: 0, v: 1 },
      { u: 1, v: 2 },
    ]);
    expect(graphJson(g1)).toBe('{"edges":[[0,1,1],[1,2,1]],"n":3}');
    expect(graphDigest(g1)).toBe(graphDigest(g2));
    expect(graphDigest(completeBipartite(1, 2))).not.toBe(graphDigest(g1)); // a different numbering is a different labelled graph
  });

  it("SHA-256 of known texts", () => {
    // FIPS 180-2 appendix B.1 test vector: SHA-256("abc").
    expect(sha256Hex("abc")).toBe("ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad");
    expect(valueDigest({ b: 1, a: 2 })).toBe(sha256Hex('{"a":2,"b":1}'));
  });
});

describe("canonical JSON errors", () => {
  it("name the path of the offending value", () => {
    expect(() => canonicalJson({ a: [1, { b: 0.25 }] })).toThrow("at a[1].b");
    const loop: Record<string, unknown> = {};
    loop.self = loop;
    expect(() => canonicalJson(loop)).toThrow(/refers to itself at self/);
    expect(canonicalJson(new Int32Array([3, 1]))).toBe("[3,1]");
  });
});
