/**
 * Markdown with math → LaTeX, written from the same syntax tree the web pages render: remark-parse with
 * the page's remark plugins (GitHub-flavoured Markdown, $…$ and $$…$$ math, `$$…$$` within a line as
 * display math; lib/markdown.ts). A step therefore cannot say one thing on screen and another in the
 * PDF: both read one parse. Every text node is escaped; every formula goes through sanitizeMath and is
 * printed verbatim when it fails the check. What the web page drops (raw HTML, images) is dropped here
 * too; an image keeps its alternative text.
 */
import { unified } from "unified";
import remarkParse from "remark-parse";
import type { Root, RootContent, PhrasingContent, ListItem, Table } from "mdast";
import { remarkPlugins } from "@/lib/markdown";
import { escapeText, sanitizeMath, stripControl } from "./latex-escape";

const processor = unified().use(remarkParse).use(remarkPlugins);

function parse(md: string): Root {
  const source = stripControl(md.replace(/\r\n?/g, "\n"));
  return processor.runSync(processor.parse(source), source) as Root;
}

const verbatim = (s: string): string => `\\texttt{${escapeText(s.replace(/\n/g, " "))}}`;

function mathInline(src: string): string {
  const m = sanitizeMath(src);
  return m === null ? verbatim(`$${src}$`) : `$${m}$`;
}

function mathDisplay(src: string): string {
  const m = sanitizeMath(src);
  return m === null ? `\n\n\\noindent${verbatim(`$$${src}$$`)}\n\n` : `\\[${m}\\]`;
}

/** Whether remark-math's inline node was written `$$…$$` (display math within a line; lib/display-math.ts). */
const isDisplay = (node: { data?: { hProperties?: Record<string, unknown> } }): boolean => {
  const cls = node.data?.hProperties?.className;
  return Array.isArray(cls) && cls.includes("math-display");
};

function inline(nodes: readonly PhrasingContent[]): string {
  return nodes.map(phrasing).join("");
}

function phrasing(node: PhrasingContent): string {
  switch (node.type) {
    case "text":
      return escapeText(node.value);
    case "emphasis":
      return `\\emph{${inline(node.children)}}`;
    case "strong":
      return `\\textbf{${inline(node.children)}}`;
    case "delete":
      return `[struck: ${inline(node.children)}]`;
    case "inlineCode":
      return verbatim(node.value);
    case "break":
      return "\\newline\n";
    case "link":
      return `${inline(node.children)} (${verbatim(node.url)})`;
    case "linkReference":
      return inline(node.children);
    case "image":
    case "imageReference":
      return node.alt ? escapeText(node.alt) : "";
    case "footnoteReference":
      return `\\textsuperscript{${escapeText(node.label ?? node.identifier)}}`;
    case "html":
      return ""; // the web page skips raw HTML
    default: {
      const math = node as unknown as { type: string; value?: string };
      if (math.type === "inlineMath") return isDisplay(node as never) ? mathDisplay(math.value ?? "") : mathInline(math.value ?? "");
      return "";
    }
  }
}

function listItem(item: ListItem): string {
  const box = item.checked === true ? "\\ensuremath{\\boxtimes} " : item.checked === false ? "\\ensuremath{\\square} " : "";
  return `\\item ${box}${blocks(item.children).trim()}`;
}

function table(node: Table): string {
  const columns = Math.max(1, ...node.children.map((r) => r.children.length));
  const align = Array.from({ length: columns }, (_, i) => ({ left: "l", right: "r", center: "c" })[node.align?.[i] ?? "left"] ?? "l").join("");
  const rows = node.children.map((row, r) => {
    const cells = Array.from({ length: columns }, (_, i) => (row.children[i] ? inline(row.children[i].children) : ""));
    const line = `${cells.join(" & ")} \\\\`;
    return r === 0 ? `${line}\n\\hline` : line;
  });
  return `\\begin{center}\\begin{tabular}{${align}}\n${rows.join("\n")}\n\\end{tabular}\\end{center}`;
}

function block(node: RootContent): string {
  switch (node.type) {
    case "paragraph":
      return inline(node.children);
    case "heading":
      return `\\par\\noindent\\textbf{${inline(node.children)}}\\par`;
    case "thematicBreak":
      return "\\par\\noindent\\rule{\\linewidth}{0.4pt}\\par";
    case "blockquote":
      return `\\begin{quote}\n${blocks(node.children)}\n\\end{quote}`;
    case "list": {
      const env = node.ordered ? "enumerate" : "itemize";
      const start = node.ordered && node.start != null && node.start !== 1 ? `\\setcounter{enumi}{${node.start - 1}}\n` : "";
      return `\\begin{${env}}\n${start}${node.children.map(listItem).join("\n")}\n\\end{${env}}`;
    }
    case "code":
      return `\\begin{quote}\\ttfamily\\raggedright\n${node.value
        .split("\n")
        .map((l) => escapeText(l) || "~")
        .join("\\\\\n")}\n\\end{quote}`;
    case "table":
      return table(node);
    case "footnoteDefinition":
      return `\\par\\noindent\\textsuperscript{${escapeText(node.label ?? node.identifier)}} ${blocks(node.children)}`;
    case "html":
    case "definition":
      return "";
    default: {
      const math = node as unknown as { type: string; value?: string };
      if (math.type === "math") return mathDisplay(math.value ?? "");
      return "";
    }
  }
}

function blocks(nodes: readonly RootContent[]): string {
  return nodes
    .map(block)
    .filter((s) => s !== "")
    .join("\n\n");
}

/** Markdown with math → LaTeX body text. */
export function markdownToLatex(md: string): string {
  return blocks(parse(md).children);
}

/** The inline Markdown of one line (a title, a list item) → LaTeX, without paragraph breaks. */
export function inlineToLatex(text: string): string {
  return markdownToLatex(text).replace(/\n\n+/g, " ");
}
