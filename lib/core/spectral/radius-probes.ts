/**
 * The exact computations behind a verdict on "ρ(G) op b": the quadratic form of a witness vector, one
 * elimination of (at)I − A at a rational point with its certificate, the vector-first shortcut for
 * large graphs with cycles, the elimination over Q(b) and the characteristic polynomial with Sturm
 * sequences for an irrational b. Shared by the verdict (inertia.ts) and the re-check (radius-recheck.ts).
 */
import { Graph, adjacency } from "../graph";
import { Budget } from "../verdict";
import { Rational, add, cmp, gcd, mul, rat, ratToString, sign, sub } from "../arithmetic/rational";
import { Bound, boundApprox, enclose, boundPolynomial } from "../arithmetic/bound";
import { isForest, treeInertia, treeInertiaOver, StopRule } from "./tree-inertia";
import { AlgebraicField, rationalEnclosure } from "../arithmetic/number-field";
import { intervalElimination } from "./interval-elimination";
import { QUOTIENT_ABS, QUOTIENT_REL, quotientByDoubleWord, type DW } from "../arithmetic/double-word";
import { fieldSparseDefiniteness } from "./field-sparse-inertia";
import { algebraicIntervalInertia } from "./algebraic-kernel";
import { sparseInertia, FLOAT_FRONT_DEGREE, type SparseEliminationResult } from "./sparse-inertia";
import { characteristicPolynomial } from "./charpoly";
import { perronVectorsByComponent } from "./perron";
import { checkVectorCertificate, components } from "./vector";
import { Poly, polyGcd, sturmSequence, rootsBetween, deg, signAt } from "../arithmetic/sturm";
import { Relation, SpectralRadiusCertificate, Fact, inertiaRelation } from "./radius-certificate";

/** Precisions (bits) of the rational enclosures lo < b < hi at which an irrational b is probed. */
export const PROBE_BITS: readonly number[] = [20, 50];

/**
 * x^T (bI − A) x, exact; x maps vertices to rationals (absent = 0). Computed over one common denominator:
 * with L the lcm of x's denominators and y = L·x (integers), x^T (bI − A) x = (p·Σ y_v² − q·y^T A y) / (q·L²)
 * for b = p/q, so only integers are multiplied and added, and the fraction is reduced once (adding the
 * rational terms one by one reduces a fraction at every term: with a witness of thousands of bits per
 * entry, those gcds were nearly all the time of a verdict and of its re-check).
 */
export function quadraticForm(g: Graph, b: Rational, x: ReadonlyMap<number, Rational>, budget?: Budget): Rational {
  const { start, nbr, wt, diag } = adjacency(g);
  let l = 1n;
  for (const xv of x.values()) if (xv.den !== 1n && l % xv.den !== 0n) l = (l / gcd(l, xv.den)) * xv.den;
  const y = new Map<number, bigint>();
  for (const [v, xv] of x) if (xv.num !== 0n) y.set(v, xv.num * (l / xv.den));
  let squares = 0n,
    form = 0n; // Σ y_v², y^T A y
  for (const [v, yv] of y) {
    budget?.tick(1 + start[v + 1] - start[v]);
    const sq = yv * yv;
    squares += sq;
    if (diag[v] !== 0) form += BigInt(diag[v]) * sq;
    let cross = 0n;
    for (let k = start[v]; k < start[v + 1]; k++) {
      const u = nbr[k];
      const yu = u > v ? y.get(u) : undefined;
      if (yu !== undefined) cross += BigInt(wt[k]) * yu;
    }
    if (cross !== 0n) form += 2n * yv * cross;
  }
  return rat(b.num * squares - b.den * form, b.den * l * l);
}

export function runAt(
  g: Graph,
  at: Rational,
  stop: StopRule,
  budget: Budget,
  probeOnly = false,
  signsOnly = false,
): { fact: Fact; cert: SpectralRadiusCertificate; forest: boolean } {
  const forest = isForest(g);
  // A forest's early stop is certified by its sign alone when asked (the re-check repeats the
  // elimination): no witness vector, whose exact quadratic form can cost far more than the elimination.
  const witness = !probeOnly && !(signsOnly && forest);
  const r = forest ? treeInertia(g, at, stop, budget, false, witness) : sparseInertia(g, at, stop, budget, undefined, { degree: FLOAT_FRONT_DEGREE });
  const atText = ratToString(at);
  if (r.complete) {
    const sr = r as SparseEliminationResult;
    const sparse = "steps" in r ? { steps: sr.steps, signs: sr.signs, ...(sr.front !== undefined ? { front: sr.front } : {}) } : {};
    const cert: SpectralRadiusCertificate = {
      kind: "inertia",
      at: atText,
      engine: forest ? "forest" : "sparse",
      ...sparse,
      positive: r.positive,
      negative: r.negative,
      zero: r.zero,
    };
    return { fact: { rel: inertiaRelation(r), at }, cert, forest };
  }
  // A probe whose failure is not going to be reported needs no certificate (and no costly re-evaluation).
  if (probeOnly) return { fact: { rel: ">=", at }, cert: { kind: "rayleigh", at: atText, vector: [], value: "0" }, forest };
  if (!witness) {
    const sign = r.stopSign!;
    return { fact: { rel: sign < 0 ? ">" : ">=", at }, cert: { kind: "tree-signs", at: atText, stop, stoppedAt: r.stoppedAt!, sign }, forest };
  }
  const vector = [...r.witness!].filter(([, x]) => x.num !== 0n).sort((a, b) => a[0] - b[0]);
  // The certificate states the value recomputed from the vector itself, checked against the engine.
  const value = quadraticForm(g, at, r.witness!, budget);
  if (cmp(value, r.witnessValue!) !== 0)
    throw new Error(`internal error: witness value ${ratToString(value)} differs from the elimination's ${ratToString(r.witnessValue!)}`);
  const cert: SpectralRadiusCertificate = { kind: "rayleigh", at: atText, vector: vector.map(([v, x]) => [v, ratToString(x)]), value: ratToString(value) };
  return { fact: { rel: sign(value) < 0 ? ">" : ">=", at }, cert, forest };
}

export const VECTOR_METHOD = {
  rayleigh: "Rayleigh quotient at an exact integer vector (suggested by power iteration)",
  "collatz-wielandt": "Collatz–Wielandt bound at an exact positive integer vector (suggested by power iteration)",
};

/** Graphs with a cycle and at least this many vertices try a vector certificate before any elimination. */
export const VECTOR_FIRST_MIN_VERTICES = 200;

/**
 * A quick exact proof for a large graph with a cycle, when there is one. Floating-point power
 * iteration only suggests a vector (entries rounded to integers); the proof is exact:
 * - ρ > b: xᵀ(at·I − A)x < 0 at a rational `at` ≥ b, computed in rationals (a Rayleigh certificate);
 * - ρ < b: x > 0 with (Ax)_v < b·x_v at every vertex, compared exactly with b (Collatz–Wielandt).
 * When the hint is within 10⁻⁹ of b both are tried (an exact check, so a wrong guess costs one pass over
 * the edges): a regular graph's Perron vector is constant, so its rounded vector is exact and decides b = k ± 2⁻⁶⁰
 * at once. Undefined when neither check holds; the elimination then decides.
 */
export function vectorFirst(g: Graph, b: Bound, budget: Budget): { rel: Relation; cert: SpectralRadiusCertificate; at?: Rational } | undefined {
  if (g.n < VECTOR_FIRST_MIN_VERTICES || isForest(g)) return undefined;
  const { comp, count } = components(g);
  const hint = perronVectorsByComponent(g, comp, count);
  budget.tick(hint.iterations * (g.n + 2 * g.edges.length));
  const approx = b.kind === "rational" ? Number(b.value.num) / Number(b.value.den) : boundApprox(b);
  const margin = 1e-9 * Math.max(1, Math.abs(approx));
  const above = hint.rho > approx + margin;
  const below = hint.rho < approx - margin;
  if (!below) {
    const at = b.kind === "rational" ? b.value : enclose(b, 50).hi;
    // The component of largest ρ only: the others would add positive terms to xᵀ(at·I − A)x.
    const x = new Map<number, Rational>();
    hint.vector.forEach((v, i) => {
      const k = Math.round(v * 2 ** 24);
      if (k > 0 && comp[i] === hint.top) x.set(i, rat(k));
    });
    const value = x.size === 0 ? undefined : quadraticForm(g, at, x, budget);
    if (value !== undefined && sign(value) < 0)
      return {
        rel: ">",
        at,
        cert: { kind: "rayleigh", at: ratToString(at), vector: [...x].map(([v, xv]) => [v, ratToString(xv)]), value: ratToString(value) },
      };
    if (above) return undefined;
  }
  // Rounded up, so every entry is a positive integer.
  const vector = Array.from(hint.vector, (v) => String(Math.max(1, Math.ceil(v * 2 ** 24))));
  if (checkVectorCertificate(g, vector, "<", b, budget).status !== "verified") return undefined;
  return { rel: "<", cert: { kind: "collatz-wielandt", vector } };
}

type AlgebraicCertificate = SpectralRadiusCertificate & { kind: "algebraic-tree" | "algebraic-sparse" };

/**
 * bI − A positive definite for an irrational b, shown by the certified floating-point elimination with b
 * replaced by a double enclosure of it (interval-elimination.ts; from b's rational enclosure at 64 bits, each
 * end rounded outward): every pivot and the front's discs are then certified for every b in the enclosure.
 * True only when proven; false when some eigenvalue is within the error bound of b, or above it.
 */
export function floatDefinite(g: Graph, b: Bound & { kind: "algebraic" }, budget: Budget): boolean {
  const { lo, hi } = enclose(b, 64);
  const l = rationalEnclosure(lo),
    h = rationalEnclosure(hi);
  if (!l || !h) return false;
  const r = intervalElimination(g, { lo: l[0], hi: h[1], word: wordEnclosure(b) }, FLOAT_FRONT_DEGREE, (s) => budget.tick(s)).result;
  return r !== undefined && r.negative === 0 && r.zero === 0;
}

/**
 * b as a double-word midpoint with a half-width, for the double-word run: the midpoint m of b's rational
 * enclosure at 2^-128 in double words (error ≤ QUOTIENT_REL·|m| + QUOTIENT_ABS), the half-width (hi − lo)/2
 * as a double rounded up (rationalEnclosure), both added.
 */
function wordEnclosure(b: Bound & { kind: "algebraic" }): { mid: DW; half: number } | undefined {
  const { lo, hi } = enclose(b, 128);
  const m = mul(add(lo, hi), rat(1n, 2n));
  const mid = quotientByDoubleWord(m.den)(m.num);
  const w = rationalEnclosure(mul(sub(hi, lo), rat(1n, 2n)));
  if (!mid || !w) return undefined;
  return { mid, half: (w[1] + QUOTIENT_REL * Math.abs(mid.hi) + QUOTIENT_ABS) * (1 + 2 ** -50) };
}

/** Exact elimination over Q(b) (Jacobs–Trevisan on forests, sparse otherwise): the fact about ρ versus b, and the certificate. */
export function algebraicElimination(
  g: Graph,
  b: Bound & { kind: "algebraic" },
  stop: StopRule,
  budget: Budget,
): { rel: Relation; cert: AlgebraicCertificate } {
  const F = new AlgebraicField(b, budget);
  const st = stop === "negative" ? "negative" : "nonPositive";
  let out: { complete: boolean; positive: number; zero: number; stoppedAt?: number; sign?: -1 | 0 };
  const kind = isForest(g) ? "algebraic-tree" : "algebraic-sparse";
  if (kind === "algebraic-tree") {
    const r = treeInertiaOver(g, F, F.generator, st, budget);
    out = r.complete ? r : { ...r, sign: F.sign(r.witnessValue!) < 0 ? -1 : 0 };
  } else if (floatDefinite(g, b, budget)) {
    // Positive definite: every pivot of the exact elimination is positive, in any order, so it runs to the end
    // with n positive pivots; that outcome is stated without computing it in Q(b).
    out = { complete: true, positive: g.n, zero: 0 };
  } else {
    // The full inertia at b's double enclosure, zeros proven by kernel vectors over Q(b) (algebraic-kernel.ts). With no
    // negative eigenvalue it states what the exact elimination under "negative" gives, in any order: every pivot
    // positive or an exact zero with an empty row (a PSD matrix), so n − k positive and k zero; the certificate is
    // that outcome, and the re-check takes the same route.
    const r = algebraicIntervalInertia(g, b, budget);
    if (r && r.negative === 0) return { rel: r.zero > 0 ? "=" : "<", cert: { kind, stop: "negative", complete: true, positive: r.positive, zero: r.zero } };
    out = fieldSparseDefiniteness(g, F, F.generator, st, budget);
  }
  if (out.complete) return { rel: out.zero > 0 ? "=" : "<", cert: { kind, stop: st, complete: true, positive: out.positive, zero: out.zero } };
  return { rel: out.sign! < 0 ? ">" : ">=", cert: { kind, stop: st, complete: false, positive: 0, zero: 0, stoppedAt: out.stoppedAt, sign: out.sign } };
}

export function boundIsRootOf(f: Poly, b: Bound & { kind: "algebraic" }, budget: Budget): boolean {
  const gg = polyGcd(f, boundPolynomial(b), budget);
  if (deg(gg) < 1) return false;
  // Roots of gg are roots of b.poly, whose only root in (b.lo, b.hi) is b; endpoints are not roots.
  return rootsBetween(sturmSequence(gg, budget), b.lo, b.hi) === 1;
}

export function sturmCertificate(g: Graph, b: Bound & { kind: "algebraic" }, budget: Budget): SpectralRadiusCertificate & { kind: "sturm" } {
  const chi = characteristicPolynomial(g, budget);
  // Sturm counts distinct roots of χ itself (no square-free part needed; endpoints are kept off roots).
  const sf = chi;
  const seq = sturmSequence(sf, budget);
  const isRoot = boundIsRootOf(sf, b, budget);
  for (let bits = 8; ; bits *= 2) {
    budget.tick(bits);
    const { lo, hi } = enclose(b, bits);
    if (signAt(sf, lo) === 0 || signAt(sf, hi) === 0) continue;
    if (rootsBetween(seq, lo, hi) !== (isRoot ? 1 : 0)) continue;
    return {
      kind: "sturm",
      charpoly: chi.map(String),
      lo: ratToString(lo),
      hi: ratToString(hi),
      rootsAbove: rootsBetween(seq, hi, "+inf"),
      boundIsEigenvalue: isRoot,
    };
  }
}
