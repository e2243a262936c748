/**
 * The local-disk driver: each object is a file named by its SHA-256 under two levels of folders
 * (`ab/cd/abcd…`), written to a temporary name in the same folder tree and renamed into place, so a
 * reader never sees half a file and a crash leaves only a temporary `.part` file, which the orphan
 * sweep removes once it is an hour old.
 */
import { mkdir, readdir, readFile, rename, rm, stat, writeFile } from "node:fs/promises";
import { randomBytes } from "node:crypto";
import path from "node:path";
import { assertDigest, sha256Hex, type BlobStore, type PutResult, type StoredObject } from "./index";

export class LocalStore implements BlobStore {
  readonly driver = "local" as const;
  readonly root: string;

  constructor(root: string) {
    this.root = path.resolve(root);
  }

  private pathOf(sha256: string): string {
    assertDigest(sha256);
    return path.join(this.root, sha256.slice(0, 2), sha256.slice(2, 4), sha256);
  }

  async put(bytes: Uint8Array): Promise<PutResult> {
    const sha256 = sha256Hex(bytes);
    const target = this.pathOf(sha256);
    if (await this.has(sha256)) return { sha256, size: bytes.byteLength, created: false };
    await mkdir(path.dirname(target), { recursive: true });
    const temporary = `${target}.${randomBytes(6).toString("hex")}.part`;
    try {
      await writeFile(temporary, bytes, { flag: "wx" });
      // rename is atomic within one file system; two uploads of the same bytes both land the same content.
      await rename(temporary, target);
    } catch (e) {
      await rm(temporary, { force: true });
      throw e;
    }
    return { sha256, size: bytes.byteLength, created: true };
  }

  async get(sha256: string): Promise<Uint8Array | null> {
    try {
      return new Uint8Array(await readFile(this.pathOf(sha256)));
    } catch (e) {
      if ((e as NodeJS.ErrnoException).code === "ENOENT") return null;
      throw e;
    }
  }

  async has(sha256: string): Promise<boolean> {
    try {
      return (await stat(this.pathOf(sha256))).isFile();
    } catch (e) {
      if ((e as NodeJS.ErrnoException).code === "ENOENT") return false;
      throw e;
    }
  }

  async delete(sha256: string): Promise<void> {
    await rm(this.pathOf(sha256), { force: true });
  }

  async removeStalePartials(olderThanMs: number, now = Date.now()): Promise<number> {
    let removed = 0;
    for await (const file of this.files(/\.part$/)) {
      if (now - (await stat(file)).mtime.getTime() < olderThanMs) continue;
      await rm(file, { force: true });
      removed++;
    }
    return removed;
  }

  async *list(): AsyncIterable<StoredObject> {
    for await (const file of this.files(/^[0-9a-f]{64}$/)) yield { sha256: path.basename(file), modified: (await stat(file)).mtime };
  }

  private async *files(name: RegExp): AsyncIterable<string> {
    const level = async (dir: string) => {
      try {
        return await readdir(dir, { withFileTypes: true });
      } catch (e) {
        if ((e as NodeJS.ErrnoException).code === "ENOENT") return [];
        throw e;
      }
    };
    for (const a of await level(this.root)) {
      if (!a.isDirectory() || !/^[0-9a-f]{2}$/.test(a.name)) continue;
      for (const b of await level(path.join(this.root, a.name))) {
        if (!b.isDirectory()) continue;
        for (const f of await level(path.join(this.root, a.name, b.name))) {
          if (f.isFile() && name.test(f.name)) yield path.join(this.root, a.name, b.name, f.name);
        }
      }
    }
  }
}
