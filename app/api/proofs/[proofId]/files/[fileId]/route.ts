import { route } from "@/lib/http";
import { AppError } from "@/lib/errors";
import { proofAccess, seesCase } from "@/lib/access";
import { forbidden } from "@/lib/errors";
import { loadStepFile, readStoredFile } from "@/lib/data/files";
import { loadStep } from "@/lib/data/reviews";
import { routeIds } from "@/app/api/proofs/[proofId]/route-ids";

type Context = { params: Promise<{ proofId: string; fileId: string }> };

/**
 * Downloads an uploaded file, as it was uploaded (gzip stays gzip): members of the proof only, and a
 * reviewer invited to chosen cases only for steps in those cases. Always as an attachment, with the
 * type decided from its content, so a browser never runs an uploaded file as a page.
 */
export const GET = route(async (_request: Request, { params }: Context) => {
  const { proofId, fileId } = await routeIds(params);
  const access = await proofAccess(proofId);
  const file = await loadStepFile(proofId, fileId);
  const step = await loadStep(proofId, file.stepId);
  if (!seesCase(access, step.caseId)) throw forbidden("This file belongs to a step in a case you were not asked to review.");
  const bytes = await readStoredFile(file.sha256);
  if (!bytes) throw new AppError("unavailable", "The file's bytes are missing from the file store; ask the site's administrator to restore it.");
  return new Response(Buffer.from(bytes), {
    headers: {
      "content-type": file.mediaType,
      "content-length": String(bytes.byteLength),
      "content-disposition": `attachment; filename="${file.name.replace(/[^\x20-\x7e]/g, "_")}"; filename*=UTF-8''${encodeURIComponent(file.name)}`,
      "x-content-type-options": "nosniff",
      "cache-control": "private, max-age=0",
      etag: `"${file.sha256}"`,
    },
  });
});
