// `plumbline measure DOMAIN PROBLEM`: exact measures of a small task's reachable state graph
// (diameters, optimal cost and length). Wiring only; the work is in src/measure.
import type { Command } from "commander";
import { groundFiles } from "../../ground/index.js";
import { DEFAULT_MAX_STATES, measureTask, type Measure } from "../../measure/index.js";
import { deadlineFrom, positiveOption } from "../options.js";
import { withCommonOptions, type CliContext } from "../context.js";

interface MeasureCliOptions {
  json?: boolean;
  quiet?: boolean;
  verbose?: boolean;
  maxReachableStates?: string;
  maxPaths?: string;
  timeLimit?: string;
}

function show(m: Measure): string {
  if (m.exact) return String(m.value);
  return `between ${m.lower} and ${m.upper ?? "?"} (bound only: ${m.note ?? "search capped"})`;
}

export function registerMeasure(program: Command, ctx: CliContext): void {
  withCommonOptions(
    program
      .command("measure")
      .description(
        "exact measures of the reachable state graph of a small task: diameter, subset, sublist, recurrence and traversal diameters, optimal cost and the shortest optimal plan length.",
      )
      .argument("<domain>", "PDDL domain file")
      .argument("<problem>", "PDDL problem file")
      .option("--max-reachable-states <n>", `largest reachable state space to explore (default ${DEFAULT_MAX_STATES})`)
      .option("--max-paths <n>", "partial paths each exhaustive search (recurrence, sublist and subset diameters) may try; past it, bounds are reported (default 2000000)")
      .option("--time-limit <seconds>", "stop after this many seconds (exit 3)"),
  ).action((domain: string, problem: string, opts: MeasureCliOptions) => {
    ctx.configure(opts);
    const maxStates = positiveOption("--max-reachable-states", opts.maxReachableStates, DEFAULT_MAX_STATES);
    const maxSearch = positiveOption("--max-paths", opts.maxPaths, 2_000_000);
    deadlineFrom(opts.timeLimit);
    const { task, seconds } = groundFiles(domain, problem);
    ctx.note(`grounded ${task.facts.length} facts, ${task.actions.length} actions in ${seconds.toFixed(2)} s; exploring up to ${maxStates} states`);
    const r = measureTask(task, { maxStates, maxPathNodes: maxSearch, sublist: { maxNodes: maxSearch } });
    ctx.result({ domain: task.domainName, problem: task.problemName, maxStates, ...r });
    const rows: Array<[string, string]> = [
      ["reachable states", String(r.states)],
      ["transitions", String(r.edges)],
      ["goal states", String(r.goalStates)],
      ["diameter", show(r.diameter)],
      ["subset diameter", show(r.subsetDiameter)],
      ["sublist diameter", show(r.sublistDiameter)],
      ["recurrence diameter", show(r.recurrenceDiameter)],
      ["traversal diameter", show(r.traversalDiameter)],
      ["optimal cost", r.optimal.cost === null ? "unsolvable" : String(r.optimal.cost)],
      ["shortest optimal plan", r.optimal.length === null ? "-" : `${r.optimal.length} actions`],
    ];
    const w = Math.max(...rows.map((x) => x[0].length));
    ctx.out(rows.map(([k, v]) => `${k.padEnd(w)}  ${v}`).join("\n"));
    if (r.diameter.symmetries.length > 0) ctx.note(`diameter: ${r.diameter.bfsRuns} BFS runs, one per orbit of ${r.diameter.symmetries.length} verified symmetries`);
  });
}
