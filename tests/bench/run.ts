/**
 * `npm run bench` — times Cairn's verification core on the shared workloads (see workloads.ts).
 *
 *   npm run bench                 all sections, full sizes
 *   npm run bench -- --quick      small sizes only (a smoke run; not part of the unit tests)
 *   npm run bench -- --only tree  tasks whose id contains "tree"
 *   npm run bench -- --only offline      the offline checker with --parallel 1 and 2 (tests/bench/offline-parts.ts)
 *   npm run bench -- --only mixed-load   50 clients, 60 s of mixed reads and writes on a 60-case proof (tests/bench/mixed-load.ts)
 *   npm run bench -- --runs 5     repetitions per task (default 3; the median is reported)
 *
 * Each task runs in its own child process, so the peak memory reported (maxRSS from the kernel, and
 * the largest V8 heap seen by sampling) belongs to that task alone. Inside the child, the workload is
 * generated first and only the verification is timed.
 *
 * Extension point: a section is a named list of tasks; `SECTIONS` below is the list of sections. A
 * section that is not a core task (e.g. an HTTP API load test) can be added as a `BenchSection` with
 * its own `run` function that prints its own rows.
 */
import { spawnSync } from "node:child_process";
import { availableParallelism, cpus, totalmem } from "node:os";
import { fileURLToPath } from "node:url";
import { coreSection } from "./core-tasks";
import { apiLoadSection } from "./api-load";
import { overviewBytesSection } from "./overview-bytes";
import { batchThroughputSection } from "./batch-throughput";
import { mixedLoadSection } from "./mixed-load";
import { offlinePartsSection } from "./offline-parts";

/** One timed job: `prepare` builds the input (untimed), `run` does the verification (timed). */
export interface BenchTask {
  /** Unique id, used to run the task in a child process. */
  readonly id: string;
  readonly workload: string;
  readonly task: string;
  /** Included in `--quick` runs. */
  readonly quick: boolean;
  /** A target from the brief to report against, e.g. "< 2000 ms". */
  readonly targetMs?: number;
  prepare(): unknown;
  /** Returns a short result text (e.g. the verdict status) printed beside the timing. */
  run(input: unknown): string;
}

export interface BenchSection {
  readonly name: string;
  /** Core sections list tasks; other sections (HTTP load tests) bring their own runner. */
  readonly tasks?: readonly BenchTask[];
  run?(options: BenchOptions): Promise<void>;
}

export interface BenchOptions {
  readonly quick: boolean;
  readonly only?: string;
  readonly runs: number;
}

/** The sections of the benchmark, in print order. Add new sections here. */
export const SECTIONS: BenchSection[] = [coreSection, apiLoadSection, overviewBytesSection, batchThroughputSection, offlinePartsSection, mixedLoadSection];

interface ChildReport {
  readonly timesMs: number[];
  /** User + system CPU time of each run (the machine is shared: wall time alone can mislead). */
  readonly cpuMs?: number[];
  readonly result: string;
  readonly maxRssMiB: number;
  readonly peakHeapMiB: number;
  readonly error?: string;
}

const MiB = 1024 * 1024;

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  const k = s.length >> 1;
  return s.length % 2 ? s[k] : (s[k - 1] + s[k]) / 2;
}

/** Runs inside the child process: prepare once, run `runs` times, report as one JSON line. */
function runChild(taskId: string, runs: number): void {
  const task = SECTIONS.flatMap((s) => s.tasks ?? []).find((t) => t.id === taskId);
  if (!task) throw new Error(`unknown task ${taskId}`);
  let peakHeap = 0;
  const sample = () => {
    peakHeap = Math.max(peakHeap, process.memoryUsage().heapUsed);
  };
  const timer = setInterval(sample, 5);
  timer.unref();
  const timesMs: number[] = [];
  const cpuMs: number[] = [];
  let result = "";
  let error: string | undefined;
  try {
    const input = task.prepare();
    sample();
    for (let i = 0; i < runs; i++) {
      const c0 = process.cpuUsage();
      const t0 = process.hrtime.bigint();
      result = task.run(input);
      timesMs.push(Number(process.hrtime.bigint() - t0) / 1e6);
      const c = process.cpuUsage(c0);
      cpuMs.push((c.user + c.system) / 1000);
      sample();
    }
  } catch (e) {
    error = e instanceof Error ? e.message : String(e);
  }
  clearInterval(timer);
  sample();
  // resourceUsage().maxRSS is in KiB.
  const out: ChildReport = {
    timesMs,
    cpuMs,
    result,
    maxRssMiB: process.resourceUsage().maxRSS / 1024,
    peakHeapMiB: peakHeap / MiB,
    ...(error ? { error } : {}),
  };
  process.stdout.write(`BENCH-REPORT ${JSON.stringify(out)}\n`);
}

function runInChild(task: BenchTask, runs: number): ChildReport {
  const self = fileURLToPath(import.meta.url);
  const child = spawnSync(process.execPath, [...process.execArgv, self, "--child", task.id, "--runs", String(runs)], {
    encoding: "utf8",
    maxBuffer: 16 * MiB,
    // A task that hangs is a finding, not a reason to hang the bench.
    timeout: 10 * 60 * 1000,
  });
  const line = child.stdout.split("\n").find((l) => l.startsWith("BENCH-REPORT "));
  if (!line) {
    const why = child.error?.message ?? (child.stderr.trim().split("\n").pop() || `exit ${child.status}`);
    return { timesMs: [], result: "", maxRssMiB: 0, peakHeapMiB: 0, error: why };
  }
  return JSON.parse(line.slice("BENCH-REPORT ".length)) as ChildReport;
}

function pad(s: string, n: number): string {
  return s.length >= n ? s : s + " ".repeat(n - s.length);
}

function printMachine(options: BenchOptions): void {
  const cpu = cpus()[0]?.model ?? "unknown CPU";
  console.log(`Cairn bench — ${new Date().toISOString()}`);
  console.log(
    `machine: ${availableParallelism()} cores (${cpu}), ${(totalmem() / 1024 ** 3).toFixed(1)} GiB RAM, Node ${process.version}, ${process.platform}/${process.arch}`,
  );
  console.log(
    `runs per task: ${options.runs} (median reported)${options.quick ? ", quick sizes only" : ""}; memory: peak RSS of the task's own process / peak V8 heap`,
  );
}

/**
 * The general-purpose tools timed beside Cairn (Debian's nauty: geng, gentreeg) are installed the way `npm test`
 * installs them, when missing and when this runs as root; otherwise their rows say how to install them.
 */
function ensureComparisonTools(): void {
  const r = spawnSync("bash", ["-c", "source scripts/common.sh; ensure_debian_package nauty-geng nauty"], { stdio: ["ignore", "inherit", "inherit"] });
  if (r.status !== 0) console.log("(nauty could not be installed here: its comparison rows are left out)");
}

async function runSections(options: BenchOptions): Promise<void> {
  ensureComparisonTools();
  printMachine(options);
  for (const section of SECTIONS) {
    console.log(`\n## ${section.name}`);
    if (section.run) {
      // One failing section (a server that would not start) must not hide the figures of the others.
      try {
        await section.run(options);
      } catch (e) {
        console.log(`section "${section.name}" failed: ${e instanceof Error ? e.message.split("\n")[0] : String(e)}`);
        process.exitCode = 1;
      }
      continue;
    }
    const tasks = (section.tasks ?? []).filter((t) => (!options.quick || t.quick) && (!options.only || t.id.includes(options.only)));
    console.log(
      `${pad("workload", 28)} ${pad("task", 44)} ${pad("median ms", 10)} ${pad("CPU ms", 10)} ${pad("RSS/heap MiB", 14)} ${pad("target", 10)} result`,
    );
    for (const task of tasks) {
      const r = runInChild(task, options.runs);
      const ms = r.timesMs.length ? median(r.timesMs) : NaN;
      const cpu = r.cpuMs?.length ? median(r.cpuMs).toFixed(1) : "-";
      const mem = r.maxRssMiB ? `${r.maxRssMiB.toFixed(0)}/${r.peakHeapMiB.toFixed(0)}` : "-";
      const target = task.targetMs === undefined ? "" : `< ${task.targetMs}${Number.isFinite(ms) ? (ms < task.targetMs ? " ok" : " MISS") : ""}`;
      const result = r.error ? `ERROR: ${r.error}` : r.result;
      console.log(
        `${pad(task.workload, 28)} ${pad(task.task, 44)} ${pad(Number.isFinite(ms) ? ms.toFixed(1) : "-", 10)} ${pad(cpu, 10)} ${pad(mem, 14)} ${pad(target, 10)} ${result}`,
      );
    }
  }
}

function parseArgs(argv: string[]): BenchOptions & { child?: string } {
  const value = (flag: string) => {
    const i = argv.indexOf(flag);
    return i >= 0 ? argv[i + 1] : undefined;
  };
  const runs = Number(value("--runs") ?? 3);
  if (!Number.isInteger(runs) || runs < 1) throw new Error("--runs needs a positive integer");
  return { quick: argv.includes("--quick"), only: value("--only"), runs, child: value("--child") };
}

const options = parseArgs(process.argv.slice(2));
if (options.child) runChild(options.child, options.runs);
else await runSections(options);
