import { readBody, route } from "@/lib/http";
import { requireUser } from "@/lib/session";
import { listProofsForUser } from "@/lib/data/proofs";
import { createProof } from "@/lib/data/proof-drafts";
import { createProofSchema } from "@/lib/validations/proof";

/** The proofs the signed-in user belongs to, with their role in each. */
export const GET = route(async () => {
  const user = await requireUser();
  return Response.json({ proofs: await listProofsForUser(user.id) });
});

/** Starts a proof; whoever creates it is its first author. */
export const POST = route(async (request: Request) => {
  const user = await requireUser();
  const input = await readBody(request, createProofSchema);
  const proof = await createProof(user.id, input);
  return Response.json({ proof }, { status: 201 });
});
