import { idParam, readBody, route } from "@/lib/http";
import { requireProofRole } from "@/lib/session";
import { getProofSummary } from "@/lib/data/proofs";
import { updateProof } from "@/lib/data/proof-drafts";
import { notFound } from "@/lib/errors";
import { updateProofSchema } from "@/lib/validations/proof";

type Context = { params: Promise<{ proofId: string }> };

/** One proof's summary and members; any member may read it. */
export const GET = route(async (_request: Request, { params }: Context) => {
  const proofId = idParam((await params).proofId, "This proof");
  const { user, role } = await requireProofRole(proofId);
  const proof = await getProofSummary(proofId, { id: user.id, role });
  if (!proof) throw notFound("This proof");
  return Response.json({ proof, role });
});

/** Edits the title or statement; authors only. */
export const PATCH = route(async (request: Request, { params }: Context) => {
  const proofId = idParam((await params).proofId, "This proof");
  const { user } = await requireProofRole(proofId, "author");
  const input = await readBody(request, updateProofSchema);
  await updateProof(proofId, user.id, input);
  return Response.json({ proof: await getProofSummary(proofId, { id: user.id, role: "author" }) });
});
