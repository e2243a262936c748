import { idParam, route } from "@/lib/http";
import { requireProofRole } from "@/lib/session";
import { getProofSummary } from "@/lib/data/proofs";
import { notFound } from "@/lib/errors";

type Context = { params: Promise<{ proofId: string }> };

/** One proof's summary and members; any member may read it. */
export const GET = route(async (_request: Request, { params }: Context) => {
  const proofId = idParam((await params).proofId, "This proof");
  const { role } = await requireProofRole(proofId);
  const proof = await getProofSummary(proofId);
  if (!proof) throw notFound("This proof");
  return Response.json({ proof, role });
});
