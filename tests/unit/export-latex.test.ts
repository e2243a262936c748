import { describe, expect, it } from "vitest";
import { buildBundle } from "@/lib/export/bundle";
import { documentOf } from "@/lib/export/document";
import { renderLatex } from "@/lib/export/latex";
import { escapeLine, sanitizeMath } from "@/lib/export/latex-escape";
import { inlineToLatex, markdownToLatex } from "@/lib/export/markdown-latex";
import { compileLatex, compileLatexRobustly, pdflatexAvailable, PdfFailedError, PdfUnavailableError } from "@/lib/export/pdf";
import { NOT_TYPESET_MARK, setMathAsSource } from "@/lib/export/latex-fallback";
import { settledSnapshot } from "./export-fixture";

const EVIL_TITLE = String.raw`Evil \input{/etc/passwd} \end{document} 100% & #1 _x_ ^ ~ {brace} $\write18{ls}$`;
const EVIL_STEP =
  String.raw`Text \input{/etc/passwd} and \immediate\write18{rm -rf /} here.

Inline $\input{/etc/passwd} x^2$ and $\def\x{\x}\x$ and $\catcode` +
  "`" +
  String.raw`\@=11$ and $^^5cinput{/etc/passwd}$.

$$
\openout1=/tmp/cairn-pwned \immediate\write1{owned} \include{/etc/passwd}
$$

A brace attack $x}\input{/etc/passwd}{$ and a comment $x % hides the rest$ and \$5 literally.`;

function texOf(title: string, body: string, kind: "certified" | "draft" = "draft") {
  const s = settledSnapshot(title);
  s.cases[0].steps[0].revision!.body = body;
  return renderLatex(documentOf(buildBundle(s, { kind, exportedAt: "2026-12-01T10:00:00.000Z", exportedBy: "Ada \\Quenby" })));
}

/** The document body with every allowed use of a backslash-word removed: whatever is left must be inert. */
const commandsIn = (tex: string) => new Set([...tex.matchAll(/\\([A-Za-z]+)/g)].map((m) => m[1]));

describe("LaTeX escaping", () => {
  it("escapes every LaTeX special character in text", () => {
    expect(escapeLine(String.raw`\ { } $ & # ^ _ ~ % < > |`)).toBe(
      String.raw`\textbackslash{} \{ \} \$ \& \# \textasciicircum{} \_ \textasciitilde{} \% \textless{} \textgreater{} \textbar{}`,
    );
  });

  it("writes the Unicode of claim statements as LaTeX that pdflatex knows", () => {
    expect(escapeLine("ρ(G) ≥ √5, G ≅ D̃4, x₁")).toBe(
      String.raw`\ensuremath{\rho}(G) \ensuremath{\ge} \ensuremath{\surd}5, G \ensuremath{\cong} \ensuremath{\tilde{D}}4, x\ensuremath{_{1}}`,
    );
    expect(escapeLine("日")).toBe(String.raw`\texttt{[U+65E5]}`);
  });

  it("passes harmless math through and neutralises dangerous commands inside math", () => {
    expect(sanitizeMath(String.raw`\rho\big(T(2,2,k)\big) \le \sqrt{2+\sqrt5}`)).toBe(String.raw`\rho\big(T(2,2,k)\big) \le \sqrt{2+\sqrt5}`);
    for (const cmd of ["input", "include", "write", "openout", "immediate", "catcode", "def", "csname", "usepackage", "newcommand"])
      expect(sanitizeMath(`\\${cmd}{x}`)).toBe(`\\backslash\\mathrm{${cmd}}{x}`);
    expect(sanitizeMath("^^5cinput{x}")).toBeNull(); // TeX's ^^ notation spells a backslash
    expect(sanitizeMath("x}")).toBeNull();
    expect(sanitizeMath(String.raw`\begin{document}`)).toBeNull();
    expect(sanitizeMath(String.raw`\left( x`)).toBeNull();
    expect(sanitizeMath("x % y")).toBe(String.raw`x \% y`);
    // Array column specs: l, c, r and rules only (">{x}c" stopped pdflatex for the whole proof).
    expect(sanitizeMath(String.raw`\begin{array}{>{x}c}x\end{array}`)).toBeNull();
    expect(sanitizeMath(String.raw`\begin{array}{p{1cm}}x\end{array}`)).toBeNull();
    expect(sanitizeMath(String.raw`\begin{array}{@{}c}x\end{array}`)).toBeNull();
    expect(sanitizeMath(String.raw`\begin{array}{l | c r}a&b&c\end{array}`)).toBe(String.raw`\begin{array}{l|cr}a&b&c\end{array}`);
    expect(sanitizeMath(`${"{".repeat(400)}x${"}".repeat(400)}`)).toBeNull(); // TeX's grouping limit is 255
    expect(sanitizeMath(String.raw`\begin{pmatrix} 1 & 0 \\ 0 & 1 \end{pmatrix}`)).toBe(String.raw`\begin{pmatrix} 1 & 0 \\ 0 & 1 \end{pmatrix}`);
  });

  it("turns Markdown into LaTeX: emphasis, code, lists and display math", () => {
    expect(inlineToLatex("**If $x_1$ then** *y* and `a_b`")).toBe(String.raw`\textbf{If $x_1$ then} \emph{y} and \texttt{a\_b}`);
    expect(markdownToLatex("- one\n- two")).toBe("\\begin{itemize}\n\\item one\n\\item two\n\\end{itemize}");
    // Line breaks inside math become spaces: a blank line in display math would not compile.
    expect(markdownToLatex("$$\n\\rho < 2\n\n$$")).toBe("\\[\\rho < 2 \\]");
  });

  it("LaTeX specials and injection attempts in titles and steps come out escaped", () => {
    const tex = texOf(EVIL_TITLE, EVIL_STEP);
    // Only our own preamble and layout commands remain; every user command is printed, not run.
    for (const bad of ["input", "include", "write", "immediate", "openout", "catcode", "def", "write18"]) expect(commandsIn(tex).has(bad)).toBe(false);
    expect(tex).toContain(
      String.raw`Evil \textbackslash{}input\{/etc/passwd\} \textbackslash{}end\{document\} 100\% \& \#1 \_x\_ \textasciicircum{} \textasciitilde{} \{brace\}`,
    );
    expect(tex).toContain(String.raw`$\backslash\mathrm{input}{/etc/passwd} x^2$`);
    expect(tex).toContain(String.raw`\texttt{\$\textasciicircum{}\textasciicircum{}5cinput\{/etc/passwd\}\$}`);
    expect(tex).toContain(String.raw`\$5 literally`);
    expect(tex.match(/\\end\{document\}/g)).toHaveLength(1);
  });
});

describe("LaTeX document", () => {
  it("marks a draft as DRAFT in the header of every page style and in the title block", () => {
    const tex = texOf("A proof", "A step.", "draft");
    expect(tex).toContain(String.raw`\fancyhead[R]{\small \textbf{DRAFT --- not certified}}`);
    // The plain style (first pages of \maketitle-like layouts, floats) carries the same header.
    expect(tex).toMatch(/\\fancypagestyle\{plain\}\{\\fancyhf\{\}\n\\fancyhead\[L\][^\n]*\n\\fancyhead\[R\]\{\\small \\textbf\{DRAFT/);
    expect(tex).toContain(String.raw`\textbf{DRAFT export} (not certified)`);
    const certified = texOf("A proof", "A step.", "certified");
    expect(certified).not.toContain("DRAFT");
    expect(certified).toContain("Certified export");
  });

  it("states what a verified claim means and does not mean, and each claim with its method and digest", () => {
    const tex = texOf("A proof", "A step.", "certified");
    expect(tex).toContain("the stated computation with exact arithmetic");
    expect(tex).toContain("It does not mean that the case split is exhaustive, nor that the prose argument of any step is right");
    expect(tex).toMatch(
      /Verified:\} G is a tree, by breadth-first search \(certificate: spanning forest \(parent of each vertex\)\); certificate in bundle item \\texttt\{claim 1\(a\)\\#1\}/,
    );
    expect(tex).toContain("Celia Marwood & 2 & 2026-11-30 12:00 UTC");
  });

  it("compiles with pdflatex, including the injection attempts, without reading or writing outside its directory", async () => {
    const { pdf, log } = await compileLatex(texOf(EVIL_TITLE, EVIL_STEP), { runs: 2 });
    expect(pdf.subarray(0, 5).toString()).toBe("%PDF-");
    expect(log).not.toContain("(/etc/passwd"); // pdflatex logs every file it opens as "(path"
    expect(log).not.toMatch(/^! /m);
  }, 120_000);

  it("compiles the appendix of claim inputs, with hostile text in a family name and in a graph that does not read", async () => {
    const s = settledSnapshot("Inputs");
    const hostile = String.raw`\input{/etc/passwd} $\write18{ls}$ 100% & #1 _x_ ^^5c ~ {`;
    s.cases[0].steps[0].claims.push({
      ...s.cases[0].steps[0].claims[0],
      position: 2,
      kind: "identification",
      status: "refuted",
      certificate: null,
      input: JSON.stringify({ format: "cairn-claim/1", kind: "identification", graph: { format: "edges", text: hostile }, family: hostile }),
    });
    const tex = renderLatex(documentOf(buildBundle(s, { kind: "draft", exportedAt: "2026-12-01T10:00:00.000Z", exportedBy: "Ada" })));
    expect(tex).toContain("\\section*{Appendix: claim inputs}");
    for (const bad of ["input", "write", "write18"]) expect(commandsIn(tex).has(bad)).toBe(false);
    const { pdf, log } = await compileLatex(tex, { runs: 1 });
    expect(pdf.subarray(0, 5).toString()).toBe("%PDF-");
    expect(log).not.toContain("(/etc/passwd");
    expect(log).not.toMatch(/^! /m);
  }, 120_000);

  it("says when pdflatex is missing instead of failing obscurely", async () => {
    expect(await pdflatexAvailable()).toBe(true);
    const path = process.env.PATH;
    process.env.PATH = "/nonexistent";
    try {
      expect(await pdflatexAvailable()).toBe(false);
      await expect(compileLatex("\\documentclass{article}")).rejects.toBeInstanceOf(PdfUnavailableError);
    } finally {
      process.env.PATH = path;
    }
  });
});

/** Formulas that pass the math check (or fail it) and would stop pdflatex: each must not take the document down. */
const UNCOMPILABLE = [
  String.raw`$\begin{array}{>{x}c}x\end{array}$`,
  String.raw`$x^1^2$`,
  String.raw`$a\limits^2$`,
  String.raw`$\begin{matrix}1&2&3&4&5&6&7&8&9&10&11\end{matrix}$`,
  String.raw`$\text{\alpha}$`,
  String.raw`$\frac$`,
  `$${"\\sqrt{".repeat(400)}x${"}".repeat(400)}$`,
  String.raw`$\begin{split}a\end{split}$`,
];

describe("a formula that would not compile", () => {
  it("is set as its source with a mark, and the rest of the document still compiles", async () => {
    const body = [String.raw`Good $\rho(T) \le 2$ first.`, ...UNCOMPILABLE.map((f) => `Then ${f} here.`), String.raw`Good $$\sqrt{2+\sqrt5}$$ last.`].join(
      "\n\n",
    );
    const tex = texOf("Hostile formulas", body);
    await expect(compileLatex(tex)).rejects.toBeInstanceOf(PdfFailedError); // the document as written does not compile
    const result = await compileLatexRobustly(tex, { runs: 1 });
    expect(result.pdf.subarray(0, 5).toString()).toBe("%PDF-");
    expect(result.recovered).toBeGreaterThan(0);
    expect(result.tex).toContain(NOT_TYPESET_MARK);
    expect(result.tex).toContain(String.raw`Good $\rho(T) \le 2$ first.`); // good math is still typeset
    expect(result.tex).toContain(String.raw`\texttt{x\textasciicircum{}1\textasciicircum{}2}~${NOT_TYPESET_MARK}`);
  }, 300_000);

  it("is found on the line pdflatex names; a line without math gives nothing to replace", () => {
    const tex = "\\begin{document}\nplain text\nsee $x^1^2$ and \\$5 and \\[ a \\] end\n\\end{document}";
    expect(setMathAsSource(tex, 2)).toBeNull();
    const fixed = setMathAsSource(tex, 3)!;
    expect(fixed.split("\n")[2]).toBe(
      String.raw`see \texttt{x\textasciicircum{}1\textasciicircum{}2}~${NOT_TYPESET_MARK} and \$5 and \par\noindent \texttt{a}~${NOT_TYPESET_MARK}\par  end`,
    );
  });
});
