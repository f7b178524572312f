// The HTML page of one bench run: summary tiles, findings (loud), coverage and outcome
// tables, the coverage-over-time chart, cost agreement, horizon tightness, bounds over time
// per instance, and every run in one table.
import type { BenchMeta, RunRecord } from "./record.js";
import { checkAgreement } from "./agreement.js";
import { breakdown, coverage, geometricMean, tightness } from "./summary.js";
import { boundsChart, cactusChart, tightnessChart } from "./charts.js";
import { badge, htmlTable, page, section, tile } from "./html.js";
import { colourOf, esc } from "./svg.js";
import { formatBytes, formatSeconds } from "./text-table.js";

const d = (v: number | null | undefined, digits?: number) => (v === null || v === undefined ? "–" : digits === undefined ? String(v) : v.toFixed(digits));

export interface BenchCharts {
  cactus: string;
  tightness: string;
}

/** The two summary charts (also written as stand-alone .svg files next to the report). */
export function benchCharts(records: readonly RunRecord[], meta: BenchMeta): BenchCharts {
  const cov = coverage(records, meta.configurations);
  return { cactus: cactusChart(records, cov.configurations, meta.timeLimit), tightness: tightnessChart(tightness(records), cov.configurations) };
}

export function benchReportHtml(records: readonly RunRecord[], meta: BenchMeta): string {
  const cov = coverage(records, meta.configurations);
  const configs = cov.configurations;
  const agreement = checkAgreement(records);
  const charts = benchCharts(records, meta);
  const parts: string[] = [];

  // tiles
  const best = Math.max(0, ...configs.map((c) => cov.optimal[c].total));
  const findings = agreement.findings.length;
  parts.push(
    `<div class="tiles">${[
      tile("instances", String(cov.instances.total)),
      tile("runs", String(records.length) + (meta.runs > records.length ? ` of ${meta.runs}` : "")),
      tile("configurations", String(configs.length)),
      tile("best coverage (proven optimal)", `${best} / ${cov.instances.total}`, best > 0 ? "good" : undefined),
      tile("disagreements", String(findings), findings ? "bad" : "good"),
    ].join("")}</div>`,
  );

  if (findings) {
    parts.push(
      `<div class="alarm" id="findings"><h2>⚠ ${findings} disagreement${findings === 1 ? "" : "s"} between configurations — this means a bug</h2>` +
        `<p>A proven optimum must be the same whoever proves it, no plan can be cheaper than it, and our own certificates must pass their audit. Investigate before trusting any result below.</p><ul>` +
        agreement.findings.map((f) => `<li><strong>${esc(f.instance)}</strong> [${esc(f.kind)}]: ${esc(f.message)}</li>`).join("") +
        `</ul></div>`,
    );
  }

  // coverage
  const covRows = configs.map((c) => [
    esc(c),
    ...cov.domains.map((dm) => `${cov.optimal[c][dm]}${cov.runs[c][dm] !== cov.instances[dm] ? ` <span class="note">of ${cov.runs[c][dm]} run</span>` : ""}`),
    `<strong>${cov.optimal[c].total}</strong>`,
  ]);
  parts.push(
    section(
      "Coverage: instances proven optimal",
      htmlTable(["configuration", ...cov.domains.map((dm) => `${dm} (${cov.instances[dm]})`), `total (${cov.instances.total})`], covRows) +
        `<p class="note">A run counts only when the configuration proved its plan optimal within ${meta.timeLimit} s and ${meta.memoryLimit} MB. Instance counts per domain in brackets.</p>`,
      "coverage",
    ),
  );

  const bd = breakdown(records, configs);
  parts.push(
    section(
      "Outcomes per configuration",
      htmlTable(
        ["configuration", "optimal", "feasible", "unsolvable", "unknown", "error", "audits valid", "audits rejected", "median time (optimal)", "max memory"],
        bd.map((b) => [esc(b.configuration), String(b.counts.optimal), String(b.counts.feasible), String(b.counts.unsolvable), String(b.counts.unknown), String(b.counts.error), String(b.auditValid), b.auditInvalid ? `<strong style="color:#b3261e">${b.auditInvalid}</strong>` : "0", formatSeconds(b.medianOptimalSeconds), b.maxMemory === null ? "–" : `${Math.round(b.maxMemory)} MB`]),
      ) + `<p class="note">feasible: a plan without an optimality proof; unknown: a limit was reached first; error: the run crashed or refused its input (see the run's stderr.log).</p>`,
    ),
  );

  parts.push(section("Proven-optimal coverage over time", `<figure>${charts.cactus}<figcaption>Each step is one more instance proven optimal; the red dashed line is the time limit. Further right is slower, higher is more.</figcaption></figure>`, "cactus"));

  // agreement
  const byKey = new Map(records.map((r) => [`${r.instance}\u0000${r.configuration}`, r]));
  const agreeRows = agreement.instances.map((a) => [
    esc(a.instance),
    esc(a.domain),
    ...configs.map((c) => {
      const r = byKey.get(`${a.instance}\u0000${c}`);
      if (!r) return "";
      if (r.cost === null) return r.lowerBound !== null && r.status === "unknown" ? `<span class="note">≥ ${r.lowerBound}</span>` : badge(r.status);
      return `${r.cost}${r.status === "optimal" ? " ✓" : ""}`;
    }),
    a.verdict === "disagree" ? `<strong style="color:#b3261e">DISAGREE</strong>` : esc(a.verdict),
  ]);
  parts.push(
    section(
      "Cost agreement",
      (findings ? "" : `<p class="ok">No contradictions: every instance proven optimal by several configurations has one optimal cost, and no plan or bound contradicts it.</p>`) +
        `<div class="scroll">${htmlTable(["instance", "domain", ...configs, "verdict"], agreeRows, { left: [1] })}</div><p class="note">✓ marks a proven optimum; ≥ a run stopped by a limit with only a lower bound. verdict: agree (two or more proofs, equal), one-proof (one configuration proved an optimum: nothing to compare it with), no-proof (none did), disagree (proofs of different optima: a bug).</p>`,
      "agreement",
    ),
  );

  // tightness
  const tg = tightness(records);
  const gm = configs
    .map((c) => ({ c, g: geometricMean(tg.filter((t) => t.configuration === c).map((t) => t.ratio)), n: tg.filter((t) => t.configuration === c).length }))
    .filter((x) => x.n > 0);
  parts.push(
    section(
      "Horizon tightness",
      `<figure>${charts.tightness}<figcaption>Horizon (the completeness threshold the proof used) divided by the length of the plan found. 1 would be a perfect bound; larger means a longer unrolling than the plan needed.</figcaption></figure>` +
        (gm.length ? htmlTable(["configuration", "runs", "geometric mean ratio"], gm.map((x) => [esc(x.c), String(x.n), d(x.g, 2)])) : ""),
      "tightness",
    ),
  );

  // bounds over time per instance
  const instances = [...new Set(records.map((r) => r.instance))].sort();
  const figs: string[] = [];
  for (const inst of instances) {
    const runs = records.filter((r) => r.instance === inst && r.timeline.length > 0);
    // a chart only says something when some run improved its bounds over time
    if (!runs.some((r) => r.timeline.length >= 2)) continue;
    const optima = records.filter((r) => r.instance === inst && r.status === "optimal" && r.cost !== null).map((r) => r.cost as number);
    const optimum = optima.length && optima.every((c) => c === optima[0]) ? optima[0] : null;
    const series = runs.map((r) => ({ configuration: r.configuration, timeline: r.timeline, end: r.seconds, colour: undefined as string | undefined }));
    series.forEach((s) => (s.colour = colourOf(Math.max(0, configs.indexOf(s.configuration)))));
    figs.push(`<figure>${boundsChart(inst, series, optimum)}<figcaption>${esc(inst)}</figcaption></figure>`);
  }
  const boundsBody = figs.length
    ? (figs.length > 12 ? `<div class="charts">${figs.slice(0, 12).join("")}</div><details><summary>${figs.length - 12} more instances</summary><div class="charts">${figs.slice(12).join("")}</div></details>` : `<div class="charts">${figs.join("")}</div>`) +
      `<p class="note">Solid: cost of the best plan known at that time; dashed: the best proven lower bound. They meet when optimality is proven. A* reports its bounds only when it stops (one point).</p>`
    : `<p class="note">No run reported bounds improving over time (A* reports its bounds only when it stops; the table below has them).</p>`;
  parts.push(section("Bounds over time", boundsBody, "bounds"));

  // all runs
  const runRows = [...records]
    .sort((a, b) => a.instance.localeCompare(b.instance) || configs.indexOf(a.configuration) - configs.indexOf(b.configuration))
    .map((r) => [
      esc(r.instance),
      esc(r.configuration),
      badge(r.status),
      d(r.cost),
      d(r.lowerBound),
      d(r.horizon),
      d(r.planLength),
      formatSeconds(r.seconds),
      r.memory === null ? "–" : `${Math.round(r.memory)} MB`,
      formatBytes(r.proofBytes),
      r.audit === "none" ? `<span class="s-none">none</span>` : badge(r.audit),
      formatSeconds(r.auditSeconds),
      `<span class="note">${esc(r.reason ?? r.auditReason ?? "")}</span>`,
    ]);
  parts.push(
    section(
      "All runs",
      `<div class="scroll">${htmlTable(["instance", "configuration", "status", "cost", "lower bound", "horizon", "plan length", "time", "peak memory", "proof", "audit", "audit time", "note"], runRows, { left: [1, 12] })}</div>` +
        `<p class="note">Each run's output, stderr and certificate are in its folder under runs/ next to this page; results.jsonl holds every field.</p>`,
      "runs",
    ),
  );

  parts.push(
    section(
      "About this run",
      htmlTable(
        ["setting", "value"],
        [
          ["suite", esc(meta.suite)],
          ["suite file", `<code>${esc(meta.suiteFile)}</code>`],
          ["configurations", esc(meta.configurations.join(", "))],
          ["time limit per run", `${meta.timeLimit} s`],
          ["memory limit per run", `${meta.memoryLimit} MB`],
          ["parallel runs", String(meta.jobs)],
          ["machine", esc(`${meta.host}, ${meta.cpus} CPU${meta.cpus === 1 ? "" : "s"}, Node ${meta.node}`)],
          ["started", esc(meta.createdAt)],
          ["plumbline", esc(meta.toolVersion)],
        ],
        { left: [1] },
      ) + `<p class="note">Times are wall-clock seconds of each run's own process, on a machine that may have been shared; compare configurations within one bench run, not across machines.</p>`,
    ),
  );

  const subtitle = `${esc(meta.suite)} · ${records.length} runs · ${configs.length} configuration${configs.length === 1 ? "" : "s"} · limits ${meta.timeLimit} s / ${meta.memoryLimit} MB · ${esc(meta.createdAt)}`;
  return page(`plumbline bench: ${meta.suite}`, subtitle, parts.join("\n"));
}
