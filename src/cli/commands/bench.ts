// `plumbline bench SUITE`: runs a benchmark suite in child processes and writes results.jsonl,
// tables, charts and an HTML report; also exports a suite as a cluster job array, runs one
// array task, and merges the tasks' results. Wiring only; the work is in src/bench.
import { existsSync } from "node:fs";
import { join, resolve } from "node:path";
import type { Command } from "commander";
import { CONFIGURATIONS, DEFAULT_MEMORY_LIMIT, DEFAULT_TIME_LIMIT, exportSlurm, mergeTasks, runBench, runTask } from "../../bench/index.js";
import { PlumblineError } from "../../util/errors.js";
import { positiveNumber } from "../options.js";
import { withCommonOptions, type CliContext } from "../context.js";
import { invocationName } from "../help.js";
import { checkOutputs } from "../output-paths.js";

interface BenchCliOptions {
  json?: boolean;
  quiet?: boolean;
  verbose?: boolean;
  jobs?: string;
  timeLimitPerRun?: string;
  memoryLimitPerRun?: string;
  config?: string[];
  outputDir?: string;
  export?: string[];
  merge?: string;
  runTask?: string;
  index?: string;
  grace?: string;
}

function stamp(): string {
  return new Date().toISOString().replace(/[-:]/g, "").replace("T", "-").slice(0, 15);
}

export function registerBench(program: Command, ctx: CliContext): void {
  withCommonOptions(
    program
      .command("bench")
      .description(
        "run a benchmark suite: every (instance, configuration) pair in its own process under time and memory limits, N at a time. " +
          "Writes results.jsonl (one JSON object per run), summary.txt, coverage.svg, tightness.svg and report.html to the output folder; " +
          "re-running with the same --output-dir skips finished runs. " +
          "SUITE is a suite JSON file, or a folder of PDDL: each folder holding domain.pddl contributes its other .pddl files, and domain-NN.pddl/problem-NN.pddl pairs also work. " +
          `Configurations: ${CONFIGURATIONS.map((c) => `${c.name} (${c.summary})`).join("; ")}.`,
      )
      .argument("[suite]", "suite JSON file or folder of PDDL files")
      .option("--jobs <n>", "runs at the same time (default 1; keep it at or below the number of cores for fair times)")
      .option("--time-limit-per-run <seconds>", `passed to each run and enforced by killing it a little later (default: the suite's, else ${DEFAULT_TIME_LIMIT})`)
      .option("--memory-limit-per-run <MB>", `resident memory of each run, enforced by a heap limit and by polling (default: the suite's, else ${DEFAULT_MEMORY_LIMIT})`)
      .option("--config <names...>", "configurations to run instead of the suite's (space- or comma-separated; entries that name their own keep only these; put SUITE before this option)")
      .option("--output-dir <dir>", "output folder (default bench-results/<suite>-<date>-<time>); give the same folder again to resume")
      .option("--export <kind-and-dir...>", "instead of running: '--export slurm DIR' writes a job-array script (bench.sbatch), a task list and input copies to DIR")
      .option("--merge <dir>", "merge the per-task result files of an exported folder into DIR/results.jsonl and write the report")
      .option("--run-task <list>", "run one task of an exported task list (what each array task does); result in results/task-INDEX.jsonl next to the list")
      .option("--index <n>", "with --run-task: the task index, counted from 0 (default: $SLURM_ARRAY_TASK_ID)")
      .option("--grace <seconds>", "extra seconds a run may overrun its time limit before it is killed (default 10% of the limit, 3 to 30)"),
  ).action(async (suite: string | undefined, opts: BenchCliOptions) => {
    ctx.configure(opts);
    const configs = opts.config?.flatMap((c) => c.split(",")).filter(Boolean);
    const common = {
      jobs: positiveNumber("--jobs", opts.jobs, true),
      timeLimit: positiveNumber("--time-limit-per-run", opts.timeLimitPerRun),
      memoryLimit: positiveNumber("--memory-limit-per-run", opts.memoryLimitPerRun),
      configs,
      graceSeconds: opts.grace === undefined ? undefined : positiveNumber("--grace", opts.grace),
      signal: ctx.signal,
    };
    const stderr = ctx.io.stderr as NodeJS.WritableStream & { isTTY?: boolean };
    const progress = ctx.quiet ? null : { write: (s: string) => void stderr.write(s), isTTY: !!stderr.isTTY && !ctx.json };
    const modes = [opts.merge !== undefined, opts.runTask !== undefined, opts.export !== undefined].filter(Boolean).length;
    if (modes > 1) throw new PlumblineError("usage", "use only one of --merge, --run-task and --export");

    if (opts.merge !== undefined) {
      const m = mergeTasks(opts.merge);
      ctx.exitCode = m.agreement.findings.length ? 1 : 0;
      if (m.missing.length) ctx.warn(`${m.missing.length} task(s) have no result yet: ${m.missing.slice(0, 20).join(", ")}${m.missing.length > 20 ? ", …" : ""}`);
      ctx.result({ dir: m.dir, runs: m.records.length, missing: m.missing, results: resolve(m.dir, "results.jsonl"), report: m.html, findings: m.agreement.findings });
      ctx.out(`${m.text}\n\nmerged ${m.records.length} task result(s)${m.missing.length ? `, ${m.missing.length} missing` : ""}\nreport: ${m.html}`);
      return;
    }
    if (opts.runTask !== undefined) {
      const raw = opts.index ?? process.env.SLURM_ARRAY_TASK_ID;
      if (raw === undefined || !/^\d+$/.test(raw)) throw new PlumblineError("usage", "--run-task needs --index N (or SLURM_ARRAY_TASK_ID in the environment)");
      const rec = await runTask(opts.runTask, Number(raw), { graceSeconds: common.graceSeconds, signal: ctx.signal });
      ctx.exitCode = ctx.signal.aborted ? 3 : 0;
      ctx.result(rec);
      ctx.out(`${rec.instance} · ${rec.configuration}: ${rec.status}${rec.cost !== null ? ` cost ${rec.cost}` : ""}${rec.reason ? ` (${rec.reason})` : ""}`);
      return;
    }
    if (suite === undefined) throw new PlumblineError("usage", "bench needs a SUITE (or --merge DIR, or --run-task LIST)");
    if (opts.export !== undefined) {
      const [kind, dir, ...rest] = opts.export;
      if (kind !== "slurm" || dir === undefined || rest.length) throw new PlumblineError("usage", `--export expects 'slurm DIR', found '${opts.export.join(" ")}'`);
      checkOutputs([{ flag: "--export slurm", path: dir, kind: "folder", reuseIf: (d) => existsSync(join(d, "tasks.jsonl")) }], [suite]);
      const e = exportSlurm({ suite, ...common }, dir);
      ctx.result({ dir: e.dir, tasks: e.tasks, script: e.script, taskList: e.taskList });
      ctx.out(`exported ${e.tasks} runs to ${e.dir}\n  task list  ${e.taskList}\n  script     ${e.script}\nsubmit with: cd ${e.dir} && sbatch bench.sbatch   then: ${invocationName()} bench --merge ${e.dir}`);
      return;
    }
    const outDir = opts.outputDir ?? `bench-results/${suite.replace(/\/+$/, "").split("/").pop()?.replace(/\.json$/i, "") ?? "suite"}-${stamp()}`;
    // an existing folder is resumed when it holds an earlier run of this command
    checkOutputs([{ flag: "--output-dir", path: outDir, kind: "folder", reuseIf: (d) => existsSync(join(d, "results.jsonl")) || existsSync(join(d, "bench.json")) }], [suite]);
    const r = await runBench({ suite, outDir, progress, ...common });
    for (const w of r.warnings) ctx.warn(w);
    ctx.exitCode = r.agreement.findings.length ? 1 : r.interrupted ? 3 : 0;
    ctx.result({ out: r.outDir, runs: r.records.length, ran: r.ran, skipped: r.skipped, interrupted: r.interrupted, results: resolve(r.outDir, "results.jsonl"), report: r.html, findings: r.agreement.findings });
    ctx.out(`${r.text}\n\n${r.ran} run(s) done now, ${r.skipped} from before${r.interrupted ? " (interrupted: re-run the same command to finish)" : ""}\nresults: ${resolve(r.outDir, "results.jsonl")}\nreport:  ${r.html}`);
  });
}
