import { route } from "@/lib/http";
import { memberExport, type ExportContext } from "./member-export";

/** One export's record (kind, manifest digest, who and when) without its files; any member. */
export const GET = route(async (_request: Request, context: ExportContext) => {
  const { bundle: _bundle, bundleText: _text, tex: _tex, ...summary } = await memberExport(context);
  return Response.json({ export: summary });
});
