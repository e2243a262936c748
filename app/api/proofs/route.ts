import { route } from "@/lib/http";
import { requireUser } from "@/lib/session";
import { listProofsForUser } from "@/lib/data/proofs";

/** The proofs the signed-in user belongs to, with their role in each. */
export const GET = route(async () => {
  const user = await requireUser();
  return Response.json({ proofs: await listProofsForUser(user.id) });
});
