import { readBody, route } from "@/lib/http";
import { routeIds } from "../route-ids";
import { proofAccess } from "@/lib/access";
import { transferOwnership } from "@/lib/data/members";
import { ownershipSchema } from "@/lib/validations/membership";

type Context = { params: Promise<{ proofId: string }> };

/** The owner hands the proof to another author or editor: `{ "userId": … }`. */
export const PUT = route(async (request: Request, { params }: Context) => {
  const { proofId } = await routeIds(params);
  const access = await proofAccess(proofId, "ownership.transfer");
  const input = await readBody(request, ownershipSchema);
  return Response.json(await transferOwnership(proofId, input.userId, access.user.id));
});
