/**
 * The staging area of uploads in parts: each upload in progress has a folder under the data folder
 * (CAIRN_UPLOAD_PARTS_DIR, default `.data/parts`) holding its parts as files named by their number.
 * A part is written to a temporary name and renamed into place, so a part either is there whole or
 * not at all, and sending the same part again simply replaces it (retries are harmless). Parts are
 * staged locally whichever file store is chosen: only the assembled file goes through lib/storage.
 */
import { mkdir, readdir, readFile, rename, rm, stat, writeFile } from "node:fs/promises";
import { randomBytes } from "node:crypto";
import path from "node:path";
import { readEnv } from "../env";

export const partsRoot = (): string => path.resolve(readEnv().CAIRN_UPLOAD_PARTS_DIR ?? ".data/parts");

const folderOf = (uploadId: number) => path.join(partsRoot(), String(uploadId));

/** How many parts a file of `size` bytes has, and how long part `n` (1-based) must be. */
export function partCount(size: number, partSize: number): number {
  return Math.max(1, Math.ceil(size / partSize));
}
export function partLength(size: number, partSize: number, n: number): number {
  return n < partCount(size, partSize) ? partSize : size - (partCount(size, partSize) - 1) * partSize;
}

export async function writePart(uploadId: number, n: number, bytes: Uint8Array): Promise<void> {
  const folder = folderOf(uploadId);
  await mkdir(folder, { recursive: true });
  const temporary = path.join(folder, `${n}.${randomBytes(6).toString("hex")}.tmp`);
  try {
    await writeFile(temporary, bytes, { flag: "wx" });
    await rename(temporary, path.join(folder, String(n)));
  } catch (e) {
    await rm(temporary, { force: true });
    throw e;
  }
}

/** The numbers of the parts received whole, ascending. */
export async function receivedParts(uploadId: number): Promise<number[]> {
  try {
    return (await readdir(folderOf(uploadId)))
      .filter((f) => /^[1-9][0-9]*$/.test(f))
      .map(Number)
      .sort((a, b) => a - b);
  } catch (e) {
    if ((e as NodeJS.ErrnoException).code === "ENOENT") return [];
    throw e;
  }
}

/** The parts 1…count concatenated (the caller has checked that every part is there). */
export async function assembleParts(uploadId: number, count: number): Promise<Uint8Array> {
  const chunks: Buffer[] = [];
  for (let n = 1; n <= count; n++) chunks.push(await readFile(path.join(folderOf(uploadId), String(n))));
  return Buffer.concat(chunks);
}

export const removeStaging = (uploadId: number): Promise<void> => rm(folderOf(uploadId), { recursive: true, force: true });

/** The upload ids that have a staging folder, with when it last changed (for the sweep). */
export async function stagedUploads(): Promise<Array<{ uploadId: number; modified: Date }>> {
  let names: string[];
  try {
    names = await readdir(partsRoot());
  } catch (e) {
    if ((e as NodeJS.ErrnoException).code === "ENOENT") return [];
    throw e;
  }
  const out: Array<{ uploadId: number; modified: Date }> = [];
  for (const name of names.filter((f) => /^[1-9][0-9]*$/.test(f)))
    out.push({ uploadId: Number(name), modified: (await stat(path.join(partsRoot(), name))).mtime });
  return out;
}
