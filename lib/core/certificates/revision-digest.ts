/**
 * What a vouch covers: one revision of a step, which is its text *and* the claims attached at that
 * moment with their verdicts. The revision digest is the SHA-256 of the canonical JSON of
 * `{ format, number, bodySha256, claims: [{ digest, status }] }` (claims in their order on the step).
 * A vouch stores this digest; the offline checker recomputes it from the bundle (bundle.ts), so a
 * vouch can never be read as covering claims it did not see. Framework-free.
 */
import { canonicalJson } from "../input/canonical";
import { sha256Hex } from "../digest";

export const REVISION_FORMAT = "cairn-revision/1";

/** A claim as a revision covers it: the digest of its input and its verdict at that revision. */
export interface CoveredClaim {
  readonly digest: string;
  readonly status: string;
}

export interface CoveredRevision {
  readonly number: number;
  readonly body: string;
  readonly claims: readonly CoveredClaim[];
}

export function revisionDigest(r: CoveredRevision): string {
  return sha256Hex(
    canonicalJson({
      format: REVISION_FORMAT,
      number: r.number,
      bodySha256: sha256Hex(r.body),
      claims: r.claims.map((c) => ({ digest: c.digest, status: c.status })),
    }),
  );
}
