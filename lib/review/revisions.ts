/**
 * A revision of a step is its text and its claim set (each claim with its input digest and verdict).
 * Pure rules shared by the data layer, the review panel, the export and the seeders: what a new
 * revision's claim set is, what changed between two revisions (in words a referee reads), and which
 * revisions count as written by someone (claim-only revisions do not make their actor an author).
 */
import { revisionDigest } from "@/lib/core/certificates/revision-digest";
import type { ClaimStatus } from "./states";

export interface RevisionClaim {
  id: number;
  position: number;
  kind: string;
  statement: string | null;
  digest: string;
  status: ClaimStatus;
}

/** "text": saved by a person from the editor; "claims": made by attaching, withdrawing or re-deciding a claim. */
export type RevisionOrigin = "text" | "claims";

export function parseClaimSet(text: string | null | undefined): RevisionClaim[] {
  if (!text) return [];
  const parsed = JSON.parse(text) as unknown;
  return Array.isArray(parsed) ? (parsed as RevisionClaim[]) : [];
}

export const claimSetText = (claims: readonly RevisionClaim[]) => JSON.stringify(claims);

export function digestOfRevision(number: number, body: string, claims: readonly RevisionClaim[]): string {
  return revisionDigest({ number, body, claims: claims.map((c) => ({ digest: c.digest, status: c.status })) });
}

/** Claims in step order (position, then id). */
export const ordered = (claims: readonly RevisionClaim[]) => [...claims].sort((a, b) => a.position - b.position || a.id - b.id);

export interface RevisionChange {
  text: boolean;
  added: RevisionClaim[];
  withdrawn: RevisionClaim[];
  redecided: Array<{ claim: RevisionClaim; from: ClaimStatus; to: ClaimStatus }>;
}

/** What changed from revision `a` to revision `b`. */
export function compareRevisions(a: { body: string; claims: readonly RevisionClaim[] }, b: { body: string; claims: readonly RevisionClaim[] }): RevisionChange {
  const before = new Map(a.claims.map((c) => [c.id, c]));
  const after = new Map(b.claims.map((c) => [c.id, c]));
  return {
    text: a.body !== b.body,
    added: b.claims.filter((c) => !before.has(c.id)),
    withdrawn: a.claims.filter((c) => !after.has(c.id)),
    redecided: b.claims.flatMap((c) => {
      const old = before.get(c.id);
      return old && old.status !== c.status ? [{ claim: c, from: old.status, to: c.status }] : [];
    }),
  };
}

export const isUnchanged = (c: RevisionChange) => !c.text && c.added.length === 0 && c.withdrawn.length === 0 && c.redecided.length === 0;

/** A claim as sentences name it: "claim #4 (ρ(G) < 2)". */
export const claimName = (c: RevisionClaim) => `claim #${c.id}${c.statement ? ` (${c.statement})` : ` (${c.kind})`}`;
const named = claimName;

/** One sentence: "the text changed; claim #4 (ρ(G) < 2) attached; claim #2 (…) re-decided: verified → refuted". */
export function describeChange(c: RevisionChange): string {
  const parts = [
    ...(c.text ? ["the text changed"] : []),
    ...c.added.map((x) => `${named(x)} attached`),
    ...c.withdrawn.map((x) => `${named(x)} withdrawn`),
    ...c.redecided.map((x) => `${named(x.claim)} re-decided: ${x.from} → ${x.to}`),
  ];
  return parts.length ? parts.join("; ") : "nothing changed";
}

/** The change as plain data for an API answer. */
export function changeJson(c: RevisionChange) {
  const ref = (x: RevisionClaim) => ({ id: x.id, kind: x.kind, statement: x.statement });
  return {
    text: c.text,
    claimsAdded: c.added.map(ref),
    claimsWithdrawn: c.withdrawn.map(ref),
    claimsRedecided: c.redecided.map((x) => ({ ...ref(x.claim), from: x.from, to: x.to })),
  };
}

/** People who wrote the step's text (they never vouch for it); claim-only revisions do not count. */
export function textAuthors(revisions: ReadonlyArray<{ authorId: number; origin?: RevisionOrigin | null }>): number[] {
  return [...new Set(revisions.filter((r) => r.origin !== "claims").map((r) => r.authorId))];
}
