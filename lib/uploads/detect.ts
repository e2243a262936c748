/**
 * What an uploaded file is, decided by its bytes and never by its name: magic numbers for PDF, PNG
 * and gzip, then UTF-8 text read as a graph list (lib/core/input/graph-list.ts), a claims file
 * (cairn-claim/1, cairn-claims/1), TeX source or plain text. Anything else is refused (415). A gzip
 * file must unpack to a graph list, and unpacking stops past a limit (a small file that unpacks to
 * gigabytes is refused, not unpacked).
 */
import { Gunzip } from "fflate";
import { graphListFormat, splitGraphList, type GraphListFormat } from "../core/input/graph-list";
import { readClaimsDocument } from "../core/claims/claim-file";

export const FILE_KINDS = ["graph-list", "claims", "document"] as const;
export type FileKind = (typeof FILE_KINDS)[number];

export interface DetectedFile {
  kind: FileKind;
  /** The media type it is served with. */
  mediaType: string;
  /** In words, e.g. "graph6 list of 106 graphs (gzip)". */
  description: string;
  graphFormat: GraphListFormat | null;
  graphCount: number | null;
  compressed: boolean;
}

/** Refusal by content (415), with what was found and what is accepted. */
export class UnsupportedContent extends Error {
  constructor(message: string) {
    super(message);
    this.name = "UnsupportedContent";
  }
}

/** Unpacked size past the limit (413). */
export class UnpackedTooLarge extends Error {
  constructor(readonly limit: number) {
    super(`the gzip file unpacks to more than ${limit} bytes`);
    this.name = "UnpackedTooLarge";
  }
}

const ACCEPTED =
  "Cairn takes graph lists (graph6 or sparse6 one per line, or edge lists; plain or gzip-compressed), claims files (cairn-claims/1), PDF, PNG, plain text and TeX source.";

const startsWith = (bytes: Uint8Array, magic: number[]) => magic.every((b, i) => bytes[i] === b);
const PDF = [0x25, 0x50, 0x44, 0x46, 0x2d]; // "%PDF-"
const PNG = [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a];
const GZIP = [0x1f, 0x8b];

export const isGzip = (bytes: Uint8Array) => startsWith(bytes, GZIP);

/** Unpacks gzip, refusing past `maxBytes` of output (checked while unpacking). */
export function gunzipLimited(bytes: Uint8Array, maxBytes: number): Uint8Array {
  const chunks: Uint8Array[] = [];
  let size = 0;
  let ended = false;
  const g = new Gunzip((chunk, final) => {
    size += chunk.byteLength;
    if (size > maxBytes) throw new UnpackedTooLarge(maxBytes);
    chunks.push(chunk);
    if (final) ended = true;
  });
  try {
    const STEP = 64 * 1024;
    for (let at = 0; at < bytes.byteLength; at += STEP) g.push(bytes.subarray(at, Math.min(at + STEP, bytes.byteLength)), at + STEP >= bytes.byteLength);
  } catch (e) {
    if (e instanceof UnpackedTooLarge) throw e;
    throw new UnsupportedContent(`The file starts like gzip but does not unpack (${(e as Error).message}). ${ACCEPTED}`);
  }
  if (!ended) throw new UnsupportedContent(`The gzip file is cut short (it ends before its last block). ${ACCEPTED}`);
  return Buffer.concat(chunks, size);
}

/** The text of a file, or null when it is not UTF-8 or holds control bytes that no text file has. */
export function asText(bytes: Uint8Array): string | null {
  let text: string;
  try {
    text = new TextDecoder("utf-8", { fatal: true }).decode(bytes);
  } catch {
    return null;
  }
  // NUL and the other C0 controls except tab, newline, form feed and carriage return mark binary data.
  return /[\x00-\x08\x0b\x0e-\x1a\x1c-\x1f]/.test(text) ? null : text.replace(/^\uFEFF/, "");
}

const TEX = /\\(documentclass|begin\{|section\*?\{|usepackage|chapter\{|input\{|newcommand)/;

function describeList(format: GraphListFormat, count: number, compressed: boolean): string {
  return `${format === "edges" ? "edge-list" : format} list of ${count} ${count === 1 ? "graph" : "graphs"}${compressed ? " (gzip)" : ""}`;
}

function graphList(text: string, compressed: boolean): DetectedFile | null {
  const format = graphListFormat(text);
  if (!format) return null;
  const count = splitGraphList(text, format).length;
  return {
    kind: "graph-list",
    mediaType: compressed ? "application/gzip" : "text/plain; charset=utf-8",
    description: describeList(format, count, compressed),
    graphFormat: format,
    graphCount: count,
    compressed,
  };
}

function claimsFile(text: string): DetectedFile | null {
  const t = text.trimStart();
  if (!t.startsWith("{") && !t.startsWith("[")) return null;
  let json: unknown;
  try {
    json = JSON.parse(text);
  } catch {
    return null;
  }
  let entries: ReturnType<typeof readClaimsDocument>;
  try {
    entries = readClaimsDocument(json);
  } catch {
    return null;
  }
  return {
    kind: "claims",
    mediaType: "application/json",
    description: `claims file of ${entries.length} ${entries.length === 1 ? "claim" : "claims"}`,
    graphFormat: null,
    graphCount: null,
    compressed: false,
  };
}

const document = (mediaType: string, description: string): DetectedFile => ({
  kind: "document",
  mediaType,
  description,
  graphFormat: null,
  graphCount: null,
  compressed: false,
});

/**
 * What these bytes are. `expected`, when given, is the kind the uploader chose; a file whose content
 * is another kind is refused with both named. `maxUnpacked` bounds the unpacked size of gzip.
 */
export function detectFile(bytes: Uint8Array, maxUnpacked: number, expected?: FileKind): DetectedFile {
  if (bytes.byteLength === 0) throw new UnsupportedContent(`The file is empty. ${ACCEPTED}`);
  const found = sniff(bytes, maxUnpacked);
  if (expected && found.kind !== expected)
    throw new UnsupportedContent(
      `You chose “${expected}”, but by its content this file is a ${found.description}. Choose that kind, or upload the file you meant.`,
    );
  return found;
}

function sniff(bytes: Uint8Array, maxUnpacked: number): DetectedFile {
  if (startsWith(bytes, PDF)) return document("application/pdf", "PDF document");
  if (startsWith(bytes, PNG)) return document("image/png", "PNG image");
  if (isGzip(bytes)) {
    const text = asText(gunzipLimited(bytes, maxUnpacked));
    const list = text === null ? null : graphList(text, true);
    if (!list)
      throw new UnsupportedContent(
        `The gzip file does not hold a graph list (graph6 or sparse6 one per line, or edge lists); only graph lists may be compressed. ${ACCEPTED}`,
      );
    return list;
  }
  const text = asText(bytes);
  if (text === null) throw new UnsupportedContent(`By its content this is a binary file of a kind Cairn does not take (not PDF, PNG or gzip). ${ACCEPTED}`);
  return (
    graphList(text, false) ??
    claimsFile(text) ??
    (TEX.test(text) ? document("text/x-tex; charset=utf-8", "TeX source") : document("text/plain; charset=utf-8", "plain text"))
  );
}

/** The text of a stored graph list (unpacked when gzip). */
export function graphListText(bytes: Uint8Array, maxUnpacked: number): string {
  const raw = isGzip(bytes) ? gunzipLimited(bytes, maxUnpacked) : bytes;
  const text = asText(raw);
  if (text === null) throw new UnsupportedContent("the stored graph list is not text");
  return text;
}
