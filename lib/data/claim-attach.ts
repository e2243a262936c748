/**
 * Attaching claims to a step: every input read as the check will read it (a 422 naming each problem,
 * nothing stored), a coverage claim's sub-cases filled in from the step's case, the claims stored all
 * or none, and their verification queued; and waiting a little for the first verdicts.
 */
import "server-only";
import { models } from "@/models";
import { getSequelize } from "@/lib/db";
import { invalid, type Issue } from "@/lib/errors";
import { ClaimError, validateClaim, type Claim as ClaimJson } from "@/lib/core/claims/claim-schema";
import { claimDigest } from "@/lib/core/claims/claims";
import { checkInputs } from "@/lib/core/claims/claim-inputs";
import { scheduleVerification, waitForVerdicts } from "@/lib/data/claim-jobs";
import { subCasesOf } from "@/lib/data/cases";
import { subCaseConditionIssue } from "@/lib/validations/case";
import { stepInProof } from "@/lib/data/steps";
import { deliverAfterCommit } from "@/lib/mail/outbox";
import { recordEvent } from "@/lib/data/audit";
import { lockLatest, reviseClaims, revisionClaimOf } from "@/lib/data/revisions";
import { readClaimViews, type ClaimRow, type ClaimView } from "@/lib/data/claim-views";

/**
 * Waits up to `ms` for the verdicts of claims just attached to a step (the checks run as jobs in the
 * worker processes) and returns the claims as they are then; those not done are still `pending`.
 */
export async function awaitVerdicts(stepId: number, ids: number[], ms: number): Promise<ClaimView[]> {
  await waitForVerdicts(ids, ms);
  return readClaimViews(stepId, ids);
}

/**
 * Reads every claim's inputs the way the check will (graph text, bound, embedding and vector sizes),
 * so that malformed input is a 422 naming the field and nothing is stored. Reading is parsing only;
 * the check itself runs in a worker process.
 */
async function readClaims(raw: Record<string, unknown>[]): Promise<ClaimJson[]> {
  // Every claim is read, also after an unreadable one, so that one answer names every problem at once.
  const found: Array<{ index: number; issue: Issue }> = [];
  const claims: Array<ClaimJson | null> = [];
  const pathOf = (i: number, p: string) => `claims.${i}${p.replace(/^\$/, "")}`;
  for (const [i, json] of raw.entries()) {
    try {
      claims.push(validateClaim(json));
    } catch (e) {
      if (!(e instanceof ClaimError)) throw e;
      claims.push(null);
      found.push({ index: i, issue: { path: pathOf(i, e.path), message: e.detail } });
    }
  }
  for (const [i, claim] of claims.entries()) {
    if (!claim) continue;
    try {
      checkInputs(claim);
    } catch (e) {
      if (!(e instanceof ClaimError)) throw e;
      found.push({ index: i, issue: { path: pathOf(i, e.path), message: e.detail } });
    }
  }
  if (found.length)
    throw invalid(
      "Some claims need attention; nothing was saved.",
      found.sort((a, b) => a.index - b.index).map((f) => f.issue),
    );
  return claims as ClaimJson[];
}

/**
 * A coverage claim attached to a step without `cases` takes its sub-cases from the step's case: one per
 * live child case, labelled by its title, with the child's machine-readable condition. The filled-in
 * claim carries the conditions itself, so the offline checker re-checks it from the bundle alone.
 */
async function fillCoverageCases(proofId: number, stepId: number, raw: Record<string, unknown>[]): Promise<Record<string, unknown>[]> {
  if (!raw.some((c) => c.kind === "coverage" && c.cases === undefined)) return raw;
  const step = await models().Step.findByPk(stepId);
  const children = step ? await subCasesOf(proofId, step.caseId) : [];
  const found: Issue[] = [];
  const out = raw.map((c, i) => {
    if (c.kind !== "coverage" || c.cases !== undefined) return c;
    if (children.length === 0) {
      found.push({ path: `claims.${i}.cases`, message: 'This step\'s case has no sub-cases to take the conditions from; list the sub-cases in "cases".' });
      return c;
    }
    const missing = children.filter((k) => !k.predicate);
    if (missing.length) {
      found.push({
        path: `claims.${i}.cases`,
        message: `Give every sub-case a machine-readable condition first (missing on: ${missing.map((k) => `"${k.title}"`).join(", ")}), or list the sub-cases in "cases".`,
      });
      return c;
    }
    // Each sub-case's condition must fit this claim's setting; the problem names the case and the part that does not fit.
    const setting = { multigraph: c.setting === "multigraph" };
    const wrong = children.flatMap((k, j) => subCaseConditionIssue({ ...k, predicate: k.predicate! }, setting, `claims.${i}.cases[${j}].condition`) ?? []);
    found.push(...wrong);
    return { ...c, cases: children.map((k) => ({ label: k.title, condition: JSON.parse(k.predicate!) as unknown })) };
  });
  if (found.length) throw invalid("Some claims need attention; nothing was saved.", found);
  return out;
}

/**
 * Stores claims on a step (all or none) and queues their verification; they start `pending`.
 * Returns their ids in order. Malformed input is a 422 naming the field, and nothing is stored.
 */
export async function storeClaims(proofId: number, stepId: number, userId: number, raw: Record<string, unknown>[]): Promise<number[]> {
  const { Claim } = models();
  await stepInProof(proofId, stepId);
  const claims = await readClaims(await fillCoverageCases(proofId, stepId, raw));
  const stored = await getSequelize().transaction(async (transaction) => {
    // Locking the step row (lockLatest) serialises attaches to one step, so each claim takes its own place
    // (the unique index on (step_id, position) is the backstop), and serialises them against vouches.
    const latest = await lockLatest(stepId, transaction);
    const last = await Claim.max<number, ClaimRow>("position", { where: { stepId }, transaction });
    const out: Array<{ id: number; row: ClaimRow }> = [];
    for (const [i, claim] of claims.entries()) {
      const row = await Claim.create(
        {
          stepId,
          position: (last ?? 0) + i + 1,
          kind: claim.kind,
          input: JSON.stringify(claim),
          digest: claimDigest(claim),
          status: "pending",
          createdBy: userId,
        },
        { transaction },
      );
      await recordEvent({ proofId, actorId: userId, action: "claim.attached", subjectType: "claim", subjectId: row.id, detail: claim.kind }, transaction);
      out.push({ id: row.id, row });
    }
    await reviseClaims(proofId, stepId, userId, transaction, latest, (set) => [...set, ...out.map((o) => revisionClaimOf(o.row))]);
    return out;
  });
  await deliverAfterCommit();
  // Queued after the commit, so a worker never looks for a claim that is not there yet.
  for (const { id } of stored) await scheduleVerification(id, 0, userId);
  return stored.map((s) => s.id);
}

/** Attaches claims to a step (all or none) and queues their verification; they start `pending`. */
export async function attachClaims(proofId: number, stepId: number, userId: number, raw: Record<string, unknown>[]): Promise<ClaimView[]> {
  return readClaimViews(stepId, await storeClaims(proofId, stepId, userId, raw));
}
