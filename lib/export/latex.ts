/**
 * The LaTeX source of an exported proof. Standard packages only (amsmath, amssymb, hyperref, fancyhdr,
 * geometry, longtable, lmodern), so it compiles with Debian's texlive-latex-base/recommended. Every user
 * string goes through latex-escape.ts or markdown-latex.ts; a draft carries "DRAFT" in the header of
 * every page (the plain page style is redefined too, so no page escapes it).
 */
import {
  CAUTION_DOES_NOT,
  CAUTION_MEANS,
  recommendationWords,
  type DocCase,
  type DocClaim,
  type DocRound,
  type DocStep,
  type ExportDocument,
} from "./document";
import { escapeLine, escapeText } from "./latex-escape";
import { markdownToLatex } from "./markdown-latex";
import { claimInputsAppendixTex } from "./latex-inputs";
import { stepLabel } from "@/lib/proof-tree";

/** "2026-12-01T22:58:11.000Z" → "2026-12-01 22:58 UTC". */
export function formatUtc(iso: string): string {
  const d = new Date(iso);
  if (Number.isNaN(d.getTime())) return iso;
  return `${d.toISOString().slice(0, 10)} ${d.toISOString().slice(11, 16)} UTC`;
}

/** A hex digest in groups of eight that may break between groups. */
function digestTex(hex: string): string {
  const safe = hex.replace(/[^0-9a-f]/gi, "");
  return `\\texttt{${(safe.match(/.{1,8}/g) ?? []).join("\\allowbreak\\,")}}`;
}

const SECTION = ["section", "subsection", "subsubsection", "paragraph"];

function claimTex(c: DocClaim): string {
  const what = `${escapeLine(c.statement || "(no statement recorded)")}`;
  const method = c.method ? `, by ${escapeLine(c.method)}${c.certificateKind ? ` (certificate: ${escapeLine(c.certificateKind)})` : ""}` : "";
  const digest = c.digest ? `; claim digest ${digestTex(c.digest)}` : "";
  const reason = c.reason && c.status !== "verified" ? `: ${escapeLine(c.reason)}` : "";
  const label = { verified: "$\\checkmark$ Verified", refuted: "$\\times$ Refuted", undecided: "? Undecided" }[c.status] ?? "$\\circ$ Not checked yet";
  const cert = c.status === "verified" ? `; certificate in bundle item \\texttt{${escapeLine(c.id)}} (SHA-256 ${digestTex(c.itemDigest)})` : "";
  const inputs = c.inputs.short
    ? `; inputs ${escapeLine(c.inputs.short.length > 160 ? `${c.inputs.short.slice(0, 160)}…` : c.inputs.short)} (in full in the appendix of claim inputs)`
    : "";
  return `\\item \\textbf{${label}:} ${what}${method}${reason}${cert}${digest}${inputs}.`;
}

function stepTex(s: DocStep, caseNumber: string): string {
  const rev = s.revision;
  const head =
    `\\paragraph{Step ${escapeLine(stepLabel(caseNumber, s.position))}}` +
    (rev ? ` {\\small(revision ${rev.number}, by ${escapeLine(rev.authorName)}, ${escapeLine(formatUtc(rev.savedAt))})}` : " {\\small(no text saved)}");
  const body = rev ? markdownToLatex(rev.body) : "";
  const claims = s.claims.length ? `\n\n\\begin{itemize}\n${s.claims.map(claimTex).join("\n")}\n\\end{itemize}` : "";
  const disputes = s.openDisputes ? `\n\n\\noindent\\textit{${s.openDisputes} open dispute${s.openDisputes > 1 ? "s" : ""} on this step.}` : "";
  return `${head}\n${body}${claims}${disputes}`;
}

function caseTex(c: DocCase): string {
  const cmd = SECTION[Math.min(c.depth, SECTION.length - 1)];
  return [
    `\\${cmd}*{Case ${escapeLine(c.number)}: ${escapeLine(c.title)}}`,
    `\\noindent\\textit{Condition.} ${markdownToLatex(c.condition)}`,
    `\\noindent{\\small Case state: ${escapeLine(c.state)}.}`,
    ...c.steps.map((s) => stepTex(s, c.number)),
  ].join("\n\n");
}

function roundTex(r: DocRound): string {
  const when = `opened ${escapeLine(formatUtc(r.openedAt))}, due ${escapeLine(formatUtc(r.dueAt))}${r.closedAt ? `, closed ${escapeLine(formatUtc(r.closedAt))}` : ""}`;
  const decision = r.decision
    ? `\\noindent\\textbf{Decision: ${escapeLine(recommendationWords(r.decision.decision))}}, by ${escapeLine(r.decision.editor)}, ${escapeLine(formatUtc(r.decision.decidedAt))}.\\par\n\\noindent\\textit{Letter to the authors.} ${markdownToLatex(r.decision.letter)}`
    : "\\noindent\\textit{No decision yet.}";
  const reports = r.reports.length
    ? `\n\n\\begin{itemize}\n${r.reports.map((p) => `\\item ${escapeLine(p.referee)} (report version ${p.version}${p.submittedAt ? `, ${escapeLine(formatUtc(p.submittedAt))}` : ""}): recommends ${escapeLine(recommendationWords(p.recommendation))}.`).join("\n")}\n\\end{itemize}`
    : r.decision && !r.decision.reportsAttached
      ? "\n\n\\noindent{\\small The referees' reports were not attached to this decision.}"
      : "";
  return `\\subsection*{Round ${r.number}}\n\\noindent{\\small ${when}.}\\par\n${decision}${reports}`;
}

/** The review rounds with their decisions; referees as the authors see them ("Referee k" on a blind proof). */
function roundsTex(doc: ExportDocument): string {
  if (doc.rounds.length === 0) return "";
  return ["\\section*{Review rounds and decisions}", ...doc.rounds.map(roundTex)].join("\n\n");
}

function appendixTex(doc: ExportDocument): string {
  const rows = doc.cases.flatMap((c) =>
    c.steps.flatMap((s) =>
      s.vouches.length
        ? s.vouches.map(
            (a) =>
              `${escapeLine(stepLabel(c.number, s.position))} & ${escapeLine(a.reviewer)} & ${a.revision}${s.revision && a.revision !== s.revision.number ? " (superseded)" : ""} & ${escapeLine(formatUtc(a.at))} \\\\`,
          )
        : [`${escapeLine(stepLabel(c.number, s.position))} & \\textit{no vouch} & & \\\\`],
    ),
  );
  const members = doc.members.map((m) => `${escapeLine(m.name)} (${escapeLine(m.role)})`).join(", ");
  return [
    "\\section*{Appendix: reviewers and vouches}",
    `\\noindent Members of the proof: ${members || "none recorded"}. Each step needs ${doc.requiredApprovals} approval${doc.requiredApprovals > 1 ? "s" : ""} at its latest revision.`,
    "\\begin{longtable}{llll}",
    "\\textbf{Step} & \\textbf{Reviewer} & \\textbf{Vouched for revision} & \\textbf{Date} \\\\ \\hline \\endhead",
    ...rows,
    "\\end{longtable}",
  ].join("\n");
}

export function renderLatex(doc: ExportDocument): string {
  const draft = doc.kind === "draft";
  const mark = draft ? "\\textbf{DRAFT --- not certified}" : "Certified export";
  const header = [
    `\\fancyhead[L]{\\small ${escapeLine(doc.title.length > 60 ? doc.title.slice(0, 57) + "…" : doc.title)}}`,
    `\\fancyhead[R]{\\small ${mark}}`,
    `\\fancyfoot[L]{\\scriptsize manifest ${digestTex(doc.manifestDigest.slice(0, 16))}}`,
    `\\fancyfoot[C]{\\thepage}`,
    draft ? `\\fancyfoot[R]{\\small\\textbf{DRAFT}}` : `\\fancyfoot[R]{\\scriptsize ${escapeLine(doc.checkerVersion)}}`,
  ].join("\n");
  const pdfTitle = doc.title
    .replace(/[^A-Za-z0-9 ,.()-]/g, " ")
    .replace(/\s+/g, " ")
    .trim();
  return `% Exported by Cairn (${escapeLine(doc.checkerVersion)}). ${draft ? "DRAFT: not certified." : "Certified export."}
% Manifest digest of the certificate bundle: ${doc.manifestDigest}
\\documentclass[11pt,a4paper]{article}
\\usepackage[T1]{fontenc}
\\usepackage[utf8]{inputenc}
\\usepackage{lmodern}
\\usepackage{amsmath,amssymb}
\\usepackage[margin=2.4cm,headheight=15pt]{geometry}
\\usepackage{longtable}
\\usepackage{fancyhdr}
\\usepackage[hidelinks]{hyperref}
\\hypersetup{pdftitle={${pdfTitle}}, pdfcreator={Cairn}}
\\pagestyle{fancy}
\\fancyhf{}
${header}
\\fancypagestyle{plain}{\\fancyhf{}
${header}}
\\setlength{\\parindent}{0pt}
\\setlength{\\parskip}{0.6em}
\\setlength{\\emergencystretch}{3em}
\\begin{document}

{\\LARGE\\bfseries ${escapeLine(doc.title)}\\par}
\\vspace{0.5em}
{\\small ${draft ? "\\textbf{DRAFT export} (not certified)" : "\\textbf{Certified export}"} made ${escapeLine(formatUtc(doc.exportedAt))} by ${escapeLine(doc.exportedBy)}. Proof state at export: ${escapeLine(doc.proofState)}. Checker: ${escapeLine(doc.checkerVersion)}.\\\\
Manifest digest of the certificate bundle (SHA-256): ${digestTex(doc.manifestDigest)}\\par}
${draft ? "\n\\noindent\\fbox{\\parbox{0.95\\linewidth}{\\textbf{DRAFT.} This proof is not ready to certify: some case is not settled (a step without the required vouches, an open dispute, or a claim that is not verified). Do not cite it as certified.}}\n" : ""}
\\section*{What the verdicts mean}
${escapeText(CAUTION_MEANS)}
\\textbf{${escapeText(CAUTION_DOES_NOT)}}

To re-check this document's computations offline, run Cairn's checker on the bundle: \\texttt{node cairn-check.mjs bundle.json}. It re-verifies every certificate from scratch and recomputes every digest.

\\section*{Statement}
${markdownToLatex(doc.statement)}

${doc.cases.map(caseTex).join("\n\n")}

${roundsTex(doc)}

${appendixTex(doc)}

${claimInputsAppendixTex(doc, stepLabel)}

\\end{document}
`;
}
