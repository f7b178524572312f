// `npm run demo`: runs the built CLI on a bundled scenario instance with zero-cost actions
// (grounding statistics, then a replay of its committed plan); add steps to the list below.
import { spawnSync } from "node:child_process";
import { existsSync, readFileSync } from "node:fs";
import { dirname, join, relative } from "node:path";
import { fileURLToPath } from "node:url";

const root = join(dirname(fileURLToPath(import.meta.url)), "..");
const cli = join(root, "dist", "cli", "main.js");

// The bundled instance: a harbour where the crane work is free and the cheapest delivery
// takes more actions than the quickest one (see benchmarks/domains/harbour/README.md).
const scenario = "harbour";
const instance = "problem-02";
const dir = join(root, "benchmarks", "domains", scenario);
const domain = join(dir, "domain.pddl");
const problem = join(dir, `${instance}.pddl`);
const plan = join(dir, `${instance}.plan`);

/** The demo, one CLI call per step (later: solve, audit). */
const steps = [
  { title: "Ground the model (facts, actions, zero-cost actions)", args: ["ground", domain, problem] },
  { title: "Replay the committed plan on the lifted model (valid? cost?)", args: ["replay", domain, problem, plan] },
];

if (!existsSync(cli)) {
  process.stderr.write(`demo: ${relative(root, cli)} is missing; build first with "npm run build" (npm ci does it too)\n`);
  process.exit(2);
}

const rel = (p) => relative(root, p);
const record = JSON.parse(readFileSync(join(dir, "instances.json"), "utf8"))[instance];
process.stdout.write(`plumbline demo: ${scenario} scenario, ${rel(problem)}\n`);
process.stdout.write(
  `Trucks pay the road length for every drive; the cranes load and unload for free.\n` +
    `Recorded for this instance: cheapest cost ${record.optimalCost} in ${record.optimalLength} actions, ` +
    `while the shortest plans (${record.shortestLength} actions) cost at least ${record.cheapestAtShortestLength}.\n`,
);

let failed = false;
for (const [i, step] of steps.entries()) {
  process.stdout.write(`\n[${i + 1}/${steps.length}] ${step.title}\n$ plumbline ${step.args.map((a) => (a.startsWith(root) ? rel(a) : a)).join(" ")}\n`);
  const r = spawnSync(process.execPath, [cli, ...step.args], { cwd: root, encoding: "utf8" });
  process.stdout.write(r.stdout ?? "");
  if (r.stderr) process.stderr.write(r.stderr);
  if (r.status !== 0) {
    process.stdout.write(`(step ${i + 1} exited with code ${r.status})\n`);
    failed = true;
    break;
  }
}

process.stdout.write(
  `\nNote: plans are only as good as the model — a plan that is valid and cheapest for this model is unsafe\n` +
    `if the model leaves out a rule of the real harbour; review the model before acting on a schedule.\n`,
);
process.exitCode = failed ? 1 : 0;
