/**
 * Full inertia of bI − A for an irrational algebraic b on any graph, by the certified floating-point
 * elimination at a double enclosure of b (interval-elimination.ts), with the zeros of its front proven by
 * exact kernel vectors over Q(b) — so that only what is set aside pays exact algebraic arithmetic, and the
 * rest never leaves floating point.
 *
 * Why kernel vectors over Q(b) can be recognised from floating point. Let P be b's minimal polynomial, of
 * degree d, with real roots b = b_1, …, b_d (a totally real b: every 2cos(2πk/n), √5, …). bI − A has entries
 * in Q(b), so its kernel has a basis N(b) over Q(b); normalised by an identity block at a set J of vertices
 * it is unique, and its entries are x_v = Σ_i c_{v,i} b^i with rational c. Each field embedding b ↦ b_j maps
 * N(b) to the normalised kernel basis N(b_j) of b_j I − A (A is rational). So the float kernel vectors at the
 * d roots, normalised at the same J, give the c's by one d×d Vandermonde solve per entry; they are rounded to
 * small rationals. Nothing here is trusted: every vector is then CHECKED EXACTLY, (b − loop_v)·x_v −
 * Σ_u w_uv x_u = 0 at every vertex as polynomials in b reduced modulo P (integer arithmetic). k checked vectors
 * with an identity block are independent, so nullity(bI − A) ≥ k, and the Gershgorin argument of
 * float-front.ts (deflate) makes the k eigenvalues of the front's component through 0 all 0.
 *
 * A b that is not totally real, of degree above MAX_CONJUGATE_DEGREE, or without a minimal polynomial, and
 * any vector that fails its check, leave the front undecided: the caller goes on exactly over Q(b).
 */
import { adjacency, type Graph } from "../graph";
import type { Budget } from "../verdict";
import { enclose, isolateByRank, type AlgebraicBound } from "../arithmetic/algebraic";
import { rationalEnclosure } from "../arithmetic/number-field";
import { deg, rootsBetween, sturmSequence, type Poly } from "../arithmetic/sturm";
import type { Rational } from "../arithmetic/rational";
import { roundedIntegerVector } from "./float-front";
import { certifiedRun, intervalElimination, type IntervalEliminationResult, type LiftedKernelCheck } from "./interval-elimination";
import { FLOAT_FRONT_DEGREE } from "./sparse-inertia";

/** Largest degree of b for which kernel vectors over Q(b) are recognised (one float run per conjugate). */
export const MAX_CONJUGATE_DEGREE = 8;

type Tick = (steps: number) => void;
type Enclosure = { lo: number; hi: number };

/** A double enclosure of the root of `poly` isolated by (lo, hi): its rational enclosure at 64 bits, ends rounded outward. */
function doubleEnclosure(poly: Poly, lo: Rational, hi: Rational): Enclosure | undefined {
  const root: AlgebraicBound = { kind: "algebraic", form: "root", text: "", poly, lo, hi, approx: 0 };
  const e = enclose(root, 64);
  const l = rationalEnclosure(e.lo),
    h = rationalEnclosure(e.hi);
  return l && h ? { lo: l[0], hi: h[1] } : undefined;
}

/**
 * The inertia of bI − A (every count certified), or undefined when the floating-point run cannot decide it:
 * an eigenvalue within the error bound of b that is not proven to be b itself.
 */
export function algebraicIntervalInertia(g: Graph, b: AlgebraicBound, budget: Budget): IntervalEliminationResult | undefined {
  const tick: Tick = (s) => budget.tick(s);
  const own = doubleEnclosure(b.poly, b.lo, b.hi);
  if (!own) return undefined;
  const d = deg(b.poly);
  const kernel: LiftedKernelCheck | undefined =
    b.minimal !== false && d <= MAX_CONJUGATE_DEGREE && rootsBetween(sturmSequence(b.poly), "-inf", "+inf") === d
      ? (rows, J, t) => proveKernel(g, b, own, rows, J, t)
      : undefined;
  return intervalElimination(g, { ...own, kernel }, FLOAT_FRONT_DEGREE, tick).result;
}

/** The approximate kernel basis of cI − A at a conjugate c (lifted, identity at its own set), or undefined. */
function conjugateKernel(g: Graph, at: Enclosure, tick: Tick): { rows: Float64Array[]; J: number[] } | undefined {
  let found: { rows: Float64Array[]; J: number[] } | undefined;
  certifiedRun(g, { ...at, kernel: (rows, J) => ((found = { rows: rows.map((r) => r.slice()), J: [...J] }), false) }, "double", FLOAT_FRONT_DEGREE, tick);
  return found;
}

/** M⁻¹ for a small square matrix (Gauss–Jordan with partial pivoting), or undefined when it is (nearly) singular. */
function inverse(M: number[][]): number[][] | undefined {
  const k = M.length;
  const A = M.map((row, i) => [...row, ...Array.from({ length: k }, (_, j) => (i === j ? 1 : 0))]);
  let scale = 0;
  for (const row of M) for (const x of row) scale = Math.max(scale, Math.abs(x));
  for (let c = 0; c < k; c++) {
    let p = c;
    for (let i = c + 1; i < k; i++) if (Math.abs(A[i][c]) > Math.abs(A[p][c])) p = i;
    if (!(Math.abs(A[p][c]) > 1e-12 * scale)) return undefined;
    [A[c], A[p]] = [A[p], A[c]];
    const pv = A[c][c];
    for (let j = 0; j < 2 * k; j++) A[c][j] /= pv;
    for (let i = 0; i < k; i++)
      if (i !== c && A[i][c] !== 0) {
        const f = A[i][c];
        for (let j = 0; j < 2 * k; j++) A[i][j] -= f * A[c][j];
      }
  }
  return A.map((row) => row.slice(k));
}

/**
 * Kernel vectors of bI − A over Q(b) from the float basis `rows` at b (identity at J) and the float kernels at
 * the other roots of P, checked exactly; true only when all k are proven.
 */
function proveKernel(g: Graph, b: AlgebraicBound, own: Enclosure, rows: readonly Float64Array[], J: readonly number[], tick: Tick): boolean {
  const P = b.poly,
    d = deg(P),
    n = g.n,
    k = rows.length;
  // The d real roots as doubles (b's own is the one nearest its enclosure), and the basis at each, normalised at J.
  const ownMid = own.lo / 2 + own.hi / 2;
  const roots: number[] = [];
  const encl: Enclosure[] = [];
  for (let rank = 0; rank < d; rank++) {
    const iso = isolateByRank(P, rank);
    const e = doubleEnclosure(P, iso.lo, iso.hi);
    if (!e) return false;
    roots.push(e.lo / 2 + e.hi / 2);
    encl.push(e);
  }
  const self = roots.reduce((best, r, i) => (Math.abs(r - ownMid) < Math.abs(roots[best] - ownMid) ? i : best), 0);
  const bases: Array<readonly Float64Array[]> = [];
  for (let j = 0; j < d; j++) {
    if (j === self) {
      bases.push(rows);
      continue;
    }
    const other = conjugateKernel(g, encl[j], tick);
    if (!other || other.rows.length !== k) return false;
    // Z[s][t] = x_s[J_t]; the basis normalised at J is N_r = Σ_s (Z⁻¹)[r][s]·x_s (then N_r[J_t] = δ_rt).
    const Zinv = inverse(other.rows.map((x) => J.map((v) => x[v])));
    if (!Zinv) return false;
    bases.push(
      Array.from({ length: k }, (_, r) => {
        const y = new Float64Array(n);
        for (let s = 0; s < k; s++) {
          const w = Zinv[r][s];
          if (w !== 0) for (let v = 0; v < n; v++) y[v] += w * other.rows[s][v];
        }
        return y;
      }),
    );
  }
  const Vinv = inverse(roots.map((r) => Array.from({ length: d }, (_, i) => r ** i)));
  if (!Vinv) return false;
  tick(k * n * d * (d + 1));
  const { start, nbr, wt, diag: loops } = adjacency(g);
  const at = new Map(J.map((v, t) => [v, t]));
  for (let r = 0; r < k; r++) {
    // Coefficients c_{v,i} (index v·d + i): exact 1 and 0 at J.
    const y = new Float64Array(n * d);
    for (let v = 0; v < n; v++)
      for (let i = 0; i < d; i++) {
        let s = 0;
        for (let j = 0; j < d; j++) s += Vinv[i][j] * bases[j][r][v];
        y[v * d + i] = s;
      }
    const ints = roundedIntegerVector(y, (idx) => {
      const t = at.get(Math.floor(idx / d));
      return t === undefined ? undefined : idx % d === 0 && t === r ? 1 : 0;
    });
    if (!ints || ints.length === 0) return false;
    const C = new Map<number, bigint[]>();
    for (const [idx, c] of ints) {
      const v = Math.floor(idx / d);
      let poly = C.get(v);
      if (!poly) C.set(v, (poly = new Array<bigint>(d).fill(0n)));
      poly[idx % d] = c;
    }
    // (t − loop_v)·C_v(t) − Σ_u w_uv C_u(t) ≡ 0 modulo P, at every vertex (degree ≤ d: a multiple of P iff E_d·P_i = E_i·P_d).
    tick(n + start[n]);
    for (let v = 0; v < n; v++) {
      const E = new Array<bigint>(d + 1).fill(0n);
      const cv = C.get(v);
      if (cv)
        for (let i = 0; i < d; i++) {
          E[i + 1] += cv[i];
          E[i] -= BigInt(loops[v]) * cv[i];
        }
      for (let q = start[v]; q < start[v + 1]; q++) {
        const cu = C.get(nbr[q]);
        if (cu) for (let i = 0; i < d; i++) E[i] -= BigInt(wt[q]) * cu[i];
      }
      for (let i = 0; i <= d; i++) if (E[d] * P[i] !== E[i] * P[d]) return false;
    }
  }
  return true;
}
