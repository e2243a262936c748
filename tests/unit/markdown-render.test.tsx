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
