import { readBody, route } from "@/lib/http";
import { proofAccess } from "@/lib/access";
import { changesSinceVisit, markSeen } from "@/lib/data/visits";
import { markSeenSchema } from "@/lib/validations/visit";
import { routeIds } from "@/app/api/proofs/[proofId]/route-ids";

type Context = { params: Promise<{ proofId: string }> };

/** What changed since the member's mark, as they may see it (their cases only; referees numbered on a blind proof). */
export const GET = route(async (_request: Request, { params }: Context) => {
  const { proofId } = await routeIds(params);
  const access = await proofAccess(proofId);
  return Response.json(await changesSinceVisit(proofId, { id: access.user.id, role: access.role }, access.visible));
});

/** "Mark as seen": moves the member's mark to `through` (never past now, never back). */
export const POST = route(async (request: Request, { params }: Context) => {
  const { proofId } = await routeIds(params);
  const access = await proofAccess(proofId);
  const { through } = await readBody(request, markSeenSchema);
  return Response.json(await markSeen(proofId, access.user.id, new Date(through)));
});
