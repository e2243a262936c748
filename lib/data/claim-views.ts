/**
 * A claim as pages and handlers see it (ClaimView): read from its row with the certificate summarised,
 * long inputs cut for display and the checker's name; and reading the views of a step's claims.
 */
import "server-only";
import { storedJson } from "@/lib/stored-json";
import { models } from "@/models";
import { certificateKindOf, methodWithoutCertificate } from "@/lib/core/certificates/certificate-kind";
import { claimInputsView, type ClaimInputsView } from "@/lib/core/claims/claim-display";
import type { JobProgress } from "@/lib/data/claim-jobs";
import type { ClaimPicture } from "@/lib/verification/picture";
import type { ClaimStatus } from "@/lib/review/states";

export interface ClaimView {
  id: number;
  stepId: number;
  position: number;
  kind: string;
  status: ClaimStatus;
  statement: string | null;
  /** The method that decided (without the certificate words: those are `certificateKind`). */
  method: string | null;
  /** The kind of the stored certificate in words, read from the certificate; null when none. */
  certificateKind: string | null;
  reason: string | null;
  digest: string | null;
  /** The claim's inputs as JSON; graph texts longer than 4 000 characters are cut for display. */
  input: Record<string, unknown>;
  /** The inputs as a reader sees them (lib/core/claims/claim-display.ts): graphs as entered and as graph6, bound, vector, … */
  inputs: ClaimInputsView;
  certificate: { summary: string; bytes: number; preview: string } | null;
  checkerVersion: string | null;
  /** The worker (host:pid) that stored the verdict. */
  decidedBy: string | null;
  /** While pending: where its job is (queued, checking on which worker, retried), when the queue can be asked. */
  progress: JobProgress | null;
  checkedByName: string | null;
  checkedAt: string | null;
  createdAt: string;
  picture: ClaimPicture | null;
}

export type ClaimRow = InstanceType<ReturnType<typeof models>["Claim"]>;

const PREVIEW = 4_000;

function cut(value: unknown): unknown {
  if (typeof value === "string") return value.length > PREVIEW ? `${value.slice(0, PREVIEW)}… (${value.length} characters)` : value;
  if (Array.isArray(value)) return value.length > 500 ? [...value.slice(0, 500).map(cut), `… ${value.length} entries`] : value.map(cut);
  if (typeof value === "object" && value !== null) return Object.fromEntries(Object.entries(value).map(([k, v]) => [k, cut(v)]));
  return value;
}

function certificateSummary(text: string, claimKind: string): ClaimView["certificate"] {
  let summary = "certificate";
  try {
    const c = JSON.parse(text) as { outcome?: string };
    const kind = certificateKindOf(claimKind, c);
    summary = `supports “${c.outcome}”${kind ? `; ${kind.words}` : ""}`;
  } catch {
    // stored by this server, always JSON; keep the generic summary otherwise
  }
  return { summary, bytes: text.length, preview: text.length > 1_500 ? `${text.slice(0, 1_500)}…` : text };
}

export const certificateJson = (text: string | null) => storedJson(text);

export function claimView(c: ClaimRow, progress: JobProgress | null = null): ClaimView {
  const checker = (c as unknown as { checker?: { name: string } | null }).checker;
  return {
    id: c.id,
    stepId: c.stepId,
    position: c.position,
    kind: c.kind,
    status: c.status,
    statement: c.statement,
    method: c.method === null ? null : methodWithoutCertificate(c.method),
    certificateKind: certificateKindOf(c.kind, certificateJson(c.certificate))?.words ?? null,
    reason: c.reason,
    digest: c.digest,
    input: cut(JSON.parse(c.input)) as Record<string, unknown>,
    inputs: claimInputsView(c.input, certificateJson(c.certificate)),
    certificate: c.certificate ? certificateSummary(c.certificate, c.kind) : null,
    checkerVersion: c.checkerVersion,
    decidedBy: c.decidedBy ?? null,
    progress: c.status === "pending" ? progress : null,
    checkedByName: checker?.name ?? null,
    checkedAt: c.checkedAt ? c.checkedAt.toISOString() : null,
    createdAt: c.createdAt.toISOString(),
    picture: c.picture ? (JSON.parse(c.picture) as ClaimPicture) : null,
  };
}

export const withChecker = () => [{ model: models().User, as: "checker", attributes: ["name"], required: false }];

/** The step's claims with these ids, in step order, read in one query. */
export async function readClaimViews(stepId: number, ids: number[]): Promise<ClaimView[]> {
  const { Claim } = models();
  return (await Claim.findAll({ where: { id: ids, stepId }, include: withChecker(), order: [["position", "ASC"]] })).map((c) => claimView(c));
}
