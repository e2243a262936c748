/**
 * Uploads in parts (lib/data/part-uploads.ts), with the local-disk store and with the S3 store against s3rver on
 * loopback: a file of several parts comes back byte for byte with its SHA-256; two uploads of the same bytes store
 * one object; retrying a part is harmless and the server says which parts it has; every refusal (413 declared,
 * 400 part number and length, 409 missing parts named, 409 SHA-256, 415 by content, 403/404 for non-members and
 * other steps); the browser's upload client (components/files/upload-request.ts, its JSON calls through the one API
 * client) against the same handlers, showing a refusal's own message; and an upload stopped between parts leaves no
 * row, and the sweep removes its staged parts.
 */
import { beforeAll, describe, expect, it, vi } from "vitest";

vi.mock("next-auth", async (importOriginal) => ({ ...(await importOriginal<typeof import("next-auth")>()), getServerSession: vi.fn() }));

import { readdir } from "node:fs/promises";
import { randomBytes } from "node:crypto";
import path from "node:path";
import { actAs, jsonRequest, params, storesForFile } from "./helpers";
import { addStep, draftCaseStep, dropProofs } from "./workspace-fixture";
import { models } from "@/models";
import { fileStore, sha256Hex } from "@/lib/storage";
import { sweepPartUploads } from "@/lib/data/part-uploads";
import { useStore } from "../support/s3-fake";
import * as startRoute from "@/app/api/proofs/[proofId]/steps/[stepId]/uploads/route";
import * as uploadRoute from "@/app/api/proofs/[proofId]/steps/[stepId]/uploads/[uploadId]/route";
import * as partRoute from "@/app/api/proofs/[proofId]/steps/[stepId]/uploads/[uploadId]/parts/[part]/route";
import * as finishRoute from "@/app/api/proofs/[proofId]/steps/[stepId]/uploads/[uploadId]/finish/route";
import * as fileRoute from "@/app/api/proofs/[proofId]/files/[fileId]/route";
import { refusalText, sendFile } from "@/components/files/upload-request";

const PART = 1024;
const PART_KEYS = ["CAIRN_UPLOAD_PART_BYTES", "CAIRN_UPLOAD_PARTS_DIR", "CAIRN_UPLOAD_MAX_BYTES"];
let proofId: string;
let stepId: string;
let otherStepId: string;
const stores = storesForFile("cairn-parts-", 5, PART_KEYS, () => dropProofs([proofId]));

beforeAll(async () => {
  const drafted = await draftCaseStep("Uploads in parts", "Trees on twelve vertices", "A computer search over a long list of graphs.");
  ({ proofId, stepId } = drafted);
  otherStepId = String((await addStep(proofId, drafted.caseId, "Another step.")).id);
});

const start = (body: unknown, step = stepId) => startRoute.POST(jsonRequest("/x", "POST", body), params({ proofId, stepId: step }));
const put = (uploadId: number, part: string | number, bytes: Uint8Array, step = stepId) =>
  partRoute.PUT(
    new Request("http://localhost/x", { method: "PUT", body: bytes as Uint8Array<ArrayBuffer> }),
    params({ proofId, stepId: step, uploadId: String(uploadId), part: String(part) }),
  );
const status = (uploadId: number, step = stepId) =>
  uploadRoute.GET(new Request("http://localhost/x"), params({ proofId, stepId: step, uploadId: String(uploadId) }));
const finish = (uploadId: number, step = stepId) =>
  finishRoute.POST(new Request("http://localhost/x", { method: "POST" }), params({ proofId, stepId: step, uploadId: String(uploadId) }));
const download = (fileId: number) => fileRoute.GET(new Request("http://localhost/x"), params({ proofId, fileId: String(fileId) }));
const fileRows = () => models().StepFile.count({ where: { stepId: Number(stepId) } });
const objects = async () => {
  const out: string[] = [];
  for await (const o of fileStore().list()) out.push(o.sha256);
  return out.sort();
};
const staged = async () => readdir(process.env.CAIRN_UPLOAD_PARTS_DIR!).catch(() => [] as string[]);

/** A graph6 list (K_3 = "Bw", P_3 = "Bg": nauty's formats.txt, worked by hand) of at least `min` bytes, made different by `salt`. */
function graphList(min: number, salt: number): Uint8Array {
  const lines: string[] = [];
  let size = 0;
  for (let i = 0; size < min; i++) {
    const line = (i + salt) % 3 === 0 ? "Bw" : "Bg";
    lines.push(line);
    size += 3;
  }
  lines.push(salt % 2 ? "Bw" : "Bg");
  return new TextEncoder().encode(lines.join("\n") + "\n");
}

/** Sends every part of `bytes` in order (or only those listed), returning the upload's id. */
async function sendParts(bytes: Uint8Array, only?: number[]): Promise<number> {
  const res = await start({ name: "search.g6", size: bytes.byteLength, sha256: sha256Hex(bytes) });
  expect(res.status).toBe(201);
  const { upload } = await res.json();
  expect(upload.partSize).toBe(PART);
  expect(upload.parts).toBe(Math.ceil(bytes.byteLength / PART));
  for (let n = 1; n <= upload.parts; n++) {
    if (only && !only.includes(n)) continue;
    const r = await put(upload.id, n, bytes.slice((n - 1) * PART, n * PART));
    expect(r.status).toBe(200);
  }
  return upload.id;
}

/**
 * Stubs the browser's fetch and XMLHttpRequest for components/files/upload-request.ts: each request to the upload routes
 * is answered by the route handler in this process; returns the list of requests made ("fetch POST uploads", …).
 */
function stubBrowserRequests(): string[] {
  const sent: string[] = [];
  const serve = async (via: string, method: string, url: string, body?: BodyInit | null, headers?: HeadersInit): Promise<Response> => {
    const m = /^\/api\/proofs\/(\d+)\/steps\/(\d+)\/uploads(?:\/(\d+)(?:\/(finish)|\/parts\/(\d+))?)?$/.exec(url);
    if (!m) throw new Error(`no route for ${method} ${url} in this test`);
    const request = new Request(`http://localhost${url}`, { method, body, headers });
    const at = { proofId: m[1], stepId: m[2] };
    sent.push(`${via} ${method} ${!m[3] ? "uploads" : m[4] ? "finish" : m[5] ? `parts/${m[5]}` : "upload"}`);
    if (!m[3]) return startRoute.POST(request, params(at));
    if (m[4]) return finishRoute.POST(request, params({ ...at, uploadId: m[3] }));
    if (m[5]) return partRoute.PUT(request, params({ ...at, uploadId: m[3], part: m[5] }));
    return uploadRoute.GET(request, params({ ...at, uploadId: m[3] }));
  };
  vi.stubGlobal("fetch", (url: string, init: RequestInit = {}) => serve("fetch", init.method ?? "GET", url, init.body, init.headers));
  class BrowserXhr {
    status = 0;
    responseText = "";
    upload: { onprogress?: (e: { loaded: number; total: number; lengthComputable: boolean }) => void } = {};
    onload?: () => void;
    onerror?: () => void;
    onabort?: () => void;
    private call = { method: "GET", url: "", headers: {} as Record<string, string> };
    open(method: string, url: string) {
      Object.assign(this.call, { method, url });
    }
    setRequestHeader(name: string, value: string) {
      this.call.headers[name] = value;
    }
    abort() {
      this.onabort?.();
    }
    send(body: Blob) {
      void (async () => {
        const bytes = new Uint8Array(await body.arrayBuffer());
        const res = await serve("xhr", this.call.method, this.call.url, bytes, this.call.headers);
        this.upload.onprogress?.({ loaded: bytes.byteLength, total: bytes.byteLength, lengthComputable: true });
        [this.status, this.responseText] = [res.status, await res.text()];
        this.onload?.();
      })().catch(() => this.onerror?.());
    }
  }
  vi.stubGlobal("XMLHttpRequest", BrowserXhr);
  return sent;
}

describe.each(["local", "s3"])("uploads in parts with the %s store", (driver) => {
  beforeAll(() => {
    useStore(driver, stores.fake, path.join(stores.dir, "files"));
    process.env.CAIRN_UPLOAD_PART_BYTES = String(PART);
    process.env.CAIRN_UPLOAD_PARTS_DIR = path.join(stores.dir, `parts-${driver}`);
  });
  const salt = driver === "s3" ? 1 : 2;

  it("a file of several parts comes back byte for byte, with its SHA-256; the upload's row and staged parts are gone", async () => {
    await actAs("author");
    const bytes = graphList(4 * PART + 100, salt);
    const id = await sendParts(bytes);
    const res = await finish(id);
    expect(res.status).toBe(201);
    const { file } = await res.json();
    expect(file).toMatchObject({ kind: "graph-list", graphFormat: "graph6", size: bytes.byteLength, sha256: sha256Hex(bytes), name: "search.g6" });
    // The count is the number of lines written, counted independently here.
    expect(file.graphCount).toBe(new TextDecoder().decode(bytes).trim().split("\n").length);
    expect(await models().PartUpload.findByPk(id)).toBeNull();
    expect(await staged()).not.toContain(String(id));
    await actAs("reviewer");
    const got = Buffer.from(await (await download(file.id)).arrayBuffer());
    expect(got.equals(Buffer.from(bytes))).toBe(true);
    expect(sha256Hex(got)).toBe(file.sha256);
  });

  it("two uploads in parts of the same bytes store one object; the second to another step is a new row naming it", async () => {
    await actAs("author");
    const bytes = graphList(2 * PART + 7, salt + 10);
    const first = await (await finish(await sendParts(bytes))).json();
    const before = await objects();
    expect(before).toContain(sha256Hex(bytes));
    const again = await finish(await sendParts(bytes));
    expect(again.status).toBe(200);
    expect(await again.json()).toMatchObject({ duplicate: true, file: { id: first.file.id } });
    const res = await start({ name: "copy.g6", size: bytes.byteLength }, otherStepId);
    const { upload } = await res.json();
    for (let n = 1; n <= upload.parts; n++) expect((await put(upload.id, n, bytes.slice((n - 1) * PART, n * PART), otherStepId)).status).toBe(200);
    const elsewhere = await finish(upload.id, otherStepId);
    expect(elsewhere.status).toBe(201);
    expect((await elsewhere.json()).file).toMatchObject({ sha256: first.file.sha256 });
    expect(await objects()).toEqual(before);
  });

  it("a retried part is harmless; after a dropped connection the server says which parts it has", async () => {
    await actAs("author");
    const bytes = graphList(3 * PART, salt + 20);
    const id = await sendParts(bytes, [1, 3]);
    // Part 1 again, as after a lost answer.
    expect((await put(id, 1, bytes.slice(0, PART))).status).toBe(200);
    const { upload } = await (await status(id)).json();
    expect(upload.received).toEqual([1, 3]);
    expect(upload.missing).toEqual([2, 4]);
    // Finishing with parts missing names them.
    const early = await finish(id);
    expect(early.status).toBe(409);
    const body = await early.json();
    expect(body.error.message).toMatch(/parts 2, 4 of 4 are missing/);
    expect(body.error.missing).toEqual([2, 4]);
    for (const n of upload.missing) expect((await put(id, n, bytes.slice((n - 1) * PART, n * PART))).status).toBe(200);
    const done = await finish(id);
    expect(done.status).toBe(201);
    expect((await done.json()).file.sha256).toBe(sha256Hex(bytes));
  });

  it("413 naming the limit when the declared size is past it; 400 for a wrong part number or length; 409 for a SHA-256 that does not match", async () => {
    await actAs("author");
    process.env.CAIRN_UPLOAD_MAX_BYTES = String(8 * PART);
    try {
      const big = await start({ name: "big.g6", size: 8 * PART + 1 });
      expect(big.status).toBe(413);
      expect((await big.json()).error).toMatchObject({ code: "too_large", limitBytes: 8 * PART, message: expect.stringMatching(/upload limit of 8 KiB/) });
    } finally {
      delete process.env.CAIRN_UPLOAD_MAX_BYTES;
    }
    const bytes = graphList(2 * PART, salt + 30);
    const id = await sendParts(bytes, []);
    for (const n of [0, 4, "x"]) {
      const r = await put(id, n, bytes.slice(0, PART));
      expect(r.status).toBe(400);
      expect((await r.json()).error.message).toMatch(/numbered 1 to 3/);
    }
    const short = await put(id, 1, bytes.slice(0, PART - 1));
    expect(short.status).toBe(400);
    expect((await short.json()).error.message).toMatch(/Part 1 must be exactly 1024 bytes.*1023 bytes/);
    const long = await put(id, 3, bytes.slice(0, PART));
    expect(long.status).toBe(400);
    expect((await long.json()).error.message).toMatch(/Part 3 must be exactly/);
    // Parts of the right length but other bytes: the declared SHA-256 catches it, and nothing is stored.
    const before = [await fileRows(), await objects()];
    for (const n of [1, 2, 3]) {
      const part = new Uint8Array(n < 3 ? PART : bytes.byteLength - 2 * PART).fill(0x42);
      expect((await put(id, n, part)).status).toBe(200);
    }
    const wrong = await finish(id);
    expect(wrong.status).toBe(409);
    expect((await wrong.json()).error.message).toMatch(/not the [0-9a-f]{64} declared/);
    expect([await fileRows(), await objects()]).toEqual(before);
  });

  it("415 by content at the finish, and no row", async () => {
    await actAs("author");
    const jpeg = new Uint8Array(PART + 10);
    jpeg.set([0xff, 0xd8, 0xff, 0xe0, 0, 0x10, 0x4a, 0x46, 0x49, 0x46]);
    jpeg.set(randomBytes(PART), 10);
    const res = await start({ name: "graphs.g6", size: jpeg.byteLength });
    const { upload } = await res.json();
    expect((await put(upload.id, 1, jpeg.slice(0, PART))).status).toBe(200);
    expect((await put(upload.id, 2, jpeg.slice(PART))).status).toBe(200);
    const before = await fileRows();
    const refused = await finish(upload.id);
    expect(refused.status).toBe(415);
    expect((await refused.json()).error.message).toMatch(/not PDF, PNG or gzip/);
    expect(await fileRows()).toBe(before);
  });

  it("the browser's upload client sends its JSON calls through the API client: a file arrives in parts, and a refusal shows the server's message", async () => {
    await actAs("author");
    // The browser's fetch and XMLHttpRequest, answered by the route handlers in this process (as the signed-in author).
    const sent = stubBrowserRequests();
    try {
      const bytes = graphList(2 * PART + 5, salt + 60);
      const file = new File([bytes as Uint8Array<ArrayBuffer>], "client.g6");
      let progress = 0;
      const answer = await sendFile(Number(proofId), Number(stepId), file, "", PART, (n) => (progress = n));
      expect(answer.status).toBe(201);
      expect(answer.body?.file?.name).toBe("client.g6");
      expect(progress).toBe(bytes.byteLength);
      // Start, ask which parts are in, finish: JSON through the API client; the three parts as raw bytes.
      expect(sent).toEqual(["fetch POST uploads", "xhr PUT parts/1", "xhr PUT parts/2", "xhr PUT parts/3", "fetch GET upload", "fetch POST finish"]);

      // A 4xx of the start: the form shows the server's own message (naming the limit), as the route gives it.
      process.env.CAIRN_UPLOAD_MAX_BYTES = String(8 * PART);
      try {
        const big = new File([new Uint8Array(8 * PART + 1)], "big.g6");
        const direct = (await (await start({ name: "big.g6", size: big.size })).json()).error.message as string;
        expect(direct).toMatch(/upload limit of 8 KiB/);
        const refused = await sendFile(Number(proofId), Number(stepId), big, "", PART, () => {});
        expect(refused.status).toBe(413);
        expect(refusalText(refused)).toBe(direct);
      } finally {
        delete process.env.CAIRN_UPLOAD_MAX_BYTES;
      }

      // A 4xx of the finish (the content is no file Cairn keeps): its message, not "The server answered …".
      const jpeg = new Uint8Array(PART + 10);
      jpeg.set([0xff, 0xd8, 0xff, 0xe0, 0, 0x10, 0x4a, 0x46, 0x49, 0x46]);
      const refused = await sendFile(Number(proofId), Number(stepId), new File([jpeg], "graphs.g6"), "", PART, () => {});
      expect(refused.status).toBe(415);
      expect(refusalText(refused)).toMatch(/not PDF, PNG or gzip/);

      // A JSON call that cannot reach the server says so in words, not as the browser's "Failed to fetch".
      vi.stubGlobal("fetch", () => Promise.reject(new TypeError("Failed to fetch")));
      await expect(sendFile(Number(proofId), Number(stepId), new File([jpeg], "graphs.g6"), "", PART, () => {})).rejects.toThrow(
        "The connection failed during the upload; nothing was saved. Try again.",
      );
    } finally {
      vi.unstubAllGlobals();
    }
  });

  it("403 for a referee or an outsider, 401 signed out, 404 for an upload of another step", async () => {
    await actAs("author");
    const bytes = graphList(PART + 1, salt + 40);
    const id = await sendParts(bytes, [1]);
    for (const who of ["reviewer", "outsider"]) {
      await actAs(who);
      expect((await start({ name: "x.g6", size: 10 })).status).toBe(403);
      expect((await put(id, 2, bytes.slice(PART))).status).toBe(403);
      expect((await status(id)).status).toBe(403);
      expect((await finish(id)).status).toBe(403);
    }
    await actAs(null);
    expect((await put(id, 2, bytes.slice(PART))).status).toBe(401);
    await actAs("author");
    expect((await status(id, otherStepId)).status).toBe(404);
    expect((await put(id, 2, bytes.slice(PART), otherStepId)).status).toBe(404);
    expect((await status(id)).status).toBe(200);
  });

  it("an upload stopped between parts and never finished leaves no row; the sweep removes its row and staged parts", async () => {
    await actAs("author");
    const rowsBefore = await fileRows();
    const objectsBefore = await objects();
    const bytes = graphList(3 * PART, salt + 50);
    const id = await sendParts(bytes, [1, 2]);
    expect(await staged()).toContain(String(id));
    // A young upload is left alone.
    expect(await sweepPartUploads(3_600_000)).toBe(0);
    expect(await models().PartUpload.findByPk(id)).not.toBeNull();
    // An hour later it is abandoned.
    // (The part of the scheduled file sweep that handles uploads in parts: the whole sweep would also judge other tests' files.)
    expect(await sweepPartUploads(3_600_000, Date.now() + 3_600_001)).toBeGreaterThanOrEqual(1);
    expect(await models().PartUpload.findByPk(id)).toBeNull();
    expect(await staged()).not.toContain(String(id));
    expect(await fileRows()).toBe(rowsBefore);
    // No object for the half-sent file (its parts never reached the store).
    expect((await objects()).filter((o) => !objectsBefore.includes(o))).toEqual([]);
    expect((await finish(id)).status).toBe(404);
  });
});
