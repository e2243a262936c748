import { route } from "@/lib/http";
import { requireProofRole } from "@/lib/session";
import { assertMayInRound, loadRound, submitReport } from "@/lib/data/rounds";
import { routeIds } from "../../../../route-ids";

type Context = { params: Promise<{ proofId: string; round: string }> };

/** Submits the referee's draft (once): 422 without a report or recommendation, 409 when the round is closed (with its state). */
export const POST = route(async (_request: Request, { params }: Context) => {
  const { proofId, round } = await routeIds(params);
  const { user, role } = await requireProofRole(proofId);
  await loadRound(proofId, round);
  assertMayInRound(role, "write_report");
  return Response.json({ report: await submitReport(proofId, round, user.id) });
});
