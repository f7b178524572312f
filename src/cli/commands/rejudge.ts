// `plumbline rejudge CERT_DIR [--domain F] [--problem F]`: is a certificate's recorded plan still
// valid, and still optimal, in a changed model? Wiring only; the work is in src/certify/rejudge.ts.
import type { Command } from "commander";
import { rejudge, type RejudgeResult } from "../../certify/index.js";
import { withCommonOptions, type CliContext } from "../context.js";
import { invocationName } from "../help.js";
import { deadlineFrom, positiveNumber } from "../options.js";
import { checkOutputs, isCertificateFolder } from "../output-paths.js";

interface RejudgeCliOptions {
  json?: boolean;
  quiet?: boolean;
  verbose?: boolean;
  domain?: string;
  problem?: string;
  certificate?: string;
  timeLimit?: string;
  memoryLimit?: string;
}

function headline(r: RejudgeResult): string {
  switch (r.verdict) {
    case "unchanged":
      return r.audit?.valid
        ? `unchanged — the model is the certificate's (whitespace, comments or case aside), and the certificate audits valid: cost ${r.recordedCost} is optimal`
        : `unchanged — the model is the certificate's, but the certificate does not audit valid (${r.audit?.checks.filter((c) => !c.ok && !c.skipped).map((c) => c.name).join(", ") || "not finished"})`;
    case "plan-invalid":
      return `plan no longer valid — ${r.failure!.message}`;
    case "cost-changed":
      return `cost changed — the recorded plan is valid but costs ${r.newCost} now (recorded ${r.recordedCost}); ${r.optimal === true ? "it is still optimal at the new cost (proven)" : r.optimal === null ? "whether it is still optimal was not settled" : "and a cheaper plan exists"}`;
    case "still-optimal":
      return `still optimal — the recorded plan (cost ${r.recordedCost}) is proven optimal again in the new model by ${r.provedBy}`;
    case "cheaper-plan":
      return `cheaper plan — the new model has a plan of cost ${r.cheaperPlan!.cost} (${r.cheaperPlan!.proven ? "proven optimal" : "not proven optimal"}); the recorded plan costs ${r.newCost} there (recorded ${r.recordedCost})`;
    case "undecided":
      return `undecided — the recorded plan is valid at the same cost ${r.newCost}, but a limit (${r.stopReason}) stopped the proof before optimality was settled`;
  }
}

export function registerRejudge(program: Command, ctx: CliContext): void {
  withCommonOptions(
    program
      .command("rejudge")
      .description(
        "re-judge a certificate's recorded plan against a changed model (the files not given are the certificate's own): " +
          "unchanged (same model up to whitespace, comments and case: the certificate is re-audited), plan-invalid " +
          "(the first failing action and unmet condition), cost-changed (old and new cost), still-optimal (proven again, starting " +
          "from the recorded plan so only the final refutation is left), cheaper-plan (its plan and cost), or undecided (a limit stopped the proof).",
      )
      .argument("<cert-dir>", "certificate folder written by 'solve --certificate' (holds certificate.json)")
      .option("--domain <file>", "the new domain file (default: the certificate's domain.pddl)")
      .option("--problem <file>", "the new problem file (default: the certificate's problem.pddl)")
      .option("--certificate <dir>", "write a certificate for the new model here when optimality is proven (or, unchanged, a copy with the given files)")
      .option("--time-limit <seconds>", "stop after this many seconds (verdict undecided, exit 3, unless the cost already changed)")
      .option("--memory-limit <MB>", "stop when resident memory passes this many MB"),
  ).action(async (certDir: string, opts: RejudgeCliOptions) => {
    ctx.configure(opts);
    checkOutputs([opts.certificate !== undefined ? { flag: "--certificate", path: opts.certificate, kind: "folder", reuseIf: isCertificateFolder } : null], [certDir, ...(opts.domain ? [opts.domain] : []), ...(opts.problem ? [opts.problem] : [])]);
    const deadline = deadlineFrom(opts.timeLimit);
    const memoryLimitMb = positiveNumber("--memory-limit", opts.memoryLimit);
    const r = await rejudge(certDir, { domain: opts.domain, problem: opts.problem, certificateOut: opts.certificate, deadline, memoryLimitMb, signal: ctx.signal, onProgress: (l) => ctx.note(l) });
    ctx.exitCode = r.exitCode;
    ctx.result({
      verdict: r.verdict,
      modelChanged: r.modelChanged,
      planValid: r.planValid,
      failure: r.failure,
      recordedCost: r.recordedCost,
      newCost: r.newCost,
      optimal: r.optimal,
      cheaperPlan: r.cheaperPlan,
      certificate: r.certificate,
      provedBy: r.provedBy,
      stopReason: r.stopReason,
      reuse: r.reuse,
      change: r.change,
      audit: r.audit ? { valid: r.audit.valid, checks: r.audit.checks } : null,
      domain: r.domain,
      problem: r.problem,
      seconds: r.seconds,
      notes: r.notes,
    });
    const lines = [headline(r), ""];
    if (r.change) {
      const c = r.change;
      const parts = [
        c.actionsAdded.length ? `${c.actionsAdded.length} actions added (e.g. ${c.actionsAdded.slice(0, 3).join(", ")})` : "",
        c.actionsRemoved.length ? `${c.actionsRemoved.length} actions removed (e.g. ${c.actionsRemoved.slice(0, 3).join(", ")})` : "",
        c.costsChanged.length ? `${c.costsChanged.length} action costs changed (e.g. ${c.costsChanged.slice(0, 3).map((x) => `${x.action} ${x.from}→${x.to}`).join(", ")})` : "",
        c.factsAdded.length || c.factsRemoved.length ? `facts +${c.factsAdded.length}/−${c.factsRemoved.length}` : "",
        c.initChanged ? "initial state changed" : "",
        c.goalChanged ? "goal changed" : "",
      ].filter((x) => x);
      lines.push(`what changed (ground task): ${parts.length ? parts.join("; ") : "nothing but the order"}`);
    }
    if (r.cheaperPlan) lines.push("", "cheaper plan:", r.cheaperPlan.text.trimEnd(), "");
    if (r.audit && !r.audit.valid) for (const c of r.audit.checks) if (!c.ok && !c.skipped) lines.push(`FAIL  ${c.name}: ${c.detail}`);
    for (const u of r.reuse) lines.push(`${u.reused ? "reused" : "not reused"}: ${u.part} — ${u.why}`);
    for (const n of r.notes) lines.push(`note: ${n}`);
    if (r.certificate) lines.push(`certificate written to ${r.certificate} (check it with: ${invocationName()} audit ${r.certificate})`);
    lines.push(`(${r.seconds.toFixed(2)} s; plans are only as good as the model: re-judging says nothing about what the model leaves out)`);
    ctx.out(lines.join("\n"));
  });
}
