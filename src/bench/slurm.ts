// Scale-out: a suite exported as a self-contained folder for a cluster job array (an sbatch
// script, a task list with one run per line, copies of every input), the command one array
// task runs, and the merge of the per-task result files back into one bench directory.
import { copyFileSync, existsSync, mkdirSync, readdirSync, readFileSync } from "node:fs";
import { dirname, join, relative, resolve } from "node:path";
import type { BenchMeta, RunRecord } from "../report/record.js";
import { writeBenchReport, type WrittenReport } from "../report/write-bench.js";
import { PlumblineError } from "../util/errors.js";
import { writeFileAtomic } from "../util/files.js";
import { benchMeta, defaultGrace, planBench, type BenchOptions } from "./bench.js";
import { configRegistry, type Configuration } from "./configs.js";
import { parseJsonSource } from "./json-source.js";
import { readResults, writeResults } from "./results.js";
import { executeRun, runId, safePath } from "./run-one.js";

/** One line of tasks.jsonl: a run's identity and limits; file paths relative to the export folder. */
export type TaskLine = Pick<RunRecord, "id" | "instance" | "domain" | "configuration" | "domainFile" | "problemFile" | "timeLimit" | "memoryLimit"> & { index: number };

export const TASKS_FILE = "tasks.jsonl";
export const SCRIPT_FILE = "bench.sbatch";

export interface ExportResult {
  dir: string;
  tasks: number;
  script: string;
  taskList: string;
}

/** Writes DIR/tasks.jsonl, DIR/bench.sbatch, DIR/bench.json and DIR/instances/ (copies). */
export function exportSlurm(opts: Omit<BenchOptions, "outDir">, dir: string): ExportResult {
  const out = resolve(dir);
  mkdirSync(join(out, "instances"), { recursive: true });
  mkdirSync(join(out, "logs"), { recursive: true });
  mkdirSync(join(out, "results"), { recursive: true });
  const plan = planBench(opts, join(out, "instances"));
  const copied = new Map<string, string>();
  const localCopy = (file: string, instance: string, as: string): string => {
    const abs = resolve(file);
    if (abs.startsWith(out + "/")) return relative(out, abs); // generated into the export already
    const key = `${abs}\u0000${instance}`;
    const known = copied.get(key);
    if (known) return known;
    const target = join(out, "instances", safePath(instance), as);
    mkdirSync(dirname(target), { recursive: true });
    copyFileSync(abs, target);
    copied.set(key, relative(out, target));
    return relative(out, target);
  };
  const tasks: TaskLine[] = plan.runs.map((r, index) => ({
    index,
    id: runId(r),
    instance: r.instance,
    domain: r.domain,
    configuration: r.configuration,
    domainFile: localCopy(r.domainFile, r.instance, "domain.pddl"),
    problemFile: localCopy(r.problemFile, r.instance, "problem.pddl"),
    timeLimit: plan.timeLimit,
    memoryLimit: plan.memoryLimit,
  }));
  const jobs = Math.max(0, Math.floor(opts.jobs ?? 0));
  writeFileAtomic(join(out, TASKS_FILE), tasks.map((t) => JSON.stringify(t) + "\n").join(""));
  writeFileAtomic(join(out, "bench.json"), JSON.stringify({ ...benchMeta(plan, jobs || 1), host: "cluster (job array)" }, null, 2) + "\n");
  const script = join(out, SCRIPT_FILE);
  writeFileAtomic(script, sbatchScript(plan.suite.name, tasks.length, plan.timeLimit, plan.memoryLimit, jobs, plan.configurations.some((c) => plan.registry.get(c)?.audits === true)));
  return { dir: out, tasks: tasks.length, script, taskList: join(out, TASKS_FILE) };
}

/** HH:MM:SS for sbatch --time. */
function slurmTime(seconds: number): string {
  const s = Math.ceil(seconds);
  return `${String(Math.floor(s / 3600)).padStart(2, "0")}:${String(Math.floor((s % 3600) / 60)).padStart(2, "0")}:${String(s % 60).padStart(2, "0")}`;
}

export function sbatchScript(suite: string, tasks: number, timeLimit: number, memoryLimit: number, throttle: number, audits: boolean): string {
  // a run may take its limit twice (the run, then the audit of its certificate) plus grace
  const wall = (audits ? 2 : 1) * (timeLimit + defaultGrace(timeLimit)) + 60;
  const mem = Math.ceil(memoryLimit + 512);
  return `#!/bin/bash
# plumbline benchmark "${suite}" as a job array: ${tasks} runs, one run per array task.
# Submit from this folder:      sbatch ${SCRIPT_FILE}
# Then, when every task ended:  plumbline bench --merge .
# Each task writes results/task-<index>.jsonl; its run's files go under runs/.
# Set PLUMBLINE to the command that starts plumbline on the cluster nodes, e.g.
#   export PLUMBLINE="node /path/to/plumbline/dist/cli/main.js"   (sbatch passes the environment on)
#SBATCH --job-name=plumbline-${suite.replace(/[^A-Za-z0-9_.-]/g, "_")}
#SBATCH --array=0-${Math.max(0, tasks - 1)}${throttle > 0 ? `%${throttle}` : ""}
#SBATCH --ntasks=1
#SBATCH --cpus-per-task=1
#SBATCH --time=${slurmTime(wall)}
#SBATCH --mem=${mem}M
#SBATCH --output=logs/task-%a.out
#SBATCH --error=logs/task-%a.err
set -euo pipefail
cd "\${PLUMBLINE_BENCH_DIR:-\${SLURM_SUBMIT_DIR:-.}}"
PLUMBLINE="\${PLUMBLINE:-plumbline}"
\$PLUMBLINE bench --run-task ${TASKS_FILE} --index "\${SLURM_ARRAY_TASK_ID:?run this script through sbatch --array, or set SLURM_ARRAY_TASK_ID}" --quiet
`;
}

/** Reads a task list, checking every line. */
export function readTasks(file: string): TaskLine[] {
  if (!existsSync(file)) throw new PlumblineError("io", `cannot read task list ${file}: no such file`);
  const lines = readFileSync(file, "utf8").split("\n");
  const tasks: TaskLine[] = [];
  lines.forEach((line, i) => {
    if (!line.trim()) return;
    const v = parseJsonSource(line, `${file}:${i + 1}`).value as unknown as TaskLine;
    if (!v || typeof v !== "object" || typeof v.instance !== "string" || typeof v.configuration !== "string" || typeof v.problemFile !== "string" || typeof v.domainFile !== "string" || typeof v.timeLimit !== "number" || typeof v.memoryLimit !== "number") {
      throw new PlumblineError("parse", "expected a task object with instance, domain, configuration, domainFile, problemFile, timeLimit, memoryLimit", { file, line: i + 1, col: 1 });
    }
    tasks.push({ ...v, index: tasks.length });
  });
  return tasks;
}

export const taskResultFile = (dir: string, index: number) => join(dir, "results", `task-${index}.jsonl`);

export interface TaskRunOptions {
  graceSeconds?: number;
  cli?: string[];
  extraConfigs?: Configuration[];
  signal?: AbortSignal;
}

/** Runs task `index` of a task list; its record goes to results/task-<index>.jsonl beside the list. */
export async function runTask(listFile: string, index: number, opts: TaskRunOptions = {}): Promise<RunRecord> {
  const tasks = readTasks(listFile);
  if (!Number.isInteger(index) || index < 0 || index >= tasks.length) throw new PlumblineError("usage", `task index ${index} is out of range: ${listFile} has tasks 0..${tasks.length - 1}`);
  const t = tasks[index];
  const dir = dirname(resolve(listFile));
  const config = configRegistry(opts.extraConfigs).get(t.configuration);
  if (!config) throw new PlumblineError("semantic", `${listFile}:${index + 1}: unknown configuration "${t.configuration}"`);
  const rec = await executeRun(
    { instance: t.instance, domain: t.domain, configuration: t.configuration, domainFile: resolve(dir, t.domainFile), problemFile: resolve(dir, t.problemFile) },
    config,
    { outDir: dir, timeLimit: t.timeLimit, memoryLimit: t.memoryLimit, graceSeconds: opts.graceSeconds ?? defaultGrace(t.timeLimit), cli: opts.cli, signal: opts.signal },
  );
  // paths as in the task list, so merged results do not depend on where the cluster mounted the folder
  const portable: RunRecord = { ...rec, domainFile: t.domainFile, problemFile: t.problemFile };
  if (opts.signal?.aborted) return portable;
  mkdirSync(join(dir, "results"), { recursive: true });
  writeResults(taskResultFile(dir, index), [portable]);
  return portable;
}

export interface MergeResult extends WrittenReport {
  dir: string;
  records: RunRecord[];
  /** Task indexes with no result file yet. */
  missing: number[];
}

/** Merges DIR/results/task-*.jsonl into DIR/results.jsonl (task order) and writes the report. */
export function mergeTasks(dir: string): MergeResult {
  const out = resolve(dir);
  const tasks = readTasks(join(out, TASKS_FILE));
  const records: RunRecord[] = [];
  const missing: number[] = [];
  const resultsDir = join(out, "results");
  const present = new Set(existsSync(resultsDir) ? readdirSync(resultsDir) : []);
  for (const t of tasks) {
    const name = `task-${t.index}.jsonl`;
    if (!present.has(name)) {
      missing.push(t.index);
      continue;
    }
    const recs = readResults(join(resultsDir, name));
    const rec = recs.find((r) => r.id === t.id);
    if (!rec) throw new PlumblineError("parse", `${join(resultsDir, name)}: holds no result for task ${t.index} (${t.id})`);
    records.push(rec);
  }
  writeResults(join(out, "results.jsonl"), records);
  const metaFile = join(out, "bench.json");
  const meta: BenchMeta = existsSync(metaFile)
    ? (JSON.parse(readFileSync(metaFile, "utf8")) as BenchMeta)
    : { suite: "merged", suiteFile: TASKS_FILE, configurations: [...new Set(tasks.map((t) => t.configuration))], timeLimit: tasks[0]?.timeLimit ?? 0, memoryLimit: tasks[0]?.memoryLimit ?? 0, jobs: 0, createdAt: new Date().toISOString(), toolVersion: "", node: "", host: "", cpus: 0, runs: tasks.length };
  return { ...writeBenchReport(out, records, meta), dir: out, records, missing };
}
