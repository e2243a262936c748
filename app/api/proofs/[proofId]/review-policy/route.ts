import { BODY_LIMITS, readBody, route } from "@/lib/http";
import { requireProofRole } from "@/lib/session";
import { assertMayInRound, setReviewPolicy } from "@/lib/data/rounds";
import { reviewPolicySchema } from "@/lib/validations/round";
import { routeIds } from "../route-ids";

type Context = { params: Promise<{ proofId: string }> };

/** Blind review on or off, and the reminder offsets (editors only). */
export const PATCH = route(async (request: Request, { params }: Context) => {
  const { proofId } = await routeIds(params);
  const { user, role } = await requireProofRole(proofId);
  assertMayInRound(role, "set_review_policy");
  const input = await readBody(request, reviewPolicySchema, BODY_LIMITS.small);
  return Response.json(await setReviewPolicy(proofId, user.id, input));
});
