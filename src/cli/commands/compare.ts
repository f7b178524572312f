// `plumbline compare DOMAIN PROBLEM PLAN`: validates another planner's plan and compares its
// cost with our proven optimum. Wiring only; the work is in src/search/compare.ts.
import type { Command } from "commander";
import { costModelNote, groundFiles } from "../../ground/index.js";
import { parsePlan } from "../../plan/index.js";
import { satProver } from "../../optimize/index.js";
import { comparePlan, sideBySide, type CompareResult } from "../../search/index.js";
import { readText } from "../../util/files.js";
import { withCommonOptions, type CliContext } from "../context.js";
import { deadlineFrom } from "../options.js";

const EXIT: Record<CompareResult["verdict"], number> = { optimal: 0, invalid: 1, suboptimal: 1, unknown: 3 };

function headline(r: CompareResult): string {
  const t = r.theirs;
  const o = r.ours;
  switch (r.verdict) {
    case "invalid":
      return `verdict: invalid — ${t.error!.message}`;
    case "optimal":
      return `verdict: optimal — cost ${t.cost} equals the proven optimum (optimal by ${o.method})`;
    case "suboptimal":
      return `verdict: suboptimal — cost ${t.cost} is ${r.excess} more than the optimum ${o.cost} (optimal by ${o.method})`;
    case "unknown":
      return `verdict: unknown — a limit was reached; the optimum lies between ${o.lowerBound} and ${o.upperBound} (this plan costs ${t.cost})`;
  }
}

export function registerCompare(program: Command, ctx: CliContext): void {
  withCommonOptions(
    program
      .command("compare")
      .description(
        "check another planner's plan: invalid (where it fails), optimal, suboptimal (by how much, with an optimal plan beside it) " +
          "or unknown (a limit was reached first; the bounds on the optimum are shown).",
      )
      .argument("<domain>", "PDDL domain file")
      .argument("<problem>", "PDDL problem file")
      .argument("<plan>", "the plan to judge: one (action object …) per line, ';' comments")
      .option("--time-limit <seconds>", "stop after this many seconds (verdict unknown, exit 3)"),
  ).action(async (domain: string, problem: string, planPath: string, opts: { json?: boolean; quiet?: boolean; verbose?: boolean; timeLimit?: string }) => {
    ctx.configure(opts);
    // the limit is the whole command's: reading and grounding the model spend it too
    const deadline = deadlineFrom(opts.timeLimit);
    const steps = parsePlan(readText(planPath), planPath);
    const { model, task } = groundFiles(domain, problem);
    const costNote = costModelNote(model);
    if (costNote) ctx.note(`note: ${costNote}`);
    // the SAT optimizer proves the optimum when it can; exhaustive A* takes over otherwise
    const prover = satProver(model, {}, { onProgress: (line) => ctx.note(line) });
    const r = await comparePlan(model, task, steps, { deadline, signal: ctx.signal, planFile: planPath, prover });
    ctx.exitCode = EXIT[r.verdict];
    const lb = r.ours.lowerBound;
    ctx.result({
      verdict: r.verdict,
      domain: model.domain.name,
      problem: model.problem.name,
      plan: { file: planPath, valid: r.theirs.valid, cost: r.theirs.cost, length: r.theirs.length, error: r.theirs.error, steps: r.theirs.steps },
      optimum: {
        cost: r.ours.cost,
        method: r.ours.method,
        lowerBound: Number.isFinite(lb) ? lb : null,
        upperBound: r.ours.upperBound,
        landmarkBound: r.ours.landmarkBound,
        plan: r.ours.plan,
        stats: r.ours.stats,
      },
      excess: r.excess,
      seconds: r.seconds,
    });
    const lines = [headline(r), ""];
    if (r.verdict === "invalid") {
      lines.push(sideBySide({ title: "plan under test", steps: r.theirs.steps, flag: { step: r.theirs.error!.step, note: `fails: ${r.theirs.error!.literal}` } }));
    } else if (r.ours.plan && r.ours.cost !== null) {
      lines.push(sideBySide({ title: `plan under test (cost ${r.theirs.cost})`, steps: r.theirs.steps }, { title: `our optimal plan (cost ${r.ours.cost})`, steps: r.ours.plan }));
    } else {
      lines.push(sideBySide({ title: `plan under test (cost ${r.theirs.cost})`, steps: r.theirs.steps }));
    }
    lines.push("", "(verdicts are about the model as written: a plan is only as good as the model)");
    ctx.out(lines.join("\n"));
  });
}
