import { describe, expect, it } from "vitest";
import { GraphError, adjacency, type Graph } from "../graph";
import { parseGraph, parseEdgeList, parseAdjacencyMatrix, detectFormat } from "./parse";
import { parseGraph6, parseSparse6, writeGraph6, writeSparse6 } from "./graph6";
import { complete, completeBipartite, path, affineA, loopPath2 } from "./constructors";
import { graphJson } from "./canonical";
import { thrownBy } from "../../../tests/support/thrown";

const pairs = (g: Graph) => g.edges.map((e) => [e.u, e.v, e.m]);

function errorOf(run: () => unknown): GraphError {
  try {
    run();
  } catch (e) {
    if (e instanceof GraphError) return e;
    throw e;
  }
  throw new Error("expected a GraphError");
}

/** Girth by BFS from every vertex (test helper, small graphs only). */
function girth(g: Graph): number {
  const a = adjacency(g);
  let best = Infinity;
  for (let s = 0; s < g.n; s++) {
    const dist = new Array(g.n).fill(-1),
      parent = new Array(g.n).fill(-1);
    dist[s] = 0;
    const queue = [s];
    for (let qi = 0; qi < queue.length; qi++) {
      const x = queue[qi];
      for (let p = a.start[x]; p < a.start[x + 1]; p++) {
        const y = a.nbr[p];
        if (dist[y] < 0) {
          dist[y] = dist[x] + 1;
          parent[y] = x;
          queue.push(y);
        } else if (parent[x] !== y) best = Math.min(best, dist[x] + dist[y] + 1);
      }
    }
  }
  return best;
}

describe("graph6", () => {
  it("decodes the worked example of McKay's formats.txt", () => {
    // formats.txt: n = 5 with edges 0-2, 0-4, 1-3, 3-4 is "DQc".
    expect(pairs(parseGraph6("DQc"))).toEqual([
      [0, 2, 1],
      [0, 4, 1],
      [1, 3, 1],
      [3, 4, 1],
    ]);
  });

  it("decodes networkx's documented example DF{", () => {
    // networkx test_graph6.py: "DF{" has edges (0,3),(0,4),(1,3),(1,4),(2,3),(2,4),(3,4).
    expect(pairs(parseGraph("DF{")).map(([u, v]) => [u, v])).toEqual([
      [0, 3],
      [0, 4],
      [1, 3],
      [1, 4],
      [2, 3],
      [2, 4],
      [3, 4],
    ]);
  });

  it("reads the Petersen graph and cross-checks it is 3-regular with 15 edges and girth 5", () => {
    // "IheA@GUAo" from memory; cross-checked structurally (Petersen: 10 vertices, 3-regular, girth 5,
    // common practice; from memory).
    const g = parseGraph("IheA@GUAo");
    expect(g.n).toBe(10);
    expect(g.edges.length).toBe(15);
    const a = adjacency(g);
    for (let v = 0; v < 10; v++) expect(a.start[v + 1] - a.start[v]).toBe(3);
    expect(girth(g)).toBe(5);
  });

  it("writes the strings networkx checked against Sage", () => {
    // networkx test_graph6.py: K4 → ">>graph6<<C~", K_{6,9} → "N??F~z{~Fw^_~?~?^_?", K_67 → "~?@B" + "~"*368 + "w".
    expect(writeGraph6(complete(4), true)).toBe(">>graph6<<C~");
    expect(writeGraph6(completeBipartite(6, 9))).toBe("N??F~z{~Fw^_~?~?^_?");
    expect(writeGraph6(complete(67))).toBe("~?@B" + "~".repeat(368) + "w");
  });

  it("round-trips graphs of many orders, including the 4-byte N(n) form", () => {
    for (const n of [0, 1, 2, 5, 62, 63, 64, 100]) {
      const g = path(Math.max(n, 1));
      expect(graphJson(parseGraph6(writeGraph6(g)))).toBe(graphJson(g));
    }
  });

  it("refuses loops and multiple edges on write, and names the column of a bad byte", () => {
    expect(() => writeGraph6(affineA(1))).toThrow(/simple graphs only/);
    const e = errorOf(() => parseGraph6("D Qc"));
    expect([e.line, e.column]).toEqual([1, 2]);
    expect(errorOf(() => parseGraph6("DQ")).message).toMatch(/needs 2 data bytes/);
  });
});

describe("sparse6", () => {
  it("decodes networkx's documented examples", () => {
    // networkx sparse6.py docstrings: ":A_" is a triple edge 0-1, ":An" is P_2, ":Ab" a multigraph.
    expect(pairs(parseSparse6(":A_"))).toEqual([[0, 1, 3]]);
    expect(pairs(parseSparse6(">>sparse6<<:An"))).toEqual([[0, 1, 1]]);
    expect(pairs(parseSparse6(":Ab"))).toEqual([[0, 1, 2]]);
  });

  it("decodes the 18-vertex example of networkx's tests", () => {
    // networkx test_sparse6.py: ":Q___eDcdFcDeFcE`GaJ`IaHbKNbLM" has these 27 edges.
    const g = parseGraph(":Q___eDcdFcDeFcE`GaJ`IaHbKNbLM");
    expect(g.n).toBe(18);
    expect(
      pairs(g)
        .map(([u, v]) => `${u}-${v}`)
        .join(" "),
    ).toBe("0-1 0-2 0-3 1-12 1-14 2-13 2-15 3-16 3-17 4-7 4-9 4-11 5-6 5-8 5-9 6-10 6-11 7-8 7-10 8-12 9-15 10-14 11-13 12-16 13-17 14-17 15-16");
  });

  it("writes the padding special case exactly as networkx/Sage do", () => {
    // networkx test_sparse6.py test_padding: paths P_4..P_8.
    expect([4, 5, 6, 7, 8].map((n) => writeSparse6(path(n)))).toEqual([":Cdv", ":DaYn", ":EaYnN", ":FaYnL", ":GaYnLz"]);
    // networkx: K4 → ":CcKI", K_{6,9} → ":Nk" + "?G`cJ"*9.
    expect(writeSparse6(complete(4), true)).toBe(">>sparse6<<:CcKI");
    expect(writeSparse6(completeBipartite(6, 9))).toBe(":Nk" + "?G`cJ".repeat(9));
  });

  it("round-trips loops and multiple edges", () => {
    for (const g of [affineA(0), affineA(1), loopPath2(5), parseEdgeList("0 0 3\n0 1 2\n3 4\n4 4")]) {
      expect(graphJson(parseSparse6(writeSparse6(g)))).toBe(graphJson(g));
    }
  });

  it("round-trips powers of two, where the padding special case bites", () => {
    for (const n of [2, 4, 8, 16, 32, 64]) {
      for (const edges of [[[0, 1]], [[n - 2, n - 1]], [[0, n - 2]], [[n - 1, n - 1]]]) {
        const g = parseEdgeList(`n = ${n}\nbase = 0\n` + edges.map(([u, v]) => `${u} ${v}`).join("\n"));
        expect(graphJson(parseSparse6(writeSparse6(g)))).toBe(graphJson(g));
      }
    }
  });

  it("rejects incremental sparse6 with a clear error", () => {
    expect(() => parseGraph(";An")).toThrow(/incremental sparse6/);
  });
});

describe("edge lists", () => {
  it("reads integers, comments, multiplicities, loops and the n header", () => {
    const g = parseGraph("# a triangle with extras\nn = 6\n0 1\n1 2 2   # double edge\n2 0\n3 3\n");
    expect(g.n).toBe(6);
    expect(pairs(g)).toEqual([
      [0, 1, 1],
      [0, 2, 1],
      [1, 2, 2],
      [3, 3, 1],
    ]);
    expect(g.labels).toBeUndefined();
  });

  it("keeps identifier labels in order of first appearance and adds repeated pairs of a multigraph", () => {
    const g = parseGraph("multigraph: true\na b\nb c\nc a\nb a");
    expect(g.labels).toEqual(["a", "b", "c"]);
    expect(pairs(g)).toEqual([
      [0, 1, 2],
      [0, 2, 1],
      [1, 2, 1],
    ]);
  });

  it("names line and column of each mistake", () => {
    const cases: Array<[string, number, number, RegExp]> = [
      ["0 1\n1 2 0", 2, 5, /multiplicity/],
      ["0 1\n1", 2, 1, /found 1 field/],
      ["0 1\n1 2 3 4", 2, 1, /found 4 fields/],
      ["n = 3\n0 1\n2 3", 3, 3, /outside 0\.\.2/],
      ["0 1\nx $y", 2, 3, /not a vertex name/],
      ["0 1\nn = 4", 2, 1, /header/],
    ];
    for (const [text, line, column, message] of cases) {
      const e = errorOf(() => parseEdgeList(text));
      expect([e.line, e.column], text).toEqual([line, column]);
      expect(e.message).toMatch(message);
    }
  });
});

describe("adjacency matrices", () => {
  it("reads a symmetric matrix with a loop weight on the diagonal", () => {
    const g = parseGraph("[0, 1, 0]\n[1, 2, 1]\n[0, 1, 0]");
    expect(pairs(g)).toEqual([
      [0, 1, 1],
      [1, 1, 2],
      [1, 2, 1],
    ]);
  });

  it("names the first asymmetric entry", () => {
    const e = errorOf(() => parseAdjacencyMatrix("0 1 0 0\n1 0 1 0\n0 1 0 1\n0 0 2 0"));
    expect(e.message).toMatch(/entry \(3,4\) = 1 but entry \(4,3\) = 2/);
    expect([e.line, e.column]).toEqual([3, 7]);
  });

  it("rejects non-square input", () => {
    expect(errorOf(() => parseAdjacencyMatrix("0 1\n1 0 0")).message).toMatch(/square/);
  });
});

describe("format detection", () => {
  it("tells the formats apart", () => {
    expect(detectFormat(">>graph6<<DQc")).toBe("graph6");
    expect(detectFormat("DQc")).toBe("graph6");
    expect(detectFormat(":An")).toBe("sparse6");
    expect(detectFormat("E~(8) + path(2)")).toBe("named");
    expect(detectFormat("0 1 1 0\n1 0 1 0\n1 1 0 1\n0 0 1 0")).toBe("matrix");
    expect(detectFormat("0 1\n1 0")).toBe("matrix");
    expect(detectFormat("0 1\n1 2")).toBe("edges");
    expect(detectFormat("a b")).toBe("edges");
  });

  it("reports unknown named families with their column", () => {
    const e = errorOf(() => parseGraph("path(3) + tree(4)"));
    expect([e.line, e.column]).toEqual([1, 11]);
  });
});

describe("edge list header columns", () => {
  it("reads n=4 without spaces and points at the count", () => {
    expect(parseEdgeList("n=4\n0 1").n).toBe(4);
    const e = errorOf(() => parseEdgeList("n=x\n0 1"));
    expect([e.line, e.column]).toEqual([1, 3]);
  });
});

describe("graph6/sparse6 orders (N(n) encodings)", () => {
  it("writes the null, trivial and empty graphs as networkx does", () => {
    // networkx test_sparse6.py: null → ":?", trivial → ":@", empty 5 → ":D", empty 68 → ":~?@C", empty 258049 → ":~~???~?@";
    // networkx test_graph6.py: null → "?", trivial → "@".
    const empty = (n: number) => parseEdgeList(`n = ${n}`);
    expect([0, 1, 5, 68, 258049].map((n) => writeSparse6(empty(n)))).toEqual([":?", ":@", ":D", ":~?@C", ":~~???~?@"]);
    expect([writeGraph6(empty(0)), writeGraph6(empty(1))]).toEqual(["?", "@"]);
    expect(parseSparse6(":~~???~?@").n).toBe(258049);
  });

  it("reads formats.txt's N(n) examples", () => {
    // formats.txt: N(30) = 93; N(12345) = 126 66 63 120; N(460175067) = 126 126 63 90 90 90 90 90.
    const order = (bytes: number[]) => parseSparse6(":" + String.fromCharCode(...bytes)).n;
    expect(order([93])).toBe(30);
    expect(order([126, 66, 63, 120])).toBe(12345);
    expect(() => order([126, 126, 63, 90, 90, 90, 90, 90])).toThrow(/460175067 vertices is beyond the limit/);
  });

  it("sends a bare family name to the named reader, which asks for its argument", () => {
    expect(() => parseGraph("path")).toThrow(/expected "\("/);
  });
});

describe("JSON-style matrices", () => {
  it("reads [[…],[…]] on one line or several, and points at an asymmetric entry", () => {
    expect(pairs(parseGraph("[[0,1,0],[1,0,1],[0,1,0]]"))).toEqual([
      [0, 1, 1],
      [1, 2, 1],
    ]);
    expect(pairs(parseGraph("[[0, 2],\n [2, 0]]"))).toEqual([[0, 1, 2]]);
    const e = errorOf(() => parseGraph("[[0,1],[0,0]]"));
    expect(e.message).toMatch(/not symmetric/);
    expect([e.line, e.column]).toEqual([1, 5]);
  });
});

describe("line endings", () => {
  it("reads matrices and edge lists with CRLF and CR line ends alike", () => {
    for (const eol of ["\n", "\r\n", "\r"]) {
      expect(pairs(parseGraph(["0 1 1 1", "1 0 0 0", "1 0 0 0", "1 0 0 0"].join(eol)))).toEqual([
        [0, 1, 1],
        [0, 2, 1],
        [0, 3, 1],
      ]);
      const e = errorOf(() => parseGraph(["0 1", "1 2", "2 x y"].join(eol)));
      expect([e.line, e.column]).toEqual([3, 5]);
    }
  });
});

describe("edge lists that could mislead are refused with a way out", () => {
  const message = (text: string) => {
    const e = thrownBy(() => parseGraph(text));
    if (!e) throw new Error("accepted: " + text);
    return e.message;
  };
  it("1-based numbering: refused without a base header, read as 1..n with base = 1", () => {
    // P3 written 1-based (common practice in papers): would otherwise be P3 plus an isolated vertex 0.
    expect(message("1 2\n2 3")).toBe(
      'line 1, column 1: the vertices are numbered from 1 (no vertex 0 appears), but edge lists count from 0, so vertex 0 would be an extra isolated vertex. Add the header "base = 1" to read the vertices as 1..n, or "base = 0" if an isolated vertex 0 is meant',
    );
    const g = parseGraph("base = 1\n1 2\n2 3");
    expect(g.n).toBe(3);
    expect(g.edges.map((e) => [e.u, e.v])).toEqual([
      [0, 1],
      [1, 2],
    ]);
    expect(parseGraph("base: 1\nn = 4\n1 2").n).toBe(4);
    expect(parseGraph("base = 0\n1 2\n2 3").n).toBe(4);
    expect(message("base = 1\n0 1")).toMatch(/line 2, column 1: vertex 0 does not exist with the header "base = 1"/);
    expect(message("base = 2\n1 2")).toMatch(/"base" is 0 \(vertices 0..n-1\) or 1/);
    expect(message("base = 1\nn = 2\n1 3")).toMatch(/vertex 3 is outside 1..2 declared by the header n = 2/);
    // A list that starts at 0 or at 2 is read as before.
    expect(parseGraph("0 1\n1 2").n).toBe(3);
  });
  it("a repeated pair is refused unless the header says multigraph; an explicit multiplicity is fine", () => {
    expect(message("0 1\n1 2\n1 0")).toBe(
      'line 3, column 1: the edge {0, 1} is given twice (lines 1 and 3); a graph has one edge between two vertices. For a multigraph write the multiplicity once ("0 1 2") or add the header "multigraph: true"',
    );
    expect(message("2 2\n2 2\n0 1")).toMatch(/the loop at 2 is given twice/);
    expect(message("base = 1\n1 2\n2 1")).toMatch(/the edge \{1, 2\} is given twice/);
    expect(parseGraph("multigraph = true\n0 1\n1 0").edges).toEqual([{ u: 0, v: 1, m: 2 }]);
    expect(parseGraph("0 1 2").edges).toEqual([{ u: 0, v: 1, m: 2 }]);
    expect(message("multigraph: maybe\n0 1")).toMatch(/"multigraph" is true or false/);
    expect(message("n = 3\n0 1\nn = 4")).toMatch(/header `n = …` must come once/);
  });
  it("an edgeless graph needs its vertex count, and says so", () => {
    expect(message("")).toMatch(
      /the graph is empty: give edges one per line \("0 1"\), or for a graph without edges its vertex count as a header, e.g. "n = 5"/,
    );
    expect(message("# only a comment")).toMatch(/there are no edges: for a graph without edges give its vertex count/);
    expect(parseGraph("n = 5").n).toBe(5);
    expect(parseGraph("n = 5").edges).toEqual([]);
  });
});
