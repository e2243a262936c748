import "server-only";
import { nameOf } from "./rows";
import type { Transaction } from "sequelize";
import { models } from "@/models";
import { refereeLens, type NameLens } from "./blind";
import type { ProofRole } from "@/lib/access/rules";
import { buildCaseTree, casesBelow, flattenCaseTree, pruneCaseTree, stepLabel, type CaseNode } from "@/lib/proof-tree";
import { readConditionText } from "@/lib/validations/case";
import { caseState, isUnresolved, latestVouches, proofState, stepStatus } from "@/lib/review/states";
import type { CaseFacts, CaseState, ClaimStatus, DisputeState, ProofState, ReviewFact, StepFacts } from "@/lib/review/states";

export interface StepView {
  id: number;
  position: number;
  revision: { id: number; number: number; body: string; authorName: string; createdAt: string } | null;
  claims: ClaimStatus[];
  /** The same claims as the overview lists them: what each states, and its verdict. */
  claimItems: Array<{ id: number; statement: string; status: ClaimStatus }>;
  /** Derived from revisions, reviews and claims (lib/review/states.ts). */
  vouches: number;
  openDisputes: number;
  /**
   * The step's review as a reader of the overview needs it: each referee's latest vouch (superseded when
   * given on an older revision) and the unresolved disputes with their state. Names pass the viewer's
   * blind lens ("Referee k" for authors of a blind proof); no user ids.
   */
  review: {
    vouches: Array<{ name: string; revision: number; superseded: boolean }>;
    disputes: Array<{ id: number; name: string; state: DisputeState; revision: number }>;
  };
}

export interface CaseView {
  id: number;
  parentId: number | null;
  position: number;
  title: string;
  condition: string;
  /** The machine-readable condition, as stored (normalised JSON) and in words; null when the case has none. */
  predicate: { json: string; words: string } | null;
  steps: StepView[];
  /** Rolled up over this case's steps and its sub-cases' steps. */
  state: CaseState;
}

/** A stored machine-readable condition for display; one that no longer reads is shown as stored, with the problem. */
function predicateView(json: string | null | undefined): CaseView["predicate"] {
  const reading = json ? readConditionText(json) : null;
  if (!json || !reading) return null;
  return { json, words: "words" in reading ? reading.words : `unreadable: ${reading.path}: ${reading.problem}` };
}

export const CASE_STATES: readonly CaseState[] = ["drafting", "claim failing", "under review", "disputed", "settled"];

/** Ids of deleted cases and everything below them: hidden from the tree, kept for the history. */
export function hiddenCaseIds(rows: ReadonlyArray<{ id: number; parentId: number | null; deletedAt: Date | null }>): Set<number> {
  return casesBelow(
    rows.filter((r) => r.deletedAt).map((r) => r.id),
    rows,
  );
}

/** The live cases of a proof (deleted ones and their sub-cases left out), in position order. */
/** The steps of these cases, in their order (position, then id). */
export async function stepsOfCases(caseIds: number[]) {
  if (caseIds.length === 0) return [];
  const { Step } = models();
  return Step.findAll({
    where: { caseId: caseIds },
    order: [
      ["position", "ASC"],
      ["id", "ASC"],
    ],
  });
}

/**
 * What the pages and the export read about these steps: their revisions (newest first, with the author's name),
 * claims (in their order; only `claimAttributes` when given) and reviews (oldest first; with the reviewer's name
 * when `reviewerNames`).
 */
export async function stepRecords(stepIds: number[], options: { claimAttributes?: string[]; reviewerNames?: boolean } = {}) {
  const { StepRevision, User, Claim, Review } = models();
  const none = stepIds.length === 0;
  const [revisions, claims, reviews] = await Promise.all([
    none
      ? []
      : StepRevision.findAll({ where: { stepId: stepIds }, include: [{ model: User, as: "author", attributes: ["name"] }], order: [["number", "DESC"]] }),
    none
      ? []
      : Claim.findAll({
          where: { stepId: stepIds },
          ...(options.claimAttributes ? { attributes: options.claimAttributes } : {}),
          order: [
            ["position", "ASC"],
            ["id", "ASC"],
          ],
        }),
    none
      ? []
      : Review.findAll({
          where: { stepId: stepIds },
          ...(options.reviewerNames ? { include: [{ model: User, as: "reviewer", attributes: ["name"] }] } : {}),
          order: [
            ["createdAt", "ASC"],
            ["id", "ASC"],
          ],
        }),
  ]);
  return { revisions, claims, reviews };
}

/** Every case of the proof, deleted ones included, in order; `lock` takes them FOR UPDATE inside the transaction. */
export async function allCases(proofId: number, transaction?: Transaction, lock = false) {
  const { Case } = models();
  return Case.findAll({
    where: { proofId },
    order: [
      ["position", "ASC"],
      ["id", "ASC"],
    ],
    transaction,
    ...(lock && transaction ? { lock: transaction.LOCK.UPDATE } : {}),
  });
}

/** The cases still in the tree (neither deleted nor under a deleted case), in order. */
export async function liveCases(proofId: number, transaction?: Transaction, lock = false) {
  const all = await allCases(proofId, transaction, lock);
  const hidden = hiddenCaseIds(all);
  return all.filter((c) => !hidden.has(c.id));
}

/** The live sub-cases of a case in their order, numbered as the pages number them (lib/proof-tree.ts), with their stored conditions. */
export async function subCasesOf(proofId: number, caseId: number): Promise<Array<{ id: number; number: string; title: string; predicate: string | null }>> {
  const live = await liveCases(proofId);
  const node = flattenCaseTree(
    buildCaseTree(live.map((c) => ({ id: c.id, parentId: c.parentId, position: c.position, title: c.title, predicate: c.predicate }))),
  ).find((n) => n.id === caseId);
  return (node?.children ?? []).map((k) => ({ id: k.id, number: k.number, title: k.title, predicate: k.predicate ?? null }));
}

/**
 * The proof's case tree with each step's latest revision and each case's derived state.
 * A fixed number of queries, whatever the size of the tree.
 */
export async function getCaseTree(proofId: number): Promise<CaseNode<CaseView>[]> {
  return (await loadTree(proofId)).tree;
}

export interface ProofOverview {
  cases: CaseNode<CaseView>[];
  counts: Record<CaseState, number>;
  proofState: ProofState;
  /** How many vouches a step needs. */
  requiredApprovals: number;
}

/**
 * The case tree with the counts per case state and the proof's derived state, and under each step its
 * claims and its review, with referees named as this viewer may see them (lib/data/blind.ts).
 */
export async function getProofOverview(
  proofId: number,
  visible: ReadonlySet<number> | null,
  viewer: { id: number; role: ProofRole | null },
): Promise<ProofOverview> {
  const { tree, facts, required } = await loadTree(proofId, await refereeLens(proofId, viewer));
  const shown = pruneCaseTree(tree, visible);
  return { cases: shown, counts: countCaseStates(shown), proofState: proofState(facts, required), requiredApprovals: required };
}

/** Groups rows by a key, keeping their order (one pass, so the tree's load stays linear in its size). */
function groupBy<T>(rows: readonly T[], key: (row: T) => number): Map<number, T[]> {
  const out = new Map<number, T[]>();
  for (const r of rows) {
    const list = out.get(key(r));
    if (list) list.push(r);
    else out.set(key(r), [r]);
  }
  return out;
}

/** `lens` null: no names are read (the tree is wanted for its numbers, not its review). */
async function loadTree(proofId: number, lens: NameLens | null = null): Promise<{ tree: CaseNode<CaseView>[]; facts: CaseFacts[]; required: number }> {
  const { User, Proof } = models();
  const cases = await liveCases(proofId);
  const proof = await Proof.findByPk(proofId, { attributes: ["requiredApprovals"] });
  const required = proof?.requiredApprovals ?? 1;
  const steps = await stepsOfCases(cases.map((c) => c.id));
  const stepIds = steps.map((s) => s.id);
  const { revisions, claims, reviews } = await stepRecords(stepIds, { claimAttributes: ["id", "stepId", "status", "statement", "kind"] });
  const reviewerIds = [...new Set(reviews.map((r) => r.reviewerId))];
  const names = new Map(
    lens && reviewerIds.length
      ? (await User.findAll({ where: { id: reviewerIds }, attributes: ["id", "name"] })).map((u) => [u.id, lens.name(u.id, u.name)])
      : [],
  );
  const claimsByStep = groupBy(claims, (c) => c.stepId);
  const reviewsByStep = groupBy(reviews, (r) => r.stepId);
  const latest = new Map<number, (typeof revisions)[number]>();
  const numberOf = new Map<number, number>();
  const authorsOf = new Map<number, Set<number>>();
  for (const r of revisions) {
    if (!latest.has(r.stepId)) latest.set(r.stepId, r);
    numberOf.set(r.id, r.number);
    if (r.origin !== "claims") authorsOf.set(r.stepId, (authorsOf.get(r.stepId) ?? new Set()).add(r.authorId));
  }
  const factsOf = (stepId: number): StepFacts => ({
    id: stepId,
    latestRevision: latest.get(stepId)?.number ?? 0,
    claims: (claimsByStep.get(stepId) ?? []).map((c) => c.status),
    reviews: (reviewsByStep.get(stepId) ?? []).map((r): ReviewFact => ({
      reviewerId: r.reviewerId,
      revisionNumber: numberOf.get(r.revisionId) ?? 0,
      verdict: r.verdict,
      disputeState: r.disputeState,
    })),
    authorIds: [...(authorsOf.get(stepId) ?? [])],
  });
  const facts = new Map(steps.map((s) => [s.id, factsOf(s.id)]));
  const rows = cases.map((c) => ({
    id: c.id,
    parentId: c.parentId,
    position: c.position,
    title: c.title,
    condition: c.condition,
    predicate: predicateView(c.predicate),
    state: "drafting" as CaseState,
    steps: steps
      .filter((s) => s.caseId === c.id)
      .map((s): StepView => {
        const r = latest.get(s.id);
        const status = stepStatus(facts.get(s.id)!, required);
        const stepReviews = reviewsByStep.get(s.id) ?? [];
        const revisionOf = (r: (typeof stepReviews)[number]) => numberOf.get(r.revisionId) ?? 0;
        return {
          id: s.id,
          position: s.position,
          claims: facts.get(s.id)!.claims,
          claimItems: (claimsByStep.get(s.id) ?? []).map((c) => ({ id: c.id, statement: c.statement ?? c.kind, status: c.status })),
          vouches: status.vouches,
          openDisputes: status.openDisputes,
          review: {
            vouches: latestVouches(
              stepReviews.map((r) => ({ reviewerId: r.reviewerId, revisionNumber: revisionOf(r), verdict: r.verdict })),
              facts.get(s.id)!.latestRevision,
            ).map(({ review, superseded }) => ({ name: names.get(review.reviewerId) ?? "", revision: review.revisionNumber, superseded })),
            disputes: stepReviews
              .filter((r) => r.verdict === "dispute" && isUnresolved(r.disputeState))
              .map((r) => ({ id: r.id, name: names.get(r.reviewerId) ?? "", state: r.disputeState!, revision: revisionOf(r) })),
          },
          revision: r
            ? {
                id: r.id,
                number: r.number,
                body: r.body,
                authorName: nameOf(r, "author"),
                createdAt: r.createdAt.toISOString(),
              }
            : null,
        };
      }),
  }));
  const tree = buildCaseTree(rows);
  const toFacts = (n: CaseNode<CaseView>): CaseFacts => ({ id: n.id, steps: n.steps.map((s) => facts.get(s.id)!), children: n.children.map(toFacts) });
  for (const n of flattenCaseTree(tree)) n.state = caseState(toFacts(n), required);
  return { tree, facts: tree.map(toFacts), required };
}

/** How many cases are in each state (every case of the tree, sub-cases included). */
export function countCaseStates(tree: CaseNode<CaseView>[]): Record<CaseState, number> {
  const counts = Object.fromEntries(CASE_STATES.map((s) => [s, 0])) as Record<CaseState, number>;
  for (const n of flattenCaseTree(tree)) counts[n.state]++;
  return counts;
}

export interface DeletedCaseView {
  id: number;
  title: string;
  deletedAt: string;
  /** Steps kept in the database with all their revisions and reviews. */
  steps: number;
}

/** Cases deleted from the tree (newest first); their steps, revisions and reviews are kept. */
export async function listDeletedCases(proofId: number): Promise<DeletedCaseView[]> {
  const { Case, Step } = models();
  const all = await Case.findAll({ where: { proofId }, attributes: ["id", "parentId", "title", "deletedAt"] });
  const deleted = all.filter((c) => c.deletedAt).sort((a, b) => b.deletedAt!.getTime() - a.deletedAt!.getTime());
  if (deleted.length === 0) return [];
  return Promise.all(
    deleted.map(async (c) => ({
      id: c.id,
      title: c.title,
      deletedAt: c.deletedAt!.toISOString(),
      steps: await Step.count({ where: { caseId: [...casesBelow([c.id], all)] } }),
    })),
  );
}

/** The cases and steps a text of this proof may refer to, labelled as the pages print them (for the editor). */
export async function proofReferences(proofId: number, limit = 300): Promise<Array<{ label: string; text: string }>> {
  const out: Array<{ label: string; text: string }> = [];
  for (const c of flattenCaseTree(await getCaseTree(proofId))) {
    out.push({ label: `${c.number} ${c.title}`, text: `Case ${c.number}` });
    c.steps.forEach((_s, i) => out.push({ label: stepLabel(c.number, i + 1), text: `Step ${stepLabel(c.number, i + 1)}` }));
  }
  return out.slice(0, limit);
}
