/** Shared by the handlers of one export: parse the ids (404), require membership (401/403), load the export (404). */
import { idParam } from "@/lib/http";
import { requireProofRole } from "@/lib/session";
import { getExport, type ExportFull } from "@/lib/data/exports";

export type ExportContext = { params: Promise<{ proofId: string; exportId: string }> };

export async function memberExport({ params }: ExportContext): Promise<ExportFull> {
  const p = await params;
  const proofId = idParam(p.proofId, "This proof");
  const exportId = idParam(p.exportId, "This export");
  await requireProofRole(proofId);
  return getExport(proofId, exportId);
}
