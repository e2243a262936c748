/**
 * Lists of claims: a step's live claims, a step's withdrawn ones (kept as history), and every claim of
 * a proof's live cases with its step's number (the overview table).
 */
import "server-only";
import { Op } from "sequelize";
import { models } from "@/models";
import { certificateKindOf, methodWithoutCertificate } from "@/lib/core/certificates/certificate-kind";
import { claimInputsView, type ClaimInputsView } from "@/lib/core/claims/claim-display";
import { pendingProgress } from "@/lib/data/claim-jobs";
import type { ClaimStatus } from "@/lib/review/states";
import { liveCases, stepsOfCases } from "@/lib/data/cases";
import { numberedCases, stepLabel } from "@/lib/proof-tree";
import { certificateJson, claimView, withChecker, type ClaimView } from "@/lib/data/claim-views";

export interface WithdrawnClaimView {
  id: number;
  kind: string;
  statement: string | null;
  status: ClaimStatus;
  withdrawnAt: string;
  withdrawnByName: string | null;
}

/** The step's withdrawn claims, most recent first: kept as history, shown apart from the live ones. */
export async function listWithdrawnClaims(stepId: number): Promise<WithdrawnClaimView[]> {
  const { Claim, User } = models();
  const rows = await Claim.unscoped().findAll({
    where: { stepId, withdrawnAt: { [Op.ne]: null } },
    attributes: ["id", "kind", "statement", "status", "withdrawnAt"],
    include: [{ model: User, as: "withdrawer", attributes: ["name"], required: false }],
    order: [
      ["withdrawnAt", "DESC"],
      ["id", "DESC"],
    ],
  });
  return rows.map((r) => ({
    id: r.id,
    kind: r.kind,
    statement: r.statement,
    status: r.status,
    withdrawnAt: r.withdrawnAt!.toISOString(),
    withdrawnByName: (r as unknown as { withdrawer?: { name: string } | null }).withdrawer?.name ?? null,
  }));
}

export async function listStepClaims(stepId: number): Promise<ClaimView[]> {
  const { Claim } = models();
  const rows = await Claim.findAll({
    where: { stepId },
    include: withChecker(),
    order: [
      ["position", "ASC"],
      ["id", "ASC"],
    ],
  });
  const progress = await pendingProgress(rows);
  return rows.map((r) => claimView(r, progress.get(r.id) ?? null));
}

export interface ClaimRowView {
  id: number;
  stepId: number;
  stepNumber: string;
  caseNumber: string;
  caseTitle: string;
  kind: string;
  status: ClaimStatus;
  statement: string | null;
  method: string | null;
  certificateKind: string | null;
  inputs: ClaimInputsView;
  checkedAt: string | null;
}

/** Every claim of the proof's live cases, with the number of its step (for the overview table). */
export async function listProofClaims(proofId: number, visible: ReadonlySet<number> | null = null): Promise<ClaimRowView[]> {
  const { Claim } = models();
  const all = await liveCases(proofId);
  // Numbering uses every live case; the listing only the cases this reader may see.
  const cases = visible === null ? all : all.filter((c) => visible.has(c.id));
  const numbered = new Map(numberedCases(all).map((n) => [n.id, n]));
  const steps = await stepsOfCases(cases.map((c) => c.id));
  if (steps.length === 0) return [];
  const place = new Map<number, string>();
  for (const c of cases) steps.filter((s) => s.caseId === c.id).forEach((s, i) => place.set(s.id, stepLabel(numbered.get(c.id)!.number, i + 1)));
  const rows = await Claim.findAll({
    where: { stepId: { [Op.in]: steps.map((s) => s.id) } },
    attributes: ["id", "stepId", "kind", "status", "statement", "method", "checkedAt", "input", "certificate"],
    order: [["id", "ASC"]],
  });
  const caseOf = new Map(steps.map((s) => [s.id, numbered.get(s.caseId)!]));
  return rows.map((r) => ({
    id: r.id,
    stepId: r.stepId,
    stepNumber: place.get(r.stepId) ?? "",
    caseNumber: caseOf.get(r.stepId)?.number ?? "",
    caseTitle: caseOf.get(r.stepId)?.title ?? "",
    kind: r.kind,
    status: r.status,
    statement: r.statement,
    method: r.method === null ? null : methodWithoutCertificate(r.method),
    certificateKind: certificateKindOf(r.kind, certificateJson(r.certificate))?.words ?? null,
    inputs: claimInputsView(r.input, certificateJson(r.certificate)),
    checkedAt: r.checkedAt ? r.checkedAt.toISOString() : null,
  }));
}
