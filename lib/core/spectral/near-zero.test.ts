/**
 * Pivots within their error bound of 0 in the certified floating-point elimination (interval-elimination.ts):
 * they are set aside instead of sending the whole run back to exact arithmetic, and zeros are proven by exact
 * kernel vectors of the whole matrix. Every count is compared with the all-exact elimination (sparse-inertia.ts,
 * Bareiss steps to the end, no floating point), and with a spectrum derived by hand where one is known.
 */
import { describe, expect, it } from "vitest";
import { intervalElimination, intervalSparseInertia } from "./interval-elimination";
import { sparseInertia, FLOAT_FRONT_DEGREE } from "./sparse-inertia";
import { spectralRadiusBound, recheckSpectralRadiusBound, type SpectralRadiusCertificate } from "./inertia";
import { buildGraph } from "../input/graph-build";
import { cycle } from "../input/constructors";
import { add, rat, sub, type Rational } from "../arithmetic/rational";
import { Budget } from "../verdict";
import type { Graph } from "../graph";
import { cubicWorkload, sparseGraphWorkload, workloadGraph } from "../../../tests/bench/workloads";
import { enclose, parseBound, type Bound } from "../arithmetic/bound";
import { AlgebraicField, rationalEnclosure } from "../arithmetic/number-field";
import { fieldSparseDefiniteness } from "./field-sparse-inertia";
import { floatDefinite } from "./radius-probes";
import { perronApproximation } from "./perron";

const big = () => new Budget(1e13);
const counts = (r: { positive: number; negative: number; zero: number }) => [r.positive, r.negative, r.zero];
/** The all-exact elimination: fraction-free Bareiss steps to the end, no floating point anywhere. */
const exact = (g: Graph, b: Rational) => counts(sparseInertia(g, b, "none", big()));
/** The full count as the verdicts run it: floating-point steps first, exact only where they decline. */
const full = (g: Graph, b: Rational) => sparseInertia(g, b, "none", big(), undefined, { degree: FLOAT_FRONT_DEGREE, intervals: true });
const pow2 = (k: number) => rat(1n, 1n << BigInt(k));
const edges = (list: Array<[number, number]>) => list.map(([u, v]) => ({ u: Math.min(u, v), v: Math.max(u, v) }));

/** The Petersen graph: outer 5-cycle, inner pentagram, spokes. */
function petersen(): Graph {
  const e: Array<[number, number]> = [];
  for (let i = 0; i < 5; i++) e.push([i, (i + 1) % 5], [i, i + 5], [5 + i, 5 + ((i + 2) % 5)]);
  return buildGraph(10, edges(e));
}

/** The prism C_n □ K_2: two n-cycles joined by a perfect matching. */
function prism(n: number): Graph {
  const e: Array<[number, number]> = [];
  for (let i = 0; i < n; i++) e.push([i, (i + 1) % n], [n + i, n + ((i + 1) % n)], [i, n + i]);
  return buildGraph(2 * n, edges(e));
}

/** The Möbius–Kantor graph, the generalised Petersen graph GP(8, 3): outer 8-cycle, inner i ~ i + 3, spokes. */
function moebiusKantor(): Graph {
  const e: Array<[number, number]> = [];
  for (let i = 0; i < 8; i++) e.push([i, (i + 1) % 8], [i, 8 + i], [8 + i, 8 + ((i + 3) % 8)]);
  return buildGraph(16, edges(e));
}

/** Inertia of bI − A from a list of eigenvalues of A (exact small integers here). */
const fromSpectrum = (eig: number[], b: number) => [eig.filter((x) => x < b).length, eig.filter((x) => x > b).length, eig.filter((x) => x === b).length];

describe("pivots within their error of 0 are set aside, zeros proven by exact kernel vectors", () => {
  it("Petersen graph at its eigenvalues 3, 1, −2 (spectrum 3, 1^5, (−2)^4; Brouwer & Haemers §1.4, from memory): nullity 1, 5, 4, decided in floating point", () => {
    const g = petersen();
    const spectrum = [3, 1, 1, 1, 1, 1, -2, -2, -2, -2];
    for (const [b, nullity] of [
      [3, 1],
      [1, 5],
      [-2, 4],
    ] as const) {
      const want = fromSpectrum(spectrum, b);
      expect(want[2]).toBe(nullity);
      expect(exact(g, rat(b)), `b = ${b}`).toEqual(want);
      for (const degree of [undefined, 4, FLOAT_FRONT_DEGREE]) {
        const r = intervalSparseInertia(g, rat(b), degree, () => {});
        expect(r && counts(r), `b = ${b}, front ${degree}`).toEqual(want);
      }
    }
  });

  it("cycles C_n at their rational eigenvalues 2cos(2πk/n) ∈ {2, 1, 0, −1, −2} (Brouwer & Haemers §1.4.3: 2cos(2πk/n), k = 0..n−1)", () => {
    for (const n of [6, 12, 24, 60]) {
      const g = cycle(n);
      // Multiset of 2cos(2πk/n), rounded where it is an integer (|x − round(x)| < 1e-9 only at the integer values).
      const spectrum = Array.from({ length: n }, (_, k) => 2 * Math.cos((2 * Math.PI * k) / n)).map((x) =>
        Math.abs(x - Math.round(x)) < 1e-9 ? Math.round(x) : x,
      );
      for (const b of [2, 1, 0, -1, -2]) {
        const want = fromSpectrum(spectrum, b);
        expect(exact(g, rat(b)), `C_${n} at ${b}`).toEqual(want);
        const r = intervalSparseInertia(g, rat(b), undefined, () => {});
        // At b = 0 every pivot of the bipartite cycle is 0: 2×2 pivots on edges (block-pivots.test.ts).
        expect(r && counts(r), `C_${n} at ${b}`).toEqual(want);
        expect(counts(full(g, rat(b))), `C_${n} at ${b}`).toEqual(want);
      }
    }
  });

  it("prisms C_n □ K_2 (eigenvalues 2cos(2πk/n) ± 1: a Cartesian product's are the sums, Brouwer & Haemers §1.4.6, from memory) and the Möbius–Kantor graph", () => {
    for (const n of [6, 12, 30]) {
      const g = prism(n);
      const c = Array.from({ length: n }, (_, k) => 2 * Math.cos((2 * Math.PI * k) / n));
      const spectrum = [...c.map((x) => x + 1), ...c.map((x) => x - 1)].map((x) => (Math.abs(x - Math.round(x)) < 1e-9 ? Math.round(x) : x));
      for (const b of [3, 2, 1, 0, -1, -3]) {
        const want = fromSpectrum(spectrum, b);
        expect(exact(g, rat(b)), `prism ${n} at ${b}`).toEqual(want);
        const r = intervalSparseInertia(g, rat(b), 4, () => {});
        if (r) expect(counts(r), `prism ${n} at ${b}`).toEqual(want);
        expect(counts(full(g, rat(b))), `prism ${n} at ${b}`).toEqual(want);
      }
    }
    // GP(8, 3): its eigenvalues are those of the circulant pieces, 3, ±√3, ±1 (a 3-regular bipartite graph; computed here
    // only at the integers, where the all-exact elimination is the reference). ρ = 3 with nullity 1 (connected, 3-regular).
    const mk = moebiusKantor();
    for (const b of [3, 1, 0, -1, -3, 2]) {
      const want = exact(mk, rat(b));
      const r = intervalSparseInertia(mk, rat(b), undefined, () => {});
      expect(r && counts(r), `Möbius–Kantor at ${b}`).toEqual(want);
      expect(counts(full(mk, rat(b))), `Möbius–Kantor at ${b}`).toEqual(want);
    }
    expect(exact(mk, rat(3))).toEqual([15, 0, 1]);
    expect(exact(mk, rat(-3))).toEqual([0, 15, 1]); // bipartite: the spectrum is symmetric
  });

  it("cubic graphs at 3 ± 2^-60 and at 3 (ρ = 3 for a connected cubic graph; Brouwer & Haemers Prop. 3.1.2, from memory)", () => {
    for (const n of [40, 150]) {
      const g = workloadGraph(cubicWorkload(n));
      for (const [b, want] of [
        [sub(rat(3), pow2(60)), [n - 1, 1, 0]],
        [add(rat(3), pow2(60)), [n, 0, 0]],
        [rat(3), [n - 1, 0, 1]],
      ] as const) {
        expect(exact(g, b)).toEqual(want);
        // The float run either decides right or hands its order and front to the exact engine, which is always right.
        const r = intervalSparseInertia(g, b, FLOAT_FRONT_DEGREE, () => {});
        if (r) expect(counts(r)).toEqual(want);
        expect(counts(full(g, b)), `n ${n}`).toEqual(want);
      }
      // At 3 itself the zero is a true one: the kernel vector (all ones) is found and checked exactly, no exact elimination.
      expect(counts(intervalSparseInertia(g, rat(3), FLOAT_FRONT_DEGREE, () => {})!)).toEqual([n - 1, 0, 1]);
    }
  });

  it("random degree-3 graphs (the bench's G(n, m)) at b = 2, 1, 0, −1 — exact zero pivots under pendant trees — and at ρ estimates ± 10^-12", () => {
    for (const n of [60, 200]) {
      const g = workloadGraph(sparseGraphWorkload(n));
      for (const b of [2, 1, 0, -1]) {
        const want = exact(g, rat(b));
        const o = intervalElimination(g, { rational: rat(b) }, FLOAT_FRONT_DEGREE, () => {});
        if (o.result) expect(counts(o.result), `n ${n}, b ${b}`).toEqual(want);
        expect(counts(full(g, rat(b))), `n ${n}, b ${b}`).toEqual(want);
      }
      // ρ by power iteration (a float hint), then b = ρ ± 10^-12 as a rational with denominator 10^15.
      const { start, nbr } = workloadGraphAdjacency(g);
      let x = new Float64Array(n).fill(1),
        rho = 0;
      for (let it = 0; it < 3000; it++) {
        const y = new Float64Array(n);
        for (let v = 0; v < n; v++) for (let k = start[v]; k < start[v + 1]; k++) y[v] += x[nbr[k]] + x[v] * 1e-300;
        // A shift by 1 keeps the iteration off −ρ (bipartite pieces).
        for (let v = 0; v < n; v++) y[v] += x[v];
        const norm = Math.hypot(...y);
        rho = norm / Math.hypot(...x) - 1;
        x = y.map((t) => t / norm);
      }
      for (const s of n > 100 ? [] : [1, -1]) {
        const b = rat(BigInt(Math.round((rho + s * 1e-12) * 1e15)), 10n ** 15n);
        const want = exact(g, b);
        expect(counts(full(g, b)), `n ${n}, ρ ${s > 0 ? "+" : "−"} 1e-12`).toEqual(want);
      }
    }
  });
});

describe("certificates through zeros settled by kernel vectors re-check and resist tampering", () => {
  it("ρ = 3 on a cubic graph of 150 vertices: the certificate's front holds the zero, the re-check (interval replay) proves it again", () => {
    const g = workloadGraph(cubicWorkload(150));
    const v = spectralRadiusBound(g, "=", "3", big());
    expect(v.status).toBe("verified");
    const cert = v.certificate as SpectralRadiusCertificate & { kind: "inertia" };
    expect(cert.kind).toBe("inertia");
    expect([cert.positive, cert.negative, cert.zero]).toEqual([149, 0, 1]);
    expect(recheckSpectralRadiusBound(g, "=", "3", "verified", cert).status).toBe("verified");
    const tamper = (edit: (c: SpectralRadiusCertificate & { kind: "inertia" }) => void) => {
      const c = structuredClone(cert);
      edit(c);
      return recheckSpectralRadiusBound(g, "=", "3", "verified", c);
    };
    // Claiming no zero (ρ < 3) or two zeros fails; so does a front one vertex larger or smaller.
    expect(tamper((c) => ((c.zero = 0), (c.positive = 150))).status).toBe("refuted");
    expect(tamper((c) => ((c.zero = 2), (c.positive = 148))).status).toBe("refuted");
    if (cert.front !== undefined) {
      expect(tamper((c) => (c.front = c.front! + 1)).status).toBe("refuted");
      expect(tamper((c) => c.steps!.pop()).status).toBe("refuted");
    }
  });
});

function workloadGraphAdjacency(g: Graph): { start: Int32Array; nbr: Int32Array } {
  const deg = new Int32Array(g.n + 1);
  for (const e of g.edges) (deg[e.u]++, deg[e.v]++);
  const start = new Int32Array(g.n + 1);
  for (let v = 0; v < g.n; v++) start[v + 1] = start[v] + deg[v];
  const fill = start.slice(0, g.n);
  const nbr = new Int32Array(start[g.n]);
  for (const e of g.edges) ((nbr[fill[e.u]++] = e.v), (nbr[fill[e.v]++] = e.u));
  return { start, nbr };
}

describe("an irrational b inside the floating-point elimination (a double enclosure of b)", () => {
  /** The double enclosure the verdicts use: b's rational enclosure at 64 bits, each end rounded outward. */
  const doubleEnclosure = (b: Bound & { kind: "algebraic" }) => {
    const { lo, hi } = enclose(b, 64);
    return { lo: rationalEnclosure(lo)![0], hi: rationalEnclosure(hi)![1] };
  };
  const algebraic = (text: string) => parseBound(text) as Bound & { kind: "algebraic" };

  it("cycles C_n at b = 2cos(2πk/n) irrational (an eigenvalue of multiplicity 2; Brouwer & Haemers §1.4.3) decline, and at b ± 2^-20, 2^-40 count as the spectrum says", () => {
    let tried = 0,
      decided = 0;
    for (const n of [7, 10, 16, 30]) {
      const g = cycle(n);
      const eig = Array.from({ length: n }, (_, j) => 2 * Math.cos((2 * Math.PI * j) / n));
      for (const k of [1, 2, 3]) {
        const value = 2 * Math.cos((2 * Math.PI * k) / n);
        if (Math.abs(value - Math.round(value)) < 1e-9) continue; // rational: the tests above
        // At b itself: the zero cannot be proven in floating point (no rational kernel vector), so the run declines.
        const at = intervalElimination(g, doubleEnclosure(algebraic(`2cos(${2 * k}pi/${n})`)), FLOAT_FRONT_DEGREE, () => {});
        expect(at.result, `C_${n} at 2cos(2π${k}/${n})`).toBeUndefined();
        for (const [s, e] of [
          ["+", 20],
          ["-", 20],
          ["+", 40],
          ["-", 40],
        ] as const) {
          const b = algebraic(`2cos(${2 * k}pi/${n}) ${s} 2^-${e}`);
          const bf = value + (s === "+" ? 1 : -1) * 2 ** -e;
          // Eigenvalues are at least ~10^-3 apart here, far above 2^-40 and the float cosine's error.
          const want = [eig.filter((x) => x < bf).length, eig.filter((x) => x > bf).length, 0];
          expect(want[0] + want[1]).toBe(n);
          const r = intervalElimination(g, doubleEnclosure(b), FLOAT_FRONT_DEGREE, () => {}).result;
          // Near a double eigenvalue the error bounds grow through small pivots: the run may decline, never miscount.
          tried++;
          if (r) {
            decided++;
            expect(counts(r), `C_${n}, 2cos(2π${k}/${n}) ${s} 2^-${e}`).toEqual(want);
          }
        }
      }
    }
    // A usefulness check, not a correctness one: most of these are decided in floating point.
    expect(decided).toBeGreaterThan(tried / 2);
  });

  it("random degree-3 graphs at b = √r within 10^-12 and 10^-6 of ρ: the verdict agrees with the exact elimination over Q(b), and its certificate re-checks", () => {
    for (const n of [40, 80]) {
      const g = workloadGraph(sparseGraphWorkload(n));
      const rho = perronApproximation(g, 100_000, 1e-15).rho;
      for (const eps of [1e-12, -1e-12, 1e-6, -1e-6]) {
        const text = `sqrt(${Math.round((rho + eps) ** 2 * 2 ** 50)}/${2 ** 50})`;
        const b = algebraic(text);
        // The reference: minimum-degree elimination with exact arithmetic in Q(b) (field-sparse-inertia.ts).
        const ref = fieldSparseDefiniteness(g, new AlgebraicField(b, big()), new AlgebraicField(b, big()).generator, "nonPositive", big());
        const pd = ref.complete && ref.zero === 0;
        expect(pd, `n ${n}, ρ ${eps}`).toBe(eps > 0);
        if (pd) expect(floatDefinite(g, b, big()), `n ${n}, ρ + ${eps}`).toBe(true);
        const v = spectralRadiusBound(g, "<", text, big());
        expect(v.status, `n ${n}, ρ ${eps}`).toBe(pd ? "verified" : "refuted");
        const re = recheckSpectralRadiusBound(g, "<", text, v.status as "verified" | "refuted", v.certificate);
        expect(re.status, re.reason).toBe("verified");
        if (pd) {
          expect(v.certificate?.kind).toBe("algebraic-sparse");
          // A claim of one zero pivot (ρ = b) instead of none is rejected.
          const forged = { ...(v.certificate as object), positive: n - 1, zero: 1 };
          expect(recheckSpectralRadiusBound(g, "<", text, "verified", forged).status).toBe("refuted");
        }
      }
    }
  });
});
