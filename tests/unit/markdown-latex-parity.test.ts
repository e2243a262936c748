import { describe, expect, it } from "vitest";
import { unified } from "unified";
import remarkParse from "remark-parse";
import remarkRehype from "remark-rehype";
import rehypeSanitize, { type Options as Schema } from "rehype-sanitize";
import type { Element, Root as HastRoot, RootContent as HastContent } from "hast";
import { remarkPlugins, sanitizeSchema } from "@/lib/markdown";
import { markdownToLatex } from "@/lib/export/markdown-latex";

/**
 * A step must say the same on screen and in the PDF. Each fixture is rendered the way the web page
 * renders it (the page's remark plugins, then remark-rehype and the page's sanitiser; KaTeX only
 * typesets the math it is given, so the formulas are compared as their sources) and the way the
 * export writes it; the words and the formulas must come out the same and in the same order.
 */

interface Reading {
  words: string[];
  math: string[];
}

const wordsOf = (s: string): string[] => s.match(/[A-Za-z0-9]+/g) ?? [];
const squash = (s: string) => s.replace(/\s+/g, " ").trim();

function webReading(md: string): Reading {
  const processor = unified()
    .use(remarkParse)
    .use(remarkPlugins)
    .use(remarkRehype)
    .use(rehypeSanitize, sanitizeSchema as Schema);
  const tree = processor.runSync(processor.parse(md), md) as HastRoot;
  const out: Reading = { words: [], math: [] };
  const text = (n: HastContent | HastRoot): string =>
    "value" in n && typeof n.value === "string" ? n.value : "children" in n ? n.children.map((c) => text(c as HastContent)).join("") : "";
  const walk = (n: HastContent | HastRoot) => {
    if (n.type === "text") {
      out.words.push(...wordsOf(n.value));
      return;
    }
    if (n.type === "element") {
      const el = n as Element;
      const cls = el.properties?.className;
      if (Array.isArray(cls) && (cls.includes("math-inline") || cls.includes("math-display"))) {
        out.math.push(squash(text(el)));
        return;
      }
      el.children.forEach((c) => walk(c as HastContent));
      // The PDF cannot be clicked: it prints a link's address after its text.
      if (el.tagName === "a" && typeof el.properties?.href === "string") out.words.push(...wordsOf(el.properties.href));
      return;
    }
    if ("children" in n) n.children.forEach((c) => walk(c as HastContent));
  };
  walk(tree);
  return out;
}

const UNESCAPE: Array<[RegExp, string]> = [
  [/\\textbackslash\{\}/g, "\\"],
  [/\\textasciicircum\{\}/g, "^"],
  [/\\textasciitilde\{\}/g, "~"],
  [/\\textless\{\}/g, "<"],
  [/\\textgreater\{\}/g, ">"],
  [/\\textbar\{\}/g, "|"],
  [/\\textquotedbl\{\}/g, '"'],
  [/\\([{}$&#_%])/g, "$1"],
];

function latexReading(tex: string): Reading {
  const math: string[] = [];
  // Formulas: \[…\] and $…$ (an escaped \$ is text).
  let rest = tex.replace(/\\\[([\s\S]*?)\\\]/g, (_m, body: string) => {
    math.push(squash(body));
    return " ";
  });
  rest = rest.replace(/(?<!\\)\$((?:\\.|[^$\\])*)\$/g, (_m, body: string) => {
    math.push(squash(body));
    return " ";
  });
  // Layout commands with their arguments carry no words of the step.
  rest = rest.replace(/\\(begin|end|setcounter|rule)(\{[^}]*\})+/g, " ");
  for (const [re, to] of UNESCAPE) rest = rest.replace(re, to);
  rest = rest.replace(/\\[A-Za-z]+/g, " ");
  return { words: wordsOf(rest), math };
}

// Markdown as proof authors write it (common practice), including the constructions a hand-written
// line parser gets wrong: emphasis inside words, nested and numbered lists, tables, setext headings,
// hard breaks, indented code, raw HTML (which the page drops), and $$…$$ both on its own lines and within one.
const FIXTURES: Record<string, string> = {
  emphasis: "If $T$ is a **star-like tree** with *three* legs, then snake_case_words and 2*3*4 stay as written.",
  "intra-word emphasis": "A con*cat*enation, un__der__score and a_b_c.",
  "display math": "Hence\n\n$$\n\\rho(G) \\le 2\\cos\\frac{\\pi}{n+1}\n$$\n\nfollows.",
  "display math within a line": "So $$\\lambda_1 > 2$$ holds, and $x_1 = 1$.",
  lists: "1. first case\n2. second case\n   - sub-case with $d(v) = 3$\n   - another\n3. third",
  "list starting at 3": "3) Case three\n4) Case four",
  "task list": "- [x] checked $K_{1,4}$\n- [ ] not yet",
  table: "| graph | $\\rho$ |\n| :-- | --: |\n| $P_4$ | golden ratio |\n| $K_{1,4}$ | two |",
  "setext heading": "Lemma\n=====\n\nThe body.",
  "hard break": "line one  \nline two\\\nline three",
  "indented code": "Run\n\n    cairn check claims.json\n\ndone.",
  "fenced code": "```\nA(5) <= 2\n```",
  "raw html": 'Before <span onclick="x()">inside</span> after <!-- hidden comment -->',
  quote: "> Quoted with $\\sqrt{2+\\sqrt5}$\n> and more.",
  link: "See [the bound](https://example.org/bound) and <https://example.org/auto>.",
  escapes: "A \\$5 note, \\*not emphasis\\*, 100% & #1 {braces}.",
  "strike and rule": "~~old claim~~ new claim\n\n---\n\nAfter the rule.",
};

describe("the LaTeX export reads Markdown as the web page does", () => {
  for (const [name, md] of Object.entries(FIXTURES)) {
    it(`same words and formulas: ${name}`, () => {
      const web = webReading(md);
      const tex = latexReading(markdownToLatex(md));
      // The export marks struck-out text in words, since it has no strike-through font.
      expect(tex.words.filter((w) => w !== "struck")).toEqual(web.words);
      expect(tex.math).toEqual(web.math);
      expect(web.words.length + web.math.length).toBeGreaterThan(0);
    });
  }

  it("drops raw HTML like the page, and prints no formula from outside math", () => {
    const tex = markdownToLatex(FIXTURES["raw html"]);
    expect(tex).not.toContain("onclick");
    expect(tex).not.toContain("hidden comment");
    expect(tex).toContain("inside");
  });

  it("continues a numbered list at the number written", () => {
    expect(markdownToLatex(FIXTURES["list starting at 3"])).toContain("\\setcounter{enumi}{2}");
  });
});
