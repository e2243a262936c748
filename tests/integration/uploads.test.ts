/**
 * Uploads to a step: who may upload (authors and the owner) and read (members), type by content
 * (415), the size limit (413, named), de-duplication (the same bytes stored once), and an upload cut
 * off half-way (no row, no object). Runs once with the local-disk store and once with the S3 store
 * against s3rver on loopback.
 */
import { beforeAll, describe, expect, it, vi } from "vitest";

vi.mock("next-auth", async (importOriginal) => ({ ...(await importOriginal<typeof import("next-auth")>()), getServerSession: vi.fn() }));

import path from "node:path";
import { gzipSync } from "fflate";
import { actAs, params, storesForFile } from "./helpers";
import { addStep, draftCaseStep, dropProofs } from "./workspace-fixture";
import { models } from "@/models";
import { fileStore, sha256Hex } from "@/lib/storage";
import { useStore } from "../support/s3-fake";
import * as filesRoute from "@/app/api/proofs/[proofId]/steps/[stepId]/files/route";
import * as fileRoute from "@/app/api/proofs/[proofId]/files/[fileId]/route";

let proofId: string;
let stepId: string;
const stores = storesForFile("cairn-upload-", 1, [], () => dropProofs([proofId]));

beforeAll(async () => {
  ({ proofId, stepId } = await draftCaseStep("Uploads test", "Trees on ten vertices", "A computer search over all trees on 10 vertices."));
});

const bytes = (s: string) => new TextEncoder().encode(s);
const upload = (body: BodyInit, query = "name=list.g6", step = stepId) =>
  filesRoute.POST(
    new Request(`http://localhost/x?${query}`, {
      method: "POST",
      body,
      headers: { "content-type": "application/octet-stream" },
      duplex: "half",
    } as RequestInit),
    params({ proofId, stepId: step }),
  );
const list = () => filesRoute.GET(new Request("http://localhost/x"), params({ proofId, stepId }));
const download = (fileId: number) => fileRoute.GET(new Request("http://localhost/x"), params({ proofId, fileId: String(fileId) }));
const rows = () => models().StepFile.count({ where: { stepId: Number(stepId) } });
const objects = async () => {
  const out: string[] = [];
  for await (const o of fileStore().list()) out.push(o.sha256);
  return out;
};

describe.each(["local", "s3"])("uploads with the %s store", (driver) => {
  beforeAll(() => {
    useStore(driver, stores.fake, path.join(stores.dir, "files"));
  });

  // K_3 ("Bw") and the path P_3 ("Bg") in graph6 (nauty's formats.txt; worked by hand).
  const g6 = "Bw\nBg\n";

  it("401 without a session, 403 for a reviewer or a non-member, nothing stored", async () => {
    const before = await objects();
    await actAs(null);
    expect((await upload(bytes(g6))).status).toBe(401);
    await actAs("reviewer");
    const refused = await upload(bytes(g6));
    expect(refused.status).toBe(403);
    expect((await refused.json()).error.message).toMatch(/Only the proof's authors/);
    await actAs("outsider");
    expect((await upload(bytes(g6))).status).toBe(403);
    expect(await objects()).toEqual(before);
  });

  it("stores a graph list (201), lists it for members, and serves the same bytes to them only", async () => {
    await actAs("author");
    const text = `Bw\nBg\nBw\n`.repeat(driver === "s3" ? 2 : 1);
    const res = await upload(bytes(text), "name=search/out.g6&kind=graph-list");
    expect(res.status).toBe(201);
    const { file } = await res.json();
    expect(file).toMatchObject({
      kind: "graph-list",
      graphFormat: "graph6",
      graphCount: driver === "s3" ? 6 : 3,
      name: "out.g6",
      sha256: sha256Hex(bytes(text)),
      size: text.length,
    });
    await actAs("reviewer");
    const listed = (await (await list()).json()).files.map((f: { id: number }) => f.id);
    expect(listed).toContain(file.id);
    const got = await download(file.id);
    expect(got.status).toBe(200);
    expect(got.headers.get("content-disposition")).toMatch(/^attachment; filename="out.g6"/);
    expect(got.headers.get("x-content-type-options")).toBe("nosniff");
    expect(await got.text()).toBe(text);
    await actAs("outsider");
    expect((await download(file.id)).status).toBe(403);
    expect((await list()).status).toBe(403);
    await actAs(null);
    expect((await download(file.id)).status).toBe(401);
  });

  it("stores the same bytes once: again on this step gives the same row (200), on another step a new row and no new object", async () => {
    await actAs("author");
    // Different bytes per driver, since both runs upload to the same step.
    const text = "Bw\n" + "Bg\n".repeat(driver === "s3" ? 3 : 2);
    const first = await (await upload(bytes(text))).json();
    const before = (await objects()).length;
    const again = await upload(bytes(text), "name=renamed.g6");
    expect(again.status).toBe(200);
    expect(await again.json()).toMatchObject({ duplicate: true, file: { id: first.file.id } });
    const other = String((await addStep(proofId, (await models().Step.findByPk(Number(stepId)))!.caseId, "Another step")).id);
    await actAs("author");
    const elsewhere = await upload(bytes(text), "name=copy.g6", other);
    expect(elsewhere.status).toBe(201);
    const row = (await elsewhere.json()).file;
    expect(row.sha256).toBe(first.file.sha256);
    expect(row.id).not.toBe(first.file.id);
    expect((await objects()).length).toBe(before);
  });

  it("decides the type by content, not name: 415 for other binary data, or content that contradicts the kind", async () => {
    await actAs("author");
    const before = await rows();
    const jpeg = new Uint8Array([0xff, 0xd8, 0xff, 0xe0, 0, 0x10, 0x4a, 0x46, 0x49, 0x46, 0, 1, 2, 3]);
    const res = await upload(jpeg, "name=graphs.g6");
    expect(res.status).toBe(415);
    expect((await res.json()).error).toMatchObject({ code: "unsupported_media_type", message: expect.stringMatching(/not PDF, PNG or gzip/) });
    const pdfAsList = await upload(bytes("%PDF-1.7\n1 0 obj\n"), "name=graphs.g6&kind=graph-list");
    expect(pdfAsList.status).toBe(415);
    expect((await pdfAsList.json()).error.message).toMatch(/by its content this file is a PDF document/);
    // A PDF named .g6 is still a PDF: stored as a document.
    const pdf = await upload(bytes(`%PDF-1.7\n% ${driver}\n`), "name=graphs.g6");
    expect(pdf.status).toBe(201);
    expect((await pdf.json()).file).toMatchObject({ kind: "document", mediaType: "application/pdf" });
    expect(await rows()).toBe(before + 1);
  });

  it("takes a gzip-compressed graph list and serves it back compressed", async () => {
    await actAs("author");
    const text = `Bw\nBg\n`.repeat(driver === "s3" ? 40 : 50);
    const gz = gzipSync(bytes(text));
    const res = await upload(gz, "name=list.g6.gz");
    expect(res.status).toBe(201);
    const { file } = await res.json();
    expect(file).toMatchObject({ graphCount: text.split("\n").length - 1, mediaType: "application/gzip" });
    await actAs("reviewer");
    expect(Buffer.from(await (await download(file.id)).arrayBuffer()).equals(Buffer.from(gz))).toBe(true);
  });

  it("413 past the upload limit, naming it, and nothing stored", async () => {
    await actAs("author");
    process.env.CAIRN_UPLOAD_MAX_BYTES = "4096";
    try {
      const before = [await rows(), (await objects()).length];
      const res = await upload(bytes("Bw\n".repeat(2000)));
      expect(res.status).toBe(413);
      expect((await res.json()).error).toMatchObject({ code: "too_large", limitBytes: 4096, message: expect.stringMatching(/upload limit of 4 KiB/) });
      expect([await rows(), (await objects()).length]).toEqual(before);
    } finally {
      delete process.env.CAIRN_UPLOAD_MAX_BYTES;
    }
  });

  it("an upload cut off half-way leaves no row and no object", async () => {
    await actAs("author");
    const before = [await rows(), (await objects()).sort()];
    const body = new ReadableStream<Uint8Array>({
      start(controller) {
        controller.enqueue(bytes("Bw\nBg\n".repeat(100)));
        controller.error(new Error("connection reset by the client"));
      },
    });
    const res = await upload(body);
    expect(res.status).toBeGreaterThanOrEqual(400);
    expect([await rows(), (await objects()).sort()]).toEqual(before);
  });

  it("422 without a name", async () => {
    await actAs("author");
    const res = await upload(bytes("Bw\n"), "kind=graph-list");
    expect(res.status).toBe(422);
    expect((await res.json()).error.issues[0].path).toBe("name");
  });
});
