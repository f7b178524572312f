// Audits many certificate folders, N at a time in child processes (one core each), each under
// its own time limit; every folder gets a verdict: valid, rejected, unfinished, unreadable or error.
import { fork, type ChildProcess } from "node:child_process";
import { existsSync, readFileSync } from "node:fs";
import * as path from "node:path";
import { createRequire } from "node:module";
import { fileURLToPath, pathToFileURL } from "node:url";
import { isPlumblineError } from "../util/errors.js";
import { auditCertificate, type AuditCheck, type AuditReport } from "./audit.js";
import { discoverCertificates } from "./discover.js";
import { FILES } from "./format.js";

export type BulkVerdict = "valid" | "rejected" | "unfinished" | "unreadable" | "error";

export interface BulkEntry {
  /** The certificate folder (or, for `unreadable`, the path that named none). */
  dir: string;
  verdict: BulkVerdict;
  claim: { status: string; how: string } | null;
  cost: number | null;
  seconds: number;
  /** Every check of the audit, in order ([] without a report). */
  checks: AuditCheck[];
  /** Names of the checks that failed (skipped ones not counted). */
  failed: string[];
  /** Why there is no verdict on the certificate (unfinished, unreadable, error), else null. */
  reason: string | null;
}

export interface BulkOptions {
  /** Audits at once, each in its own child process (default 1). */
  jobs?: number;
  /** Seconds per certificate; past it (plus GRACE_SECONDS) its child is stopped: `unfinished`. */
  timeLimit?: number;
  signal?: AbortSignal;
  /** Seconds a child may run past the time limit before it is killed (default GRACE_SECONDS). */
  graceSeconds?: number;
  /** Called as each certificate gets its verdict. */
  onEntry?: (e: BulkEntry, done: number, total: number) => void;
}

/** How long a child may run past the time limit (phases without their own deadline check) before it is killed. */
export const GRACE_SECONDS = 2;

/** Message to the child process. */
export interface ChildRequest {
  id: number;
  dir: string;
  timeLimit: number | null;
}
/** Message from the child process. */
export interface ChildReply {
  id: number;
  report: AuditReport | null;
  error: string | null;
  /** True for an unexpected exception (a bug), false for an unreadable certificate. */
  internal: boolean;
}

/**
 * True when the audit stopped at its time limit (or an abort) instead of reaching a verdict:
 * every failed check is the proof check, cut short. A certificate with any other failed check
 * is rejected whatever the time.
 */
export function stoppedEarly(r: AuditReport): boolean {
  return !r.valid && !r.finished;
}

/** The entry for a finished audit. */
export function entryOf(r: AuditReport): BulkEntry {
  const failed = r.checks.filter((c) => !c.ok && !c.skipped && !c.stopped).map((c) => c.name);
  const unfinished = stoppedEarly(r);
  return {
    dir: r.dir,
    verdict: r.valid ? "valid" : unfinished ? "unfinished" : "rejected",
    claim: r.claim,
    cost: r.cost,
    seconds: r.seconds,
    checks: r.checks,
    failed: unfinished ? [] : failed,
    reason: unfinished ? (r.checks.find((c) => c.stopped)?.detail ?? "not finished within the time limit") : null,
  };
}

const bare = (dir: string, verdict: BulkVerdict, reason: string, seconds = 0): BulkEntry => ({ dir, verdict, claim: null, cost: null, seconds, checks: [], failed: [], reason });

/**
 * A rough size of a certificate's audit, for ordering only: the DRAT check dominates, and it grows
 * with the proof (uncompressed bytes) and the CNF. 0 when the record is unreadable.
 */
export function workEstimate(dir: string): number {
  try {
    const j = JSON.parse(readFileSync(path.join(dir, FILES.certificate), "utf8")) as { proof?: { uncompressedBytes?: unknown }; cnf?: { clauses?: unknown } };
    const bytes = typeof j.proof?.uncompressedBytes === "number" ? j.proof.uncompressedBytes : 0;
    const clauses = typeof j.cnf?.clauses === "number" ? j.cnf.clauses : 0;
    return bytes + 40 * clauses;
  } catch {
    return 0;
  }
}

/** The child's entry module and the Node options it needs (tsx when running from the TypeScript sources). */
function childCommand(): { file: string; execArgv: string[] } {
  const here = fileURLToPath(import.meta.url);
  const ts = here.endsWith(".ts");
  const file = here.replace(/bulk\.(ts|js)$/, `audit-child.${ts ? "ts" : "js"}`);
  if (!existsSync(file)) throw new Error(`bulk audit: missing ${file}`);
  // one core per child: without V8's background compiler and GC threads an audit child uses about
  // 1.2 cores, so two children on two cores slowed each other (measured: --jobs 2 took 45–48 s with
  // them, 40 s without, on 58 certificates that take 76 s one at a time either way)
  const oneCore = ["--single-threaded"];
  if (!ts) return { file, execArgv: oneCore };
  const loader = createRequire(import.meta.url).resolve("tsx");
  return { file, execArgv: [...oneCore, "--import", pathToFileURL(loader).href] };
}

interface Slot {
  child: ChildProcess;
  job: { index: number; id: number; start: number; timer: NodeJS.Timeout | null; timedOut: boolean } | null;
  stderr: string;
}

/**
 * Audits every certificate found under `paths` (see discoverCertificates), `jobs` at a time.
 * Entries come back in discovery order, paths that named no certificate first.
 */
export async function auditMany(paths: readonly string[], opts: BulkOptions = {}): Promise<BulkEntry[]> {
  const found = discoverCertificates(paths);
  const problems = found.problems.map((p) => bare(p.path, "unreadable", p.reason));
  const total = problems.length + found.dirs.length;
  let done = 0;
  const report = (e: BulkEntry) => opts.onEntry?.(e, ++done, total);
  problems.forEach(report);
  const results = await auditDirs(found.dirs, opts, report);
  return [...problems, ...results];
}

/**
 * One certificate, audited in this process (no child to start): the time limit reaches the proof
 * check as its deadline, but a phase that does not watch the deadline cannot be cut short here.
 */
function auditHere(dir: string, opts: BulkOptions): BulkEntry {
  const t0 = performance.now();
  try {
    return entryOf(auditCertificate(dir, { deadline: opts.timeLimit === undefined ? undefined : Date.now() + opts.timeLimit * 1000, signal: opts.signal }));
  } catch (e) {
    return bare(dir, isPlumblineError(e) ? "unreadable" : "error", (e as Error)?.message ?? String(e), (performance.now() - t0) / 1000);
  }
}

/**
 * Audits exactly these certificate folders, `jobs` at a time in child processes (a single folder
 * in this process); results in the same order.
 */
export function auditDirs(dirs: readonly string[], opts: BulkOptions, report: (e: BulkEntry) => void = () => {}): Promise<BulkEntry[]> {
  const results: Array<BulkEntry | null> = dirs.map(() => null);
  if (dirs.length === 0) return Promise.resolve([]);
  if (dirs.length === 1) {
    const e = auditHere(dirs[0], opts);
    report(e);
    return Promise.resolve([e]);
  }
  const jobs = Math.max(1, Math.min(opts.jobs ?? 1, dirs.length));
  const limit = opts.timeLimit ?? null;
  const grace = opts.graceSeconds ?? GRACE_SECONDS;
  const { file, execArgv } = childCommand();
  // the longest audits first, so that no long one starts last while the other cores sit idle
  const order = dirs.map((_, i) => i).sort((a, b) => workEstimate(dirs[b]) - workEstimate(dirs[a]) || a - b);
  let next = 0;
  let ids = 0;
  const slots = new Set<Slot>();

  return new Promise((resolve) => {
    const finishIfDone = () => {
      if (results.every((r) => r !== null)) {
        for (const s of slots) s.child.kill("SIGKILL");
        slots.clear();
        opts.signal?.removeEventListener("abort", onAbort);
        resolve(results as BulkEntry[]);
      }
    };
    const settle = (index: number, e: BulkEntry) => {
      if (results[index] !== null) return;
      results[index] = e;
      report(e);
    };
    const onAbort = () => {
      next = dirs.length;
      for (const s of slots) {
        if (s.job) settle(s.job.index, bare(dirs[s.job.index], "unfinished", "interrupted before the audit finished", (performance.now() - s.job.start) / 1000));
        s.child.kill("SIGKILL");
      }
      slots.clear();
      dirs.forEach((d, i) => settle(i, bare(d, "unfinished", "interrupted before the audit started")));
      finishIfDone();
    };
    const dispatch = (s: Slot) => {
      if (s.job?.timer) clearTimeout(s.job.timer);
      s.job = null;
      if (next >= dirs.length) {
        s.child.kill("SIGKILL");
        slots.delete(s);
        return finishIfDone();
      }
      const index = order[next++];
      const id = ++ids;
      s.job = { index, id, start: performance.now(), timer: null, timedOut: false };
      if (limit !== null) {
        const job = s.job;
        job.timer = setTimeout(() => {
          job.timedOut = true;
          s.child.kill("SIGKILL");
        }, (limit + grace) * 1000);
      }
      s.child.send({ id, dir: dirs[index], timeLimit: limit } satisfies ChildRequest);
    };
    const spawn = () => {
      const child = fork(file, [], { execArgv, stdio: ["ignore", "ignore", "pipe", "ipc"] });
      const s: Slot = { child, job: null, stderr: "" };
      slots.add(s);
      child.on("error", () => {}); // a send to a child that just died; its exit event settles the job
      child.stderr?.setEncoding("utf8").on("data", (t: string) => (s.stderr = (s.stderr + t).slice(-4000)));
      child.on("message", (m: ChildReply) => {
        if (!s.job || m.id !== s.job.id) return;
        const dir = dirs[s.job.index];
        const secs = (performance.now() - s.job.start) / 1000;
        settle(s.job.index, m.report ? entryOf(m.report) : bare(dir, m.internal ? "error" : "unreadable", m.error ?? "unreadable", secs));
        dispatch(s);
      });
      child.on("exit", (code, signal) => {
        if (!slots.has(s)) return;
        slots.delete(s);
        if (s.job) {
          if (s.job.timer) clearTimeout(s.job.timer);
          const secs = (performance.now() - s.job.start) / 1000;
          const dir = dirs[s.job.index];
          settle(
            s.job.index,
            s.job.timedOut
              ? bare(dir, "unfinished", `not finished within the time limit of ${limit} s (stopped ${grace} s past it)`, secs)
              : signal === "SIGINT" || signal === "SIGTERM" // Ctrl-C reaches the children too, maybe before the parent's abort
                ? bare(dir, "unfinished", `interrupted (${signal}) before the audit finished`, secs)
                : bare(dir, "error", `the audit process ended unexpectedly (${signal ?? `exit code ${code}`})${s.stderr ? `: ${s.stderr.trim().split("\n").slice(-3).join(" ")}` : ""}`, secs),
          );
          if (next < dirs.length) dispatch(spawn());
        }
        finishIfDone();
      });
      return s;
    };
    if (opts.signal?.aborted) return onAbort();
    opts.signal?.addEventListener("abort", onAbort, { once: true });
    for (let k = 0; k < jobs; k++) dispatch(spawn());
  });
}

/** The process exit code for a bulk audit: 4 an internal error, else 1 any rejected, 2 any unreadable, 3 any unfinished, 0 all valid. */
export function bulkExitCode(entries: readonly BulkEntry[]): number {
  const has = (v: BulkVerdict) => entries.some((e) => e.verdict === v);
  if (has("error")) return 4;
  if (has("rejected")) return 1;
  if (has("unreadable")) return 2;
  if (has("unfinished")) return 3;
  return entries.length > 0 ? 0 : 2;
}
