// `npm run bench:search`: coverage, times and expansions per second of the built-in search
// per heuristic under one time limit, on the scenario suite or on a directory of PDDL files.
//
// Usage: tsx benchmarks/scripts/bench-search.ts [DIR] [--time-limit S] [--runners a,b,...]
//          [--sizes tiny,small,medium] [--seeds 1,2,3] [--out FILE.json]
// Every runner gets the same time limit; `sat-optimizer` runs the SAT optimizer (default encoding,
// built-in solver, proof kept only in memory) beside the searches — the table users ask for first.
import { mkdirSync, mkdtempSync, readdirSync, rmSync, statSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { basename, join, resolve } from "node:path";
import { groundFiles } from "../../src/ground/index.js";
import type { Task } from "../../src/ground/task.js";
import { disposeOutcome, optimizeFiles } from "../../src/optimize/index.js";
import { astar, gbfs, type SearchResult } from "../../src/search/index.js";
import { generateProblem, scenarios, type SizeName } from "../domains/index.js";

interface Instance {
  name: string;
  domain: string;
  problem: string;
}

interface Outcome {
  /** "optimal" (proven), "feasible" (a plan), "unsolvable", "unknown" (limit), "error". */
  status: string;
  cost: number | null;
  seconds: number;
  expanded: number;
  detail?: string;
}

interface Runner {
  name: string;
  /** Claims optimality when it solves: optimal costs of different runners must agree. */
  optimal: boolean;
  /** false when "expanded" counts something else (SAT calls): no expansions per second then. */
  expands?: boolean;
  run(task: Task, deadline: number, inst: Instance): Outcome | Promise<Outcome>;
}

const fromSearch = (r: SearchResult, optimal: boolean): Outcome => ({
  status: r.status === "solved" ? (optimal ? "optimal" : "feasible") : r.status === "unsolvable" ? "unsolvable" : "unknown",
  cost: r.cost,
  seconds: r.seconds,
  expanded: r.expanded,
  detail: r.stopReason,
});

const RUNNERS: Runner[] = [
  { name: "astar-blind", optimal: true, run: (t, deadline) => fromSearch(astar(t, { heuristic: "blind", deadline }), true) },
  { name: "astar-max", optimal: true, run: (t, deadline) => fromSearch(astar(t, { heuristic: "max", deadline }), true) },
  { name: "astar-landmark-cut", optimal: true, run: (t, deadline) => fromSearch(astar(t, { heuristic: "landmark-cut", deadline }), true) },
  { name: "gbfs-ff", optimal: false, run: (t, deadline) => fromSearch(gbfs(t, { deadline }), false) },
  { name: "sat-optimizer", optimal: true, expands: false, run: satOptimizer },
];

/** The SAT optimizer on the instance's files (it grounds with its own options); "expanded" = SAT calls. */
async function satOptimizer(_task: Task, deadline: number, inst: Instance): Promise<Outcome> {
  const timeLimit = Math.max(0.1, (deadline - Date.now()) / 1000);
  const out = await optimizeFiles(inst.domain, inst.problem, { timeLimit, progressIntervalMs: 1e9 });
  disposeOutcome(out);
  const detail = out.status === "optimal" ? (out.how ?? undefined) : (out.stopReason ?? undefined);
  return { status: out.status, cost: out.cost, seconds: out.seconds, expanded: out.satCalls, detail };
}
/** Speeds are reported as ratios against this runner's figures from the same run. */
const REFERENCE = "astar-blind";

function parseArgs(argv: string[]) {
  const o = { dir: null as string | null, timeLimit: 30, runners: RUNNERS.map((r) => r.name), sizes: ["tiny", "small", "medium"] as SizeName[], seeds: [1, 2, 3], out: null as string | null };
  for (let i = 0; i < argv.length; i++) {
    const a = argv[i];
    const next = () => {
      const v = argv[++i];
      if (v === undefined) throw new Error(`${a} needs a value`);
      return v;
    };
    if (a === "--time-limit") o.timeLimit = Number(next());
    else if (a === "--runners") o.runners = next().split(",");
    else if (a === "--sizes") o.sizes = next().split(",") as SizeName[];
    else if (a === "--seeds") o.seeds = next().split(",").map(Number);
    else if (a === "--out") o.out = next();
    else if (a === "--help") {
      console.log("usage: bench-search [DIR] [--time-limit S] [--runners " + RUNNERS.map((r) => r.name).join(",") + "] [--sizes tiny,small,medium] [--seeds 1,2,3] [--out FILE]");
      process.exit(0);
    } else if (a.startsWith("--")) throw new Error(`unknown option ${a}`);
    else o.dir = a;
  }
  if (!(o.timeLimit > 0)) throw new Error("--time-limit must be a positive number of seconds");
  for (const r of o.runners) if (!RUNNERS.some((x) => x.name === r)) throw new Error(`unknown runner ${r}`);
  return o;
}

/** Instances of a directory: DIR/domain.pddl + problem files, or domain-NN/problem-NN pairs; subfolders too. */
function instancesIn(dir: string): Instance[] {
  const out: Instance[] = [];
  const names = readdirSync(dir).sort();
  const pddl = names.filter((n) => n.endsWith(".pddl"));
  for (const n of pddl) {
    if (n.startsWith("domain")) continue;
    const paired = n.replace(/^problem/, "domain");
    const domain = pddl.includes(paired) && paired !== n ? paired : pddl.includes("domain.pddl") ? "domain.pddl" : null;
    if (domain) out.push({ name: `${basename(dir)}/${n.replace(/\.pddl$/, "")}`, domain: join(dir, domain), problem: join(dir, n) });
  }
  for (const n of names) if (statSync(join(dir, n)).isDirectory()) out.push(...instancesIn(join(dir, n)));
  return out;
}

function scenarioInstances(tmp: string, sizes: SizeName[], seeds: number[]): Instance[] {
  const out: Instance[] = [];
  for (const sc of scenarios) {
    for (const size of sizes) {
      for (const seed of seeds) {
        const file = join(tmp, `${sc.name}-${size}-${seed}.pddl`);
        writeFileSync(file, generateProblem(sc, size, seed));
        out.push({ name: `${sc.name}/${size}-${seed}`, domain: join(sc.dir, "domain.pddl"), problem: file });
      }
    }
  }
  return out;
}

const fmt = (x: number, d = 2) => (Number.isFinite(x) ? x.toFixed(d) : "-");
const pad = (s: string, w: number) => (s.length >= w ? s : s + " ".repeat(w - s.length));
const lpad = (s: string, w: number) => (s.length >= w ? s : " ".repeat(w - s.length) + s);

async function main(): Promise<void> {
  const o = parseArgs(process.argv.slice(2));
  const tmp = mkdtempSync(join(tmpdir(), "plumbline-bench-search-"));
  const instances = o.dir ? instancesIn(resolve(o.dir)) : scenarioInstances(tmp, o.sizes, o.seeds);
  const runners = RUNNERS.filter((r) => o.runners.includes(r.name));
  console.log(`bench:search — ${instances.length} instances, time limit ${o.timeLimit} s per run, runners ${runners.map((r) => r.name).join(", ")}`);
  const rows: Array<{ instance: string; facts: number; actions: number; results: Record<string, Outcome> }> = [];
  const problems: string[] = [];
  const colW = 26;
  console.log(pad("instance", 26) + lpad("facts", 7) + lpad("acts", 7) + runners.map((r) => lpad(r.name, colW)).join(""));
  for (const inst of instances) {
    let task: Task;
    try {
      task = groundFiles(inst.domain, inst.problem).task;
    } catch (e) {
      console.log(`${pad(inst.name, 26)} grounding failed: ${(e as Error).message.split("\n")[0]}`);
      continue;
    }
    const results: Record<string, Outcome> = {};
    for (const r of runners) {
      try {
        results[r.name] = await r.run(task, Date.now() + o.timeLimit * 1000, inst);
      } catch (e) {
        results[r.name] = { status: "error", cost: null, seconds: 0, expanded: 0, detail: (e as Error).message };
      }
    }
    const optimalCosts = new Set(runners.filter((r) => r.optimal && results[r.name].status === "optimal").map((r) => results[r.name].cost));
    if (optimalCosts.size > 1) problems.push(`${inst.name}: optimal runners disagree: ${[...optimalCosts].join(" vs ")}`);
    const cell = (x: Outcome) => (x.status === "optimal" || x.status === "feasible" ? `${x.cost}${x.status === "feasible" ? "~" : ""} ${fmt(x.seconds)}s ${x.expanded}` : `${x.status}${x.detail ? `(${x.detail})` : ""}`);
    console.log(pad(inst.name, 26) + lpad(String(task.facts.length), 7) + lpad(String(task.actions.length), 7) + runners.map((r) => lpad(cell(results[r.name]), colW)).join(""));
    rows.push({ instance: inst.name, facts: task.facts.length, actions: task.actions.length, results });
  }
  rmSync(tmp, { recursive: true, force: true });

  // summary: coverage, total time on solved, expansions per second, ratios vs the reference
  console.log("\nsummary (cells: cost [~ = not proven optimal], seconds, expansions [sat-optimizer: SAT calls]; solved = any plan or unsolvability, proven = optimal or unsolvable proven)");
  console.log(pad("runner", 14) + lpad("solved", 8) + lpad("proven", 8) + lpad("exp/s", 10) + lpad("x ref exp/s", 13) + lpad("time common", 13) + lpad("x ref time", 12));
  const solved = (x: Outcome | undefined) => !!x && (x.status === "optimal" || x.status === "feasible" || x.status === "unsolvable");
  const summary: Record<string, unknown> = {};
  const ref = runners.find((r) => r.name === REFERENCE);
  const rate = (name: string) => {
    let e = 0;
    let s = 0;
    for (const row of rows) {
      e += row.results[name].expanded;
      s += row.results[name].seconds;
    }
    return s > 0 ? e / s : NaN;
  };
  const refRate = ref ? rate(ref.name) : NaN;
  for (const r of runners) {
    const cov = rows.filter((row) => solved(row.results[r.name])).length;
    const common = rows.filter((row) => solved(row.results[r.name]) && (!ref || solved(row.results[ref.name])));
    const t = common.reduce((a, row) => a + row.results[r.name].seconds, 0);
    const tRef = ref ? common.reduce((a, row) => a + row.results[ref.name].seconds, 0) : NaN;
    const proven = rows.filter((row) => ["optimal", "unsolvable"].includes(row.results[r.name].status)).length;
    const rr = r.expands === false ? NaN : rate(r.name);
    summary[r.name] = { solved: cov, proven, of: rows.length, expansionsPerSecond: rr, ratioExpansionsPerSecond: rr / refRate, commonSeconds: t, ratioTimeCommon: t / tRef };
    console.log(pad(r.name, 14) + lpad(`${cov}/${rows.length}`, 8) + lpad(`${proven}`, 8) + lpad(fmt(rr, 0), 10) + lpad(fmt(rr / refRate), 13) + lpad(fmt(t), 13) + lpad(fmt(t / tRef), 12));
  }
  if (ref) console.log(`(ratios against ${ref.name} in this run; "time common" sums the instances both it and the reference solved)`);
  for (const p of problems) console.log(`PROBLEM: ${p}`);
  const outFile = o.out ?? join("benchmarks", "results", "search", `bench-search-${new Date().toISOString().replace(/[:.]/g, "-")}.json`);
  mkdirSync(resolve(outFile, ".."), { recursive: true });
  writeFileSync(outFile, JSON.stringify({ timeLimit: o.timeLimit, source: o.dir ?? "scenarios", rows, summary, problems }, null, 2) + "\n");
  console.log(`results written to ${outFile}`);
  if (problems.length > 0) process.exitCode = 1;
}

main().catch((e) => {
  console.error(`bench-search: ${(e as Error).message}`);
  process.exitCode = 2;
});
