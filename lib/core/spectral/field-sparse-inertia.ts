/**
 * Positive (semi)definiteness of bI − A over an exact field (used with Q(b) for an irrational bound b
 * on graphs with cycles): symmetric Gaussian elimination with 1x1 pivots in minimum-degree order
 * (the symmetric Markowitz rule, Tinney & Walker 1967), stopping at the first pivot that shows the
 * matrix is not positive definite ("nonPositive") or not positive semidefinite ("negative").
 *
 * Why the stops are exact: all earlier pivots are positive, so the Schur complement S is congruent to
 * the remaining block (Sylvester's law of inertia). A negative pivot, or a zero pivot whose row is not
 * zero (the 2x2 principal minor [[0, a], [a, c]] has determinant −a² < 0), gives a negative eigenvalue;
 * a zero pivot with a zero row is a zero eigenvalue and is set aside. Division happens only by
 * positive pivots, so the field needs no zero-divisor handling beyond its exact sign.
 */
import { adjacency, Graph } from "../graph";
import { Budget } from "../verdict";
import type { Field } from "../arithmetic/number-field";

export interface FieldEliminationOutcome {
  complete: boolean;
  positive: number;
  zero: number;
  /** Vertex whose pivot stopped the run, and the kind of evidence: -1 negative eigenvalue, 0 zero pivot. */
  stoppedAt?: number;
  sign?: -1 | 0;
}

export function fieldSparseDefiniteness<T>(g: Graph, F: Field<T>, b: T, stop: "nonPositive" | "negative", budget: Budget): FieldEliminationOutcome {
  const n = g.n;
  const { start, nbr, wt, diag: loops } = adjacency(g);
  const rows: Array<Map<number, T>> = [];
  const diag: T[] = [];
  for (let v = 0; v < n; v++) {
    diag.push(loops[v] === 0 ? b : F.sub(b, F.fromInt(loops[v])));
    const row = new Map<number, T>();
    for (let k = start[v]; k < start[v + 1]; k++) row.set(nbr[k], F.fromInt(-wt[k]));
    rows.push(row);
  }
  const alive = new Uint8Array(n).fill(1);
  let positive = 0,
    zero = 0;
  for (let done = 0; done < n; done++) {
    // Minimum current degree (a linear scan: this path serves graphs of moderate size).
    let p = -1;
    for (let v = 0; v < n; v++) if (alive[v] && (p < 0 || rows[v].size < rows[p].size)) p = v;
    const row = [...rows[p]];
    budget.tick(n + row.length * row.length);
    const s = F.sign(diag[p]);
    if (s === 0 && row.length === 0) {
      zero++;
      if (stop === "nonPositive") return { complete: false, positive, zero, stoppedAt: p, sign: 0 };
    } else if (s <= 0) {
      return { complete: false, positive, zero, stoppedAt: p, sign: -1 };
    } else {
      positive++;
      // S_ij -= S_ip S_pj / S_pp for the neighbours i, j of the pivot (fill-in included).
      const inv = F.div(F.fromInt(1), diag[p]);
      const scaled = row.map(([i, x]) => [i, F.mul(x, inv)] as const);
      for (let a = 0; a < row.length; a++) {
        const [i, xi] = row[a];
        for (let c = a; c < row.length; c++) {
          const [j, yj] = scaled[c];
          const update = F.mul(xi, yj);
          if (i === j) diag[i] = F.sub(diag[i], update);
          else {
            const cur = rows[i].get(j);
            const next = cur === undefined ? F.sub(F.fromInt(0), update) : F.sub(cur, update);
            if (F.sign(next) === 0) {
              rows[i].delete(j);
              rows[j].delete(i);
            } else {
              rows[i].set(j, next);
              rows[j].set(i, next);
            }
          }
        }
      }
    }
    for (const [i] of row) rows[i].delete(p);
    rows[p].clear();
    alive[p] = 0;
  }
  return { complete: true, positive, zero };
}
