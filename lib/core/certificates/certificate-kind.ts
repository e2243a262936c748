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
  switch (claimKind as ClaimKind) {
    case "spectral-radius-bound":
      return kind && kind in SPECTRAL_CERTIFICATE_KIND ? { key: kind, words: SPECTRAL_CERTIFICATE_KIND[kind as keyof typeof SPECTRAL_CERTIFICATE_KIND] } : null;
    case "vector-certificate":
      if ("conclusion" in e) return { key: "vector-check", words: "the stated vector, checked entrywise" };
      if ("failingVertex" in e) return { key: "failing-vertex", words: "a vertex where the stated vector fails" };
      return null;
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
    case "exclusion":
      if ("found" in e) return { key: "embedding", words: "embedding of one pattern in G" };
      if ("absent" in e) return { key: "absence", words: "absence argument for each pattern" };
      return null;
    case "identification":
      if (kind === "isomorphism") return { key: "isomorphism", words: "isomorphism onto the family member" };
      if (kind === "forbidden-subgraph") return { key: "forbidden-subgraph", words: "embedding of a forbidden subgraph" };
      if (kind === "components") return { key: "components", words: STRUCTURE_WORDS.components };
      return null;
    case "characteristic-polynomial":
      return "coefficients" in e ? { key: "coefficients", words: "coefficients of det(xI − A)" } : null;
    case "eigenvalues":
      return "charpoly" in e ? { key: "charpoly", words: "characteristic polynomial χ_G" } : null;
    case "structure":
      return kind && kind in STRUCTURE_WORDS ? { key: kind, words: STRUCTURE_WORDS[kind] } : null;
    case "dynkin-data":
      if (kind !== "dynkin-data") return null;
      if ("cartanMatrix" in e)
        return { key: "dynkin-data", words: "Cartan matrix, highest root, Coxeter graph's characteristic polynomial, Weyl group and quantum integer values" };
      return "marks" in e
        ? { key: "dynkin-data", words: "identification, inertia and eigenvalue certificates, highest root, Weyl group and quantum integer values" }
        : { key: "dynkin-data", words: "identification of G (not the stated diagram)" };
    case "coverage":
      return kind === "coverage" ? { key: "coverage", words: "counts per order and sub-case, uncovered graphs (graph6 or sparse6)" } : null;
    case "enumeration":
      return kind === "enumeration" ? { key: "enumeration", words: "list of the graphs found (graph6), with counts by order" } : null;
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
