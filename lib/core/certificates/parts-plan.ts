/**
 * Re-checking a document's large enumeration and coverage claims in parts: which claims of a bundle
 * or claims file are split (claimsToSplit, by the one rule partsOf), and how the parts computed
 * elsewhere — part jobs on the server's workers, or worker threads of the offline checker — come back
 * to the check of the document (claimPartsOptions). Merged parts give the verdict, certificate and
 * digest of the single run (augmentation-parts.ts), and a carried certificate is re-checked against the
 * same merged enumeration, so no path enumerates a split claim again in one piece.
 */
import { readClaimsDocument } from "../claims/claim-file";
import { ClaimError, validateClaim, type Claim } from "../claims/claim-schema";
import { claimDigest, type VerifyOptions } from "../claims/claims";
import { partsOf } from "../claims/part-count";

/** A claim of a document to be checked in parts: `key` names it in the document (a bundle item's id, or a claims file's JSON path). */
export interface ClaimToSplit {
  readonly key: string;
  readonly claim: Claim;
  /** The claim's digest: parts are used only for the claim they were computed for. */
  readonly digest: string;
  readonly parts: number;
}

/** The parts of one claim, as computed: every part's result (claimPart), or why one has none (it failed for good). */
export type PartsOfClaim = { readonly digest: string; readonly results: readonly unknown[] } | { readonly digest: string; readonly failed: string };

/** Parts by claim key (plain JSON: it crosses threads and job boundaries). */
export type PartsByClaim = Readonly<Record<string, PartsOfClaim>>;

const isRecord = (v: unknown): v is Record<string, unknown> => typeof v === "object" && v !== null && !Array.isArray(v);

/** The claims of a bundle (`cairn-bundle/1`) or claims document that partsOf splits, with their parts; unreadable claims are left to the check. */
export function claimsToSplit(json: unknown, maxParts?: number): ClaimToSplit[] {
  const claims: Array<{ key: string; claim: Claim }> = [];
  if (isRecord(json) && json.format === "cairn-bundle/1") {
    for (const item of Array.isArray(json.items) ? json.items : []) {
      if (!isRecord(item) || item.type !== "claim" || typeof item.id !== "string" || !isRecord(item.data)) continue;
      try {
        claims.push({ key: item.id, claim: validateClaim(item.data.claim, `${item.id}.data.claim`) });
      } catch (e) {
        if (!(e instanceof ClaimError)) throw e;
      }
    }
  } else {
    try {
      for (const entry of readClaimsDocument(json)) if ("claim" in entry) claims.push({ key: entry.path, claim: entry.claim });
    } catch (e) {
      if (!(e instanceof ClaimError)) throw e;
    }
  }
  return claims.map(({ key, claim }) => ({ key, claim, digest: claimDigest(claim), parts: partsOf(claim, maxParts) })).filter((c) => c.parts > 1);
}

/** What verifyClaim takes from the parts given for the claim at `key` (nothing when none were given, or they were computed for another claim). */
export function claimPartsOptions(given: PartsByClaim | undefined, key: string, claim: Claim): Pick<VerifyOptions, "parts" | "partsFailed"> {
  const p = given?.[key];
  if (!p || p.digest !== claimDigest(claim)) return {};
  return "failed" in p ? { partsFailed: p.failed } : { parts: p.results };
}

/** "part 2 of 4": a part as reasons and logs name it (0-based `part`, named 1-based). */
export const partWords = (p: { readonly part: number; readonly parts: number }): string => `part ${p.part + 1} of ${p.parts}`;
