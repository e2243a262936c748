/**
 * The second precision step of the certified front (float-front.ts): when some Gershgorin discs of
 * B = X·S·Xᵀ touch 0 in double precision, only their rows are recomputed in double-word arithmetic
 * (arithmetic/double-word.ts), and the rest of B is bounded, not recomputed.
 *
 * Let K be the rows of B whose double discs touch 0 (few: one per eigenvalue of S near 0) and F the others.
 * Every disc of F is clear of 0, and the discs of the principal block B_FF are no larger (same centres,
 * fewer off-diagonal terms), so B_FF is invertible with (#F₊, #F₋, 0) as its inertia and every eigenvalue
 * of the symmetric B_FF satisfies |λ| ≥ δ = min_{i∈F} (|c_i| − r_i) (Gershgorin 1931; Horn & Johnson,
 * "Matrix Analysis", Thm 6.1.1), so ‖B_FF⁻¹‖₂ ≤ 1/δ. By Haynsworth's inertia additivity (E. V. Haynsworth,
 * "Determination of the inertia of a partitioned Hermitian matrix", Linear Algebra Appl. 1 (1968) 73–81),
 *   In(B) = In(B_FF) + In(T),  T = B_KK − B_KF·B_FF⁻¹·B_FK,
 * and |T_ab − B_ab| ≤ ‖B_aF‖₂·‖B_bF‖₂ / δ (Cauchy–Schwarz). The rows B_a· (a ∈ K) are computed as
 * y = X_a·S, then B_aj = y·X_jᵀ, in double-word arithmetic, each operation with relative error at most
 * ε = DW_EPS. An inner product of k terms formed that way errs by at most γ_k·Σ|terms|, γ_k = kε/(1 − kε)
 * (N. J. Higham, "Accuracy and Stability of Numerical Algorithms", 2nd ed. 2002, §3.1: the derivation only
 * uses fl(a ∘ b) = (a ∘ b)(1 + δ), |δ| ≤ ε). With S known up to |S − S̃| ≤ R (S̃ = S_hi + S_lo):
 *   |ỹ_l − y_l| ≤ e_l := γ_{f+1}·(|X_a||S̃|)_l + (|X_a| R)_l,
 *   |B̃_aj − B_aj| ≤ E_aj := γ_{f+1}·Σ_l |ỹ_l||X_jl| + Σ_l e_l |X_jl|.
 * T's enclosure (symmetrised: the midpoint of B̃_ab and B̃_ba, radius max(E_ab, E_ba) + |B̃_ab − B̃_ba|/2 plus
 * the Schur term with ‖B_aF‖₂ ≤ (Σ_{j∈F} (|B̃_aj| + E_aj)²)^½) is a small interval matrix whose scale is that
 * of its eigenvalues, so it is certified by the double-precision discs again (float-front.ts): relative
 * rounding at that scale is harmless. The bounds themselves are sums of fewer than 2^20 non-negative doubles
 * (nested at most three deep), each rounded to nearest: multiplying by 1 + 2^-20 keeps them upper bounds;
 * every double-word operation adds an absolute 2^-1000 for gradual underflow (entries are kept below 2^400),
 * 2^-900 per entry in all. A zero eigenvalue makes T's discs touch 0 again: the caller then goes on to
 * the exact kernel vectors or the exact elimination — only a proof is returned.
 */
import { DW_EPS, dwAdd, dwMulD } from "../arithmetic/double-word";
import type { FrontFactor, FrontInertia } from "./float-front";

/** Most rows refined (each costs about f² double-word operations). */
export const REFINE_LIMIT = 64;

const SAFE = 1 + 2 ** -20;
const UNDER = 2 ** -900;
const LIMIT = 2 ** 400;

/**
 * The inertia shared by every symmetric S with |S − (S_hi + S_lo)| ≤ R entrywise (f×f, front order), given
 * the double factorisation of S_hi whose discs touch 0, or undefined when the refinement does not decide it.
 * `certify` is the double-precision disc certificate for the small interval matrix T.
 */
export function refineFront(
  factor: FrontFactor,
  Shi: Float64Array,
  Slo: Float64Array | undefined,
  R: Float64Array,
  certify: (mid: Float64Array, rad: Float64Array, m: number) => FrontInertia | undefined,
  tick: (steps: number) => void,
): FrontInertia | undefined {
  const { f, X, perm, centre, radius } = factor;
  if (f > 2 ** 20) return undefined;
  const K: number[] = [];
  let delta = Infinity,
    fPositive = 0,
    fCount = 0;
  for (let i = 0; i < f; i++) {
    const c = centre[i],
      r = radius[i];
    if (Math.abs(c) > r) {
      delta = Math.min(delta, (Math.abs(c) - r) * (1 - 2 ** -50));
      fCount++;
      if (c > 0) fPositive++;
    } else K.push(i);
  }
  const m = K.length;
  if (m === 0 || m > REFINE_LIMIT || !(delta > 0)) return undefined;
  for (let i = 0; i < Shi.length; i++) if (!(Math.abs(Shi[i]) < LIMIT) || !(Math.abs(X[i]) < LIMIT) || !(R[i] < LIMIT)) return undefined;
  tick(8 * m * f * f);
  const gamma = ((f + 1) * DW_EPS) / (1 - (f + 1) * DW_EPS);
  const lo = Slo ?? new Float64Array(Shi.length);
  const rowsH: Float64Array[] = [],
    rowsL: Float64Array[] = [],
    rowsE: Float64Array[] = [];
  for (const a of K) {
    // y = X_a·P (P = S in pivot order), its error bound e.
    const yh = new Float64Array(f),
      yl = new Float64Array(f),
      absY = new Float64Array(f),
      radY = new Float64Array(f);
    for (let l = 0; l <= a; l++) {
      const x = X[a * f + l];
      if (x === 0) continue;
      const ax = Math.abs(x),
        row = perm[l] * f;
      for (let j = 0; j < f; j++) {
        const c = row + perm[j];
        const t = dwMulD(Shi[c], lo[c], x);
        const s = dwAdd(yh[j], yl[j], t.hi, t.lo);
        yh[j] = s.hi;
        yl[j] = s.lo;
        absY[j] += ax * Math.abs(Shi[c]);
        radY[j] += ax * R[c];
      }
    }
    const e = new Float64Array(f);
    for (let j = 0; j < f; j++) e[j] = (gamma * absY[j] + radY[j]) * SAFE + UNDER;
    // B_aj = y·X_jᵀ (X_j has entries l ≤ j), its error bound E.
    const bh = new Float64Array(f),
      bl = new Float64Array(f),
      E = new Float64Array(f);
    for (let j = 0; j < f; j++) {
      let h = 0,
        w = 0,
        absB = 0,
        errB = 0;
      for (let l = 0; l <= j; l++) {
        const xj = X[j * f + l];
        if (xj === 0) continue;
        const t = dwMulD(yh[l], yl[l], xj);
        const s = dwAdd(h, w, t.hi, t.lo);
        h = s.hi;
        w = s.lo;
        absB += Math.abs(yh[l] * xj);
        errB += e[l] * Math.abs(xj);
      }
      bh[j] = h;
      bl[j] = w;
      E[j] = (gamma * absB + errB) * SAFE * SAFE + UNDER;
      if (!Number.isFinite(h) || !Number.isFinite(E[j])) return undefined;
    }
    rowsH.push(bh);
    rowsL.push(bl);
    rowsE.push(E);
  }
  // ‖B_aF‖₂ bounds, then T's midpoint and radius.
  const inK = new Uint8Array(f);
  for (const a of K) inK[a] = 1;
  const norm = rowsH.map((bh, r) => {
    let s = 0;
    for (let j = 0; j < f; j++) if (!inK[j]) s += (Math.abs(bh[j]) * (1 + 2 ** -52) + rowsE[r][j]) ** 2;
    return Math.sqrt(s * SAFE) * SAFE;
  });
  const mid = new Float64Array(m * m),
    rad = new Float64Array(m * m);
  for (let r = 0; r < m; r++)
    for (let c = r; c < m; c++) {
      const ab = { hi: rowsH[r][K[c]], lo: rowsL[r][K[c]] },
        ba = { hi: rowsH[c][K[r]], lo: rowsL[c][K[r]] };
      const sum = dwAdd(ab.hi, ab.lo, ba.hi, ba.lo);
      const diff = dwAdd(ab.hi, ab.lo, -ba.hi, -ba.lo);
      const schur = fCount > 0 ? (norm[r] * norm[c]) / delta : 0;
      mid[r * m + c] = mid[c * m + r] = sum.hi / 2;
      rad[r * m + c] = rad[c * m + r] =
        (Math.max(rowsE[r][K[c]], rowsE[c][K[r]]) + Math.abs(diff.hi) / 2 + Math.abs(sum.lo) / 2 + DW_EPS * Math.abs(sum.hi) + schur) * SAFE + UNDER;
      if (!Number.isFinite(rad[r * m + c])) return undefined;
    }
  const t = certify(mid, rad, m);
  if (!t) return undefined;
  return { positive: fPositive + t.positive, negative: fCount - fPositive + t.negative, zero: t.zero };
}
