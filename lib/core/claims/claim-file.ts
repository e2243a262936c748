/**
 * Claims documents: one claim, an array of claims, or a "cairn-claims/1" list. The offline checker
 * reads files through `readClaimsDocument`; other document formats (exported bundles) dispatch on
 * their own "format" value in the checker.
 */
import { array, CLAIM_FORMAT, ClaimError, CLAIMS_FILE_FORMAT, describe, object, validateClaim, type Claim } from "./claim-schema";

/** One entry of a claims file: the claim, or the error that kept it out. */
export type ClaimEntry =
  | { readonly index: number; readonly path: string; readonly claim: Claim }
  | { readonly index: number; readonly path: string; readonly error: ClaimError; readonly id?: string };

/**
 * Reads a claims document: one claim, an array of claims, or `{ "format": "cairn-claims/1", "claims": [...] }`.
 * A malformed document throws; a malformed claim inside a valid list becomes an entry with its error,
 * so the other claims are still checked.
 */
export function readClaimsDocument(json: unknown): ClaimEntry[] {
  let list: unknown[];
  let base: string;
  if (Array.isArray(json)) {
    list = json;
    base = "$";
  } else {
    const o = object(json, "$");
    if (o.format === CLAIM_FORMAT) return [entry(o, 0, "$")];
    if (o.format !== CLAIMS_FILE_FORMAT)
      throw new ClaimError("$.format", `expected "${CLAIM_FORMAT}" (one claim) or "${CLAIMS_FILE_FORMAT}" (a list), got ${describe(o.format)}`);
    list = array(o.claims, "$.claims");
    base = "$.claims";
  }
  return list.map((c, i) => entry(c, i, `${base}[${i}]`));
}

function entry(json: unknown, index: number, path: string): ClaimEntry {
  try {
    return { index, path, claim: validateClaim(json, path) };
  } catch (e) {
    if (e instanceof ClaimError) {
      // Keep the author's label when it is readable, so the report names the claim they know.
      const id = typeof json === "object" && json !== null ? (json as { id?: unknown }).id : undefined;
      return typeof id === "string" ? { index, path, error: e, id } : { index, path, error: e };
    }
    throw e;
  }
}
