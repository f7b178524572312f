// Rebuilds the committed instances of each scenario from its instances.json: regenerates
// every problem file from the recorded generator parameters, solves it exactly on the
// scenario's PDDL-free model, and writes the plan file and the derived figures back.
// Usage: npx tsx benchmarks/domains/tools/build-instances.ts [SCENARIO ...] [--check]
import * as fs from "node:fs";
import * as path from "node:path";
import { planFileText } from "../../../src/plan/index.js";
import { writeFileAtomic } from "../../../src/util/files.js";
import { scenarios, resolveParams, type Scenario, type SizeName } from "../index.js";
import { analyseInstance } from "./figures.js";
import { instancesFile, readInstances, type InstanceRecord } from "./instances.js";

/** Above this many states the layered "cheapest within the shortest length" search is skipped. */
const LAYERED_LIMIT = 300_000;

/** The committed plan file, in plumbline's plan-file layout (src/plan/plan-file.ts). */
export function planText(sc: Scenario, problem: string, plan: string[], cost: number): string {
  return planFileText(plan, {
    cost,
    status: "optimal",
    proof: "exhaustive-search",
    notes: [`${problem}: a cheapest plan, and among cheapest plans one with the fewest actions`, `found by benchmarks/domains/tools/build-instances.ts (Dijkstra over ${sc.name}/model.ts)`],
  });
}

function build(sc: Scenario, check: boolean): string[] {
  const problems: string[] = [];
  const records = readInstances(sc.dir);
  const out: Record<string, InstanceRecord> = {};
  for (const [file, rec] of Object.entries(records)) {
    const g = rec.generator;
    const params = resolveParams(sc, rec.size as SizeName, g.seed, g);
    const inst = sc.makeInstance(params);
    const text = sc.toPddl(inst);
    const problem = /\(define \(problem ([^)\s]+)\)/.exec(text)![1];
    const t0 = performance.now();
    const f = analyseInstance(sc, params, 5_000_000, LAYERED_LIMIT);
    if (!f.plan || f.optimalCost === null) throw new Error(`${sc.name}/${file}: no plan exists`);
    const plan = planText(sc, problem, f.plan, f.optimalCost);
    const next: InstanceRecord = {
      problem,
      size: rec.size,
      generator: g,
      note: rec.note,
      states: f.states,
      optimalCost: f.optimalCost,
      optimalLength: f.optimalLength,
      shortestLength: f.shortestLength,
      cheapestAtShortestLength: f.cheapestAtShortestLength,
      cheapestLongerThanShortest: f.cheapestLongerThanShortest,
      planCost: f.optimalCost,
      planLength: f.plan.length,
      source:
        `Dijkstra on (cost, length) over ${sc.name}/model.ts, a PDDL-free model of the same mechanics ` +
        `(tools/build-instances.ts); shortestLength by breadth-first search` +
        (f.cheapestAtShortestLength === null ? "" : `, cheapestAtShortestLength by a layered search`) +
        (rec.size === "tiny" || rec.size === "small" ? "; re-checked in test/scenarios by the reference Dijkstra on the grounded PDDL" : ""),
    };
    out[file] = next;
    const pddlPath = path.join(sc.dir, `${file}.pddl`);
    const planPath = path.join(sc.dir, `${file}.plan`);
    const same = (p: string, t: string) => fs.existsSync(p) && fs.readFileSync(p, "utf8") === t;
    if (check) {
      if (!same(pddlPath, text)) problems.push(`${sc.name}/${file}.pddl differs from the generator output`);
      if (!same(planPath, plan)) problems.push(`${sc.name}/${file}.plan differs from the recomputed plan`);
      if (JSON.stringify(records[file]) !== JSON.stringify(next)) problems.push(`${sc.name}/${file}: instances.json figures differ`);
    } else {
      writeFileAtomic(pddlPath, text);
      writeFileAtomic(planPath, plan);
    }
    process.stdout.write(
      `${sc.name}/${file}: ${f.states} states, optimal ${f.optimalCost} in ${f.optimalLength} actions, shortest ${f.shortestLength}` +
        ` (${((performance.now() - t0) / 1000).toFixed(1)} s)\n`,
    );
  }
  if (!check) writeFileAtomic(instancesFile(sc.dir), JSON.stringify(out, null, 2) + "\n");
  return problems;
}

const args = process.argv.slice(2);
const check = args.includes("--check");
const names = args.filter((a) => !a.startsWith("--"));
const chosen = names.length === 0 ? scenarios : scenarios.filter((s) => names.includes(s.name));
if (chosen.length !== Math.max(names.length, chosen.length)) throw new Error(`unknown scenario among ${names.join(", ")}`);
const problems = chosen.flatMap((sc) => build(sc, check));
for (const p of problems) process.stderr.write(`${p}\n`);
process.exitCode = problems.length > 0 ? 1 : 0;
