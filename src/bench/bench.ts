// `plumbline bench SUITE`: loads the suite, generates scenario instances, runs every
// (instance, configuration) pair not finished before, N at a time, and writes the report.
import { availableParallelism, cpus, hostname } from "node:os";
import { existsSync, mkdirSync, readFileSync } from "node:fs";
import { join, resolve } from "node:path";
import type { BenchMeta, RunRecord } from "../report/record.js";
import { writeBenchReport, type WrittenReport } from "../report/write-bench.js";
import { PlumblineError } from "../util/errors.js";
import { writeFileAtomic } from "../util/files.js";
import { VERSION } from "../util/version.js";
import { configRegistry, DEFAULT_CONFIGURATIONS, type Configuration, type ConfigRegistry } from "./configs.js";
import { materialiseGenerated } from "./generate.js";
import { runPool } from "./pool.js";
import type { ProgressSink } from "./progress.js";
import { latestById, readResults } from "./results.js";
import { runId, type RunSpec } from "./run-one.js";
import { loadSuite, type Suite } from "./suite.js";

export const DEFAULT_TIME_LIMIT = 60;
export const DEFAULT_MEMORY_LIMIT = 2048;

export interface BenchOptions {
  suite: string;
  outDir: string;
  jobs?: number;
  timeLimit?: number;
  memoryLimit?: number;
  /** Configurations to run instead of the suite's defaults (entries naming their own are filtered). */
  configs?: string[];
  /** Extra configurations (tests add quick fake ones). */
  extraConfigs?: Configuration[];
  graceSeconds?: number;
  cli?: string[];
  progress?: ProgressSink | null;
  signal?: AbortSignal;
}

export interface PlannedBench {
  suite: Suite;
  registry: ConfigRegistry;
  runs: RunSpec[];
  timeLimit: number;
  memoryLimit: number;
  configurations: string[];
}

/** Suite + options → the list of runs (generator instances written under `instancesDir`). */
export function planBench(opts: Omit<BenchOptions, "outDir">, instancesDir: string): PlannedBench {
  const registry = configRegistry(opts.extraConfigs);
  const known = [...registry.keys()];
  for (const c of opts.configs ?? []) if (!registry.has(c)) throw new PlumblineError("usage", `unknown configuration "${c}" (known: ${known.join(", ")})`);
  const suite = loadSuite(opts.suite, known);
  const timeLimit = opts.timeLimit ?? suite.timeLimit ?? DEFAULT_TIME_LIMIT;
  const memoryLimit = opts.memoryLimit ?? suite.memoryLimit ?? DEFAULT_MEMORY_LIMIT;
  materialiseGenerated(suite.instances, instancesDir);
  const runs: RunSpec[] = [];
  for (const inst of suite.instances) {
    // an entry's own configurations are filtered by --config; the suite's are only defaults
    const own = inst.configurations;
    const chosen = opts.configs?.length ? (own ? own.filter((c) => opts.configs!.includes(c)) : opts.configs) : (own ?? suite.configurations ?? DEFAULT_CONFIGURATIONS);
    for (const configuration of chosen) runs.push({ instance: inst.instance, domain: inst.domain, domainFile: inst.domainFile, problemFile: inst.problemFile, configuration });
  }
  if (runs.length === 0) throw new PlumblineError("usage", `${opts.suite}: no runs left after selecting configurations ${opts.configs?.join(", ")}`);
  const configurations = [...new Set(runs.map((r) => r.configuration))];
  return { suite, registry, runs, timeLimit, memoryLimit, configurations };
}

export interface BenchResult extends WrittenReport {
  outDir: string;
  records: RunRecord[];
  ran: number;
  skipped: number;
  interrupted: boolean;
  warnings: string[];
}

export function benchMeta(p: PlannedBench, jobs: number): BenchMeta {
  return {
    suite: p.suite.name,
    suiteFile: p.suite.file,
    configurations: p.configurations,
    timeLimit: p.timeLimit,
    memoryLimit: p.memoryLimit,
    jobs,
    createdAt: new Date().toISOString(),
    toolVersion: VERSION,
    node: process.version,
    host: hostname(),
    cpus: cpus().length,
    runs: p.runs.length,
  };
}

export async function runBench(opts: BenchOptions): Promise<BenchResult> {
  const outDir = resolve(opts.outDir);
  mkdirSync(outDir, { recursive: true });
  const plan = planBench(opts, join(outDir, "instances"));
  const jobs = Math.max(1, Math.floor(opts.jobs ?? 1));
  const resultsFile = join(outDir, "results.jsonl");
  const before = latestById(readResults(resultsFile, true));
  const doneIds = new Set(before.map((r) => r.id));
  const todo = plan.runs.filter((r) => !doneIds.has(runId(r)));
  const metaFile = join(outDir, "bench.json");
  const meta: BenchMeta = existsSync(metaFile) ? { ...(JSON.parse(readFileSync(metaFile, "utf8")) as BenchMeta), runs: plan.runs.length, configurations: plan.configurations } : benchMeta(plan, jobs);
  writeFileAtomic(metaFile, JSON.stringify(meta, null, 2) + "\n");
  const fresh = await runPool(todo, plan.registry, {
    jobs,
    resultsFile,
    progress: opts.progress ?? null,
    skipped: plan.runs.length - todo.length,
    outDir,
    timeLimit: plan.timeLimit,
    memoryLimit: plan.memoryLimit,
    // a fair share of the cores: solve's A* helper takes turns with its SAT queries on one core
    threads: Math.max(1, Math.floor(availableParallelism() / jobs)),
    graceSeconds: opts.graceSeconds ?? defaultGrace(plan.timeLimit),
    cli: opts.cli,
    signal: opts.signal,
  });
  const wanted = new Set(plan.runs.map(runId));
  const records = latestById(readResults(resultsFile)).filter((r) => wanted.has(r.id));
  const written = writeBenchReport(outDir, records, meta);
  return { ...written, outDir, records, ran: fresh.length, skipped: plan.runs.length - todo.length, interrupted: !!opts.signal?.aborted, warnings: plan.suite.warnings };
}

/** Seconds a child may overrun its own time limit before it is killed (start-up, writing out). */
export function defaultGrace(timeLimit: number): number {
  return Math.min(30, Math.max(3, timeLimit * 0.1));
}
