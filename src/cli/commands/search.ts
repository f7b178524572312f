// `plumbline search DOMAIN PROBLEM`: the built-in explicit-state planner (A* for optimal
// plans, GBFS for quick first plans). Wiring only; the work is in src/search.
import { Option, type Command } from "commander";
import { costModelNote, groundFiles } from "../../ground/index.js";
import { planFileText } from "../../plan/index.js";
import { astar, gbfs, limitStop, planNames, planSteps, type HeuristicName, type SearchResult } from "../../search/index.js";
import { PlumblineError } from "../../util/errors.js";
import { writeFileAtomic } from "../../util/files.js";
import { deadlineFrom } from "../options.js";
import { checkOutputs } from "../output-paths.js";
import { withCommonOptions, type CliContext } from "../context.js";

interface SearchCliOptions {
  json?: boolean;
  quiet?: boolean;
  verbose?: boolean;
  heuristic?: HeuristicName;
  greedy?: boolean;
  timeLimit?: string;
  plan?: string;
}

export function peakMemoryBytes(): number {
  return process.resourceUsage().maxRSS * 1024;
}

const mb = (bytes: number) => `${(bytes / 1048576).toFixed(1)} MB`;

export function registerSearch(program: Command, ctx: CliContext): void {
  withCommonOptions(
    program
      .command("search")
      .description(
        "find a plan by explicit-state search: A* (optimal, proven by exhaustive-search) by default, or greedy best-first (--greedy) for a quick first plan.",
      )
      .argument("<domain>", "PDDL domain file")
      .argument("<problem>", "PDDL problem file")
      .addOption(
        new Option("--heuristic <name>", "A*: landmark-cut (default), max (h-max) or blind; with --greedy also ff (default) or add").choices([
          "landmark-cut",
          "max",
          "blind",
          "ff",
          "add",
        ]),
      )
      .option("--greedy", "greedy best-first search with h-FF: a plan quickly, not necessarily the cheapest")
      .option("--time-limit <seconds>", "give up after this many seconds (status unknown, exit 3)")
      .option("--plan <file>", "write the plan found to this file (one action per line)"),
  ).action((domain: string, problem: string, opts: SearchCliOptions) => {
    ctx.configure(opts);
    const deadline = deadlineFrom(opts.timeLimit);
    const greedy = !!opts.greedy;
    const heuristic: HeuristicName = opts.heuristic ?? (greedy ? "ff" : "landmark-cut");
    if (!greedy && (heuristic === "ff" || heuristic === "add")) {
      throw new PlumblineError("usage", `--heuristic ${heuristic} is not admissible: use it with --greedy, or choose landmark-cut, max or blind for A*`);
    }
    checkOutputs([opts.plan !== undefined ? { flag: "--plan", path: opts.plan, kind: "file" } : null], [domain, problem]);
    let grounded;
    try {
      grounded = groundFiles(domain, problem);
    } catch (e) {
      // a limit reached while reading or grounding: the same result shape, no plan
      const stopReason = limitStop(e);
      ctx.exitCode = 3;
      ctx.result({ status: "unknown", algorithm: greedy ? "gbfs" : "astar", heuristic, cost: null, length: null, plan: null, lowerBound: null, stopReason, planFile: null });
      ctx.out(`status     unknown (${stopReason} limit reached while reading and grounding)`);
      return;
    }
    const { model, task, seconds: groundSeconds } = grounded;
    const costNote = costModelNote(model);
    if (costNote) ctx.note(`note: ${costNote}`);
    ctx.note(`grounded ${task.facts.length} facts, ${task.actions.length} actions in ${groundSeconds.toFixed(2)} s; searching (${greedy ? "greedy best-first" : "A*"}, ${heuristic})`);
    const limits = { deadline, signal: ctx.signal };
    const r: SearchResult = greedy
      ? gbfs(task, { ...limits, heuristic })
      : astar(task, { ...limits, heuristic: heuristic as "landmark-cut" | "max" | "blind" });
    const status = r.status === "solved" ? (greedy ? "feasible" : "optimal") : r.status === "unsolvable" ? "unsolvable" : "unknown";
    ctx.exitCode = status === "unknown" ? 3 : 0; // a plan or proven unsolvability is an answer (README: exit codes)
    const names = r.plan ? planNames(task, r.plan) : null;
    if (r.plan && opts.plan) {
      const proof = greedy ? null : "exhaustive-search";
      writeFileAtomic(opts.plan, planFileText(planSteps(task, r.plan), { cost: r.cost!, status: greedy ? "feasible" : "optimal", proof, costModel: task.costModel, notes: [`found by ${greedy ? "greedy best-first search" : "A*"} with ${heuristic}`] }));
    }
    const peak = peakMemoryBytes();
    ctx.result({
      status,
      algorithm: greedy ? "gbfs" : "astar",
      heuristic,
      domain: model.domain.name,
      problem: model.problem.name,
      cost: r.cost,
      length: names ? names.length : null,
      plan: names,
      lowerBound: greedy ? null : Number.isFinite(r.lowerBound ?? NaN) ? r.lowerBound : null,
      expanded: r.expanded,
      generated: r.generated,
      states: r.states,
      seconds: r.seconds,
      groundSeconds,
      peakMemoryBytes: peak,
      searchBytes: r.searchBytes,
      stopReason: r.stopReason ?? null,
      planFile: r.plan && opts.plan ? opts.plan : null,
    });
    const lines: string[] = [];
    lines.push(`status     ${status}${r.stopReason ? ` (${r.stopReason} limit reached)` : ""}`);
    if (names) {
      lines.push(`cost       ${r.cost}${greedy ? " (not proven optimal)" : " (optimal by exhaustive A*)"}`);
      lines.push(`length     ${names.length}`);
    } else if (status === "unknown" && !greedy) {
      lines.push(`lower bound ${r.lowerBound} (no plan is cheaper)`);
    }
    lines.push(`expanded   ${r.expanded}   generated ${r.generated}   states ${r.states}`);
    lines.push(`time       ${r.seconds.toFixed(2)} s search, ${groundSeconds.toFixed(2)} s grounding   peak memory ${mb(peak)}`);
    if (names) {
      lines.push("plan:");
      names.forEach((n, i) => lines.push(`  ${String(i + 1).padStart(4)}  ${n}`));
      if (opts.plan) lines.push(`plan written to ${opts.plan}`);
      lines.push("(a plan is only as good as the model: check the model before acting on it)");
    }
    ctx.out(lines.join("\n"));
  });
}
