// `plumbline audit PATH...`: re-checks certificates from their input files alone — one folder, or
// every certificate below some folders, N at a time — with a summary table, JSON and JUnit XML.
import type { Command } from "commander";
import { auditMany, bulkExitCode, checkWords, type BulkEntry } from "../../certify/index.js";
import { formatSeconds, formatTable, junitXml } from "../../report/index.js";
import { writeFileAtomic } from "../../util/files.js";
import { withCommonOptions, type CliContext } from "../context.js";
import { positiveNumber, positiveOption } from "../options.js";
import { checkOutputs, isCertificateFolder } from "../output-paths.js";

interface AuditCliOptions {
  json?: boolean;
  quiet?: boolean;
  verbose?: boolean;
  timeLimitPerCertificate?: string;
  jobs?: string;
  junit?: string;
}

const VERDICT_TEXT: Record<BulkEntry["verdict"], string> = { valid: "valid", rejected: "REJECTED", unfinished: "unfinished", unreadable: "unreadable", error: "ERROR" };

/** One JSON object per certificate (the --json array's elements). */
function entryJson(e: BulkEntry): Record<string, unknown> {
  return { dir: e.dir, verdict: e.verdict, valid: e.verdict === "valid", claim: e.claim, cost: e.cost, seconds: e.seconds, failed: e.failed, reason: e.reason, checks: e.checks };
}

/**
 * The checklist of a certificate: each check in plain words with its name; the check's own
 * (technical) detail under it for a check that did not pass, and for every check with `verbose`.
 */
function details(e: BulkEntry, all: boolean, verbose: boolean): string[] {
  const lines = [`${e.dir}: ${VERDICT_TEXT[e.verdict]}${e.reason ? ` — ${e.reason}` : ""}`];
  for (const c of e.checks) {
    if (!all && (c.ok || c.skipped)) continue;
    lines.push(`  ${c.ok ? "ok  " : c.stopped ? "stop" : c.skipped ? "skip" : "FAIL"}  ${checkWords(c.name)} (${c.name})`);
    if (verbose || !c.ok) lines.push(`          ${c.detail}`);
  }
  return lines;
}

/** The first line: the overall verdict (for one certificate, its claim and how it is proven). */
function headline(entries: readonly BulkEntry[]): string {
  const bad = entries.filter((e) => e.verdict !== "valid");
  if (bad.length === 0) {
    const e = entries[0];
    return entries.length === 1 ? `valid — ${e.claim?.status}${e.cost !== null ? ` (cost ${e.cost})` : ""}, proven by ${e.claim?.how}` : `valid — all ${entries.length} certificates`;
  }
  const worst = (["error", "rejected", "unreadable", "unfinished"] as const).find((v) => bad.some((e) => e.verdict === v))!;
  const what = bad.map((e) => (e.verdict === "rejected" ? `${e.dir} (${e.failed.join(", ")})` : `${e.dir} (${VERDICT_TEXT[e.verdict]})`));
  return `${VERDICT_TEXT[worst].toUpperCase()} — ${bad.length} of ${entries.length}: ${what.join("; ")}`;
}

export function registerAudit(program: Command, ctx: CliContext): void {
  withCommonOptions(
    program
      .command("audit")
      .description(
        "re-check certificates written by 'solve --certificate', trusting nothing but their domain and problem files: " +
          "re-parse, re-ground, replay the plan, recompute the horizon and its derivation, rebuild the CNF and compare its hash, " +
          "check the DRAT proof with the independent checker (or the landmark record). A certificate of an earlier version whose " +
          "recorded horizon is above today's recomputed threshold is accepted (every plan that short fits into its steps). " +
          "Each PATH is a certificate folder or a folder searched recursively for them. Prints the verdict, a table (folder, claim, cost, " +
          "verdict, seconds), and for one certificate every check in plain words (--verbose adds the solver details). " +
          "Verdicts: valid, rejected, unfinished (a limit stopped the audit), unreadable.",
      )
      .argument("<paths...>", "certificate folders (holding certificate.json), or folders to search for them")
      .option("--time-limit-per-certificate <seconds>", "give up on a certificate after this many seconds (verdict unfinished, exit 3)")
      .option("--jobs <n>", "audit this many certificates at once, each in its own process (default 1)")
      .option("--junit <file>", "also write the results as JUnit XML (one testcase per certificate) for a CI system"),
  ).action(async (paths: string[], opts: AuditCliOptions) => {
    ctx.configure(opts);
    // the file may go into a folder that is searched (`audit . --junit audit.xml`), not into a certificate
    checkOutputs([opts.junit !== undefined ? { flag: "--junit", path: opts.junit, kind: "file" } : null], paths.filter(isCertificateFolder));
    const timeLimit = positiveNumber("--time-limit-per-certificate", opts.timeLimitPerCertificate);
    const jobs = positiveOption("--jobs", opts.jobs, 1);
    const started = new Date();
    const entries = await auditMany(paths, {
      jobs,
      timeLimit,
      signal: ctx.signal,
      onEntry: (e, done, total) => ctx.note(`[${done}/${total}] ${e.dir}: ${VERDICT_TEXT[e.verdict]} (${formatSeconds(e.seconds)})`),
    });
    if (opts.junit) {
      const properties: Record<string, string> = { jobs: String(jobs) };
      if (timeLimit !== undefined) properties["time-limit"] = `${timeLimit} s per certificate`;
      writeFileAtomic(opts.junit, junitXml(entries, { started, properties }));
    }
    ctx.exitCode = bulkExitCode(entries);
    ctx.result(entries.map(entryJson));
    const table = formatTable({
      headers: ["folder", "claim", "cost", "verdict", "seconds"],
      rows: entries.map((e) => [e.dir, e.claim ? `${e.claim.status} (${e.claim.how})` : "–", e.cost === null ? "–" : String(e.cost), VERDICT_TEXT[e.verdict], e.seconds.toFixed(2)]),
      align: ["left", "left", "right", "left", "right"],
    });
    const count = (v: BulkEntry["verdict"]) => entries.filter((e) => e.verdict === v).length;
    const lines = [headline(entries), "", table, "", `${entries.length} certificate${entries.length === 1 ? "" : "s"}: ${count("valid")} valid, ${count("rejected")} rejected, ${count("unfinished")} unfinished, ${count("unreadable") + count("error")} unreadable or failed to run`];
    const one = entries.length === 1;
    for (const e of entries) if (one || opts.verbose || e.verdict !== "valid") lines.push("", ...details(e, one || !!opts.verbose, !!opts.verbose));
    if (one && !opts.verbose && entries[0].checks.length) lines.push("", "(--verbose shows how each check was done)");
    if (opts.junit) lines.push("", `JUnit XML written to ${opts.junit}`);
    lines.push("", "(a valid certificate speaks about the model as written — plans are only as good as the model)");
    ctx.out(lines.join("\n"));
  });
}
