import "server-only";
/**
 * "Since your last visit", per member of a proof: opening the overview records the visit; what changed
 * after the member's mark (new revisions, claims, verdicts, disputes, reports, decisions, comments by
 * others) is listed at the top of the overview and marked in the outline until they mark it seen. The
 * list passes through the same blind lens and case scope as the timeline (lib/data/blind.ts, withinScope).
 */
import { Op } from "sequelize";
import { models } from "@/models";
import { notFound } from "@/lib/errors";
import { withinScope, type Actor } from "@/lib/access/rules";
import { CHANGE_ACTIONS, changeHref, type ChangeKind } from "@/lib/review/changes";
import { listProofEvents } from "./audit";
import { refereeLens } from "./blind";

export interface ChangeItem {
  id: number;
  kind: ChangeKind;
  sentence: string;
  href: string;
  at: string;
}

export interface ChangesSinceVisit {
  /** The member's mark: changes after it are listed. */
  since: string;
  lastVisitAt: string | null;
  /** Newest first, at most `limit`; `more` counts the rest. */
  items: ChangeItem[];
  more: number;
  /** The steps and cases with a listed change, for the outline's marks. */
  stepIds: number[];
  caseIds: number[];
}

const ACTIONS = Object.keys(CHANGE_ACTIONS);

/** What changed on the proof since this member's mark, as they may see it. `visible`: their case scope (null: the whole proof). */
export async function changesSinceVisit(proofId: number, viewer: Actor, visible: ReadonlySet<number> | null, limit = 50): Promise<ChangesSinceVisit> {
  const member = await models().ProofMember.findOne({ where: { proofId, userId: viewer.id }, attributes: ["seenThrough", "lastVisitAt"] });
  if (!member) throw notFound("Your membership of this proof");
  const lens = await refereeLens(proofId, viewer);
  const events = await listProofEvents(proofId, 1000, lens, { after: member.seenThrough, notBy: viewer.id, actions: ACTIONS });
  const seen = withinScope(events, (e) => e.caseId, visible);
  return {
    since: member.seenThrough.toISOString(),
    lastVisitAt: member.lastVisitAt?.toISOString() ?? null,
    items: seen.slice(0, limit).map((e) => ({ id: e.id, kind: CHANGE_ACTIONS[e.action], sentence: e.sentence, href: changeHref(proofId, e), at: e.at })),
    more: Math.max(0, seen.length - limit),
    stepIds: [...new Set(seen.map((e) => e.stepId).filter((id): id is number => id !== null))],
    caseIds: [...new Set(seen.map((e) => e.caseId).filter((id): id is number => id !== null))],
  };
}

/** Records that the member opened the overview now. */
export async function recordVisit(proofId: number, userId: number): Promise<void> {
  await models().ProofMember.update({ lastVisitAt: new Date() }, { where: { proofId, userId } });
}

/**
 * Marks the changes up to `through` as seen (never later than now, never moving the mark back), so
 * that a change that arrived after the page was drawn stays listed. Returns the mark.
 */
export async function markSeen(proofId: number, userId: number, through: Date): Promise<{ seenThrough: string }> {
  const { ProofMember } = models();
  const at = new Date(Math.min(through.getTime(), Date.now()));
  await ProofMember.update({ seenThrough: at }, { where: { proofId, userId, seenThrough: { [Op.lt]: at } } });
  const member = await ProofMember.findOne({ where: { proofId, userId }, attributes: ["seenThrough"] });
  if (!member) throw notFound("Your membership of this proof");
  return { seenThrough: member.seenThrough.toISOString() };
}
