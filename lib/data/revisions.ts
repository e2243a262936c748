import "server-only";
/**
 * Revisions made by claim changes. Attaching, withdrawing, or a claim's verdict changing on re-check
 * makes a new revision of the step with the same text and the new claim set, so that a vouch covers
 * exactly the text and claims it was given on; vouches on the previous revision become superseded and
 * their referees are notified. Every write here runs in the caller's transaction with the step row
 * locked, so a vouch racing a claim change is serialised against it (and refused, see reviews.ts).
 */
import type { Transaction } from "sequelize";
import { models } from "@/models";
import { caseNumbers, labelSteps } from "@/lib/proof-tree";
import { placePhrase, type EventPlace } from "@/lib/review/event-sentences";
import { claimSetText, compareRevisions, describeChange, digestOfRevision, ordered, parseClaimSet, type RevisionClaim } from "@/lib/review/revisions";
import type { ClaimStatus } from "@/lib/review/states";
import { recordEvent } from "./audit";
import { notify } from "./notifications";
import { compareQuery } from "@/lib/review/compare-link";

type RevisionRow = InstanceType<ReturnType<typeof models>["StepRevision"]>;

export const revisionClaimOf = (c: {
  id: number;
  position: number;
  kind: string;
  statement: string | null;
  digest: string | null;
  status: ClaimStatus;
}): RevisionClaim => ({
  id: c.id,
  position: c.position,
  kind: c.kind,
  statement: c.statement,
  digest: c.digest ?? "",
  status: c.status,
});

/** The claim set a revision covers. */
export const claimsOf = (r: Pick<RevisionRow, "claimSet">) => parseClaimSet(r.claimSet);

/** The digest of what a vouch at this revision covers (computed for rows written before digests were stored). */
export const digestOf = (r: Pick<RevisionRow, "number" | "body" | "claimSet" | "digest">) => r.digest ?? digestOfRevision(r.number, r.body, claimsOf(r));

/** Locks the step row (serialising every revision, claim change and vouch of the step) and returns its latest revision. */
export async function lockLatest(stepId: number, transaction: Transaction): Promise<RevisionRow | null> {
  const { Step, StepRevision } = models();
  await Step.findByPk(stepId, { transaction, lock: transaction.LOCK.UPDATE });
  return StepRevision.findOne({ where: { stepId }, order: [["number", "DESC"]], transaction });
}

/**
 * "step 3.1(b) (case 3.1, “Trees with a long leg”) of “Title”", for sentences in notifications: proof, case and
 * step named with the labels the pages show (lib/proof-tree.ts).
 */
export async function stepPhrase(stepId: number, transaction?: Transaction): Promise<string> {
  const { Step, Case, Proof } = models();
  const step = await Step.findByPk(stepId, { transaction });
  const here = step ? await Case.findByPk(step.caseId, { transaction }) : null;
  if (!step || !here) return "a step";
  const [cases, siblings, proof] = await Promise.all([
    Case.findAll({ where: { proofId: here.proofId }, attributes: ["id", "parentId", "position"], transaction }),
    Step.findAll({ where: { caseId: here.id }, attributes: ["id", "caseId", "position"], transaction }),
    Proof.findByPk(here.proofId, { attributes: ["title"], transaction }),
  ]);
  const numbers = caseNumbers(cases);
  const place: EventPlace = { step: labelSteps(numbers, siblings).get(step.id) ?? null, caseNumber: numbers.get(here.id) ?? null, caseTitle: here.title };
  return `${placePhrase(place)} of “${proof?.title ?? ""}”`;
}

/** Tells every referee who vouched for `previous` that the new revision supersedes it, and why; the notice opens the two compared. */
export async function noticeSuperseded(
  proofId: number,
  stepId: number,
  previous: RevisionRow,
  created: RevisionRow,
  actorId: number,
  transaction: Transaction,
): Promise<void> {
  const vouches = await models().Review.findAll({ where: { stepId, revisionId: previous.id, verdict: "vouch" }, attributes: ["reviewerId"], transaction });
  const recipients = vouches.map((v) => v.reviewerId).filter((id) => id !== actorId);
  if (recipients.length === 0) return;
  const change = describeChange(compareRevisions({ body: previous.body, claims: claimsOf(previous) }, { body: created.body, claims: claimsOf(created) }));
  await notify(
    recipients,
    {
      kind: "vouch_superseded",
      proofId,
      stepId,
      message: `Your vouch for ${await stepPhrase(stepId, transaction)} at revision ${previous.number} is superseded by revision ${created.number}: ${change}. Read revision ${created.number} and vouch again if it still holds.`,
      link: `/queue/${proofId}/${stepId}${compareQuery(previous.number, created.number)}`,
    },
    transaction,
  );
}

/**
 * Makes a new revision with the latest text and the claim set `next(current)`, unless the set is
 * unchanged. The step row must already be locked by this transaction (lockLatest).
 */
export async function reviseClaims(
  proofId: number,
  stepId: number,
  actorId: number,
  transaction: Transaction,
  latest: RevisionRow | null,
  next: (claims: RevisionClaim[]) => RevisionClaim[],
): Promise<RevisionRow | null> {
  if (!latest) return null;
  const before = claimsOf(latest);
  const after = ordered(next(before));
  const change = compareRevisions({ body: latest.body, claims: before }, { body: latest.body, claims: after });
  if (change.added.length + change.withdrawn.length + change.redecided.length === 0) return null;
  const number = latest.number + 1;
  const created = await models().StepRevision.create(
    {
      stepId,
      number,
      body: latest.body,
      authorId: actorId,
      baseRevisionId: latest.id,
      claimSet: claimSetText(after),
      digest: digestOfRevision(number, latest.body, after),
      origin: "claims",
    },
    { transaction },
  );
  await recordEvent(
    { proofId, actorId, action: "step.revised", subjectType: "step", subjectId: stepId, detail: `revision ${number}: ${describeChange(change)}` },
    transaction,
  );
  await noticeSuperseded(proofId, stepId, latest, created, actorId, transaction);
  return created;
}

/**
 * Stores a claim's verdict and carries it into the step's revisions (recordVerdictInRevisions).
 */
export async function storeVerdict(claimId: number, update: Record<string, unknown>, actorId: number, transaction: Transaction): Promise<void> {
  const { Claim } = models();
  const found = await Claim.findByPk(claimId, { attributes: ["id", "stepId"], transaction });
  if (!found) return; // withdrawn meanwhile: its verdict no longer matters
  await lockLatest(found.stepId, transaction);
  await Claim.update(update, { where: { id: claimId }, transaction });
  await recordVerdictInRevisions(claimId, actorId, transaction);
}

/**
 * Carries a claim's verdict, just stored in this transaction, into the step's revisions. A first
 * verdict (the revision recorded the claim as pending) is written into every revision that still
 * shows it pending and that nobody vouched for (a vouch on a pending claim is refused, so there is
 * none to mislead); any other change of verdict makes a new revision. The caller should lock the step
 * row (lockLatest) before it updates the claim, so that the locks are taken in the same order as by
 * attaches, withdrawals and vouches; it is locked here in any case.
 */
export async function recordVerdictInRevisions(claimId: number, actorId: number, transaction: Transaction): Promise<void> {
  const { Claim, Case, StepRevision, Review } = models();
  const row = await Claim.findByPk(claimId, { transaction });
  if (!row) return; // withdrawn: no revision after the withdrawal covers it
  const stepId = row.stepId;
  const latest = await lockLatest(stepId, transaction);
  if (!latest) return;
  const now = revisionClaimOf(row);
  const recorded = claimsOf(latest).find((c) => c.id === claimId);
  if (!recorded || recorded.status === now.status) return;
  if (recorded.status === "pending") {
    const vouched = new Set((await Review.findAll({ where: { stepId, verdict: "vouch" }, attributes: ["revisionId"], transaction })).map((r) => r.revisionId));
    if (!vouched.has(latest.id)) {
      for (const r of await StepRevision.findAll({ where: { stepId }, transaction })) {
        const set = claimsOf(r);
        if (vouched.has(r.id) || !set.some((c) => c.id === claimId && c.status === "pending")) continue;
        const filled = set.map((c) => (c.id === claimId ? { ...c, status: now.status, statement: now.statement, digest: now.digest } : c));
        await r.update({ claimSet: claimSetText(filled), digest: digestOfRevision(r.number, r.body, filled) }, { transaction });
      }
      return;
    }
  }
  const step = await models().Step.findByPk(stepId, { attributes: ["caseId"], transaction });
  const c = step && (await Case.findByPk(step.caseId, { attributes: ["proofId"], transaction }));
  if (!c) return;
  await reviseClaims(c.proofId, stepId, actorId, transaction, latest, (claims) => claims.map((x) => (x.id === claimId ? now : x)));
}
