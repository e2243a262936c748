import "server-only";
import { storedJson } from "@/lib/stored-json";
import { Op } from "sequelize";
import { models } from "@/models";
import { getSequelize } from "@/lib/db";
import { conflict, invalid, notFound, type Issue } from "@/lib/errors";
import { ClaimError, validateClaim, type Claim as ClaimJson } from "@/lib/core/claims/claim-schema";
import { claimDigest } from "@/lib/core/claims/claims";
import { certificateKindOf, methodWithoutCertificate } from "@/lib/core/certificates/certificate-kind";
import { claimInputsView, type ClaimInputsView } from "@/lib/core/claims/claim-display";
import { checkInputs } from "@/lib/core/claims/claim-inputs";
import { pendingProgress, scheduleVerification, verificationSettled, waitForVerdicts, type JobProgress } from "@/lib/data/claim-jobs";
import { bounded, claimJobId, verificationQueue } from "@/lib/jobs/queue";
import type { ClaimPicture } from "@/lib/verification/picture";
import type { ClaimStatus } from "@/lib/review/states";
import { liveCases, stepsOfCases, subCasesOf } from "@/lib/data/cases";
import { subCaseConditionIssue } from "@/lib/validations/case";
import { buildCaseTree, flattenCaseTree, stepLabel } from "@/lib/proof-tree";
import { stepInProof } from "@/lib/data/steps";
import { deliverAfterCommit } from "@/lib/mail/outbox";
import { recordEvent } from "@/lib/data/audit";
import { lockLatest, recordVerdictInRevisions, reviseClaims, revisionClaimOf } from "@/lib/data/revisions";

export { verificationSettled };

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

type ClaimRow = InstanceType<ReturnType<typeof models>["Claim"]>;

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

const certificateJson = (text: string | null) => storedJson(text);

function claimView(c: ClaimRow, progress: JobProgress | null = null): ClaimView {
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

/**
 * Waits up to `ms` for the verdicts of claims just attached to a step (the checks run as jobs in the
 * worker processes) and returns the claims as they are then; those not done are still `pending`.
 */
export async function awaitVerdicts(stepId: number, ids: number[], ms: number): Promise<ClaimView[]> {
  await waitForVerdicts(ids, ms);
  return readClaimViews(stepId, ids);
}

// ---------------------------------------------------------------- reads and writes

const withChecker = () => [{ model: models().User, as: "checker", attributes: ["name"], required: false }];

/** The step's claims with these ids, in step order, read in one query. */
async function readClaimViews(stepId: number, ids: number[]): Promise<ClaimView[]> {
  const { Claim } = models();
  return (await Claim.findAll({ where: { id: ids, stepId }, include: withChecker(), order: [["position", "ASC"]] })).map((c) => claimView(c));
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

async function claimInProof(proofId: number, claimId: number): Promise<ClaimRow> {
  const { Claim } = models();
  const row = await Claim.findByPk(claimId, { include: withChecker() });
  if (!row) throw notFound("This claim");
  await stepInProof(proofId, row.stepId).catch(() => {
    throw notFound("This claim");
  });
  return row;
}

/** The claim's input exactly as stored (cairn-claim/1 JSON text), with its step, for the download of a large input. */
export async function getClaimInput(proofId: number, claimId: number): Promise<{ stepId: number; input: string }> {
  const row = await claimInProof(proofId, claimId);
  return { stepId: row.stepId, input: row.input };
}

export async function getClaim(proofId: number, claimId: number): Promise<ClaimView> {
  const row = await claimInProof(proofId, claimId);
  return claimView(row, (await pendingProgress([row])).get(row.id) ?? null);
}

/**
 * Runs the check again (e.g. after an `undecided` for budget or time) in a new verification round:
 * the claim is `pending` until a worker stores the new verdict. A claim already pending is left as it is.
 */
export async function recheck(proofId: number, claimId: number, userId: number): Promise<ClaimView> {
  const row = await claimInProof(proofId, claimId);
  if (row.status !== "pending") {
    await row.update({ status: "pending", verifyRound: row.verifyRound + 1 });
    await recordEvent({ proofId, actorId: userId, action: "claim.rechecked", subjectType: "claim", subjectId: claimId, detail: null });
    await scheduleVerification(claimId, row.verifyRound, userId);
  }
  return claimView(row);
}

/**
 * Cancels a pending claim's verification: the claim becomes `undecided` (re-check runs it again), a
 * job still waiting is removed, and a worker checking it stops within about a second. 409 when the
 * claim is not pending (its verdict is already in).
 */
export async function cancelVerification(proofId: number, claimId: number, user: { id: number; name: string }): Promise<ClaimView> {
  const { Claim } = models();
  const row = await claimInProof(proofId, claimId);
  const cancelled = await getSequelize().transaction(async (transaction) => {
    await lockLatest(row.stepId, transaction);
    const [changed] = await Claim.update(
      {
        status: "undecided",
        method: "cancelled",
        reason: `the verification was cancelled by ${user.name}; re-check to run it again`,
        certificate: null,
        checkedBy: user.id,
        checkedAt: new Date(),
      },
      { where: { id: claimId, status: "pending", verifyRound: row.verifyRound }, transaction },
    );
    if (changed !== 1) return false;
    await recordEvent({ proofId, actorId: user.id, action: "claim.cancelled", subjectType: "claim", subjectId: claimId, detail: null }, transaction);
    // `undecided` is a verdict like any other for the step's revisions (a vouch waits for no pending claim).
    await recordVerdictInRevisions(claimId, user.id, transaction);
    return true;
  });
  if (!cancelled) throw conflict("This claim is not waiting for a verdict any more; there is nothing to cancel.");
  await deliverAfterCommit();
  // A job still waiting is removed; an active one is stopped by its worker, which watches the claim.
  await bounded(async () => (await verificationQueue().getJob(claimJobId(claimId, row.verifyRound)))?.remove()).catch(() => undefined);
  return claimView(await claimInProof(proofId, claimId));
}

/**
 * Withdraws a claim (an author's mistake, say a typo in a graph that left a refuted claim). The row
 * stays, with who withdrew it and when, and an audit event; the proof's states, tables and exports
 * leave it out from now on. A claim already withdrawn is not found (404).
 */
export async function withdrawClaim(proofId: number, claimId: number, userId: number): Promise<WithdrawnClaimView> {
  const { Claim } = models();
  const row = await claimInProof(proofId, claimId);
  await getSequelize().transaction(async (transaction) => {
    const latest = await lockLatest(row.stepId, transaction);
    const [changed] = await Claim.unscoped().update(
      { withdrawnAt: new Date(), withdrawnBy: userId },
      { where: { id: claimId, withdrawnAt: null }, transaction },
    );
    if (changed !== 1) throw notFound("This claim"); // withdrawn meanwhile by someone else
    await reviseClaims(proofId, row.stepId, userId, transaction, latest, (set) => set.filter((c) => c.id !== claimId));
    await recordEvent(
      { proofId, actorId: userId, action: "claim.withdrawn", subjectType: "claim", subjectId: claimId, detail: row.statement ?? row.kind },
      transaction,
    );
  });
  await deliverAfterCommit();
  return (await listWithdrawnClaims(row.stepId)).find((w) => w.id === claimId)!;
}

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
  const numbered = new Map(
    flattenCaseTree(buildCaseTree(all.map((c) => ({ id: c.id, parentId: c.parentId, position: c.position, title: c.title })))).map((n) => [n.id, n]),
  );
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
