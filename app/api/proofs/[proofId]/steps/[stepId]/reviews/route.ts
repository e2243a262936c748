import { readBody, route } from "@/lib/http";
import { giveVerdict } from "@/lib/data/reviews";
import { getStepReview } from "@/lib/data/review-panel";
import { verdictSchema } from "@/lib/validations/review";
import { routeIds } from "@/app/api/proofs/[proofId]/route-ids";
import { assertCanGiveVerdict, requireStepAccess } from "@/lib/access";

type Context = { params: Promise<{ proofId: string; stepId: string }> };

/** The review panel of a step: verdicts (superseded vouches marked), disputes with their threads, comments, and what the viewer may do. */
export const GET = route(async (_request: Request, { params }: Context) => {
  const { proofId, stepId } = await routeIds(params);
  const { actor, step } = await requireStepAccess(proofId, stepId);
  return Response.json({ review: await getStepReview(step, actor) });
});

/** A referee vouches for or disputes the step at its latest revision (an older revision is refused with 409 naming what changed). */
export const POST = route(async (request: Request, { params }: Context) => {
  const { proofId, stepId } = await routeIds(params);
  const { actor, step } = await requireStepAccess(proofId, stepId);
  await assertCanGiveVerdict(step, actor);
  const input = await readBody(request, verdictSchema);
  const result = await giveVerdict(step, actor, input);
  return Response.json(result, { status: result.created ? 201 : 200 });
});
