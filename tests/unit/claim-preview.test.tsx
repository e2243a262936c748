/** The claim form's preview shows the input as the checker reads it, before submit. */
import { describe, expect, it } from "vitest";
import { renderToStaticMarkup } from "react-dom/server";
import { ClaimPreview } from "@/components/claims/claim-preview";

const html = (graphText: string, graphFormat: string, bound?: string) =>
  renderToStaticMarkup(<ClaimPreview graphText={graphText} graphFormat={graphFormat} bound={bound} onBaseOne={() => {}} />);

describe("claim preview", () => {
  it("shows order, size, degree sequence, a drawing and the bound in normal form", () => {
    const out = html("E~(8)", "named", "(1+sqrt(5))/2");
    // Ẽ8 = T(1,2,5): 9 vertices, 8 edges, degrees 3, 2×5, 1×3 (Bourbaki Plate VII).
    expect(out).toContain('G: order 9, size 8, no loops, no multiple edges; degree sequence <span class="font-mono">(3, 2, 2, 2, 2, 2, 1, 1, 1)</span>');
    expect(out).toContain('data-testid="graph-picture"');
    expect(out).toContain("b = root of x²−x−1 in (1, 2) ≈ 1.618034…, as you wrote: (1+sqrt(5))/2");
  });
  it("offers 1-based reading when the edge list starts at 1, and shows bound errors", () => {
    const out = html("1 2\n2 3", "edges", "sqrt(-1)");
    expect(out).toContain("numbered from 1");
    expect(out).toContain("Read the vertices as 1..n");
    expect(out).toContain("square root of a negative number");
  });
});
