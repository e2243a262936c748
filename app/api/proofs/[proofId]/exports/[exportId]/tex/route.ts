import { route } from "@/lib/http";
import { download, exportFileName } from "@/lib/export/files";
import { memberExport, type ExportContext } from "../member-export";

/** The LaTeX source of the export; any member. */
export const GET = route(async (_request: Request, context: ExportContext) => {
  const e = await memberExport(context);
  return download(e.tex, "application/x-tex; charset=utf-8", exportFileName(e.proofId, e.id, e.kind, "tex"));
});
