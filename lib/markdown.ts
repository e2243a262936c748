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

export const sanitizeSchema = {
  ...defaultSchema,
  // No images at all: a step must not load remote content.
  tagNames: (defaultSchema.tagNames ?? []).filter((t) => t !== "img"),
  attributes: {
    ...defaultSchema.attributes,
    code: [...(defaultSchema.attributes?.code ?? []), ["className", "language-math", "math-inline", "math-display"]],
    span: [...(defaultSchema.attributes?.span ?? []), ["className", "math", "math-inline", "math-display"]],
    div: [...(defaultSchema.attributes?.div ?? []), ["className", "math", "math-display"]],
  },
  protocols: { ...defaultSchema.protocols, href: ["http", "https", "mailto"] },
};

export const katexOptions = { trust: false, maxExpand: 1000, maxSize: 20, strict: "ignore" as const, throwOnError: false };

export const remarkPlugins: PluggableList = [remarkGfm, remarkMath];
// The budget sits between the two: an over-large or too deeply nested formula becomes an error box
// before KaTeX renders it (see lib/math-budget.ts).
export const rehypePlugins: PluggableList = [[rehypeSanitize, sanitizeSchema], [rehypeMathBudget, katexOptions], [rehypeKatex, katexOptions]];
