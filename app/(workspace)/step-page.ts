import "server-only";
import { getStep } from "@/lib/data/steps";
import { listStepClaims, listWithdrawnClaims } from "@/lib/data/claim-lists";
import { verificationNotice } from "@/lib/data/claim-jobs";
import { parseCompare } from "@/lib/review/compare-link";
import { orNotFound, stepPageAccess } from "./page-access";

/** What the two step pages (in the proof, and from the review queue) are given. */
export interface StepPageProps {
  params: Promise<{ proofId: string; stepId: string }>;
  searchParams: Promise<Record<string, string | string[] | undefined>>;
}

/**
 * Opens a step page: its access (a step that is gone or outside a case-limited member's cases is not found),
 * the step with its revisions, and the comparison a superseded vouch's notice asks for (the vouched revision
 * against the latest).
 */
export async function openStepPage({ params, searchParams }: StepPageProps) {
  const p = await params;
  const { access, step: ref } = await stepPageAccess(p.proofId, p.stepId);
  const step = await orNotFound(getStep(access.proofId, ref.id));
  const compare = parseCompare((await searchParams).compare, step.revisions[0]?.number ?? 0);
  return { access, ref, step, compare };
}

/** The step's claims as a claim list starts: current, withdrawn, and the note on checks still running. */
export async function stepClaimLists(stepId: number) {
  const [claims, withdrawn] = await Promise.all([listStepClaims(stepId), listWithdrawnClaims(stepId)]);
  return { claims, withdrawn, verification: await verificationNotice(claims) };
}
