// Counts behind the tables and charts: proven-optimal coverage per configuration and domain,
// status breakdowns, and the horizon tightness ratios — computed once, shown as text and HTML.
import type { RunRecord, RunStatus } from "./record.js";
import { RUN_STATUSES } from "./record.js";

export interface Coverage {
  configurations: string[];
  domains: string[];
  /** instances per domain (distinct instance names seen in the records of that domain). */
  instances: Record<string, number>;
  /** proven optimal count: [configuration][domain], plus "total". */
  optimal: Record<string, Record<string, number>>;
  /** runs per [configuration][domain] (a configuration may not run on every instance). */
  runs: Record<string, Record<string, number>>;
}

const uniq = (xs: string[]) => [...new Set(xs)];

/** Configurations in the order they first appear (the suite's order), domains sorted. */
export function coverage(records: readonly RunRecord[], configOrder?: readonly string[]): Coverage {
  const seen = uniq(records.map((r) => r.configuration));
  const configurations = configOrder ? [...configOrder.filter((c) => seen.includes(c)), ...seen.filter((c) => !configOrder.includes(c))] : seen;
  const domains = uniq(records.map((r) => r.domain)).sort();
  const instances: Record<string, number> = { total: uniq(records.map((r) => r.instance)).length };
  for (const d of domains) instances[d] = uniq(records.filter((r) => r.domain === d).map((r) => r.instance)).length;
  const optimal: Coverage["optimal"] = {};
  const runs: Coverage["runs"] = {};
  for (const c of configurations) {
    optimal[c] = { total: 0 };
    runs[c] = { total: 0 };
    for (const d of domains) {
      optimal[c][d] = 0;
      runs[c][d] = 0;
    }
  }
  for (const r of records) {
    runs[r.configuration][r.domain]++;
    runs[r.configuration].total++;
    if (r.status === "optimal") {
      optimal[r.configuration][r.domain]++;
      optimal[r.configuration].total++;
    }
  }
  return { configurations, domains, instances, optimal, runs };
}

/** Status counts per configuration, plus audits and the summed time of proven runs. */
export interface ConfigBreakdown {
  configuration: string;
  counts: Record<RunStatus, number>;
  auditValid: number;
  auditInvalid: number;
  /** Median wall seconds over proven-optimal runs (null when none). */
  medianOptimalSeconds: number | null;
  /** Largest peak memory in MB over all runs. */
  maxMemory: number | null;
}

export function breakdown(records: readonly RunRecord[], configurations: readonly string[]): ConfigBreakdown[] {
  return configurations.map((configuration) => {
    const rs = records.filter((r) => r.configuration === configuration);
    const counts = Object.fromEntries(RUN_STATUSES.map((s) => [s, 0])) as Record<RunStatus, number>;
    for (const r of rs) counts[r.status]++;
    const times = rs.filter((r) => r.status === "optimal").map((r) => r.seconds).sort((a, b) => a - b);
    const mems = rs.map((r) => r.memory).filter((m): m is number => m !== null);
    return {
      configuration,
      counts,
      auditValid: rs.filter((r) => r.audit === "valid").length,
      auditInvalid: rs.filter((r) => r.audit === "rejected").length,
      medianOptimalSeconds: median(times),
      maxMemory: mems.length ? Math.max(...mems) : null,
    };
  });
}

export function median(sorted: readonly number[]): number | null {
  if (sorted.length === 0) return null;
  const m = sorted.length >> 1;
  return sorted.length % 2 ? sorted[m] : (sorted[m - 1] + sorted[m]) / 2;
}

export interface Tightness {
  instance: string;
  configuration: string;
  horizon: number;
  planLength: number;
  ratio: number;
}

/** Horizon / plan length of every run that has both (plan length > 0). */
export function tightness(records: readonly RunRecord[]): Tightness[] {
  return records
    .filter((r) => r.horizon !== null && r.planLength !== null && r.planLength > 0 && (r.status === "optimal" || r.status === "feasible"))
    .map((r) => ({ instance: r.instance, configuration: r.configuration, horizon: r.horizon as number, planLength: r.planLength as number, ratio: (r.horizon as number) / (r.planLength as number) }));
}

/** Geometric mean (null for an empty list). */
export function geometricMean(xs: readonly number[]): number | null {
  if (xs.length === 0) return null;
  return Math.exp(xs.reduce((s, x) => s + Math.log(x), 0) / xs.length);
}
