// Where the package lives and how to start its CLI in a child process: the built
// dist/cli/main.js (what `npm ci` builds), or the TypeScript source through tsx when unbuilt.
import { existsSync, readdirSync, statSync } from "node:fs";
import { createRequire } from "node:module";
import { dirname, join, resolve } from "node:path";
import { fileURLToPath } from "node:url";
import { PlumblineError } from "../util/errors.js";

/** The package root (the folder of package.json): two levels above src/bench or dist/bench. */
export function packageRoot(): string {
  return resolve(dirname(fileURLToPath(import.meta.url)), "..", "..");
}

/** The tsx command-line entry (a dev dependency), or null when it is not installed. */
export function tsxCli(): string | null {
  try {
    return createRequire(join(packageRoot(), "package.json")).resolve("tsx/cli");
  } catch {
    return null;
  }
}

/** Newest modification time (ms) of the .ts files under `dir`, 0 when there are none. */
function newestSource(dir: string): number {
  let newest = 0;
  const walk = (d: string) => {
    for (const e of readdirSync(d, { withFileTypes: true })) {
      const p = join(d, e.name);
      if (e.isDirectory()) walk(p);
      else if (e.name.endsWith(".ts")) newest = Math.max(newest, statSync(p).mtimeMs);
    }
  };
  if (existsSync(dir)) walk(dir);
  return newest;
}

let cached: string[] | null = null;

/**
 * The command that starts plumbline's CLI: [program, ...leading args]. Node options (heap
 * size) go right after the program. Prefers the built CLI (what npm ci builds, and all an
 * installed package has); uses the sources through tsx when there is no build or a source
 * file is newer than it, so a checkout never benchmarks stale code.
 */
export function cliCommand(): string[] {
  if (cached) return cached;
  const root = packageRoot();
  const built = join(root, "dist", "cli", "main.js");
  const source = join(root, "src", "cli", "main.ts");
  const tsx = tsxCli();
  const canUseSource = tsx !== null && existsSync(source);
  const stale = existsSync(built) && canUseSource && newestSource(join(root, "src")) > statSync(built).mtimeMs;
  if (existsSync(built) && !stale) cached = [process.execPath, built];
  else if (canUseSource) cached = [process.execPath, tsx as string, source];
  else throw new PlumblineError("io", `cannot find plumbline's CLI to run: build it first (npm run build creates ${built})`);
  return cached;
}
