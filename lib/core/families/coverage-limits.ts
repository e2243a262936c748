/**
 * How far a coverage check over graphs with loops and multiple edges may go. Their number grows with
 * the bounds M (multiplicity) and L (loop weight): there are (M + 1)^C(n,2) · (L + 1)^n labelled
 * ones on n vertices, so about that divided by n! up to isomorphism (most have no symmetry; common
 * practice as an estimate). N is the largest order whose estimate stays within
 * MULTIGRAPH_COVERAGE_GRAPHS, about the 261,080 connected simple graphs on 9 vertices (OEIS A001349)
 * that bound the simple setting. The enumeration batch uses the same estimate with its own limit
 * (batch-enumeration.ts). No imports: claim validation and the checks read it.
 */

/** The most graphs (estimated, at the largest order) a multigraph coverage check may run over. */
export const MULTIGRAPH_COVERAGE_GRAPHS = 200_000n;

/** The largest N for multiplicities ≤ maxMultiplicity and loop weights ≤ maxLoop (at least 1). */
export function multigraphCoverageMaxVertices(maxMultiplicity: number, maxLoop: number): number {
  return multigraphMaxVertices(maxMultiplicity, maxLoop, MULTIGRAPH_COVERAGE_GRAPHS);
}

/** The largest n (at least 1) whose estimated number of graphs, as above, is at most `graphs`. */
export function multigraphMaxVertices(maxMultiplicity: number, maxLoop: number, graphs: bigint): number {
  const m = BigInt(maxMultiplicity + 1),
    l = BigInt(maxLoop + 1);
  let factorial = 1n;
  for (let k = 2; k <= 30; k++) {
    factorial *= BigInt(k);
    if (l ** BigInt(k) * m ** BigInt((k * (k - 1)) / 2) > graphs * factorial) return k - 1;
  }
  return 30;
}
