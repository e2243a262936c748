import { BODY_LIMITS, readBody, route } from "@/lib/http";
import { requireProofRole } from "@/lib/session";
import { assertMayInRound, listRoundViews, openRound, parseDueDate } from "@/lib/data/rounds";
import { openRoundSchema } from "@/lib/validations/round";
import { routeIds } from "../route-ids";

type Context = { params: Promise<{ proofId: string }> };

/** The proof's rounds, each as the viewer may see it (reports, notes and names per lib/review/rounds.ts). */
export const GET = route(async (_request: Request, { params }: Context) => {
  const { proofId } = await routeIds(params);
  const { user, role } = await requireProofRole(proofId);
  return Response.json({ rounds: await listRoundViews(proofId, { id: user.id, role }) });
});

/** An editor opens the next round with its due date; 409 while one is open or after a final decision. */
export const POST = route(async (request: Request, { params }: Context) => {
  const { proofId } = await routeIds(params);
  const { user, role } = await requireProofRole(proofId);
  assertMayInRound(role, "open_round");
  const input = await readBody(request, openRoundSchema, BODY_LIMITS.small);
  return Response.json(await openRound(proofId, user.id, parseDueDate(input.dueAt)), { status: 201 });
});
