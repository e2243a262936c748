/**
 * Vector certificates for the spectral radius (Collatz–Wielandt, Perron–Frobenius), checked in O(|E|).
 *
 * Let A >= 0 be symmetric and x >= 0. On a connected component C the block A_C is irreducible and has
 * a left Perron vector y > 0 with y^T A_C = ρ(C) y^T; if x_C != 0 then y^T x_C > 0, so from
 * y^T (A x)_C = ρ(C) y^T x_C:
 *   (Ax)_C <= b x_C            ⟹ ρ(C) <= b,   strict somewhere in C ⟹ ρ(C) < b;
 *   (Ax)_C >= b x_C            ⟹ ρ(C) >= b,   strict somewhere in C ⟹ ρ(C) > b;
 *   (Ax)_C  = b x_C            ⟹ ρ(C)  = b.
 * (Collatz 1942; Wielandt, "Unzerlegbare, nicht negative Matrizen", Math. Z. 52 (1950) 642–648;
 * see Horn & Johnson, "Matrix Analysis", §8.1 and §8.4.) As ρ(G) = max_C ρ(C): upper bounds need x
 * non-zero on EVERY component (a zero component says nothing about its own ρ); lower bounds need one
 * component with x_C != 0. In particular x > 0 with Ax <= bx gives ρ <= b for any graph; a vector with
 * zeros suffices only through the component argument above.
 * Also the Rayleigh quotient: x != 0 with x^T A x >= b x^T x ⟹ ρ = λ_max >= b (> b if strict).
 *
 * Bounds: any Bound (rational, sqrt, 2cos, root); each entrywise comparison (Ax)_v vs b x_v is exact:
 * sign((Ax)_v - b x_v) = sign((Ax)_v / x_v - b) for x_v > 0 via compareToBound. An equality with an
 * irrational b never holds for rational x, so "=" certificates need a rational b.
 */
import { adjacency, Graph, GraphError, label } from "../graph";
import { Budget, Verdict, withinBudget } from "../verdict";
import { Rational, add, div, mul, parseRational, rat, ratToString, sign, ZERO } from "../arithmetic/rational";
import { Bound, compareToBound, parseBound } from "../arithmetic/bound";
import type { Relation } from "./radius-certificate";

const SYMBOL: Record<Relation, string> = { "<": "<", "<=": "≤", "=": "=", ">=": "≥", ">": ">" };

export interface VectorEvidence {
  /** What the vector proves about ρ(G), e.g. "ρ(G) < 2"; absent when refuted. */
  conclusion?: string;
  /** First vertex where a condition fails (refuted only). */
  failingVertex?: number;
}

/** Connected component index of every vertex (loops ignored). */
export function components(g: Graph): { comp: Int32Array; count: number } {
  const { start, nbr } = adjacency(g);
  const comp = new Int32Array(g.n).fill(-1);
  let count = 0;
  const stack: number[] = [];
  for (let r = 0; r < g.n; r++) {
    if (comp[r] >= 0) continue;
    comp[r] = count;
    stack.push(r);
    while (stack.length) {
      const v = stack.pop()!;
      for (let k = start[v]; k < start[v + 1]; k++)
        if (comp[nbr[k]] < 0) {
          comp[nbr[k]] = count;
          stack.push(nbr[k]);
        }
    }
    count++;
  }
  return { comp, count };
}

function toRationals(g: Graph, x: ReadonlyArray<string | Rational>): Rational[] {
  if (x.length !== g.n) throw new GraphError(`the vector has ${x.length} entries but the graph has ${g.n} vertices`);
  return x.map((e, i) => {
    if (typeof e !== "string") return e;
    try {
      return parseRational(e);
    } catch (err) {
      throw new GraphError(`vector entry ${i} (vertex ${label(g, i)}): ${(err as Error).message}`);
    }
  });
}

/** (Ax)_v for every v, exact. */
export function multiply(g: Graph, x: readonly Rational[], budget?: Budget): Rational[] {
  const { start, nbr, wt, diag } = adjacency(g);
  const out: Rational[] = new Array(g.n);
  for (let v = 0; v < g.n; v++) {
    budget?.tick(1 + start[v + 1] - start[v]);
    let s = diag[v] ? mul(rat(diag[v]), x[v]) : ZERO;
    for (let k = start[v]; k < start[v + 1]; k++) if (x[nbr[k]].num !== 0n) s = add(s, mul(rat(wt[k]), x[nbr[k]]));
    out[v] = s;
  }
  return out;
}

/** sign((Ax)_v − b·x_v) for x_v >= 0. */
function compareEntry(ax: Rational, xv: Rational, b: Bound): -1 | 0 | 1 {
  if (xv.num === 0n) return sign(ax);
  return compareToBound(div(ax, xv), b);
}

/**
 * Checks "A·x rel b·x entrywise" for a non-negative rational vector x (strings like "3/2" or Rationals)
 * and states what it proves about ρ(G). Refuted verdicts name the first vertex where a condition fails.
 */
export function checkVectorCertificate(
  g: Graph,
  vector: ReadonlyArray<string | Rational>,
  rel: Relation,
  bound: Bound | string,
  budget: Budget = new Budget(),
): Verdict<VectorEvidence> {
  const b = typeof bound === "string" ? parseBound(bound) : bound;
  const x = toRationals(g, vector);
  const statement = `A·x ${SYMBOL[rel]} ${b.text}·x entrywise, x ≥ 0 (Collatz–Wielandt)`;
  const method = "Collatz–Wielandt vector check";
  return withinBudget(statement, method, budget, () => {
    const fail = (v: number, why: string): Verdict<VectorEvidence> => ({
      status: "refuted",
      statement,
      method,
      reason: `at vertex ${label(g, v)}: ${why}`,
      certificate: { failingVertex: v },
    });
    for (let v = 0; v < g.n; v++) if (sign(x[v]) < 0) return fail(v, `x = ${ratToString(x[v])} is negative`);
    const ax = multiply(g, x, budget);
    const { comp, count } = components(g);
    const nonzero = new Uint8Array(count),
      strict = new Uint8Array(count);
    const wanted: Record<Relation, Array<-1 | 0 | 1>> = { "<": [-1], "<=": [-1, 0], "=": [0], ">=": [0, 1], ">": [1] };
    for (let v = 0; v < g.n; v++) {
      budget.tick();
      const c = compareEntry(ax[v], x[v], b);
      if (!wanted[rel].includes(c)) return fail(v, `(Ax)_v = ${ratToString(ax[v])} is not ${SYMBOL[rel]} ${b.text}·${ratToString(x[v])}`);
      if (x[v].num !== 0n) nonzero[comp[v]] = 1;
      if (c !== 0) strict[comp[v]] = 1;
    }
    let conclusion: string, why: string;
    if (rel === "<" || rel === "<=" || rel === "=") {
      for (let v = 0; v < g.n; v++)
        if (!nonzero[comp[v]]) return fail(v, "x vanishes on the whole connected component of this vertex, so it bounds nothing there");
      const allStrict = strict.every((s) => s === 1);
      const op = rel === "=" ? "=" : allStrict ? "<" : "≤";
      conclusion = `ρ(G) ${op} ${b.text}`;
      why = `x ≥ 0 is non-zero on each of the ${count} component(s) and A·x ${SYMBOL[rel]} ${b.text}·x; a positive left Perron vector of each component gives ${conclusion}.`;
    } else {
      let best = -1;
      for (let c = 0; c < count; c++) if (nonzero[c] && (best < 0 || strict[c])) best = c;
      if (best < 0) return fail(0, "x is the zero vector");
      const op = strict[best] ? ">" : "≥";
      conclusion = `ρ(G) ${op} ${b.text}`;
      why = `x ≥ 0 is non-zero on a component where A·x ${SYMBOL[rel]} ${b.text}·x${strict[best] ? " with a strict entry" : ""}; its positive left Perron vector gives ${conclusion}.`;
    }
    return { status: "verified", statement, method, reason: why, certificate: { conclusion }, notes: [`establishes ${conclusion}`] };
  });
}

/** Rayleigh quotient certificate: x != 0 with x^T A x ≥ b·x^T x proves ρ ≥ b (> b when strict). */
export function checkRayleighCertificate(
  g: Graph,
  vector: ReadonlyArray<string | Rational>,
  bound: Bound | string,
  budget: Budget = new Budget(),
): Verdict<VectorEvidence> {
  const b = typeof bound === "string" ? parseBound(bound) : bound;
  const x = toRationals(g, vector);
  const statement = `xᵀAx ≥ ${b.text}·xᵀx (Rayleigh quotient)`;
  const method = "Rayleigh quotient";
  return withinBudget(statement, method, budget, () => {
    const ax = multiply(g, x, budget);
    let xax = ZERO,
      xx = ZERO;
    for (let v = 0; v < g.n; v++) {
      xax = add(xax, mul(x[v], ax[v]));
      xx = add(xx, mul(x[v], x[v]));
    }
    if (xx.num === 0n) return { status: "refuted", statement, method, reason: "x is the zero vector" };
    const c = compareToBound(div(xax, xx), b);
    const q = `${ratToString(xax)}/${ratToString(xx)}`;
    if (c < 0) return { status: "refuted", statement, method, reason: `the Rayleigh quotient xᵀAx/xᵀx = ${q} is below ${b.text}` };
    const conclusion = `ρ(G) ${c > 0 ? ">" : "≥"} ${b.text}`;
    return {
      status: "verified",
      statement,
      method,
      reason: `xᵀAx/xᵀx = ${q} ${c > 0 ? ">" : "="} ${b.text}, and λ_max = ρ for non-negative symmetric A, so ${conclusion}.`,
      certificate: { conclusion },
    };
  });
}

/** Re-check: the vector itself is the certificate; verified when it still establishes `conclusion`. */
export function recheckVectorCertificate(
  g: Graph,
  vector: ReadonlyArray<string | Rational>,
  rel: Relation,
  bound: Bound | string,
  conclusion: string,
  budget: Budget = new Budget(),
): Verdict<VectorEvidence> {
  const v = checkVectorCertificate(g, vector, rel, bound, budget);
  if (v.status === "verified" && v.certificate?.conclusion !== conclusion)
    return { ...v, status: "refuted", reason: `the vector establishes ${v.certificate?.conclusion}, not ${conclusion}` };
  return v;
}
