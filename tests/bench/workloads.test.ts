import { describe, expect, it } from "vitest";
import { extendedDWorkload, extendedE8Workload, halfDenseGraphWorkload, pathWorkload, randomTreeWorkload } from "./workloads";
import { sparseGraphWorkload, star4Workload, t12kWorkload, workloadDigest, workloadGraph, type Workload } from "./workloads";

// Expected edge counts and digests: the shared benchmark workload table (BENCH-WORKLOADS.md).
const table: Array<[string, () => Workload, number, string]> = [
  ["tree-100", () => randomTreeWorkload(100), 99, "c5dfdd7ba47549f0"],
  ["tree-300", () => randomTreeWorkload(300), 299, "5eb87b3d5c5307b2"],
  ["tree-1000", () => randomTreeWorkload(1000), 999, "b514d749abadeb2b"],
  ["tree-5000", () => randomTreeWorkload(5000), 4999, "eb9b641e0ff76482"],
  ["tree-10000", () => randomTreeWorkload(10000), 9999, "75d78ab17b9ec111"],
  ["tree-100000", () => randomTreeWorkload(100000), 99999, "021fb20ca5591e00"],
  ["G(n,m) n=1000", () => sparseGraphWorkload(1000), 1500, "4f21a70b384398dc"],
  ["G(n,m) n=5000", () => sparseGraphWorkload(5000), 7500, "07575c5300bbde5e"],
  ["G(n,1/2) n=10", () => halfDenseGraphWorkload(10), 13, "9b0625f9c132250f"],
  ["G(n,1/2) n=20", () => halfDenseGraphWorkload(20), 103, "e0b0ba4c9e0afb11"],
  ["G(n,1/2) n=30", () => halfDenseGraphWorkload(30), 234, "7fdfbd5696f239fd"],
  ["G(n,1/2) n=40", () => halfDenseGraphWorkload(40), 385, "d721fc0d5d682baf"],
  ["T(1,2,k) n=20", () => t12kWorkload(16), 19, "60118d01c8181288"],
  ["T(1,2,k) n=50", () => t12kWorkload(46), 49, "f40d7fe3d5c834b1"],
  ["T(1,2,k) n=100", () => t12kWorkload(96), 99, "0c6d046406a48b8c"],
  ["T(1,2,k) n=200", () => t12kWorkload(196), 199, "232d24d07e25dabe"],
  ["extended E8", extendedE8Workload, 8, "69beba24bea93427"],
  ["K_{1,4}", star4Workload, 4, "9ee64e6554036144"],
];

describe("benchmark workloads match the shared table", () => {
  for (const [name, make, edgeCount, digest] of table) {
    it(name, () => {
      const w = make();
      expect(w.edges.length).toBe(edgeCount);
      expect(workloadDigest(w)).toBe(digest);
    });
  }

  it("extended E8 has the edges listed in the table", () => {
    // Table: (0,1),(1,2),…,(6,7),(5,8).
    expect(extendedE8Workload().edges).toEqual([
      [0, 1],
      [1, 2],
      [2, 3],
      [3, 4],
      [4, 5],
      [5, 6],
      [6, 7],
      [5, 8],
    ]);
  });

  it("extended D_n is a tree with two forks (4 leaves, n-1 edges)", () => {
    // Shape of the affine D_{n-1} diagram (Bourbaki, Plate IV extended diagram): n vertices, 4 leaves.
    const g = workloadGraph(extendedDWorkload(12));
    expect(g.edges.length).toBe(11);
    const deg = new Array(12).fill(0);
    for (const e of g.edges) {
      deg[e.u]++;
      deg[e.v]++;
    }
    expect(deg.filter((d) => d === 1).length).toBe(4);
    expect(deg.filter((d) => d === 3).length).toBe(2);
  });

  it("paths have n-1 edges in order", () => {
    expect(pathWorkload(4).edges).toEqual([
      [0, 1],
      [1, 2],
      [2, 3],
    ]);
  });
});
