/**
 * Where uploaded files live: one small interface, two drivers. Files are addressed by the SHA-256
 * of their bytes, so a file uploaded twice (by anyone, to any step) is stored once, and a stored
 * object never changes. The driver is chosen by CAIRN_STORAGE (lib/env.ts validates the settings):
 * `local` (the default) keeps files under the data folder, `s3` in a bucket through the S3 API.
 *
 * Why no transaction spans the store and the database: the object is written first and completely
 * (local: to a temporary name, then renamed; S3: one PUT, which is atomic), and only then is the
 * row that points at it committed. An upload cut short leaves either nothing, or an object that no
 * row names. Such an object is harmless: it is content-addressed, so the next upload of the same
 * bytes reuses it, and nothing lists it; `sweepOrphans` deletes those older than an hour.
 */
import { createHash } from "node:crypto";
import { readEnv } from "../env";
import { LocalStore } from "./local";
import { S3Store } from "./s3";

export interface PutResult {
  sha256: string;
  size: number;
  /** False when an object with these bytes was already stored (nothing was written). */
  created: boolean;
}

export interface StoredObject {
  sha256: string;
  /** When the object was written (for the orphan sweep). */
  modified: Date;
}

export interface BlobStore {
  readonly driver: "local" | "s3";
  /** Stores the bytes under their SHA-256, unless already there. */
  put(bytes: Uint8Array): Promise<PutResult>;
  /** The bytes stored under this digest, or null. */
  get(sha256: string): Promise<Uint8Array | null>;
  has(sha256: string): Promise<boolean>;
  delete(sha256: string): Promise<void>;
  /** Every stored object (for the orphan sweep and tests). */
  list(): AsyncIterable<StoredObject>;
  /** Removes what interrupted writes left behind (local disk: temporary files); S3 PUTs leave nothing. */
  removeStalePartials?(olderThanMs: number, now?: number): Promise<number>;
}

export const sha256Hex = (bytes: Uint8Array): string => createHash("sha256").update(bytes).digest("hex");

const DIGEST = /^[0-9a-f]{64}$/;

/** Throws unless `sha256` is 64 lower-case hex digits (a key never comes from a name a person typed). */
export function assertDigest(sha256: string): void {
  if (!DIGEST.test(sha256)) throw new Error(`not a SHA-256 digest: ${sha256.slice(0, 80)}`);
}

/** The store described by these settings (default: this process's environment). */
export function storeFromEnv(source: Record<string, string | undefined> = process.env): BlobStore {
  const env = readEnv(source);
  if (env.CAIRN_STORAGE === "s3")
    return new S3Store({
      bucket: env.CAIRN_S3_BUCKET!,
      prefix: env.CAIRN_S3_PREFIX,
      region: env.CAIRN_S3_REGION,
      endpoint: env.CAIRN_S3_ENDPOINT,
      forcePathStyle: env.CAIRN_S3_PATH_STYLE,
      accessKeyId: env.CAIRN_S3_ACCESS_KEY_ID,
      secretAccessKey: env.CAIRN_S3_SECRET_ACCESS_KEY,
    });
  return new LocalStore(env.CAIRN_STORAGE_DIR ?? ".data/files");
}

const g = globalThis as unknown as { __cairnStore?: { key: string; store: BlobStore } };

/** This process's store, made once per setting. */
export function fileStore(): BlobStore {
  const key = ["CAIRN_STORAGE", "CAIRN_STORAGE_DIR", "CAIRN_S3_BUCKET", "CAIRN_S3_PREFIX", "CAIRN_S3_ENDPOINT"].map((k) => process.env[k] ?? "").join("|");
  if (g.__cairnStore?.key !== key) g.__cairnStore = { key, store: storeFromEnv() };
  return g.__cairnStore.store;
}

/**
 * Deletes objects that no row names and that are older than `olderThanMs` (an upload in flight
 * writes its object before its row, so young objects are left alone). Returns how many went.
 */
export async function sweepOrphans(
  store: BlobStore,
  isNamed: (sha256: string) => Promise<boolean>,
  olderThanMs = 3_600_000,
  now = Date.now(),
): Promise<number> {
  let removed = (await store.removeStalePartials?.(olderThanMs, now)) ?? 0;
  for await (const o of store.list()) {
    if (now - o.modified.getTime() < olderThanMs) continue;
    if (await isNamed(o.sha256)) continue;
    await store.delete(o.sha256);
    removed++;
  }
  return removed;
}
