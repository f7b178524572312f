// Turns what a child run printed (one JSON object from `solve`/`search --json`, or nothing
// when it was killed or crashed) into the fields of a result record, tolerating the small
// differences between commands (horizon as a number or an object, plan or length, ...).
import type { RunRecord, RunStatus, TimelinePoint } from "../report/record.js";
import { normaliseTimeline, numOrNull } from "../report/timeline.js";
import type { ChildOutcome } from "./child.js";

const STATUSES: readonly string[] = ["optimal", "feasible", "unsolvable", "unknown"];

/** The last complete JSON object on stdout (commands print exactly one with --json). */
export function jsonOf(stdout: string): Record<string, unknown> | null {
  const t = stdout.trim();
  if (!t) return null;
  try {
    const v = JSON.parse(t) as unknown;
    return v !== null && typeof v === "object" && !Array.isArray(v) ? (v as Record<string, unknown>) : null;
  } catch {
    const at = t.lastIndexOf("\n{");
    if (at < 0) return null;
    return jsonOf(t.slice(at + 1));
  }
}

/** A number, or the first numeric field among `keys` of an object. */
function numberIn(v: unknown, keys: readonly string[]): number | null {
  if (typeof v === "number") return numOrNull(v);
  if (v !== null && typeof v === "object") for (const k of keys) {
    const x = numOrNull((v as Record<string, unknown>)[k]);
    if (x !== null) return x;
  }
  return null;
}


/** The record fields a run's output determines, plus what is needed to finish the record. */
export type ParsedOutcome = Pick<RunRecord, "status" | "reason" | "cost" | "lowerBound" | "horizon" | "planLength" | "toolSeconds" | "proofBytes" | "timeline"> & {
  toolPeakMb: number | null;
  json: Record<string, unknown> | null;
};

const lastLine = (s: string) =>
  s
    .trim()
    .split("\n")
    .filter((l) => l.trim())
    .slice(-1)[0]
    ?.slice(0, 300) ?? "";

/** Interprets a finished child: limits first, then the command's own JSON and exit code. */
export function parseOutcome(o: ChildOutcome, limits: { timeLimit: number; memoryLimit: number }): ParsedOutcome {
  const json = jsonOf(o.stdout);
  const base: ParsedOutcome = { status: "unknown", reason: null, cost: null, lowerBound: null, horizon: null, planLength: null, toolSeconds: null, toolPeakMb: null, proofBytes: null, timeline: [], json };
  if (json) {
    const plan = json.plan;
    base.cost = numOrNull(json.cost);
    base.lowerBound = numOrNull(json.lowerBound);
    base.horizon = numberIn(json.horizon, ["horizon", "value", "steps"]);
    base.planLength = numOrNull(json.length) ?? numOrNull(json.planLength) ?? (Array.isArray(plan) ? plan.length : null);
    base.toolSeconds = numOrNull(json.seconds);
    const peakBytes = numOrNull(json.peakMemoryBytes);
    base.toolPeakMb = peakBytes !== null ? peakBytes / 1048576 : numOrNull(json.peakMemoryMb);
    base.proofBytes = numOrNull(json.proofBytes) ?? numberIn(json.proof, ["bytes", "size", "proofBytes"]);
    base.timeline = normaliseTimeline(json.timeline);
  }
  if (o.spawnError) return { ...base, status: "error", reason: `could not start: ${o.spawnError}` };
  if (o.killed === "time") return { ...base, status: "unknown", reason: `killed: still running ${o.seconds.toFixed(1)} s after start (time limit ${limits.timeLimit} s)` };
  if (o.killed === "memory") return { ...base, status: "unknown", reason: `killed: resident memory above the limit of ${limits.memoryLimit} MB` };
  if (o.killed === "abort") return { ...base, status: "unknown", reason: "interrupted" };
  if (/heap out of memory|Reached heap limit|Allocation failed/i.test(o.stderr)) return { ...base, status: "unknown", reason: `memory limit: JavaScript heap exhausted (limit ${limits.memoryLimit} MB)` };
  if (json && typeof json.status === "string" && STATUSES.includes(json.status) && (o.exitCode === 0 || o.exitCode === 1 || o.exitCode === 3)) {
    const status = json.status as RunStatus;
    const stop = typeof json.stopReason === "string" ? json.stopReason : typeof json.reason === "string" ? json.reason : null;
    const reason = o.exitCode === 3 || status === "unknown" ? `limit reached${stop ? ` (${stop})` : ""}` : null;
    return { ...base, status, reason };
  }
  if (json && typeof json.error === "string") return { ...base, status: "error", reason: `exit ${o.exitCode}: ${json.error}` };
  const why = o.signal ? `killed by ${o.signal}` : `exit ${o.exitCode}`;
  return { ...base, status: "error", reason: `${why}${lastLine(o.stderr) ? `: ${lastLine(o.stderr)}` : ""}` };
}

/** A timeline for commands that report bounds only at the end (A*): one point at the finish. */
export function finalPoint(p: ParsedOutcome, seconds: number): TimelinePoint[] {
  if (p.timeline.length) return p.timeline;
  const upper = p.status === "optimal" || p.status === "feasible" ? p.cost : null;
  const lower = p.status === "optimal" ? (p.lowerBound ?? p.cost) : p.lowerBound;
  if (upper === null && lower === null) return [];
  return [{ seconds, upper, lower }];
}
