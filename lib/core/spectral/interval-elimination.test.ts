/**
 * The certified floating-point elimination (interval-elimination.ts) must give exactly the inertia of the
 * all-exact Bareiss elimination (sparse-inertia.ts with no front), or decline. Checked on random graphs at
 * long rationals b, and adversarially at b within 10^-9 and 2^-60 of known eigenvalues.
 */
import { describe, expect, it } from "vitest";
import { intervalSparseInertia } from "./interval-elimination";
import { sparseInertia, FLOAT_FRONT_DEGREE } from "./sparse-inertia";
import { inertia, spectralRadiusBound, recheckSpectralRadiusBound, type SpectralRadiusCertificate } from "./inertia";
import { buildGraph } from "../input/graph-build";
import { complete, cycle } from "../input/constructors";
import { add, parseRational, rat, sub, type Rational } from "../arithmetic/rational";
import { Budget } from "../verdict";
import type { Graph } from "../graph";
import { cubicWorkload, sparseGraphWorkload, workloadGraph } from "../../../tests/bench/workloads";

const big = () => new Budget(1e13);
const counts = (r: { positive: number; negative: number; zero: number }) => [r.positive, r.negative, r.zero];
/** The all-exact elimination: fraction-free Bareiss steps to the end, no floating point anywhere. */
const exact = (g: Graph, b: Rational) => counts(sparseInertia(g, b, "none", big()));
const interval = (g: Graph, b: Rational, degree: number | undefined = FLOAT_FRONT_DEGREE) => intervalSparseInertia(g, b, degree, () => {});
const cubic = (n: number) => workloadGraph(cubicWorkload(n));
const pow2 = (k: number) => rat(1n, 1n << BigInt(k));

/** The Petersen graph: outer 5-cycle, inner pentagram, spokes. */
function petersen(): Graph {
  const e: { u: number; v: number }[] = [];
  for (let i = 0; i < 5; i++) {
    e.push({ u: i, v: (i + 1) % 5 }, { u: i, v: i + 5 }, { u: 5 + i, v: 5 + ((i + 2) % 5) });
  }
  return buildGraph(
    10,
    e.map(({ u, v }) => ({ u: Math.min(u, v), v: Math.max(u, v) })),
  );
}

describe("certified floating-point elimination before the front", () => {
  it("matches the all-exact elimination on random graphs at long rationals b (30-bit numerators), whenever it decides", () => {
    let decided = 0,
      tried = 0;
    for (let seed = 1; seed <= 12; seed++) {
      // The shared G(n, m) workload of average degree 3 (tests/bench/workloads.ts), 20–78 vertices, and cubic graphs.
      const n = 20 + 2 * ((seed * 37) % 30);
      const g = seed % 3 === 0 ? cubic(n) : workloadGraph(sparseGraphWorkload(n));
      for (const b of [parseRational(`${(seed * 104729) % 1000003}/${(1 << 30) + seed}`), parseRational(`-${seed * 7919}/${1000003}`)]) {
        for (const degree of [FLOAT_FRONT_DEGREE, 4, undefined]) {
          tried++;
          const r = interval(g, b, degree);
          if (!r) continue;
          decided++;
          expect(counts(r), `seed ${seed}, b ${b.num}/${b.den}, front ${degree}`).toEqual(exact(g, b));
        }
      }
    }
    // Far from every eigenvalue it should nearly always decide (not a correctness condition, a usefulness one).
    expect(decided).toBeGreaterThan(tried / 2);
  });

  it("cubic graphs: ρ = 3 (connected 3-regular; Brouwer & Haemers Prop. 3.1.2, from memory) at b = 3 ± 10^-9 gives (n − 1, 1, 0) and (n, 0, 0), as the all-exact elimination", () => {
    for (const n of [60, 120]) {
      const g = cubic(n);
      const below = parseRational("2999999999/1000000000"),
        above = parseRational("3000000001/1000000000");
      const rb = interval(g, below),
        ra = interval(g, above);
      expect(rb && counts(rb)).toEqual([n - 1, 1, 0]);
      expect(ra && counts(ra)).toEqual([n, 0, 0]);
      expect(exact(g, below)).toEqual([n - 1, 1, 0]);
      expect(exact(g, above)).toEqual([n, 0, 0]);
    }
  });

  it("never miscounts an eigenvalue 2^-60 or 2^-80 from b: cubic graphs at 3 ± 2^-k, K_n at −1 + 2^-60 (spectrum n − 1, (−1)^(n−1); Brouwer & Haemers §1.4.1)", () => {
    for (const k of [30, 60, 80]) {
      for (const n of [40, 100]) {
        const g = cubic(n);
        for (const [b, want] of [
          [sub(rat(3), pow2(k)), [n - 1, 1, 0]],
          [add(rat(3), pow2(k)), [n, 0, 0]],
        ] as const) {
          const r = interval(g, b);
          if (r) expect(counts(r), `n ${n}, 3 ± 2^-${k}`).toEqual(want);
          // The full count (interval first, exact where it declines) is always right.
          expect(counts(sparseInertia(g, b, "none", big(), undefined, { degree: FLOAT_FRONT_DEGREE, intervals: true }))).toEqual(want);
        }
      }
    }
    for (const n of [5, 12, 30]) {
      const b = add(rat(-1), pow2(60));
      const want = [n - 1, 1, 0]; // b − (−1) = 2^-60 > 0 (n − 1 times), b − (n − 1) < 0 once
      expect(exact(complete(n), b)).toEqual(want);
      const r = interval(complete(n), b, undefined);
      if (r) expect(counts(r)).toEqual(want);
      // Exact zero pivots (b = −1: bI − A = −J has rank 1) hold 0 in their intervals: they are set aside, and the
      // front they form is settled by exact kernel vectors e_i − e_j of −J: (0, 1, n − 1).
      expect(counts(interval(complete(n), rat(-1), undefined)!)).toEqual([0, 1, n - 1]);
    }
  });

  it("Petersen graph (spectrum 3, 1^5, (−2)^4; Brouwer & Haemers §1.4, common practice) at b = λ ± 10^-9 and λ ± 2^-60", () => {
    const g = petersen();
    const table: Array<[string, number[]]> = [
      ["1000000001/1000000000", [9, 1, 0]],
      ["999999999/1000000000", [4, 6, 0]],
      ["-1999999999/1000000000", [4, 6, 0]],
      ["-2000000001/1000000000", [0, 10, 0]],
      ["3000000001/1000000000", [10, 0, 0]],
    ];
    for (const [text, want] of table) {
      const b = parseRational(text);
      expect(exact(g, b), text).toEqual(want);
      // 10^-9 from an eigenvalue is far above the rounding level: the interval steps decide.
      expect(counts(interval(g, b, undefined)!), text).toEqual(want);
    }
    for (const [b, want] of [
      [add(rat(1), pow2(60)), [9, 1, 0]],
      [sub(rat(1), pow2(60)), [4, 6, 0]],
    ] as const) {
      expect(exact(g, b)).toEqual(want);
      const r = interval(g, b, undefined);
      if (r) expect(counts(r)).toEqual(want);
    }
  });

  it("cycles C_n at rationals 10^-9 from 2cos(2πk/n) (Brouwer & Haemers §1.4.3): the count of eigenvalues below b", () => {
    for (const n of [7, 12, 31, 64]) {
      const g = cycle(n);
      const eig = Array.from({ length: n }, (_, k) => 2 * Math.cos((2 * Math.PI * k) / n));
      for (const k of [1, 2, Math.floor(n / 3)]) {
        for (const s of [1, -1]) {
          // b = 2cos(2πk/n) ± 10^-9, rounded to a rational with denominator 10^12 (the float cosine is good to 10^-15).
          const b = rat(BigInt(Math.round((eig[k] + s * 1e-9) * 1e12)), 10n ** 12n);
          const bf = Number(b.num) / Number(b.den);
          const want = [eig.filter((x) => x < bf).length, eig.filter((x) => x > bf).length, 0];
          expect(exact(g, b), `C_${n}, k ${k}, ${s}`).toEqual(want);
          const r = interval(g, b, undefined);
          if (r) expect(counts(r), `C_${n}, k ${k}, ${s}`).toEqual(want);
        }
      }
    }
  });

  it("the full inertia at b = 3 − 10^-9 on the cubic bench workload (n = 1000) goes through the interval steps and the front", () => {
    const r = inertia(cubic(1000), parseRational("2999999999/1000000000"), big());
    expect(counts(r)).toEqual([999, 1, 0]);
    expect(r.front).toBeGreaterThan(50);
  });

  it("the order of an interval run, replayed by the exact engine alone, gives the same signs and front (cubic, n = 200)", () => {
    const g = cubic(200),
      b = parseRational("2999999999/1000000000");
    const r = sparseInertia(g, b, "none", big(), undefined, { degree: FLOAT_FRONT_DEGREE, intervals: true });
    expect(r.front).toBeGreaterThan(10);
    const replayed = sparseInertia(g, b, "none", big(), r.steps, { degree: FLOAT_FRONT_DEGREE, intervals: false });
    expect(replayed.signs).toBe(r.signs);
    expect(replayed.front).toBe(r.front);
    expect(counts(replayed)).toEqual([199, 1, 0]);
  });
});

describe("ρ verdicts through the interval steps: certificates re-check and resist tampering", () => {
  const g = workloadGraph(sparseGraphWorkload(200));
  it("ρ against long rationals on G(200, 300): the verdict agrees with the all-exact inertia, and its certificate re-checks", () => {
    for (const text of ["4123456789/1000000000", "3999999999/1000000000", "27182818284/10000000000"]) {
      const b = parseRational(text);
      const ex = exact(g, b);
      const v = spectralRadiusBound(g, "<", text, big());
      expect(v.status).toBe(ex[1] === 0 && ex[2] === 0 ? "verified" : "refuted");
      const re = recheckSpectralRadiusBound(g, "<", text, v.status as "verified" | "refuted", v.certificate);
      expect(re.status, re.reason).toBe("verified");
    }
  });
  it("a regular graph at b = k ± 2^-60 is decided by its constant Perron vector, exactly, without any elimination (cubic, n = 1000)", () => {
    // ρ = 3 for a 3-regular graph with the all-ones eigenvector (Brouwer & Haemers Prop. 3.1.2, from memory): power iteration
    // suggests a constant vector, so xᵀ(bI − A)x = n·x²·(b − 3) and (Ax)_v / x_v = 3 are exact.
    const h = cubic(1000);
    const cases = [
      [sub(rat(3), pow2(60)), "refuted", "rayleigh"],
      [add(rat(3), pow2(60)), "verified", "collatz-wielandt"],
    ] as const;
    for (const [b, status, kind] of cases) {
      const text = `${b.num}/${b.den}`;
      const v = spectralRadiusBound(h, "<", text, big());
      expect(v.status, text).toBe(status);
      expect(v.certificate?.kind, text).toBe(kind);
      expect(recheckSpectralRadiusBound(h, "<", text, status, v.certificate).status).toBe("verified");
      // The certificate says nothing at the other side of 3: a Rayleigh vector for 3 − 2^-60 does not prove ρ > 3.
      const other = `${(3n * b.den * 2n - b.num * 1n) / 1n}/${b.den}`;
      expect(recheckSpectralRadiusBound(h, "<", other, status, v.certificate).status, other).toBe("refuted");
    }
  });

  it("a changed sign, count, step or front size of an interval-certified inertia is rejected", () => {
    // Below 200 vertices no vector certificate is tried first, so the elimination decides.
    const h = workloadGraph(sparseGraphWorkload(150));
    const text = "3999999999/1000000000";
    const v = spectralRadiusBound(h, "<=", text, big());
    const cert = v.certificate as SpectralRadiusCertificate & { kind: "inertia" };
    expect(cert.kind).toBe("inertia");
    expect(cert.engine).toBe("sparse");
    const ok = recheckSpectralRadiusBound(h, "<=", text, v.status as "verified" | "refuted", cert);
    expect(ok.status, ok.reason).toBe("verified");
    const tamper = (edit: (c: SpectralRadiusCertificate & { kind: "inertia" }) => void) => {
      const c = structuredClone(cert);
      edit(c);
      return recheckSpectralRadiusBound(h, "<=", text, v.status as "verified" | "refuted", c);
    };
    const flipped = tamper((c) => (c.signs = (c.signs![0] === "+" ? "-" : "+") + c.signs!.slice(1)));
    expect(flipped.status).toBe("refuted");
    expect(flipped.reason).toMatch(/step 1 has pivot sign/);
    expect(tamper((c) => ((c.positive += 1), (c.negative -= 1))).status).toBe("refuted");
    const repeated = tamper((c) => (c.steps![1] = c.steps![0]));
    expect(repeated.status).toBe("refuted");
    expect(repeated.reason).toMatch(/step 2/);
    if (cert.front !== undefined) expect(tamper((c) => (c.front = c.front! + 1)).status).toBe("refuted");
    expect(tamper((c) => c.steps!.pop()).status).toBe("refuted");
    // Another point, even one where the same counts hold, is not the point the verdict eliminates at.
    const moved = tamper((c) => (c.at = "4/1"));
    expect(moved.status).toBe("refuted");
    expect(moved.reason).toMatch(/bound b itself/);
  });
});
