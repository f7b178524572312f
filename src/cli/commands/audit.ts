// `plumbline audit PATH...`: re-checks certificates from their input files alone — one folder, or
// every certificate below some folders, N at a time — with a summary table, JSON and JUnit XML.
import type { Command } from "commander";
import { auditMany, bulkExitCode, type BulkEntry } from "../../certify/index.js";
import { formatSeconds, formatTable, junitXml } from "../../report/index.js";
import { writeFileAtomic } from "../../util/files.js";
import { withCommonOptions, type CliContext } from "../context.js";
import { positiveNumber, positiveOption } from "../options.js";
import { checkOutputs, isCertificateFolder } from "../output-paths.js";

interface AuditCliOptions {
  json?: boolean;
  quiet?: boolean;
  verbose?: boolean;
  timeLimit?: string;
  jobs?: string;
  junit?: string;
}

const VERDICT_TEXT: Record<BulkEntry["verdict"], string> = { valid: "valid", rejected: "REJECTED", unfinished: "not finished", unreadable: "unreadable", error: "ERROR" };

/** One JSON object per certificate (the --json array's elements). */
function entryJson(e: BulkEntry): Record<string, unknown> {
  return { dir: e.dir, verdict: e.verdict, valid: e.verdict === "valid", claim: e.claim, cost: e.cost, seconds: e.seconds, failed: e.failed, reason: e.reason, checks: e.checks };
}

function details(e: BulkEntry, all: boolean): string[] {
  const lines = [`${e.dir}: ${VERDICT_TEXT[e.verdict]}${e.reason ? ` — ${e.reason}` : ""}`];
  for (const c of e.checks) if (all || (!c.ok && !c.skipped)) lines.push(`  ${c.ok ? "ok  " : c.stopped ? "stop" : c.skipped ? "skip" : "FAIL"}  ${c.name}: ${c.detail}`);
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
        "re-check certificates written by 'solve --certificate', trusting nothing but their domain and problem files:\n" +
          "re-parse, re-ground, replay the plan, recompute the horizon and its derivation, rebuild the CNF and compare its hash,\n" +
          "check the DRAT proof with the independent checker (or the landmark record). A certificate of an earlier version whose\n" +
          "recorded horizon is above today's recomputed threshold is accepted (every plan that short fits into its steps).\n" +
          "Each PATH is a certificate folder or a folder searched recursively for them. Prints a table (folder, claim, cost,\n" +
          "verdict, seconds). Exit 0 all valid, 1 any rejected, 2 any unreadable (or no certificate under a PATH),\n" +
          "3 any not finished within --time-limit (in that order of precedence), 4 an internal error.",
      )
      .argument("<paths...>", "certificate folders (holding certificate.json), or folders to search for them")
      .option("--time-limit <seconds>", "per certificate: give up on a certificate after this many seconds (verdict 'not finished', exit 3)")
      .option("--jobs <n>", "audit this many certificates at once, each in its own process (default 1)")
      .option("--junit <file>", "also write the results as JUnit XML (one testcase per certificate) for a CI system"),
  ).action(async (paths: string[], opts: AuditCliOptions) => {
    ctx.configure(opts);
    // the file may go into a folder that is searched (`audit . --junit audit.xml`), not into a certificate
    checkOutputs([opts.junit !== undefined ? { flag: "--junit", path: opts.junit, kind: "file" } : null], paths.filter(isCertificateFolder));
    const timeLimit = positiveNumber("--time-limit", opts.timeLimit);
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
    const lines = [headline(entries), "", table, "", `${entries.length} certificate${entries.length === 1 ? "" : "s"}: ${count("valid")} valid, ${count("rejected")} rejected, ${count("unfinished")} not finished, ${count("unreadable") + count("error")} unreadable or failed to run`];
    const one = entries.length === 1;
    for (const e of entries) if (one || opts.verbose || e.verdict !== "valid") lines.push("", ...details(e, one || !!opts.verbose));
    if (opts.junit) lines.push("", `JUnit XML written to ${opts.junit}`);
    lines.push("", "(a valid certificate speaks about the model as written — plans are only as good as the model)");
    ctx.out(lines.join("\n"));
  });
}
