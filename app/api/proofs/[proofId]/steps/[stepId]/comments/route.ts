import { idParam, readBody, route } from "@/lib/http";
import { requireProofRole } from "@/lib/session";
import { addComment, assertCanSeeStep, getStepReview, loadStep } from "@/lib/data/reviews";
import { commentSchema } from "@/lib/validations/comment";

type Context = { params: Promise<{ proofId: string; stepId: string }> };

/** The step's comments as threads (general comments, and each dispute's own thread). */
export const GET = route(async (_request: Request, { params }: Context) => {
  const p = await params;
  const proofId = idParam(p.proofId, "This proof");
  const stepId = idParam(p.stepId, "This step");
  const { user, role } = await requireProofRole(proofId);
  const step = await loadStep(proofId, stepId);
  await assertCanSeeStep(step, user.id);
  const review = await getStepReview(step, { id: user.id, role });
  return Response.json({ comments: review.comments, disputes: review.disputes.map((d) => ({ id: d.id, state: d.state, thread: d.thread })) });
});

/** Any member who sees the step comments or replies, in Markdown with math. */
export const POST = route(async (request: Request, { params }: Context) => {
  const p = await params;
  const proofId = idParam(p.proofId, "This proof");
  const stepId = idParam(p.stepId, "This step");
  const { user, role } = await requireProofRole(proofId);
  const step = await loadStep(proofId, stepId);
  await assertCanSeeStep(step, user.id);
  const input = await readBody(request, commentSchema);
  return Response.json(await addComment(step, { id: user.id, role }, input), { status: 201 });
});
