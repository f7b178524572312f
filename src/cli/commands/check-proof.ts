// `plumbline check-proof CNF PROOF`: checks a DRAT proof (binary or text, gzip or not) with the
// stand-alone checker in src/proof. Wiring only.
import { Option, type Command } from "commander";
import { checkDratFiles, type CheckMode } from "../../proof/index.js";
import { withCommonOptions, type CliContext } from "../context.js";
import { deadlineFrom } from "./search.js";

interface CheckProofCliOptions {
  json?: boolean;
  quiet?: boolean;
  verbose?: boolean;
  mode?: CheckMode;
  timeLimit?: string;
}

export function registerCheckProof(program: Command, ctx: CliContext): void {
  withCommonOptions(
    program
      .command("check-proof")
      .description(
        "check a DRAT proof that a DIMACS CNF formula is unsatisfiable (RUP and RAT lemmas, deletions; binary or text, optionally gzip-compressed).\n" +
          "Exit 0 proof valid, 1 proof rejected, 2 bad input, 3 time limit reached.",
      )
      .argument("<cnf>", "DIMACS CNF file")
      .argument("<proof>", "DRAT proof file")
      .addOption(
        new Option("--mode <mode>", "backward (default): check only the lemmas the refutation needs; forward: check every lemma up to the refutation").choices(["backward", "forward"]).default("backward"),
      )
      .option("--time-limit <seconds>", "give up after this many seconds (exit 3)"),
  ).action((cnfPath: string, proofPath: string, opts: CheckProofCliOptions) => {
    ctx.configure(opts);
    const deadline = deadlineFrom(opts.timeLimit);
    const r = checkDratFiles(cnfPath, proofPath, { mode: opts.mode ?? "backward", deadline, signal: ctx.signal });
    for (const w of r.warnings) ctx.log.warn(w);
    const stopped = !r.valid && (r.reason ?? "").startsWith("stopped");
    ctx.exitCode = r.valid ? 0 : stopped ? 3 : 1;
    const s = r.stats;
    if (r.valid) {
      ctx.out(`proof valid: ${s.checkedLemmas} of ${s.lemmas} lemmas checked (${s.mode}), ${s.ratLemmas} by RAT, in ${s.seconds.toFixed(2)} s`);
    } else {
      ctx.out(`proof ${stopped ? "not checked" : "rejected"}: ${r.reason}`);
    }
    ctx.result({
      valid: r.valid,
      ...(r.reason ? { reason: r.reason } : {}),
      ...(r.failedLemma ? { failedLemma: r.failedLemma } : {}),
      stats: s,
      seconds: s.seconds,
    });
  });
}
