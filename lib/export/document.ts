/**
 * The exported document, read back from a sealed bundle, so that the LaTeX source, the print view and
 * the bundle say exactly the same thing. Pure: the writers (latex.ts, components/export) only lay it out.
 */
import type { Bundle, ClaimItemData, ExportKind } from "@/lib/core/certificates/bundle";
import { isUnresolved, type DisputeState } from "@/lib/review/states";
import { certificateKindOf, methodWithoutCertificate } from "@/lib/core/certificates/certificate-kind";
import { claimInputsView, type ClaimInputsView } from "@/lib/core/claims/claim-display";
import type { SnapshotRound } from "./snapshot";

export const CAUTION_MEANS =
  "A verified claim means that Cairn's checker redid the stated computation with exact arithmetic (integers, rationals, Sturm sequences; never floating point) on the stated input, and that the certificate stored with it re-checks independently, for example with the offline checker on this bundle.";
export const CAUTION_DOES_NOT =
  "It does not mean that the case split is exhaustive, nor that the prose argument of any step is right: that remains the responsibility of the authors and the referees.";

export interface DocClaim {
  id: string;
  status: string;
  /** The claim's kind ("subgraph", …). */
  kind: string;
  statement: string;
  /** The method that decided, without the certificate words (those are `certificateKind`). */
  method: string;
  /** The kind of the stored certificate in words, read from the certificate itself; null when there is none. */
  certificateKind: string | null;
  reason: string | null;
  /** The inputs as entered (lib/core/claims/claim-display.ts), with the vector a certificate carries. */
  inputs: ClaimInputsView;
  digest: string | null;
  /** SHA-256 of the bundle item that carries the claim and its certificate. */
  itemDigest: string;
  /** One sentence: what was checked, how, and with which certificate. */
  sentence: string;
}

export interface DocStep {
  id: string;
  position: number;
  revision: { number: number; body: string; authorName: string; savedAt: string } | null;
  claims: DocClaim[];
  vouches: Array<{ reviewer: string; revision: number; at: string }>;
  openDisputes: number;
}

export interface DocCase {
  number: string;
  depth: number;
  title: string;
  condition: string;
  state: string;
  steps: DocStep[];
}

/** A round in the document is the round as the snapshot read it (what the authors may see). */
export type DocRound = SnapshotRound;

/** "minor_revision" → "minor revision". */
export const recommendationWords = (r: string | null) => (r ? r.replace(/_/g, " ") : "no recommendation");

export interface ExportDocument {
  kind: ExportKind;
  title: string;
  statement: string;
  exportedAt: string;
  exportedBy: string;
  proofState: string;
  checkerVersion: string;
  manifestDigest: string;
  requiredApprovals: number;
  members: Array<{ name: string; role: string }>;
  cases: DocCase[];
  /** Review rounds and their decisions, oldest first. */
  rounds: DocRound[];
}

interface StepData {
  case: string;
  position: number;
  revision: DocStep["revision"];
  reviews: Array<{ reviewer: string; verdict: string; revision: number; disputeState: string | null; at: string }>;
}

/** "by tree inertia (Jacobs–Trevisan 2011) (certificate: Rayleigh vector)": the method that decided and the kind of evidence it left. */
export function methodPhrase(method: string | null, certificateKind: string | null): string {
  return `by ${method || "an unnamed method"}${certificateKind ? ` (certificate: ${certificateKind})` : ""}`;
}

function claimSentence(id: string, d: ClaimItemData, itemDigest: string, method: string, certificateKind: string | null): string {
  const v = d.verdict;
  const statement = v.statement ?? "(no statement recorded)";
  const digest = d.digest ? `claim digest ${d.digest}` : "no claim digest";
  switch (v.status) {
    case "verified":
      return `Verified: ${statement}, ${methodPhrase(method, certificateKind)}; certificate in bundle item "${id}" (SHA-256 ${itemDigest}), ${digest}.`;
    case "refuted":
      return `Refuted: ${statement}, ${methodPhrase(method, certificateKind)}${v.reason ? `: ${v.reason}` : ""}; ${digest}.`;
    case "undecided":
      return `Undecided: ${statement}${v.reason ? `: ${v.reason}` : ""}; ${digest}.`;
    default:
      return `Not checked yet: ${statement}.`;
  }
}

export function documentOf(bundle: Bundle): ExportDocument {
  const proof = bundle.items.find((i) => i.type === "proof")?.data as
    { title: string; statement: string; requiredApprovals: number; members: Array<{ name: string; role: string }> } | undefined;
  const cases: DocCase[] = [];
  const rounds: DocRound[] = [];
  const steps = new Map<string, DocStep>();
  for (const item of bundle.items) {
    if (item.type === "round") {
      rounds.push(item.data as DocRound);
    } else if (item.type === "case") {
      const d = item.data as { number: string; title: string; condition: string; state: string };
      cases.push({ number: d.number, depth: d.number.split(".").length - 1, title: d.title, condition: d.condition, state: d.state, steps: [] });
    } else if (item.type === "step") {
      const d = item.data as StepData;
      const step: DocStep = {
        id: item.id,
        position: d.position,
        revision: d.revision,
        claims: [],
        vouches: d.reviews.filter((r) => r.verdict === "vouch").map((r) => ({ reviewer: r.reviewer, revision: r.revision, at: r.at })),
        openDisputes: d.reviews.filter((r) => r.verdict === "dispute" && isUnresolved(r.disputeState as DisputeState | null)).length,
      };
      steps.set(item.id, step);
      cases.find((c) => c.number === d.case)?.steps.push(step);
    } else if (item.type === "claim") {
      const d = item.data as ClaimItemData;
      const kind = typeof (d.claim as { kind?: unknown } | null)?.kind === "string" ? String((d.claim as { kind: string }).kind) : "unknown";
      const certificateKind = certificateKindOf(kind, d.certificate)?.words ?? null;
      const method = methodWithoutCertificate(d.verdict.method ?? "");
      steps.get(d.step)?.claims.push({
        id: item.id,
        kind,
        status: d.verdict.status,
        statement: d.verdict.statement ?? "",
        method,
        certificateKind,
        reason: d.verdict.reason,
        inputs: claimInputsView(d.claim, d.certificate),
        digest: d.digest,
        itemDigest: item.sha256,
        sentence: claimSentence(item.id, d, item.sha256, method, certificateKind),
      });
    }
  }
  return {
    kind: bundle.export.kind,
    title: proof?.title ?? "",
    statement: proof?.statement ?? "",
    exportedAt: bundle.export.exportedAt,
    exportedBy: bundle.export.exportedBy,
    proofState: bundle.export.proofState,
    checkerVersion: bundle.export.checkerVersion,
    manifestDigest: bundle.manifestDigest,
    requiredApprovals: proof?.requiredApprovals ?? 1,
    members: proof?.members ?? [],
    cases,
    rounds,
  };
}
