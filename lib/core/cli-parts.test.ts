/**
 * The offline checker with --parallel: large enumeration and coverage claims checked in parts on
 * worker threads give the report of the run in one piece (verdicts, certificates, digests); a part
 * that throws is tried again on a fresh thread, and a part that fails for good leaves its claim
 * undecided saying which part failed, how often and why. The threads load the sources through
 * bin/cairn-check-thread.mjs, as `npm run check` does.
 */
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { afterAll, describe, expect, it } from "vitest";
import { checkDocument, checkFile, checkFileOnThreads, EXIT_NOT_VERIFIED, main } from "./cli";
import { partsOnThreads } from "./cli-parts";
import { DEFAULT_STEP_LIMIT } from "./verdict";
import { sameRun } from "../../tests/support/bundle-items";

const scratch = mkdtempSync(join(tmpdir(), "cairn-cli-parts-"));
afterAll(() => rmSync(scratch, { recursive: true, force: true }));
const script = new URL("../../bin/cairn-check-thread.mjs", import.meta.url);

// Connected graphs on n = 1..7 vertices: OEIS A001349. Trees on n = 1..13 vertices: OEIS A000055.
const A001349 = [1, 1, 2, 6, 21, 112, 853];
const A000055 = [1, 1, 1, 2, 3, 6, 11, 23, 47, 106, 235, 551, 1301];

const claims = {
  format: "cairn-claims/1",
  claims: [
    { format: "cairn-claim/1", id: "graphs-7", kind: "enumeration", maxVertices: 7, op: "<", bound: "7", graphs: [] },
    { format: "cairn-claim/1", id: "trees-13", kind: "enumeration", setting: "tree", maxVertices: 13, op: "<=", bound: "100", graphs: [] },
    {
      format: "cairn-claim/1",
      id: "split-7",
      kind: "coverage",
      maxVertices: 7,
      cases: [{ condition: { predicate: "tree" } }, { condition: { predicate: "has-cycle" } }],
    },
    { format: "cairn-claim/1", id: "path", kind: "structure", graph: { format: "named", text: "path(3)" }, predicate: "tree" },
  ],
};
const file = join(scratch, "claims.json");
writeFileSync(file, JSON.stringify(claims));

describe("the offline checker on threads", () => {
  it("gives the report of the run in one piece, with the counts of OEIS A001349 and A000055", async () => {
    const single = checkFile(file);
    const threaded = await checkFileOnThreads(file, {}, { threads: 2, script });
    expect(sameRun(threaded)).toEqual(sameRun(single));
    expect(single.lines.map((l) => [l.label, l.status])).toEqual([
      ["graphs-7", "refuted"],
      ["trees-13", "refuted"],
      ["split-7", "verified"],
      ["path", "verified"],
    ]);
    // The refutations name every graph found: the counts per order are OEIS A001349 and A000055.
    expect(threaded.lines[0].reason).toContain(`found 996 graph(s) (${A001349.map((c, i) => `${c} on ${i + 1}`).join(", ")})`);
    expect(threaded.lines[1].reason).toContain(`found 2288 graph(s) (${A000055.map((c, i) => `${c} on ${i + 1}`).join(", ")})`);
    expect(threaded.lines.map((l) => l.digests)).toEqual(single.lines.map((l) => l.digests));
  }, 120_000);

  it("--parallel N on the command line; --json reports the same verdicts and digests as --parallel 1", async () => {
    const run = async (n: string) => {
      const out: string[] = [];
      const code = await main(["--parallel", n, "--json", file], (s) => out.push(s), { script });
      return { code, report: sameRun(JSON.parse(out.join("\n"))) };
    };
    const [one, two] = [await run("1"), await run("2")];
    expect(two).toEqual(one);
    expect(one.code).toBe(EXIT_NOT_VERIFIED);
    const out: string[] = [];
    expect(await main(["--parallel", "0", file], (s) => out.push(s))).toBe(2);
    expect(out.join("\n")).toContain("--parallel needs a number of threads from 1 to 256");
  }, 120_000);

  it("tries a part that throws again, and the claim is decided as in one piece", async () => {
    const json = { format: "cairn-claims/1", claims: [claims.claims[0]] };
    // Part 2 throws on its first two tries and computes on its third (the last it gets).
    const parts = await partsOnThreads(json, { threads: 2, script, steps: DEFAULT_STEP_LIMIT, faults: ["part:2@1", "part:2@2"] });
    expect(Object.keys(parts)).toEqual(["$.claims[0]"]);
    expect("results" in parts["$.claims[0]"]).toBe(true);
    const retried = join(scratch, "one.json");
    writeFileSync(retried, JSON.stringify(json));
    const single = checkFile(retried);
    expect(sameRun(checkDocument(json, retried, { parts }))).toEqual(sameRun(single));
  }, 120_000);

  it("leaves the claim undecided when a part fails on every try, saying which part, how often and why", async () => {
    const json = { format: "cairn-claims/1", claims: [claims.claims[0], claims.claims[3]] };
    const parts = await partsOnThreads(json, { threads: 2, script, steps: DEFAULT_STEP_LIMIT, faults: ["part:2@*"] });
    const reason =
      "part 2 of 2 failed 3 times (fault injected into part 2, attempt 3), so the claim could not be decided; run the checker again (--parallel 1 checks it in one piece)";
    expect(parts["$.claims[0]"]).toMatchObject({ failed: reason });
    const report = checkDocument(json, "two.json", { parts });
    expect(report.lines.map((l) => [l.label, l.status])).toEqual([
      ["graphs-7", "undecided"],
      ["path", "verified"],
    ]);
    expect(report.lines[0]).toMatchObject({ method: "checked in parts", reason });
    expect(report.exitCode).toBe(EXIT_NOT_VERIFIED);
  }, 120_000);
});
