/**
 * The appendix of claim inputs in the LaTeX export: one subsection per claim with its inputs as the
 * display model of lib/core/claims/claim-display.ts gives them (the same model the claim card, the claims
 * table and the print view lay out). Every user string is escaped here; long codes may break anywhere.
 */
import type { GraphInputView, InputEntry } from "@/lib/core/claims/claim-display";
import type { DocClaim, ExportDocument } from "./document";
import { escapeLine } from "./latex-escape";

/** Text in a typewriter face that may break every few characters (graph6, vectors, edge lists). */
export function codeTex(text: string): string {
  const lines = text
    .split(/\r?\n/)
    .map((l) => l.trimEnd())
    .filter((l) => l.length > 0);
  const line = (l: string) => (l.match(/[\s\S]{1,8}/gu) ?? []).map(escapeLine).join("\\allowbreak{}");
  return lines.length ? `\\texttt{${lines.map(line).join("}\\newline\n\\texttt{")}}` : "\\textit{(empty)}";
}

function graphTex(g: GraphInputView, itemId: string): string {
  const parts: string[] = [];
  if (g.order !== null)
    parts.push(
      `order ${g.order}, size ${g.size}${g.loops ? `, ${g.loops} loop${g.loops > 1 ? "s" : ""}` : ""}; degree sequence ${escapeLine(g.degreeSequence ?? "")}`,
    );
  if (g.problem) parts.push(`\\textit{not read for display: ${escapeLine(g.problem)}}`);
  const lines = [`${parts.join(". ")}.`];
  if (g.entered !== null) lines.push(`As entered (${escapeLine(g.format)}):\\newline\n${codeTex(g.entered)}`);
  if (g.encoded !== null && !(g.format === g.encoding && g.entered?.trim() === g.encoded)) lines.push(`As ${g.encoding}:\\newline\n${codeTex(g.encoded)}`);
  if (g.large)
    lines.push(
      `\\textit{Large input (${g.enteredCharacters} characters as entered${g.encodedCharacters ? `, ${g.encodedCharacters} as ${g.encoding}` : ""}): shown as a summary; SHA-256 of the ${g.encoding ?? "text"} ${codeTex(g.digest)}. The full input is in bundle item ${codeTex(itemId)}.}`,
    );
  return lines.join("\\par\n");
}

function entryTex(e: InputEntry, itemId: string): string {
  const label = `\\item[${escapeLine(e.label)}]`;
  if (e.type === "text") return `${label} ${escapeLine(e.text)}`;
  if (e.type === "graph") return `${label} ${graphTex(e.graph, itemId)}`;
  if (e.entries) return `${label} ${e.count} entr${e.count === 1 ? "y" : "ies"}:\\newline\n${codeTex(e.entries.join(", "))}`;
  return `${label} \\textit{${e.count} entries, shown as a summary: SHA-256 of the entries (one per line) ${codeTex(e.digest)}. The full list is in bundle item ${codeTex(itemId)}.}`;
}

function claimInputsTex(c: DocClaim, where: string): string {
  const head = `\\subsection*{${escapeLine(`${where}, ${c.id.replace(/^claim /, "claim ")}`)}: ${escapeLine(c.statement || c.kind)}}`;
  const method =
    c.status === "pending"
      ? "Not checked yet."
      : `Decided ${escapeLine(c.status)} by ${escapeLine(c.method || "an unnamed method")}; certificate: ${c.certificateKind ? escapeLine(c.certificateKind) : "none (no decision to certify)"}.`;
  const problem = c.inputs.problem ? `\n\n\\textit{The stored input is not a readable claim: ${escapeLine(c.inputs.problem)}}` : "";
  const entries = c.inputs.entries.length ? `\n\\begin{description}\n${c.inputs.entries.map((e) => entryTex(e, c.id)).join("\n")}\n\\end{description}` : "";
  return `${head}\n{\\small Kind ${escapeLine(c.kind)}. ${method}}${problem}${entries}`;
}

/** "Appendix: claim inputs", one subsection per claim in reading order; empty when the proof has no claims. */
export function claimInputsAppendixTex(doc: ExportDocument, stepLabel: (caseNumber: string, position: number) => string): string {
  const blocks = doc.cases.flatMap((c) => c.steps.flatMap((s) => s.claims.map((cl) => claimInputsTex(cl, `Step ${stepLabel(c.number, s.position)}`))));
  if (blocks.length === 0) return "";
  return [
    "\\section*{Appendix: claim inputs}",
    "Each claim with its inputs as entered and as graph6 (sparse6 for loops or multiple edges), and the vector its certificate carries. Large inputs are summarised by order, size, degree sequence and SHA-256; the bundle holds them in full.",
    ...blocks,
  ].join("\n\n");
}
