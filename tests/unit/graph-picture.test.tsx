/**
 * A claim's drawing as a reader without sight gets it: the SVG is an image named by its title and described by the
 * graph in words (its summary) and its graph6 string, and a pattern's embedding is drawn thick and filled and named in
 * the description. The host here is a cycle, drawn as a polygon.
 */
import { describe, expect, it } from "vitest";
import { renderToStaticMarkup } from "react-dom/server";
import { GraphPicture } from "@/components/graph/graph-picture";
import { pictureOf } from "@/lib/verification/picture";
import { parseGraph } from "@/lib/core/input/parse";

describe("GraphPicture", () => {
  // C5 with vertices 0..4 in cycle order, and the path P3 mapped onto 0, 1, 2.
  const picture = pictureOf(parseGraph("cycle(5)", "named"), "Host", [0, 1, 2], parseGraph("path(3)", "named"))!;
  const html = renderToStaticMarkup(<GraphPicture picture={picture} />);

  it("is an image with a title and a description: the summary and graph6", () => {
    expect(picture.summary).toBe("5 vertices, 5 edges; connected: a cycle on 5 vertices");
    // graph6 of C5 is "Dhc": N(5) = chr(63+5) = 'D', then the upper triangle column by column, 101001 100100 (nauty's formats.txt).
    expect(picture.graph6).toBe("Dhc");
    const svg = /<svg[^>]*>/.exec(html)![0];
    expect(svg).toContain('role="img"');
    const titleId = /aria-labelledby="([^"]+)"/.exec(svg)![1];
    const descId = /aria-describedby="([^"]+)"/.exec(svg)![1];
    expect(html).toContain(`<title id="${titleId}">Host: a drawing of the graph</title>`);
    const desc = new RegExp(`<desc id="${descId}">([^<]*)</desc>`).exec(html)![1];
    expect(desc).toContain("5 vertices, 5 edges; connected: a cycle on 5 vertices");
    expect(desc).toContain("graph6 Dhc");
    expect(desc).toContain("the embedding&#x27;s image is vertices 0, 1, 2");
    // The same words under the drawing, for everyone.
    expect(html).toMatch(/The graph in words<\/summary><p[^>]*>5 vertices, 5 edges; connected: a cycle on 5 vertices\.<\/p>/);
  });

  it("draws the embedding's image thick and filled, and nothing else", () => {
    expect(html.match(/data-highlighted="true"/g)?.length).toBe(3);
    expect(html.match(/stroke-width="6"/g)?.length).toBe(2); // the edges 01 and 12 of the image
    expect(html.match(/stroke-width="2"/g)?.length).toBe(3 + 2); // the other three edges, the other two vertices
    expect(html).toContain("thick and filled: the embedding’s image");
  });

  it("says nothing of an embedding when there is none", () => {
    const plain = renderToStaticMarkup(<GraphPicture picture={pictureOf(parseGraph("cycle(5)", "named"), "Host")!} />);
    expect(plain).not.toContain("data-highlighted");
    expect(plain).not.toContain("embedding");
  });
});
