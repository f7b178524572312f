// `npm run bench:solve`: the optimizer on the scenario suite — per instance status, cost, lower
// bound, horizon, formula size, SAT calls, time to first plan / proof, audit time, proof size, memory.
//
// Usage: tsx benchmarks/scripts/bench-solve.ts [DIR] [--time-limit S] [--memory-limit MB]
//          [--encoding ID[,ID…]] [--only TEXT] [--sizes tiny,small,medium] [--cnf-out DIR] [--json FILE]
//   --encoding: a step encoding (default forall-1: the cost encoding chosen by size, the default
//   parts) or a full formula id; several, comma-separated, are run one after the other on each
//   instance (interleaved, so machine load hits them alike), and each after the first is compared
//   with the first: geometric mean of the solve-time and proof-time ratios over the instances both
//   prove by SAT (horizon-unsat).
//   DIR (default benchmarks/domains): every folder with domain.pddl contributes its problem-*.pddl
//   (scenario folders: only the sizes listed, read from instances.json). Each solve and each audit
//   runs in its own child process (the CLI, `--json`), so peak memory is per run.
//   --cnf-out DIR writes, per instance that was proven by SAT, the proof's CNF (formula + bound
//   units, canonical DIMACS) for `npm run bench:sat -- --cnf-dir DIR`.
// Ratios, not absolute times, are what to compare between runs (the machine is shared).
import { spawnSync } from "node:child_process";
import { existsSync, mkdirSync, mkdtempSync, readdirSync, readFileSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { basename, join, resolve } from "node:path";
import { cliCommand } from "../../src/bench/paths.js";
import { writeFileAtomic } from "../../src/util/files.js";

const args = process.argv.slice(2);
const value = (name: string): string | undefined => {
  const i = args.indexOf(name);
  return i >= 0 ? args[i + 1] : undefined;
};
const positional = args.filter((a, i) => !a.startsWith("--") && (i === 0 || !args[i - 1].startsWith("--")));
const dir = resolve(positional[0] ?? join(import.meta.dirname, "../domains"));
const timeLimit = Number(value("--time-limit") ?? 300);
const memoryLimit = Number(value("--memory-limit") ?? 4096);
const encodings = (value("--encoding") ?? "forall-1").split(",");
const only = value("--only");
const sizes = (value("--sizes") ?? "tiny,small,medium").split(",");
const cnfOut = value("--cnf-out");
const jsonOut = value("--json") ?? resolve(import.meta.dirname, "../results/solve/latest.json");

interface Instance {
  name: string;
  domain: string;
  problem: string;
  size: string | null;
}

function instances(): Instance[] {
  const out: Instance[] = [];
  const folders = existsSync(join(dir, "domain.pddl")) ? [dir] : readdirSync(dir).map((d) => join(dir, d)).filter((d) => existsSync(join(d, "domain.pddl")));
  for (const f of folders.sort()) {
    const meta = existsSync(join(f, "instances.json")) ? (JSON.parse(readFileSync(join(f, "instances.json"), "utf8")) as Record<string, { size?: string }>) : null;
    for (const p of readdirSync(f).filter((x) => x.startsWith("problem") && x.endsWith(".pddl")).sort()) {
      const key = p.replace(/\.pddl$/, "");
      const size = meta?.[key]?.size ?? null;
      if (meta && size && !sizes.includes(size)) continue;
      const name = `${basename(f)}/${key}`;
      if (only && !name.includes(only)) continue;
      out.push({ name, domain: join(f, "domain.pddl"), problem: join(f, p), size });
    }
  }
  return out;
}

const cli = cliCommand();
function run(argv: string[], limitS: number): { json: Record<string, any> | null; code: number | null; seconds: number; stderr: string } {
  const t0 = performance.now();
  const r = spawnSync(cli[0], [`--max-old-space-size=${memoryLimit}`, ...cli.slice(1), ...argv], { encoding: "utf8", timeout: (limitS + 30) * 1000, maxBuffer: 1 << 28 });
  const seconds = (performance.now() - t0) / 1000;
  let json: Record<string, any> | null = null;
  try {
    json = JSON.parse(r.stdout);
  } catch {
    json = null;
  }
  return { json, code: r.status, seconds, stderr: r.stderr ?? "" };
}

interface Row {
  instance: string;
  /** What --encoding was given for this run. */
  encoding: string;
  size: string | null;
  status: string;
  cost: number | null;
  lowerBound: number | string | null;
  horizon: number | string | null;
  how: string | null;
  /** The formula id the proof (or the last formula) was built with. */
  formula: string | null;
  variables: number | null;
  clauses: number | null;
  satCalls: number | null;
  firstPlan: number | null;
  proof: number | null;
  solveSeconds: number;
  audit: string;
  auditSeconds: number | null;
  proofBytes: number | null;
  peakMb: number | null;
}

const rows: Row[] = [];
const work = mkdtempSync(join(tmpdir(), "plumbline-bench-solve-"));
if (cnfOut) mkdirSync(cnfOut, { recursive: true });
const list = instances();
process.stderr.write(`bench:solve: ${list.length} instances, time limit ${timeLimit} s, memory limit ${memoryLimit} MB, encoding ${encodings.join(", ")}\n`);
for (const inst of list) for (const encoding of encodings) {
  const cert = join(work, inst.name.replace("/", "-"));
  const s = run(["solve", inst.domain, inst.problem, "--json", "--quiet", "--encoding", encoding, "--time-limit", String(timeLimit), "--memory-limit", String(memoryLimit), "--certificate", cert], timeLimit);
  const j = s.json;
  let audit = "none";
  let auditSeconds: number | null = null;
  if (existsSync(join(cert, "certificate.json"))) {
    const a = run(["audit", cert, "--json", "--quiet"], timeLimit);
    const entry = Array.isArray(a.json) ? a.json[0] : a.json; // audit --json prints one object per certificate, in an array
    audit = entry ? (entry.valid ? "valid" : "REJECTED") : `error (exit ${a.code})`;
    auditSeconds = a.seconds;
    if (cnfOut && j?.how === "horizon-unsat") {
      const c = JSON.parse(readFileSync(join(cert, "certificate.json"), "utf8"));
      const target = join(cnfOut, `${inst.name.replace("/", "-")}-${c.encoding.id}-H${c.encoding.params.steps}.cnf`);
      const e = run(["encode", inst.domain, inst.problem, "--steps", String(c.encoding.params.steps), "--cost-below", String(j.cost), "--encoding", c.encoding.id, "-o", target, "--quiet"], timeLimit);
      if (e.code !== 0) process.stderr.write(`  (could not write ${target}: exit ${e.code})\n`);
    }
  }
  rmSync(cert, { recursive: true, force: true });
  const row: Row = {
    instance: inst.name,
    encoding,
    size: inst.size,
    status: j?.status ?? `error (exit ${s.code}: ${s.stderr.trim().split("\n").slice(-1)[0]?.slice(0, 80) ?? ""})`,
    cost: j?.cost ?? null,
    lowerBound: j?.lowerBound ?? null,
    horizon: j?.horizon ?? null,
    how: j?.how ?? null,
    formula: j?.encoding ?? null,
    variables: j?.variables ?? null,
    clauses: j?.clauses ?? null,
    satCalls: j?.satCalls ?? null,
    firstPlan: j?.timeToFirstPlan ?? null,
    proof: j?.timeToProof ?? null,
    solveSeconds: s.seconds,
    audit,
    auditSeconds,
    proofBytes: j?.proof?.bytes ?? null,
    peakMb: j?.peakMemoryBytes ? j.peakMemoryBytes / 1048576 : null,
  };
  rows.push(row);
  process.stderr.write(`  ${row.instance} [${encoding}]: ${row.status}${row.cost !== null ? ` cost ${row.cost}` : ""} in ${row.solveSeconds.toFixed(1)} s, audit ${row.audit}${auditSeconds !== null ? ` ${auditSeconds.toFixed(1)} s` : ""}\n`);
}
rmSync(work, { recursive: true, force: true });

const f = (x: number | null, d = 1) => (x === null ? "-" : x.toFixed(d));
const header = ["instance", "encoding", "size", "status", "cost", "lb", "H", "how", "formula", "vars", "clauses", "SAT", "1st plan s", "proof s", "solve s", "audit", "audit s", "proof KB", "peak MB"];
const table = rows.map((r) => [
  r.instance,
  r.encoding,
  r.size ?? "-",
  r.status,
  String(r.cost ?? "-"),
  String(r.lowerBound ?? "-"),
  String(r.horizon ?? "-"),
  r.how ?? "-",
  r.formula ?? "-",
  String(r.variables ?? "-"),
  String(r.clauses ?? "-"),
  String(r.satCalls ?? "-"),
  f(r.firstPlan, 2),
  f(r.proof, 1),
  f(r.solveSeconds, 1),
  r.audit,
  f(r.auditSeconds, 1),
  r.proofBytes === null ? "-" : (r.proofBytes / 1024).toFixed(0),
  f(r.peakMb, 0),
]);
const widths = header.map((h, i) => Math.max(h.length, ...table.map((t) => t[i].length)));
const line = (cells: string[]) => cells.map((c, i) => (i < 4 || i === 7 || i === 8 || i === 15 ? c.padEnd(widths[i]) : c.padStart(widths[i]))).join("  ");
process.stdout.write(`${line(header)}\n${table.map(line).join("\n")}\n`);

const median = (xs: number[]) => {
  const s = [...xs].sort((a, b) => a - b);
  return s.length === 0 ? null : s.length % 2 ? s[(s.length - 1) / 2] : (s[s.length / 2 - 1] + s[s.length / 2]) / 2;
};
const geoMean = (xs: number[]) => (xs.length === 0 ? null : Math.exp(xs.reduce((a, x) => a + Math.log(x), 0) / xs.length));
const summary: Record<string, unknown> = {};
for (const encoding of encodings) {
  const mine = rows.filter((r) => r.encoding === encoding);
  const proven = mine.filter((r) => r.status === "optimal" || r.status === "unsolvable");
  const audited = mine.filter((r) => r.audit === "valid" && r.auditSeconds !== null);
  const auditRatio = median(audited.map((r) => r.auditSeconds! / Math.max(1e-3, r.solveSeconds)));
  const smallMedium = mine.filter((r) => r.size === "small" || r.size === "medium");
  const both = smallMedium.filter((r) => (r.status === "optimal" || r.status === "unsolvable") && r.audit === "valid").length;
  process.stdout.write(
    `\n[${encoding}] proven: ${proven.length}/${mine.length}; audited valid: ${audited.length}; rejected: ${mine.filter((r) => r.audit === "REJECTED").length}\n` +
      `[${encoding}] small+medium proven and audited within ${timeLimit} s: ${both}/${smallMedium.length}\n` +
      `[${encoding}] median audit time / solve time (audited instances): ${auditRatio === null ? "-" : auditRatio.toFixed(2)}\n`,
  );
  const entry: Record<string, unknown> = { proven: proven.length, instances: mine.length, smallMediumProvenAudited: both, auditToSolveMedian: auditRatio };
  if (encoding !== encodings[0]) {
    // against the first encoding, on the instances both prove by SAT
    const pairs = mine.flatMap((r) => {
      const ref = rows.find((x) => x.encoding === encodings[0] && x.instance === r.instance);
      return ref && ref.how === "horizon-unsat" && r.how === "horizon-unsat" && ref.proof !== null && r.proof !== null ? [{ r, ref }] : [];
    });
    const solveRatio = geoMean(pairs.map(({ r, ref }) => r.solveSeconds / ref.solveSeconds));
    const proofRatio = geoMean(pairs.map(({ r, ref }) => Math.max(r.proof!, 0.01) / Math.max(ref.proof!, 0.01)));
    process.stdout.write(
      `[${encoding}] vs [${encodings[0]}] on ${pairs.length} instances both prove by SAT: solve time × ${solveRatio?.toFixed(2) ?? "-"}, proof time × ${proofRatio?.toFixed(2) ?? "-"} (geometric means; < 1 is faster)\n`,
    );
    Object.assign(entry, { comparedInstances: pairs.length, solveRatio, proofRatio });
  }
  summary[encoding] = entry;
}
mkdirSync(resolve(jsonOut, ".."), { recursive: true });
writeFileAtomic(jsonOut, JSON.stringify({ dir, timeLimit, memoryLimit, encodings, rows, summary }, null, 2) + "\n");
