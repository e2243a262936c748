import { route } from "@/lib/http";
import { AppError } from "@/lib/errors";
import { download, exportFileName } from "@/lib/export/files";
import { buildArchive } from "@/lib/export/archive";
import { checkerScript, CheckerUnavailableError } from "@/lib/export/checker-script";
import { cachedPdf, PdfFailedError, PdfUnavailableError } from "@/lib/export/pdf";
import { memberExport, type ExportContext } from "../member-export";

/**
 * Everything to re-check this export offline in one .zip: bundle, checker, LaTeX, the PDF when the
 * server can make it, and a README with the command and the manifest digest; any member.
 */
export const GET = route(async (_request: Request, context: ExportContext) => {
  const e = await memberExport(context);
  let checker: string;
  try {
    checker = await checkerScript();
  } catch (err) {
    if (err instanceof CheckerUnavailableError) throw new AppError("unavailable", err.message);
    throw err;
  }
  let pdf: Uint8Array | { missing: string };
  try {
    pdf = new Uint8Array((await cachedPdf(e.tex, { runs: 2 })).pdf);
  } catch (err) {
    if (!(err instanceof PdfUnavailableError || err instanceof PdfFailedError)) throw err;
    pdf = {
      missing:
        err instanceof PdfUnavailableError
          ? "pdflatex is not installed on the server; compile proof.tex yourself"
          : "pdflatex could not compile it on the server; compile proof.tex yourself",
    };
  }
  const proofItem = e.bundle.items.find((i) => i.type === "proof")?.data as { title?: string } | undefined;
  const zip = buildArchive({
    proofTitle: proofItem?.title ?? `proof ${e.proofId}`,
    kind: e.kind,
    exportId: e.id,
    manifestDigest: e.manifestDigest,
    exportedAt: e.createdAt,
    bundleText: e.bundleText,
    tex: e.tex,
    checker,
    pdf,
  });
  return download(new Uint8Array(zip), "application/zip", exportFileName(e.proofId, e.id, e.kind, "zip"));
});
