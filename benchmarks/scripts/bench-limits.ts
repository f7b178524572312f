// Measures how fast limits and signals stop plumbline: every command with --time-limit on a task it
// cannot finish (overrun past the limit), and SIGINT / SIGTERM sent at several moments of a solve
// (latency to exit, exit code, plan written, temporary files left). Prints tables; asserts nothing.
//
//   npm run bench:limits [-- --limit S] [--times 0.5,2,5,10] [--signals SIGINT,SIGTERM] [--keep]
//
// The tasks are generated here (large harbour and warehouse scenarios), so no input folder is needed.
import { spawn } from "node:child_process";
import * as fs from "node:fs";
import { tmpdir } from "node:os";
import * as path from "node:path";
import { fileURLToPath } from "node:url";
import { harbour } from "../domains/harbour/generate.js";
import { generateProblem } from "../domains/lib/scenario.js";

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "../..");
const args = process.argv.slice(2);
const opt = (name: string, dflt: string) => {
  const i = args.indexOf(name);
  return i >= 0 && args[i + 1] !== undefined ? args[i + 1] : dflt;
};
const LIMIT = Number(opt("--limit", "3"));
const TIMES = opt("--times", "0.5,1.5,3,6,10,16").split(",").map(Number);
const SIGNALS = opt("--signals", "SIGINT,SIGTERM").split(",") as NodeJS.Signals[];
const keep = args.includes("--keep");

/** The CLI: the build when present and not older than the sources, else the sources through tsx. */
function cliCommand(): string[] {
  const dist = path.join(root, "dist/cli/main.js");
  if (fs.existsSync(dist)) return [process.execPath, dist];
  return [process.execPath, "--import", path.join(root, "node_modules/tsx/dist/loader.mjs"), path.join(root, "src/cli/main.ts")];
}

interface Run {
  code: number | null;
  signal: string | null;
  wall: number;
  /** Seconds from the signal to the exit (signal runs). */
  latency: number | null;
  stderr: string;
  stdout: string;
  leftovers: string[];
}

function run(argv: string[], opts: { signalAt?: number; signal?: NodeJS.Signals; killAfter?: number } = {}): Promise<Run> {
  const tmp = fs.mkdtempSync(path.join(tmpdir(), "plumbline-bench-limits-"));
  const [cmd, ...pre] = cliCommand();
  return new Promise((resolve) => {
    const t0 = performance.now();
    const child = spawn(cmd, [...pre, ...argv], { env: { ...process.env, TMPDIR: tmp }, stdio: ["ignore", "pipe", "pipe"] });
    let out = "";
    let err = "";
    child.stdout.on("data", (b: Buffer) => (out += b.toString()));
    child.stderr.on("data", (b: Buffer) => (err += b.toString()));
    let sentAt: number | null = null;
    const timers: NodeJS.Timeout[] = [];
    if (opts.signalAt !== undefined) {
      timers.push(
        setTimeout(() => {
          sentAt = performance.now();
          child.kill(opts.signal ?? "SIGINT");
        }, opts.signalAt * 1000),
      );
    }
    // a hang is a result too: stop it 60 s past what it was allowed
    timers.push(setTimeout(() => child.kill("SIGKILL"), (opts.killAfter ?? 120) * 1000));
    child.on("close", (code, signal) => {
      for (const t of timers) clearTimeout(t);
      const end = performance.now();
      const leftovers = fs.readdirSync(tmp);
      fs.rmSync(tmp, { recursive: true, force: true });
      resolve({ code, signal, wall: (end - t0) / 1000, latency: sentAt === null ? null : (end - sentAt) / 1000, stderr: err, stdout: out, leftovers });
    });
  });
}

/** The last progress line printed before `seconds` (what the run was doing when signalled). */
function phaseAt(stderr: string): string {
  const lines = stderr.split("\n").filter((l) => /^\[\s*[\d.]+ s\]/.test(l));
  return lines.length ? lines[lines.length - 1].replace(/\s+/g, " ").slice(0, 70) : "(before the first progress line: reading, grounding or analysing)";
}

const pad = (s: string, n: number) => (s.length >= n ? s : s + " ".repeat(n - s.length));

async function main(): Promise<void> {
  const work = fs.mkdtempSync(path.join(tmpdir(), "plumbline-limits-"));
  const D = path.join(root, "benchmarks/domains/harbour/domain.pddl");
  const big = path.join(work, "harbour-60.pddl");
  fs.writeFileSync(big, generateProblem(harbour, "large", 1, { sites: 60, trucks: 20, containers: 40, home: 5 }));
  const medium = path.join(root, "benchmarks/domains/harbour/problem-05.pddl");
  console.log(`CLI: ${cliCommand().join(" ")}\nbig task: harbour generator --sites 60 --trucks 20 --containers 40 --home 5 (${big})\n`);

  // --- 1. every command with a time limit on a task it cannot finish -----------------------
  const plan = path.join(work, "p.txt");
  fs.writeFileSync(plan, "(drive t1 quay1 yard1)\n");
  const cert = path.join(work, "cert");
  const cnf = path.join(work, "f.cnf");
  // a certificate and a formula from the medium task, for audit, check-proof and sat
  await run(["solve", D, path.join(root, "benchmarks/domains/harbour/problem-02.pddl"), "--certificate", cert, "--quiet"]);
  await run(["encode", D, medium, "--steps", "40", "--cost-below", "53", "-o", cnf]);
  const cases: Array<[string, string[]]> = [
    ["solve", ["solve", D, big]],
    ["search (A*)", ["search", D, big]],
    ["search --greedy", ["search", D, big, "--greedy"]],
    ["horizon", ["horizon", D, big]],
    ["measure", ["measure", D, big, "--max-reachable-states", "100000000"]],
    ["ground", ["ground", D, big]],
    ["encode", ["encode", D, big, "--steps", "60", "-o", path.join(work, "big.cnf")]],
    ["compare", ["compare", D, big, plan]],
    ["sat", ["sat", cnf]],
    ["check-proof (forward)", ["check-proof", cnf, cnf]],
    ["audit", ["audit", cert]],
  ];
  console.log(`time limit ${LIMIT} s: wall time and overrun (wall − limit) per command`);
  console.log(`${pad("command", 24)} ${pad("exit", 5)} ${pad("wall s", 8)} ${pad("overrun s", 10)} temp left`);
  for (const [name, argv] of cases) {
    const r = await run([...argv, "--time-limit", String(LIMIT)], { killAfter: LIMIT + 60 });
    console.log(`${pad(name, 24)} ${pad(String(r.code ?? r.signal), 5)} ${pad(r.wall.toFixed(2), 8)} ${pad((r.wall - LIMIT).toFixed(2), 10)} ${r.leftovers.length}`);
  }

  // --- 2. signals at several moments of a solve ---------------------------------------------
  console.log(`\nsolve ${path.basename(big)} --plan FILE, a signal at t seconds: latency from the signal to the exit`);
  console.log(`${pad("signal", 8)} ${pad("t s", 5)} ${pad("exit", 5)} ${pad("latency s", 10)} ${pad("plan", 6)} ${pad("temp", 5)} doing`);
  for (const sig of SIGNALS) {
    for (const t of TIMES) {
      const pf = path.join(work, `plan-${sig}-${t}.txt`);
      fs.rmSync(pf, { force: true });
      const r = await run(["solve", D, big, "--plan", pf], { signalAt: t, signal: sig, killAfter: t + 60 });
      const before = r.stderr.slice(0, Math.max(0, r.stderr.indexOf("plumbline: ")));
      console.log(`${pad(sig, 8)} ${pad(String(t), 5)} ${pad(String(r.code ?? r.signal), 5)} ${pad(r.latency?.toFixed(2) ?? "-", 10)} ${pad(fs.existsSync(pf) ? "yes" : "no", 6)} ${pad(String(r.leftovers.length), 5)} ${phaseAt(before)}`);
    }
  }
  if (keep) console.log(`\nfiles kept in ${work}`);
  else fs.rmSync(work, { recursive: true, force: true });
}

await main();
