// `plumbline report DIR`: the HTML report of a bench results folder or of a certificate
// (running audit on it, or showing the recorded audit). Wiring only; the pages are built
// in src/report, the audit is src/certify's.
import { existsSync, readFileSync } from "node:fs";
import { basename, dirname, join, resolve } from "node:path";
import type { Command } from "commander";
import { latestById, readResults } from "../../bench/index.js";
import { auditCertificate } from "../../certify/index.js";
import { auditViewOf, certificateReportHtml, singleAuditJson, detectReportDir, findField, normaliseTimeline, readCertificateView, writeBenchReport, type AuditView, type BenchMeta } from "../../report/index.js";
import { PlumblineError } from "../../util/errors.js";
import { writeFileAtomic } from "../../util/files.js";
import { withCommonOptions, type CliContext } from "../context.js";
import { invocationName } from "../help.js";
import { checkOutputs } from "../output-paths.js";

interface ReportCliOptions {
  json?: boolean;
  quiet?: boolean;
  verbose?: boolean;
  output?: string;
  audit?: boolean;
  timeLimit?: string;
}

export function registerReport(program: Command, ctx: CliContext): void {
  withCommonOptions(
    program
      .command("report")
      .description(
        "write a self-contained HTML report (no scripts, no network) of a bench results folder or of a certificate folder. " +
          "Bench folder: tables, coverage over time, cost agreement, bounds over time, horizon tightness (report.html in the folder). " +
          "Certificate: the audit verdict, the plan as a timeline, bound convergence, the horizon derivation (DIR.report.html beside it).",
      )
      .argument("<dir>", "bench results folder (holds results.jsonl) or certificate folder (holds certificate.json)")
      .option("-o, --output <file>", "where to write the HTML (default: DIR/report.html for a bench folder, DIR.report.html for a certificate)")
      .option("--no-audit", "certificate: do not run audit; show the audit recorded next to it by bench, if any")
      .option("--time-limit <seconds>", "certificate: stop the audit after this many seconds (default 600; the audit is then unfinished)"),
  ).action(async (dir: string, opts: ReportCliOptions) => {
    ctx.configure(opts);
    checkOutputs([opts.output !== undefined ? { flag: "--output", path: opts.output, kind: "file" } : null], [dir]);
    const kind = detectReportDir(dir);
    if (kind === "export") throw new PlumblineError("usage", `${dir} is an exported job array without merged results: run ${invocationName()} bench --merge ${dir} first`);
    if (kind === "bench") {
      const records = latestById(readResults(join(dir, "results.jsonl")));
      const metaFile = join(dir, "bench.json");
      const meta: BenchMeta = existsSync(metaFile)
        ? (JSON.parse(readFileSync(metaFile, "utf8")) as BenchMeta)
        : { suite: basename(resolve(dir)), suiteFile: "", configurations: [...new Set(records.map((r) => r.configuration))], timeLimit: Math.max(0, ...records.map((r) => r.timeLimit)), memoryLimit: Math.max(0, ...records.map((r) => r.memoryLimit)), jobs: 1, createdAt: "", toolVersion: "", node: "", host: "", cpus: 0, runs: records.length };
      const w = writeBenchReport(dir, records, meta);
      let html = w.html;
      if (opts.output) {
        writeFileAtomic(opts.output, readFileSync(w.html, "utf8"));
        html = resolve(opts.output);
      }
      ctx.exitCode = w.agreement.findings.length ? 1 : 0;
      ctx.result({ kind, report: html, runs: records.length, findings: w.agreement.findings });
      ctx.out(`${w.text}\n\nreport: ${html}`);
      return;
    }
    const view = readCertificateView(dir, (c) => normaliseTimeline(findField(c, ["timeline"])));
    let audit: AuditView;
    if (opts.audit === false) {
      const recorded = join(dirname(resolve(dir)), "audit.json");
      audit = existsSync(recorded) ? auditViewOf(singleAuditJson(readFileSync(recorded, "utf8")), "recorded", null, `from ${recorded}`) : auditViewOf(null, "none", null, "--no-audit given and no recorded audit found");
    } else {
      const limit = opts.timeLimit === undefined ? 600 : Number(opts.timeLimit);
      if (!(limit > 0)) throw new PlumblineError("usage", `--time-limit expects a positive number of seconds, found '${opts.timeLimit}'`);
      ctx.note(`auditing ${dir} …`);
      const r = auditCertificate(dir, { deadline: Date.now() + limit * 1000, signal: ctx.signal });
      audit = auditViewOf({ valid: r.valid, finished: r.finished, checks: r.checks }, "run", r.seconds);
    }
    const out = opts.output ?? `${resolve(dir).replace(/\/+$/, "")}.report.html`;
    writeFileAtomic(out, certificateReportHtml(view, audit));
    ctx.exitCode = audit.status === "rejected" ? 1 : 0;
    ctx.result({ kind, report: resolve(out), audit: audit.status, checks: audit.checks, plan: view.plan ? view.plan.length : null, planNote: view.planNote });
    ctx.out(`certificate ${dir}: audit ${audit.status}${audit.source === "recorded" ? " (recorded)" : ""}${view.planNote ? `\nnote: ${view.planNote}` : ""}\nreport: ${resolve(out)}`);
  });
}
