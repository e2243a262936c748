#!/usr/bin/env node
// Cairn's offline checker: `cairn-check FILE...` (see lib/core/cli.ts for the output and exit codes).
//
// Runs with Node.js alone. Two ways, tried in order:
//  1. bin/cairn-check.bundle.mjs, a single self-contained file (no node_modules needed), made by
//       node bin/cairn-check.mjs --make-bundle
//     which runs esbuild (installed with tsx) on lib/core/cli.ts. Hand that one file to a reader.
//  2. Otherwise the TypeScript sources are loaded in-process through tsx's loader from the package's
//     own node_modules (no global tools, no build step).
import { existsSync } from "node:fs";
import { spawnSync } from "node:child_process";
import { fileURLToPath } from "node:url";

const here = (p) => fileURLToPath(new URL(p, import.meta.url));
const bundle = here("./cairn-check.bundle.mjs");

if (process.argv[2] === "--make-bundle") {
  const esbuild = here("../node_modules/.bin/esbuild");
  const r = spawnSync(
    esbuild,
    [here("../lib/core/cli.ts"), "--bundle", "--platform=node", "--format=esm", "--target=node20", `--outfile=${bundle}`, "--log-level=warning"],
    { stdio: "inherit" },
  );
  if (r.status === 0) process.stdout.write(`wrote ${bundle}\n`);
  process.exit(r.status ?? 2);
}

let main;
// Threads for --parallel run the checker's own module again: the bundle as it is, the sources through cairn-check-thread.mjs.
let start = {};
if (existsSync(bundle)) {
  ({ main } = await import(new URL("./cairn-check.bundle.mjs", import.meta.url).href));
} else {
  let register;
  try {
    ({ register } = await import("tsx/esm/api"));
  } catch {
    process.stderr.write(
      "cairn-check: neither bin/cairn-check.bundle.mjs nor the TypeScript loader (tsx) is available;\n" +
        "run `npm install` in the Cairn package, or use a bundled checker (see the top of bin/cairn-check.mjs).\n",
    );
    process.exit(2);
  }
  register();
  ({ main } = await import(new URL("../lib/core/cli.ts", import.meta.url).href));
  start = { script: new URL("./cairn-check-thread.mjs", import.meta.url) };
}
process.exitCode = await main(process.argv.slice(2), undefined, start);
