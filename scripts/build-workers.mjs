#!/usr/bin/env node
// Part of `npm run build`: bundles, ahead of any request, the two programs that run outside the web
// server's own bundle — the verification worker thread (lib/verification/worker-entry.ts) and the
// offline checker offered beside every export (lib/core/cli.ts) — into .data/build/ (or CAIRN_BUILD_DIR).
// Each is written under a temporary name and renamed, so a process never reads half a file.
import { build } from "esbuild";
import { mkdirSync, renameSync } from "node:fs";
import path from "node:path";

const root = process.cwd();
const out = process.env.CAIRN_BUILD_DIR ?? path.join(root, ".data", "build");
mkdirSync(out, { recursive: true });

const bundles = [
  ["lib/verification/worker-entry.ts", "verify-worker.mjs"],
  ["lib/core/cli.ts", "cairn-check.mjs"],
];
for (const [entry, name] of bundles) {
  const target = path.join(out, name);
  const tmp = `${target}.${process.pid}.tmp.mjs`;
  await build({ entryPoints: [path.join(root, entry)], bundle: true, platform: "node", format: "esm", target: "node20", logLevel: "error", outfile: tmp });
  renameSync(tmp, target);
  console.log(`bundled ${entry} → ${path.relative(root, target)}`);
}
