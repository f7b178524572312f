// Cross-checks between configurations on each instance. Two proven optima that differ, a plan
// cheaper than a proven optimum, a lower bound above a real plan's cost, "unsolvable" beside a
// plan, or a rejected audit of our own certificate: each means a bug, so each is a finding.
import type { RunRecord } from "./record.js";

export type FindingKind = "optimum-disagreement" | "plan-below-optimum" | "bound-above-plan" | "unsolvable-with-plan" | "audit-rejected";

export interface Finding {
  kind: FindingKind;
  instance: string;
  /** Configurations involved. */
  configurations: string[];
  message: string;
}

export interface InstanceAgreement {
  instance: string;
  domain: string;
  /** Proven optimal cost per configuration that proved one. */
  optima: Record<string, number>;
  /** Agreement of the proven optima: "agree" (≥ 2, equal), "one-proof" (1), "no-proof" (0), "disagree" (≥ 2, different: a bug). */
  verdict: "agree" | "one-proof" | "no-proof" | "disagree";
}

export interface AgreementResult {
  instances: InstanceAgreement[];
  findings: Finding[];
}

const hasPlan = (r: RunRecord) => (r.status === "optimal" || r.status === "feasible") && r.cost !== null;

export function checkAgreement(records: readonly RunRecord[]): AgreementResult {
  const byInstance = new Map<string, RunRecord[]>();
  for (const r of records) {
    const list = byInstance.get(r.instance) ?? [];
    list.push(r);
    byInstance.set(r.instance, list);
  }
  const findings: Finding[] = [];
  const instances: InstanceAgreement[] = [];
  for (const [instance, runs] of [...byInstance].sort((a, b) => a[0].localeCompare(b[0]))) {
    const optimal = runs.filter((r) => r.status === "optimal" && r.cost !== null);
    const optima: Record<string, number> = {};
    for (const r of optimal) optima[r.configuration] = r.cost as number;
    const costs = [...new Set(optimal.map((r) => r.cost as number))].sort((a, b) => a - b);
    let verdict: InstanceAgreement["verdict"] = optimal.length === 0 ? "no-proof" : optimal.length === 1 ? "one-proof" : "agree";
    if (costs.length > 1) {
      verdict = "disagree";
      findings.push({
        kind: "optimum-disagreement",
        instance,
        configurations: optimal.map((r) => r.configuration),
        message: `proven optimal costs differ: ${optimal.map((r) => `${r.configuration} = ${r.cost}`).join(", ")}`,
      });
    }
    const lowestOptimum = costs[0];
    const highestOptimum = costs[costs.length - 1];
    for (const r of runs) {
      if (lowestOptimum !== undefined && r.status === "feasible" && r.cost !== null && r.cost < highestOptimum) {
        const claimed = optimal.filter((o) => (o.cost as number) > (r.cost as number));
        findings.push({
          kind: "plan-below-optimum",
          instance,
          configurations: [r.configuration, ...claimed.map((o) => o.configuration)],
          message: `${r.configuration} found a plan of cost ${r.cost}, cheaper than the optimum ${claimed.map((o) => `${o.cost} claimed by ${o.configuration}`).join(", ")}`,
        });
      }
      if (r.lowerBound !== null) {
        const cheaper = runs.filter((o) => hasPlan(o) && (o.cost as number) < (r.lowerBound as number));
        if (cheaper.length > 0) {
          findings.push({
            kind: "bound-above-plan",
            instance,
            configurations: [r.configuration, ...cheaper.map((o) => o.configuration)],
            message: `${r.configuration} claims lower bound ${r.lowerBound}, but ${cheaper.map((o) => `${o.configuration} has a plan of cost ${o.cost}`).join(", ")}`,
          });
        }
      }
      if (r.status === "unsolvable") {
        const withPlan = runs.filter(hasPlan);
        if (withPlan.length > 0) {
          findings.push({
            kind: "unsolvable-with-plan",
            instance,
            configurations: [r.configuration, ...withPlan.map((o) => o.configuration)],
            message: `${r.configuration} claims the task is unsolvable, but ${withPlan.map((o) => `${o.configuration} has a plan of cost ${o.cost}`).join(", ")}`,
          });
        }
      }
      if (r.audit === "rejected") {
        findings.push({
          kind: "audit-rejected",
          instance,
          configurations: [r.configuration],
          message: `the audit rejected ${r.configuration}'s own certificate${r.auditReason ? `: ${r.auditReason}` : ""}`,
        });
      }
    }
    instances.push({ instance, domain: runs[0].domain, optima, verdict });
  }
  return { instances, findings };
}

/** The loud banner printed (and shown in red in HTML) when any finding exists. */
export function findingsBanner(findings: readonly Finding[]): string {
  if (findings.length === 0) return "";
  const bar = "!".repeat(78);
  const lines = [bar, `!!  ${findings.length} DISAGREEMENT${findings.length === 1 ? "" : "S"} BETWEEN CONFIGURATIONS — THIS MEANS A BUG IN PLUMBLINE`, bar];
  for (const f of findings) lines.push(`!!  [${f.kind}] ${f.instance}: ${f.message}`);
  lines.push(bar);
  return lines.join("\n");
}
