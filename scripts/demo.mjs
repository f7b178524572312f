// `npm run demo`: runs the built CLI on a bundled scenario instance with zero-cost actions:
// grounding statistics, solve with a certificate, audit of that certificate; add steps below.
// Progress (stderr) shows as it comes, before each step's result; the files stay for a look.
import { spawnSync } from "node:child_process";
import { existsSync, mkdtempSync, readFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { dirname, join, relative } from "node:path";
import { fileURLToPath } from "node:url";

const root = join(dirname(fileURLToPath(import.meta.url)), "..");
const cli = join(root, "dist", "cli", "main.js");

// The bundled instance: a harbour where the crane work is free and the cheapest delivery
// takes more actions than the quickest one (see benchmarks/domains/harbour/README.md).
const scenario = "harbour";
const instance = "problem-01";
const dir = join(root, "benchmarks", "domains", scenario);
const domain = join(dir, "domain.pddl");
const problem = join(dir, `${instance}.pddl`);
const out = mkdtempSync(join(tmpdir(), "plumbline-demo-"));
const plan = join(out, "plan.txt");
const certificate = join(out, "certificate");

/** The demo, one CLI call per step. */
const steps = [
  { title: "Ground the model (facts, actions, zero-cost actions)", args: ["ground", domain, problem] },
  { title: "Solve: cheapest plan, proven optimal by SAT, with a certificate", args: ["solve", domain, problem, "--plan", plan, "--certificate", certificate] },
  { title: "Audit the certificate from scratch (independent proof checker)", args: ["audit", certificate] },
  { title: "Audit again, as JSON, to read the proven cost", args: ["audit", certificate, "--json", "--quiet"], quiet: true },
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
let last = null;
for (const [i, step] of steps.entries()) {
  process.stdout.write(`\n[${i + 1}/${steps.length}] ${step.title}\n$ npx plumbline ${step.args.map((a) => (a.startsWith(root) ? rel(a) : a)).join(" ")}\n`);
  // stderr (progress) goes straight through while the step runs; its result (stdout) follows
  const r = spawnSync(process.execPath, [cli, ...step.args], {
    cwd: root,
    encoding: "utf8",
    stdio: ["ignore", "pipe", "inherit"],
    env: { ...process.env, PLUMBLINE_INVOKED_AS: "npx plumbline" },
  });
  if (!step.quiet) process.stdout.write(r.stdout ?? "");
  last = r;
  if (r.status !== 0) {
    process.stdout.write(`(step ${i + 1} exited with code ${r.status})\n`);
    failed = true;
    break;
  }
}
if (!failed && last) {
  // one certificate: the array has one entry
  const [audit] = JSON.parse(last.stdout);
  process.stdout.write(`Audit: ${audit.verdict} — proven ${audit.claim.status} cost ${audit.cost} (recorded optimum ${record.optimalCost}).\n`);
  if (audit.verdict !== "valid" || audit.cost !== record.optimalCost) failed = true;
}
process.stdout.write(
  `\nThe plan and the certificate are in ${out} (kept for you; delete the folder when done).\n` +
    `Re-check the certificate any time with: npx plumbline audit ${certificate}\n`,
);

process.stdout.write(
  `\nNote: plans are only as good as the model — a plan that is valid and cheapest for this model is unsafe\n` +
    `if the model leaves out a rule of the real harbour; review the model before acting on a schedule.\n`,
);
process.exitCode = failed ? 1 : 0;
