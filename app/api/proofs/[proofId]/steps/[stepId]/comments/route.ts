import { readBody, route } from "@/lib/http";
import { addComment } from "@/lib/data/reviews";
import { getStepReview } from "@/lib/data/review-panel";
import { commentSchema } from "@/lib/validations/comment";
import { routeIds } from "@/app/api/proofs/[proofId]/route-ids";
import { requireStepAccess } from "@/lib/access";

type Context = { params: Promise<{ proofId: string; stepId: string }> };

/** The step's comments as threads (general comments, and each dispute's own thread). */
export const GET = route(async (_request: Request, { params }: Context) => {
  const { proofId, stepId } = await routeIds(params);
  const { actor, step } = await requireStepAccess(proofId, stepId);
  const review = await getStepReview(step, actor);
  return Response.json({ comments: review.comments, disputes: review.disputes.map((d) => ({ id: d.id, state: d.state, thread: d.thread })) });
});

/** Any member who sees the step comments or replies, in Markdown with math. */
export const POST = route(async (request: Request, { params }: Context) => {
  const { proofId, stepId } = await routeIds(params);
  const { actor, step } = await requireStepAccess(proofId, stepId);
  const input = await readBody(request, commentSchema);
  return Response.json(await addComment(step, actor, input), { status: 201 });
});
