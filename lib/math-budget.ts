/**
 * A budget per formula for untrusted math. KaTeX's own limits (maxSize, maxExpand) do not bound how
 * deep a formula nests or how much HTML it turns into: 400 nested \sqrt{ in a 2.8 KB step became
 * ~1.2 MB of markup and killed the reader's browser tab. This rehype plugin runs after sanitising and
 * before rehype-katex; a formula over budget is replaced by a small error box (with the start of its
 * source), so rehype-katex never renders it. Pure: no framework imports, used on server and client.
 */
import katex from "katex";
import type { Element as HastElement, Root, RootContent } from "hast";

/** Deepest nesting of groups (braces, \left…\right, \begin…\end) a formula may have. */
export const MAX_MATH_DEPTH = 24;
/** Most characters of KaTeX HTML one formula may render to (a 10×10 matrix is about 93 KB). */
export const MAX_MATH_HTML = 160_000;
/** Most characters of TeX source in one formula. */
export const MAX_MATH_SOURCE = 4_000;

/** The deepest nesting of `{…}`, `\left…\right` and `\begin…\end` in a TeX string (escaped braces do not count). */
export function mathDepth(tex: string): number {
  let depth = 0;
  let max = 0;
  for (let i = 0; i < tex.length; i++) {
    const c = tex[i];
    if (c === "\\") {
      const word = /^\\([a-zA-Z]+)/.exec(tex.slice(i, i + 12))?.[1];
      if (word === "left" || word === "begin") max = Math.max(max, ++depth);
      else if (word === "right" || word === "end") depth = Math.max(0, depth - 1);
      i += word ? word.length : 1; // skip the command name, or the escaped character (\{ \} \\)
    } else if (c === "{") max = Math.max(max, ++depth);
    else if (c === "}") depth = Math.max(0, depth - 1);
  }
  return max;
}

export type MathVerdict = { ok: true } | { ok: false; reason: string };

const measured = new Map<string, MathVerdict>();

/** Whether one formula fits the budget; the rendered size is measured with the same KaTeX options. */
export function checkMathBudget(tex: string, displayMode: boolean, options: katex.KatexOptions): MathVerdict {
  if (tex.length > MAX_MATH_SOURCE) return { ok: false, reason: `its source has ${tex.length} characters (at most ${MAX_MATH_SOURCE})` };
  const depth = mathDepth(tex);
  if (depth > MAX_MATH_DEPTH) return { ok: false, reason: `it nests ${depth} levels deep (at most ${MAX_MATH_DEPTH})` };
  const key = `${displayMode ? "D" : "I"}${tex}`;
  const known = measured.get(key);
  if (known) return known;
  let size = 0;
  try {
    size = katex.renderToString(tex, { ...options, displayMode, throwOnError: false }).length;
  } catch {
    size = 0; // rehype-katex shows its own error box for a formula KaTeX cannot render
  }
  const verdict: MathVerdict =
    size > MAX_MATH_HTML
      ? { ok: false, reason: `it would render to ${Math.round(size / 1000)} KB of markup (at most ${MAX_MATH_HTML / 1000} KB)` }
      : { ok: true };
  if (measured.size > 2000) measured.clear();
  measured.set(key, verdict);
  return verdict;
}

type HastNode = Root | RootContent;

const isElement = (n: HastNode): n is HastElement => n.type === "element";
const classesOf = (e: HastElement): unknown[] => (Array.isArray(e.properties?.className) ? (e.properties.className as unknown[]) : []);
const isMath = (e: HastElement) => classesOf(e).some((c) => c === "math-inline" || c === "math-display" || c === "language-math");
const textOf = (n: HastNode): string => (n.type === "text" ? n.value : "children" in n ? n.children.map(textOf).join("") : "");

function errorBox(tex: string, reason: string, display: boolean): HastElement {
  const head = tex.length > 80 ? `${tex.slice(0, 80)}…` : tex;
  return {
    type: "element",
    tagName: display ? "div" : "span",
    properties: { className: ["math-over-budget"], role: "note" },
    children: [{ type: "text", value: `Formula not shown: ${reason}. Source begins: ${head}` }],
  };
}

/** The rehype plugin: put it after rehype-sanitize and before rehype-katex, with KaTeX's options. */
export function rehypeMathBudget(options: katex.KatexOptions) {
  return (tree: Root) => {
    const walk = (node: HastNode) => {
      if (node.type !== "root" && node.type !== "element") return;
      node.children = node.children.map((child): RootContent => {
        if (!isElement(child)) return child;
        // ```math blocks arrive as <pre><code class="language-math">; the box replaces the whole <pre>.
        const only = child.children.length === 1 ? child.children[0] : null;
        const inner = child.tagName === "pre" && only && isElement(only) ? only : null;
        const math = isMath(child) ? child : inner && isMath(inner) ? inner : null;
        if (!math) {
          walk(child);
          return child;
        }
        const display = math !== child || classesOf(math).includes("math-display");
        const tex = textOf(math);
        const verdict = checkMathBudget(tex, display, options);
        return verdict.ok ? child : errorBox(tex, verdict.reason, display);
      });
    };
    walk(tree);
  };
}
