// `npm run bench:sat-dir -- DIR`: the built-in solver on every .cnf of a folder, optionally
// beside a reference copy of the solver in the same run (speed ratios) and with proof checking.
// Usage: npm run bench:sat-dir -- DIR [--time-limit S] [--only TEXT[,TEXT…]] [--ref ROOT]
//          [--conflicts N] [--proof-dir OUT] [--check]
//   --conflicts N    stop each run after N conflicts (equal work for both solvers: compare c/s)
//   --ref ROOT       also run ROOT/src/sat/index.ts (e.g. a copy of an earlier commit) on each file,
//                    alternating with the current solver; prints time and conflict-rate ratios
//   --proof-dir OUT  keep the current solver's binary DRAT proof of each file in OUT (both solvers
//                    log proofs whenever --proof-dir or --check is given)
//   --check          check each unsat proof with the independent checker (src/proof)
import { mkdirSync, readdirSync, readFileSync, rmSync } from "node:fs";
import { basename, join, resolve } from "node:path";
import { pathToFileURL } from "node:url";
import { checkDrat, readCnfForChecker } from "../../src/proof/index.js";
import * as current from "../../src/sat/index.js";

type SatModule = typeof current;

interface Run {
  status: string;
  seconds: number;
  conflicts: number;
  propagations: number;
  proofPath?: string;
}

const args = process.argv.slice(2);
const value = (name: string): string | undefined => {
  const i = args.indexOf(name);
  return i >= 0 ? args[i + 1] : undefined;
};
const dir = args.find((a, i) => !a.startsWith("--") && (i === 0 || !["--time-limit", "--only", "--ref", "--proof-dir", "--conflicts"].includes(args[i - 1])));
if (dir === undefined) {
  console.error("usage: npm run bench:sat-dir -- DIR [--time-limit S] [--only TEXT[,TEXT…]] [--ref ROOT] [--conflicts N] [--proof-dir OUT] [--check]");
  process.exit(2);
}
const limitS = Number(value("--time-limit") ?? 60);
const conflictLimit = value("--conflicts") === undefined ? undefined : Number(value("--conflicts"));
const only = value("--only")?.split(",");
const refRoot = value("--ref");
const proofDir = value("--proof-dir");
const check = args.includes("--check");
const ref: SatModule | null = refRoot === undefined ? null : ((await import(pathToFileURL(resolve(refRoot, "src/sat/index.ts")).href)) as SatModule);
if (proofDir !== undefined) mkdirSync(proofDir, { recursive: true });

function runOnce(mod: SatModule, file: string, proofPath: string | undefined): Run {
  const cnf = mod.readDimacsFile(file);
  const sink = proofPath === undefined ? null : new mod.FileProofWriter(proofPath, "binary");
  const solver = new mod.Solver({ proof: sink });
  const t0 = performance.now();
  solver.addCnf(cnf);
  const status = solver.solve([], { deadline: Date.now() + limitS * 1000, conflicts: conflictLimit });
  const seconds = (performance.now() - t0) / 1000;
  sink?.close();
  const st = solver.stats();
  return { status, seconds, conflicts: st.conflicts, propagations: st.propagations, proofPath };
}

const fmt = (r: Run) => `${r.status.padEnd(7)} ${r.seconds.toFixed(2).padStart(7)}s ${String(r.conflicts).padStart(8)} confl ${String(Math.round(r.conflicts / r.seconds)).padStart(6)} c/s ${(r.propagations / r.seconds / 1e6).toFixed(2)}M p/s`;

let files = readdirSync(dir).filter((f) => f.endsWith(".cnf")).sort();
if (only) files = files.filter((f) => only.some((o) => f.includes(o)));
console.log(`# ${files.length} files from ${dir}, time limit ${limitS}s${ref ? `, reference ${refRoot}` : ""}`);
let sumNew = 0;
let sumRef = 0;
let failures = 0;
for (const f of files) {
  const path = join(dir, f);
  const proofPath = proofDir === undefined && !check ? undefined : join(proofDir ?? "/tmp", `${basename(f, ".cnf")}.${process.pid}.drat`);
  const r = runOnce(current, path, proofPath);
  let line = `${f.padEnd(26)} new ${fmt(r)}`;
  if (ref !== null) {
    // the reference logs a proof too when the current solver does (same work), then drops it
    const refProof = proofPath === undefined ? undefined : `${proofPath}.ref`;
    const q = runOnce(ref, path, refProof);
    if (refProof !== undefined) rmSync(refProof, { force: true });
    line += ` | ref ${fmt(q)}`;
    if (r.status !== "unknown" && q.status !== "unknown" && r.status !== q.status) {
      line += " | ANSWERS DIFFER";
      failures++;
    }
    if (r.status !== "unknown" && q.status !== "unknown") {
      sumNew += r.seconds;
      sumRef += q.seconds;
    }
    line += ` | time ×${(q.seconds / r.seconds).toFixed(2)} c/s ×${(r.conflicts / r.seconds / (q.conflicts / q.seconds)).toFixed(2)}`;
  }
  if (check && r.status === "unsat" && proofPath !== undefined) {
    const t0 = performance.now();
    const res = checkDrat(readCnfForChecker(readFileSync(path), path), readFileSync(proofPath));
    line += ` | proof ${res.valid ? "valid" : `REJECTED (${res.reason})`} in ${((performance.now() - t0) / 1000).toFixed(1)}s`;
    if (!res.valid) failures++;
  }
  if (proofDir === undefined && proofPath !== undefined) rmSync(proofPath, { force: true });
  console.log(line);
}
if (ref !== null && sumNew > 0) console.log(`# solved by both: new ${sumNew.toFixed(1)}s, ref ${sumRef.toFixed(1)}s, speed-up ×${(sumRef / sumNew).toFixed(2)}`);
if (failures > 0) {
  console.log(`# ${failures} FAILURE(S)`);
  process.exit(1);
}
