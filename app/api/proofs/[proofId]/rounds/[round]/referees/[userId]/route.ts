import { BODY_LIMITS, readBody, route } from "@/lib/http";
import { requireProofRole } from "@/lib/session";
import { assertMayInRound, loadRound, parseDueDate, setRefereeDue } from "@/lib/data/rounds";
import { refereeDueSchema } from "@/lib/validations/round";
import { routeIds } from "../../../../route-ids";

type Context = { params: Promise<{ proofId: string; round: string; userId: string }> };

/** The editor moves one referee's due date in an open round (409 when the round is decided). */
export const PATCH = route(async (request: Request, { params }: Context) => {
  const { proofId, round, userId } = await routeIds(params);
  const { user, role } = await requireProofRole(proofId);
  await loadRound(proofId, round);
  assertMayInRound(role, "set_due_date");
  const input = await readBody(request, refereeDueSchema, BODY_LIMITS.small);
  const dueAt = parseDueDate(input.dueAt);
  await setRefereeDue(proofId, round, userId, user.id, dueAt);
  return Response.json({ dueAt: dueAt.toISOString() });
});
