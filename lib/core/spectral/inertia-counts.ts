/**
 * The inertia of a real symmetric matrix: how many of its eigenvalues are positive, negative and zero.
 * By Sylvester's law of inertia any congruent diagonal matrix has the same counts, which is what every
 * elimination in this folder computes.
 */
export interface InertiaCounts {
  positive: number;
  negative: number;
  zero: number;
}
