/**
 * Files uploaded to a claim (supporting documents, a claims file), with the local-disk store and with the S3 store
 * against s3rver: stored once by SHA-256 as files of the claim's step, linked to the claim; listed for the claim and
 * downloadable by members; refused to outsiders (403), to the signed-out (401), to a referee limited to other cases
 * (403), to referees uploading (403); 404 for a claim of another proof; an upload in parts names its claim; 415 by content.
 */
import { beforeAll, describe, expect, it, vi } from "vitest";

vi.mock("next-auth", async (importOriginal) => ({ ...(await importOriginal<typeof import("next-auth")>()), getServerSession: vi.fn() }));

import { mkdtemp, rm } from "node:fs/promises";
import { tmpdir } from "node:os";
import path from "node:path";
import { actAs, closeAfterAll, demoProofId, jsonRequest, params, userIdOf } from "./helpers";
import { addCase, addStep, draftProof, dropProofs } from "./workspace-fixture";
import { models } from "@/models";
import { sha256Hex } from "@/lib/storage";
import { rememberEnv, s3FakePort, startS3Fake, STORAGE_KEYS, useStore, type S3Fake } from "../support/s3-fake";
import * as claimsRoute from "@/app/api/proofs/[proofId]/steps/[stepId]/claims/route";
import * as claimFilesRoute from "@/app/api/proofs/[proofId]/claims/[claimId]/files/route";
import * as stepFilesRoute from "@/app/api/proofs/[proofId]/steps/[stepId]/files/route";
import * as startRoute from "@/app/api/proofs/[proofId]/steps/[stepId]/uploads/route";
import * as partRoute from "@/app/api/proofs/[proofId]/steps/[stepId]/uploads/[uploadId]/parts/[part]/route";
import * as finishRoute from "@/app/api/proofs/[proofId]/steps/[stepId]/uploads/[uploadId]/finish/route";
import * as fileRoute from "@/app/api/proofs/[proofId]/files/[fileId]/route";
import * as fileClaimsRoute from "@/app/api/proofs/[proofId]/files/[fileId]/claims/route";

const PART = 1024;
const restoreEnv = rememberEnv([...STORAGE_KEYS, "CAIRN_UPLOAD_PART_BYTES", "CAIRN_UPLOAD_PARTS_DIR"]);
let dir: string;
let fake: S3Fake;
let proofId: string;
let caseIn: number;
let stepIn: number;
let stepOut: number;
let claimIn: number;
let claimOut: number;

const spectral = { format: "cairn-claim/1", kind: "spectral-radius-bound", graph: { format: "named", text: "path(3)" }, op: "<", bound: "2" };
async function claimOn(stepId: number): Promise<number> {
  await actAs("author");
  const res = await claimsRoute.POST(jsonRequest("/x", "POST", { claims: [spectral] }), params({ proofId, stepId: String(stepId) }));
  expect(res.status).toBeLessThan(300);
  return (await res.json()).claims[0].id;
}

closeAfterAll(
  async () => {
    restoreEnv();
    await dropProofs([proofId]);
    await fake?.stop();
    await rm(dir, { recursive: true, force: true });
  },
  { queue: true },
);
beforeAll(async () => {
  dir = await mkdtemp(path.join(tmpdir(), "cairn-claim-files-"));
  fake = await startS3Fake(s3FakePort(6));
  proofId = await draftProof("Claim files");
  caseIn = await addCase(proofId, "Paths");
  const caseOut = await addCase(proofId, "Stars");
  stepIn = (await addStep(proofId, caseIn, "The path on three vertices has spectral radius below 2.")).id;
  stepOut = (await addStep(proofId, caseOut, "So has the star with three leaves.")).id;
  claimIn = await claimOn(stepIn);
  claimOut = await claimOn(stepOut);
});

const bytes = (s: string) => new TextEncoder().encode(s);
const upload = (claimId: number, body: Uint8Array, name = "note.pdf") =>
  claimFilesRoute.POST(
    new Request(`http://localhost/x?name=${encodeURIComponent(name)}`, { method: "POST", body: body as Uint8Array<ArrayBuffer> }),
    params({ proofId, claimId: String(claimId) }),
  );
const list = (claimId: number, proof = proofId) => claimFilesRoute.GET(new Request("http://localhost/x"), params({ proofId: proof, claimId: String(claimId) }));
const download = (fileId: number) => fileRoute.GET(new Request("http://localhost/x"), params({ proofId, fileId: String(fileId) }));

describe.each(["local", "s3"])("files of a claim with the %s store", (driver) => {
  beforeAll(() => {
    useStore(driver, fake, path.join(dir, "files"));
    process.env.CAIRN_UPLOAD_PART_BYTES = String(PART);
    process.env.CAIRN_UPLOAD_PARTS_DIR = path.join(dir, `parts-${driver}`);
  });

  it("a document uploaded to a claim is a file of its step linked to the claim, listed for the claim, downloadable by members", async () => {
    await actAs("author");
    const pdf = bytes(`%PDF-1.7\n% supporting computation (${driver})\n`);
    const res = await upload(claimIn, pdf);
    expect(res.status).toBe(201);
    const { file } = await res.json();
    expect(file).toMatchObject({ kind: "document", mediaType: "application/pdf", sha256: sha256Hex(pdf), stepId: stepIn, claimIds: [claimIn] });
    const listed = (await (await list(claimIn)).json()).files;
    expect(listed.map((f: { id: number }) => f.id)).toContain(file.id);
    // Not a file of the other claim.
    expect((await (await list(claimOut)).json()).files.map((f: { id: number }) => f.id)).not.toContain(file.id);
    // The step's own list says which claim it belongs to (the claim card reads it from there).
    const stepList = (await (await stepFilesRoute.GET(new Request("http://localhost/x"), params({ proofId, stepId: String(stepIn) }))).json()).files;
    expect(stepList.find((f: { id: number }) => f.id === file.id).claimIds).toEqual([claimIn]);
    await actAs("reviewer");
    const got = await download(file.id);
    expect(got.status).toBe(200);
    expect(Buffer.from(await got.arrayBuffer()).equals(Buffer.from(pdf))).toBe(true);
  });

  it("the same bytes already on the step: the existing row (200), now linked to the claim too; no second object", async () => {
    await actAs("author");
    const text = bytes(`A plain-text note on the computation, ${driver}.\n`);
    const onStep = await stepFilesRoute.POST(
      new Request("http://localhost/x?name=note.txt", { method: "POST", body: text as Uint8Array<ArrayBuffer> }),
      params({ proofId, stepId: String(stepIn) }),
    );
    expect(onStep.status).toBe(201);
    const first = (await onStep.json()).file;
    expect(first.claimIds).toEqual([]);
    const again = await upload(claimIn, text, "note.txt");
    expect(again.status).toBe(200);
    expect((await again.json()).file).toMatchObject({ id: first.id, claimIds: [claimIn] });
    expect(await models().StepFile.count({ where: { sha256: first.sha256 } })).toBe(1);
  });

  it("refuses: 401 signed out, 403 for referees uploading and outsiders, 404 for a claim of another proof, 415 by content", async () => {
    await actAs(null);
    expect((await upload(claimIn, bytes("%PDF-1.7\n"))).status).toBe(401);
    expect((await list(claimIn)).status).toBe(401);
    await actAs("reviewer");
    const byReferee = await upload(claimIn, bytes("%PDF-1.7\n"));
    expect(byReferee.status).toBe(403);
    await actAs("outsider");
    expect((await list(claimIn)).status).toBe(403);
    expect((await upload(claimIn, bytes("%PDF-1.7\n"))).status).toBe(403);
    await actAs("author");
    // A claim id of this proof asked under the demo proof: not found there.
    expect((await list(claimIn, String(await demoProofId()))).status).toBe(404);
    const jpeg = new Uint8Array([0xff, 0xd8, 0xff, 0xe0, 0, 0x10, 0x4a, 0x46, 0x49, 0x46, 0, 1, 2, 3]);
    const before = await models().ClaimFile.count({ where: { claimId: claimIn } });
    expect((await upload(claimIn, jpeg, "scan.png")).status).toBe(415);
    expect(await models().ClaimFile.count({ where: { claimId: claimIn } })).toBe(before);
  });

  it("a referee limited to one case reads the files of claims in it, and is refused (403) those of claims elsewhere", async () => {
    await actAs("author");
    const outFile = (await (await upload(claimOut, bytes(`%PDF-1.7\n% star (${driver})\n`))).json()).file;
    // The last file of the claim was uploaded in this run, so its bytes are in this store.
    const inFile = (await (await list(claimIn)).json()).files.at(-1);
    const reviewerId = await userIdOf("reviewer");
    await models().ReviewerScope.create({ proofId: Number(proofId), userId: reviewerId, caseId: caseIn });
    try {
      await actAs("reviewer");
      expect((await list(claimIn)).status).toBe(200);
      expect((await download(inFile.id)).status).toBe(200);
      expect((await list(claimOut)).status).toBe(403);
      expect((await download(outFile.id)).status).toBe(403);
    } finally {
      await models().ReviewerScope.destroy({ where: { proofId: Number(proofId), userId: reviewerId } });
    }
  });

  it("an upload in parts names its claim: the finished file is linked to it; a claim of another step is refused (422)", async () => {
    await actAs("author");
    const text = bytes(`${"A long supporting note. ".repeat(120)}${driver}\n`);
    const wrong = await startRoute.POST(
      jsonRequest("/x", "POST", { name: "long.txt", size: text.byteLength, claimId: claimOut }),
      params({ proofId, stepId: String(stepIn) }),
    );
    expect(wrong.status).toBe(422);
    const res = await startRoute.POST(
      jsonRequest("/x", "POST", { name: "long.txt", size: text.byteLength, claimId: claimIn }),
      params({ proofId, stepId: String(stepIn) }),
    );
    const { upload: u } = await res.json();
    expect(u.parts).toBeGreaterThan(1);
    for (let n = 1; n <= u.parts; n++) {
      const part = text.slice((n - 1) * PART, n * PART) as Uint8Array<ArrayBuffer>;
      const r = await partRoute.PUT(
        new Request("http://localhost/x", { method: "PUT", body: part }),
        params({ proofId, stepId: String(stepIn), uploadId: String(u.id), part: String(n) }),
      );
      expect(r.status).toBe(200);
    }
    const done = await finishRoute.POST(
      new Request("http://localhost/x", { method: "POST" }),
      params({ proofId, stepId: String(stepIn), uploadId: String(u.id) }),
    );
    expect(done.status).toBe(201);
    const { file } = await done.json();
    expect(file).toMatchObject({ sha256: sha256Hex(text), claimIds: [claimIn] });
  });

  it("the claims of an uploaded claims file are attached to its step from the stored bytes; a graph list is refused (422), a referee too (403)", async () => {
    await actAs("author");
    const doc = bytes(
      JSON.stringify({ format: "cairn-claims/1", claims: [{ ...spectral, graph: { format: "named", text: driver === "s3" ? "path(4)" : "path(2)" } }] }),
    );
    const up = await stepFilesRoute.POST(
      new Request("http://localhost/x?name=claims.json", { method: "POST", body: doc as Uint8Array<ArrayBuffer> }),
      params({ proofId, stepId: String(stepIn) }),
    );
    const { file } = await up.json();
    expect(file.kind).toBe("claims");
    const attach = (fileId: number) => fileClaimsRoute.POST(new Request("http://localhost/x", { method: "POST" }), params({ proofId, fileId: String(fileId) }));
    await actAs("reviewer");
    expect((await attach(file.id)).status).toBe(403);
    await actAs("author");
    const before = await models().Claim.count({ where: { stepId: stepIn } });
    const res = await attach(file.id);
    expect(res.status).toBe(202);
    const { claims } = await res.json();
    expect(claims).toHaveLength(1);
    expect(claims[0]).toMatchObject({ stepId: stepIn, kind: "spectral-radius-bound" });
    expect(await models().Claim.count({ where: { stepId: stepIn } })).toBe(before + 1);
    const list = await stepFilesRoute.POST(
      new Request("http://localhost/x?name=paths.g6", { method: "POST", body: bytes(driver === "s3" ? "Bg\n" : "Bw\n") as Uint8Array<ArrayBuffer> }),
      params({ proofId, stepId: String(stepIn) }),
    );
    const refused = await attach((await list.json()).file.id);
    expect(refused.status).toBe(422);
    expect((await refused.json()).error.message).toMatch(/not a claims file/);
    expect(await models().Claim.count({ where: { stepId: stepIn } })).toBe(before + 1);
  });
});
