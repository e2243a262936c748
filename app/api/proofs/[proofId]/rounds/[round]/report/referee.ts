import { requireProofRole } from "@/lib/session";
import { assertMayInRound, loadRound } from "@/lib/data/rounds";
import { routeIds } from "../../../route-ids";

export type RoundContext = { params: Promise<{ proofId: string; round: string }> };

/** The signed-in referee of this proof's round (404 for an unknown round, 403 for anyone who may not write a report in it). */
export async function refereeOfRound(params: RoundContext["params"]): Promise<{ proofId: number; round: number; userId: number }> {
  const { proofId, round } = await routeIds(params);
  const { user, role } = await requireProofRole(proofId);
  await loadRound(proofId, round);
  assertMayInRound(role, "write_report");
  return { proofId, round, userId: user.id };
}
