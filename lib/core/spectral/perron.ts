/**
 * Perron vector and spectral radius by power iteration in floating point — DISPLAY ONLY.
 *
 * Nothing here may decide a verdict (floating point cannot separate ρ = 2 from ρ < 2; see the exact
 * checks in inertia.ts and vector.ts). Iterating with A + I instead of A keeps the dominant eigenvalue
 * ρ + 1 strictly largest in modulus on bipartite graphs (where −ρ is also an eigenvalue of A), so the
 * iteration converges (R. von Mises & H. Pollaczek-Geiringer, "Praktische Verfahren der
 * Gleichungsauflösung", ZAMM 9 (1929) 58–77, for the power method; the shift is common practice).
 */
import { adjacency, Graph } from "../graph";

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
  // One normalisation for the whole graph: every vertex in "component" 0.
  const r = perronVectorsByComponent(g, new Int32Array(g.n), 1, maxIterations, tolerance);
  return { rho: r.rho, vector: Array.from(r.vector), iterations: r.iterations, residual: r.residual, displayOnly: true };
}

/**
 * Power iteration on A + I with every connected component normalised on its own (maximum entry 1),
 * so that no component fades next to one of larger ρ: approximate Perron vectors of all components
 * at once, the largest Rayleigh quotient among them and its component (`top`). Floating point: a HINT for choosing an exact
 * certificate, never a verdict.
 */
export function perronVectorsByComponent(
  g: Graph,
  comp: Int32Array,
  count: number,
  maxIterations = 2_000,
  tolerance = 1e-10,
): { vector: Float64Array; rho: number; top: number; iterations: number; residual: number } {
  const { start, nbr, wt, diag } = adjacency(g);
  const n = g.n;
  let x = new Float64Array(n).fill(1);
  let y = new Float64Array(n);
  const top = new Float64Array(count),
    num = new Float64Array(count),
    den = new Float64Array(count);
  let residual = Infinity,
    it = 0;
  for (; it < maxIterations && residual > tolerance; it++) {
    top.fill(0);
    num.fill(0);
    den.fill(0);
    for (let v = 0; v < n; v++) {
      let s = x[v] * (1 + diag[v]);
      for (let k = start[v]; k < start[v + 1]; k++) s += wt[k] * x[nbr[k]];
      y[v] = s;
      const c = comp[v];
      if (s > top[c]) top[c] = s;
      num[c] += x[v] * (s - x[v]);
      den[c] += x[v] * x[v];
    }
    residual = 0;
    for (let v = 0; v < n; v++) {
      const t = top[comp[v]];
      y[v] = t > 0 ? y[v] / t : 0;
      residual = Math.max(residual, Math.abs(y[v] - x[v]));
    }
    [x, y] = [y, x];
  }
  let rho = 0,
    best = 0;
  for (let c = 0; c < count; c++) if (den[c] > 0 && num[c] / den[c] > rho) [rho, best] = [num[c] / den[c], c];
  return { vector: x, rho, top: best, iterations: it, residual };
}
