import { route } from "@/lib/http";
import { AppError, invalid } from "@/lib/errors";
import { requireStepAccess } from "@/lib/access";
import { attachClaims } from "@/lib/data/claim-attach";
import { loadStepFile, readStoredFile } from "@/lib/data/files";
import { asText } from "@/lib/uploads/detect";
import { claimsFromDocument } from "@/lib/validations/claim";
import { routeIds } from "@/app/api/proofs/[proofId]/route-ids";

type Context = { params: Promise<{ proofId: string; fileId: string }> };

/**
 * Attaches the claims of an uploaded claims file to the file's step, read from the stored bytes (the same document the
 * offline checker reads): as attaching them pasted, all or nothing, 422 naming the claim and field of any problem.
 * Authors and the owner. 422 when the file is not a claims file. 202 with the claims, pending until checked.
 */
export const POST = route(async (_request: Request, { params }: Context) => {
  const { proofId, fileId } = await routeIds(params);
  const file = await loadStepFile(proofId, fileId);
  const { user } = await requireStepAccess(proofId, file.stepId, "files.upload");
  if (file.kind !== "claims")
    throw invalid(`“${file.name}” is a ${file.description}, not a claims file: only a claims file's claims can be attached.`, [
      { path: "fileId", message: "a claims file (cairn-claims/1)" },
    ]);
  const bytes = await readStoredFile(file.sha256);
  if (!bytes) throw new AppError("unavailable", "The file's bytes are missing from the file store; ask the site's administrator to restore it.");
  const read = claimsFromDocument(asText(bytes) ?? "");
  if ("problem" in read) throw invalid(read.problem, [{ path: "fileId", message: read.problem }]);
  return Response.json({ claims: await attachClaims(proofId, file.stepId, user.id, read.claims) }, { status: 202 });
});
