/**
 * One .zip with everything a reader needs to re-check an export offline: the bundle, the offline
 * checker (Node.js only), the LaTeX source, the PDF when the server could make it, and a README that
 * says how to run the check, what its answer means and what it does not cover. Built with fflate.
 */
import { strToU8, zipSync, type Zippable } from "fflate";

export interface ArchiveParts {
  proofTitle: string;
  kind: string;
  exportId: number;
  manifestDigest: string;
  exportedAt: string;
  bundleText: string;
  tex: string;
  checker: string;
  /** The compiled PDF, or why there is none. */
  pdf: Uint8Array | { missing: string };
}

export function readmeText(p: Omit<ArchiveParts, "bundleText" | "tex" | "checker">): string {
  const pdfLine =
    p.pdf instanceof Uint8Array ? "  proof.pdf         the same document, compiled by pdflatex on the server" : `  (no proof.pdf: ${p.pdf.missing})`;
  return (
    [
      `Cairn export #${p.exportId} (${p.kind}) of “${p.proofTitle}”, made ${p.exportedAt}`,
      `Manifest digest (SHA-256): ${p.manifestDigest}`,
      "",
      "Files",
      "  bundle.json       the certificate bundle (cairn-bundle/1): every case, step, claim and certificate",
      "  cairn-check.mjs   the offline checker, one file, needs only Node.js 20 or later",
      "  proof.tex         the document in LaTeX",
      pdfLine,
      "",
      "Re-check",
      "  node cairn-check.mjs bundle.json",
      "The checker recomputes every item's SHA-256 and the manifest digest, then re-does every claim's",
      "computation in exact arithmetic and re-checks its certificate. It exits with 0 only when everything",
      "matches and every claim is verified; cite the manifest digest above to name exactly this export.",
      "",
      "What a verified claim means",
      "  The stated computation was redone exactly on the stated input. It does not say that the case split",
      "  is exhaustive or that the prose argument is right: that stays with the authors and the referees.",
      p.kind === "certified" ? "" : "\nThis is a DRAFT export: it was made while the proof was not ready to certify.",
    ]
      .join("\n")
      .trimEnd() + "\n"
  );
}

/** The zip archive's bytes. */
export function buildArchive(p: ArchiveParts): Uint8Array {
  const files: Zippable = {
    "README.txt": strToU8(readmeText(p)),
    "bundle.json": strToU8(p.bundleText),
    "cairn-check.mjs": strToU8(p.checker),
    "proof.tex": strToU8(p.tex),
  };
  if (p.pdf instanceof Uint8Array) files["proof.pdf"] = [p.pdf, { level: 0 }];
  const folder = `cairn-export-${p.exportId}`;
  return zipSync({ [folder]: files }, { level: 6, mtime: new Date(p.exportedAt) });
}
