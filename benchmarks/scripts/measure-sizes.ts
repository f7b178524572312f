// Measures (does not test) CNF sizes of every step encoding on the scenario instances, with and
// without mutex groups: `npx tsx benchmarks/scripts/measure-sizes.ts [--steps T] [--solve S] [DOMAIN PROBLEM ...]`.
// --solve S also runs bound tightening with the built-in solver (S seconds per CNF at most).
import { readFileSync } from "node:fs";
import { pairReachability, findVariables } from "../../src/analyse/index.js";
import { encodePlanning, extractPlan, STEP_ENCODINGS } from "../../src/encode/index.js";
import { groundFiles } from "../../src/ground/index.js";
import { Solver } from "../../src/sat/index.js";

interface Job {
  label: string;
  domain: string;
  problem: string;
  steps: number;
}

const args = process.argv.slice(2);
let fixedSteps: number | null = null;
const si = args.indexOf("--steps");
if (si >= 0) {
  fixedSteps = Number(args[si + 1]);
  args.splice(si, 2);
}
let solveSeconds = 0;
const vi = args.indexOf("--solve");
if (vi >= 0) {
  solveSeconds = Number(args[vi + 1]);
  args.splice(vi, 2);
}
const jobs: Job[] = [];
if (args.length > 0) {
  for (let i = 0; i + 1 < args.length; i += 2) jobs.push({ label: args[i + 1], domain: args[i], problem: args[i + 1], steps: fixedSteps ?? 10 });
} else {
  for (const sc of ["harbour", "warehouse", "workshop"]) {
    const dir = `benchmarks/domains/${sc}`;
    const inst = JSON.parse(readFileSync(`${dir}/instances.json`, "utf8")) as Record<string, { optimalLength: number }>;
    for (const [name, v] of Object.entries(inst)) jobs.push({ label: `${sc}/${name}`, domain: `${dir}/domain.pddl`, problem: `${dir}/${name}.pddl`, steps: fixedSteps ?? v.optimalLength });
  }
}

/** Bound tightening from "any plan" down to UNSAT; returns "best cost / seconds / status". */
function tighten(enc: ReturnType<typeof encodePlanning>, task: Parameters<typeof extractPlan>[0]): string {
  const s = new Solver();
  const t0 = performance.now();
  const deadline = Date.now() + solveSeconds * 1000;
  enc.streamTo(s);
  let B = enc.maxSum;
  let best: number | null = null;
  for (;;) {
    const r = s.solve(enc.boundAssumptions(B), { deadline });
    if (r !== "sat") return `${best ?? "-"} ${((performance.now() - t0) / 1000).toFixed(2)}s ${r === "unsat" ? "proved" : "limit"}`;
    best = extractPlan(task, enc, (v) => s.value(v) === true).cost;
    B = best - 1;
    if (B < 0) return `${best} ${((performance.now() - t0) / 1000).toFixed(2)}s proved`;
  }
}

const rows: string[][] = [["instance", "facts", "actions", "T", "groups", "encoding", "vars", "clauses", "literals", "step-rule cl.", "cost cl.", "mutex cl.", "ms", ...(solveSeconds > 0 ? ["best / solve"] : [])]];
for (const job of jobs) {
  const { task } = groundFiles(job.domain, job.problem);
  const groups = findVariables(task, pairReachability(task))
    .variables.map((v) => v.facts)
    .filter((g) => g.length > 1);
  for (const withGroups of [false, true]) {
    for (const id of STEP_ENCODINGS) {
      const t0 = performance.now();
      const enc = encodePlanning(task, { encoding: id, steps: job.steps, mutexGroups: withGroups ? groups : [] });
      const ms = performance.now() - t0;
      const p = enc.stats.clausesByPart;
      rows.push([
        job.label,
        String(task.facts.length),
        String(task.actions.length),
        String(job.steps),
        withGroups ? String(groups.length) : "-",
        id,
        String(enc.numVars),
        String(enc.numClauses),
        String(enc.stats.literals),
        String(p["step-rules"] ?? 0),
        String((p["cost-inputs"] ?? 0) + (p.adder ?? 0) + (p.comparator ?? 0)),
        String(p.mutex ?? 0),
        ms.toFixed(1),
        ...(solveSeconds > 0 ? [tighten(enc, task)] : []),
      ]);
    }
  }
}
const widths = rows[0].map((_, c) => Math.max(...rows.map((r) => r[c].length)));
for (const r of rows) process.stdout.write(r.map((x, c) => (c < 1 || c === 5 ? x.padEnd(widths[c]) : x.padStart(widths[c]))).join("  ") + "\n");
