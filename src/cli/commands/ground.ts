// `plumbline ground DOMAIN PROBLEM`: grounds a model and prints its size (facts, actions,
// zero-cost actions, conditional effects, seconds); wiring only, the work is in src/ground.
import { Option, type Command } from "commander";
import { groundFiles, groundStats } from "../../ground/index.js";
import { withCommonOptions, type CliContext } from "../context.js";
import { deadlineFrom } from "../options.js";

export function registerGround(program: Command, ctx: CliContext): void {
  withCommonOptions(
    program
      .command("ground")
      .description("ground a PDDL model and print its size: facts, actions, zero-cost actions, conditional effects, seconds")
      .argument("<domain>", "PDDL domain file")
      .argument("<problem>", "PDDL problem file")
      .addOption(new Option("--relevance", "prune actions and facts that cannot matter for the goal (the default now)").hideHelp())
      .option("--no-relevance", "keep actions and facts that cannot matter for the goal (by default they are pruned, as solve does)")
      .option("--time-limit <seconds>", "stop after this many seconds (exit 3)"),
  ).action((domain: string, problem: string, opts: { json?: boolean; quiet?: boolean; verbose?: boolean; relevance?: boolean; timeLimit?: string }) => {
    ctx.configure(opts);
    deadlineFrom(opts.timeLimit);
    const relevance = opts.relevance !== false;
    const { task, seconds } = groundFiles(domain, problem, { relevance });
    const st = groundStats(task, Number(seconds.toFixed(3)));
    ctx.result({ ...st, domain: task.domainName, problem: task.problemName, costModel: task.costModel, relevance, goalFacts: task.goal.length + task.goalNeg.length });
    const rows: Array<[string, string]> = [
      ["domain", task.domainName],
      ["problem", task.problemName],
      ["cost model", task.costModel],
      ["facts", String(st.facts)],
      ["actions", String(st.actions)],
      ["zero-cost actions", String(st.zeroCostActions)],
      ["conditional effects", String(st.conditionalEffects)],
      ["seconds", seconds.toFixed(3)],
    ];
    const w = Math.max(...rows.map((r) => r[0].length));
    ctx.out(rows.map(([k, v]) => `${k.padEnd(w)}  ${v}`).join("\n"));
  });
}
