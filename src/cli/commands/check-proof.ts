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
  lemmas?: "needed" | "all";
  proofFormat?: "drat" | "lrat";
  lratProof?: string;
  timeLimit?: string;
}

/** --lemmas needed|all → the checker's pass: needed lemmas found working backward, or every lemma forward. */
const PASS: Record<"needed" | "all", CheckMode> = { needed: "backward", all: "forward" };

export function registerCheckProof(program: Command, ctx: CliContext): void {
  withCommonOptions(
    program
      .command("check-proof")
      .description(
        "check a proof that a DIMACS CNF formula is unsatisfiable: a DRAT proof (RUP and RAT lemmas, deletions; binary or text, optionally gzip-compressed), " +
          "or with --proof-format lrat an LRAT proof (every lemma with its hint chain; checked by a separate, much simpler checker). " +
          "A valid DRAT proof can be turned into an LRAT proof with --lrat-proof FILE.",
      )
      .argument("<cnf>", "DIMACS CNF file")
      .argument("<proof>", "proof file")
      .addOption(new Option("--proof-format <format>", "what PROOF holds: drat (default; binary or text, gzip or not, told apart by reading it) or lrat (text)").choices(["drat", "lrat"]).default("drat").helpGroup("The proof:"))
      .addOption(
        new Option("--lemmas <which>", "DRAT: needed (default) checks only the lemmas the refutation uses, found working back from the final conflict; all checks every lemma in order")
          .choices(["needed", "all"])
          .default("needed")
          .helpGroup("Checking a DRAT proof:"),
      )
      .addOption(new Option("--time-limit <seconds>", "DRAT: give up after this many seconds (exit 3); the LRAT check always runs to the end").helpGroup("Checking a DRAT proof:"))
      .addOption(new Option("--lrat-proof <file>", "DRAT, --lemmas needed: when the proof is valid, also write the refutation as a text LRAT proof to this file").helpGroup("Output:")),
  ).action((cnfPath: string, proofPath: string, opts: CheckProofCliOptions) => {
    ctx.configure(opts);
    if (opts.proofFormat === "lrat") {
      if (opts.lratProof !== undefined) throw new PlumblineError("usage", "--lrat-proof writes an LRAT proof from a DRAT proof; it cannot be combined with --proof-format lrat");
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
    if (opts.lratProof !== undefined && opts.lemmas === "all") throw new PlumblineError("usage", "--lrat-proof needs --lemmas needed (the default): the LRAT proof is built from the lemmas the refutation uses");
    checkOutputs([opts.lratProof !== undefined ? { flag: "--lrat-proof", path: opts.lratProof, kind: "file" } : null], [cnfPath, proofPath]);
    const deadline = deadlineFrom(opts.timeLimit);
    const r = checkDratFiles(cnfPath, proofPath, { mode: PASS[opts.lemmas ?? "needed"], deadline, signal: ctx.signal, lratFile: opts.lratProof });
    for (const w of r.warnings) ctx.warn(w);
    const stopped = !r.valid && (r.reason ?? "").startsWith("stopped");
    ctx.exitCode = r.valid ? 0 : stopped ? 3 : 1;
    const s = r.stats;
    if (r.valid) {
      ctx.out(`proof valid: ${s.checkedLemmas} of ${s.lemmas} lemmas checked (${opts.lemmas === "all" ? "all lemmas" : "the lemmas the refutation needs"}), ${s.ratLemmas} by RAT, in ${s.seconds.toFixed(2)} s`);
      if (opts.lratProof !== undefined) ctx.out(`LRAT proof written to ${opts.lratProof} (${s.lratLines} lines)`);
    } else {
      ctx.out(`proof ${stopped ? "not checked" : "rejected"}: ${r.reason}`);
    }
    ctx.result({
      valid: r.valid,
      format: "drat",
      ...(r.reason ? { reason: r.reason } : {}),
      ...(r.failedLemma ? { failedLemma: r.failedLemma } : {}),
      lemmas: opts.lemmas ?? "needed",
      ...(r.valid && opts.lratProof !== undefined ? { lratProof: opts.lratProof } : {}),
      stats: s,
      seconds: s.seconds,
    });
  });
}
