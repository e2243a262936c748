import { BODY_LIMITS, readBody, route } from "@/lib/http";
import { requireProofRole } from "@/lib/session";
import { attachClaims, awaitVerdicts, storeClaims } from "@/lib/data/claim-attach";
import { listStepClaims, listWithdrawnClaims } from "@/lib/data/claim-lists";
import { stepInProof } from "@/lib/data/steps";
import { verificationNotice } from "@/lib/data/claim-jobs";
import { attachClaimsSchema } from "@/lib/validations/claim";
import { routeIds } from "@/app/api/proofs/[proofId]/route-ids";
import { requireStepAccess } from "@/lib/access";

type Context = { params: Promise<{ proofId: string; stepId: string }> };

/**
 * The step's claims with their verdicts (poll this while any is `pending`), its withdrawn claims, and,
 * while a claim is pending, whether verification runs (`verification.paused` with a message); any member.
 */
export const GET = route(async (_request: Request, { params }: Context) => {
  const { proofId, stepId } = await routeIds(params);
  await requireStepAccess(proofId, stepId); // a reviewer of chosen cases sees only those
  await stepInProof(proofId, stepId);
  const claims = await listStepClaims(stepId);
  return Response.json({ claims, withdrawn: await listWithdrawnClaims(stepId), verification: await verificationNotice(claims) });
});

/**
 * Attaches one or more "cairn-claim/1" claims to the step; authors only. Input that cannot be read
 * is a 422 naming the field (e.g. `claims.0.graph.text`) and nothing is saved; otherwise the claims
 * are stored `pending` and verified as jobs by the worker processes (202). With `?wait=SECONDS` (at most 60) the
 * answer waits that long for the verdicts: 200 when all are in, else 202 with those still pending.
 */
export const POST = route(async (request: Request, { params }: Context) => {
  const { proofId, stepId } = await routeIds(params);
  const { user } = await requireProofRole(proofId, "author");
  const input = await readBody(request, attachClaimsSchema, BODY_LIMITS.claims);
  const wait = Math.min(Number(new URL(request.url).searchParams.get("wait")) || 0, 60);
  if (wait <= 0) return Response.json({ claims: await attachClaims(proofId, stepId, user.id, input.claims) }, { status: 202 });
  const ids = await storeClaims(proofId, stepId, user.id, input.claims);
  const settled = await awaitVerdicts(stepId, ids, wait * 1000);
  return Response.json({ claims: settled }, { status: settled.some((c) => c.status === "pending") ? 202 : 200 });
});
