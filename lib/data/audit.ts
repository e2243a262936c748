import "server-only";
/**
 * The audit trail: an append-only event log per proof (who did what to which step, case, claim,
 * revision). This module only inserts and reads; nothing here updates or deletes an event.
 */
import { Op, type Transaction } from "sequelize";
import { models } from "@/models";
import { caseNumbers, labelSteps } from "@/lib/proof-tree";
import { eventSentence, placePhrase, type EventPlace } from "@/lib/review/event-sentences";
import type { NameLens } from "./blind";

/** Events whose detail names a member or an address (invitations, membership, due dates). */
const HIDDEN_DETAIL = /^(invitation|member|round\.due_date)/;

export interface AuditInput {
  proofId: number;
  actorId: number | null;
  action: string;
  subjectType: "proof" | "case" | "step" | "revision" | "claim" | "review" | "comment" | "invitation" | "member" | "settings" | "round" | "report";
  subjectId: number | null;
  detail?: string | null;
}

export async function recordEvent(e: AuditInput, transaction?: Transaction): Promise<void> {
  const { AuditEvent } = models();
  await AuditEvent.create({ ...e, detail: e.detail ?? null }, { transaction });
}

export interface AuditEntry {
  id: number;
  action: string;
  subjectType: string;
  subjectId: number | null;
  detail: string | null;
  actorName: string | null;
  /** "step 2.1(a) (case 2.1, “Title”)", "case 3.2, “Title”", or "the proof": where the event happened, in the pages' labels. */
  subjectLabel: string;
  /** The event in one sentence: who did what, where (lib/review/event-sentences.ts). */
  sentence: string;
  /** The page of the step or proof the event is about. */
  href: string;
  /** The case the event is about (through its step, revision, claim, review or comment), or null for the whole proof. */
  caseId: number | null;
  /** Its number ("2.1", lib/proof-tree.ts) while the case lives, and the step the event is about, if any. */
  caseNumber: string | null;
  stepId: number | null;
  at: string;
}

/** Numbers and titles of the proof's cases ("3.2") and labels of its steps ("3.2(a)", lib/proof-tree.ts), for readable subjects. */
async function labels(
  proofId: number,
): Promise<{ cases: Map<number, string>; titles: Map<number, string>; steps: Map<number, string>; caseOfStep: Map<number, number> }> {
  const { Case, Step } = models();
  const rows = await Case.findAll({ where: { proofId }, attributes: ["id", "parentId", "position", "title"] });
  const cases = caseNumbers(rows);
  const steps = rows.length ? await Step.findAll({ where: { caseId: rows.map((c) => c.id) }, attributes: ["id", "caseId", "position"] }) : [];
  return {
    cases,
    titles: new Map(rows.map((c) => [c.id, c.title])),
    steps: labelSteps(cases, steps),
    caseOfStep: new Map(steps.map((st) => [st.id, st.caseId])),
  };
}

/** The step of each revision, claim, review and comment named by these events, so that every event finds its case. */
async function stepsOfSubjects(events: ReadonlyArray<{ subjectType: string; subjectId: number | null }>): Promise<Map<string, number>> {
  const { StepRevision, Claim, Review, Comment } = models();
  const ids = (type: string) => [...new Set(events.filter((e) => e.subjectType === type && e.subjectId !== null).map((e) => e.subjectId!))];
  const sources = [
    ["revision", StepRevision],
    ["claim", Claim],
    ["review", Review],
    ["comment", Comment],
  ] as const;
  const found = new Map<string, number>();
  await Promise.all(
    sources.map(async ([type, model]) => {
      const wanted = ids(type);
      if (wanted.length === 0) return;
      // Claims are read unscoped: a withdrawn claim's events still belong to its case.
      const rows = await (model as typeof Review).unscoped().findAll({ where: { id: wanted }, attributes: ["id", "stepId"] });
      for (const r of rows) if (r.stepId !== null) found.set(`${type}:${r.id}`, r.stepId);
    }),
  );
  return found;
}

/**
 * A proof's events, newest first. With a `lens` (lib/data/blind.ts), a referee of a blind proof acts as
 * "Referee k", and the free-text detail of events about members (which may hold an address) is withheld.
 * `only`: the events with these actions after a moment, leaving out one person's own (what changed since their last visit).
 */
export async function listProofEvents(
  proofId: number,
  limit = 500,
  lens?: NameLens,
  only?: { after: Date; notBy: number; actions: readonly string[] },
): Promise<AuditEntry[]> {
  const { AuditEvent, User } = models();
  const events = await AuditEvent.findAll({
    where: only
      ? { proofId, createdAt: { [Op.gt]: only.after }, action: [...only.actions], [Op.or]: [{ actorId: null }, { actorId: { [Op.ne]: only.notBy } }] }
      : { proofId },
    order: [
      ["createdAt", "DESC"],
      ["id", "DESC"],
    ],
    limit,
  });
  const actorIds = [...new Set(events.map((e) => e.actorId).filter((id): id is number => id !== null))];
  const [{ cases, titles, steps, caseOfStep }, stepOf] = await Promise.all([labels(proofId), stepsOfSubjects(events)]);
  const caseOf = (type: string, id: number | null): number | null => {
    if (id === null) return null;
    if (type === "case") return id;
    if (type === "step") return caseOfStep.get(id) ?? null;
    const stepId = stepOf.get(`${type}:${id}`);
    return stepId === undefined ? null : (caseOfStep.get(stepId) ?? null);
  };
  const stepIdOf = (type: string, id: number | null): number | null => (id === null ? null : type === "step" ? id : (stepOf.get(`${type}:${id}`) ?? null));
  const placeOf = (type: string, id: number | null): EventPlace => {
    const stepId = stepIdOf(type, id);
    const caseId = caseOf(type, id);
    return {
      step: stepId === null ? null : (steps.get(stepId) ?? null),
      caseNumber: caseId === null ? null : (cases.get(caseId) ?? null),
      caseTitle: caseId === null ? null : (titles.get(caseId) ?? null),
    };
  };
  const names = new Map((actorIds.length ? await User.findAll({ where: { id: actorIds }, attributes: ["id", "name"] }) : []).map((u) => [u.id, u.name]));
  // A member event about a hidden referee does not carry their user id.
  const hiddenMember = (e: { subjectType: string; subjectId: number | null }) =>
    lens !== undefined && e.subjectType === "member" && e.subjectId !== null && lens.hides(e.subjectId);
  return events.map((e) => {
    const detail = lens && ((e.actorId !== null && lens.hides(e.actorId)) || HIDDEN_DETAIL.test(e.action)) ? null : e.detail;
    const actorName = e.actorId === null ? null : lens ? lens.name(e.actorId, names.get(e.actorId) ?? "") : (names.get(e.actorId) ?? null);
    const place = placeOf(e.subjectType, e.subjectId);
    const stepId = stepIdOf(e.subjectType, e.subjectId);
    return {
      id: Number(e.id),
      action: e.action,
      subjectType: e.subjectType,
      subjectId: hiddenMember(e) ? null : e.subjectId,
      detail,
      actorName,
      subjectLabel: placePhrase(place),
      sentence: eventSentence({ action: e.action, subjectType: e.subjectType, actorName, detail, place }),
      href: stepId !== null && place.step !== null ? `/proofs/${proofId}/steps/${stepId}` : `/proofs/${proofId}`,
      caseId: caseOf(e.subjectType, e.subjectId),
      caseNumber: place.caseNumber,
      stepId,
      at: e.createdAt.toISOString(),
    };
  });
}
