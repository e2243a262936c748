import { describe, expect, it } from "vitest";
import { execFileSync } from "node:child_process";
import { mkdtempSync, mkdirSync, utimesSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { CHECKER_VERSION } from "@/lib/core/claims/claims";
import { isFresh, newestSource } from "@/lib/verification/bundles";

describe("bundles built at build time", () => {
  it("npm run build's first step writes the worker and a checker that runs with Node alone", () => {
    const out = mkdtempSync(path.join(tmpdir(), "cairn-build-"));
    execFileSync(process.execPath, ["scripts/build-workers.mjs"], { env: { ...process.env, CAIRN_BUILD_DIR: out }, stdio: "pipe" });
    // The checker answers with the same version as the sources the server runs (no node_modules needed: it runs from a temp folder).
    const version = execFileSync(process.execPath, [path.join(out, "cairn-check.mjs"), "--version"], { cwd: tmpdir(), encoding: "utf8" }).trim();
    expect(version).toBe(CHECKER_VERSION);
    // The worker bundle exports the entry the pool calls (a default function).
    const probe = `import(${JSON.stringify(path.join(out, "verify-worker.mjs"))}).then((m) => console.log(typeof m.default))`;
    expect(execFileSync(process.execPath, ["--input-type=module", "-e", probe], { encoding: "utf8" }).trim()).toBe("function");
  }, 120_000);

  it("a bundle older than any source, in any sub-folder, is rebuilt; a newer one is used as it is", () => {
    const root = mkdtempSync(path.join(tmpdir(), "cairn-src-"));
    mkdirSync(path.join(root, "lib/core/spectral"), { recursive: true });
    writeFileSync(path.join(root, "lib/core/a.ts"), "export {};");
    writeFileSync(path.join(root, "lib/core/spectral/b.ts"), "export {};");
    writeFileSync(path.join(root, "lib/core/spectral/b.test.ts"), "export {};");
    const bundle = path.join(root, "bundle.mjs");
    writeFileSync(bundle, "");
    const t = (s: number) => new Date(Date.UTC(2026, 0, 1, 0, 0, s));
    utimesSync(path.join(root, "lib/core/a.ts"), t(1), t(1));
    utimesSync(path.join(root, "lib/core/spectral/b.ts"), t(2), t(2));
    utimesSync(path.join(root, "lib/core/spectral/b.test.ts"), t(9), t(9)); // tests are not sources of the bundle
    expect(newestSource(root, ["lib/core"])).toBe(t(2).getTime());
    utimesSync(bundle, t(3), t(3));
    expect(isFresh(bundle, root, ["lib/core"])).toBe(true);
    utimesSync(path.join(root, "lib/core/spectral/b.ts"), t(4), t(4));
    expect(isFresh(bundle, root, ["lib/core"])).toBe(false);
    expect(isFresh(path.join(root, "missing.mjs"), root, ["lib/core"])).toBe(false);
  });
});
