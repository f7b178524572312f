// Seeded generator of workshop problems (orders needing operations, machines, a shared tool
// rack, set-up and swap costs). Usage: npx tsx benchmarks/domains/workshop/generate.ts --help
import { fileURLToPath } from "node:url";
import * as path from "node:path";
import { isMain, runGenerator } from "../lib/cli.js";
import { formatProblem, problemName } from "../lib/pddl-text.js";
import { Rng } from "../lib/rng.js";
import type { Params, Scenario } from "../lib/scenario.js";
import { workshopModel } from "./model.js";

const OPERATIONS = ["drill", "mill", "turn", "bore", "grind", "tap", "hone", "ream", "knurl", "slot", "chamfer", "polish"];

export interface WorkshopInstance {
  params: Params;
  name: string;
  operations: string[];
  /** ops: indices into operations. */
  tools: Array<{ name: string; ops: number[] }>;
  /** accepts: tool indices; initial: fitted tool index or null (bare). */
  machines: Array<{ name: string; fit: number; swap: number; run: number; accepts: number[]; initial: number | null }>;
  jobs: Array<{ name: string; needs: number[] }>;
  /** Every machine must be left bare at the end. */
  bareAtEnd: boolean;
}

export function makeWorkshop(p: Params): WorkshopInstance {
  if (p.tools < p.ops) throw new Error(`workshop: --tools ${p.tools} must be at least --ops ${p.ops} (every operation needs a tool)`);
  if (p.perJob > p.ops) throw new Error(`workshop: --perJob ${p.perJob} exceeds --ops ${p.ops}`);
  const rng = new Rng(p.seed * 104729 + 2);
  const operations = OPERATIONS.slice(0, p.ops);
  // tool i performs operation i mod ops; some tools are combination tools with a second one
  const tools = Array.from({ length: p.tools }, (_, i) => {
    const ops = [i % p.ops];
    if (p.ops > 1 && rng.chance(0.25)) {
      const second = rng.int(0, p.ops - 1);
      if (second !== ops[0]) ops.push(second);
    }
    return { name: `tool${i + 1}`, ops: ops.sort((a, b) => a - b) };
  });
  const machines: WorkshopInstance["machines"] = Array.from({ length: p.machines }, (_, i) => {
    const fit = rng.int(2, 5);
    const quickChange = rng.chance(0.5);
    const swap = quickChange ? Math.max(1, fit - rng.int(1, 2)) : fit + rng.int(1, 3);
    return { name: `machine${i + 1}`, fit, swap, run: rng.int(1, 3), accepts: [], initial: null };
  });
  // every tool fits one or two machines; every machine takes at least one tool
  for (let t = 0; t < p.tools; t++) {
    for (const m of rng.sample([...machines.keys()], Math.min(p.machines, rng.int(1, 2)))) machines[m].accepts.push(t);
  }
  for (const m of machines) if (m.accepts.length === 0) m.accepts.push(rng.int(0, p.tools - 1));
  for (const m of machines) m.accepts = [...new Set(m.accepts)].sort((a, b) => a - b);
  // half the machines start the shift with a tool still fitted from yesterday
  const used = new Set<number>();
  for (const m of machines) {
    if (!rng.chance(0.5)) continue;
    const free = m.accepts.filter((t) => !used.has(t));
    if (free.length === 0) continue;
    m.initial = rng.pick(free);
    used.add(m.initial);
  }
  const jobs = Array.from({ length: p.jobs }, (_, j) => ({
    name: `order${j + 1}`,
    needs: rng.sample([...operations.keys()], rng.int(1, p.perJob)).sort((a, b) => a - b),
  }));
  const name = problemName("workshop", p, [["jobs", "j"], ["machines", "m"], ["tools", "t"], ["ops", "o"], ["perJob", "p"], ["bare", "b"]]);
  return { params: p, name, operations, tools, machines, jobs, bareAtEnd: p.bare === 1 };
}

export function workshopPddl(w: WorkshopInstance): string {
  const init: string[] = [];
  for (const j of w.jobs) for (const o of j.needs) init.push(`(needs ${j.name} ${w.operations[o]})`);
  for (const t of w.tools) for (const o of t.ops) init.push(`(performs ${t.name} ${w.operations[o]})`);
  for (const m of w.machines) {
    init.push(`(= (fit-cost ${m.name}) ${m.fit}) (= (swap-cost ${m.name}) ${m.swap}) (= (run-cost ${m.name}) ${m.run})`);
    for (const t of m.accepts) init.push(`(accepts ${m.name} ${w.tools[t].name})`);
    init.push(m.initial === null ? `(bare ${m.name})` : `(fitted ${m.name} ${w.tools[m.initial].name})`);
  }
  const fitted = new Set(w.machines.flatMap((m) => (m.initial === null ? [] : [m.initial])));
  for (let t = 0; t < w.tools.length; t++) if (!fitted.has(t)) init.push(`(in-rack ${w.tools[t].name})`);
  const jobsDone = "(forall (?j - job) (signed-off ?j))";
  const goal = w.bareAtEnd ? `(and ${jobsDone} (forall (?m - machine) (bare ?m)))` : jobsDone;
  return formatProblem({
    scenario: "workshop",
    domain: "workshop",
    name: w.name,
    params: w.params,
    objects: [
      ["job", w.jobs.map((j) => j.name)],
      ["machine", w.machines.map((m) => m.name)],
      ["tool", w.tools.map((t) => t.name)],
      ["operation", w.operations],
    ],
    init,
    goal,
    costs: true,
  });
}

export const workshop: Scenario<WorkshopInstance> = {
  name: "workshop",
  summary: "Workshop scheduling: fitting and swapping tools cost set-up time, running costs machine time; stripping and sign-off are free.",
  dir: path.dirname(fileURLToPath(import.meta.url)),
  params: [
    { name: "jobs", help: "number of orders", min: 1, max: 30 },
    { name: "machines", help: "number of machines", min: 1, max: 10 },
    { name: "tools", help: "number of tools in the rack (at least --ops)", min: 1, max: 20 },
    { name: "ops", help: "number of operation kinds", min: 1, max: OPERATIONS.length },
    { name: "perJob", help: "most operations one order needs", min: 1, max: OPERATIONS.length },
    { name: "bare", help: "1: every machine must be left bare at the end", min: 0, max: 1 },
  ],
  sizes: {
    tiny: { jobs: 1, machines: 1, tools: 2, ops: 2, perJob: 2, bare: 0 },
    small: { jobs: 4, machines: 3, tools: 5, ops: 3, perJob: 2, bare: 1 },
    medium: { jobs: 5, machines: 3, tools: 6, ops: 4, perJob: 3, bare: 1 },
    large: { jobs: 10, machines: 4, tools: 8, ops: 6, perJob: 4, bare: 1 },
  },
  makeInstance: makeWorkshop,
  toPddl: workshopPddl,
  model: workshopModel,
};

if (isMain(import.meta.url)) runGenerator(workshop as Scenario, process.argv.slice(2));
