// `npm run bench:horizon`: how tight each completeness threshold is — the horizon by every
// method beside the shortest cost-optimal plan length, their ratio, and geometric means.
//
// Usage: tsx benchmarks/scripts/bench-horizon.ts [DIR] [--time-limit S] [--max-states N] [--out FILE.json]
//   DIR (default benchmarks/domains): every folder holding domain.pddl contributes its other
//   *.pddl files as problems; a folder of domain-NN.pddl / problem-NN.pddl pairs is paired by NN.
// Columns: C = cost of the first plan (greedy best-first search), the horizon for "cheaper than
// C" by each method, L = fewest actions among cost-optimal plans (exact, from the explicit state
// graph; "≥" marks an A* plan's length when the graph is too large, which flatters the ratio),
// H/L, H*/L where H* is the horizon for C = optimum + 1 (a completeness threshold must then
// admit an optimal plan, so H*/L < 1 would be a soundness bug), Hs/L where Hs is the horizon
// for C without the optimal-length method, and Hg/L where Hg uses no explicit state space at all
// (cost counting, zero-cost segments and compositional projections only: the general bounds),
// and Hs*/L: the horizon without the optimal-length method for C = optimum + 1 (what the final
// proof of an optimal plan needs, once the optimizer has found it).
import { mkdirSync, readdirSync, statSync } from "node:fs";
import { basename, dirname, join, resolve } from "node:path";
import { groundFiles } from "../../src/ground/index.js";
import type { Task } from "../../src/ground/task.js";
import { computeHorizon, type HorizonReport } from "../../src/horizon/index.js";
import { optimalPlan, reachableGraph } from "../../src/measure/index.js";
import { astar, gbfs } from "../../src/search/index.js";
import { isPlumblineError } from "../../src/util/errors.js";
import { writeFileAtomic } from "../../src/util/files.js";

interface Instance {
  name: string;
  domain: string;
  problem: string;
}

interface Row {
  instance: string;
  facts: number;
  actions: number;
  zeroCost: number;
  C: number | null;
  optimum: number | null;
  length: number | null;
  lengthSource: "exact" | "astar" | "none";
  methods: Record<string, string | null>;
  horizon: string | null;
  winner: string | null;
  ratio: number | null;
  horizonAtOptimum: string | null;
  ratioAtOptimum: number | null;
  /** Horizon for C by the structural methods only (optimal-length disabled). */
  structural: string | null;
  structuralWinner: string | null;
  ratioStructural: number | null;
  /** Horizon for C by the general bounds only (no explicit state space: no exact search, no reachable-state count). */
  general: string | null;
  generalWinner: string | null;
  ratioGeneral: number | null;
  /** Horizon without the optimal-length method for C = optimum + 1. */
  structuralAtOptimum: string | null;
  ratioStructuralAtOptimum: number | null;
  groundSeconds: number;
  horizonSeconds: number;
  structuralSeconds: number;
  note?: string;
}

function parseArgs(argv: string[]) {
  let dir = "benchmarks/domains";
  let timeLimit = 30;
  let maxStates = 400_000;
  let out: string | null = "benchmarks/results/horizon/latest.json";
  for (let i = 0; i < argv.length; i++) {
    const a = argv[i];
    if (a === "--time-limit") timeLimit = Number(argv[++i]);
    else if (a === "--max-states") maxStates = Number(argv[++i]);
    else if (a === "--out") out = argv[++i];
    else if (a === "--no-out") out = null;
    else if (a.startsWith("--")) throw new Error(`unknown option ${a}`);
    else dir = a;
  }
  if (!(timeLimit > 0) || !(maxStates > 0)) throw new Error("--time-limit and --max-states must be positive");
  return { dir: resolve(dir), timeLimit, maxStates, out };
}

/** Instances under `root`, sorted by name. */
function findInstances(root: string): Instance[] {
  const out: Instance[] = [];
  const walk = (d: string) => {
    const names = readdirSync(d).sort();
    const pddl = names.filter((n) => n.endsWith(".pddl"));
    if (names.includes("domain.pddl")) {
      for (const p of pddl) if (p !== "domain.pddl" && !p.startsWith("domain")) out.push({ name: `${basename(d)}/${p.replace(/\.pddl$/, "")}`, domain: join(d, "domain.pddl"), problem: join(d, p) });
    } else {
      for (const p of pddl) {
        const m = /^problem-?(\w+)\.pddl$/.exec(p);
        if (m && names.includes(`domain-${m[1]}.pddl`)) out.push({ name: `${basename(d)}/${p.replace(/\.pddl$/, "")}`, domain: join(d, `domain-${m[1]}.pddl`), problem: join(d, p) });
      }
    }
    for (const n of names) {
      const p = join(d, n);
      if (statSync(p).isDirectory() && !n.startsWith(".") && n !== "node_modules") walk(p);
    }
  };
  walk(root);
  return out;
}

function shortestOptimal(task: Task, maxStates: number, deadline: number): { cost: number | null; length: number | null; source: Row["lengthSource"] } {
  try {
    const g = reachableGraph(task, maxStates);
    const o = optimalPlan(g);
    return { cost: o.cost, length: o.length, source: o.cost === null ? "none" : "exact" };
  } catch (e) {
    if (!isPlumblineError(e)) throw e;
  }
  const r = astar(task, { heuristic: "landmark-cut", deadline });
  if (r.status === "solved") return { cost: r.cost, length: r.plan!.length, source: "astar" };
  return { cost: null, length: null, source: "none" };
}

function value(r: HorizonReport, method: string): string | null {
  const m = r.methods.find((x) => x.method === method);
  return m && m.value !== null ? m.valueText : null;
}

const short = (t: string | null) => (t === null ? "-" : t.length > 9 ? `${t.slice(0, 3)}e${t.length - 1}` : t);

function runInstance(inst: Instance, timeLimit: number, maxStates: number): Row {
  const { task, seconds: groundSeconds } = groundFiles(inst.domain, inst.problem);
  const zeroCost = task.actions.filter((a) => a.cost === 0).length;
  const row: Row = {
    instance: inst.name,
    facts: task.facts.length,
    actions: task.actions.length,
    zeroCost,
    C: null,
    optimum: null,
    length: null,
    lengthSource: "none",
    methods: {},
    horizon: null,
    winner: null,
    ratio: null,
    horizonAtOptimum: null,
    ratioAtOptimum: null,
    structural: null,
    structuralWinner: null,
    ratioStructural: null,
    general: null,
    generalWinner: null,
    ratioGeneral: null,
    structuralAtOptimum: null,
    ratioStructuralAtOptimum: null,
    groundSeconds,
    horizonSeconds: 0,
    structuralSeconds: 0,
  };
  const first = gbfs(task, { deadline: Date.now() + timeLimit * 1000 });
  if (first.status !== "solved") {
    row.note = `no first plan (${first.status})`;
    return row;
  }
  row.C = first.cost;
  const t0 = performance.now();
  const rep = computeHorizon(task, first.cost!);
  row.horizonSeconds = (performance.now() - t0) / 1000;
  for (const m of rep.methods) row.methods[m.method] = m.value === null ? null : m.valueText;
  row.horizon = rep.horizonText;
  row.winner = rep.winner;
  const t1 = performance.now();
  const st = computeHorizon(task, first.cost!, { maxOptimalStates: 0 });
  row.structuralSeconds = (performance.now() - t1) / 1000;
  row.structural = st.horizonText;
  row.structuralWinner = st.winner;
  const gen = computeHorizon(task, first.cost!, { maxOptimalStates: 0, maxExplicitStates: 1 });
  row.general = gen.horizonText;
  row.generalWinner = gen.winner;
  const opt = shortestOptimal(task, maxStates, Date.now() + timeLimit * 1000);
  row.optimum = opt.cost;
  row.length = opt.length;
  row.lengthSource = opt.source;
  if (opt.length !== null && opt.length > 0 && Number.isFinite(rep.horizon)) row.ratio = rep.horizon / opt.length;
  if (opt.length !== null && opt.length > 0 && Number.isFinite(st.horizon)) row.ratioStructural = st.horizon / opt.length;
  if (opt.length !== null && opt.length > 0 && Number.isFinite(gen.horizon)) row.ratioGeneral = gen.horizon / opt.length;
  if (opt.cost !== null) {
    const atOpt = computeHorizon(task, opt.cost + 1);
    row.horizonAtOptimum = atOpt.horizonText;
    if (opt.length !== null && opt.length > 0 && Number.isFinite(atOpt.horizon)) row.ratioAtOptimum = atOpt.horizon / opt.length;
    const stOpt = computeHorizon(task, opt.cost + 1, { maxOptimalStates: 0 });
    row.structuralAtOptimum = stOpt.horizonText;
    if (opt.length !== null && opt.length > 0 && Number.isFinite(stOpt.horizon)) row.ratioStructuralAtOptimum = stOpt.horizon / opt.length;
  }
  return row;
}

function geomean(xs: number[]): number | null {
  if (xs.length === 0) return null;
  return Math.exp(xs.reduce((s, x) => s + Math.log(x), 0) / xs.length);
}

function main(): void {
  const { dir, timeLimit, maxStates, out } = parseArgs(process.argv.slice(2));
  const instances = findInstances(dir);
  if (instances.length === 0) throw new Error(`no instances under ${dir}`);
  const rows: Row[] = [];
  const header = ["instance", "facts", "acts", "zero", "C", "opt", "L", "cost", "zero-cost", "compos.", "exact", "H", "winner", "H/L", "H*/L", "Hs", "Hs/L", "Hs winner", "Hg", "Hg/L", "Hg winner", "Hs*/L", "sec", "sec s"];
  const widths = [26, 6, 6, 5, 5, 5, 5, 7, 9, 9, 6, 7, 16, 6, 6, 7, 6, 13, 7, 6, 13, 6, 5, 5];
  const left = new Set([0, 12, 17, 20]);
  const line = (cells: string[]) => cells.map((c, i) => (left.has(i) ? c.padEnd(widths[i]) : c.padStart(widths[i]))).join(" ");
  console.log(`horizon tightness on ${instances.length} instances under ${dir} (first plan by GBFS, ${timeLimit} s limits)`);
  console.log(line(header));
  for (const inst of instances) {
    let row: Row;
    try {
      row = runInstance(inst, timeLimit, maxStates);
    } catch (e) {
      console.log(line([inst.name, "error: " + (e instanceof Error ? e.message.split("\n")[0] : String(e))]));
      continue;
    }
    rows.push(row);
    const L = row.length === null ? "-" : `${row.lengthSource === "astar" ? "≥" : ""}${row.length}`;
    console.log(
      line([
        row.instance.slice(0, 26),
        String(row.facts),
        String(row.actions),
        String(row.zeroCost),
        String(row.C ?? "-"),
        String(row.optimum ?? "-"),
        L,
        short(row.methods.cost ?? null),
        short(row.methods["zero-cost"] ?? null),
        short(row.methods.compositional ?? null),
        short(row.methods["optimal-length"] ?? null),
        short(row.horizon),
        row.winner ?? "-",
        row.ratio === null ? "-" : row.ratio.toFixed(2),
        row.ratioAtOptimum === null ? "-" : row.ratioAtOptimum.toFixed(2),
        short(row.structural),
        row.ratioStructural === null ? "-" : row.ratioStructural.toFixed(2),
        row.structuralWinner ?? "-",
        short(row.general),
        row.ratioGeneral === null ? "-" : row.ratioGeneral.toFixed(2),
        row.generalWinner ?? "-",
        row.ratioStructuralAtOptimum === null ? "-" : row.ratioStructuralAtOptimum.toFixed(2),
        row.horizonSeconds.toFixed(1),
        row.structuralSeconds.toFixed(1),
      ]) + (row.note ? `  (${row.note})` : ""),
    );
  }
  const ratios = rows.flatMap((r) => (r.ratio === null ? [] : [r.ratio]));
  const atOpt = rows.flatMap((r) => (r.ratioAtOptimum === null ? [] : [r.ratioAtOptimum]));
  const structural = rows.flatMap((r) => (r.ratioStructural === null ? [] : [r.ratioStructural]));
  const gm = geomean(ratios);
  const gmOpt = geomean(atOpt);
  const gmStructural = geomean(structural);
  const general = rows.flatMap((r) => (r.ratioGeneral === null ? [] : [r.ratioGeneral]));
  const gmGeneral = geomean(general);
  const structuralAtOpt = rows.flatMap((r) => (r.ratioStructuralAtOptimum === null ? [] : [r.ratioStructuralAtOptimum]));
  const gmStructuralAtOpt = geomean(structuralAtOpt);
  const below = rows.filter((r) => r.ratioAtOptimum !== null && r.ratioAtOptimum < 1 && r.lengthSource === "exact");
  const groundTotal = rows.reduce((s, r) => s + r.groundSeconds, 0);
  const horizonTotal = rows.reduce((s, r) => s + r.horizonSeconds, 0);
  console.log("");
  console.log(`geometric mean H/L  = ${gm === null ? "-" : gm.toFixed(2)} over ${ratios.length} instances (target ≤ 4)`);
  console.log(`geometric mean H*/L = ${gmOpt === null ? "-" : gmOpt.toFixed(2)} over ${atOpt.length} instances (H* for C = optimum + 1; must be ≥ 1)`);
  console.log(`geometric mean Hs/L = ${gmStructural === null ? "-" : gmStructural.toFixed(2)} over ${structural.length} instances (without the optimal-length method)`);
  console.log(`geometric mean Hg/L = ${gmGeneral === null ? "-" : gmGeneral.toFixed(2)} over ${general.length} instances (general bounds only: no explicit state space at all)`);
  console.log(`geometric mean Hs*/L = ${gmStructuralAtOpt === null ? "-" : gmStructuralAtOpt.toFixed(2)} over ${structuralAtOpt.length} instances (without the optimal-length method, C = optimum + 1)`);
  const wins = (key: "winner" | "structuralWinner" | "generalWinner") => {
    const n = new Map<string, number>();
    for (const r of rows) if (r[key]) n.set(r[key]!, (n.get(r[key]!) ?? 0) + 1);
    return [...n].sort((a, b) => b[1] - a[1] || (a[0] < b[0] ? -1 : 1)).map(([m, c]) => `${m} ${c}`).join(", ");
  };
  console.log(`winning methods: H: ${wins("winner")}; Hs: ${wins("structuralWinner")}; Hg: ${wins("generalWinner")}`);
  const maxSeconds = rows.reduce((m, r) => Math.max(m, r.horizonSeconds), 0);
  console.log(`horizon computation: ${horizonTotal.toFixed(1)} s in total, at most ${maxSeconds.toFixed(1)} s for one instance`);
  console.log(`horizon time / grounding time = ${groundTotal > 0 ? (horizonTotal / groundTotal).toFixed(2) : "-"} (same run)`);
  if (below.length > 0) console.log(`SOUNDNESS ALARM: H*/L < 1 on ${below.map((r) => r.instance).join(", ")}`);
  if (out) {
    mkdirSync(dirname(out), { recursive: true });
    writeFileAtomic(out, JSON.stringify({ dir, timeLimit, maxStates, geometricMean: gm, geometricMeanAtOptimum: gmOpt, geometricMeanStructural: gmStructural, geometricMeanGeneral: gmGeneral, geometricMeanStructuralAtOptimum: gmStructuralAtOpt, rows }, null, 2) + "\n");
    console.log(`rows written to ${out}`);
  }
  if (below.length > 0) process.exitCode = 1;
}

main();
