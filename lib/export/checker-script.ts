/**
 * The self-contained offline checker offered beside every export: lib/core/cli.ts bundled by esbuild
 * into one ES module that needs nothing but Node.js (≥ 20) and its built-in modules, built by `npm run
 * build` from the sources the server itself runs (or here, once per process, when that bundle is missing
 * or older than a source), so it is the same checker. Node-only.
 */
import { execFile } from "node:child_process";
import { existsSync, readFileSync } from "node:fs";
import { join } from "node:path";
import { CHECKER_VERSION } from "@/lib/core/claims/claims";
import { CHECKER_SOURCES, checkerBundlePath, isFresh } from "@/lib/verification/bundles";

export class CheckerUnavailableError extends Error {}

const g = globalThis as unknown as { __cairnCheckerScript?: Promise<string> };

const banner = `#!/usr/bin/env node\n// Cairn offline checker ${CHECKER_VERSION}, self-contained: node cairn-check.mjs BUNDLE.json\n`;

function build(root: string): Promise<string> {
  // Built by `npm run build` (scripts/build-workers.mjs) from the sources this server runs.
  const built = checkerBundlePath(root);
  if (isFresh(built, root, CHECKER_SOURCES)) return Promise.resolve(banner + readFileSync(/* turbopackIgnore: true */ built, "utf8"));
  const esbuild = join(root, "node_modules", ".bin", "esbuild");
  const entry = join(root, "lib", "core", "cli.ts");
  if (!existsSync(esbuild) || !existsSync(entry))
    return Promise.reject(
      new CheckerUnavailableError(
        "The bundled checker cannot be built here (esbuild or the checker sources are missing). Use `npm run check -- FILE` from a Cairn checkout instead.",
      ),
    );
  return new Promise((resolve, reject) => {
    execFile(
      esbuild,
      [entry, "--bundle", "--platform=node", "--format=esm", "--target=node20", "--log-level=error"],
      { cwd: root, maxBuffer: 32 * 1024 * 1024, timeout: 60_000 },
      (error, stdout, stderr) => (error ? reject(new CheckerUnavailableError(`esbuild failed: ${stderr || error.message}`)) : resolve(banner + stdout)),
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
