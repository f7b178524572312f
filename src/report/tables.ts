// The text tables bench and report print: coverage per configuration and domain, status
// breakdown, cost agreement per instance (with the loud banner when something disagrees).
import type { RunRecord } from "./record.js";
import { checkAgreement, findingsBanner, type AgreementResult } from "./agreement.js";
import { breakdown, coverage, type Coverage } from "./summary.js";
import { formatSeconds, formatTable } from "./text-table.js";

export function coverageTable(cov: Coverage): string {
  const headers = ["configuration", ...cov.domains.map((d) => `${d} (${cov.instances[d]})`), `total (${cov.instances.total})`];
  const rows = cov.configurations.map((c) => [c, ...cov.domains.map((d) => cellOf(cov, c, d)), cellOf(cov, c, "total")]);
  return formatTable({ headers, rows });
}

function cellOf(cov: Coverage, c: string, d: string): string {
  const runs = cov.runs[c][d];
  const inst = cov.instances[d];
  // a configuration that ran on fewer instances than the domain has says so
  return runs === inst ? String(cov.optimal[c][d]) : `${cov.optimal[c][d]} of ${runs}`;
}

export function breakdownTable(records: readonly RunRecord[], configurations: readonly string[]): string {
  const rows = breakdown(records, configurations).map((b) => [
    b.configuration,
    String(b.counts.optimal),
    String(b.counts.feasible),
    String(b.counts.unsolvable),
    String(b.counts.unknown),
    String(b.counts.error),
    b.auditValid + b.auditInvalid === 0 ? "–" : `${b.auditValid} valid${b.auditInvalid ? `, ${b.auditInvalid} REJECTED` : ""}`,
    formatSeconds(b.medianOptimalSeconds),
    b.maxMemory === null ? "–" : `${Math.round(b.maxMemory)} MB`,
  ]);
  return formatTable({
    headers: ["configuration", "optimal", "feasible", "unsolvable", "unknown", "error", "audits", "median time (optimal)", "max memory"],
    rows,
  });
}

/** Per instance: each configuration's cost (with * when proven optimal) and the verdict. */
export function agreementTable(records: readonly RunRecord[], configurations: readonly string[], agreement: AgreementResult = checkAgreement(records)): string {
  const byKey = new Map(records.map((r) => [`${r.instance}\u0000${r.configuration}`, r]));
  const rows = agreement.instances.map((a) => [
    a.instance,
    ...configurations.map((c) => {
      const r = byKey.get(`${a.instance}\u0000${c}`);
      if (!r) return "";
      if (r.cost === null) return r.lowerBound !== null && r.status === "unknown" ? `≥${r.lowerBound}` : r.status;
      return `${r.cost}${r.status === "optimal" ? "*" : ""}`;
    }),
    a.verdict === "disagree" ? "DISAGREE !!" : a.verdict,
  ]);
  return formatTable({ headers: ["instance", ...configurations, "verdict"], rows });
}

/** The full text summary: coverage, breakdown, agreement and any findings. */
export function textSummary(records: readonly RunRecord[], configOrder?: readonly string[]): { text: string; agreement: AgreementResult } {
  const cov = coverage(records, configOrder);
  const agreement = checkAgreement(records);
  const parts = [
    "Proven-optimal coverage (instances per domain in brackets):",
    coverageTable(cov),
    "",
    "Outcomes per configuration:",
    breakdownTable(records, cov.configurations),
    "",
    "Cost per instance (* = proven optimal, ≥ = only a lower bound):",
    agreementTable(records, cov.configurations, agreement),
    "",
  ];
  const multi = agreement.instances.filter((a) => a.verdict === "agree").length;
  if (agreement.findings.length) parts.push(findingsBanner(agreement.findings));
  else parts.push(`Agreement: no contradictions (${multi} instance${multi === 1 ? "" : "s"} proven optimal by two or more configurations, all equal).`);
  return { text: parts.join("\n"), agreement };
}

