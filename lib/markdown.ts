/**
 * The one Markdown pipeline for steps, statements and comments, on the server and in the editor:
 * GitHub-flavoured Markdown with $…$ and $$…$$ math, sanitised BEFORE KaTeX runs so that raw HTML,
 * event handlers, javascript: links and remote images cannot survive, then KaTeX with trust off and
 * bounded macro expansion, nesting depth and rendered size (untrusted input).
 */
import remarkGfm from "remark-gfm";
import remarkMath from "remark-math";
import rehypeSanitize, { defaultSchema } from "rehype-sanitize";
import rehypeKatex from "rehype-katex";
import type { PluggableList } from "unified";
import { rehypeMathBudget } from "@/lib/math-budget";
import { remarkDisplayMathInline } from "@/lib/display-math";

export const sanitizeSchema = {
  ...defaultSchema,
  // No images at all: a step must not load remote content.
  // <mark> only comes from the revision comparison (lib/review/word-marks.ts): raw HTML never reaches here.
  tagNames: [...(defaultSchema.tagNames ?? []).filter((t) => t !== "img"), "mark"],
  attributes: {
    ...defaultSchema.attributes,
    // One className rule for code (the sanitizer reads only the first rule naming an attribute): the default's
    // language-* classes plus the two math classes, so `$$…$$` within a line keeps its math-display class.
    code: [
      ...(defaultSchema.attributes?.code ?? []).filter((a) => (Array.isArray(a) ? a[0] : a) !== "className"),
      ["className", /^language-./, "math-inline", "math-display"],
    ],
    span: [...(defaultSchema.attributes?.span ?? []), ["className", "math", "math-inline", "math-display"]],
    div: [...(defaultSchema.attributes?.div ?? []), ["className", "math", "math-display", "word-removed-block", "word-added-block"]],
    mark: [["className", "word-removed", "word-added"] as [string, ...string[]]],
  },
  protocols: { ...defaultSchema.protocols, href: ["http", "https", "mailto"] },
};

export const katexOptions = { trust: false, maxExpand: 1000, maxSize: 20, strict: "ignore" as const, throwOnError: false };

// `$$…$$` within a line is display math, as in the PDF (lib/display-math.ts).
export const remarkPlugins: PluggableList = [remarkGfm, remarkMath, remarkDisplayMathInline];
// The budget sits between the two: an over-large or too deeply nested formula becomes an error box
// before KaTeX renders it (see lib/math-budget.ts).
export const rehypePlugins: PluggableList = [
  [rehypeSanitize, sanitizeSchema],
  [rehypeMathBudget, katexOptions],
  [rehypeKatex, katexOptions],
];
