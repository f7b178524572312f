// Helpers for the bench tests: quick fake configurations (plain node one-liners that print
// what a plumbline command would), temporary folders, and small suites on disk.
import { existsSync, mkdirSync, mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { dirname, join, resolve } from "node:path";
import type { Configuration } from "../../src/bench/index.js";
import { PlumblineError } from "../../src/util/errors.js";

export const ROOT = resolve(__dirname, "../..");

export function tempDir(tag: string): string {
  return mkdtempSync(join(tmpdir(), `plumbline-${tag}-`));
}

/**
 * A configuration that runs `node -e SCRIPT DOMAIN PROBLEM RUNDIR TIMELIMIT` instead of
 * plumbline; the script sees those as process.argv[1..4].
 */
export function fakeConfig(name: string, script: string): Configuration {
  return { name, summary: "test double", audits: false, external: true, argv: (f, l) => [process.execPath, "-e", script, f.domainFile, f.problemFile, f.runDir, String(l.timeLimit)] };
}

/** Prints an optimal answer whose cost is the problem file's length modulo 50, after `sleepMs`. */
export const quickScript = (sleepMs: number, extra = "") => `
const fs = require("fs");
const start = Date.now();
const cost = fs.readFileSync(process.argv[2], "utf8").length % 50;
setTimeout(() => {
  fs.writeFileSync(require("path").join(process.argv[3], "span.json"), JSON.stringify([start, Date.now()]));
  ${extra}
  process.stdout.write(JSON.stringify({ status: "optimal", cost, lowerBound: cost, plan: ["(a)", "(b)"], seconds: 0.01,
    timeline: [{ seconds: 0.001, upper: cost + 5, lower: 0 }, { seconds: 0.002, upper: cost, lower: cost }] }));
}, ${sleepMs});`;

/** Never answers: sleeps far past any limit. */
export const hangScript = `setTimeout(() => {}, 600000);`;

/** Grows its resident memory by 20 MB every 20 ms and never answers. */
export const hogScript = `const keep = []; setInterval(() => { const b = Buffer.alloc(20 * 1048576, 1); keep.push(b); }, 20);`;

/** Writes files (path → text) under `dir`. */
export function writeTree(dir: string, files: Record<string, string>): void {
  for (const [p, text] of Object.entries(files)) {
    const f = join(dir, p);
    mkdirSync(dirname(f), { recursive: true });
    writeFileSync(f, text);
  }
}

/** A command that starts plumbline's CLI with the bench command in it (built if present, else sources). */
export function plumblineCommand(): string[] {
  const built = join(ROOT, "dist", "cli", "commands", "bench.js");
  if (existsSync(built)) return [process.execPath, join(ROOT, "dist", "cli", "main.js")];
  return [process.execPath, join(ROOT, "node_modules", "tsx", "dist", "cli.mjs"), join(ROOT, "src", "cli", "main.ts")];
}

/** The PlumblineError `f` throws (fails the test if it throws nothing or something else). */
export function errorOf(f: () => unknown): PlumblineError {
  try {
    f();
  } catch (e) {
    if (e instanceof PlumblineError) return e;
    throw e;
  }
  throw new Error("expected a PlumblineError");
}
