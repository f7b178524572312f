// `plumbline audit DIR`: re-checks a certificate from its input files alone and names every
// check that passed or failed. Wiring only; the work is in src/certify/audit.ts.
import type { Command } from "commander";
import { auditCertificate } from "../../certify/index.js";
import { withCommonOptions, type CliContext } from "../context.js";
import { deadlineFrom } from "../options.js";

export function registerAudit(program: Command, ctx: CliContext): void {
  withCommonOptions(
    program
      .command("audit")
      .description(
        "re-check a certificate directory written by 'solve --certificate', trusting nothing but its domain and problem files:\n" +
          "re-parse, re-ground, replay the plan, recompute the horizon and its derivation, rebuild the CNF and compare its hash,\n" +
          "check the DRAT proof with the independent checker (or the landmark record). A certificate of an earlier version whose\n" +
          "recorded horizon is above today's recomputed threshold is accepted (every plan that short fits into its steps).\n" +
          "Exit 0 valid, 1 rejected, 2 unreadable directory.",
      )
      .argument("<dir>", "certificate directory (holds certificate.json)")
      .option("--time-limit <seconds>", "give up checking the proof after this many seconds (exit 3)"),
  ).action((dir: string, opts: { json?: boolean; quiet?: boolean; verbose?: boolean; timeLimit?: string }) => {
    ctx.configure(opts);
    const deadline = deadlineFrom(opts.timeLimit);
    const r = auditCertificate(dir, { deadline, signal: ctx.signal });
    const stopped = !r.valid && r.checks.some((c) => c.name === "proof-check" && !c.ok && /could not be checked/.test(c.detail));
    ctx.exitCode = r.valid ? 0 : stopped ? 3 : 1;
    ctx.result({ valid: r.valid, dir: r.dir, claim: r.claim, cost: r.cost, checks: r.checks, seconds: r.seconds });
    const lines = [r.valid ? `valid — ${r.claim?.status}${r.cost !== null ? ` (cost ${r.cost})` : ""}, proven by ${r.claim?.how}` : `REJECTED — ${r.checks.filter((c) => !c.ok && !c.skipped).map((c) => c.name).join(", ")}`, ""];
    for (const c of r.checks) lines.push(`${c.ok ? "ok  " : c.skipped ? "skip" : "FAIL"}  ${c.name}: ${c.detail}`);
    lines.push("", `(${r.seconds.toFixed(2)} s; a valid certificate speaks about the model as written — plans are only as good as the model)`);
    ctx.out(lines.join("\n"));
  });
}
