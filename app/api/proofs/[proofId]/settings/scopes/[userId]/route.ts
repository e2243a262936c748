import { idParam, readBody, route } from "@/lib/http";
import { requireProofRole } from "@/lib/session";
import { setReviewerCases, shareWholeProof } from "@/lib/data/invitations";
import { assertCanManageReviewers } from "@/lib/access";
import { reviewerScopeSchema } from "@/lib/validations/membership";

type Context = { params: Promise<{ proofId: string; userId: string }> };

/** Both verbs: the proof and reviewer from the path, signed in (401), a member (404) who may manage reviewers (403). */
async function managedReviewer(params: Context["params"]) {
  const p = await params;
  const proofId = idParam(p.proofId, "This proof");
  const reviewerId = idParam(p.userId, "This reviewer");
  const { user, role } = await requireProofRole(proofId);
  await assertCanManageReviewers(proofId, user, role);
  return { proofId, reviewerId, user };
}

/** Removes a reviewer's case limits: the editor shares the whole proof with them. */
export const DELETE = route(async (_request: Request, { params }: Context) => {
  const { proofId, reviewerId, user } = await managedReviewer(params);
  await shareWholeProof(proofId, reviewerId, user.id);
  return Response.json({ scope: "whole proof" });
});

/** The editor changes which cases a reviewer reviews (422 for an empty list or a case of another proof). */
export const PUT = route(async (request: Request, { params }: Context) => {
  const { proofId, reviewerId, user } = await managedReviewer(params);
  const input = await readBody(request, reviewerScopeSchema);
  return Response.json(await setReviewerCases(proofId, reviewerId, user.id, input.caseIds));
});
