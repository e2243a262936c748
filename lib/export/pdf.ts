/**
 * PDF from the exported LaTeX with pdflatex, in a fresh temporary directory: no shell escape,
 * non-interactive, halting on the first error, files outside the directory unreadable and unwritable
 * (openin_any/openout_any = p), and a time limit. Node-only (child_process), framework-free.
 */
import { execFile, type ExecFileException } from "node:child_process";
import { access, mkdir, mkdtemp, readFile, rename, rm, writeFile } from "node:fs/promises";
import { createHash } from "node:crypto";
import { constants } from "node:fs";
import { tmpdir } from "node:os";
import { delimiter, join } from "node:path";
import { readEnv } from "@/lib/env";
import { failingLines, setMathAsSource } from "./latex-fallback";

export class PdfUnavailableError extends Error {
  constructor() {
    super(
      "pdflatex is not installed on this server. Install Debian's texlive-latex-base, texlive-latex-recommended and texlive-fonts-recommended (apt-get install …), or download the .tex and compile it yourself, or print the print view to PDF from your browser.",
    );
    this.name = "PdfUnavailableError";
  }
}

export class PdfFailedError extends Error {
  constructor(readonly log: string) {
    super("pdflatex could not compile the exported document");
    this.name = "PdfFailedError";
  }
}

export interface CompileResult {
  pdf: Buffer;
  log: string;
}

interface RunResult {
  code: number | null;
  error?: ExecFileException;
}

function run(cmd: string, args: string[], cwd: string, timeoutMs: number): Promise<RunResult> {
  return new Promise((resolve) => {
    execFile(
      cmd,
      args,
      {
        cwd,
        timeout: timeoutMs,
        killSignal: "SIGKILL",
        maxBuffer: 16 * 1024 * 1024,
        env: {
          NODE_ENV: process.env.NODE_ENV,
          PATH: process.env.PATH ?? "/usr/bin:/bin",
          HOME: cwd,
          openin_any: "p",
          openout_any: "p",
          shell_escape: "f",
          TEXMFOUTPUT: cwd,
        } as NodeJS.ProcessEnv,
      },
      (error) => resolve({ code: error ? (typeof error.code === "number" ? error.code : null) : 0, error: error ?? undefined }),
    );
  });
}

/** Compiles LaTeX source to PDF; throws PdfUnavailableError when pdflatex is missing, PdfFailedError with the log otherwise. */
export async function compileLatex(tex: string, { timeoutMs = 60_000, runs = 1, haltOnError = true } = {}): Promise<CompileResult> {
  const dir = await mkdtemp(join(tmpdir(), "cairn-tex-"));
  try {
    await writeFile(join(dir, "proof.tex"), tex, "utf8");
    let last: RunResult = { code: 0 };
    for (let i = 0; i < runs; i++) {
      last = await run(
        "pdflatex",
        ["-no-shell-escape", "-interaction=nonstopmode", ...(haltOnError ? ["-halt-on-error"] : []), "-file-line-error", "proof.tex"],
        dir,
        timeoutMs,
      );
      if (last.error?.code === "ENOENT") throw new PdfUnavailableError();
      if (last.code !== 0) break;
    }
    const log = await readFile(join(dir, "proof.log"), "utf8").catch(() => "");
    if (last.code !== 0) throw new PdfFailedError(log || String(last.error?.message ?? "no log"));
    return { pdf: await readFile(join(dir, "proof.pdf")), log };
  } finally {
    await rm(dir, { recursive: true, force: true });
  }
}

/** Rounds of setting failing formulas as source before every formula of the document is. */
const MAX_FORMULA_ROUNDS = 3;

/**
 * compileLatex, but a formula that does not compile cannot take the document down. pdflatex runs on
 * past errors here, so one run names every failing line; the formulas on those lines are set as their
 * source with a mark (latex-fallback.ts) and the document compiled again; after a few such rounds every
 * formula of the body is. `recovered` counts the rounds; `tex` is the source that compiled.
 */
export async function compileLatexRobustly(
  tex: string,
  options: { timeoutMs?: number; runs?: number } = {},
): Promise<CompileResult & { tex: string; recovered: number }> {
  let current = tex;
  for (let round = 0; ; round++) {
    try {
      return { ...(await compileLatex(current, { ...options, haltOnError: false })), tex: current, recovered: round };
    } catch (e) {
      if (!(e instanceof PdfFailedError)) throw e;
      let next: string | null = null;
      if (round < MAX_FORMULA_ROUNDS) for (const line of failingLines(e.log)) next = setMathAsSource(next ?? current, line) ?? next;
      next ??= setMathAsSource(current, "all");
      if (next === null) throw e;
      current = next;
    }
  }
}

/** Whether pdflatex is on this server's PATH, so that pages can say so before anyone clicks. */
export async function pdflatexAvailable(): Promise<boolean> {
  for (const dir of (process.env.PATH ?? "").split(delimiter).filter(Boolean)) {
    try {
      await access(join(dir, "pdflatex"), constants.X_OK);
      return true;
    } catch {
      // not in this directory
    }
  }
  return false;
}

const inFlight = new Map<string, Promise<Buffer>>();
let queue: Promise<unknown> = Promise.resolve();

/**
 * The PDF of an export's LaTeX, compiled once and kept: exports never change, so the file is cached
 * on disk under the SHA-256 of its source (CAIRN_PDF_CACHE, default .data/pdf-cache). Requests for
 * the same source while it compiles share that compilation, and pdflatex runs one at a time, so a
 * burst of downloads cannot start a crowd of TeX processes.
 */
export async function cachedPdf(tex: string, options: { runs?: number; timeoutMs?: number } = {}): Promise<{ pdf: Buffer; cached: boolean }> {
  const key = createHash("sha256").update(tex).digest("hex");
  const dir = readEnv().CAIRN_PDF_CACHE ?? join(process.cwd(), ".data", "pdf-cache");
  const file = join(dir, `${key}.pdf`);
  const kept = await readFile(file).catch(() => null);
  if (kept) return { pdf: kept, cached: true };
  let job = inFlight.get(key);
  if (!job) {
    const start = queue.then(() => compileLatexRobustly(tex, options));
    queue = start.catch(() => undefined);
    job = start.then(async ({ pdf }) => {
      await mkdir(dir, { recursive: true });
      const tmp = `${file}.${process.pid}.${Date.now()}.tmp`;
      await writeFile(tmp, pdf);
      await rename(tmp, file); // whole files only: a reader never sees half a PDF
      return pdf;
    });
    inFlight.set(key, job);
    void job.catch(() => undefined).finally(() => inFlight.delete(key));
  }
  return { pdf: await job, cached: false };
}
