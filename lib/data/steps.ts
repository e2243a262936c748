import "server-only";
import { nameOf, pick } from "./rows";
import type { Transaction } from "sequelize";
import { diffLines } from "diff";
import { models } from "@/models";
import { getSequelize } from "@/lib/db";
import { conflict, invalid, notFound } from "@/lib/errors";
import { numberedCases, stepLabel } from "@/lib/proof-tree";
import { liveCases } from "@/lib/data/cases";
import { Op } from "sequelize";
import { deliverAfterCommit } from "@/lib/mail/outbox";
import { recordEvent } from "@/lib/data/audit";
import { claimName, claimSetText, compareRevisions, digestOfRevision } from "@/lib/review/revisions";
import { wordMarks, type WordMarks } from "@/lib/review/word-marks";
import { claimsOf, lockLatest, noticeSuperseded } from "@/lib/data/revisions";

export interface RevisionView {
  id: number;
  number: number;
  body: string;
  authorId: number;
  authorName: string;
  baseRevisionId: number | null;
  createdAt: string;
}

export interface StepDetail {
  id: number;
  proofId: number;
  caseId: number;
  caseNumber: string;
  caseTitle: string;
  /** "3.2(a)": the case number and the step's place in it (see stepLabel). */
  number: string;
  latest: RevisionView | null;
  revisions: Array<Omit<RevisionView, "body">>;
}

type RevisionRow = InstanceType<ReturnType<typeof models>["StepRevision"]>;

function revisionView(r: RevisionRow): RevisionView {
  return {
    ...pick(r, ["id", "number", "body", "authorId"]),
    authorName: nameOf(r, "author"),
    baseRevisionId: r.baseRevisionId ?? null,
    createdAt: r.createdAt.toISOString(),
  };
}

/**
 * The step if it belongs to a live case of this proof (no deleted case above it, however high up),
 * with its numbered case; a 404 otherwise. The one definition of "this step is in this proof".
 */
export async function stepInProof(proofId: number, stepId: number, transaction?: Transaction) {
  const { Step } = models();
  const step = await Step.findByPk(stepId, { transaction });
  if (!step) throw notFound("This step");
  const cases = await liveCases(proofId, transaction);
  const node = numberedCases(cases).find((c) => c.id === step.caseId);
  if (!node) throw notFound("This step");
  return { step, node };
}

export async function getStep(proofId: number, stepId: number): Promise<StepDetail> {
  const { Step, StepRevision, User } = models();
  const { step, node } = await stepInProof(proofId, stepId);
  const revisions = await StepRevision.findAll({
    where: { stepId },
    include: [{ model: User, as: "author", attributes: ["name"] }],
    order: [["number", "DESC"]],
  });
  const siblings = await Step.findAll({
    where: { caseId: step.caseId },
    attributes: ["id", "position"],
    order: [
      ["position", "ASC"],
      ["id", "ASC"],
    ],
  });
  const place = siblings.findIndex((s) => s.id === stepId) + 1;
  return {
    id: step.id,
    proofId,
    caseId: step.caseId,
    caseNumber: node.number,
    caseTitle: node.title,
    number: stepLabel(node.number, place),
    latest: revisions[0] ? revisionView(revisions[0]) : null,
    revisions: revisions.map((r) => {
      const { body: _body, ...rest } = revisionView(r);
      return rest;
    }),
  };
}

/** Adds a step at the end of a case, with its first revision, in one transaction. */
export async function createStep(proofId: number, caseId: number, userId: number, body: string): Promise<{ id: number; revisionId: number }> {
  const { Case, Step, StepRevision } = models();
  if (!(await liveCases(proofId)).some((c) => c.id === caseId)) throw notFound("This case");
  return getSequelize().transaction(async (transaction) => {
    // Locking the case row serialises step creates in one case, so each takes its own place
    // (the unique index on (case_id, position) is the backstop).
    await Case.findByPk(caseId, { attributes: ["id"], transaction, lock: transaction.LOCK.UPDATE });
    const last = await Step.max<number, InstanceType<typeof Step>>("position", { where: { caseId }, transaction });
    const step = await Step.create({ caseId, position: (last ?? 0) + 1 }, { transaction });
    const revision = await StepRevision.create(
      {
        stepId: step.id,
        number: 1,
        body,
        authorId: userId,
        baseRevisionId: null,
        claimSet: claimSetText([]),
        digest: digestOfRevision(1, body, []),
        origin: "text",
      },
      { transaction },
    );
    await recordEvent({ proofId, actorId: userId, action: "step.created", subjectType: "step", subjectId: step.id, detail: null }, transaction);
    return { id: step.id, revisionId: revision.id };
  });
}

/**
 * Moves a step one place up or down among the steps of its case (places stay 1..k, so labels such as
 * 2.1(c) follow); moving the first step up or the last down changes nothing. Reviews, revisions and
 * claims stay with the step.
 */
export async function moveStep(proofId: number, stepId: number, userId: number, move: "up" | "down"): Promise<void> {
  const { Step } = models();
  const { step } = await stepInProof(proofId, stepId);
  await getSequelize().transaction(async (transaction) => {
    const siblings = await Step.findAll({
      where: { caseId: step.caseId },
      order: [
        ["position", "ASC"],
        ["id", "ASC"],
      ],
      transaction,
      lock: transaction.LOCK.UPDATE,
    });
    const i = siblings.findIndex((s) => s.id === stepId);
    const j = move === "up" ? i - 1 : i + 1;
    if (i < 0 || j < 0 || j >= siblings.length) return;
    [siblings[i], siblings[j]] = [siblings[j], siblings[i]];
    await renumberSteps(siblings, transaction);
    await recordEvent({ proofId, actorId: userId, action: "step.moved", subjectType: "step", subjectId: stepId, detail: move }, transaction);
  });
}

/**
 * Gives the steps places 1..k in the order given. Positions are unique per case, so the steps that
 * move first step aside to places past the end, then take their new places.
 */
async function renumberSteps(ordered: Array<InstanceType<ReturnType<typeof models>["Step"]>>, transaction: Transaction): Promise<void> {
  const moving = ordered.map((s, k) => ({ s, place: k + 1 })).filter(({ s, place }) => s.position !== place);
  const aside = Math.max(ordered.length, ...ordered.map((s) => s.position));
  for (const [n, { s }] of moving.entries()) await s.update({ position: aside + n + 1 }, { transaction });
  for (const { s, place } of moving) await s.update({ position: place }, { transaction });
}

/**
 * Saves a new immutable revision based on `baseRevisionId`. When someone saved a newer revision
 * meanwhile, nothing is written and the 409 carries that newer revision, so the editor can merge or
 * overwrite knowingly (by saving again with the newer revision as its base).
 */
export async function saveRevision(proofId: number, stepId: number, userId: number, baseRevisionId: number, body: string): Promise<RevisionView> {
  const { StepRevision, User } = models();
  await stepInProof(proofId, stepId);
  const saved = await getSequelize().transaction(async (transaction) => {
    // Locking the step row serialises concurrent saves of one step (and claim changes), so exactly one of two wins.
    const previous = await lockLatest(stepId, transaction);
    const latest = await StepRevision.findOne({
      where: { stepId },
      order: [["number", "DESC"]],
      include: [{ model: User, as: "author", attributes: ["name"] }],
      transaction,
    });
    const base = await StepRevision.findOne({ where: { id: baseRevisionId, stepId }, attributes: ["id", "number"], transaction });
    if (!base) throw invalid("The base revision is not a revision of this step.", [{ path: "baseRevisionId", message: "name a revision of this step" }]);
    // Revisions made by claim changes since the base do not touch the text: saving over them is no conflict.
    const textSince =
      latest && latest.id !== base.id ? await StepRevision.count({ where: { stepId, origin: "text", number: { [Op.gt]: base.number } }, transaction }) : 0;
    if (latest && textSince > 0)
      throw conflict(`Someone saved revision ${latest.number} of this step while you were editing. Merge your text with it, or overwrite it knowingly.`, {
        latest: revisionView(latest),
      });
    const number = (latest?.number ?? 0) + 1;
    const claims = previous ? claimsOf(previous) : [];
    const created = await StepRevision.create(
      {
        stepId,
        number,
        body,
        authorId: userId,
        baseRevisionId,
        claimSet: claimSetText(claims),
        digest: digestOfRevision(number, body, claims),
        origin: "text",
      },
      { transaction },
    );
    await recordEvent(
      { proofId, actorId: userId, action: "step.revised", subjectType: "step", subjectId: stepId, detail: `revision ${created.number}` },
      transaction,
    );
    if (previous) await noticeSuperseded(proofId, stepId, previous, created, userId, transaction);
    const author = await User.findByPk(userId, { attributes: ["name"], transaction });
    return { ...revisionView(created), authorName: author?.name ?? "" };
  });
  await deliverAfterCommit();
  return saved;
}

export interface RevisionDiff {
  from: { id: number; number: number; body: string };
  to: { id: number; number: number; body: string };
  /** Line diff of the sources (kept for API clients). */
  parts: Array<{ value: string; added: boolean; removed: boolean }>;
  /** Word-level marks for typesetting both sides (lib/review/word-marks.ts). */
  words: WordMarks;
  /** The claim set's change between the two revisions, one sentence per claim. */
  claims: { added: string[]; withdrawn: string[]; redecided: string[]; kept: number };
}

/** Two revisions of a step compared, by revision number: text (lines and words) and claim set. */
export async function diffRevisions(proofId: number, stepId: number, from: number, to: number): Promise<RevisionDiff> {
  const { StepRevision } = models();
  await stepInProof(proofId, stepId);
  const rows = await StepRevision.findAll({ where: { stepId, number: [from, to] } });
  const a = rows.find((r) => r.number === from),
    b = rows.find((r) => r.number === to);
  if (!a || !b) throw notFound(`Revision ${!a ? from : to} of this step`);
  const change = compareRevisions({ body: a.body, claims: claimsOf(a) }, { body: b.body, claims: claimsOf(b) });
  const gone = new Set([...change.withdrawn, ...change.redecided.map((r) => r.claim)].map((c) => c.id));
  return {
    from: { id: a.id, number: a.number, body: a.body },
    to: { id: b.id, number: b.number, body: b.body },
    parts: diffLines(a.body, b.body).map((p) => ({ value: p.value, added: !!p.added, removed: !!p.removed })),
    words: wordMarks(a.body, b.body),
    claims: {
      added: change.added.map(claimName),
      withdrawn: change.withdrawn.map(claimName),
      redecided: change.redecided.map((r) => `${claimName(r.claim)}: ${r.from} → ${r.to}`),
      kept: claimsOf(b).filter((c) => !gone.has(c.id) && !change.added.some((x) => x.id === c.id)).length,
    },
  };
}

/** The body of one revision (for showing an older revision next to the latest). */
export async function getRevision(proofId: number, stepId: number, number: number): Promise<RevisionView> {
  const { StepRevision, User } = models();
  await stepInProof(proofId, stepId);
  const r = await StepRevision.findOne({ where: { stepId, number }, include: [{ model: User, as: "author", attributes: ["name"] }] });
  if (!r) throw notFound(`Revision ${number} of this step`);
  return revisionView(r);
}
