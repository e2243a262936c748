/**
 * Where the two programs that run outside the web server's bundle live once built: the verification
 * worker thread (lib/verification/worker-entry.ts) and the offline checker (lib/core/cli.ts), both
 * bundled by esbuild into plain ES modules. `npm run build` writes them (scripts/build-workers.mjs);
 * a process that finds one missing or older than its sources (a development checkout) builds it again.
 */
import { readdirSync, statSync } from "node:fs";
import path from "node:path";

export const buildDir = (root: string): string => path.join(/* turbopackIgnore: true */ root, ".data", "build");
export const workerBundlePath = (root: string): string => path.join(/* turbopackIgnore: true */ buildDir(root), "verify-worker.mjs");
export const checkerBundlePath = (root: string): string => path.join(/* turbopackIgnore: true */ buildDir(root), "cairn-check.mjs");

/** The newest modification time of the TypeScript sources (tests excluded) in these folders, recursively. */
export function newestSource(root: string, dirs: readonly string[]): number {
  let newest = 0;
  // These are the bundles' sources, read at run time, not files the server bundle needs. The bundler traces a
  // path built from the working directory and a variable as "the whole project", so the ignore comment goes on
  // the path itself as well as on the fs call.
  const visit = (folder: string) => {
    for (const entry of readdirSync(/* turbopackIgnore: true */ folder, { withFileTypes: true })) {
      const full = path.join(/* turbopackIgnore: true */ folder, entry.name);
      if (entry.isDirectory()) visit(full);
      else if (entry.name.endsWith(".ts") && !entry.name.endsWith(".test.ts")) newest = Math.max(newest, statSync(/* turbopackIgnore: true */ full).mtimeMs);
    }
  };
  for (const dir of dirs) visit(path.join(/* turbopackIgnore: true */ root, dir));
  return newest;
}

/** Whether a built bundle exists and is at least as new as every source it was built from. */
export function isFresh(file: string, root: string, dirs: readonly string[]): boolean {
  try {
    return statSync(/* turbopackIgnore: true */ file).mtimeMs >= newestSource(root, dirs);
  } catch {
    return false;
  }
}

export const WORKER_SOURCES = ["lib/core", "lib/verification"] as const;
export const CHECKER_SOURCES = ["lib/core"] as const;
