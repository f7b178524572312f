// `npm run bench:sat-formulas`: writes a fixed set of planning CNFs (the optimizer's final proving
// query and a satisfiable twin) into benchmarks/results/sat-formulas/, so solver timings can be repeated.
//
// Usage: npm run bench:sat-formulas -- [PDDL_DIR] [--out DIR] [--only TEXT[,TEXT…]] [--all]
//          [--search-limit S] [--max-clauses N]
//   Without PDDL_DIR: the fixed set below — committed scenario instances (benchmarks/domains/*/
//   problem-NN.pddl, optimum C* from instances.json) and instances of the scenario generators at
//   fixed sizes and seeds (problem files written to OUT/pddl/, C* by A* with landmark-cut).
//   PDDL_DIR         also every DOMAIN/problem-NN.pddl of a folder of public PDDL (domain.pddl or
//                    domain-NN.pddl beside it), named DOMAIN-NN; C* by A* with landmark-cut
//                    (--search-limit S seconds each, default 30; problems it does not solve are skipped)
//   --only TEXT,…    only instances whose name contains one of the texts
//   --all            instead of the fixed set: every small and medium committed instance and seeds
//                    1–6 of every generator's small and medium size, both queries (to choose the set)
//   --max-clauses N  skip formulas with more clauses (default 3,000,000)
//
// Each query is the formula `solve` builds (default encoding, cost encoding chosen by size, the
// default parts) at the horizon H(C*) the optimizer proves at, i.e. what
// `plumbline encode D P --steps H --cost-below C` writes:
//   NAME-unsat.cnf  cost ≤ C* − 1 within H steps (unsatisfiable: the optimality proof)
//   NAME-sat.cnf    cost ≤ C* within the same H steps (satisfiable: a cheapest plan fits)
import { existsSync, mkdirSync, readdirSync, readFileSync, renameSync, rmSync, writeFileSync } from "node:fs";
import { join, resolve } from "node:path";
import { prepareTask } from "../../src/analyse/index.js";
import { groundFiles, type Task } from "../../src/ground/index.js";
import { computeHorizon } from "../../src/horizon/index.js";
import { boundSettings, buildFormula, estimateFormula, formulaId, OPTIMIZE_GROUNDING, resolveEncoding, specFor, writeCanonicalDimacs } from "../../src/optimize/index.js";
import { astar } from "../../src/search/index.js";
import { generateProblem, scenarioByName, type SizeName } from "../domains/index.js";

const args = process.argv.slice(2);
const value = (name: string): string | undefined => {
  const i = args.indexOf(name);
  return i >= 0 ? args[i + 1] : undefined;
};
const valued = ["--out", "--search-limit", "--max-clauses", "--only"];
const pddlDir = args.find((a, i) => !a.startsWith("--") && (i === 0 || !valued.includes(args[i - 1])));
const outDir = resolve(value("--out") ?? resolve(import.meta.dirname, "../results/sat-formulas"));
const all = args.includes("--all");
const only = value("--only")?.split(",");
const searchLimit = Number(value("--search-limit") ?? 30);
const maxClauses = Number(value("--max-clauses") ?? 3_000_000);
const domains = resolve(import.meta.dirname, "../domains");

/**
 * The fixed set: committed scenario instances and which queries. Chosen (with --all and
 * bench:sat-dir) so that each query takes the built-in solver roughly 1–60 s (CPU) on this
 * project's machine; the easier and much harder queries of the same instances are left out.
 */
const FIXED: Array<{ instance: string; queries: Array<"unsat" | "sat"> }> = [
  { instance: "harbour/problem-04", queries: ["unsat", "sat"] },
  { instance: "harbour/problem-05", queries: ["sat"] },
  { instance: "warehouse/problem-05", queries: ["unsat", "sat"] },
  { instance: "workshop/problem-04", queries: ["unsat"] },
  { instance: "workshop/problem-05", queries: ["sat"] },
];

/**
 * More instances of the same scenarios from their seeded generators (same size and seed, same
 * problem file), written to OUT/pddl/; the optimum is found by A* with landmark-cut.
 */
const GENERATED: Array<{ scenario: string; size: SizeName; seed: number; queries: Array<"unsat" | "sat"> }> = [
  { scenario: "harbour", size: "small", seed: 4, queries: ["unsat"] },
  { scenario: "harbour", size: "small", seed: 5, queries: ["unsat"] },
  { scenario: "warehouse", size: "small", seed: 4, queries: ["unsat"] },
  { scenario: "warehouse", size: "small", seed: 5, queries: ["unsat", "sat"] },
  { scenario: "warehouse", size: "medium", seed: 3, queries: ["sat"] },
  { scenario: "warehouse", size: "medium", seed: 5, queries: ["unsat"] },
];

interface Job {
  name: string;
  domain: string;
  problem: string;
  /** Known optimum, or null to find it by A*. */
  optimum: number | null;
  queries: Array<"unsat" | "sat">;
}

function scenarioJobs(): Job[] {
  const jobs: Job[] = [];
  for (const sc of ["harbour", "warehouse", "workshop"]) {
    const inst = JSON.parse(readFileSync(join(domains, sc, "instances.json"), "utf8")) as Record<string, { optimalCost: number; size: string }>;
    for (const [problem, v] of Object.entries(inst)) {
      const label = `${sc}/${problem}`;
      const fixed = FIXED.find((f) => f.instance === label);
      const wanted = all ? (v.size === "small" || v.size === "medium" ? (["unsat", "sat"] as const) : null) : fixed?.queries;
      if (!wanted) continue;
      jobs.push({ name: `${sc}-${problem}`, domain: join(domains, sc, "domain.pddl"), problem: join(domains, sc, `${problem}.pddl`), optimum: v.optimalCost, queries: [...wanted] });
    }
  }
  return jobs;
}

function generatedJobs(): Job[] {
  const list = all
    ? ["harbour", "warehouse", "workshop"].flatMap((scenario) =>
        (["small", "medium"] as const).flatMap((size) => [1, 2, 3, 4, 5, 6].map((seed) => ({ scenario, size, seed, queries: ["unsat", "sat"] as Array<"unsat" | "sat"> }))),
      )
    : GENERATED;
  const jobs: Job[] = [];
  mkdirSync(join(outDir, "pddl"), { recursive: true });
  for (const g of list) {
    const sc = scenarioByName(g.scenario);
    const name = `${g.scenario}-${g.size}-s${g.seed}`;
    const problem = join(outDir, "pddl", `${name}.pddl`);
    const text = generateProblem(sc, g.size, g.seed);
    // (--all) the committed instances are generator output too: skip a seed that repeats one
    if (readdirSync(sc.dir).some((f) => /^problem-\d+\.pddl$/.test(f) && readFileSync(join(sc.dir, f), "utf8") === text)) continue;
    writeFileSync(problem, text);
    jobs.push({ name, domain: join(sc.dir, "domain.pddl"), problem, optimum: null, queries: g.queries });
  }
  return jobs;
}

function pddlJobs(dir: string): Job[] {
  const jobs: Job[] = [];
  for (const d of readdirSync(dir, { withFileTypes: true }).filter((e) => e.isDirectory()).map((e) => e.name).sort()) {
    for (const p of readdirSync(join(dir, d)).filter((f) => /^problem-\d+\.pddl$/.test(f)).sort()) {
      const nn = p.slice("problem-".length, -".pddl".length);
      const own = join(dir, d, `domain-${nn}.pddl`);
      const domain = existsSync(own) ? own : join(dir, d, "domain.pddl");
      if (!existsSync(domain)) continue;
      jobs.push({ name: `${d}-${nn}`, domain, problem: join(dir, d, p), optimum: null, queries: ["unsat", "sat"] });
    }
  }
  return jobs;
}

/** Writes formula + units as DIMACS through a temporary name. */
function writeQuery(task: Task, steps: number, costBelow: number, file: string): { vars: number; clauses: number; id: string } | null {
  const prepared = prepareTask(task);
  const base = { steps, ...boundSettings(costBelow), mutexGroups: prepared.variables.variables.filter((v) => v.facts.length > 1).map((v) => [...v.facts]) };
  // size check before the cost encoding is chosen (choosing builds the cost part)
  const choice = resolveEncoding(undefined);
  if (estimateFormula(prepared.task, { ...base, encoding: choice.encoding, cost: "cost-adder-1", parts: choice.parts }).clauses > maxClauses) return null;
  const spec = specFor(prepared.task, choice, base);
  if (estimateFormula(prepared.task, spec).clauses > maxClauses) return null;
  const f = buildFormula(prepared.task, spec);
  if (f.numClauses > maxClauses) return null; // (the estimate can be low)
  const units = f.boundUnits(costBelow - 1);
  const chunks: string[] = [`c plumbline ${formulaId(spec)} steps=${steps} query: cost <= ${costBelow - 1}\n`];
  writeCanonicalDimacs(f, units, (s) => chunks.push(s));
  const tmp = `${file}.tmp-${process.pid}`;
  writeFileSync(tmp, chunks.join(""));
  renameSync(tmp, file);
  return { vars: f.numVars, clauses: f.numClauses + units.length, id: formulaId(spec) };
}

mkdirSync(outDir, { recursive: true });
const jobs = [...scenarioJobs(), ...generatedJobs(), ...(pddlDir ? pddlJobs(pddlDir) : [])].filter((j) => !only || only.some((o) => j.name.includes(o)));
console.log(`# writing ${jobs.length} instance(s) to ${outDir}`);
let written = 0;
for (const job of jobs) {
  let task: Task;
  try {
    task = groundFiles(job.domain, job.problem, OPTIMIZE_GROUNDING).task;
  } catch (e) {
    console.log(`${job.name}: skipped (${(e as Error).message.split("\n")[0]})`);
    continue;
  }
  let C = job.optimum;
  if (C === null) {
    const t0 = performance.now();
    const r = astar(task, { heuristic: "landmark-cut", deadline: Date.now() + searchLimit * 1000, maxStates: 5_000_000 });
    if (r.status !== "solved" || r.cost === null) {
      console.log(`${job.name}: skipped (A* did not find the optimum: ${r.stopReason ?? r.status} after ${((performance.now() - t0) / 1000).toFixed(0)}s)`);
      continue;
    }
    C = r.cost;
  }
  if (C <= 0) {
    console.log(`${job.name}: skipped (optimum ${C}: no proving query)`);
    continue;
  }
  const H = computeHorizon(task, C).horizon;
  if (!Number.isFinite(H)) {
    console.log(`${job.name}: skipped (no finite horizon for cost < ${C})`);
    continue;
  }
  for (const q of job.queries) {
    // unsat: the proof query "cost ≤ C − 1"; sat: "cost ≤ C" at the same horizon
    const file = join(outDir, `${job.name}-${q}.cnf`);
    const r = writeQuery(task, H, q === "unsat" ? C : C + 1, file);
    if (r === null) {
      rmSync(file, { force: true });
      console.log(`${job.name}-${q}: skipped (more than ${maxClauses.toLocaleString("en")} clauses at horizon ${H})`);
      continue;
    }
    written++;
    console.log(`${job.name}-${q}.cnf  C*=${C} H=${H} ${r.id}: ${r.vars.toLocaleString("en")} vars, ${r.clauses.toLocaleString("en")} clauses`);
  }
}
console.log(`# ${written} formula(s) written`);
