/**
 * The last line of defence of the PDF: the math check (sanitizeMath) stops what could escape or
 * read files, but it is not a TeX parser, and a formula can still be valid-looking and not compile
 * (a double superscript, \limits after a letter, a matrix of 11 columns…). One such formula must not
 * take the whole document down, so when pdflatex fails, the formulas on the lines it names are set
 * as their source in typewriter type with a visible mark, and the document is compiled again.
 * Every formula of an export sits on one line (line breaks inside math become spaces), so the line
 * of an error finds it. Pure string work; the compile loop is in pdf.ts (compileLatexRobustly).
 */
import { escapeText } from "./latex-escape";

export const NOT_TYPESET_MARK = "\\fbox{\\scriptsize formula shown as source: it did not compile}";

interface MathSpan {
  start: number;
  end: number; // exclusive
  display: boolean;
  body: string;
}

/** The $…$ and \[…\] spans of one line of the generated LaTeX (escaped \$ and \\ are skipped). */
export function mathSpans(line: string): MathSpan[] {
  const spans: MathSpan[] = [];
  let open: { at: number; display: boolean } | null = null;
  for (let i = 0; i < line.length; i++) {
    const ch = line[i];
    if (ch === "\\") {
      const next = line[i + 1];
      if (!open && next === "[") open = { at: i, display: true };
      else if (open?.display && next === "]") {
        spans.push({ start: open.at, end: i + 2, display: true, body: line.slice(open.at + 2, i) });
        open = null;
      }
      i++; // a control symbol or the first letter of a control word: never a delimiter
      continue;
    }
    if (ch === "%" && !open) break; // a comment to the end of the line
    if (ch !== "$") continue;
    if (!open) open = { at: i, display: false };
    else if (!open.display) {
      spans.push({ start: open.at, end: i + 1, display: false, body: line.slice(open.at + 1, i) });
      open = null;
    }
  }
  return spans;
}

const asSource = (span: MathSpan) => {
  const shown = `\\texttt{${escapeText(span.body.trim())}}~${NOT_TYPESET_MARK}`;
  return span.display ? `\\par\\noindent ${shown}\\par ` : shown;
};

function replaceSpans(line: string): string {
  const spans = mathSpans(line);
  let out = "";
  let at = 0;
  for (const s of spans) {
    out += line.slice(at, s.start) + asSource(s);
    at = s.end;
  }
  return out + line.slice(at);
}

/**
 * The document with the formulas of line `line` (1-based) set as source, or of every line of the body
 * when `line` is "all". Null when there is nothing left to replace (the fault is not in a formula).
 */
export function setMathAsSource(tex: string, line: number | "all"): string | null {
  const lines = tex.split("\n");
  const bodyStart = lines.findIndex((l) => l.startsWith("\\begin{document}")) + 1;
  const targets = line === "all" ? lines.map((_, k) => k).filter((k) => k >= bodyStart) : [line - 1];
  let changed = false;
  for (const k of targets) {
    if (k < bodyStart || k >= lines.length || mathSpans(lines[k]).length === 0) continue;
    lines[k] = replaceSpans(lines[k]);
    changed = true;
  }
  return changed ? lines.join("\n") : null;
}

/** The lines pdflatex names in its errors (`-file-line-error` form `./proof.tex:123: …`), each once. */
export function failingLines(log: string): number[] {
  return [...new Set([...log.matchAll(/^\.\/proof\.tex:(\d+): /gm)].map((m) => Number(m[1])))];
}
