/**
 * The double-word step of the certified front (front-refine.ts, the double-word run of interval-elimination.ts,
 * the double-word quotient of float-front.ts): eigenvalues of bI − A between the double error bound and the
 * double-word one are decided, every count equal to the all-exact Bareiss elimination (sparse-inertia.ts
 * without a front); true zeros are still left to the kernel vectors and the exact engine.
 */
import { describe, expect, it } from "vitest";
import { certifiedRun, intervalElimination } from "./interval-elimination";
import { certifiedFrontInertia } from "./float-front";
import { sparseInertia } from "./sparse-inertia";
import { spectralRadiusBound, recheckSpectralRadiusBound } from "./inertia";
import { buildGraph } from "../input/graph-build";
import { completeBipartite, cycle } from "../input/constructors";
import { isqrt, rat, type Rational } from "../arithmetic/rational";
import { quotientByDoubleWord } from "../arithmetic/double-word";
import { Budget } from "../verdict";
import { enclose, parseBound, type Bound } from "../arithmetic/bound";
import { rationalEnclosure } from "../arithmetic/number-field";
import { floatDefinite } from "./radius-probes";
import { checkDocument } from "../cli";
import { adjacency, type Graph } from "../graph";
import { cubicWorkload, workloadGraph } from "../../../tests/bench/workloads";

const big = () => new Budget(1e13);
const counts = (r: { positive: number; negative: number; zero: number } | undefined) => r && [r.positive, r.negative, r.zero];
const exactCounts = (g: Graph, b: Rational) => counts(sparseInertia(g, b, "none", big()));
const run = (g: Graph, b: Rational, precision: "double" | "double-word", degree: number) =>
  certifiedRun(g, { rational: b }, precision, degree, () => {}).result;

/** The Petersen graph: outer 5-cycle, inner pentagram, five spokes (common practice). */
function petersen(): Graph {
  const edges: Array<{ u: number; v: number }> = [];
  for (let i = 0; i < 5; i++) edges.push({ u: i, v: (i + 1) % 5 }, { u: 5 + i, v: 5 + ((i + 2) % 5) }, { u: i, v: 5 + i });
  return buildGraph(
    10,
    edges.map(({ u, v }) => ({ u: Math.min(u, v), v: Math.max(u, v) })),
  );
}

/** √s to within 2^-bits, as a dyadic rational (floor). */
function sqrtApprox(s: bigint, bits: number): Rational {
  return rat(isqrt(s << BigInt(2 * bits)), 1n << BigInt(bits));
}

/** v·2^k as an exact BigInt (v = m·2^e with a 53-bit integer m; needs k + e ≥ 0). */
function scaledExactly(v: number, k: bigint): bigint {
  if (v === 0) return 0n;
  const e = Math.floor(Math.log2(Math.abs(v))) - 60;
  const m = v / 2 ** e; // an integer below 2^62, exact (a power-of-two scaling)
  return BigInt(m) << (k + BigInt(e));
}

/** p/q + sgn·2^-e. */
function shifted(c: Rational, sgn: 1 | -1, e: number): Rational {
  const den = c.den * (1n << BigInt(e));
  return rat(c.num * (1n << BigInt(e)) + BigInt(sgn) * c.den, den);
}

/** The integer rows of q·(bI − A) for b = p/q (one dense front, D = q). */
function rowsOf(g: Graph, b: Rational): bigint[][] {
  const { start, nbr, wt, diag } = adjacency(g);
  return Array.from({ length: g.n }, (_, v) => {
    const row = new Array<bigint>(g.n).fill(0n);
    row[v] = b.num - b.den * BigInt(diag[v]);
    for (let k = start[v]; k < start[v + 1]; k++) row[nbr[k]] -= b.den * BigInt(wt[k]);
    return row;
  });
}

/**
 * Graphs with an eigenvalue λ at a known rational or quadratic point, and b = λ ± 2^-e:
 * - Petersen: spectrum 3, 1⁵, (−2)⁴ (Brouwer & Haemers, Spectra of Graphs, §1.4, from memory; checked here by the
 *   exact zero count at b = 1);
 * - a connected cubic graph (the bench's cubicWorkload): 3 is a simple eigenvalue (Perron–Frobenius; B&H Prop. 3.1.1);
 * - K_{17,18}: spectrum ±√306, 0³³ (B&H §1.4, from memory), its degrees 17, 18 put it all in the front at once;
 *   b within 2^-100 of √306, shifted by ±2^-e.
 */
const cases: Array<[string, Graph, Rational, number]> = [
  ["Petersen at 1", petersen(), rat(1), 2],
  ["cubic n = 60 at 3", workloadGraph(cubicWorkload(60)), rat(3), 2],
  ["K_{17,18} at √306", completeBipartite(17, 18), sqrtApprox(306n, 100), 16],
];
/**
 * C_8 and C_200: eigenvalues 2cos(2πj/n) (B&H §1.4), so √2 = 2cos(2π·1/8) = 2cos(2π·25/200), twice, in the middle of
 * the spectrum. The front's 1×1 diagonal pivoting grows by about 10^11 there, so neither precision may decide; whatever
 * is returned must still be the exact count.
 */
const SQRT2 = sqrtApprox(2n, 100);
const cycles: Array<[string, Graph, Rational, number]> = [
  ["C_8 at √2", cycle(8), SQRT2, 2],
  ["C_200 at √2", cycle(200), SQRT2, 2],
];

describe("double-word step of the certified front", () => {
  it("the double-word quotient N/D is within 2^-104 of the exact value (checked exactly in BigInt)", () => {
    const long = (1n << 3000n) + 12345678901234567n;
    const pairs: Array<[bigint, bigint]> = [long / 3n, -(long * 7n) / 5n, long >> 40n, (long << 20n) + 1n, 1n << 2900n].map((x) => [x, long]);
    // Short denominators, where nothing is shifted: −1/1, −1/3, 7/−5.
    pairs.push([-1n, 1n], [-1n, 3n], [7n, -5n]);
    for (const [x, d] of pairs) {
      const w = quotientByDoubleWord(d)(x)!;
      // (hi + lo) as an exact dyadic rational, compared with x/d: |hi + lo − x/d|·d·2^k ≤ 2^-104·|x|·2^k.
      const k = 1200n;
      const approx = scaledExactly(w.hi, k) + scaledExactly(w.lo, k);
      const err = approx * d - (x << k);
      expect((err < 0n ? -err : err) * (1n << 104n) <= (x < 0n ? -x : x) << k, `${x}/${d}`).toBe(true);
    }
  });

  it("small exact quotients stay exact: −1/1, 1/1, −3/2 (no shift, so −1 is a value, not the floor of a tiny one)", () => {
    expect(quotientByDoubleWord(1n)(-1n)).toEqual({ hi: -1, lo: 0 });
    expect(quotientByDoubleWord(1n)(1n)).toEqual({ hi: 1, lo: 0 });
    expect(quotientByDoubleWord(2n)(-3n)).toEqual({ hi: -1.5, lo: 0 });
    // At b = −1 the double-word run counts −I − A, not −A: C_7 has eigenvalues 2cos(2πk/7) (Brouwer & Haemers §1.4.3):
    // 2, 1.247 (twice), −0.445 (twice), −1.802 (twice), so two lie below −1 and five above (below 0 there are four).
    const word = certifiedRun(cycle(7), { rational: rat(-1) }, "double-word", 4, () => {});
    expect(counts(word.result)).toEqual([2, 5, 0]);
    expect(exactCounts(cycle(7), rat(-1))).toEqual([2, 5, 0]);
  });

  it.each(cases)(
    "%s ± 2^-e (e = 40 … 70): the double-word run decides what the double run cannot, as the exact elimination counts",
    (name, g, lambda, degree) => {
      for (const e of [40, 50, 60, 70])
        for (const sgn of [1, -1] as const) {
          const b = shifted(lambda, sgn, e);
          const exact = exactCounts(g, b);
          const label = `${name} ${sgn > 0 ? "+" : "−"} 2^-${e}`;
          expect(exact![2], label).toBe(0);
          const word = run(g, b, "double-word", degree);
          expect(counts(word), label).toEqual(exact);
          // Past 2^-55 the double entries themselves (2^-48 relative) cannot see the gap: the double run declines.
          if (e >= 60) expect(run(g, b, "double", degree), label).toBeUndefined();
          // Both runs in turn, as the engine calls them, and the exact front's double-word quotient.
          expect(counts(intervalElimination(g, { rational: b }, degree, () => {}).result), label).toEqual(exact);
          expect(counts(certifiedFrontInertia(rowsOf(g, b), b.den)), label).toEqual(exact);
        }
    },
  );

  it.each(cycles)("%s ± 2^-e: an indefinite front with a double eigenvalue near b is decided correctly or declined", (name, g, lambda, degree) => {
    for (const e of [40, 60])
      for (const sgn of [1, -1] as const) {
        const b = shifted(lambda, sgn, e);
        const exact = exactCounts(g, b);
        for (const r of [run(g, b, "double", degree), run(g, b, "double-word", degree), certifiedFrontInertia(rowsOf(g, b), b.den)])
          if (r) expect(counts(r), `${name} ${sgn > 0 ? "+" : "−"} 2^-${e}`).toEqual(exact);
      }
  });

  it.each(cases.filter(([, , l]) => l.den === 1n))(
    "%s exactly: a true zero is not decided by the double-word run, but by kernel vectors or exact steps",
    (name, g, b, degree) => {
      const exact = exactCounts(g, b);
      // The construction: 1 is an eigenvalue of the Petersen graph five times, 3 of a connected cubic graph once.
      expect(exact![2], name).toBe(name.startsWith("Petersen") ? 5 : 1);
      expect(run(g, b, "double-word", degree), name).toBeUndefined();
      expect(counts(sparseInertia(g, b, "none", big(), undefined, { degree })), name).toEqual(exact);
    },
  );

  it("an irrational b within 2^-60 of ρ: √(306 ± 2^-60) for K_{17,18}, √(9 ± 2^-60) for a cubic graph — the double-word run decides", () => {
    // ρ(K_{17,18}) = √306 (spectrum ±√306, 0³³; B&H §1.4, from memory); ρ = 3 for a connected cubic graph (B&H Prop. 3.1.1).
    for (const [g, r] of [
      [completeBipartite(17, 18), 306n],
      [workloadGraph(cubicWorkload(60)), 9n],
    ] as const)
      for (const sgn of [1n, -1n]) {
        const b = parseBound(`sqrt(${(r << 60n) + sgn}/${1n << 60n})`) as Bound & { kind: "algebraic" };
        // The double run alone, at b's double enclosure, cannot separate b from ρ.
        const { lo, hi } = enclose(b, 64);
        const double = certifiedRun(g, { lo: rationalEnclosure(lo)![0], hi: rationalEnclosure(hi)![1] }, "double", 16, () => {}).result;
        expect(double, `r = ${r}`).toBeUndefined();
        expect(floatDefinite(g, b, big()), `r = ${r} ${sgn > 0 ? "+" : "−"} 2^-60`).toBe(sgn > 0n);
      }
  });

  it("ρ(K_{17,18}) < √306 + 2^-60 is verified by an inertia certificate that re-checks, and tampered certificates are refused", () => {
    const g = completeBipartite(17, 18);
    const b = shifted(sqrtApprox(306n, 100), 1, 60);
    const text = `${b.num}/${b.den}`;
    const v = spectralRadiusBound(g, "<", text, big());
    expect(v.status).toBe("verified");
    const cert = v.certificate as { kind: string; front?: number; positive: number; negative: number };
    expect(cert.kind).toBe("inertia");
    expect(cert.front).toBe(35);
    expect(recheckSpectralRadiusBound(g, "<", text, "verified", cert, big()).status).toBe("verified");
    // One negative value claimed instead (ρ > b): refused by the replay.
    const flipped = { ...cert, positive: cert.positive - 1, negative: cert.negative + 1 };
    expect(recheckSpectralRadiusBound(g, "<", text, "refuted", flipped, big()).status).toBe("refuted");
    // The same certificate presented for b − 2^-59 (below ρ): its point is not that b, refused.
    const lower = shifted(b, -1, 59);
    expect(recheckSpectralRadiusBound(g, "<", `${lower.num}/${lower.den}`, "verified", cert, big()).status).toBe("refuted");
    // And the verdict there is a refutation (ρ = √306 > b − 2^-59).
    expect(spectralRadiusBound(g, "<", `${lower.num}/${lower.den}`, big()).status).toBe("refuted");
    // The offline checker (cli.ts) re-checks the carried certificate the same way: accepted as made, refused when tampered.
    const claim = (evidence: unknown) => ({
      format: "cairn-claims/1",
      claims: [
        {
          format: "cairn-claim/1",
          id: "K17-18",
          kind: "spectral-radius-bound",
          graph: { format: "named", text: "complete_bipartite(17,18)" },
          op: "<",
          bound: text,
          certificate: { kind: "spectral-radius-bound", outcome: "verified", evidence },
        },
      ],
    });
    const good = checkDocument(claim(cert), "memory");
    expect(good.lines[0].status).toBe("verified");
    expect(good.lines[0].certificate?.matches).toBe(true);
    expect(good.exitCode).toBe(0);
    const bad = checkDocument(claim(flipped), "memory");
    expect(bad.lines[0].certificate?.matches).toBe(false);
    expect(bad.exitCode).not.toBe(0);
  });
});
