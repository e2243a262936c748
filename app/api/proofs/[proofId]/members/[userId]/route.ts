import { route } from "@/lib/http";
import { routeIds } from "../../route-ids";
import { assertMayRemove, membershipAccess } from "@/lib/access";
import { memberStanding, removeMember } from "@/lib/data/members";

type Context = { params: Promise<{ proofId: string; userId: string }> };

/**
 * Removes a member, or lets a member leave (their own id). Their vouches, disputes, comments and
 * submitted reports stay in the record, attributed. 409 for the owner: hand over ownership first.
 */
export const DELETE = route(async (_request: Request, { params }: Context) => {
  const { proofId, userId } = await routeIds(params);
  const m = await membershipAccess(proofId, false);
  assertMayRemove(m, await memberStanding(proofId, userId));
  return Response.json(await removeMember(proofId, userId, m.user.id));
});
