import { route } from "@/lib/http";
import { download, exportFileName } from "@/lib/export/files";
import { memberExport, type ExportContext } from "../member-export";

/** The certificate bundle (cairn-bundle/1 JSON) exactly as it was exported; any member. */
export const GET = route(async (_request: Request, context: ExportContext) => {
  const e = await memberExport(context);
  return download(e.bundleText, "application/json; charset=utf-8", exportFileName(e.proofId, e.id, e.kind, "json"));
});
