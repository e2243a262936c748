/**
 * The self-contained offline checker offered beside every export: lib/core/cli.ts bundled by esbuild
 * into one ES module that needs nothing but Node.js (≥ 20) and its built-in modules. Built once per
 * server process from the sources the server itself runs, so it is the same checker. Node-only.
 */
import { execFile } from "node:child_process";
import { existsSync } from "node:fs";
import { join } from "node:path";
import { CHECKER_VERSION } from "@/lib/core/claims";

export class CheckerUnavailableError extends Error {}

const g = globalThis as unknown as { __cairnCheckerScript?: Promise<string> };

function build(root: string): Promise<string> {
  const esbuild = join(root, "node_modules", ".bin", "esbuild");
  const entry = join(root, "lib", "core", "cli.ts");
  if (!existsSync(esbuild) || !existsSync(entry))
    return Promise.reject(new CheckerUnavailableError("The bundled checker cannot be built here (esbuild or the checker sources are missing). Use `npm run check -- FILE` from a Cairn checkout instead."));
  const banner = `#!/usr/bin/env node\n// Cairn offline checker ${CHECKER_VERSION}, self-contained: node cairn-check.mjs BUNDLE.json\n`;
  return new Promise((resolve, reject) => {
    execFile(
      esbuild,
      [entry, "--bundle", "--platform=node", "--format=esm", "--target=node20", "--log-level=error", `--banner:js=${banner}`],
      { cwd: root, maxBuffer: 32 * 1024 * 1024, timeout: 60_000 },
      (error, stdout, stderr) => (error ? reject(new CheckerUnavailableError(`esbuild failed: ${stderr || error.message}`)) : resolve(stdout)),
    );
  });
}

/** The checker as one .mjs text; built on first use and kept for the life of the process. */
export function checkerScript(root = process.cwd()): Promise<string> {
  g.__cairnCheckerScript ??= build(root).catch((e) => {
    g.__cairnCheckerScript = undefined;
    throw e;
  });
  return g.__cairnCheckerScript;
}
