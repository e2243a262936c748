import "server-only";
/**
 * The audit trail: an append-only event log per proof (who did what to which step, case, claim,
 * revision). This module only inserts and reads; nothing here updates or deletes an event.
 */
import type { Transaction } from "sequelize";
import { models } from "@/models";

export interface AuditInput {
  proofId: number;
  actorId: number | null;
  action: string;
  subjectType: "proof" | "case" | "step" | "revision" | "claim" | "review" | "comment" | "invitation" | "member" | "settings";
  subjectId: number | null;
  detail?: string;
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
  at: string;
}

/** A proof's events, newest first. */
export async function listProofEvents(proofId: number, limit = 500): Promise<AuditEntry[]> {
  const { AuditEvent, User } = models();
  const events = await AuditEvent.findAll({ where: { proofId }, order: [["createdAt", "DESC"], ["id", "DESC"]], limit });
  const actorIds = [...new Set(events.map((e) => e.actorId).filter((id): id is number => id !== null))];
  const names = new Map((actorIds.length ? await User.findAll({ where: { id: actorIds }, attributes: ["id", "name"] }) : []).map((u) => [u.id, u.name]));
  return events.map((e) => ({
    id: Number(e.id),
    action: e.action,
    subjectType: e.subjectType,
    subjectId: e.subjectId,
    detail: e.detail,
    actorName: e.actorId === null ? null : (names.get(e.actorId) ?? null),
    at: e.createdAt.toISOString(),
  }));
}
