import { describe, expect, it } from "vitest";
import { perronVector, pictureOf, symmetricEigenvalues } from "./picture";
import { parseGraph } from "../core/input/parse";

describe("graph pictures (display only)", () => {
  it("gives a text alternative: the drawing in words and graph6 (null with a loop)", () => {
    const p = pictureOf(parseGraph("path(3)", "named"), "G")!;
    expect(p.summary).toBe("3 vertices, 2 edges; connected: a path on 3 vertices");
    expect(p.graph6).toBe("Bg"); // P3 with edges 01, 12 (graph6 format description, nauty's formats.txt)
    expect(pictureOf(parseGraph("loop_path(3)", "named"), "G")!.graph6).toBeNull();
  });

  it("finds the spectrum of the path P3, {−√2, 0, √2} (eigenvalues 2cos(kπ/4))", () => {
    const ev = symmetricEigenvalues([
      [0, 1, 0],
      [1, 0, 1],
      [0, 1, 0],
    ]);
    expect(ev[0]).toBeCloseTo(-Math.SQRT2, 10);
    expect(ev[1]).toBeCloseTo(0, 10);
    expect(ev[2]).toBeCloseTo(Math.SQRT2, 10);
  });

  it("gives the Perron vector of the star K_{1,4}: centre 1, leaves 1/2 (ρ = 2)", () => {
    expect(perronVector(parseGraph("star(4)", "named"))).toEqual([1, 0.5, 0.5, 0.5, 0.5]);
  });

  it("highlights the image of an embedding, vertices and edges", () => {
    const host = parseGraph("path(5)", "named"),
      pattern = parseGraph("path(3)", "named");
    const p = pictureOf(host, "G", [1, 2, 3], pattern)!;
    expect(p.highlight).toEqual({
      vertices: [1, 2, 3],
      edges: [
        [1, 2],
        [2, 3],
      ],
    });
    expect(pictureOf(host, "G", [7, 8, 9], pattern)!.highlight).toBeNull();
  });
});
