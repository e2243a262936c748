import { route } from "@/lib/http";
import { requireProofRole } from "@/lib/session";
import { getRoundView } from "@/lib/data/rounds";
import { routeIds } from "../../route-ids";

type Context = { params: Promise<{ proofId: string; round: string }> };

/** One round as the viewer may see it. */
export const GET = route(async (_request: Request, { params }: Context) => {
  const { proofId, round } = await routeIds(params);
  const { user, role } = await requireProofRole(proofId);
  return Response.json({ round: await getRoundView(proofId, round, { id: user.id, role }) });
});
