import { route } from "@/lib/http";
import { requireProofRole } from "@/lib/session";
import { assertMayInRound, loadRound, startCorrection } from "@/lib/data/rounds";
import { routeIds } from "../../../../route-ids";

type Context = { params: Promise<{ proofId: string; round: string }> };

/** Starts a correction of a submitted report: a new draft version; the submitted one is kept unchanged. */
export const POST = route(async (_request: Request, { params }: Context) => {
  const { proofId, round } = await routeIds(params);
  const { user, role } = await requireProofRole(proofId);
  await loadRound(proofId, round);
  assertMayInRound(role, "write_report");
  return Response.json({ report: await startCorrection(proofId, round, user.id) }, { status: 201 });
});
