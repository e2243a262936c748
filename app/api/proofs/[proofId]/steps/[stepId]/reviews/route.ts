import { idParam, readBody, route } from "@/lib/http";
import { requireProofRole } from "@/lib/session";
import { assertCanGiveVerdict, assertCanSeeStep, getStepReview, giveVerdict, loadStep } from "@/lib/data/reviews";
import { verdictSchema } from "@/lib/validations/review";

type Context = { params: Promise<{ proofId: string; stepId: string }> };

/** The review panel of a step: verdicts (stale ones marked), disputes with their threads, comments, and what the viewer may do. */
export const GET = route(async (_request: Request, { params }: Context) => {
  const p = await params;
  const proofId = idParam(p.proofId, "This proof");
  const stepId = idParam(p.stepId, "This step");
  const { user, role } = await requireProofRole(proofId);
  const step = await loadStep(proofId, stepId);
  await assertCanSeeStep(step, user.id);
  return Response.json({ review: await getStepReview(step, { id: user.id, role }) });
});

/** A reviewer approves or disputes the step at its latest revision (a stale revision is refused with 409). */
export const POST = route(async (request: Request, { params }: Context) => {
  const p = await params;
  const proofId = idParam(p.proofId, "This proof");
  const stepId = idParam(p.stepId, "This step");
  const { user, role } = await requireProofRole(proofId);
  const step = await loadStep(proofId, stepId);
  await assertCanGiveVerdict(step, { id: user.id, role });
  const input = await readBody(request, verdictSchema);
  const result = await giveVerdict(step, { id: user.id, role }, input);
  return Response.json(result, { status: result.created ? 201 : 200 });
});
