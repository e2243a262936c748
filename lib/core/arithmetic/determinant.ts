/** Exact determinants of integer matrices. */
import type { Budget } from "../verdict";

/**
 * det M of an integer matrix by fraction-free elimination (E. H. Bareiss, "Sylvester's identity and multistep
 * integer-preserving Gaussian elimination", Math. Comp. 22, 1968), with row swaps on a zero pivot.
 */
export function integerDeterminant(m: readonly (readonly bigint[])[], budget?: Budget): bigint {
  const a = m.map((r) => r.slice());
  const n = a.length;
  let sign = 1n,
    prev = 1n;
  for (let k = 0; k < n; k++) {
    budget?.tick(n * n);
    let p = k;
    while (p < n && a[p][k] === 0n) p++;
    if (p === n) return 0n;
    if (p !== k) {
      [a[p], a[k]] = [a[k], a[p]];
      sign = -sign;
    }
    for (let i = k + 1; i < n; i++) {
      for (let j = k + 1; j < n; j++) a[i][j] = (a[i][j] * a[k][k] - a[i][k] * a[k][j]) / prev;
      a[i][k] = 0n;
    }
    prev = a[k][k];
  }
  return sign * (n === 0 ? 1n : a[n - 1][n - 1]);
}
