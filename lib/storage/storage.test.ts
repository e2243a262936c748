/**
 * Both storage drivers against the same expectations: bytes come back as stored, an object is
 * named by the SHA-256 of its bytes and stored once, a missing digest reads as null, the orphan sweep
 * removes old unnamed objects only. The S3 driver runs against s3rver (an S3-compatible fake from
 * npm) on loopback.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createHash } from "node:crypto";
import { mkdtemp, readdir, rm, utimes, writeFile, mkdir } from "node:fs/promises";
import { tmpdir } from "node:os";
import path from "node:path";
import { sha256Hex, storeFromEnv, sweepOrphans, type BlobStore } from "./index";
import { LocalStore } from "./local";
import { S3Store } from "./s3";
import { s3FakePort, startS3Fake, type S3Fake } from "../../tests/support/s3-fake";

let localDir: string;
let fake: S3Fake;
const stores: Record<string, () => BlobStore> = {};

beforeAll(async () => {
  localDir = await mkdtemp(path.join(tmpdir(), "cairn-files-"));
  fake = await startS3Fake(s3FakePort());
  stores.local = () => storeFromEnv({ CAIRN_STORAGE_DIR: localDir });
  stores.s3 = () => storeFromEnv(fake.env);
});
afterAll(async () => {
  await fake?.stop();
  await rm(localDir, { recursive: true, force: true });
});

const text = (s: string) => new TextEncoder().encode(s);
const all = async (store: BlobStore) => {
  const out: string[] = [];
  for await (const o of store.list()) out.push(o.sha256);
  return out.sort();
};

describe.each(["local", "s3"])("the %s driver", (driver) => {
  it("is the one the settings choose", () => {
    expect(stores[driver]().driver).toBe(driver);
    expect(stores[driver]()).toBeInstanceOf(driver === "local" ? LocalStore : S3Store);
  });

  it("stores bytes under their SHA-256 and gives them back unchanged", async () => {
    const store = stores[driver]();
    const bytes = new Uint8Array(70_000).map((_, i) => (i * 37) % 256);
    const put = await store.put(bytes);
    // The digest is the standard SHA-256 of the bytes (node:crypto, computed independently here).
    expect(put.sha256).toBe(createHash("sha256").update(bytes).digest("hex"));
    expect(put).toMatchObject({ size: 70_000, created: true });
    expect(await store.has(put.sha256)).toBe(true);
    expect(Buffer.from((await store.get(put.sha256))!).equals(Buffer.from(bytes))).toBe(true);
  });

  it("stores the same bytes once (de-duplication), and different bytes apart", async () => {
    const store = stores[driver]();
    const before = (await all(store)).length;
    const a = await store.put(text(`A>o\n${driver}\n`));
    const again = await store.put(text(`A>o\n${driver}\n`));
    const b = await store.put(text(`A>o\n${driver}!\n`));
    expect(a.created).toBe(true);
    expect(again).toEqual({ ...a, created: false });
    expect(b.sha256).not.toBe(a.sha256);
    expect((await all(store)).length).toBe(before + 2);
  });

  it("reads a digest it does not hold as null, and refuses a key that is not a digest", async () => {
    const store = stores[driver]();
    const absent = sha256Hex(text("never stored"));
    expect(await store.get(absent)).toBeNull();
    expect(await store.has(absent)).toBe(false);
    await expect(store.get("../../etc/passwd")).rejects.toThrow(/not a SHA-256 digest/);
  });

  it("deletes", async () => {
    const store = stores[driver]();
    const { sha256 } = await store.put(text(`to delete ${driver}`));
    await store.delete(sha256);
    expect(await store.get(sha256)).toBeNull();
  });

  it("sweeps objects no row names once they are old enough, and keeps named or young ones", async () => {
    const store = stores[driver]();
    const named = await store.put(text(`named ${driver}`));
    const orphan = await store.put(text(`orphan ${driver}`));
    const names = new Set([...(await all(store))].filter((d) => d !== orphan.sha256));
    // Young objects stay (an upload in flight writes its object before its row).
    expect(await sweepOrphans(store, async (d) => names.has(d), 3_600_000)).toBe(0);
    // An hour later the orphan goes, the named one stays.
    expect(await sweepOrphans(store, async (d) => names.has(d), 3_600_000, Date.now() + 2 * 3_600_000)).toBe(1);
    expect(await store.has(orphan.sha256)).toBe(false);
    expect(await store.has(named.sha256)).toBe(true);
  });
});

describe("the local driver on interrupted writes", () => {
  it("never shows a partial object, and the sweep removes a stale temporary file", async () => {
    const store = new LocalStore(localDir);
    const bytes = text("whole");
    const digest = sha256Hex(bytes);
    // What a crash between write and rename leaves: a .part file beside where the object would go.
    const dir = path.join(localDir, digest.slice(0, 2), digest.slice(2, 4));
    await mkdir(dir, { recursive: true });
    const part = path.join(dir, `${digest}.abc.part`);
    await writeFile(part, "who");
    expect(await store.has(digest)).toBe(false);
    const old = new Date(Date.now() - 2 * 3_600_000);
    await utimes(part, old, old);
    expect(await sweepOrphans(store, async () => true)).toBe(1);
    expect((await readdir(dir)).filter((f) => f.endsWith(".part"))).toEqual([]);
    expect((await store.put(bytes)).created).toBe(true);
  });
});

describe("storage settings", () => {
  it("need a bucket for s3 and keys in pairs", () => {
    expect(() => storeFromEnv({ CAIRN_STORAGE: "s3" })).toThrow(/CAIRN_S3_BUCKET: not set/);
    expect(() => storeFromEnv({ CAIRN_STORAGE: "s3", CAIRN_S3_BUCKET: "b-1", CAIRN_S3_ACCESS_KEY_ID: "k" })).toThrow(/together/);
    expect(() => storeFromEnv({ CAIRN_STORAGE: "disk" })).toThrow(/CAIRN_STORAGE: must be "local"/);
  });
});
