import { describe, expect, it } from "vitest";
import { extendedDWorkload, extendedE8Workload, halfDenseGraphWorkload, pathWorkload, randomTreeWorkload } from "./workloads";
import { sparseGraphWorkload, star4Workload, t12kWorkload, workloadDigest, workloadGraph, type Workload } from "./workloads";

// Expected edge counts and digests: the shared benchmark workload table (BENCH-WORKLOADS.md), family by family as it
// lists them; a tree on n vertices has n − 1 edges (so do the T(1,2,k), n = k + 4), as that table says.
type Row = [name: string, make: () => Workload, edgeCount: number, digest: string];
const trees = (digests: Record<number, string>): Row[] =>
  Object.entries(digests).map(([n, digest]) => [`tree-${n}`, () => randomTreeWorkload(Number(n)), Number(n) - 1, digest]);
const t12k = (digests: Record<number, string>): Row[] =>
  Object.entries(digests).map(([n, digest]) => [`T(1,2,k) n=${n}`, () => t12kWorkload(Number(n) - 4), Number(n) - 1, digest]);
const table: Row[] = [
  ...trees({ 100: "c5dfdd7ba47549f0", 300: "5eb87b3d5c5307b2", 1000: "b514d749abadeb2b" }),
  ...trees({ 5000: "eb9b641e0ff76482", 10000: "75d78ab17b9ec111", 100000: "021fb20ca5591e00" }),
  ["G(n,m) n=1000", () => sparseGraphWorkload(1000), 1500, "4f21a70b384398dc"],
  ["G(n,m) n=5000", () => sparseGraphWorkload(5000), 7500, "07575c5300bbde5e"],
  ["G(n,1/2) n=10", () => halfDenseGraphWorkload(10), 13, "9b0625f9c132250f"],
  ["G(n,1/2) n=20", () => halfDenseGraphWorkload(20), 103, "e0b0ba4c9e0afb11"],
  ["G(n,1/2) n=30", () => halfDenseGraphWorkload(30), 234, "7fdfbd5696f239fd"],
  ["G(n,1/2) n=40", () => halfDenseGraphWorkload(40), 385, "d721fc0d5d682baf"],
  ...t12k({ 20: "60118d01c8181288", 50: "f40d7fe3d5c834b1", 100: "0c6d046406a48b8c", 200: "232d24d07e25dabe" }),
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
