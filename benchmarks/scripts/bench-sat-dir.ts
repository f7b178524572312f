// `npm run bench:sat-dir -- [DIR]`: the built-in solver on every .cnf of a folder, optionally beside
// a reference copy of the solver and a native solver in the same run, with proofs and checking.
// Usage: npm run bench:sat-dir -- [DIR] [--time-limit S] [--only TEXT[,TEXT…]] [--ref ROOT]
//          [--native CMD] [--modes plain,drat] [--conflicts N] [--proof-dir OUT] [--check]
//   DIR              default benchmarks/results/sat-formulas (written by `npm run bench:sat-formulas`)
//   --conflicts N    stop each run after N conflicts (equal work for both solvers: compare c/s)
//   --ref ROOT       also run ROOT/src/sat/index.ts (e.g. a copy of an earlier commit) on each file,
//                    alternating with the current solver; prints time and conflict-rate ratios
//   --native CMD     also run a native DIMACS solver (e.g. `cadical`) on each file: `CMD FILE` and,
//                    for the drat mode, `CMD FILE PROOF` (or CMD with {cnf} and {proof} in it); prints
//                    its CPU seconds and the geometric mean of ours ÷ native. Skipped with a message
//                    when CMD cannot be run. For comparison only: the project never needs it.
//   --modes M,…      plain (no proof), drat (both solvers write a binary DRAT proof to a file);
//                    default plain, or plain,drat with --native
//   --proof-dir OUT  keep our binary DRAT proof of each file in OUT
//   --check          check each unsat DRAT proof with the independent checker (src/proof)
// Times and --time-limit are CPU seconds of the solving process (ours: this process, parse + load +
// solve; native: the child, from /proc), which a busy shared machine disturbs far less than
// wall-clock time; wall seconds are printed beside them. Off Linux, wall-clock time is used.
import { spawn, spawnSync } from "node:child_process";
import { existsSync, mkdirSync, mkdtempSync, readdirSync, readFileSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { basename, join, resolve } from "node:path";
import { pathToFileURL } from "node:url";
import { checkDrat, readCnfForChecker } from "../../src/proof/index.js";
import * as current from "../../src/sat/index.js";

type SatModule = typeof current;
type Mode = "plain" | "drat";

interface Run {
  status: string;
  cpu: number;
  wall: number;
  conflicts: number;
  propagations: number;
}

const args = process.argv.slice(2);
const valued = ["--time-limit", "--only", "--ref", "--proof-dir", "--conflicts", "--native", "--modes"];
const value = (name: string): string | undefined => {
  const i = args.indexOf(name);
  return i >= 0 ? args[i + 1] : undefined;
};
const dir = args.find((a, i) => !a.startsWith("--") && (i === 0 || !valued.includes(args[i - 1]))) ?? resolve(import.meta.dirname, "../results/sat-formulas");
if (!existsSync(dir)) {
  console.error(`bench:sat-dir: no folder ${dir} (run \`npm run bench:sat-formulas\` first, or name a folder of .cnf files)`);
  process.exit(2);
}
const limitS = Number(value("--time-limit") ?? 60);
const conflictLimit = value("--conflicts") === undefined ? undefined : Number(value("--conflicts"));
const only = value("--only")?.split(",");
const refRoot = value("--ref");
const proofDir = value("--proof-dir");
const check = args.includes("--check");
let native = value("--native") ?? null;
const modes = (value("--modes") ?? (native ? "plain,drat" : "plain")).split(",") as Mode[];
for (const m of modes) if (!["plain", "drat"].includes(m)) throw new Error(`--modes: unknown mode ${m} (plain, drat)`);
const ref: SatModule | null = refRoot === undefined ? null : ((await import(pathToFileURL(resolve(refRoot, "src/sat/index.ts")).href)) as SatModule);
if (proofDir !== undefined) mkdirSync(proofDir, { recursive: true });
const work = mkdtempSync(join(tmpdir(), "bench-sat-dir-"));

if (native !== null) {
  const words = current.splitCommand(native);
  const probe = spawnSync(words[0], ["--version"], { stdio: "ignore", timeout: 10_000 });
  if (probe.error) {
    console.log(`# native solver '${words[0]}' cannot be run (${(probe.error as NodeJS.ErrnoException).code ?? probe.error.message}): skipping the native columns`);
    native = null;
  }
}

/**
 * CPU seconds (user + system) from /proc/PID/stat: of process `pid`, or with `children` of the
 * waited-for children of this process; null when unavailable.
 */
function procCpu(pid: number | "self", children = false): number | null {
  try {
    const stat = readFileSync(`/proc/${pid}/stat`, "latin1");
    const f = stat.slice(stat.lastIndexOf(")") + 2).split(" ");
    // fields after the command start at field 3 (state): utime 14, stime 15, cutime 16, cstime 17
    const at = children ? 13 : 11;
    return (Number(f[at]) + Number(f[at + 1])) / 100; // USER_HZ is 100 on Linux
  } catch {
    return null;
  }
}

function ownCpu(): number {
  const u = process.cpuUsage();
  return (u.user + u.system) / 1e6;
}

/** Our solver, stopped after `limitS` CPU seconds (checked between solveAsync's time slices). */
async function runOurs(mod: SatModule, file: string, mode: Mode, proofPath: string | undefined): Promise<Run> {
  const c0 = ownCpu();
  const t0 = performance.now();
  const cnf = mod.readDimacsFile(file);
  const sink = mode === "drat" && proofPath !== undefined ? new mod.FileProofWriter(proofPath, "binary") : null;
  const solver = new mod.Solver({ proof: sink });
  solver.addCnf(cnf);
  const ac = new AbortController();
  const timer = setInterval(() => {
    if (ownCpu() - c0 > limitS) ac.abort();
  }, 100);
  const status = await solver.solveAsync([], { signal: ac.signal, conflicts: conflictLimit, deadline: Date.now() + 20 * limitS * 1000 });
  clearInterval(timer);
  sink?.close();
  const st = solver.stats();
  return { status, cpu: ownCpu() - c0, wall: (performance.now() - t0) / 1000, conflicts: st.conflicts, propagations: st.propagations };
}

/** The native solver as a child process, killed after `limitS` CPU seconds. */
function runNative(cmd: string, file: string, proofPath: string | undefined): Promise<Run> {
  const words = current.splitCommand(cmd);
  let argv = words.slice(1).map((w) => w.replaceAll("{cnf}", file).replaceAll("{proof}", proofPath ?? ""));
  if (!words.some((w) => w.includes("{cnf}"))) argv.push(file);
  if (proofPath !== undefined && !words.some((w) => w.includes("{proof}"))) argv.push(proofPath);
  argv = argv.filter((a) => a !== "");
  const t0 = performance.now();
  const reaped0 = procCpu("self", true);
  return new Promise((done) => {
    const child = spawn(words[0], argv, { stdio: ["ignore", "pipe", "ignore"] });
    let out = "";
    let cpu = 0;
    let killed = false;
    child.stdout.setEncoding("latin1");
    // keep only the head of the output: the status line comes before any model lines
    child.stdout.on("data", (d: string) => {
      if (out.length < 1 << 16) out += d;
    });
    const poll = setInterval(() => {
      const c = procCpu(child.pid!);
      if (c !== null) cpu = c;
      const over = c === null ? (performance.now() - t0) / 1000 > limitS : c > limitS;
      if (over && !killed) {
        killed = true;
        child.kill("SIGKILL");
      }
    }, 50);
    child.on("close", () => {
      clearInterval(poll);
      const wall = (performance.now() - t0) / 1000;
      const s = /^s (\S+)/m.exec(out)?.[1];
      const status = killed ? "unknown" : s === "SATISFIABLE" ? "sat" : s === "UNSATISFIABLE" ? "unsat" : "unknown";
      // exact: the child's time is added to ours when it is reaped; off Linux, wall-clock time
      const reaped1 = procCpu("self", true);
      const total = reaped0 === null || reaped1 === null ? wall : Math.max(reaped1 - reaped0, cpu);
      done({ status, cpu: Math.max(total, 0.01), wall, conflicts: 0, propagations: 0 });
    });
  });
}

const fmt = (r: Run) => `${r.status.padEnd(7)} ${r.cpu.toFixed(2).padStart(7)}s cpu ${r.wall.toFixed(2).padStart(7)}s wall`;
const fmtOurs = (r: Run) => `${fmt(r)} ${String(r.conflicts).padStart(8)} confl ${String(Math.round(r.conflicts / r.cpu)).padStart(6)} c/s`;

let files = readdirSync(dir).filter((f) => f.endsWith(".cnf")).sort();
if (only) files = files.filter((f) => only.some((o) => f.includes(o)));
console.log(`# ${files.length} files from ${dir}, time limit ${limitS}s, modes ${modes.join(",")}${ref ? `, reference ${refRoot}` : ""}${native ? `, native '${native}'` : ""}`);
// warm-up: let the JIT compile the solver's hot loops before the first timed run
if (files.length > 0) {
  const w = new current.Solver();
  w.addCnf(current.readDimacsFile(join(dir, files[0])));
  w.solve([], { conflicts: 3000, deadline: Date.now() + 10_000 });
}
const logRatio: Record<string, { all: number[]; unsat: number[]; sat: number[] }> = {};
const refSums: Record<string, { cur: number; ref: number }> = {};
let failures = 0;
for (const f of files) {
  const path = join(dir, f);
  for (const mode of modes) {
    const proofPath = mode === "drat" ? join(proofDir ?? work, `${basename(f, ".cnf")}.${process.pid}.drat`) : undefined;
    const r = await runOurs(current, path, mode, proofPath);
    let line = `${f.padEnd(34)} ${mode.padEnd(5)} ours ${fmtOurs(r)}`;
    if (check && mode === "drat" && r.status === "unsat" && proofPath !== undefined) {
      const t0 = performance.now();
      const res = checkDrat(readCnfForChecker(readFileSync(path), path), readFileSync(proofPath));
      line += ` | drat ${res.valid ? "valid" : `REJECTED (${res.reason})`} in ${((performance.now() - t0) / 1000).toFixed(1)}s`;
      if (!res.valid) failures++;
    }
    if (proofDir === undefined && proofPath !== undefined) rmSync(proofPath, { force: true });
    if (ref !== null) {
      const refProof = proofPath === undefined ? undefined : `${proofPath}.ref`;
      const q = await runOurs(ref, path, mode, refProof);
      if (refProof !== undefined) rmSync(refProof, { force: true });
      line += ` | ref ${fmtOurs(q)} | time ×${(q.cpu / r.cpu).toFixed(2)} c/s ×${(r.conflicts / r.cpu / (q.conflicts / q.cpu)).toFixed(2)}`;
      if (r.status !== "unknown" && q.status !== "unknown") {
        if (r.status !== q.status) {
          line += " | ANSWERS DIFFER";
          failures++;
        }
        const s = (refSums[mode] ??= { cur: 0, ref: 0 });
        s.cur += r.cpu;
        s.ref += q.cpu;
      }
    }
    if (native !== null) {
      const nativeProof = mode === "drat" ? join(work, `${basename(f, ".cnf")}.native.drat`) : undefined;
      const q = await runNative(native, path, nativeProof);
      if (nativeProof !== undefined) rmSync(nativeProof, { force: true });
      line += ` | native ${fmt(q)}`;
      if (r.status !== "unknown" && q.status !== "unknown") {
        if (r.status !== q.status) {
          line += " | ANSWERS DIFFER";
          failures++;
        }
        const ratio = r.cpu / Math.max(q.cpu, 0.01);
        line += ` | ours÷native ×${ratio.toFixed(2)}`;
        const lr = (logRatio[mode] ??= { all: [], unsat: [], sat: [] });
        lr.all.push(Math.log(ratio));
        (r.status === "unsat" ? lr.unsat : lr.sat).push(Math.log(ratio));
      }
    }
    console.log(line);
  }
}
rmSync(work, { recursive: true, force: true });
const gm = (xs: number[]) => (xs.length === 0 ? "-" : `×${Math.exp(xs.reduce((a, b) => a + b, 0) / xs.length).toFixed(2)} over ${xs.length}`);
for (const [mode, s] of Object.entries(refSums)) console.log(`# ${mode}: solved by both, CPU: current ${s.cur.toFixed(1)}s, ref ${s.ref.toFixed(1)}s, speed-up ×${(s.ref / s.cur).toFixed(2)}`);
for (const [mode, lr] of Object.entries(logRatio)) {
  console.log(`# ${mode}: ours ÷ native CPU time, geometric mean: all ${gm(lr.all)}; unsat ${gm(lr.unsat)}; sat ${gm(lr.sat)}`);
}
if (failures > 0) {
  console.log(`# ${failures} FAILURE(S)`);
  process.exit(1);
}
