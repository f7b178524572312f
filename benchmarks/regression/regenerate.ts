// Rewrites the worked example of regression evidence (benchmarks/regression/README.md): the model
// (harbour problem-02), its certificate, and the four model changes. Run after a change that makes
// the committed certificate stop auditing: npx tsx benchmarks/regression/regenerate.ts
import * as fs from "node:fs";
import * as path from "node:path";
import { writeCertificate } from "../../src/certify/index.js";
import { disposeOutcome, optimizeFiles } from "../../src/optimize/index.js";

const here = import.meta.dirname;
const example = path.join(here, "harbour-02");
const scenario = path.join(here, "../domains/harbour");

/** The model changes of the worked example: folder name, the file it replaces, and the edit. */
export const CHANGES = [
  { name: "longer-road", file: "problem.pddl", from: "(= (road-length quay1 depot1) 22)", to: "(= (road-length quay1 depot1) 25)", verdict: "still-optimal" },
  { name: "road-closed", file: "problem.pddl", from: "(road yard2 quay1) (= (road-length yard2 quay1) 2)", to: "", verdict: "plan-invalid" },
  { name: "crane-cost", file: "domain.pddl", from: "(in ?c ?t) (laden ?t)))", to: "(in ?c ?t) (laden ?t) (increase (total-cost) 1)))", verdict: "cost-changed" },
  { name: "new-road", file: "problem.pddl", from: "(crane-at crane1 quay1)", to: "(road yard1 quay1) (= (road-length yard1 quay1) 1)\n    (road quay1 yard1) (= (road-length quay1 yard1) 1)\n    (crane-at crane1 quay1)", verdict: "cheaper-plan" },
] as const;

async function main(): Promise<void> {
  const model = path.join(example, "model");
  fs.mkdirSync(model, { recursive: true });
  fs.copyFileSync(path.join(scenario, "domain.pddl"), path.join(model, "domain.pddl"));
  fs.copyFileSync(path.join(scenario, "problem-02.pddl"), path.join(model, "problem.pddl"));
  for (const c of CHANGES) {
    const text = fs.readFileSync(path.join(model, c.file), "utf8");
    if (!text.includes(c.from)) throw new Error(`${c.name}: '${c.from}' not found in ${c.file}`);
    const dir = path.join(example, "changes", c.name);
    fs.mkdirSync(dir, { recursive: true });
    fs.writeFileSync(path.join(dir, c.file), text.split(c.from).join(c.to));
  }
  // the committed optimal plan as the incumbent: the certificate records that plan (the README names its
  // steps), not whichever optimal plan a run happens to find first
  const committed = fs.readFileSync(path.join(scenario, "problem-02.plan"), "utf8").split("\n").filter((l) => l.startsWith("("));
  const out = await optimizeFiles(path.join(model, "domain.pddl"), path.join(model, "problem.pddl"), { incumbent: committed });
  try {
    if (!out.certificate) throw new Error(`harbour problem-02 was not proven optimal (${out.status})`);
    await writeCertificate(path.join(example, "certificate"), out.certificate);
  } finally {
    disposeOutcome(out);
  }
  process.stdout.write(`wrote ${path.relative(process.cwd(), example)} (cost ${out.cost})\n`);
}

if (process.argv[1] && path.resolve(process.argv[1]) === path.resolve(import.meta.filename)) await main();
