// `npm run bench:ground -- DIR`: parses and grounds every PDDL problem under DIR and prints,
// per problem, facts, actions, zero-cost actions, conditional effects and seconds (limit 2 s).
//
// Usage: tsx benchmarks/scripts/bench-ground.ts DIR [--relevance] [--repeat N] [--limit S] [--json]
// Pairs problem files with `domain-NN.pddl` (same suffix as `problem-NN.pddl`) or `domain.pddl`
// in the same folder. Speed is also given as a ratio to a reference run in this script
// (grounding a generated 7-disc Towers of Hanoi), since the machine is shared and noisy.
import { existsSync, readdirSync, statSync } from "node:fs";
import { basename, dirname, join, relative, resolve } from "node:path";
import { ground, groundFiles, groundStats, type GroundStats } from "../../src/ground/index.js";
import { modelFromTexts } from "../../src/pddl/index.js";

interface Row extends Partial<GroundStats> {
  domain: string;
  problem: string;
  ok: boolean;
  error?: string;
}

function parseArgs(argv: string[]) {
  const o = { dir: null as string | null, relevance: false, repeat: 1, limit: 2, json: false };
  for (let i = 0; i < argv.length; i++) {
    const a = argv[i];
    if (a === "--relevance") o.relevance = true;
    else if (a === "--json") o.json = true;
    else if (a === "--repeat") o.repeat = Math.max(1, Number(argv[++i]));
    else if (a === "--limit") o.limit = Number(argv[++i]);
    else if (a.startsWith("--")) throw new Error(`unknown option ${a}`);
    else o.dir = a;
  }
  if (!o.dir) throw new Error("usage: bench-ground DIR [--relevance] [--repeat N] [--limit S] [--json]");
  return o;
}

/** (domain, problem) pairs under `dir`, sorted by path. */
function findProblems(dir: string): Array<{ domain: string; problem: string }> {
  const out: Array<{ domain: string; problem: string }> = [];
  const walk = (d: string) => {
    for (const name of readdirSync(d).sort()) {
      const p = join(d, name);
      if (statSync(p).isDirectory()) walk(p);
      else if (name.endsWith(".pddl") && !name.toLowerCase().includes("domain")) {
        const paired = join(d, name.replace(/problem/i, "domain"));
        const domain = name.toLowerCase().includes("problem") && existsSync(paired) ? paired : join(d, "domain.pddl");
        if (existsSync(domain)) out.push({ domain, problem: p });
      }
    }
  };
  walk(dir);
  return out;
}

function hanoiText(n: number): { domain: string; problem: string } {
  const domain = `(define (domain hanoi) (:predicates (on ?d ?x) (clear ?x) (smaller ?x ?d))
    (:action move :parameters (?d ?from ?to)
      :precondition (and (smaller ?to ?d) (smaller ?from ?d) (on ?d ?from) (clear ?d) (clear ?to) (not (= ?from ?to)))
      :effect (and (not (on ?d ?from)) (on ?d ?to) (clear ?from) (not (clear ?to)))))`;
  const discs = Array.from({ length: n }, (_, i) => `d${i + 1}`);
  const init: string[] = [];
  discs.forEach((d, i) => {
    for (const p of ["p1", "p2", "p3"]) init.push(`(smaller ${p} ${d})`);
    for (let j = i + 1; j < n; j++) init.push(`(smaller ${discs[j]} ${d})`);
    init.push(`(on ${d} ${i === n - 1 ? "p1" : discs[i + 1]})`);
  });
  const problem = `(define (problem h) (:domain hanoi) (:objects ${discs.join(" ")} p1 p2 p3)
    (:init ${init.join(" ")} (clear d1) (clear p2) (clear p3)) (:goal (on ${discs[n - 1]} p3)))`;
  return { domain, problem };
}

function referenceSeconds(): number {
  const { domain, problem } = hanoiText(7);
  const times: number[] = [];
  for (let i = 0; i < 3; i++) ground(modelFromTexts(domain, "ref-domain.pddl", problem, "ref-problem.pddl")); // warm-up
  for (let i = 0; i < 5; i++) {
    const t = performance.now();
    ground(modelFromTexts(domain, "ref-domain.pddl", problem, "ref-problem.pddl"));
    times.push((performance.now() - t) / 1000);
  }
  times.sort((a, b) => a - b);
  return times[2];
}

function main(): number {
  const o = parseArgs(process.argv.slice(2));
  const root = resolve(o.dir!);
  const pairs = findProblems(root);
  if (pairs.length === 0) {
    console.error(`no PDDL problems found under ${root}`);
    return 2;
  }
  const refBefore = referenceSeconds();
  const rows: Row[] = [];
  for (const { domain, problem } of pairs) {
    const row: Row = { domain: relative(root, dirname(domain)) || basename(root), problem: relative(root, problem), ok: false };
    try {
      let best = Infinity;
      let stats: GroundStats | null = null;
      for (let r = 0; r < o.repeat; r++) {
        const g = groundFiles(domain, problem, { relevance: o.relevance });
        best = Math.min(best, g.seconds);
        stats = groundStats(g.task, g.seconds);
      }
      Object.assign(row, stats, { seconds: best, ok: best < o.limit });
      if (!row.ok) row.error = `took ${best.toFixed(2)} s (limit ${o.limit} s)`;
    } catch (e) {
      row.error = (e as Error).message;
    }
    rows.push(row);
  }
  const refAfter = referenceSeconds();
  const ref = (refBefore + refAfter) / 2;
  if (o.json) {
    console.log(JSON.stringify({ dir: root, relevance: o.relevance, referenceSeconds: ref, rows }, null, 2));
  } else {
    const head = ["problem", "facts", "actions", "zero-cost", "cond-eff", "seconds", "× ref", "status"];
    const table = rows.map((r) => [
      r.problem,
      String(r.facts ?? "-"),
      String(r.actions ?? "-"),
      String(r.zeroCostActions ?? "-"),
      String(r.conditionalEffects ?? "-"),
      r.seconds !== undefined ? r.seconds.toFixed(3) : "-",
      r.seconds !== undefined ? (r.seconds / ref).toFixed(1) : "-",
      r.ok ? "ok" : `FAIL: ${r.error}`,
    ]);
    printTable(head, table);
    console.log("");
    const domains = [...new Set(rows.map((r) => r.domain))];
    printTable(
      ["domain", "problems", "max seconds", "max facts", "max actions", "failed"],
      domains.map((d) => {
        const rs = rows.filter((r) => r.domain === d);
        const max = (f: (r: Row) => number | undefined) => Math.max(...rs.map((r) => f(r) ?? 0));
        return [d, String(rs.length), max((r) => r.seconds).toFixed(3), String(max((r) => r.facts)), String(max((r) => r.actions)), String(rs.filter((r) => !r.ok).length)];
      }),
    );
    console.log(`\nreference (7-disc Hanoi, median of 5 after 3 warm-up runs): ${(refBefore * 1000).toFixed(1)} ms before, ${(refAfter * 1000).toFixed(1)} ms after; relevance pruning ${o.relevance ? "on" : "off"}`);
  }
  const bad = rows.filter((r) => !r.ok);
  if (bad.length && !o.json) console.log(`${bad.length} of ${rows.length} problems failed or exceeded ${o.limit} s`);
  return bad.length ? 1 : 0;
}

function printTable(head: string[], rows: string[][]): void {
  const w = head.map((h, i) => Math.max(h.length, ...rows.map((r) => r[i].length)));
  const line = (r: string[]) => r.map((c, i) => (i === 0 || i === r.length - 1 ? c.padEnd(w[i]) : c.padStart(w[i]))).join("  ").trimEnd();
  console.log(line(head));
  for (const r of rows) console.log(line(r));
}

process.exitCode = main();
