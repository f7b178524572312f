// `npm run bench:formulas`: the optimality proof query alone, per formula id, on the scenario
// instances — the formula the optimizer builds at the threshold H(C*) of the optimal cost C*
// (instances.json), asked "cost ≤ C* − 1" from scratch with the built-in solver.
//
// Usage: tsx benchmarks/scripts/bench-formulas.ts [--sizes small,medium] [--only TEXT] [--limit S]
//          [--formulas ID,ID,…] [--proof] [--seeds N] [--json FILE]
//   An ID is a formula id (forall-1+cost-unary-1+…), a bare step encoding (cost chosen by size, no
//   parts) or "units:<id>" for reach-1 as plain unit clauses without simplification (measurement
//   only). --proof also writes the DRAT proof (to a temporary file). --seeds N solves each formula
//   with solver seeds 0..N−1 and reports medians (equivalent formulas vary a lot between seeds).
//   The first formula is the reference: every row shows its median seconds and conflicts as a
//   ratio to the reference's on the same instance, and the summary the geometric mean of those
//   ratios over the instances both refute (ratios, not seconds, compare between runs).
import { mkdirSync, readFileSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join, resolve } from "node:path";
import { prepareTask } from "../../src/analyse/index.js";
import { chooseCostEncoding, encodePlanning, extractPlan } from "../../src/encode/index.js";
import { groundFiles } from "../../src/ground/index.js";
import { computeHorizon } from "../../src/horizon/index.js";
import { boundSettings, encodeOptionsOf, formulaId, OPTIMIZE_GROUNDING, parseFormulaId, type FormulaSpec } from "../../src/optimize/index.js";
import { FileProofWriter, Solver } from "../../src/sat/index.js";
import { writeFileAtomic } from "../../src/util/files.js";

const args = process.argv.slice(2);
const value = (name: string, dflt: string): string => {
  const i = args.indexOf(name);
  return i >= 0 ? args[i + 1] : dflt;
};
const sizes = value("--sizes", "small,medium").split(",");
const only = value("--only", "");
const limit = Number(value("--limit", "120"));
const withProof = args.includes("--proof");
const seeds = Number(value("--seeds", "1"));
const formulas = value("--formulas", "forall-1+cost-adder-1,forall-1+cost-adder-1+empty-steps-last-1,forall-1+cost-unary-1+empty-steps-last-1,forall-1+cost-unary-1+reach-1+empty-steps-last-1").split(",");
const jsonOut = value("--json", resolve(import.meta.dirname, "../results/formulas/latest.json"));
const domains = resolve(import.meta.dirname, "../domains");

interface Row {
  instance: string;
  optimum: number;
  horizon: number;
  formula: string;
  vars: number;
  clauses: number;
  costClauses: number;
  result: string;
  conflicts: number;
  seconds: number;
  conflictsPerSeed: number[];
}

const med = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor((xs.length - 1) / 2)];
const rows: Row[] = [];
const header = ["instance", "C*", "H", "formula", "vars", "clauses", "cost cl.", "result", "conflicts", "s", "× conflicts", "× s", "conflicts per seed"];
process.stdout.write(header.join("\t") + "\n");
for (const sc of ["harbour", "warehouse", "workshop"]) {
  const dir = join(domains, sc);
  const inst = JSON.parse(readFileSync(join(dir, "instances.json"), "utf8")) as Record<string, { optimalCost: number; size: string }>;
  for (const [name, v] of Object.entries(inst)) {
    const label = `${sc}/${name}`;
    if (!sizes.includes(v.size) || (only && !label.includes(only))) continue;
    const { task } = groundFiles(join(dir, "domain.pddl"), join(dir, `${name}.pddl`), OPTIMIZE_GROUNDING);
    const prepared = prepareTask(task);
    const C = v.optimalCost;
    const H = computeHorizon(task, C).horizon;
    const groups = prepared.variables.variables.filter((x) => x.facts.length > 1).map((x) => [...x.facts]);
    let reference: Row | null = null;
    for (const cfg of formulas) {
      const units = cfg.startsWith("units:");
      const id = parseFormulaId(units ? cfg.slice(6) : cfg);
      const spec: FormulaSpec = { encoding: id.encoding, cost: id.cost ?? "cost-adder-1", steps: H, ...boundSettings(C), mutexGroups: groups, parts: id.parts ?? [] };
      if (id.cost === null) spec.cost = chooseCostEncoding(prepared.task, encodeOptionsOf(spec)).id;
      const enc = encodePlanning(prepared.task, { ...encodeOptionsOf(spec), reachMode: units ? "units" : "simplify" });
      const proofPath = join(tmpdir(), `bench-formulas-${process.pid}.drat`);
      const runs: Array<{ r: string; conflicts: number; secs: number }> = [];
      for (let seed = 0; seed < seeds; seed++) {
        const t0 = performance.now();
        const solver = new Solver({ seed, proof: withProof ? new FileProofWriter(proofPath, "binary") : null });
        enc.streamTo(solver);
        const r = solver.solve(enc.boundAssumptions(C - 1), { deadline: Date.now() + limit * 1000 });
        const secs = (performance.now() - t0) / 1000;
        if (r === "sat") {
          // a model below the recorded optimum would be a bug somewhere: show it loudly
          const p = extractPlan(prepared.task, enc, (x) => solver.value(x) === true);
          process.stderr.write(`!!! ${label} ${cfg}: SAT with a plan of cost ${p.cost} below C* = ${C}\n`);
        }
        runs.push({ r, conflicts: solver.stats().conflicts, secs });
      }
      rmSync(proofPath, { force: true });
      const p = enc.stats.clausesByPart;
      const row: Row = {
        instance: label,
        optimum: C,
        horizon: H,
        formula: (units ? "units:" : "") + formulaId(spec),
        vars: enc.numVars,
        clauses: enc.numClauses,
        costClauses: (p["cost-inputs"] ?? 0) + (p.adder ?? 0) + (p.comparator ?? 0) + (p.unary ?? 0),
        result: runs.every((x) => x.r === runs[0].r) ? runs[0].r : runs.map((x) => x.r).join("/"),
        conflicts: med(runs.map((x) => x.conflicts)),
        seconds: med(runs.map((x) => x.secs)),
        conflictsPerSeed: runs.map((x) => x.conflicts),
      };
      reference ??= row;
      rows.push(row);
      const ratio = (x: number, y: number) => (reference!.result === "unsat" && row.result === "unsat" ? (x / Math.max(y, 1e-9)).toFixed(2) : "-");
      process.stdout.write(
        [row.instance, row.optimum, row.horizon, row.formula, row.vars, row.clauses, row.costClauses, row.result, row.conflicts, row.seconds.toFixed(1), ratio(row.conflicts, reference.conflicts), ratio(row.seconds, reference.seconds), row.conflictsPerSeed.join(",")].join("\t") + "\n",
      );
    }
  }
}

// geometric means of the ratios to the reference, over instances both refuted
const summary: Record<string, { instances: number; seconds: number | null; conflicts: number | null }> = {};
for (const cfg of formulas.slice(1)) {
  const logs = { s: [] as number[], c: [] as number[] };
  const refs = rows.filter((r) => r === rows.find((x) => x.instance === r.instance));
  let label = cfg;
  for (const ref of refs) {
    const mine = rows.filter((r) => r.instance === ref.instance)[formulas.indexOf(cfg)];
    if (!mine) continue;
    label = mine.formula;
    if (ref.result !== "unsat" || mine.result !== "unsat") continue;
    logs.s.push(Math.log(Math.max(mine.seconds, 1e-3) / Math.max(ref.seconds, 1e-3)));
    logs.c.push(Math.log(Math.max(mine.conflicts, 1) / Math.max(ref.conflicts, 1)));
  }
  const gm = (xs: number[]) => (xs.length === 0 ? null : Math.exp(xs.reduce((a, b) => a + b, 0) / xs.length));
  summary[label] = { instances: logs.s.length, seconds: gm(logs.s), conflicts: gm(logs.c) };
  process.stdout.write(`\n${label} vs ${rows[0]?.formula ?? formulas[0]}: geometric mean × seconds ${summary[label].seconds?.toFixed(2) ?? "-"}, × conflicts ${summary[label].conflicts?.toFixed(2) ?? "-"} over ${logs.s.length} instances both refuted`);
}
process.stdout.write("\n");
mkdirSync(resolve(jsonOut, ".."), { recursive: true });
writeFileAtomic(jsonOut, JSON.stringify({ sizes, limit, seeds, proof: withProof, formulas, rows, summary }, null, 2) + "\n");
