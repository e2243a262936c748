import "server-only";
import { textAuthors } from "@/lib/review/revisions";
/**
 * Read models of the review workflow: the readiness roll-up of a proof (through lib/review/states.ts),
 * the reviewer's and the author's queues, and per-reviewer progress for editors.
 */
import { models } from "@/models";
import { buildCaseTree, flattenCaseTree, numberedCases, stepLabel } from "@/lib/proof-tree";
import { caseState, proofState, stepStatus, isUnresolved, type CaseFacts, type CaseState, type ProofState, type StepFacts } from "@/lib/review/states";
import { expandScope } from "@/lib/access/rules";
import type { DisputeState } from "@/lib/review/states";
import { claimStatuses } from "./reviews";
import { refereeLenses, type NameLens } from "./blind";

interface ReviewRow {
  id: number;
  stepId: number;
  reviewerId: number;
  verdict: "vouch" | "dispute";
  disputeState: DisputeState | null;
  revisionNumber: number;
  at: Date;
}
interface StepRow {
  id: number;
  caseId: number;
  position: number;
  latestNumber: number;
  latestAt: Date | null;
  authorIds: number[];
}
interface CaseRowFull {
  id: number;
  proofId: number;
  parentId: number | null;
  position: number;
  title: string;
}

/** Everything needed to derive states for some proofs, in a fixed number of queries. */
async function loadFacts(proofIds: number[]) {
  const { Proof, Case, Step, StepRevision, Review, ReviewerScope, ProofMember, User } = models();
  const proofs = await Proof.findAll({ where: { id: proofIds }, attributes: ["id", "title", "requiredApprovals"] });
  const cases: CaseRowFull[] = (await Case.findAll({ where: { proofId: proofIds } }))
    .filter((c) => !(c as { deletedAt?: Date | null }).deletedAt)
    .map((c) => ({ id: c.id, proofId: c.proofId, parentId: c.parentId, position: c.position, title: c.title }));
  const stepRows = cases.length ? await Step.findAll({ where: { caseId: cases.map((c) => c.id) } }) : [];
  const stepIds = stepRows.map((s) => s.id);
  const [revisions, reviews, claims, scopes, members] = await Promise.all([
    stepIds.length ? StepRevision.findAll({ where: { stepId: stepIds }, attributes: ["id", "stepId", "number", "authorId", "origin", "createdAt"] }) : [],
    stepIds.length ? Review.findAll({ where: { stepId: stepIds } }) : [],
    claimStatuses(stepIds),
    ReviewerScope.findAll({ where: { proofId: proofIds } }),
    ProofMember.findAll({ where: { proofId: proofIds }, include: [{ model: User, as: "user", attributes: ["id", "name"] }] }),
  ]);
  const numberOf = new Map(revisions.map((r) => [r.id, r.number]));
  const steps: StepRow[] = stepRows.map((s) => {
    const mine = revisions.filter((r) => r.stepId === s.id).sort((a, b) => b.number - a.number);
    return {
      id: s.id,
      caseId: s.caseId,
      position: s.position,
      latestNumber: mine[0]?.number ?? 0,
      latestAt: mine[0]?.createdAt ?? null,
      authorIds: textAuthors(mine),
    };
  });
  const reviewRows: ReviewRow[] = reviews.map((r) => ({
    id: r.id,
    stepId: r.stepId,
    reviewerId: r.reviewerId,
    verdict: r.verdict,
    disputeState: r.disputeState,
    revisionNumber: numberOf.get(r.revisionId) ?? 0,
    at: r.updatedAt,
  }));
  const numbered = new Map<number, { number: string; title: string; proofId: number }>();
  for (const pid of proofIds)
    for (const n of numberedCases(cases.filter((c) => c.proofId === pid))) numbered.set(n.id, { number: n.number, title: n.title, proofId: pid });
  const stepFacts = (s: StepRow): StepFacts => ({
    id: s.id,
    latestRevision: s.latestNumber,
    reviews: reviewRows.filter((r) => r.stepId === s.id),
    claims: claims.get(s.id) ?? [],
    authorIds: s.authorIds,
  });
  const scopeOf = (proofId: number, userId: number) =>
    expandScope(
      scopes.filter((x) => x.proofId === proofId && x.userId === userId).map((x) => x.caseId),
      cases.filter((c) => c.proofId === proofId),
    );
  const memberRows = members.map((m) => ({ proofId: m.proofId, userId: m.userId, role: m.role, name: (m as unknown as { user: { name: string } }).user.name }));
  return { proofs, cases, steps, reviews: reviewRows, numbered, stepFacts, scopeOf, members: memberRows };
}

export interface CaseReadiness {
  id: number;
  number: string;
  title: string;
  depth: number;
  state: CaseState;
  steps: number;
  settledSteps: number;
}
export interface Readiness {
  requiredApprovals: number;
  state: ProofState;
  cases: CaseReadiness[];
}

/** The readiness roll-up: each case's derived state and the proof's (optionally only the cases a person may see). */
export async function getReadiness(proofId: number, visible: Set<number> | null = null): Promise<Readiness> {
  const f = await loadFacts([proofId]);
  const required = f.proofs[0]?.requiredApprovals ?? 1;
  const tree = buildCaseTree(f.cases);
  const toFacts = (n: (typeof tree)[number]): CaseFacts => ({
    id: n.id,
    steps: f.steps.filter((s) => s.caseId === n.id).map(f.stepFacts),
    children: n.children.map(toFacts),
  });
  const subtreeSteps = (n: (typeof tree)[number]): StepRow[] => [...f.steps.filter((s) => s.caseId === n.id), ...n.children.flatMap(subtreeSteps)];
  return {
    requiredApprovals: required,
    state: proofState(tree.map(toFacts), required),
    cases: flattenCaseTree(tree)
      .filter((n) => visible === null || visible.has(n.id))
      .map((n) => {
        const steps = subtreeSteps(n);
        return {
          id: n.id,
          number: n.number,
          title: n.title,
          depth: n.depth,
          state: caseState(toFacts(n), required),
          steps: steps.length,
          settledSteps: steps.filter((s) => stepStatus(f.stepFacts(s), required).settled).length,
        };
      }),
  };
}

const proofIdsWhere = async (userId: number, role: "author" | "reviewer" | "editor") =>
  (await models().ProofMember.findAll({ where: { userId, role }, attributes: ["proofId"] })).map((m) => m.proofId);

export interface QueueStepRow {
  proofId: number;
  proofTitle: string;
  stepId: number;
  stepLabel: string;
  caseTitle: string;
  revision: number;
  reason: "not read yet" | "vouch superseded";
  since: string;
}
export interface QueueDisputeRow {
  proofId: number;
  proofTitle: string;
  stepId: number;
  stepLabel: string;
  disputeId: number;
  state: DisputeState;
  reviewerName: string;
  revision: number;
  since: string;
}

const labelOf = (f: Awaited<ReturnType<typeof loadFacts>>, s: StepRow) => stepLabel(f.numbered.get(s.caseId)?.number ?? "?", s.position);

/** A reviewer's queue: steps waiting for their verdict at the latest revision, and their disputes the authors answered. */
export async function getReviewerQueue(userId: number): Promise<{ steps: QueueStepRow[]; answered: QueueDisputeRow[] }> {
  const proofIds = await proofIdsWhere(userId, "reviewer");
  if (proofIds.length === 0) return { steps: [], answered: [] };
  const f = await loadFacts(proofIds);
  const title = new Map(f.proofs.map((p) => [p.id, p.title]));
  const steps: QueueStepRow[] = [];
  const answered: QueueDisputeRow[] = [];
  for (const s of f.steps) {
    const c = f.numbered.get(s.caseId);
    if (!c || s.latestNumber === 0 || s.authorIds.includes(userId)) continue;
    const visible = f.scopeOf(c.proofId, userId);
    if (visible && !visible.has(s.caseId)) continue;
    const mine = f.reviews.filter((r) => r.stepId === s.id && r.reviewerId === userId);
    for (const d of mine.filter((r) => r.verdict === "dispute" && r.disputeState === "answered"))
      answered.push({
        proofId: c.proofId,
        proofTitle: title.get(c.proofId) ?? "",
        stepId: s.id,
        stepLabel: labelOf(f, s),
        disputeId: d.id,
        state: "answered",
        reviewerName: "",
        revision: d.revisionNumber,
        since: d.at.toISOString(),
      });
    if (mine.some((r) => r.verdict === "dispute" && isUnresolved(r.disputeState))) continue;
    if (mine.some((r) => r.verdict === "vouch" && r.revisionNumber === s.latestNumber)) continue;
    const hadVouch = mine.some((r) => r.verdict === "vouch");
    steps.push({
      proofId: c.proofId,
      proofTitle: title.get(c.proofId) ?? "",
      stepId: s.id,
      stepLabel: labelOf(f, s),
      caseTitle: c.title,
      revision: s.latestNumber,
      reason: hadVouch ? "vouch superseded" : "not read yet",
      since: (s.latestAt ?? new Date()).toISOString(),
    });
  }
  return { steps, answered };
}

/** An author's queue: unresolved disputes on the proofs they are an author of. */
export async function getAuthorQueue(userId: number): Promise<QueueDisputeRow[]> {
  const proofIds = await proofIdsWhere(userId, "author");
  return proofIds.length === 0 ? [] : disputeRows(await loadFacts(proofIds), null, true, await refereeLenses(proofIds, userId));
}

/** Every dispute of a proof, resolved or not (limited to the visible cases when given). */
export async function listProofDisputes(proofId: number, visible: Set<number> | null, viewerId?: number): Promise<QueueDisputeRow[]> {
  return disputeRows(await loadFacts([proofId]), visible, false, viewerId === undefined ? undefined : await refereeLenses([proofId], viewerId));
}

/** The proof's unresolved disputes (the editor's desk), each with when it last moved. */
export async function listOpenDisputes(proofId: number): Promise<QueueDisputeRow[]> {
  return disputeRows(await loadFacts([proofId]), null, true);
}

/** `lenses`: per proof, how the viewer sees referees (blind review); none means names as they are. */
function disputeRows(
  f: Awaited<ReturnType<typeof loadFacts>>,
  visible: Set<number> | null,
  unresolvedOnly: boolean,
  lenses?: Map<number, NameLens>,
): QueueDisputeRow[] {
  const title = new Map(f.proofs.map((p) => [p.id, p.title]));
  const name = new Map(f.members.map((m) => [m.userId, m.name]));
  return f.reviews
    .filter((r) => r.verdict === "dispute" && (!unresolvedOnly || isUnresolved(r.disputeState)))
    .filter((r) => visible === null || visible.has(f.steps.find((x) => x.id === r.stepId)!.caseId))
    .map((r) => {
      const s = f.steps.find((x) => x.id === r.stepId)!;
      const proofId = f.numbered.get(s.caseId)!.proofId;
      return {
        proofId,
        proofTitle: title.get(proofId) ?? "",
        stepId: s.id,
        stepLabel: labelOf(f, s),
        disputeId: r.id,
        state: r.disputeState!,
        reviewerName: lenses?.get(proofId)?.name(r.reviewerId, name.get(r.reviewerId) ?? "") ?? name.get(r.reviewerId) ?? "",
        revision: r.revisionNumber,
        since: r.at.toISOString(),
      };
    });
}

export interface ReviewerProgress {
  proofId: number;
  proofTitle: string;
  reviewerId: number;
  reviewerName: string;
  scope: string;
  inScope: number;
  vouched: number;
  stale: number;
  unresolvedDisputes: number;
  waiting: number;
}

/** Per-reviewer progress on the given proofs (the editor's view). */
export async function getReviewerProgress(proofIds: number[]): Promise<ReviewerProgress[]> {
  if (proofIds.length === 0) return [];
  const f = await loadFacts(proofIds);
  const title = new Map(f.proofs.map((p) => [p.id, p.title]));
  return f.members
    .filter((m) => m.role === "reviewer")
    .map((m) => {
      const visible = f.scopeOf(m.proofId, m.userId);
      const steps = f.steps.filter((s) => f.numbered.get(s.caseId)?.proofId === m.proofId && (!visible || visible.has(s.caseId)) && s.latestNumber > 0);
      const mine = (s: StepRow) => f.reviews.filter((r) => r.stepId === s.id && r.reviewerId === m.userId);
      const vouched = steps.filter((s) => mine(s).some((r) => r.verdict === "vouch" && r.revisionNumber === s.latestNumber)).length;
      const stale = steps.filter(
        (s) => !mine(s).some((r) => r.verdict === "vouch" && r.revisionNumber === s.latestNumber) && mine(s).some((r) => r.verdict === "vouch"),
      ).length;
      const disputed = steps.filter((s) => mine(s).some((r) => r.verdict === "dispute" && isUnresolved(r.disputeState))).length;
      return {
        proofId: m.proofId,
        proofTitle: title.get(m.proofId) ?? "",
        reviewerId: m.userId,
        reviewerName: m.name,
        scope: visible
          ? `cases ${[...visible]
              .map((id) => f.numbered.get(id)?.number)
              .filter(Boolean)
              .sort()
              .join(", ")}`
          : "whole proof",
        inScope: steps.length,
        vouched,
        stale,
        unresolvedDisputes: disputed,
        waiting: steps.length - vouched - disputed,
      };
    });
}

export async function getEditorProgress(userId: number): Promise<ReviewerProgress[]> {
  return getReviewerProgress(await proofIdsWhere(userId, "editor"));
}
