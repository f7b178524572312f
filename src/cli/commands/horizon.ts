// `plumbline horizon DOMAIN PROBLEM`: completeness thresholds by every method with their
// derivations, and the winner. Wiring only; the work is in src/horizon (and src/search for C).
import type { Command } from "commander";
import { groundFiles } from "../../ground/index.js";
import { checkUpperCost, computeHorizon, horizonReportJson, HORIZON_DEFAULTS, type HorizonReport, type MethodResult } from "../../horizon/index.js";
import { gbfs } from "../../search/index.js";
import { PlumblineError } from "../../util/errors.js";
import { withCommonOptions, type CliContext } from "../context.js";
import { capOption, deadlineFrom, positiveOption } from "../options.js";

interface HorizonCliOptions {
  json?: boolean;
  quiet?: boolean;
  verbose?: boolean;
  costBelow?: string;
  timeLimit?: string;
  relevance?: boolean;
  maxProjectionStates?: string;
  maxReachableStates?: string;
  maxOptimalStates?: string;
}

export function registerHorizon(program: Command, ctx: CliContext): void {
  withCommonOptions(
    program
      .command("horizon")
      .description(
        "completeness thresholds for 'is there a plan cheaper than C?': by every method, with the numbers each was derived from, and the smallest as the horizon. " +
          "Without --cost-below, C is the cost of a first plan found by greedy best-first search.",
      )
      .argument("<domain>", "PDDL domain file")
      .argument("<problem>", "PDDL problem file")
      .option("--cost-below <C>", "bound plans cheaper than C, e.g. the cost of a known plan (a whole number; 'inf' bounds plan existence)")
      .option("--time-limit <seconds>", "stop after this many seconds (exit 3); the first-plan search, when --cost-below is not given, gets at most half of it")
      .option("--no-relevance", "do not prune actions and facts irrelevant to the goal before bounding")
      .option("--max-projection-states <n>", `states explored per projection before using domain sizes (default ${HORIZON_DEFAULTS.maxProjectionStates})`)
      .option("--max-reachable-states <n>", `reachable states the reachable-states method may explore; 0 turns that method off (default ${HORIZON_DEFAULTS.maxExplicitStates})`)
      .option(
        "--max-optimal-states <n>",
        `states the exact search for the fewest actions among cheapest plans may store; 0 turns that method off (default ${HORIZON_DEFAULTS.maxOptimalStates})`,
      ),
  ).action((domain: string, problem: string, opts: HorizonCliOptions) => {
    ctx.configure(opts);
    const maxProjectionStates = positiveOption("--max-projection-states", opts.maxProjectionStates, HORIZON_DEFAULTS.maxProjectionStates);
    const maxExplicitStates = capOption("--max-reachable-states", opts.maxReachableStates, HORIZON_DEFAULTS.maxExplicitStates);
    const maxOptimalStates = capOption("--max-optimal-states", opts.maxOptimalStates, HORIZON_DEFAULTS.maxOptimalStates);
    let upper: number | null = null;
    if (opts.costBelow !== undefined) {
      upper = /^(inf|infinity)$/i.test(opts.costBelow) ? Number.POSITIVE_INFINITY : Number(opts.costBelow);
      if (!(upper === Number.POSITIVE_INFINITY || /^\d+$/.test(opts.costBelow)))
        throw new PlumblineError("usage", `--cost-below expects a non-negative whole number or 'inf', found '${opts.costBelow}'`);
      checkUpperCost(upper);
    }
    const deadline = deadlineFrom(opts.timeLimit);
    const { task, seconds } = groundFiles(domain, problem);
    ctx.note(`grounded ${task.facts.length} facts, ${task.actions.length} actions in ${seconds.toFixed(2)} s`);
    let source = "--cost-below";
    let firstPlan: { status: string; cost: number | null; length: number | null } | null = null;
    if (upper === null) {
      const r = gbfs(task, { deadline: deadline === undefined ? undefined : Date.now() + (deadline - Date.now()) / 2, signal: ctx.signal });
      firstPlan = { status: r.status, cost: r.cost, length: r.plan ? r.plan.length : null };
      if (r.status === "solved") {
        upper = r.cost!;
        source = "first plan (greedy best-first search)";
      } else {
        upper = Number.POSITIVE_INFINITY;
        source = r.status === "unsolvable" ? "no plan exists (search space exhausted): bounding plan existence" : "no plan found within the limits: bounding plan existence";
      }
      ctx.note(`upper cost C = ${upper} from ${source}`);
    }
    const report = computeHorizon(task, upper, { relevance: opts.relevance !== false, maxProjectionStates, maxExplicitStates, maxOptimalStates });
    ctx.result({ domain: task.domainName, problem: task.problemName, upperCostSource: source, firstPlan, ...horizonReportJson(report) });
    ctx.out(formatReport(report, source));
  });
}

function valueText(m: MethodResult): string {
  if (m.value === null) return "n/a";
  return m.valueText!.length > 24 ? `${m.valueText!.slice(0, 6)}…(${m.valueText!.length} digits)` : m.valueText!;
}

function why(m: MethodResult): string {
  const d = m.derivation;
  if (d.notApplicable) return `not applicable: ${d.notApplicable}`;
  if (d.note) return String(d.note);
  switch (m.method) {
    case "cost":
      return `floor((${d.C} - 1 - ${d.excessLowerBound}) / ${d.minCost}): at most that many actions, each costing at least ${d.minCost}, beyond the excess ${d.excessLowerBound} every plan pays`;
    case "zero-cost": {
      const layered = d.layered as { value?: unknown } | undefined;
      const explicit = d.explicit as { value?: unknown; l0?: unknown } | undefined;
      const viaL0 = explicit?.value !== undefined ? `, k + (k+1)·${explicit.l0} = ${explicit.value} (exact zero-cost distances)` : "";
      return `k = ${d.k} positive-cost actions + zero-cost actions per SCC = ${layered?.value}${viaL0}; ${d.zeroCostActions} zero-cost actions`;
    }
    case "optimal-length":
      return `fewest actions among plans of the optimal cost ${d.optimalCost} (exact search, ${d.statesStored} states stored)`;
    case "compositional": {
      const contributing = (d.contributing as unknown[]).length;
      return `${d.components} SCCs (${contributing} contribute), ${d.projectionsExplored} projections explored, ${d.projectionsAbandoned} abandoned`;
    }
    case "reachable-states":
      return `${d.reachableStates} reachable states - 1`;
    default:
      return String(d.formula ?? "");
  }
}

function formatReport(r: HorizonReport, source: string): string {
  const lines: string[] = [];
  lines.push(`upper cost C   ${Number.isFinite(r.upperCost) ? r.upperCost : "∞"} (${source})`);
  lines.push(`horizon        ${r.horizonText} steps (method: ${r.winner})`);
  lines.push("");
  const rows = r.methods.map((m) => [m.method, valueText(m), why(m)]);
  const w0 = Math.max(6, ...rows.map((x) => x[0].length));
  const w1 = Math.max(5, ...rows.map((x) => x[1].length));
  lines.push(`${"method".padEnd(w0)}  ${"value".padStart(w1)}  derivation`);
  for (const [a, b, c] of rows) lines.push(`${a.padEnd(w0)}  ${b.padStart(w1)}  ${c}`);
  const vars = r.analysis.variables as { count: number; multiValued: number };
  lines.push("");
  lines.push(`${vars.count} variables (${vars.multiValued} multi-valued) from h² mutex groups; full derivations with --json`);
  lines.push("Any plan cheaper than C has a counterpart of at most `horizon` actions that is no dearer.");
  return lines.join("\n");
}
