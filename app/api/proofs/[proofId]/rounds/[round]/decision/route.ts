import { readBody, route } from "@/lib/http";
import { requireProofRole } from "@/lib/session";
import { assertMayInRound, loadRound, recordDecision } from "@/lib/data/rounds";
import { decisionSchema } from "@/lib/validations/round";
import { routeIds } from "../../../route-ids";

type Context = { params: Promise<{ proofId: string; round: string }> };

/** The editor's decision for the round, with the letter e-mailed to the authors; 409 when already decided. */
export const POST = route(async (request: Request, { params }: Context) => {
  const { proofId, round } = await routeIds(params);
  const { user, role } = await requireProofRole(proofId);
  await loadRound(proofId, round);
  assertMayInRound(role, "decide");
  const input = await readBody(request, decisionSchema);
  return Response.json({ decision: await recordDecision(proofId, round, user, input) }, { status: 201 });
});
