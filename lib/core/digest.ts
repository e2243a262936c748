/**
 * SHA-256 digests of canonical texts. This is the only module of the core that touches node:crypto,
 * so the rest stays portable.
 */

import { createHash } from "node:crypto";
import type { Graph } from "./graph";
import { canonicalJson, graphJson } from "./input/canonical";

/** Lower-case hex SHA-256 of the UTF-8 encoding of a text. */
export function sha256Hex(text: string): string {
  return createHash("sha256").update(text, "utf8").digest("hex");
}

/** Digest of the canonical JSON of a labelled graph (see graphJson: numbering matters). */
export function graphDigest(g: Graph): string {
  return sha256Hex(graphJson(g));
}

/** Digest of any canonical-JSON-serialisable value, e.g. a certificate. */
export function valueDigest(value: unknown): string {
  return sha256Hex(canonicalJson(value));
}
