import "server-only";
import { QueryTypes } from "sequelize";
import { models } from "@/models";
import { getSequelize } from "@/lib/db";
import type { ProofRole } from "@/lib/access/rules";
import { refereeLens } from "./blind";
import { hiddenCaseIds } from "./cases";
import { visibleCaseIds } from "@/lib/access";
import { proofStanding, type ProofStanding } from "@/lib/review/rounds";
import type { DisputeState } from "@/lib/review/states";

export interface ProofListItem {
  id: number;
  title: string;
  role: ProofRole;
  updatedAt: string;
  caseCount: number;
  memberCount: number;
  /** Where the proof stands in refereeing (lib/review/rounds.ts): drafting, in review (round N), decided. */
  standing: ProofStanding;
  /** Unresolved disputes (raised, answered or upheld) on live steps this member may see. */
  openDisputes: number;
}

const UNRESOLVED: DisputeState[] = ["raised", "answered", "upheld"];

/** The proofs a user belongs to, with their role in each, most recently changed first. */
export async function listProofsForUser(userId: number): Promise<ProofListItem[]> {
  const { ProofMember, Proof, Case, ReviewRound, RoundDecision, Review, Step } = models();
  const memberships = await ProofMember.findAll({
    where: { userId },
    include: [{ model: Proof, as: "proof", attributes: ["id", "title", "updatedAt"] }],
  });
  const ids = memberships.map((m) => m.proofId);
  if (ids.length === 0) return [];
  const [caseCounts, memberCounts, rounds, cases] = await Promise.all([
    Case.count({ where: { proofId: ids }, group: ["proofId"] }),
    ProofMember.count({ where: { proofId: ids }, group: ["proofId"] }),
    ReviewRound.findAll({ where: { proofId: ids }, attributes: ["id", "proofId", "number"] }),
    Case.findAll({ where: { proofId: ids }, attributes: ["id", "proofId", "parentId", "deletedAt"] }),
  ]);
  const hidden = hiddenCaseIds(cases);
  const steps = await Step.findAll({ where: { caseId: cases.filter((c) => !hidden.has(c.id)).map((c) => c.id) }, attributes: ["id", "caseId"] });
  const [decisions, disputes, scopes] = await Promise.all([
    rounds.length ? RoundDecision.findAll({ where: { roundId: rounds.map((r) => r.id) }, attributes: ["roundId", "decision"] }) : [],
    steps.length ? Review.findAll({ where: { stepId: steps.map((s) => s.id), verdict: "dispute", disputeState: UNRESOLVED }, attributes: ["stepId"] }) : [],
    Promise.all(memberships.map(async (m) => [m.proofId, await visibleCaseIds(m.proofId, userId, m.role)] as const)),
  ]);
  const caseOfStep = new Map(steps.map((s) => [s.id, s.caseId]));
  const proofOfCase = new Map(cases.map((c) => [c.id, c.proofId]));
  const visible = new Map(scopes);
  const disputeCount = new Map<number, number>();
  for (const d of disputes) {
    const caseId = caseOfStep.get(d.stepId)!;
    const proofId = proofOfCase.get(caseId)!;
    if (hidden.has(caseId) || (visible.get(proofId) && !visible.get(proofId)!.has(caseId))) continue;
    disputeCount.set(proofId, (disputeCount.get(proofId) ?? 0) + 1);
  }
  const decisionOf = new Map(decisions.map((d) => [d.roundId, d.decision]));
  const countOf = (rows: Array<{ proofId?: number; count: number }>, id: number) => Number(rows.find((r) => Number(r.proofId) === id)?.count ?? 0);
  return memberships
    .map((m) => {
      const p = (m as unknown as { proof: { id: number; title: string; updatedAt: Date } }).proof;
      return {
        id: p.id,
        title: p.title,
        role: m.role,
        updatedAt: p.updatedAt.toISOString(),
        caseCount: countOf(caseCounts as never, p.id),
        memberCount: countOf(memberCounts as never, p.id),
        standing: proofStanding(rounds.filter((r) => r.proofId === p.id).map((r) => ({ number: r.number, decision: decisionOf.get(r.id) ?? null }))),
        openDisputes: disputeCount.get(p.id) ?? 0,
      };
    })
    .sort((a, b) => b.updatedAt.localeCompare(a.updatedAt) || a.id - b.id);
}

/**
 * Whether the proof exists and the user's role on it, in one query (the permission check of every
 * request): `null` when there is no such proof, `{ role: null }` for a non-member.
 */
export async function proofAndRole(proofId: number, userId: number): Promise<{ role: ProofRole | null } | null> {
  const rows = await getSequelize().query<{ role: ProofRole | null }>(
    "SELECT m.role AS role FROM proofs p LEFT JOIN proof_members m ON m.proof_id = p.id AND m.user_id = :userId WHERE p.id = :proofId",
    { replacements: { proofId, userId }, type: QueryTypes.SELECT },
  );
  return rows.length ? { role: rows[0].role ?? null } : null;
}

export async function getMembershipRole(proofId: number, userId: number): Promise<ProofRole | null> {
  const { ProofMember } = models();
  const m = await ProofMember.findOne({ where: { proofId, userId } });
  return m?.role ?? null;
}

export interface ProofSummary {
  id: number;
  title: string;
  statement: string;
  requiredApprovals: number;
  /** The member who owns the proof (its creator, until they hand it over). */
  ownerId: number;
  createdAt: string;
  updatedAt: string;
  members: Array<{ userId: number; name: string; email: string; role: ProofRole }>;
}

/**
 * A proof with its members. With a `viewer`, referees of a blind proof are shown to authors and other
 * referees as "Referee k" with neither address nor id (userId is then -k); without one, names are plain
 * (for editors' and internal use only).
 */
export async function getProofSummary(proofId: number, viewer?: { id: number; role: ProofRole | null }): Promise<ProofSummary | null> {
  const { Proof, ProofMember, User } = models();
  const p = await Proof.findByPk(proofId);
  if (!p) return null;
  const members = await ProofMember.findAll({ where: { proofId }, include: [{ model: User, as: "user" }], order: [["role", "ASC"]] });
  const lens = viewer ? await refereeLens(proofId, viewer) : null;
  return {
    id: p.id,
    title: p.title,
    statement: p.statement,
    requiredApprovals: p.requiredApprovals,
    ownerId: p.createdBy,
    createdAt: p.createdAt.toISOString(),
    updatedAt: p.updatedAt.toISOString(),
    members: members.map((m) => {
      const u = (m as unknown as { user: { id: number; name: string; email: string } }).user;
      if (lens?.hides(u.id)) {
        const name = lens.name(u.id, u.name);
        return { userId: -Number(name.replace(/\D/g, "")), name, email: "", role: m.role };
      }
      return { userId: u.id, name: u.name, email: u.email, role: m.role };
    }),
  };
}
