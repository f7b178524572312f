// Generator entries of a suite (scenario + size + seed) become real files in the bench
// directory: one child process runs the scenario generators (TypeScript, via tsx) for all
// missing instances at once, so suites store seeds and sizes, never generated files.
import { spawnSync } from "node:child_process";
import { existsSync, mkdirSync, readdirSync } from "node:fs";
import { join } from "node:path";
import { PlumblineError } from "../util/errors.js";
import { packageRoot, tsxCli } from "./paths.js";
import type { InstanceSpec } from "./suite.js";

export interface GeneratorSpec {
  scenario: string;
  size: string;
  seed: number;
  params: Record<string, number>;
  /** File stem: size, seed and parameters, e.g. "small-s3". */
  stem: string;
  /** Suite file position of the entry, for error messages. */
  where: string;
}

export const SIZE_WORDS = ["tiny", "small", "medium", "large"];

const domainsDir = () => join(packageRoot(), "benchmarks", "domains");

/** Scenario folders that have a generator (benchmarks/domains/<name>/generate.ts). */
export function scenarioNames(): string[] {
  const dir = domainsDir();
  if (!existsSync(dir)) return [];
  return readdirSync(dir)
    .filter((n) => existsSync(join(dir, n, "generate.ts")) && existsSync(join(dir, n, "domain.pddl")))
    .sort();
}

/** Sets domainFile/problemFile of generator instances to files under `instancesDir`, writing missing ones. */
export function materialiseGenerated(instances: InstanceSpec[], instancesDir: string): void {
  const jobs: Array<{ scenario: string; size: string; seed: number; params: Record<string, number>; domainOut: string; problemOut: string; where: string }> = [];
  for (const inst of instances) {
    const g = inst.generator;
    if (!g) continue;
    const dir = join(instancesDir, g.scenario);
    inst.domainFile = join(dir, "domain.pddl");
    inst.problemFile = join(dir, `${g.stem}.pddl`);
    if (!existsSync(inst.problemFile) || !existsSync(inst.domainFile)) {
      mkdirSync(dir, { recursive: true });
      jobs.push({ scenario: g.scenario, size: g.size, seed: g.seed, params: g.params, domainOut: inst.domainFile, problemOut: inst.problemFile, where: g.where });
    }
  }
  if (jobs.length === 0) return;
  const tsx = tsxCli();
  const script = join(packageRoot(), "benchmarks", "scripts", "generate-instances.ts");
  if (!tsx || !existsSync(script)) {
    throw new PlumblineError("io", `generator entries need the repository checkout with its dev dependencies (tsx and ${script}); run npm ci, or list domain/problem files instead`);
  }
  const r = spawnSync(process.execPath, [tsx, script], { input: JSON.stringify(jobs), encoding: "utf8", maxBuffer: 16 << 20 });
  if (r.status !== 0) {
    const msg = (r.stderr || r.error?.message || `exit code ${r.status}`).trim().split("\n").slice(-3).join("\n");
    throw new PlumblineError("semantic", `generating suite instances failed: ${msg}`);
  }
}
