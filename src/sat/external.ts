// Runs an external DIMACS SAT solver (`--sat external:CMD`): writes the CNF to a temporary
// file, runs CMD, reads its "s"/"v" lines, and checks any model it returns against the clauses.
import { spawn } from "node:child_process";
import * as fs from "node:fs";
import { tmpdir } from "node:os";
import * as path from "node:path";
import { PlumblineError } from "../util/errors.js";
import { asStream, firstFalsifiedClause, writeDimacsFile, type StreamedCnf } from "./dimacs-stream.js";
import type { CompactCnf, Cnf, SolveStatus } from "./types.js";

export interface ExternalOptions {
  /** Ask the solver for a DRAT proof at this path (via `{proof}` in CMD, or appended after the CNF path). */
  proofPath?: string;
  timeoutMs?: number;
  signal?: AbortSignal;
  /** Directory for the temporary CNF file (default: the system temp directory). */
  tmpDir?: string;
}

export interface ExternalResult {
  status: SolveStatus;
  /** Index v: 1 true, −1 false (only when sat; checked against every clause). */
  model?: Int8Array;
  /** The proof file, when one was requested and the solver wrote it. */
  proofPath?: string;
  exitCode: number | null;
  seconds: number;
  command: string[];
}

/** Splits a command line into words (whitespace separated; '…' and "…" group). */
export function splitCommand(cmd: string): string[] {
  const words: string[] = [];
  const re = /"([^"]*)"|'([^']*)'|(\S+)/g;
  for (let m = re.exec(cmd); m !== null; m = re.exec(cmd)) words.push(m[1] ?? m[2] ?? m[3]);
  return words;
}

/**
 * Runs `cmd` on `cnf`. `{cnf}` and `{proof}` in CMD are replaced by the file paths; without
 * `{cnf}` the CNF path is appended, and a requested proof path follows it (the usual convention
 * of proof-producing solvers). A missing command is a PlumblineError with code "external".
 */
export async function solveExternal(cmd: string, input: Cnf | CompactCnf | StreamedCnf, opts: ExternalOptions = {}): Promise<ExternalResult> {
  const cnf = asStream(input);
  const words = splitCommand(cmd);
  if (words.length === 0) throw new PlumblineError("usage", "external SAT solver: empty command (expected external:CMD)");
  const dir = fs.mkdtempSync(path.join(opts.tmpDir ?? tmpdir(), "plumbline-ext-"));
  const cnfPath = path.join(dir, "input.cnf");
  try {
    writeDimacsFile(cnfPath, cnf);
  } catch (e) {
    fs.rmSync(dir, { recursive: true, force: true });
    throw e;
  }
  const wantsProofSlot = words.some((w) => w.includes("{proof}"));
  const proofPath = opts.proofPath ?? (wantsProofSlot ? path.join(dir, "proof.drat") : undefined);
  let args = words.slice(1).map((w) => w.replaceAll("{cnf}", cnfPath).replaceAll("{proof}", proofPath ?? ""));
  if (!words.some((w) => w.includes("{cnf}"))) {
    args.push(cnfPath);
    if (opts.proofPath && !wantsProofSlot) args.push(opts.proofPath);
  }
  args = args.filter((a) => a !== "");
  const command = [words[0], ...args];
  const t0 = performance.now();
  try {
    const run = await runProcess(words[0], args, opts);
    const seconds = (performance.now() - t0) / 1000;
    if (run.stopped) return { status: "unknown", exitCode: run.code, seconds, command };
    const parsed = parseSolverOutput(run.stdout, cnf.numVars);
    if (parsed.status === null) {
      const tail = run.stderr.trim().split("\n").slice(-3).join(" | ");
      throw new PlumblineError("external", `external SAT solver '${words[0]}' printed no 's' line (exit code ${run.code})${tail ? `: ${tail}` : ""}`);
    }
    const result: ExternalResult = { status: parsed.status, exitCode: run.code, seconds, command };
    if (parsed.status === "sat") {
      const bad = firstFalsifiedClause(cnf, parsed.model);
      if (bad >= 0) throw new PlumblineError("external", `external SAT solver '${words[0]}' returned a model that falsifies clause ${bad + 1}`);
      result.model = parsed.model;
    }
    if (parsed.status === "unsat" && opts.proofPath && fs.existsSync(opts.proofPath)) result.proofPath = opts.proofPath;
    return result;
  } finally {
    fs.rmSync(dir, { recursive: true, force: true });
  }
}

interface RunResult {
  code: number | null;
  stdout: string;
  stderr: string;
  stopped: boolean;
}

function runProcess(prog: string, args: string[], opts: ExternalOptions): Promise<RunResult> {
  return new Promise((resolve, reject) => {
    const child = spawn(prog, args, { stdio: ["ignore", "pipe", "pipe"] });
    const out: Buffer[] = [];
    const err: Buffer[] = [];
    let stopped = false;
    const stop = () => {
      stopped = true;
      child.kill("SIGTERM");
    };
    const timer = opts.timeoutMs !== undefined ? setTimeout(stop, opts.timeoutMs) : undefined;
    if (opts.signal?.aborted) stop();
    opts.signal?.addEventListener("abort", stop, { once: true });
    child.stdout.on("data", (b: Buffer) => out.push(b));
    child.stderr.on("data", (b: Buffer) => err.push(b));
    child.on("error", (e: NodeJS.ErrnoException) => {
      if (timer) clearTimeout(timer);
      opts.signal?.removeEventListener("abort", stop);
      if (e.code === "ENOENT") reject(new PlumblineError("external", `external SAT solver '${prog}' not found (is it installed and on PATH?)`));
      else if (e.code === "EACCES") reject(new PlumblineError("external", `external SAT solver '${prog}' is not executable`));
      else reject(new PlumblineError("external", `cannot run external SAT solver '${prog}': ${e.message}`));
    });
    child.on("close", (code) => {
      if (timer) clearTimeout(timer);
      opts.signal?.removeEventListener("abort", stop);
      resolve({ code, stdout: Buffer.concat(out).toString("utf8"), stderr: Buffer.concat(err).toString("utf8"), stopped });
    });
  });
}

/** Reads the standard "s" and "v" lines of a DIMACS solver's output. */
export function parseSolverOutput(stdout: string, numVars: number): { status: SolveStatus | null; model: Int8Array } {
  let status: SolveStatus | null = null;
  const model = new Int8Array(numVars + 1).fill(-1);
  model[0] = 0;
  for (const raw of stdout.split("\n")) {
    const line = raw.trim();
    if (line.startsWith("s ")) {
      const word = line.slice(2).trim().toUpperCase();
      status = word === "SATISFIABLE" ? "sat" : word === "UNSATISFIABLE" ? "unsat" : "unknown";
    } else if (line.startsWith("v ") || line === "v") {
      for (const tok of line.slice(1).trim().split(/\s+/)) {
        if (tok === "") continue;
        const x = Number(tok);
        if (!Number.isInteger(x)) throw new PlumblineError("external", `external SAT solver printed a bad value line: '${line.slice(0, 60)}'`);
        const v = Math.abs(x);
        if (v >= 1 && v <= numVars) model[v] = x > 0 ? 1 : -1;
      }
    }
  }
  return { status, model };
}
