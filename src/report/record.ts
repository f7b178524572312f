// The result of one benchmark run (one line of results.jsonl): the shared shape that the
// bench runner writes and every table, chart and HTML page reads.

/** Outcome words: the CLI's status words plus "error" (the run crashed or was refused). */
export type RunStatus = "optimal" | "feasible" | "unsolvable" | "unknown" | "error";

/** Result of auditing the run's certificate: none when no certificate was made or checked. */
/** The audit's verdict words (README "Words plumbline uses"); "none": not audited. */
export type AuditStatus = "valid" | "rejected" | "unfinished" | "none";

/** Audit words of results written before this release ("invalid", "unknown") read as today's. */
export function auditStatusOf(word: string): AuditStatus {
  return word === "invalid" ? "rejected" : word === "unknown" ? "unfinished" : (word as AuditStatus);
}

/** One event of the anytime search: best plan cost so far and best proven lower bound. */
export interface TimelinePoint {
  seconds: number;
  upper: number | null;
  lower: number | null;
}

export interface RunRecord {
  /** Unique key of the run in its bench directory: `instance@configuration`. */
  id: string;
  instance: string;
  /** Group name used in the per-domain tables (scenario name or domain folder). */
  domain: string;
  configuration: string;
  domainFile: string;
  problemFile: string;
  status: RunStatus;
  /** Why the run stopped without an answer (limit, crash, ...); null when it answered. */
  reason: string | null;
  cost: number | null;
  lowerBound: number | null;
  horizon: number | null;
  planLength: number | null;
  /** Wall-clock seconds of the whole child process, measured by the runner. */
  seconds: number;
  /** Seconds the tool itself reported (null when it reported none). */
  toolSeconds: number | null;
  /** Peak resident memory in MB (the larger of what the runner saw and the tool reported). */
  memory: number | null;
  proofBytes: number | null;
  audit: AuditStatus;
  auditSeconds: number | null;
  auditReason: string | null;
  exitCode: number | null;
  timeLimit: number;
  memoryLimit: number;
  timeline: TimelinePoint[];
  startedAt: string;
  /** Folder of the run's files (stdout, stderr, plan, certificate), relative to the bench dir. */
  runDir: string;
}

/** What a bench directory records about the run as a whole (bench.json). */
export interface BenchMeta {
  suite: string;
  suiteFile: string;
  configurations: string[];
  timeLimit: number;
  memoryLimit: number;
  jobs: number;
  createdAt: string;
  toolVersion: string;
  node: string;
  host: string;
  cpus: number;
  runs: number;
}

export const RUN_STATUSES: readonly RunStatus[] = ["optimal", "feasible", "unsolvable", "unknown", "error"];
