// Executes one run of the suite — one configuration on one instance — in its own child
// process under the limits, then audits its certificate when the configuration asks for
// it, and returns the result record; the run's files stay in its own folder.
import { existsSync, mkdirSync, readdirSync, rmSync, statSync, writeFileSync } from "node:fs";
import { join } from "node:path";
import { singleAuditJson } from "../report/certificate-view.js";
import type { AuditStatus, RunRecord } from "../report/record.js";
import { runChild, type ChildOutcome } from "./child.js";
import type { Configuration, Limits, RunFiles } from "./configs.js";
import { finalPoint, parseOutcome } from "./outcome.js";
import { cliCommand } from "./paths.js";

export interface RunSpec {
  instance: string;
  domain: string;
  domainFile: string;
  problemFile: string;
  configuration: string;
}

export interface RunOptions extends Limits {
  /** The bench directory (run folders go under runs/). */
  outDir: string;
  /** Extra seconds past the time limit before the child is killed. */
  graceSeconds: number;
  /** How to start plumbline (default: cliCommand()). */
  cli?: string[];
  signal?: AbortSignal;
}

export const runId = (r: { instance: string; configuration: string }) => `${r.instance}@${r.configuration}`;

const cleanSegment = (s: string) => {
  const t = s.replace(/[^A-Za-z0-9._+-]+/g, "_");
  return t === "." || t === ".." || t === "" ? "_" : t;
};

/** A relative path made from a name: "/" separates folders, other odd characters become "_". */
export const safePath = (name: string): string => join(...name.split("/").map(cleanSegment));

/** Folder of a run, relative to the bench directory: runs/<configuration>/<instance path>. */
export function runDirOf(r: { instance: string; configuration: string }): string {
  return join("runs", cleanSegment(r.configuration), safePath(r.instance));
}

function spawnArgs(config: Configuration, argv: string[], opts: RunOptions): { command: string; args: string[] } {
  if (config.external) return { command: argv[0], args: argv.slice(1) };
  const cli = opts.cli ?? cliCommand();
  // the V8 heap limit makes a runaway heap fail fast; resident memory is also polled
  return { command: cli[0], args: [`--max-old-space-size=${Math.max(16, Math.floor(opts.memoryLimit))}`, ...cli.slice(1), ...argv] };
}

/** Size on disk of the proof file in a certificate folder (the largest file named like a proof). */
function proofBytesIn(certDir: string): number | null {
  if (!existsSync(certDir)) return null;
  const files = readdirSync(certDir).filter((n) => /proof|\.drat|\.lrat/i.test(n));
  if (files.length === 0) return null;
  return Math.max(...files.map((n) => statSync(join(certDir, n)).size));
}

interface AuditOutcome {
  audit: AuditStatus;
  seconds: number | null;
  reason: string | null;
}

/** Runs `plumbline audit DIR --json` in a child process under the limits. */
export async function runAuditChild(certDir: string, opts: Limits & { graceSeconds: number; cli?: string[]; signal?: AbortSignal }): Promise<ChildOutcome> {
  const cli = opts.cli ?? cliCommand();
  return runChild({ command: cli[0], args: [`--max-old-space-size=${Math.max(16, Math.floor(opts.memoryLimit))}`, ...cli.slice(1), "audit", certDir, "--json", "--time-limit-per-certificate", String(opts.timeLimit)], timeLimit: opts.timeLimit, graceSeconds: opts.graceSeconds, memoryLimit: opts.memoryLimit, signal: opts.signal });
}

async function auditCertificate(certDir: string, opts: RunOptions, runDir: string): Promise<AuditOutcome> {
  if (!existsSync(join(certDir, "certificate.json"))) return { audit: "none", seconds: null, reason: null };
  const o = await runAuditChild(certDir, opts);
  writeFileSync(join(runDir, "audit.json"), o.stdout || "{}\n");
  if (o.stderr) writeFileSync(join(runDir, "audit-stderr.log"), o.stderr);
  return interpretAudit(o);
}

/** valid / invalid from the audit's JSON and exit code; anything else is unknown with a reason. */
export function interpretAudit(o: ChildOutcome): AuditOutcome {
  const json = singleAuditJson(o.stdout);
  if (o.killed) return { audit: "unfinished", seconds: o.seconds, reason: `audit killed (${o.killed} limit)` };
  if (o.exitCode === 3) return { audit: "unfinished", seconds: o.seconds, reason: "audit stopped by its time limit before the proof was checked" };
  if (json && typeof json.valid === "boolean" && (o.exitCode === 0 || o.exitCode === 1)) {
    if (json.valid) return { audit: "valid", seconds: o.seconds, reason: null };
    return { audit: "rejected", seconds: o.seconds, reason: failedCheck(json) };
  }
  return { audit: "unfinished", seconds: o.seconds, reason: `audit failed to run (exit ${o.exitCode})${json && typeof json.error === "string" ? `: ${json.error}` : ""}` };
}

/** The first failed check named in an audit's JSON (checks as an array or an object). */
function failedCheck(json: Record<string, unknown>): string {
  const checks = json.checks;
  const entries: Array<[string, unknown]> = Array.isArray(checks) ? checks.map((c, i) => [String((c as Record<string, unknown>)?.name ?? i), c]) : checks && typeof checks === "object" ? Object.entries(checks) : [];
  for (const [name, c] of entries) {
    if (c && typeof c === "object" && (c as Record<string, unknown>).skipped === true) continue; // not run because an earlier check failed
    const ok = typeof c === "boolean" ? c : c && typeof c === "object" ? ((c as Record<string, unknown>).ok ?? (c as Record<string, unknown>).valid ?? (c as Record<string, unknown>).passed) : undefined;
    if (ok === false) {
      const msg = c && typeof c === "object" ? ((c as Record<string, unknown>).detail ?? (c as Record<string, unknown>).message ?? (c as Record<string, unknown>).reason) : undefined;
      return `check ${name} failed${typeof msg === "string" ? `: ${msg}` : ""}`;
    }
  }
  return typeof json.reason === "string" ? json.reason : typeof json.message === "string" ? json.message : "rejected";
}

export async function executeRun(spec: RunSpec, config: Configuration, opts: RunOptions): Promise<RunRecord> {
  const relDir = runDirOf(spec);
  const runDir = join(opts.outDir, relDir);
  rmSync(runDir, { recursive: true, force: true }); // leftovers of an unfinished attempt
  mkdirSync(runDir, { recursive: true });
  const files: RunFiles = { domainFile: spec.domainFile, problemFile: spec.problemFile, runDir, certificateDir: join(runDir, "certificate"), planFile: join(runDir, "plan.txt") };
  const startedAt = new Date().toISOString();
  const { command, args } = spawnArgs(config, config.argv(files, opts), opts);
  writeFileSync(join(runDir, "command.txt"), [command, ...args].map((a) => (/^[\w./=:+-]+$/.test(a) ? a : JSON.stringify(a))).join(" ") + "\n");
  const o = await runChild({ command, args, timeLimit: opts.timeLimit, graceSeconds: opts.graceSeconds, memoryLimit: opts.memoryLimit, signal: opts.signal });
  writeFileSync(join(runDir, "stdout.json"), o.stdout);
  writeFileSync(join(runDir, "stderr.log"), o.stderr);
  const p = parseOutcome(o, opts);
  const memory = o.peakMb === null && p.toolPeakMb === null ? null : Math.max(o.peakMb ?? 0, p.toolPeakMb ?? 0);
  const audit = config.audits && !o.killed && !opts.signal?.aborted ? await auditCertificate(files.certificateDir, opts, runDir) : { audit: "none" as AuditStatus, seconds: null, reason: null };
  return {
    id: runId(spec),
    instance: spec.instance,
    domain: spec.domain,
    configuration: spec.configuration,
    domainFile: spec.domainFile,
    problemFile: spec.problemFile,
    status: p.status,
    reason: p.reason,
    cost: p.cost,
    lowerBound: p.lowerBound,
    horizon: p.horizon,
    planLength: p.planLength,
    seconds: round(o.seconds, 3),
    toolSeconds: p.toolSeconds === null ? null : round(p.toolSeconds, 3),
    memory: memory === null ? null : round(memory, 1),
    // the proof file as stored (compressed); the tool's own figure when no certificate was written
    proofBytes: proofBytesIn(files.certificateDir) ?? p.proofBytes,
    audit: audit.audit,
    auditSeconds: audit.seconds === null ? null : round(audit.seconds, 3),
    auditReason: audit.reason,
    exitCode: o.exitCode,
    timeLimit: opts.timeLimit,
    memoryLimit: opts.memoryLimit,
    timeline: finalPoint(p, round(o.seconds, 3)),
    startedAt,
    runDir: relDir,
  };
}

const round = (x: number, digits: number) => Math.round(x * 10 ** digits) / 10 ** digits;
