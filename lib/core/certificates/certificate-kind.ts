/**
 * What kind of evidence a verdict left, in words, for every claim kind, and the method label that
 * carries it: "tree inertia (Jacobs–Trevisan 2011); certificate: Rayleigh vector". One owner, so the
 * claim card, the claims table, the bundle and the export name the same pair, and a method label can
 * never sit above evidence of another kind (an elimination that stopped and left a vector says so).
 */
import type { ClaimKind } from "../claims/claim-schema";
import { CERTIFICATE_KIND as SPECTRAL_CERTIFICATE_KIND } from "../spectral/inertia";
import { ABSENCE_ARGUMENT_WORDS } from "../subgraph/subgraph";

/** The evidence kind of a decided verdict: a stable key (as in the certificate JSON) and its words. */
export interface CertificateKind {
  readonly key: string;
  readonly words: string;
}

const STRUCTURE_WORDS: Record<string, string> = {
  forest: "spanning forest (parent of each vertex)",
  components: "component of each vertex",
  cycle: "a cycle of G",
  colouring: "2-colouring",
  "max-degree": "vertex of maximum degree with its neighbours",
  "branch-vertices": "list of the vertices of degree ≥ 3",
  legs: "centre and legs",
};

/** Claim kinds whose evidence is told apart by a field it carries: [field, key, words], the first present wins. */
const BY_FIELD: Partial<Record<ClaimKind, ReadonlyArray<readonly [field: string, key: string, words: string]>>> = {
  "vector-certificate": [
    ["conclusion", "vector-check", "the stated vector, checked entrywise"],
    ["failingVertex", "failing-vertex", "a vertex where the stated vector fails"],
  ],
  exclusion: [
    ["found", "embedding", "embedding of one pattern in G"],
    ["absent", "absence", "absence argument for each pattern"],
  ],
  "characteristic-polynomial": [["coefficients", "coefficients", "coefficients of det(xI − A)"]],
  eigenvalues: [["charpoly", "charpoly", "characteristic polynomial χ_G"]],
};

/** Claim kinds whose evidence names its own kind: the kinds each may leave, with their words. */
const BY_KIND: Partial<Record<ClaimKind, Readonly<Record<string, string>>>> = {
  "spectral-radius-bound": SPECTRAL_CERTIFICATE_KIND,
  identification: {
    isomorphism: "isomorphism onto the family member",
    "forbidden-subgraph": "embedding of a forbidden subgraph",
    components: STRUCTURE_WORDS.components,
  },
  structure: STRUCTURE_WORDS,
  coverage: { coverage: "counts per order and sub-case, uncovered graphs (graph6 or sparse6)" },
  enumeration: { enumeration: "list of the graphs found (graph6), with counts by order" },
};

const record = (v: unknown): Record<string, unknown> | null =>
  typeof v === "object" && v !== null && !Array.isArray(v) ? (v as Record<string, unknown>) : null;

/**
 * The evidence kind of a stored certificate. `certificate` is the claim certificate envelope
 * `{ kind, outcome, evidence }` (claims.ts) or the bare evidence; null when there is none (undecided)
 * or when it cannot be read (the words then say so, never a guess).
 */
export function certificateKindOf(claimKind: ClaimKind | string, certificate: unknown): CertificateKind | null {
  const envelope = record(certificate);
  if (!envelope) return null;
  const e = "evidence" in envelope && "outcome" in envelope ? record(envelope.evidence) : envelope;
  if (!e) return { key: "unreadable", words: "unreadable evidence" };
  const kind = typeof e.kind === "string" ? e.kind : undefined;
  const fields = BY_FIELD[claimKind as ClaimKind];
  if (fields) {
    const hit = fields.find(([field]) => field in e);
    return hit ? { key: hit[1], words: hit[2] } : null;
  }
  const named = BY_KIND[claimKind as ClaimKind];
  if (named) return kind && Object.hasOwn(named, kind) ? { key: kind, words: named[kind] } : null;
  switch (claimKind as ClaimKind) {
    case "subgraph":
      if (kind === "embedding") return { key: "embedding", words: "embedding of H in G" };
      if (kind === "absence") {
        const arg = record(e.argument)?.kind;
        return {
          key: "absence",
          words: `absence argument (${typeof arg === "string" ? (ABSENCE_ARGUMENT_WORDS[arg as keyof typeof ABSENCE_ARGUMENT_WORDS] ?? arg) : "unnamed"})`,
        };
      }
      return null;
    case "dynkin-data":
      if (kind !== "dynkin-data") return null;
      if ("cartanMatrix" in e)
        return { key: "dynkin-data", words: "Cartan matrix, highest root, Coxeter graph's characteristic polynomial, Weyl group and quantum integer values" };
      return "marks" in e
        ? { key: "dynkin-data", words: "identification, inertia and eigenvalue certificates, highest root, Weyl group and quantum integer values" }
        : { key: "dynkin-data", words: "identification of G (not the stated diagram)" };
    default:
      return null;
  }
}

/** Between the method and its certificate kind in a method label. */
export const CERTIFICATE_SEPARATOR = "; certificate: ";
const SEPARATOR = CERTIFICATE_SEPARATOR;

/**
 * The method that decided, with its certificate kind beside it. Idempotent: a method that already
 * names the certificate kind is returned as it is, and one that names another kind is corrected
 * (the words come from the certificate, which is what a reader re-checks).
 */
export function methodWithCertificate(claimKind: ClaimKind | string, method: string, certificate: unknown): string {
  const kind = certificateKindOf(claimKind, certificate);
  const base = method.includes(SEPARATOR) ? method.slice(0, method.indexOf(SEPARATOR)) : method;
  return kind ? `${base}${SEPARATOR}${kind.words}` : base;
}

/** The method alone, without the certificate words (for a short table cell beside a separate column). */
export function methodWithoutCertificate(method: string): string {
  return method.includes(SEPARATOR) ? method.slice(0, method.indexOf(SEPARATOR)) : method;
}
