import { idParam, BODY_LIMITS, readBody, route } from "@/lib/http";
import { requireProofRole } from "@/lib/session";
import { createExport, getCertification, listExports } from "@/lib/data/exports";
import { createExportSchema } from "@/lib/validations/export";
import { assertSeesWholeProof } from "@/lib/access";

type Context = { params: Promise<{ proofId: string }> };

/** The proof's exports, newest first, and whether it can be certified now (with the reasons if not); members who see the whole proof. */
export const GET = route(async (_request: Request, { params }: Context) => {
  const proofId = idParam((await params).proofId, "This proof");
  const { user } = await requireProofRole(proofId);
  await assertSeesWholeProof(proofId, user.id);
  const [exports, certification] = await Promise.all([listExports(proofId), getCertification(proofId)]);
  return Response.json({ exports, certification });
});

/** Makes a certified or draft export; authors and editors. 409 with the reasons when certification is refused. */
export const POST = route(async (request: Request, { params }: Context) => {
  const proofId = idParam((await params).proofId, "This proof");
  const { user } = await requireProofRole(proofId, "author", "editor");
  const { kind } = await readBody(request, createExportSchema, BODY_LIMITS.small);
  const created = await createExport(proofId, user, kind);
  return Response.json({ export: created }, { status: 201, headers: { location: `/api/proofs/${proofId}/exports/${created.id}` } });
});
