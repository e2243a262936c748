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

/** bI − A over the field: the diagonal b − loop and a sparse row (entries −weight) per vertex. */
function fieldMatrix<T>(g: Graph, F: Field<T>, b: T): { rows: Array<Map<number, T>>; diag: T[] } {
  const { start, nbr, wt, diag: loops } = adjacency(g);
  const rows: Array<Map<number, T>> = [];
  const diag: T[] = [];
  for (let v = 0; v < g.n; v++) {
    diag.push(loops[v] === 0 ? b : F.sub(b, F.fromInt(loops[v])));
    const row = new Map<number, T>();
    for (let k = start[v]; k < start[v + 1]; k++) row.set(nbr[k], F.fromInt(-wt[k]));
    rows.push(row);
  }
  return { rows, diag };
}

/** The remaining vertex of least current degree (a linear scan: this path serves graphs of moderate size), its row and the sign of its pivot. */
function nextPivot<T>(F: Field<T>, rows: ReadonlyArray<Map<number, T>>, diag: readonly T[], alive: Uint8Array, budget: Budget) {
  const n = rows.length;
  let p = -1;
  for (let v = 0; v < n; v++) if (alive[v] && (p < 0 || rows[v].size < rows[p].size)) p = v;
  const row = [...rows[p]];
  budget.tick(n + row.length * row.length);
  return { p, row, s: F.sign(diag[p]) };
}

/** S_ij −= t (the entry is shared by rows i and j), dropping exact zeros (fill-in included). */
function subtractAt<T>(F: Field<T>, rows: Array<Map<number, T>>, diag: T[], i: number, j: number, t: T): void {
  if (i === j) {
    diag[i] = F.sub(diag[i], t);
    return;
  }
  const cur = rows[i].get(j);
  const next = cur === undefined ? F.sub(F.fromInt(0), t) : F.sub(cur, t);
  if (F.sign(next) === 0) {
    rows[i].delete(j);
    rows[j].delete(i);
  } else {
    rows[i].set(j, next);
    rows[j].set(i, next);
  }
}

export function fieldSparseDefiniteness<T>(g: Graph, F: Field<T>, b: T, stop: "nonPositive" | "negative", budget: Budget): FieldEliminationOutcome {
  const n = g.n;
  const { rows, diag } = fieldMatrix(g, F, b);
  const alive = new Uint8Array(n).fill(1);
  let positive = 0,
    zero = 0;
  for (let done = 0; done < n; done++) {
    const { p, row, s } = nextPivot(F, rows, diag, alive, budget);
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
          subtractAt(F, rows, diag, i, j, F.mul(xi, yj));
        }
      }
    }
    for (const [i] of row) rows[i].delete(p);
    rows[p].clear();
    alive[p] = 0;
  }
  return { complete: true, positive, zero };
}

/**
 * The full inertia of bI − A over an exact field, to the end (no early stop): 1×1 pivots in minimum-degree order
 * while the pivot is non-zero; a zero pivot with an empty row is a zero eigenvalue; a zero pivot p with a non-zero
 * entry a at a neighbour r is eliminated with the 2×2 block B = [[0, a], [a, c]] (determinant −a² < 0: one
 * positive and one negative eigenvalue; Bunch & Parlett, SIAM J. Numer. Anal. 8 (1971) 639–655), by
 * S_ij −= [u_i v_i] B⁻¹ [u_j v_j]ᵀ with B⁻¹ = [[−c/a², 1/a], [1/a, 0]]. Sylvester's law of inertia makes the counts
 * those of bI − A. Used over Q(b) as the all-exact reference for irrational b (every step in exact arithmetic).
 */
export function fieldSparseInertia<T>(g: Graph, F: Field<T>, b: T, budget: Budget): { positive: number; negative: number; zero: number } {
  const n = g.n;
  const { rows, diag } = fieldMatrix(g, F, b);
  const ZERO = F.fromInt(0);
  const alive = new Uint8Array(n).fill(1);
  const remove = (v: number) => {
    for (const i of rows[v].keys()) rows[i].delete(v);
    rows[v].clear();
    alive[v] = 0;
  };
  const subtract = (i: number, j: number, t: T) => subtractAt(F, rows, diag, i, j, t);
  let positive = 0,
    negative = 0,
    zero = 0;
  for (let done = 0; done < n;) {
    const { p, row, s } = nextPivot(F, rows, diag, alive, budget);
    if (s === 0 && row.length === 0) {
      zero++;
      remove(p);
      done++;
    } else if (s !== 0) {
      if (s > 0) positive++;
      else negative++;
      const inv = F.div(F.fromInt(1), diag[p]);
      const scaled = row.map(([i, x]) => [i, F.mul(x, inv)] as const);
      remove(p);
      for (let a = 0; a < row.length; a++) for (let c = a; c < row.length; c++) subtract(row[a][0], scaled[c][0], F.mul(row[a][1], scaled[c][1]));
      done++;
    } else {
      // Zero pivot with a non-zero row: the 2×2 block with its first neighbour.
      const [r, a] = row[0];
      const c = diag[r];
      const invA = F.div(F.fromInt(1), a);
      const m00 = F.sub(ZERO, F.mul(c, F.mul(invA, invA))); // −c/a²
      const others = new Map<number, [T, T]>();
      for (const [i, x] of rows[p]) if (i !== r) others.set(i, [x, ZERO]);
      for (const [i, x] of rows[r]) if (i !== p) others.set(i, [others.get(i)?.[0] ?? ZERO, x]);
      const list = [...others];
      budget.tick(list.length * list.length);
      remove(p);
      remove(r);
      positive++;
      negative++;
      for (let x = 0; x < list.length; x++)
        for (let y = x; y < list.length; y++) {
          const [i, [ui, vi]] = list[x],
            [j, [uj, vj]] = list[y];
          // [u_i v_i] B⁻¹ [u_j v_j]ᵀ = −c/a²·u_i u_j + (u_i v_j + v_i u_j)/a
          const t = F.sub(F.mul(m00, F.mul(ui, uj)), F.sub(ZERO, F.mul(invA, F.sub(F.mul(ui, vj), F.sub(ZERO, F.mul(vi, uj))))));
          subtract(i, j, t);
        }
      done += 2;
    }
  }
  return { positive, negative, zero };
}
