/**
 * Perron vector and spectral radius by power iteration in floating point — DISPLAY ONLY.
 *
 * Nothing here may decide a verdict (floating point cannot separate ρ = 2 from ρ < 2; see the exact
 * checks in inertia.ts and vector.ts). Iterating with A + I instead of A keeps the dominant eigenvalue
 * ρ + 1 strictly largest in modulus on bipartite graphs (where −ρ is also an eigenvalue of A), so the
 * iteration converges (R. von Mises & H. Pollaczek-Geiringer, "Praktische Verfahren der
 * Gleichungsauflösung", ZAMM 9 (1929) 58–77, for the power method; the shift is common practice).
 */
import { adjacency, Graph } from "./graph";

export interface PerronApproximation {
  /** Approximate ρ(G); floating point, display only. */
  rho: number;
  /** Approximate Perron vector, normalised to maximum entry 1; display only. */
  vector: number[];
  iterations: number;
  /** Largest change of a vector entry in the last iteration. */
  residual: number;
  displayOnly: true;
}

/**
 * Power iteration on A + I from the all-ones vector. For a disconnected graph the result concentrates
 * on a component of largest ρ.
 */
export function perronApproximation(g: Graph, maxIterations = 10_000, tolerance = 1e-12): PerronApproximation {
  const { start, nbr, wt, diag } = adjacency(g);
  const n = g.n;
  let x = new Float64Array(n).fill(1);
  let y = new Float64Array(n);
  let rho = 0, residual = Infinity, it = 0;
  for (; it < maxIterations && residual > tolerance; it++) {
    let top = 0;
    for (let v = 0; v < n; v++) {
      let s = x[v] * (1 + diag[v]);
      for (let k = start[v]; k < start[v + 1]; k++) s += wt[k] * x[nbr[k]];
      y[v] = s;
      if (s > top) top = s;
    }
    if (top === 0) break;
    // Rayleigh quotient of A at the current vector (better than the ratio of maxima).
    let num = 0, den = 0;
    for (let v = 0; v < n; v++) { num += x[v] * (y[v] - x[v]); den += x[v] * x[v]; }
    rho = den > 0 ? num / den : 0;
    residual = 0;
    for (let v = 0; v < n; v++) {
      y[v] /= top;
      residual = Math.max(residual, Math.abs(y[v] - x[v]));
    }
    [x, y] = [y, x];
  }
  return { rho, vector: Array.from(x), iterations: it, residual, displayOnly: true };
}
