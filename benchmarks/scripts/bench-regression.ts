// `npm run bench:regression`: the two targets of regression evidence, measured in one run.
// (1) Re-judging a still-optimal plan after a cost change against solving the changed model from
//     scratch, per scenario instance (ratio of the two, same process, alternating order).
// (2) Bulk audit of the bench's certificates (the small suite, as `npm run bench` writes them):
//     `audit DIR --jobs 2` against `--jobs 1` (the built CLI in a child process, alternating).
//
// Usage: tsx benchmarks/scripts/bench-regression.ts [--part rejudge|audit|both] [--sizes tiny,small]
//          [--only TEXT] [--time-limit S] [--repeat N] [--suite FILE] [--json FILE]
//   (1) takes every committed problem of benchmarks/domains/* of the sizes given, proves it (its
//   certificate), and picks the first cost edit that raises costs only where the recorded plan does
//   not go — a numeric value of the problem (a road, a machine) or an action of the domain that
//   was free — so the plan keeps its cost and, since no cost fell, stays optimal (verdict
//   still-optimal); where every action the plan could avoid is used, every cost doubled instead
//   (the same plans optimal at twice the cost: verdict cost-changed, optimal true). Then, `--repeat`
//   times in alternating order: `rejudge(certificate, edited files)` and `optimizeFiles(edited
//   files)` (GBFS first plan, probes, proof — what `solve` does). Both must prove the same cost.
//   (2) solves every instance of the suite (default benchmarks/suites/small.json, its time limit,
//   encoding forall-1 like the bench's sat-forall), then times the two audits on the folder of
//   certificates; it also prints the best speedup any schedule could reach on 2 cores with these
//   audit times (sum / max(max, sum/2)) — one long certificate caps it.
// Ratios from one run are what to compare; the machine is shared and absolute times are noisy.
import { spawnSync } from "node:child_process";
import { cpSync, existsSync, mkdirSync, mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { basename, join, resolve } from "node:path";
import { generateProblem, scenarioByName, type SizeName } from "../domains/index.js";
import { cliCommand } from "../../src/bench/paths.js";
import { dratChecker, rejudge, stateSpaceChecker, writeCertificate } from "../../src/certify/index.js";
import { disposeOutcome, optimizeFiles } from "../../src/optimize/index.js";
import { modelFromTexts } from "../../src/pddl/index.js";
import { parsePlan, replayPlan } from "../../src/plan/index.js";
import { writeFileAtomic } from "../../src/util/files.js";

const args = process.argv.slice(2);
const value = (name: string): string | undefined => {
  const i = args.indexOf(name);
  return i >= 0 ? args[i + 1] : undefined;
};
const part = value("--part") ?? "both";
const sizes = (value("--sizes") ?? "tiny,small").split(",");
const only = value("--only");
const timeLimit = Number(value("--time-limit") ?? 300);
const repeat = Math.max(1, Number(value("--repeat") ?? 3));
const suiteFile = resolve(value("--suite") ?? join(import.meta.dirname, "../suites/small.json"));
const jsonOut = value("--json") ?? resolve(import.meta.dirname, "../results/regression/latest.json");
const domains = resolve(import.meta.dirname, "../domains");
const work = mkdtempSync(join(tmpdir(), "plumbline-bench-regression-"));
const say = (s: string) => process.stderr.write(s + "\n");
const median = (xs: number[]) => {
  const s = [...xs].sort((a, b) => a - b);
  return s.length % 2 ? s[(s.length - 1) / 2] : (s[s.length / 2 - 1] + s[s.length / 2]) / 2;
};
const geoMean = (xs: number[]) => (xs.length ? Math.exp(xs.reduce((a, x) => a + Math.log(x), 0) / xs.length) : null);
const pad = (rows: string[][]) => {
  const w = rows[0].map((_, i) => Math.max(...rows.map((r) => r[i].length)));
  return rows.map((r) => r.map((c, i) => (i < 2 ? c.padEnd(w[i]) : c.padStart(w[i]))).join("  ")).join("\n");
};

// ---------------------------------------------------------------------------------------------
// (1) re-judge after a cost change vs solve from scratch

interface Edit {
  label: string;
  domain: string;
  problem: string;
}

/** Cost raises, in order: each numeric problem value (doubled, at least +1), then each free action of the domain given cost 1. */
function costRaises(domain: string, problem: string): Edit[] {
  const out: Edit[] = [];
  for (const m of problem.matchAll(/\(=\s*\(([^()]+)\)\s+(\d+)\s*\)/g)) {
    const head = m[1].trim();
    if (head === "total-cost") continue;
    const n = Number(m[2]);
    const to = n + Math.max(1, n);
    out.push({ label: `(${head}) ${n}→${to}`, domain, problem: problem.slice(0, m.index) + `(= (${m[1]}) ${to})` + problem.slice(m.index! + m[0].length) });
  }
  const starts = [...domain.matchAll(/\(:action\s+([^\s()]+)/g)];
  starts.forEach((m, k) => {
    const end = k + 1 < starts.length ? starts[k + 1].index! : domain.length;
    const block = domain.slice(m.index, end);
    const eff = block.indexOf(":effect (and");
    if (eff < 0 || block.includes("increase")) return;
    const at = m.index! + eff + ":effect (and".length;
    out.push({ label: `${m[1]} costs 1`, domain: domain.slice(0, at) + " (increase (total-cost) 1)" + domain.slice(at), problem });
  });
  return out;
}

/** Every cost doubled (numeric problem values and constant costs of the domain): the same plans are optimal, at twice the cost. */
function doubled(domain: string, problem: string): Edit {
  return {
    label: "every cost ×2",
    domain: domain.replace(/\(increase\s+\(total-cost\)\s+(\d+)\s*\)/g, (_m, k: string) => `(increase (total-cost) ${2 * Number(k)})`),
    problem: problem.replace(/\(=\s*\(([^()]+)\)\s+(\d+)\s*\)/g, (m, head: string, n: string) => (head.trim() === "total-cost" ? m : `(= (${head}) ${2 * Number(n)})`)),
  };
}

/**
 * The first raise under which the recorded plan replays at the same cost — no cost fell, so it is
 * still optimal — or else every cost doubled (still optimal at twice the cost); null when neither replays as expected.
 */
function stillOptimalEdit(domain: string, problem: string, plan: string, cost: number): Edit | null {
  const replays = (e: Edit, expected: number) => {
    try {
      const r = replayPlan(modelFromTexts(e.domain, "domain.pddl", e.problem, "problem.pddl"), parsePlan(plan, "plan.txt"));
      return r.valid && r.cost === expected;
    } catch {
      return false; // an edit the model refuses: try the next
    }
  };
  const raise = costRaises(domain, problem).find((e) => replays(e, cost));
  if (raise) return raise;
  const d = doubled(domain, problem);
  return replays(d, 2 * cost) ? d : null;
}

interface RejudgeRow {
  instance: string;
  edit: string;
  verdict: string;
  /** rejudge's `optimal`: true when the recorded plan was proven optimal in the edited model. */
  optimal: boolean | null;
  rejudgeSeconds: number | null;
  scratchSeconds: number | null;
  scratchStatus: string;
  ratio: number | null;
  note: string;
}

async function partRejudge(): Promise<RejudgeRow[]> {
  const rows: RejudgeRow[] = [];
  for (const sc of readdirSync(domains).sort()) {
    const meta = join(domains, sc, "instances.json");
    if (!existsSync(meta)) continue;
    const inst = JSON.parse(readFileSync(meta, "utf8")) as Record<string, { size?: string }>;
    for (const [key, v] of Object.entries(inst)) {
      const name = `${sc}/${key}`;
      if (!sizes.includes(v.size ?? "") || (only && !name.includes(only))) continue;
      const domainFile = join(domains, sc, "domain.pddl");
      const problemFile = join(domains, sc, `${key}.pddl`);
      const row: RejudgeRow = { instance: name, edit: "-", verdict: "-", optimal: null, rejudgeSeconds: null, scratchSeconds: null, scratchStatus: "-", ratio: null, note: "" };
      rows.push(row);
      const cert = join(work, "rejudge", name.replace("/", "-"));
      const first = await optimizeFiles(domainFile, problemFile, { timeLimit });
      try {
        if (!first.certificate) {
          row.note = `original not proven within ${timeLimit} s (${first.status})`;
          say(`  ${name}: ${row.note}`);
          continue;
        }
        await writeCertificate(cert, first.certificate);
      } finally {
        disposeOutcome(first);
      }
      const cost = first.cost!;
      const edit = stillOptimalEdit(readFileSync(domainFile, "utf8"), readFileSync(problemFile, "utf8"), readFileSync(join(cert, "plan.txt"), "utf8"), cost);
      if (!edit) {
        row.note = "no cost edit found that keeps the recorded plan optimal";
        say(`  ${name}: ${row.note}`);
        continue;
      }
      row.edit = edit.label;
      const dir = join(work, "edited", name.replace("/", "-"));
      mkdirSync(dir, { recursive: true });
      writeFileSync(join(dir, "domain.pddl"), edit.domain);
      writeFileSync(join(dir, "problem.pddl"), edit.problem);
      const rj: number[] = [];
      const sc0: number[] = [];
      // at least --repeat pairs, more for fast instances (until each side has run ~1 s, at most 30 pairs): medians of sub-second runs are noisy
      for (let k = 0; k < repeat || (k < 30 && Math.min(rj.reduce((a, x) => a + x, 0), sc0.reduce((a, x) => a + x, 0)) < 1); k++) {
        const runRejudge = async () => {
          const t = performance.now();
          const r = await rejudge(cert, { domain: join(dir, "domain.pddl"), problem: join(dir, "problem.pddl"), timeLimit });
          rj.push((performance.now() - t) / 1000);
          row.verdict = r.verdict;
          row.optimal = r.optimal;
          if (r.optimal === false || r.verdict === "plan-invalid") row.note = `UNEXPECTED verdict ${r.verdict}: the edit keeps the recorded plan optimal`;
        };
        const runScratch = async () => {
          const t = performance.now();
          // what `solve` does: its proof checked before the claim, the exhaustive route available
          const o = await optimizeFiles(join(dir, "domain.pddl"), join(dir, "problem.pddl"), { timeLimit, proofChecker: dratChecker, stateSpaceCheck: stateSpaceChecker });
          sc0.push((performance.now() - t) / 1000);
          row.scratchStatus = o.status;
          const expected = edit.label === "every cost ×2" ? 2 * cost : cost;
          if (o.status === "optimal" && o.cost !== expected) row.note = `UNEXPECTED: from scratch the optimum is ${o.cost}, the recorded plan costs ${expected}`;
          disposeOutcome(o);
        };
        if (k % 2 === 0) {
          await runRejudge();
          await runScratch();
        } else {
          await runScratch();
          await runRejudge();
        }
      }
      row.rejudgeSeconds = median(rj);
      row.scratchSeconds = median(sc0);
      if (row.optimal === true && row.scratchStatus === "optimal") row.ratio = row.rejudgeSeconds / row.scratchSeconds;
      say(`  ${name}: ${edit.label}: rejudge ${row.rejudgeSeconds.toFixed(2)} s (${row.verdict}), from scratch ${row.scratchSeconds.toFixed(2)} s (${row.scratchStatus})${row.note ? ` — ${row.note}` : ""}`);
    }
  }
  return rows;
}

// ---------------------------------------------------------------------------------------------
// (2) bulk audit, --jobs 2 vs --jobs 1

interface AuditRow {
  set: string;
  certificates: number;
  jobs1: number;
  jobs2: number;
  speedup: number;
  bound: number;
  valid: string;
}

const cli = cliCommand();

function auditRun(dir: string, jobs: number): { seconds: number; entries: Array<{ verdict: string; seconds: number }> } {
  const t = performance.now();
  const r = spawnSync(cli[0], [...cli.slice(1), "audit", dir, "--jobs", String(jobs), "--json", "--quiet"], { encoding: "utf8", maxBuffer: 1 << 28 });
  const seconds = (performance.now() - t) / 1000;
  let entries: Array<{ verdict: string; seconds: number }> = [];
  try {
    entries = JSON.parse(r.stdout);
  } catch {
    say(`  audit --jobs ${jobs} printed no JSON (exit ${r.status}): ${r.stderr.trim().split("\n").slice(-1)[0] ?? ""}`);
  }
  return { seconds, entries };
}

function timeAudits(set: string, dir: string): AuditRow {
  const one: number[] = [];
  const two: number[] = [];
  let per: number[] = [];
  let valid = "";
  for (let k = 0; k < repeat; k++) {
    const order = k % 2 === 0 ? [1, 2] : [2, 1];
    for (const jobs of order) {
      const r = auditRun(dir, jobs);
      (jobs === 1 ? one : two).push(r.seconds);
      if (jobs === 1) per = r.entries.map((e) => e.seconds);
      valid = `${r.entries.filter((e) => e.verdict === "valid").length}/${r.entries.length}`;
    }
  }
  const sum = per.reduce((a, x) => a + x, 0);
  const max = Math.max(0, ...per);
  const row: AuditRow = { set, certificates: per.length, jobs1: median(one), jobs2: median(two), speedup: median(one) / median(two), bound: sum > 0 ? sum / Math.max(max, sum / 2) : 1, valid };
  say(`  ${set}: ${row.certificates} certificates, --jobs 1 ${row.jobs1.toFixed(2)} s, --jobs 2 ${row.jobs2.toFixed(2)} s, ×${row.speedup.toFixed(2)} (best possible ×${row.bound.toFixed(2)})`);
  return row;
}

async function partAudit(): Promise<AuditRow[]> {
  const suite = JSON.parse(readFileSync(suiteFile, "utf8")) as { timeLimit?: number; entries: Array<{ scenario: string; size: SizeName; seeds: number[] }> };
  const limit = suite.timeLimit ?? 60;
  const certs = join(work, "certificates");
  mkdirSync(certs, { recursive: true });
  for (const e of suite.entries) {
    for (const seed of e.seeds) {
      const name = `${e.scenario}-${e.size}-s${seed}`;
      const dir = join(work, "suite", name);
      mkdirSync(dir, { recursive: true });
      writeFileSync(join(dir, "problem.pddl"), generateProblem(scenarioByName(e.scenario), e.size, seed));
      const o = await optimizeFiles(join(domains, e.scenario, "domain.pddl"), join(dir, "problem.pddl"), { timeLimit: limit, encoding: "forall-1" });
      try {
        if (o.certificate) await writeCertificate(join(certs, name), o.certificate);
        say(`  ${name}: ${o.status}${o.cost !== null ? ` cost ${o.cost}` : ""} (${o.seconds.toFixed(1)} s)${o.certificate ? "" : ", no certificate"}`);
      } finally {
        disposeOutcome(o);
      }
    }
  }
  const rows = [timeAudits(`${basename(suiteFile, ".json")} suite`, certs)];
  // the same certificates twice (two copies of each): a set where no single audit dominates as much
  const twice = join(work, "twice");
  for (const c of readdirSync(certs)) for (const copy of ["a", "b"]) cpSync(join(certs, c), join(twice, `${c}-${copy}`), { recursive: true });
  rows.push(timeAudits(`${basename(suiteFile, ".json")} suite, each twice`, twice));
  return rows;
}

// ---------------------------------------------------------------------------------------------

const started = new Date().toISOString();
say(`bench:regression: part ${part}, sizes ${sizes.join(",")}, time limit ${timeLimit} s, ${repeat} repeats, CLI ${cli.slice(1).join(" ")}`);
const rejudgeRows = part === "audit" ? [] : await partRejudge();
const auditRows = part === "rejudge" ? [] : await partAudit();
rmSync(work, { recursive: true, force: true });

const f = (x: number | null, d = 2) => (x === null ? "-" : x.toFixed(d));
if (rejudgeRows.length) {
  process.stdout.write(`\nRe-judging a still-optimal plan after a cost change vs solving the changed model from scratch (median of ≥ ${repeat} runs each)\n\n`);
  process.stdout.write(
    pad([["instance", "cost edit", "verdict", "rejudge s", "scratch s", "scratch", "ratio"], ...rejudgeRows.map((r) => [r.instance, r.edit, r.verdict, f(r.rejudgeSeconds), f(r.scratchSeconds), r.scratchStatus, f(r.ratio)])]) + "\n",
  );
  for (const r of rejudgeRows.filter((x) => x.note)) process.stdout.write(`note: ${r.instance}: ${r.note}\n`);
  const all = rejudgeRows.filter((r) => r.ratio !== null);
  const slow = all.filter((r) => r.scratchSeconds! >= 0.5);
  process.stdout.write(`\ngeometric mean rejudge / from scratch over ${all.length} instances: ${f(geoMean(all.map((r) => r.ratio!)))}\n`);
  process.stdout.write(`geometric mean over the ${slow.length} instances taking ≥ 0.5 s from scratch: ${f(geoMean(slow.map((r) => r.ratio!)))}\n`);
}
if (auditRows.length) {
  process.stdout.write(`\nBulk audit: --jobs 2 vs --jobs 1 (wall seconds, median of ${repeat}; "best" = sum / max(longest, sum/2) of the audit times)\n\n`);
  process.stdout.write(
    pad([["certificates", "valid", "n", "jobs 1 s", "jobs 2 s", "speedup", "best"], ...auditRows.map((r) => [r.set, r.valid, String(r.certificates), f(r.jobs1), f(r.jobs2), `×${f(r.speedup)}`, `×${f(r.bound)}`])]) + "\n",
  );
}
mkdirSync(resolve(jsonOut, ".."), { recursive: true });
writeFileAtomic(jsonOut, JSON.stringify({ started, part, sizes, timeLimit, repeat, cli, rejudge: rejudgeRows, audit: auditRows }, null, 2) + "\n");
process.stdout.write(`\nrows written to ${jsonOut}\n`);
