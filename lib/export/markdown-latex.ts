/**
 * A small Markdown → LaTeX writer for steps, statements and conditions: paragraphs, emphasis, code,
 * lists, quotes, headings and links, with $…$ and $$…$$ math passed through sanitizeMath. Everything
 * that is not math is escaped; math that fails the check is printed verbatim. It covers the Markdown
 * that proofs use, not every corner of CommonMark; what it does not know comes out as escaped text.
 */
import { escapeText, sanitizeMath, stripControl } from "./latex-escape";

const HOLD = "\u0000";

/** Replaces protected pieces by placeholders \u0000n\u0000 and restores them after escaping. */
class Holder {
  private pieces: string[] = [];
  hold(latex: string): string {
    this.pieces.push(latex);
    return `${HOLD}${this.pieces.length - 1}${HOLD}`;
  }
  restore(s: string): string {
    // Restored pieces may contain placeholders of their own (emphasis around math): repeat until stable.
    let prev: string;
    do {
      prev = s;
      s = s.replace(/\u0000(\d+)\u0000/g, (_, n) => this.pieces[Number(n)] ?? "");
    } while (s !== prev);
    return s;
  }
}

function verbatim(s: string): string {
  return `\\texttt{${escapeText(s)}}`;
}

export function mathInline(src: string, raw: string): string {
  const m = sanitizeMath(src);
  return m === null ? verbatim(raw) : `$${m}$`;
}

export function mathDisplay(src: string, raw: string): string {
  const m = sanitizeMath(src);
  return m === null ? `\n\n\\noindent${verbatim(raw)}\n\n` : `\\[${m}\\]`;
}

/** Finds the closing `$` of inline math starting after `from`, skipping escaped dollars. */
function closingDollar(s: string, from: string | number, double: boolean): number {
  let i = Number(from);
  while (i < s.length) {
    if (s[i] === "\\") { i += 2; continue; }
    if (s[i] === "$" && (!double || s[i + 1] === "$")) return i;
    i++;
  }
  return -1;
}

/** Inline Markdown of one paragraph or list item → LaTeX. */
export function inlineToLatex(text: string): string {
  const h = new Holder();
  let s = "";
  let i = 0;
  // Pass 1: code spans, math and backslash escapes become placeholders, in reading order.
  while (i < text.length) {
    const ch = text[i];
    if (ch === "`") {
      const ticks = /^`+/.exec(text.slice(i))![0];
      const end = text.indexOf(ticks, i + ticks.length);
      if (end > 0) {
        s += h.hold(verbatim(text.slice(i + ticks.length, end).trim()));
        i = end + ticks.length;
        continue;
      }
    }
    if (ch === "$") {
      const double = text[i + 1] === "$";
      const start = i + (double ? 2 : 1);
      const end = closingDollar(text, start, double);
      if (end > start) {
        const raw = text.slice(i, end + (double ? 2 : 1));
        s += h.hold(double ? mathDisplay(text.slice(start, end), raw) : mathInline(text.slice(start, end), raw));
        i = end + (double ? 2 : 1);
        continue;
      }
    }
    if (ch === "\\" && i + 1 < text.length && /[!-/:-@[-`{-~]/.test(text[i + 1])) {
      s += h.hold(escapeText(text[i + 1]));
      i += 2;
      continue;
    }
    s += ch;
    i++;
  }
  // Pass 2: links, strong and emphasis on what is left; their contents are escaped recursively.
  const emph = (t: string): string =>
    t.replace(
      /\[([^\]\u0000]*)\]\(([^)\s]*)\)|\*\*([\s\S]+?)\*\*|__([\s\S]+?)__|\*([^*\s](?:[^*]*[^*\s])?)\*|(?<![A-Za-z0-9])_([^_\s](?:[^_]*[^_\s])?)_(?![A-Za-z0-9])/g,
      (_m, linkText, url, strong1, strong2, em1, em2) => {
        if (linkText !== undefined) return h.hold(`${emph(linkText)} (${verbatim(url)})`);
        if (strong1 !== undefined || strong2 !== undefined) return h.hold(`\\textbf{${emph(strong1 ?? strong2)}}`);
        return h.hold(`\\emph{${emph(em1 ?? em2)}}`);
      },
    )
      .split(/(\u0000\d+\u0000)/)
      .map((part) => (part.startsWith(HOLD) ? part : escapeText(part)))
      .join("");
  return h.restore(emph(s));
}

type Block =
  | { type: "para"; text: string }
  | { type: "display"; src: string; raw: string }
  | { type: "code"; lines: string[] }
  | { type: "heading"; text: string }
  | { type: "list"; ordered: boolean; items: string[] }
  | { type: "quote"; text: string };

function blocksOf(md: string): Block[] {
  const lines = stripControl(md.replace(/\r\n?/g, "\n")).split("\n");
  const blocks: Block[] = [];
  let para: string[] = [];
  const flush = () => {
    if (para.length) blocks.push({ type: "para", text: para.join("\n") });
    para = [];
  };
  for (let i = 0; i < lines.length; i++) {
    const line = lines[i];
    const t = line.trim();
    if (t === "") { flush(); continue; }
    if (/^(```|~~~)/.test(t)) {
      flush();
      const fence = t.slice(0, 3);
      const code: string[] = [];
      for (i++; i < lines.length && !lines[i].trim().startsWith(fence); i++) code.push(lines[i]);
      blocks.push({ type: "code", lines: code });
      continue;
    }
    if (t.startsWith("$$") && (t === "$$" || !t.slice(2).includes("$$"))) {
      flush();
      const body: string[] = [t.slice(2)];
      let j = i + 1;
      for (; j < lines.length && !lines[j].includes("$$"); j++) body.push(lines[j]);
      if (j < lines.length) {
        const last = lines[j];
        body.push(last.slice(0, last.indexOf("$$")));
        const src = body.join("\n");
        blocks.push({ type: "display", src, raw: `$$${src}$$` });
        const after = last.slice(last.indexOf("$$") + 2).trim();
        if (after) para.push(after);
        i = j;
        continue;
      }
    }
    const heading = /^#{1,6}\s+(.*)$/.exec(t);
    if (heading) { flush(); blocks.push({ type: "heading", text: heading[1] }); continue; }
    const item = /^([-*+]|\d{1,9}[.)])\s+(.*)$/.exec(t);
    if (item) {
      flush();
      const ordered = /\d/.test(item[1]);
      const prev = blocks[blocks.length - 1];
      if (prev?.type === "list" && prev.ordered === ordered && lines[i - 1]?.trim() !== "") prev.items.push(item[2]);
      else blocks.push({ type: "list", ordered, items: [item[2]] });
      continue;
    }
    const prev = blocks[blocks.length - 1];
    if (t.startsWith(">")) {
      flush();
      if (prev?.type === "quote" && lines[i - 1]?.trim().startsWith(">")) prev.text += "\n" + t.replace(/^>\s?/, "");
      else blocks.push({ type: "quote", text: t.replace(/^>\s?/, "") });
      continue;
    }
    if (para.length === 0 && prev?.type === "list" && /^\s{2,}/.test(line) && lines[i - 1]?.trim() !== "") {
      prev.items[prev.items.length - 1] += " " + t;
      continue;
    }
    para.push(line);
  }
  flush();
  return blocks;
}

/** Markdown with math → LaTeX body text. */
export function markdownToLatex(md: string): string {
  return blocksOf(md)
    .map((b) => {
      switch (b.type) {
        case "para": return inlineToLatex(b.text);
        case "display": return mathDisplay(b.src, b.raw);
        case "code": return `\\begin{quote}\\ttfamily\\raggedright\n${b.lines.map((l) => escapeText(l) || "~").join("\\\\\n")}\n\\end{quote}`;
        case "heading": return `\\par\\noindent\\textbf{${inlineToLatex(b.text)}}\\par`;
        case "list": {
          const env = b.ordered ? "enumerate" : "itemize";
          return `\\begin{${env}}\n${b.items.map((it) => `\\item ${inlineToLatex(it)}`).join("\n")}\n\\end{${env}}`;
        }
        case "quote": return `\\begin{quote}\n${markdownToLatex(b.text)}\n\\end{quote}`;
      }
    })
    .join("\n\n");
}
