// `plumbline replay DOMAIN PROBLEM PLAN`: validates a plan on the lifted model and says where
// it fails; exit 0 valid, 1 invalid, 2 bad input. Wiring only, the work is in src/plan.
import type { Command } from "commander";
import { loadModel } from "../../pddl/index.js";
import { parsePlan, replayPlan } from "../../plan/index.js";
import { readText } from "../../util/files.js";
import { withCommonOptions, type CliContext } from "../context.js";
import { deadlineFrom } from "../options.js";

export function registerReplay(program: Command, ctx: CliContext): void {
  withCommonOptions(
    program
      .command("replay")
      .description("replay a plan on the lifted model: is it valid, what does it cost, and where does it fail")
      .argument("<domain>", "PDDL domain file")
      .argument("<problem>", "PDDL problem file")
      .argument("<plan>", "plan file: one (action object …) per line, ';' comments")
      .option("--trace", "also list every action with its cost")
      .option("--time-limit <seconds>", "stop after this many seconds (exit 3)"),
  ).action((domain: string, problem: string, planPath: string, opts: { json?: boolean; quiet?: boolean; verbose?: boolean; trace?: boolean; timeLimit?: string }) => {
    ctx.configure(opts);
    deadlineFrom(opts.timeLimit);
    const model = loadModel(domain, problem);
    const steps = parsePlan(readText(planPath), planPath);
    const r = replayPlan(model, steps, planPath, { trace: !!opts.trace });
    ctx.exitCode = r.valid ? 0 : 1;
    ctx.result({ ...r, domain: model.domain.name, problem: model.problem.name, plan: planPath, costModel: model.domain.hasActionCosts ? "action-costs" : "unit" });
    const lines: string[] = [];
    if (opts.trace && r.trace) for (const t of r.trace) lines.push(`${String(t.step).padStart(4)}  ${t.action}  cost ${t.cost}`);
    if (r.valid) {
      lines.push(`plan valid: ${r.length} action${r.length === 1 ? "" : "s"}, cost ${r.cost}`);
      lines.push("(valid for the model as written: a plan is only as good as the model)");
    } else {
      lines.push("plan invalid");
      lines.push(`  ${r.error!.message}`);
      lines.push(`  ${r.length} actions in the plan; the actions before the failure cost ${r.cost}`);
    }
    ctx.out(lines.join("\n"));
  });
}
