import "server-only";
/** Review rounds: the viewer, loading a round, its referees and the proof's review policy (shared by the round modules). */
import type { Transaction } from "sequelize";
import { models } from "@/models";
import { conflict, forbidden, notFound } from "@/lib/errors";
import { mayDoInRound, roundRefusal, type RoundAction } from "@/lib/review/rounds";
import type { ProofRole } from "@/lib/access/rules";
import type { ReviewRound } from "@/models/review-round";

export interface Viewer {
  id: number;
  role: ProofRole;
}

/** 403 unless the role may do this with rounds (the rule lives in lib/review/rounds.ts). */
export function assertMayInRound(role: ProofRole, action: RoundAction): void {
  if (!mayDoInRound(role, action)) throw forbidden(roundRefusal(action));
}

export type RoundState = "open" | "decided";
export const stateOf = (r: ReviewRound): RoundState => (r.closedAt ? "decided" : "open");
export const day = (d: Date) => d.toISOString().slice(0, 10);

/** A round of this proof by its number, or 404. */
export async function loadRound(proofId: number, number: number, transaction?: Transaction): Promise<ReviewRound> {
  const round = await models().ReviewRound.findOne({ where: { proofId, number }, transaction, lock: transaction ? transaction.LOCK.UPDATE : undefined });
  if (!round) throw notFound(`Round ${number}`);
  return round;
}

export const closedConflict = (round: ReviewRound) =>
  conflict(
    `Round ${round.number} is closed: the editor recorded its decision on ${day(round.closedAt!)}. Reports for it can no longer be submitted or changed.`,
    {
      round: { number: round.number, state: stateOf(round), closedAt: round.closedAt!.toISOString() },
    },
  );

export interface Referee {
  userId: number;
  name: string;
  email: string;
  /** 1, 2, … in the order the referees joined the proof: the k of "Referee k". */
  index: number;
  /** Still a reviewer of the proof (a removed one stays listed: their vouches and reports stay in the record). */
  current: boolean;
}

/**
 * Every referee the proof has had: current and removed reviewers in the order they first joined, then
 * anyone else who wrote a report (so "Referee k" never changes when someone leaves or joins later).
 */
export async function listReferees(proofId: number, transaction?: Transaction): Promise<Referee[]> {
  const { ProofMember, FormerMember, User, ReviewRound, RefereeReport } = models();
  const members = await ProofMember.findAll({
    where: { proofId, role: "reviewer" },
    order: [
      ["createdAt", "ASC"],
      ["userId", "ASC"],
    ],
    transaction,
  });
  // Removed referees keep their number (their vouches and reports stay in the record): present and
  // former referees are numbered together by when they first joined.
  const former = await FormerMember.findAll({ where: { proofId, role: "reviewer" }, transaction });
  const joined = new Map<number, number>(members.map((m) => [m.userId, m.createdAt.getTime()]));
  for (const f of former) joined.set(f.userId, Math.min(joined.get(f.userId) ?? Infinity, f.joinedAt.getTime()));
  const rounds = await ReviewRound.findAll({ where: { proofId }, attributes: ["id"], transaction });
  const writers = rounds.length ? await RefereeReport.findAll({ where: { roundId: rounds.map((r) => r.id) }, attributes: ["refereeId"], transaction }) : [];
  const ids = [...joined.entries()].sort((a, b) => a[1] - b[1] || a[0] - b[0]).map(([id]) => id);
  for (const id of [...new Set(writers.map((w) => w.refereeId))].sort((a, b) => a - b)) if (!ids.includes(id)) ids.push(id);
  const users = ids.length ? await User.findAll({ where: { id: ids }, attributes: ["id", "name", "email"], transaction }) : [];
  return ids.map((id, i) => {
    const u = users.find((x) => x.id === id);
    return { userId: id, name: u?.name ?? "", email: u?.email ?? "", index: i + 1, current: members.some((m) => m.userId === id) };
  });
}

export async function proofPolicy(proofId: number, transaction?: Transaction) {
  const p = await models().Proof.findByPk(proofId, { attributes: ["id", "title", "blindReview", "remindBeforeDays", "remindAfterDays"], transaction });
  if (!p) throw notFound("This proof");
  return p;
}

/** The due date of each current referee in a round: their own row, or the round's. */
export async function dueDates(round: ReviewRound, referees: Referee[], transaction?: Transaction): Promise<Map<number, Date>> {
  const rows = await models().RoundReferee.findAll({ where: { roundId: round.id }, transaction });
  return new Map(referees.map((r) => [r.userId, rows.find((x) => x.userId === r.userId)?.dueAt ?? round.dueAt]));
}
