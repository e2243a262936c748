/**
 * Batch claims over an uploaded graph list, checked by the worker process that the integration
 * global setup starts: all 106 trees on 10 vertices (from nauty's gentreeg when installed, else from
 * Cairn's own enumeration) plus one bad line; progress, results, CSV and graph6 of the failures,
 * cancel, exactly-once chunks, and who may do what.
 */
import { beforeAll, describe, expect, it, vi } from "vitest";

vi.mock("next-auth", async (importOriginal) => ({ ...(await importOriginal<typeof import("next-auth")>()), getServerSession: vi.fn() }));

import { spawnSync } from "node:child_process";
import { actAs, jsonRequest, params, closeAfterAll } from "./helpers";
import { draftCaseStep, dropProofs } from "./workspace-fixture";
import { models } from "@/models";
import { runBatchChunk } from "@/lib/jobs/batch";
import { generateConnected } from "@/lib/core/families/augmentation";
import { writeGraph6, parseGraph6, writeSparse6 } from "@/lib/core/input/graph6";
import { degree, makeGraph, type Graph } from "@/lib/core/graph";
import { affineA, affineD, dynkinA, dynkinD } from "@/lib/core/input/constructors";
import { canonicalKeyOf } from "@/lib/core/families/canonical-label";
import { bruteForce, toGraph } from "../support/multigraph-brute-force";
import { Budget } from "@/lib/core/verdict";
import { recheckIdentification } from "@/lib/core/families/identify";
import { recheckExclusion } from "@/lib/core/subgraph/subgraph";
import { parseGraph } from "@/lib/core/input/parse";
import { isomorphic, readGraphText } from "@/lib/core/families/enumeration";
import { readListedGraph } from "@/lib/core/input/graph-list";
import { loadSnapshot } from "@/lib/data/exports";
import { buildBundle } from "@/lib/export/bundle";
import { checkBundle, sealBundle, type BundleItemType } from "@/lib/core/certificates/bundle";
import type { BatchItemData } from "@/lib/core/certificates/batch-check";
import * as filesRoute from "@/app/api/proofs/[proofId]/steps/[stepId]/files/route";
import * as batchesRoute from "@/app/api/proofs/[proofId]/steps/[stepId]/batches/route";
import * as batchRoute from "@/app/api/proofs/[proofId]/batches/[batchId]/route";
import * as cancelRoute from "@/app/api/proofs/[proofId]/batches/[batchId]/cancel/route";
import * as resultsRoute from "@/app/api/proofs/[proofId]/batches/[batchId]/results/route";
import * as exportsRoute from "@/app/api/proofs/[proofId]/exports/route";
import { fileStore } from "@/lib/storage";

let proofId: string;
let stepId: string;
let listId: number;
let documentId: number;

/** All trees on 10 vertices: sparse6 from nauty's gentreeg, or graph6 from our own enumeration. */
function treesOn10(): string[] {
  for (const cmd of ["nauty-gentreeg", "gentreeg"]) {
    const r = spawnSync(cmd, ["-q", "10"], { encoding: "utf8" });
    if (r.status === 0 && r.stdout) return r.stdout.trim().split("\n");
  }
  return generateConnected({ maxVertices: 10, setting: { kind: "tree" }, collect: true, budget: new Budget(1e9) }).levels[9].map((g) => writeGraph6(g));
}

const upload = async (text: string, name: string) => {
  await actAs("author");
  const res = await filesRoute.POST(new Request(`http://localhost/x?name=${name}`, { method: "POST", body: text }), params({ proofId, stepId }));
  expect(res.status, await res.clone().text()).toBe(201);
  return (await res.json()).file.id as number;
};
const start = (body: unknown) => batchesRoute.POST(jsonRequest("/x", "POST", body), params({ proofId, stepId }));
const progress = async (batchId: number) =>
  (await (await batchRoute.GET(new Request("http://localhost/x"), params({ proofId, batchId: String(batchId) }))).json()).batch;
const results = (batchId: number, query = "") => resultsRoute.GET(new Request(`http://localhost/x?${query}`), params({ proofId, batchId: String(batchId) }));

async function finished(batchId: number, ms = 90_000) {
  const deadline = Date.now() + ms;
  for (;;) {
    const b = await progress(batchId);
    if (b.status === "done" || b.status === "cancelled" || Date.now() > deadline) return b;
    await new Promise((r) => setTimeout(r, 250));
  }
}

const trees = treesOn10();
/** One line of the tree list as a graph (sparse6 from gentreeg, or graph6). */
const treeGraph = (line: string) => readListedGraph({ line: 1, text: line }, line.startsWith(":") ? "sparse6" : "graph6");

closeAfterAll(
  async () => {
    delete process.env.CAIRN_BATCH_CHUNK;
    await dropProofs([proofId]);
  },
  { queue: true },
);
beforeAll(async () => {
  ({ proofId, stepId } = await draftCaseStep(
    "Batch claims test",
    "Trees on ten vertices",
    "Of the trees on 10 vertices only $A_{10}$ and $D_{10}$ have $\\rho < 2$.",
  ));
  // OEIS A000055: 106 trees on 10 unlabeled vertices.
  expect(trees).toHaveLength(106);
  // One bad line at the end (line 107): "!" is no graph6/sparse6 byte.
  const bad = `${trees[0].slice(0, 3)}!${trees[0].slice(4)}`;
  listId = await upload([...trees, bad].join("\n") + "\n", "trees-10.s6");
  documentId = await upload("Notes on the search.\n", "notes.txt");
});

describe("a batch claim over the trees on 10 vertices", () => {
  it("refuses without a session (401), for a reviewer (403), on a file that is no graph list or a bad bound (422)", async () => {
    await actAs(null);
    expect((await start({ fileId: listId, op: "<", bound: "2" })).status).toBe(401);
    await actAs("reviewer");
    expect((await start({ fileId: listId, op: "<", bound: "2" })).status).toBe(403);
    await actAs("author");
    const notList = await start({ fileId: documentId, op: "<", bound: "2" });
    expect(notList.status).toBe(422);
    expect((await notList.json()).error.issues[0]).toMatchObject({ path: "fileId", message: expect.stringMatching(/plain text/) });
    const badBound = await start({ fileId: listId, op: "<", bound: "two" });
    expect(badBound.status).toBe(422);
    expect((await badBound.json()).error.issues[0].path).toBe("bound");
    expect((await start({ fileId: listId, op: "≪", bound: "2" })).status).toBe(422);
  });

  it("finds exactly A₁₀ and D₁₀ with ρ < 2, reports the bad line by number, and offers CSV and graph6 of the failures", async () => {
    process.env.CAIRN_BATCH_CHUNK = "40"; // three chunks of the 107 entries
    await actAs("author");
    const res = await start({ fileId: listId, op: "<", bound: "2" });
    expect(res.status).toBe(202);
    const { batch } = await res.json();
    expect(batch).toMatchObject({ total: 107, statement: "every graph of the list: ρ(G) < 2" });
    await actAs("reviewer");
    const b = await finished(batch.id);
    // Smith 1970 (Brouwer & Haemers, Spectra of Graphs, Thm 3.1.3): connected graphs with ρ < 2 are the
    // Dynkin diagrams A_n, D_n, E6, E7, E8; among trees on 10 vertices exactly A₁₀ and D₁₀.
    expect(b).toMatchObject({ status: "done", done: 107, verified: 2, refuted: 104, undecided: 0, unreadable: 1, failing: 105 });
    expect(b.rate).toBeGreaterThan(0);

    const json = await (await results(batch.id)).json();
    expect(json.results).toHaveLength(107);
    const verified = json.results.filter((r: { verdict: string }) => r.verdict === "verified");
    const shapes = verified.map((r: { graph6: string }) => {
      const g = parseGraph6(r.graph6);
      return Array.from({ length: g.n }, (_, v) => degree(g, v))
        .sort((x, y) => y - x)
        .join("");
    });
    expect(shapes.sort()).toEqual(["2222222211", "3222222111"]); // A₁₀ (the path), D₁₀
    expect(verified[0].certificate).not.toBeNull();
    const unreadable = json.results.find((r: { verdict: string }) => r.verdict === "unreadable");
    expect(unreadable).toMatchObject({ line: 107, reason: expect.stringMatching(/^line 107, column 4: /) });

    const failing = await (await results(batch.id, "only=failing")).json();
    expect(failing.results).toHaveLength(105);
    const csv = await (await results(batch.id, "format=csv")).text();
    const csvLines = csv.trimEnd().split("\r\n");
    expect(csvLines[0]).toBe("line,verdict,graph6,sparse6,vertices,edges,method,reason");
    expect(csvLines).toHaveLength(108);
    expect(csvLines.filter((l) => /^\d+,verified,/.test(l))).toHaveLength(2);
    const g6res = await results(batch.id, "format=graph6");
    expect(g6res.headers.get("content-disposition")).toMatch(/batch-\d+-failures\.g6/);
    const g6 = (await g6res.text()).trimEnd().split("\n");
    // 104 refuted trees, each a tree on 10 vertices (9 edges); the unreadable line has no graph to write.
    expect(g6).toHaveLength(104);
    for (const line of g6) expect(parseGraph6(line).edges).toHaveLength(9);
    // The same 104 failing trees in sparse6 (simple graphs re-written): each reads back as the graph6 line's graph.
    const s6res = await results(batch.id, "format=sparse6");
    expect(s6res.headers.get("content-disposition")).toMatch(/batch-\d+-failures\.s6/);
    const s6 = (await s6res.text()).trimEnd().split("\n");
    expect(s6).toHaveLength(104);
    s6.forEach((line, i) => expect(canonicalKeyOf(readGraphText(line))).toBe(canonicalKeyOf(parseGraph6(g6[i]))));

    await actAs("outsider");
    expect((await results(batch.id)).status).toBe(403);
    await actAs(null);
    expect((await batchRoute.GET(new Request("http://localhost/x"), params({ proofId, batchId: String(batch.id) }))).status).toBe(401);
  });

  it("decides each graph once even when a chunk runs twice (a worker died after storing it)", async () => {
    const { BatchClaim, BatchResult } = models();
    const file = await models().StepFile.findByPk(listId);
    // A batch of its own, not queued, so that only this test runs its chunks.
    const b = await BatchClaim.create({
      stepId: Number(stepId),
      fileId: file!.id,
      kind: "spectral-radius-bound",
      op: "<=",
      bound: "2",
      statement: "every graph of the list: ρ(G) ≤ 2",
      total: 107,
      chunkSize: 50,
      checkerVersion: "test",
      createdBy: (await models().User.findOne())!.id,
    });
    expect(await runBatchChunk({ type: "batch", batchId: b.id, chunk: 0 }, "test-a")).toEqual({ decided: 50 });
    expect(await runBatchChunk({ type: "batch", batchId: b.id, chunk: 0 }, "test-b")).toEqual({ decided: 0 });
    await b.reload();
    expect([b.done, b.status, await BatchResult.count({ where: { batchId: b.id } })]).toEqual([50, "running", 50]);
  });

  it("cancels: no chunk is stored after the cancel, and a finished batch cannot be cancelled (409)", async () => {
    process.env.CAIRN_BATCH_CHUNK = "5";
    await actAs("author");
    const { batch } = await (await start({ fileId: listId, op: "<=", bound: "2" })).json();
    const cancelled = await cancelRoute.POST(new Request("http://localhost/x", { method: "POST" }), params({ proofId, batchId: String(batch.id) }));
    expect(cancelled.status).toBe(200);
    const at = await progress(batch.id);
    expect(at.status).toBe("cancelled");
    await new Promise((r) => setTimeout(r, 1_500));
    const later = await progress(batch.id);
    expect(later.done).toBe(at.done);
    expect(await models().BatchResult.count({ where: { batchId: batch.id } })).toBe(later.done);
    expect((await cancelRoute.POST(new Request("http://localhost/x", { method: "POST" }), params({ proofId, batchId: String(batch.id) }))).status).toBe(409);
    await actAs("reviewer");
    expect((await cancelRoute.POST(new Request("http://localhost/x", { method: "POST" }), params({ proofId, batchId: String(batch.id) }))).status).toBe(403);
  });
});

describe("the other batch statements over the trees on 10 vertices", () => {
  // Smith 1970 (Brouwer & Haemers, Spectra of Graphs, Thm 3.1.3): a connected graph has ρ < 2 iff it is a
  // Dynkin diagram A_n, D_n, E6–E8, and ρ ≤ 2 iff also affine Ã_n, D̃_n, Ẽ6–Ẽ8; so a tree with ρ > 2
  // contains an affine tree D̃_k or Ẽ6–Ẽ8 (a proper subgraph of ρ = 2, Perron–Frobenius). Of the 106 trees on
  // 10 vertices (OEIS A000055) only A₁₀ (the path) and D₁₀ are Dynkin; one, D̃₉, is affine (ρ = 2): it is
  // no member of A or D, and it contains itself.
  const run = async (body: Record<string, unknown>) => {
    process.env.CAIRN_BATCH_CHUNK = "40";
    await actAs("author");
    const res = await start({ fileId: listId, ...body });
    expect(res.status, await res.clone().text()).toBe(202);
    const { batch } = await res.json();
    const done = await finished(batch.id);
    const rows = (await (await results(batch.id)).json()).results as Array<{ verdict: string; graph6: string | null; certificate: unknown; reason: string }>;
    return { done, rows, statement: batch.statement as string };
  };

  it("identified as a member of A or D: exactly A₁₀ and D₁₀, each with an isomorphism certificate that re-checks", async () => {
    const { done, rows, statement } = await run({ kind: "identified-as", families: ["A", "D"] });
    expect(statement).toBe("every graph of the list is identified as a member of the families A, D");
    expect(done).toMatchObject({ status: "done", kind: "identified-as", total: 107, verified: 2, refuted: 104, undecided: 0, unreadable: 1 });
    const verified = rows.filter((r) => r.verdict === "verified");
    expect(verified.map((r) => (r.certificate as { family: string; parameter: number }).family).sort()).toEqual(["A", "D"]);
    for (const r of verified) {
      expect(r.certificate).toMatchObject({ kind: "isomorphism", parameter: 10 });
      expect(recheckIdentification(parseGraph(r.graph6!), r.certificate).status).toBe("verified");
    }
    // A refuted tree's certificate (a forbidden affine subgraph) re-checks too.
    const refuted = rows.find((r) => r.verdict === "refuted")!;
    expect(recheckIdentification(parseGraph(refuted.graph6!), refuted.certificate).status).toBe("verified");
  });

  it("contains none of the affine trees D̃4…D̃9, Ẽ6, Ẽ7, Ẽ8: exactly A₁₀ and D₁₀; contains one of them: the other 104", async () => {
    const affine = ["D~4", "D~5", "D~6", "D~7", "D~8", "D~9", "E~6", "E~7", "E~8"];
    const none = await run({ kind: "contains-none-of", patterns: affine });
    expect(none.done).toMatchObject({ status: "done", verified: 2, refuted: 104, unreadable: 1 });
    const shapes = none.rows
      .filter((r) => r.verdict === "verified")
      .map((r) => {
        const g = parseGraph6(r.graph6!);
        return Array.from({ length: g.n }, (_, v) => degree(g, v))
          .sort((x, y) => y - x)
          .join("");
      });
    expect(shapes.sort()).toEqual(["2222222211", "3222222111"]);
    const patterns = affine.map((a) => parseGraph(a));
    for (const r of none.rows.filter((x) => x.graph6).slice(0, 12))
      expect(recheckExclusion(parseGraph6(r.graph6!), patterns, r.certificate).status).toBe("verified");

    const one = await run({ kind: "contains-one-of", patterns: affine, induced: false });
    expect(one.statement).toBe(`every graph of the list contains one of ${affine.join(", ")}`);
    expect(one.done).toMatchObject({ status: "done", verified: 104, refuted: 2, unreadable: 1 });
  });

  it("contains one of the claw K₁,₃ (induced): every tree but the path (a tree without a vertex of degree 3 is a path; common knowledge)", async () => {
    const { done, rows } = await run({ kind: "contains-one-of", patterns: ["star(3)"], induced: true });
    expect(done).toMatchObject({ status: "done", verified: 105, refuted: 1, unreadable: 1 });
    const path = rows.find((r) => r.verdict === "refuted")!;
    expect(parseGraph6(path.graph6!).edges).toHaveLength(9);
    expect(path.certificate).toMatchObject({ kind: "exclusion", absent: [expect.objectContaining({ kind: "absence" })] });
  });

  it("refuses a family that is none (422 on families) and a pattern that does not read (422 on patterns)", async () => {
    await actAs("author");
    const family = await start({ fileId: listId, kind: "identified-as", families: ["F4"] });
    expect(family.status).toBe(422);
    expect((await family.json()).error.issues[0].path).toMatch(/^families/);
    const pattern = await start({ fileId: listId, kind: "contains-one-of", patterns: ["star(three)"] });
    expect(pattern.status).toBe(422);
    expect((await pattern.json()).error.issues[0]).toMatchObject({ path: "patterns", message: expect.stringMatching(/pattern 1/) });
    expect((await start({ fileId: listId, kind: "contains-one-of", patterns: [] })).status).toBe(422);
  });
});

describe("the list is exactly an enumeration, up to isomorphism", () => {
  const run = async (fileId: number, body: Record<string, unknown>) => {
    process.env.CAIRN_BATCH_CHUNK = "40";
    await actAs("author");
    const res = await start({ fileId, ...body });
    expect(res.status, await res.clone().text()).toBe(202);
    const { batch } = await res.json();
    return finished(batch.id);
  };

  it("the 106 trees on 10 vertices (nauty's gentreeg when installed) are exactly Cairn's enumeration of them; with ρ < 2 only A₁₀ and D₁₀ (Smith)", async () => {
    // OEIS A000055: 106 trees on 10 vertices; the list's bad line stays unreadable.
    const all = await run(listId, { kind: "enumeration-exactly", setting: "tree", vertices: 10 });
    expect(all).toMatchObject({ status: "done", total: 107, verified: 106, refuted: 0, undecided: 0, unreadable: 1, missing: 0, note: null });
    expect(all.statement).toBe("the list is, up to isomorphism, exactly the trees on 10 vertices");
    // Brouwer & Haemers Thm 3.1.3 (Smith 1970): the enumeration with ρ < 2 has 2 classes, both listed.
    const small = await run(listId, { kind: "enumeration-exactly", setting: "tree", vertices: 10, op: "<", bound: "2" });
    expect(small).toMatchObject({ status: "done", verified: 2, refuted: 104, missing: 0 });
  });

  it("a list with one tree left out and another listed twice: the repeat is refuted naming the first line, the missing one is counted and named", async () => {
    const listed = [...trees.slice(1), trees[5]];
    const id = await upload(listed.join("\n") + "\n", "trees-10-one-off.s6");
    const b = await run(id, { kind: "enumeration-exactly", setting: "tree", vertices: 10 });
    expect(b).toMatchObject({ status: "done", total: 106, verified: 105, refuted: 1, unreadable: 0, missing: 1 });
    expect(b.note).toMatch(/^1 of the trees on 10 vertices is not listed, e\.g\. \(graph6\) \S+$/);
    const rows = (await (await results(b.id, "only=failing")).json()).results;
    expect(rows).toEqual([
      expect.objectContaining({ line: 106, verdict: "refuted", reason: "G is isomorphic to the graph listed at line 5: the list must name each class once" }),
    ]);
    // The named missing graph is the tree left out.
    const named = parseGraph6(/\(graph6\) (\S+)$/.exec(b.note)![1]);
    expect(isomorphic(named, treeGraph(trees[0]))).toBe(true);
  });

  it("graphs with loops and multiple edges from a sparse6 list: the missing class is named in sparse6, a relabelled repeat is refuted", async () => {
    // Every connected graph on 3 vertices with multiplicities ≤ 2 and loops ≤ 1, from the independent brute force,
    // with P3-with-a-looped-middle left out and the path with a double edge listed twice (the second relabelled).
    const every = bruteForce(3, 2, 1).map(toGraph);
    const loopedMiddle = makeGraph(3, [
      { u: 0, v: 1 },
      { u: 1, v: 2 },
      { u: 1, v: 1, m: 1 },
    ]);
    const doubled = makeGraph(3, [
      { u: 0, v: 1, m: 2 },
      { u: 1, v: 2 },
    ]);
    const kept = every.filter((g) => canonicalKeyOf(g) !== canonicalKeyOf(loopedMiddle));
    const text =
      [
        ...kept,
        makeGraph(3, [
          { u: 2, v: 1, m: 2 },
          { u: 1, v: 0 },
        ]),
      ]
        .map((g) => writeSparse6(g))
        .join("\n") + "\n";
    const id = await upload(text, "multi-3.s6");
    const b = await run(id, { kind: "enumeration-exactly", setting: "multigraph", maxMultiplicity: 2, maxLoop: 1, vertices: 3 });
    expect(b).toMatchObject({ status: "done", total: every.length, verified: every.length - 1, refuted: 1, missing: 1 });
    expect(b.statement).toBe(
      "the list is, up to isomorphism, exactly the connected graphs with edges of multiplicity ≤ 2 and loops of weight ≤ 1 on 3 vertices",
    );
    const named = /\(sparse6\) (\S+)$/.exec(b.note)![1];
    expect(canonicalKeyOf(readGraphText(named))).toBe(canonicalKeyOf(loopedMiddle));
    const rows = (await (await results(b.id, "only=failing")).json()).results;
    const first = kept.findIndex((g) => canonicalKeyOf(g) === canonicalKeyOf(doubled)) + 1;
    expect(rows).toEqual([
      expect.objectContaining({
        line: every.length,
        verdict: "refuted",
        reason: `G is isomorphic to the graph listed at line ${first}: the list must name each class once`,
      }),
    ]);
    // A graph with a double edge has no graph6: the row, the CSV and the sparse6 failures file name it in sparse6.
    expect(rows[0].graph6).toBeNull();
    expect(canonicalKeyOf(readGraphText(rows[0].sparse6))).toBe(canonicalKeyOf(doubled));
    expect((await (await results(b.id, "format=csv")).text()).split("\r\n")[every.length]).toContain(`,refuted,,${rows[0].sparse6},3,2,`);
    expect((await (await results(b.id, "format=sparse6")).text()).trimEnd().split("\n")).toEqual([rows[0].sparse6]);
    expect((await (await results(b.id, "format=graph6")).text()).trim()).toBe("");
    // Bounds that do not fit the setting: 422 naming the field.
    await actAs("author");
    const noLoop = await start({ fileId: id, kind: "enumeration-exactly", setting: "multigraph", maxMultiplicity: 2, vertices: 3 });
    expect(noLoop.status).toBe(422);
    expect((await noLoop.json()).error.issues[0].path).toBe("maxLoop");
  });

  it("refuses an enumeration too large to run (422 on vertices)", async () => {
    await actAs("author");
    const res = await start({ fileId: listId, kind: "enumeration-exactly", setting: "simple", vertices: 12 });
    expect(res.status).toBe(422);
    expect((await res.json()).error.issues[0].path).toBe("vertices");
  });

  it("under ρ ≤ 2 goes to 20 vertices: Smith's four graphs are the list, a list without D₂₀ names it; past the cap a 422 says what to lower", async () => {
    // The connected graphs on 20 vertices with ρ ≤ 2: A₂₀, D₂₀ (ρ < 2), the cycle Ã₁₉ and D̃₁₉ (ρ = 2); J. H. Smith 1970,
    // Brouwer & Haemers, Spectra of Graphs, Thm 3.1.3.
    const smith20 = [dynkinA(20), dynkinD(20), affineA(19), affineD(19)];
    const listOf = (gs: Graph[]) => gs.map((g) => writeGraph6(g)).join("\n") + "\n";
    const statement = { kind: "enumeration-exactly", setting: "simple", vertices: 20, op: "<=", bound: "2" };
    const id = await upload(listOf(smith20), "smith-20.g6");
    expect(await run(id, statement)).toMatchObject({ status: "done", total: 4, verified: 4, refuted: 0, undecided: 0, missing: 0, note: null });
    const short = await run(await upload(listOf(smith20.filter((g) => g !== smith20[1])), "smith-20-short.g6"), statement);
    expect(short).toMatchObject({ status: "done", total: 3, verified: 3, missing: 1 });
    expect(isomorphic(parseGraph6(/\(graph6\) (\S+)$/.exec(short.note)![1]), dynkinD(20))).toBe(true);

    await actAs("author");
    const refused = async (body: Record<string, unknown>) => {
      const res = await start({ fileId: id, ...statement, ...body });
      expect(res.status).toBe(422);
      return (await res.json()).error.issues[0] as { path: string; message: string };
    };
    expect(await refused({ vertices: 21 })).toMatchObject({
      path: "vertices",
      message: "at most 20 vertices, as for an enumeration claim; lower the number of vertices",
    });
    // A bound that does not read is answered on the bound, not on the number of vertices (common practice: name the field at fault).
    expect(await refused({ vertices: 5, bound: "2+" })).toMatchObject({ path: "bound" });
    // ρ ≤ 3 is above √(2+√5): the cap of every connected graph on n vertices applies (11,117 on 8 vertices, OEIS A001349).
    expect(await refused({ vertices: 9, bound: "3" })).toMatchObject({
      path: "vertices",
      message: "choose 1 to 8 vertices for connected simple graphs (lower the number of vertices, or give a bound b ≤ sqrt(2+sqrt(5)) on ρ to go up to 20)",
    });
  });
});

describe("the batch claims in the exported bundle", () => {
  it("carry every graph's verdict and certificate, and the offline re-check agrees with each batch; a forged verdict is rejected", async () => {
    const snapshot = await loadSnapshot(Number(proofId));
    const bundle = buildBundle(snapshot!, { kind: "draft", exportedAt: new Date().toISOString(), exportedBy: "Ada Quenby" });
    const items = bundle.items.filter((i) => i.type === "batch");
    const made = await models().BatchClaim.count({ where: { stepId: Number(stepId) } });
    expect(items).toHaveLength(made);
    const report = checkBundle(JSON.parse(JSON.stringify(bundle)), "bundle.json");
    const lines = report.lines.filter((l) => l.label.startsWith("batch "));
    expect(lines).toHaveLength(made);
    // Smith 1970 (Brouwer & Haemers Thm 3.1.3): 2 of the 106 trees are A or D; the bad line stays unreadable.
    const identified = items.findIndex((i) => (i.data as BatchItemData).statement.kind === "identified-as");
    expect(lines[identified]).toMatchObject({
      status: "refuted",
      text: expect.stringMatching(/: 2 of 107 graphs verified, 104 refuted, 0 undecided, 1 unreadable; 106 certificates re-checked$/),
    });
    for (const l of lines) expect(l.text).not.toMatch(/records|does not re-check|CHANGED/);

    // Forge one verdict and re-seal every digest: the re-check still names the graph's line.
    const forged = JSON.parse(JSON.stringify(bundle)) as { items: Array<{ id: string; type: BundleItemType; data: BatchItemData }> };
    const item = forged.items.find((i) => i.type === "batch" && i.data.statement.kind === "identified-as")!;
    const r = item.data.results.find((x) => x.verdict === "refuted")! as { verdict: string; line: number };
    r.verdict = "verified";
    const resealed = sealBundle(bundle.export, forged.items);
    const line = checkBundle(resealed, "forged.json").lines.find((l) => l.label === item.id)!;
    expect(line.text).toContain(`line ${r.line}: the bundle records "verified" but the re-check gives "refuted"`);
  });

  it("answers 409 naming the list when a batch's list is gone from the file store, writes no export, and exports again once it is back", async () => {
    const { ProofExport, StepFile } = models();
    const file = (await StepFile.findByPk(listId))!;
    const bytes = (await fileStore().get(file.sha256))!;
    const exportsBefore = await ProofExport.count({ where: { proofId: Number(proofId) } });
    await fileStore().delete(file.sha256);
    try {
      await actAs("author");
      const res = await exportsRoute.POST(jsonRequest("/x", "POST", { kind: "draft" }), params({ proofId }));
      expect(res.status).toBe(409);
      expect((await res.json()).error.message).toMatch(/graph list "trees-10\.s6" of batch claim \d+ is missing from the file store/);
      expect(await ProofExport.count({ where: { proofId: Number(proofId) } })).toBe(exportsBefore);
    } finally {
      await fileStore().put(bytes);
    }
    const again = await exportsRoute.POST(jsonRequest("/x", "POST", { kind: "draft" }), params({ proofId }));
    expect(again.status, await again.clone().text()).toBe(201);
  });
});
