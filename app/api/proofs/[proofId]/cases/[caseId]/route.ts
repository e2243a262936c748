import { BODY_LIMITS, readBody, route } from "@/lib/http";
import { requireProofRole } from "@/lib/session";
import { deleteCase, updateCase } from "@/lib/data/case-edits";
import { deleteCaseSchema, updateCaseSchema } from "@/lib/validations/case";
import { routeIds } from "@/app/api/proofs/[proofId]/route-ids";

type Context = { params: Promise<{ proofId: string; caseId: string }> };

/**
 * Edits a case's title or condition, moves it up or down, or moves it under another case; authors
 * only. Moving a case that holds steps or reviews answers 409 `needsConfirmation` unless `confirm`.
 */
export const PATCH = route(async (request: Request, { params }: Context) => {
  const { proofId, caseId } = await routeIds(params);
  const { user } = await requireProofRole(proofId, "author");
  const input = await readBody(request, updateCaseSchema, BODY_LIMITS.small);
  await updateCase(proofId, caseId, user.id, input);
  return Response.json({ ok: true });
});

/** Deletes a case softly (history kept); 409 `needsConfirmation` when it holds steps or reviews, unless `confirm`. */
export const DELETE = route(async (request: Request, { params }: Context) => {
  const { proofId, caseId } = await routeIds(params);
  const { user } = await requireProofRole(proofId, "author");
  // `{ "confirm": true }` as a JSON body, or `?confirm=true` for a request without one.
  const input = request.headers.get("content-type")?.includes("json")
    ? await readBody(request, deleteCaseSchema, BODY_LIMITS.small)
    : { confirm: new URL(request.url).searchParams.get("confirm") === "true" };
  await deleteCase(proofId, caseId, user.id, input.confirm === true);
  return Response.json({ ok: true });
});
