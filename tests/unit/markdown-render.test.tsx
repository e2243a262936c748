/** A step is untrusted Markdown: its math must render and nothing in it may run script or load remote content. */
import { describe, expect, it } from "vitest";
import { renderToStaticMarkup } from "react-dom/server";
import { MathMarkdown } from "@/components/markdown/math-markdown";

const step = [
  "By Smith's theorem $\\rho(\\tilde E_8) = 2$, and",
  "$$\n\\lambda_1(G) \\ge \\sqrt{5}\n$$",
  '<script>alert("owned")</script>',
  '<img src="https://evil.example/x.png" onerror="alert(1)">',
  "[click](javascript:alert(2))",
  '<a href="https://example.org" onclick="alert(3)">link</a>',
  "$\\href{javascript:alert(4)}{text}$",
  "$\\def\\a{\\a\\a}\\a$",
].join("\n\n");

describe("MathMarkdown", () => {
  const html = renderToStaticMarkup(<MathMarkdown source={step} />);

  it("renders inline and display math with KaTeX", () => {
    expect(html).toContain('class="katex"');
    expect(html).toContain("katex-display");
    // KaTeX keeps the TeX source in MathML annotations.
    expect(html).toContain('<annotation encoding="application/x-tex">\\lambda_1(G) \\ge \\sqrt{5}</annotation>');
  });

  it("keeps KaTeX's MathML output, which screen readers read (inline and display)", () => {
    // KaTeX's default output "htmlAndMathml" (katex.org Options): the visual HTML plus a hidden <math> tree.
    const one = renderToStaticMarkup(<MathMarkdown source={"Then $\\rho(T) > 2$, and\n\n$$\n\\sqrt{2+\\sqrt5}\n$$"} />);
    expect(one.match(/class="katex-mathml"/g)?.length).toBe(2);
    expect(one).toMatch(/<span class="katex-mathml"><math xmlns="http:\/\/www.w3.org\/1998\/Math\/MathML"( display="block")?>/);
    expect(one).toContain("<msqrt>");
  });

  it("lets no script, event handler, javascript: link or remote image through", () => {
    expect(html).not.toMatch(/<script/i);
    expect(html).not.toMatch(/\son[a-z]+=/i);
    expect(html).not.toMatch(/href="javascript:/i);
    expect(html).not.toMatch(/<img/i);
    expect(html).not.toContain("evil.example");
  });

  it("stops a self-expanding macro instead of hanging", () => {
    expect(html).toMatch(/katex-error|Too many expansions/);
  });
});

describe("MathMarkdown budget per formula", () => {
  // The hostile step that killed tabs: 400 nested \sqrt{ in 2.8 KB rendered to about 1.2 MB.
  const nested = `$${"\\sqrt{".repeat(400)}x${"}".repeat(400)}$`;

  it("replaces a too deeply nested formula by an error box, keeping the page small", () => {
    const html = renderToStaticMarkup(<MathMarkdown source={`Before ${nested} after.`} />);
    expect(html.length).toBeLessThan(5_000);
    expect(html).toContain('class="math-over-budget"');
    expect(html).toContain("400 levels deep");
    expect(html).toContain("Before");
    expect(html).toContain("after.");
  });

  it("also boxes a display formula and a ```math block over budget", () => {
    const deep = `${"x^{".repeat(60)}1${"}".repeat(60)}`;
    const html = renderToStaticMarkup(<MathMarkdown source={`$$\n${deep}\n$$\n\n\`\`\`math\n${deep}\n\`\`\``} />);
    expect(html.match(/math-over-budget/g)?.length).toBe(2);
    expect(html).not.toContain('class="katex"');
  });

  it("boxes a shallow formula whose rendering would be huge", () => {
    // 20×20 matrix: nesting 2 and a short source, but well over the rendered-size budget.
    const big = `\\begin{pmatrix}${Array.from({ length: 20 }, () => Array(20).fill("a_{ij}").join("&")).join("\\\\")}\\end{pmatrix}`;
    const html = renderToStaticMarkup(<MathMarkdown source={`$${big}$`} />);
    expect(html).toContain("math-over-budget");
    expect(html).toMatch(/KB of markup/);
  });

  it("still renders ordinary formulas, including a 10×10 matrix and moderate nesting", () => {
    const matrix = `\\begin{pmatrix}${Array.from({ length: 10 }, () => Array(10).fill("a_{ij}").join("&")).join("\\\\")}\\end{pmatrix}`;
    const html = renderToStaticMarkup(<MathMarkdown source={`$${matrix}$ and $${"\\sqrt{".repeat(8)}2${"}".repeat(8)}$ and $\\{x\\}$`} />);
    expect(html).not.toContain("math-over-budget");
    expect(html.match(/class="katex"/g)?.length).toBe(3);
  });
});

describe("display math written on one line", () => {
  it("renders $$…$$ within a line as display math, as the PDF does, and $…$ inline", () => {
    const html = renderToStaticMarkup(<MathMarkdown source={"Hence $$\\rho(G) \\ge \\sqrt{5}$$ and $x$ is inline."} />);
    expect(html.match(/katex-display/g)).toHaveLength(1);
    expect(html).toContain('<annotation encoding="application/x-tex">\\rho(G) \\ge \\sqrt{5}</annotation>');
    expect(html.match(/class="katex"/g)).toHaveLength(2); // both formulas rendered, one of them in a display block
  });
});
