// Runs one child process under a time and a memory limit: the whole process group is killed
// when the wall clock passes the limit (plus grace) or resident memory passes the limit, and
// the outcome says which; stdout/stderr are collected.
import { spawn } from "node:child_process";
import { performance } from "node:perf_hooks";
import { treeMemory } from "./memory.js";

export interface ChildSpec {
  command: string;
  args: string[];
  cwd?: string;
  env?: NodeJS.ProcessEnv;
  /** Seconds; the child is killed at timeLimit + graceSeconds. */
  timeLimit: number;
  graceSeconds: number;
  /** MB of resident memory (whole process tree); exceeding it kills the child. */
  memoryLimit: number;
  /** How often memory is sampled (ms). */
  pollMs?: number;
  signal?: AbortSignal;
}

export interface ChildOutcome {
  exitCode: number | null;
  signal: string | null;
  stdout: string;
  stderr: string;
  seconds: number;
  /** Largest resident memory seen, MB (null where /proc is unavailable). */
  peakMb: number | null;
  killed: null | "time" | "memory" | "abort";
  /** The child could not be started at all. */
  spawnError: string | null;
}

const MB = 1048576;

export function runChild(spec: ChildSpec): Promise<ChildOutcome> {
  return new Promise((resolveOutcome) => {
    const start = performance.now();
    let stdout = "";
    let stderr = "";
    let killed: ChildOutcome["killed"] = null;
    let peak: number | null = null;
    let done = false;
    const child = spawn(spec.command, spec.args, { cwd: spec.cwd, env: spec.env ?? process.env, detached: true, stdio: ["ignore", "pipe", "pipe"] });
    child.stdout.setEncoding("utf8").on("data", (s: string) => (stdout += s));
    child.stderr.setEncoding("utf8").on("data", (s: string) => {
      // keep the tail only: a chatty child must not grow the runner without bound
      stderr = (stderr + s).slice(-200_000);
    });
    const kill = (why: NonNullable<ChildOutcome["killed"]>) => {
      if (done || killed) return;
      killed = why;
      try {
        if (child.pid !== undefined) process.kill(-child.pid, "SIGKILL");
      } catch {
        try {
          child.kill("SIGKILL");
        } catch {
          /* already gone */
        }
      }
    };
    const sample = () => {
      if (child.pid === undefined || done) return;
      const m = treeMemory(child.pid);
      if (!m) return;
      const seen = Math.max(m.rss, m.rootPeak);
      peak = Math.max(peak ?? 0, seen);
      if (m.rss > spec.memoryLimit * MB) kill("memory");
    };
    const poll = setInterval(sample, spec.pollMs ?? 100);
    const timer = setTimeout(() => kill("time"), (spec.timeLimit + spec.graceSeconds) * 1000);
    const onAbort = () => kill("abort");
    spec.signal?.addEventListener("abort", onAbort, { once: true });
    if (spec.signal?.aborted) onAbort();
    const finish = (exitCode: number | null, signal: string | null, spawnError: string | null) => {
      if (done) return;
      sample();
      done = true;
      // anything the child left running in its group goes too
      try {
        if (child.pid !== undefined) process.kill(-child.pid, "SIGKILL");
      } catch {
        /* the group is already gone */
      }
      clearInterval(poll);
      clearTimeout(timer);
      spec.signal?.removeEventListener("abort", onAbort);
      resolveOutcome({ exitCode, signal, stdout, stderr, seconds: (performance.now() - start) / 1000, peakMb: peak === null ? null : peak / MB, killed, spawnError });
    };
    child.on("error", (e) => finish(null, null, e.message));
    child.on("close", (code, sig) => finish(code, sig, null));
  });
}
