/**
 * Shared by the handlers of one export: parse the ids (404), require membership (401/403), load the
 * export (404), and refuse a reviewer limited to chosen cases (403): an export shows every case.
 */
import { idParam } from "@/lib/http";
import { requireProofRole } from "@/lib/session";
import { getExport, type ExportFull } from "@/lib/data/exports";
import { assertSeesWholeProof } from "@/lib/access";

export type ExportContext = { params: Promise<{ proofId: string; exportId: string }> };

export async function memberExport({ params }: ExportContext): Promise<ExportFull> {
  const p = await params;
  const proofId = idParam(p.proofId, "This proof");
  const exportId = idParam(p.exportId, "This export");
  const { user } = await requireProofRole(proofId);
  const found = await getExport(proofId, exportId);
  await assertSeesWholeProof(proofId, user.id);
  return found;
}
