/**
 * Test support: an independent brute force over graphs with loops and multiple edges (a different
 * code path from the generator, augmentation.ts, and canonical-label.ts), shared by the core's tests
 * of enumeration, coverage and the batch. Not part of the product.
 */
import { makeGraph, type Graph } from "../../lib/core/graph";
import { integerDeterminant } from "../../lib/core/arithmetic/determinant";

/**
 * Independent brute force (a different code path from the generator and canonical-label.ts): every
 * symmetric n×n matrix with diagonal 0..maxLoop and off-diagonal 0..maxMult, kept when connected, one
 * per class, the class named by the lexicographically least entry string over all n! permutations.
 */
export function bruteForce(n: number, maxMult: number, maxLoop: number, keep: (A: number[][]) => boolean = () => true): number[][][] {
  const cells: Array<[number, number]> = [];
  for (let i = 0; i < n; i++) for (let j = i; j < n; j++) cells.push([i, j]);
  const perms: number[][] = [];
  const permute = (p: number[], rest: number[]) =>
    rest.length === 0
      ? perms.push(p)
      : rest.forEach((x, k) =>
          permute(
            [...p, x],
            rest.filter((_, j) => j !== k),
          ),
        );
  permute([], [...Array(n).keys()]);
  const classes = new Map<string, number[][]>();
  const A = Array.from({ length: n }, () => new Array<number>(n).fill(0));
  const visit = (c: number) => {
    if (c === cells.length) {
      // connected: a search from vertex 0
      const seen = new Set([0]);
      const todo = [0];
      while (todo.length) {
        const u = todo.pop()!;
        for (let v = 0; v < n; v++) if (v !== u && A[u][v] > 0 && !seen.has(v)) (seen.add(v), todo.push(v));
      }
      if (seen.size !== n) return;
      let best = "";
      for (const p of perms) {
        const s = cells.map(([i, j]) => A[p[i]][p[j]]).join(",");
        if (best === "" || s < best) best = s;
      }
      if (!classes.has(best) && keep(A))
        classes.set(
          best,
          A.map((r) => [...r]),
        );
      else if (!classes.has(best)) classes.set(best, []); // remembered as seen, not kept
      return;
    }
    const [i, j] = cells[c];
    for (let w = 0; w <= (i === j ? maxLoop : maxMult); w++) {
      A[i][j] = A[j][i] = w;
      visit(c + 1);
    }
    A[i][j] = A[j][i] = 0;
  };
  visit(0);
  return [...classes.values()].filter((m) => m.length > 0);
}

/** ρ(A) ≤ 2 ⟺ 2I − A is positive semidefinite ⟺ every principal minor ≥ 0; ρ(A) < 2 ⟺ every leading principal minor > 0 (Sylvester). */
export function rhoAtMostTwo(A: number[][], strict: boolean): boolean {
  const n = A.length;
  const B = A.map((r, i) => r.map((x, j) => BigInt((i === j ? 2 : 0) - x)));
  const minor = (idx: number[]) => integerDeterminant(idx.map((i) => idx.map((j) => B[i][j])));
  if (strict) return [...Array(n).keys()].every((k) => minor([...Array(k + 1).keys()]) > 0n);
  for (let mask = 1; mask < 1 << n; mask++) if (minor([...Array(n).keys()].filter((i) => mask & (1 << i))) < 0n) return false;
  return true;
}

export const toGraph = (A: number[][]): Graph => {
  const edges: Array<{ u: number; v: number; m: number }> = [];
  for (let u = 0; u < A.length; u++) for (let v = u; v < A.length; v++) if (A[u][v]) edges.push({ u, v, m: A[u][v] });
  return makeGraph(A.length, edges);
};

/**
 * A deliberately leaky split of the connected graphs with loops and multiple edges: simple / has a loop /
 * a multiple edge on at least 3 vertices. The only graph it misses is the double edge on 2 vertices
 * (elementary: a non-simple loopless graph has a multiple edge, and on 2 vertices that is the double edge).
 */
export const LEAKY_MULTIGRAPH_SPLIT = [
  { label: "simple", condition: { predicate: "simple" } },
  { label: "looped", condition: { predicate: "loops", relation: ">=", value: 1 } },
  {
    label: "multiple, n ≥ 3",
    condition: {
      and: [
        { predicate: "multiple-edges", relation: ">=", value: 1 },
        { predicate: "vertices", relation: ">=", value: 3 },
      ],
    },
  },
] as const;
