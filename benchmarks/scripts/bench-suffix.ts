// `npm run bench:suffix`: how far SAT proofs reach without the explicit-state horizon methods —
// per instance with zero-cost actions: solve (general bounds only) + audit, and A* with landmark-cut.
//
// Usage: tsx benchmarks/scripts/bench-suffix.ts [DIR] [--time-limit S] [--jobs N] [--only TEXT]
//          [--all] [--no-suffix] [--max-states N] [--json FILE]
//   DIR (default benchmarks/domains): a folder of PDDL (domain.pddl with problems, or
//   domain-NN.pddl / problem-NN.pddl pairs), e.g. a copy of a public benchmark collection.
//   Only instances with zero-cost actions are run unless --all. Every run is a child process of
//   the CLI: `solve --general-bounds-only --certificate` then `audit`, and `search --heuristic
//   landmark-cut`, each with the same time limit. --no-suffix runs solve with --no-suffix (the
//   threshold route alone) for comparison. L (fewest actions among cost-optimal plans) comes from
//   an exact search of the analysed task capped at --max-states (default 2,000,000) states.
// Printed: per instance the proof kind, the horizon h it was proven at, the completeness threshold
// it made unnecessary, time, proof size, lower bound, audit verdict and time, A*'s result; then
// the targets: SAT proofs vs A* proofs, geometric mean of h / L, wrong claims, median audit/solve.
import { spawn } from "node:child_process";
import { mkdirSync, mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { dirname, join, resolve } from "node:path";
import { prepareTask } from "../../src/analyse/index.js";
import { instancesInDirectory, type FoundInstance } from "../../src/bench/suite-dir.js";
import { cliCommand } from "../../src/bench/paths.js";
import { groundFiles } from "../../src/ground/index.js";
import { optimalLength } from "../../src/horizon/optimal-length.js";
import { OPTIMIZE_GROUNDING } from "../../src/optimize/index.js";
import { writeFileAtomic } from "../../src/util/files.js";

const args = process.argv.slice(2);
const value = (name: string): string | undefined => {
  const i = args.indexOf(name);
  return i >= 0 ? args[i + 1] : undefined;
};
const flags = new Set(["--all", "--no-suffix"]);
const positional = args.filter((a, i) => !a.startsWith("--") && (i === 0 || !args[i - 1].startsWith("--") || flags.has(args[i - 1])));
const dir = resolve(positional[0] ?? join(import.meta.dirname, "../domains"));
const timeLimit = Number(value("--time-limit") ?? 60);
const jobs = Math.max(1, Number(value("--jobs") ?? 1));
const only = value("--only");
const all = args.includes("--all");
const noSuffix = args.includes("--no-suffix");
const maxStates = Number(value("--max-states") ?? 2_000_000);
const jsonOut = value("--json") ?? resolve(import.meta.dirname, "../results/suffix/latest.json");
const cli = cliCommand();

type Json = Record<string, any>;
function run(argv: string[], limitS: number): Promise<{ json: Json | null; code: number | null; seconds: number }> {
  return new Promise((done) => {
    const t0 = performance.now();
    const child = spawn(cli[0], ["--max-old-space-size=8192", ...cli.slice(1), ...argv], { stdio: ["ignore", "pipe", "ignore"] });
    let out = "";
    child.stdout.on("data", (d) => (out += d));
    const timer = setTimeout(() => child.kill("SIGKILL"), (limitS + 30) * 1000);
    child.on("close", (code) => {
      clearTimeout(timer);
      let json: Json | null = null;
      try {
        json = JSON.parse(out) as Json;
      } catch {
        json = null;
      }
      done({ json, code, seconds: (performance.now() - t0) / 1000 });
    });
  });
}

interface Row {
  instance: string;
  zeroCost: number;
  solve: { status: string; how: string | null; cost: number | null; lower: number | string | null; h: number | string | null; avoided: number | string | null; seconds: number; proofBytes: number | null };
  audit: { valid: boolean | null; seconds: number | null };
  astar: { status: string; cost: number | null; seconds: number };
  /** Fewest actions among cost-optimal plans (exact), or null past the state cap. */
  L: number | null;
}

async function one(inst: FoundInstance): Promise<Row | null> {
  const { task } = groundFiles(inst.domainFile, inst.problemFile, OPTIMIZE_GROUNDING);
  const zeroCost = task.actions.filter((a) => a.cost === 0 && !a.synthetic).length;
  if (!all && zeroCost === 0) return null;
  const tmp = mkdtempSync(join(tmpdir(), "bench-suffix-"));
  try {
    const cert = join(tmp, "certificate");
    const s = await run(["solve", inst.domainFile, inst.problemFile, "--json", "--time-limit", String(timeLimit), "--general-bounds-only", "--certificate", cert, ...(noSuffix ? ["--no-suffix"] : [])], timeLimit);
    const sj = s.json ?? {};
    let audit: Row["audit"] = { valid: null, seconds: null };
    if (sj.certificate) {
      const a = await run(["audit", cert, "--json"], 600);
      // audit --json prints one entry per certificate (an array)
      const entry = (Array.isArray(a.json) ? a.json[0] : a.json) as Json | undefined;
      audit = { valid: entry?.valid === true, seconds: a.seconds };
    }
    const a = await run(["search", inst.domainFile, inst.problemFile, "--json", "--heuristic", "landmark-cut", "--time-limit", String(timeLimit)], timeLimit);
    const aj = a.json ?? {};
    let L: number | null = null;
    if (sj.status === "optimal") {
      const r = optimalLength(prepareTask(task).task, maxStates);
      L = r.kind === "found" ? r.length : null;
    }
    return {
      instance: inst.instance,
      zeroCost,
      solve: { status: sj.status ?? `exit ${s.code}`, how: sj.how ?? null, cost: sj.cost ?? null, lower: sj.lowerBound ?? null, h: sj.horizon ?? null, avoided: sj.thresholdAvoided ?? null, seconds: s.seconds, proofBytes: sj.proof?.bytes ?? null },
      audit,
      astar: { status: aj.status ?? `exit ${a.code}`, cost: aj.cost ?? null, seconds: a.seconds },
      L,
    };
  } finally {
    rmSync(tmp, { recursive: true, force: true });
  }
}

const { instances } = instancesInDirectory(dir, "root");
const todo = instances.filter((i) => !only || i.instance.includes(only));
const rows: Row[] = [];
let next = 0;
await Promise.all(
  Array.from({ length: jobs }, async () => {
    while (next < todo.length) {
      const inst = todo[next++];
      const r = await one(inst);
      if (r) {
        rows.push(r);
        const x = r.solve;
        process.stderr.write(`${r.instance}: ${x.status}${x.how ? ` (${x.how}, h ${x.h}${x.avoided !== null ? `, threshold ${x.avoided}` : ""})` : ""} cost ${x.cost} lb ${x.lower} ${x.seconds.toFixed(1)} s; A* ${r.astar.status} ${r.astar.cost ?? ""}\n`);
      }
    }
  }),
);
rows.sort((a, b) => a.instance.localeCompare(b.instance, "en", { numeric: true }));

const fmt = (x: unknown) => (x === null || x === undefined ? "-" : typeof x === "number" ? (Number.isInteger(x) ? String(x) : x.toFixed(1)) : String(x));
const head = ["instance", "solve", "how", "cost", "lower", "h", "threshold", "s", "proof KB", "audit", "audit s", "A*", "A* cost", "A* s", "L", "h/L"];
const table = [head, ...rows.map((r) => {
  const hl = r.L && typeof r.solve.h === "number" && r.solve.status === "optimal" && r.solve.how !== "lower-bound" ? r.solve.h / r.L : null;
  return [r.instance, r.solve.status, r.solve.how ?? "-", fmt(r.solve.cost), fmt(r.solve.lower), fmt(r.solve.how === "lower-bound" ? null : r.solve.h), fmt(r.solve.avoided ?? (r.solve.how === "horizon-unsat" ? r.solve.h : null)), fmt(r.solve.seconds), r.solve.proofBytes === null ? "-" : (r.solve.proofBytes / 1024).toFixed(0), r.audit.valid === null ? "-" : r.audit.valid ? "valid" : "REJECTED", fmt(r.audit.seconds), r.astar.status, fmt(r.astar.cost), fmt(r.astar.seconds), fmt(r.L), hl === null ? "-" : hl.toFixed(2)];
})];
const widths = head.map((_, i) => Math.max(...table.map((row) => row[i].length)));
console.log(table.map((row) => row.map((c, i) => c.padEnd(widths[i])).join("  ")).join("\n"));

const satProofs = rows.filter((r) => r.solve.status === "optimal" && (r.solve.how === "suffix-unsat" || r.solve.how === "horizon-unsat") && r.audit.valid === true);
const astarProven = rows.filter((r) => r.astar.status === "optimal").length;
const ratios = satProofs.filter((r) => r.L && typeof r.solve.h === "number").map((r) => (r.solve.h as number) / r.L!);
const geo = ratios.length ? Math.exp(ratios.reduce((a, x) => a + Math.log(x), 0) / ratios.length) : null;
const wrong = rows.filter((r) => r.solve.status === "optimal" && r.astar.status === "optimal" && r.solve.cost !== r.astar.cost);
const auditRatios = rows.filter((r) => r.audit.seconds !== null && r.solve.seconds > 0).map((r) => r.audit.seconds! / r.solve.seconds).sort((a, b) => a - b);
const median = auditRatios.length ? auditRatios[Math.floor((auditRatios.length - 1) / 2)] : null;
console.log(`
instances with zero-cost actions: ${rows.length}; time limit ${timeLimit} s; jobs ${jobs}${noSuffix ? "; solve --no-suffix" : ""}
(a) proven by an audited SAT refutation (general bounds only): ${satProofs.length} (suffix-unsat ${satProofs.filter((r) => r.solve.how === "suffix-unsat").length}, horizon-unsat ${satProofs.filter((r) => r.solve.how === "horizon-unsat").length}); solve proven in all: ${rows.filter((r) => r.solve.status === "optimal").length}; A* with landmark-cut proven: ${astarProven}; ratio ${(satProofs.length / Math.max(1, astarProven)).toFixed(2)}
(b) h / L over the SAT proofs with L known (${ratios.length}): geometric mean ${geo === null ? "-" : geo.toFixed(2)}
(c) wrong claims (solve optimal ≠ A* optimal): ${wrong.length}${wrong.length ? " — " + wrong.map((r) => r.instance).join(", ") : ""}; audits rejected: ${rows.filter((r) => r.audit.valid === false).length}
(d) median audit ÷ solve time: ${median === null ? "-" : median.toFixed(2)}`);
mkdirSync(dirname(jsonOut), { recursive: true });
writeFileAtomic(jsonOut, JSON.stringify({ dir, timeLimit, jobs, noSuffix, rows }, null, 1) + "\n");
