// Measures (does not test) the optimality proof query per formula configuration: on each scenario
// instance, the formula the optimizer builds at the completeness threshold H(C*) of the optimal
// cost C* (instances.json), asked "cost ≤ C* − 1" from scratch with the built-in solver.
// `npx tsx test/encode/measure-proof.ts [--sizes small,medium] [--only TEXT] [--limit S]
//   [--configs ID,ID,…] [--proof] [--seeds N]` — an ID is a formula id (forall-1+cost-unary-1+…) or
//   "units:<id>" for reach-1 as plain unit clauses without simplification (measurement only).
//   --seeds N solves each formula with solver seeds 0..N−1 and prints the medians (conflicts
//   and seconds vary a lot between equivalent formulas; the median of a few seeds is steadier).
import { readFileSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { prepareTask } from "../../src/analyse/index.js";
import { chooseCostEncoding, encodePlanning, extractPlan } from "../../src/encode/index.js";
import { groundFiles } from "../../src/ground/index.js";
import { computeHorizon } from "../../src/horizon/index.js";
import { boundSettings, encodeOptionsOf, OPTIMIZE_GROUNDING, parseFormulaId, type FormulaSpec } from "../../src/optimize/index.js";
import { FileProofWriter, Solver } from "../../src/sat/index.js";

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
const configs = value("--configs", "forall-1+cost-adder-1+empty-steps-last-1,forall-1+cost-unary-1+empty-steps-last-1,forall-1+cost-unary-1+reach-1+empty-steps-last-1").split(",");

const rows: string[][] = [["instance", "C*", "H", "config", "vars", "clauses", "cost cl.", "result", "conflicts", "decisions", "s", "conflicts per seed"]];
const print = (r: string[]) => process.stdout.write(r.join("\t") + "\n");
print(rows[0]);
for (const sc of ["harbour", "warehouse", "workshop"]) {
  const dir = `benchmarks/domains/${sc}`;
  const inst = JSON.parse(readFileSync(`${dir}/instances.json`, "utf8")) as Record<string, { optimalCost: number; size: string }>;
  for (const [name, v] of Object.entries(inst)) {
    const label = `${sc}/${name}`;
    if (!sizes.includes(v.size) || (only && !label.includes(only))) continue;
    const { task } = groundFiles(`${dir}/domain.pddl`, `${dir}/${name}.pddl`, OPTIMIZE_GROUNDING);
    const prepared = prepareTask(task);
    const C = v.optimalCost;
    const H = computeHorizon(task, C).horizon;
    const groups = prepared.variables.variables.filter((x) => x.facts.length > 1).map((x) => [...x.facts]);
    for (const cfg of configs) {
      const units = cfg.startsWith("units:");
      const id = parseFormulaId(units ? cfg.slice(6) : cfg);
      const spec: FormulaSpec = { encoding: id.encoding, cost: id.cost ?? "cost-adder-1", steps: H, ...boundSettings(C), mutexGroups: groups, parts: id.parts ?? [] };
      if (id.cost === null) spec.cost = chooseCostEncoding(prepared.task, encodeOptionsOf(spec)).id;
      const enc = encodePlanning(prepared.task, { ...encodeOptionsOf(spec), reachMode: units ? "units" : "simplify" });
      const proofPath = join(tmpdir(), `measure-proof-${process.pid}.drat`);
      const runs: Array<{ r: string; conflicts: number; decisions: number; secs: number }> = [];
      for (let seed = 0; seed < seeds; seed++) {
        const t0 = performance.now();
        const solver = new Solver({ seed, proof: withProof ? new FileProofWriter(proofPath, "binary") : null });
        enc.streamTo(solver);
        const r = solver.solve(enc.boundAssumptions(C - 1), { deadline: Date.now() + limit * 1000 });
        const secs = (performance.now() - t0) / 1000;
        if (r === "sat") {
          // a model below the proven optimum would be a bug somewhere: show it loudly
          const p = extractPlan(prepared.task, enc, (x) => solver.value(x) === true);
          process.stderr.write(`!!! ${label} ${cfg}: SAT with a plan of cost ${p.cost} below C* = ${C}\n`);
        }
        const st = solver.stats();
        runs.push({ r, conflicts: st.conflicts, decisions: st.decisions, secs });
      }
      const med = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor((xs.length - 1) / 2)];
      const result = runs.every((x) => x.r === runs[0].r) ? runs[0].r : runs.map((x) => x.r).join("/");
      const p = enc.stats.clausesByPart;
      const costClauses = (p["cost-inputs"] ?? 0) + (p.adder ?? 0) + (p.comparator ?? 0) + (p.unary ?? 0);
      const row = [label, String(C), String(H), (units ? "units:" : "") + [spec.encoding, spec.cost, ...spec.parts].join("+"), String(enc.numVars), String(enc.numClauses), String(costClauses), result, String(med(runs.map((x) => x.conflicts))), String(med(runs.map((x) => x.decisions))), med(runs.map((x) => x.secs)).toFixed(1), runs.map((x) => x.conflicts).join(",")];
      rows.push(row);
      print(row);
      rmSync(proofPath, { force: true });
    }
  }
}
