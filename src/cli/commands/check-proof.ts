// `plumbline check-proof CNF PROOF`: checks a DRAT proof (binary or text, gzip or not) with the
// stand-alone checker in src/proof, optionally writing an LRAT proof, or checks an LRAT proof
// with the separate simple LRAT checker. Wiring only.
import { Option, type Command } from "commander";
import { checkDratFiles, checkLrat, readCnfForChecker, type CheckMode } from "../../proof/index.js";
import { readBytes } from "../../util/files.js";
import { PlumblineError } from "../../util/errors.js";
import { withCommonOptions, type CliContext } from "../context.js";
import { deadlineFrom } from "../options.js";
import { checkOutputs } from "../output-paths.js";

interface CheckProofCliOptions {
  json?: boolean;
  quiet?: boolean;
  verbose?: boolean;
  mode?: CheckMode;
  format?: "drat" | "lrat";
  lrat?: string;
  timeLimit?: string;
}

export function registerCheckProof(program: Command, ctx: CliContext): void {
  withCommonOptions(
    program
      .command("check-proof")
      .description(
        "check a proof that a DIMACS CNF formula is unsatisfiable: a DRAT proof (RUP and RAT lemmas, deletions; binary or text, optionally gzip-compressed), " +
          "or with --format lrat an LRAT proof (every lemma with its hint chain; checked by a separate, much simpler checker).\n" +
          "Exit 0 proof valid, 1 proof rejected, 2 bad input, 3 time limit reached.",
      )
      .argument("<cnf>", "DIMACS CNF file")
      .argument("<proof>", "proof file")
      .addOption(new Option("--format <format>", "drat (default): a DRAT proof; lrat: a text LRAT proof").choices(["drat", "lrat"]).default("drat"))
      .addOption(
        new Option("--mode <mode>", "DRAT only. backward (default): check only the lemmas the refutation needs; forward: check every lemma up to the refutation").choices(["backward", "forward"]).default("backward"),
      )
      .option("--lrat <file>", "DRAT only, backward mode: when the proof is valid, also write an LRAT proof (text) of the refutation to this file")
      .option("--time-limit <seconds>", "DRAT only: give up after this many seconds (exit 3)"),
  ).action((cnfPath: string, proofPath: string, opts: CheckProofCliOptions) => {
    ctx.configure(opts);
    if (opts.format === "lrat") {
      if (opts.lrat !== undefined) throw new PlumblineError("usage", "--lrat writes an LRAT proof from a DRAT proof; it cannot be combined with --format lrat");
      const cnf = readCnfForChecker(readBytes(cnfPath), cnfPath);
      for (const w of cnf.warnings) ctx.warn(w);
      const r = checkLrat(cnf, readBytes(proofPath));
      ctx.exitCode = r.valid ? 0 : 1;
      const s = r.stats;
      if (r.valid) ctx.out(`LRAT proof valid: ${s.additions} lemmas (${s.ratAdditions} by RAT), ${s.hints} hints, ${s.deletions} deletion lines, in ${s.seconds.toFixed(2)} s`);
      else ctx.out(`LRAT proof rejected: ${r.reason}`);
      ctx.result({ valid: r.valid, format: "lrat", ...(r.reason ? { reason: r.reason, line: r.line } : {}), stats: s, seconds: s.seconds });
      return;
    }
    if (opts.lrat !== undefined && opts.mode === "forward") throw new PlumblineError("usage", "--lrat needs the backward mode");
    checkOutputs([opts.lrat !== undefined ? { flag: "--lrat", path: opts.lrat, kind: "file" } : null], [cnfPath, proofPath]);
    const deadline = deadlineFrom(opts.timeLimit);
    const r = checkDratFiles(cnfPath, proofPath, { mode: opts.mode ?? "backward", deadline, signal: ctx.signal, lratFile: opts.lrat });
    for (const w of r.warnings) ctx.warn(w);
    const stopped = !r.valid && (r.reason ?? "").startsWith("stopped");
    ctx.exitCode = r.valid ? 0 : stopped ? 3 : 1;
    const s = r.stats;
    if (r.valid) {
      ctx.out(`proof valid: ${s.checkedLemmas} of ${s.lemmas} lemmas checked (${s.mode}), ${s.ratLemmas} by RAT, in ${s.seconds.toFixed(2)} s`);
      if (opts.lrat !== undefined) ctx.out(`LRAT proof written to ${opts.lrat} (${s.lratLines} lines)`);
    } else {
      ctx.out(`proof ${stopped ? "not checked" : "rejected"}: ${r.reason}`);
    }
    ctx.result({
      valid: r.valid,
      format: "drat",
      ...(r.reason ? { reason: r.reason } : {}),
      ...(r.failedLemma ? { failedLemma: r.failedLemma } : {}),
      ...(r.valid && opts.lrat !== undefined ? { lrat: opts.lrat } : {}),
      stats: s,
      seconds: s.seconds,
    });
  });
}
