import { route } from "@/lib/http";
import { AppError } from "@/lib/errors";
import { download, exportFileName } from "@/lib/export/files";
import { cachedPdf, PdfFailedError, PdfUnavailableError } from "@/lib/export/pdf";
import { memberExport, type ExportContext } from "../member-export";

/** The export as PDF, compiled from its LaTeX source with pdflatex on the server (once, then cached); 503 with what to do when pdflatex is missing. */
export const GET = route(async (_request: Request, context: ExportContext) => {
  const e = await memberExport(context);
  try {
    // Two runs: the long table of vouches settles its column widths on the second. Compiled once per export, then kept.
    const { pdf } = await cachedPdf(e.tex, { runs: 2 });
    return download(new Uint8Array(pdf), "application/pdf", exportFileName(e.proofId, e.id, e.kind, "pdf"));
  } catch (err) {
    if (err instanceof PdfUnavailableError) throw new AppError("unavailable", err.message);
    if (err instanceof PdfFailedError) {
      console.error(
        "[cairn] pdflatex failed on export",
        e.id,
        err.log
          .split("\n")
          .filter((l) => l.startsWith("!") || /:\d+: /.test(l))
          .slice(0, 10)
          .join("\n"),
      );
      throw new AppError(
        "unavailable",
        "The PDF could not be made on the server this time. Download the .tex source or print the print view instead; the failure was logged.",
      );
    }
    throw err;
  }
});
