/** Comparing two revisions typeset side by side: the changed words are marked, everything is still typeset. */
import { describe, expect, it } from "vitest";
import { renderToStaticMarkup } from "react-dom/server";
import { MathMarkdown } from "@/components/markdown/math-markdown";
import { remarkMarkRanges, wordMarks } from "@/lib/review/word-marks";

const sides = (before: string, after: string) => {
  const m = wordMarks(before, after);
  return {
    marks: m,
    older: renderToStaticMarkup(<MathMarkdown source={before} marks={[[remarkMarkRanges, { ranges: m.removed, className: "word-removed" }]]} />),
    newer: renderToStaticMarkup(<MathMarkdown source={after} marks={[[remarkMarkRanges, { ranges: m.added, className: "word-added" }]]} />),
  };
};

const marked = (html: string, cls: string) => [...html.matchAll(new RegExp(`<mark class="${cls}">([\\s\\S]*?)</mark>`, "g"))].map((x) => x[1]);

describe("word marks", () => {
  it("finds the changed ranges of each side", () => {
    const m = wordMarks("the path A B C", "the path A X C");
    expect(m.removed).toEqual([{ start: 11, end: 12 }]);
    expect(m.added).toEqual([{ start: 11, end: 12 }]);
    expect(m.counts).toEqual({ removed: 1, added: 1 });
    expect(wordMarks("one  two", "one two")).toEqual({ removed: [], added: [], counts: { removed: 0, added: 0 } });
  });

  it("marks changed words and a changed formula whole, and still typesets the formula", () => {
    const { older, newer } = sides("Second tab: $\\lambda_1 = 2$.", "First tab: $\\lambda_1 < 2$.");
    expect(marked(older, "word-removed")[0]).toBe("Second");
    expect(marked(newer, "word-added")[0]).toBe("First");
    // The formula changed: marked as a unit, rendered by KaTeX inside the mark.
    expect(marked(older, "word-removed")[1]).toContain('class="katex"');
    expect(marked(newer, "word-added")[1]).toContain('class="katex"');
    // Unchanged words are not marked.
    expect(marked(older, "word-removed").join(" ")).not.toContain("tab");
    expect(older.match(/<mark/g)).toHaveLength(2);
  });

  it("marks a changed display formula as a block, typeset in display mode", () => {
    const { newer, older } = sides("Hence\n\n$$\n\\rho \\le 2\n$$", "Hence\n\n$$\n\\rho < 2\n$$");
    expect(newer).toMatch(/<div class="word-added-block">[\s\S]*katex-display/);
    expect(older).toMatch(/<div class="word-removed-block">[\s\S]*katex-display/);
    expect(newer).not.toContain("<mark");
  });

  it("marks a whole text node when an escape makes the source longer than the text", () => {
    const { newer } = sides("It costs \\$5 here.", "It costs \\$6 here.");
    expect(marked(newer, "word-added").join("")).toContain("$6");
  });

  it("marks nothing and keeps sanitising when only whitespace changed", () => {
    const { older, newer } = sides("A <script>alert(1)</script> b", "A  <script>alert(1)</script> b");
    expect(older + newer).not.toContain("<mark");
    expect(older + newer).not.toContain("<script");
  });
});
