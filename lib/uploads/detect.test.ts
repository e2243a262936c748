/** Files are told apart by content, never by name; graph lists keep each graph's line. */
import { describe, expect, it } from "vitest";
import { gzipSync } from "fflate";
import { detectFile, graphListText, UnpackedTooLarge, UnsupportedContent } from "./detect";
import { describeListProblem, readListedGraph, splitGraphList } from "../core/input/graph-list";

const bytes = (s: string) => new TextEncoder().encode(s);
const MiB = 1024 * 1024;

// graph6 of K_3 is "Bw", of the path P_3 (edges 01, 12) "Bg": formats.txt (nauty's graph6 description); common practice.
const G6 = "Bw\nBg\n";

describe("detectFile", () => {
  it("reads graph6, sparse6 and edge-list files as graph lists, with their graph count", () => {
    expect(detectFile(bytes(G6), MiB)).toMatchObject({ kind: "graph-list", graphFormat: "graph6", graphCount: 2, compressed: false });
    expect(detectFile(bytes(">>graph6<<Bw\n\nBg\n"), MiB)).toMatchObject({ graphFormat: "graph6", graphCount: 2 });
    // ":An" is sparse6 for K_2 (n = 2, edge 0–1), as nauty's formats.txt encodes it (worked by hand from its description).
    expect(detectFile(bytes(":An\n"), MiB)).toMatchObject({ kind: "graph-list", graphFormat: "sparse6", graphCount: 1 });
    expect(detectFile(bytes("0 1\n1 2\n\n# a triangle\n0 1\n1 2\n2 0\n"), MiB)).toMatchObject({ kind: "graph-list", graphFormat: "edges", graphCount: 2 });
  });

  it("unpacks gzip (a graph list only) and says so", () => {
    const d = detectFile(gzipSync(bytes(G6.repeat(500))), MiB);
    expect(d).toMatchObject({ kind: "graph-list", graphCount: 1000, compressed: true, mediaType: "application/gzip" });
    expect(() => detectFile(gzipSync(bytes("Dear referee, …")), MiB)).toThrow(/does not hold a graph list/);
  });

  it("stops unpacking past the limit (a small file that unpacks to a lot)", () => {
    const bomb = gzipSync(bytes("Bw\n".repeat(400_000)), { level: 9 });
    expect(bomb.byteLength).toBeLessThan(20_000);
    expect(() => detectFile(bomb, 100_000)).toThrow(UnpackedTooLarge);
  });

  it("takes PDF and PNG by their magic bytes, whatever the name", () => {
    expect(detectFile(bytes("%PDF-1.5\n%\u00e2\u00e3\n1 0 obj"), MiB)).toMatchObject({ kind: "document", mediaType: "application/pdf" });
    const png = new Uint8Array([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 13]);
    expect(detectFile(png, MiB)).toMatchObject({ kind: "document", mediaType: "image/png" });
  });

  it("tells TeX from plain text, and reads claims files", () => {
    expect(detectFile(bytes("\\documentclass{article}\n\\begin{document}x\\end{document}"), MiB).mediaType).toMatch(/^text\/x-tex/);
    expect(detectFile(bytes("The search ran for three days.\n"), MiB)).toMatchObject({ kind: "document", mediaType: "text/plain; charset=utf-8" });
    const claims = {
      format: "cairn-claims/1",
      claims: [{ format: "cairn-claim/1", kind: "spectral-radius-bound", graph: { format: "named", text: "path(4)" }, op: "<", bound: "2" }],
    };
    expect(detectFile(bytes(JSON.stringify(claims)), MiB)).toMatchObject({ kind: "claims", description: "claims file of 1 claim" });
  });

  it("refuses other binary content, empty files and a kind that the content contradicts (415)", () => {
    const jpeg = new Uint8Array([0xff, 0xd8, 0xff, 0xe0, 0, 0x10, 0x4a, 0x46, 0x49, 0x46, 0]);
    expect(() => detectFile(jpeg, MiB)).toThrow(UnsupportedContent);
    expect(() => detectFile(new Uint8Array(), MiB)).toThrow(/empty/);
    expect(() => detectFile(bytes("%PDF-1.4"), MiB, "graph-list")).toThrow(/You chose “graph-list”, but by its content this file is a PDF document/);
    expect(() => detectFile(bytes("hello\n"), MiB, "graph-list")).toThrow(/plain text/);
  });
});

describe("graph lists", () => {
  it("keep each graph's line number, and a bad line is named by it", () => {
    const text = "Bw\n\nBg\nB!\nBw\n";
    const entries = splitGraphList(text, "graph6");
    expect(entries.map((e) => e.line)).toEqual([1, 3, 4, 5]);
    expect(readListedGraph(entries[0], "graph6").edges).toHaveLength(3);
    let problem = "";
    try {
      readListedGraph(entries[2], "graph6");
    } catch (e) {
      problem = describeListProblem(entries[2], e);
    }
    expect(problem).toMatch(/^line 4, column 2: /);
  });

  it("name the line of a bad edge inside an edge-list block", () => {
    const text = "0 1\n1 2\n\n0 1\n1 x y z\n";
    const entries = splitGraphList(text, "edges");
    expect(entries.map((e) => e.line)).toEqual([1, 4]);
    let problem = "";
    try {
      readListedGraph(entries[1], "edges");
    } catch (e) {
      problem = describeListProblem(entries[1], e);
    }
    expect(problem).toMatch(/^line 5\b/);
  });

  it("unpack stored gzip text", () => {
    expect(graphListText(gzipSync(bytes(G6)), MiB)).toBe(G6);
  });
});
