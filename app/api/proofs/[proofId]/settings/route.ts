import { idParam, BODY_LIMITS, readBody, route } from "@/lib/http";
import { requireProofRole } from "@/lib/session";
import { setRequiredApprovals } from "@/lib/data/reviews";
import { getReadiness } from "@/lib/data/review-queues";
import { settingsSchema } from "@/lib/validations/review";
import { assertCanManageReviewers, visibleCaseIds } from "@/lib/access";

type Context = { params: Promise<{ proofId: string }> };

/** Review settings and the readiness roll-up (a case-limited reviewer sees only their cases in it). */
export const GET = route(async (_request: Request, { params }: Context) => {
  const proofId = idParam((await params).proofId, "This proof");
  const { user } = await requireProofRole(proofId);
  const readiness = await getReadiness(proofId, await visibleCaseIds(proofId, user.id));
  return Response.json({ requiredApprovals: readiness.requiredApprovals, readiness });
});

/** The editor sets how many vouches each step needs. */
export const PATCH = route(async (request: Request, { params }: Context) => {
  const proofId = idParam((await params).proofId, "This proof");
  const { user, role } = await requireProofRole(proofId);
  await assertCanManageReviewers(proofId, user, role);
  const input = await readBody(request, settingsSchema, BODY_LIMITS.small);
  await setRequiredApprovals(proofId, user.id, input.requiredApprovals);
  return Response.json({ requiredApprovals: input.requiredApprovals });
});
