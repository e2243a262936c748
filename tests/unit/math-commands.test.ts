import { describe, expect, it } from "vitest";
import { displayMath, inlineMath, mathCommands, NAMED_GRAPH_SNIPPETS } from "@/components/editor/math-commands";
import { sanitizeMath } from "@/lib/export/latex-escape";
import katex from "katex";

/** A stand-in for the editor's text area: applies replaceSelection / setSelectionRange to a string. */
function area(text: string, start: number, end = start) {
  let sel = { start, end };
  const api = {
    replaceSelection(t: string) {
      text = text.slice(0, sel.start) + t + text.slice(sel.end);
      sel = { start: sel.start + t.length, end: sel.start + t.length };
      return { text, selectedText: "", selection: sel };
    },
    setSelectionRange(r: { start: number; end: number }) {
      sel = r;
      return { text, selectedText: text.slice(r.start, r.end), selection: r };
    },
  };
  return { api, state: () => ({ text, selectedText: text.slice(sel.start, sel.end), selection: sel }), get: () => ({ text, sel }) };
}

describe("the editor's math-first toolbar", () => {
  it("offers math, a named graph and references; no image, checklist or code block", () => {
    const names = mathCommands([{ label: "2.1", text: "Case 2.1" }]).map((c) => c.name ?? c.keyCommand);
    expect(names).toEqual(expect.arrayContaining(["inline-math", "display-math", "named-graph", "reference", "bold", "italic"]));
    for (const gone of ["image", "checked-list", "codeBlock", "code", "table", "strikethrough"]) expect(names).not.toContain(gone);
    // Without references (a new proof), the reference menu is not offered.
    expect(mathCommands().map((c) => c.name)).not.toContain("reference");
  });

  it.each([
    { what: "wraps the selection in $…$", command: inlineMath, text: "so x^2 > 1", start: 3, end: 6, after: { text: "so $x^2$ > 1" } },
    { what: "cursor inside an empty $…$", command: inlineMath, text: "ab", start: 1, end: 1, after: { text: "a$$b", sel: { start: 2, end: 2 } } },
    {
      what: "puts display math on lines of its own, so the page and the PDF both set it displayed",
      command: displayMath,
      text: "Hence \\rho < 2 follows",
      start: 6,
      end: 14,
      after: { text: "Hence \n\n$$\n\\rho < 2\n$$\n follows" },
    },
    { what: "cursor in an empty display formula", command: displayMath, text: "", start: 0, end: 0, after: { text: "$$\n\n$$\n", sel: { start: 3, end: 3 } } },
  ])("$what", ({ command, text, start, end, after }) => {
    const a = area(text, start, end);
    command(a.state(), a.api);
    expect(a.get()).toMatchObject(after);
  });

  it("inserts named graphs that KaTeX renders and the PDF export accepts", () => {
    for (const g of NAMED_GRAPH_SNIPPETS) {
      expect(() => katex.renderToString(g.tex, { throwOnError: true })).not.toThrow();
      expect(sanitizeMath(g.tex)).toBe(g.tex);
    }
  });
});
