// The worked example of regression evidence (benchmarks/regression): its CI lines pass on the model
// as committed, and each model change gives the verdict and exit code its README states.
import * as fs from "node:fs";
import { tmpdir } from "node:os";
import * as path from "node:path";
import { afterAll, describe, expect, it } from "vitest";
import { CHANGES } from "../../benchmarks/regression/regenerate.js";
import { cli } from "../support/cli.js";

const root = path.resolve(import.meta.dirname, "../..");
const example = path.join(root, "benchmarks/regression");
const work = fs.mkdtempSync(path.join(tmpdir(), "plumbline-worked-"));
afterAll(() => fs.rmSync(work, { recursive: true, force: true }));
const REGENERATE = "(if the certificate no longer audits after a deliberate change, run: npx tsx benchmarks/regression/regenerate.ts)";

/** The plumbline command lines of ci.sh, as argument lists (paths relative to the repository root). */
function ciLines(): string[][] {
  const text = fs.readFileSync(path.join(example, "ci.sh"), "utf8");
  return text
    .split("\n")
    .filter((l) => l.startsWith("$PLUMBLINE "))
    .map((l) => l.slice("$PLUMBLINE ".length).trim().split(/\s+/));
}

describe("the worked example in benchmarks/regression", () => {
  it("the README shows the CI lines of ci.sh exactly", () => {
    const readme = fs.readFileSync(path.join(example, "README.md"), "utf8");
    const lines = ciLines();
    expect(lines.map((l) => l[0])).toEqual(["audit", "rejudge"]);
    for (const l of lines) expect(readme).toContain(`npx plumbline ${l.join(" ")}`);
  });

  it("the CI lines exit 0 on the model as committed (certificate valid, plan unchanged)", async () => {
    const cwd = process.cwd();
    process.chdir(root);
    try {
      const junit = path.join(work, "audit.xml");
      for (const args of ciLines()) {
        const a = args.map((x) => (x === "plumbline-audit.xml" ? junit : x));
        const r = await cli([...a, "--json"]);
        expect(r.code, `${args.join(" ")}: ${r.stdout.slice(0, 400)} ${REGENERATE}`).toBe(0);
      }
      expect(fs.readFileSync(junit, "utf8")).toContain('failures="0" errors="0"');
    } finally {
      process.chdir(cwd);
    }
  }, 120_000);

  for (const c of CHANGES) {
    it(`${c.name}: ${c.verdict}`, async () => {
      const base = path.join(example, "harbour-02");
      const file = path.join(base, "changes", c.name, c.file);
      const other = c.file === "domain.pddl" ? ["--problem", path.join(base, "model/problem.pddl")] : ["--domain", path.join(base, "model/domain.pddl")];
      const r = await cli(["rejudge", path.join(base, "certificate"), ...other, c.file === "domain.pddl" ? "--domain" : "--problem", file, "--json"]);
      const j = r.json();
      expect(j.verdict).toBe(c.verdict);
      expect(r.code).toBe(c.verdict === "still-optimal" ? 0 : 1);
      // the figures the README states (the same edits are checked against the reference Dijkstra in test/e2e/rejudge.test.ts)
      if (c.name === "road-closed") expect(j.failure).toMatchObject({ step: 3, action: "(drive t1 yard2 quay1)", condition: "(road yard2 quay1)" });
      if (c.name === "crane-cost") expect(j).toMatchObject({ newCost: 24, optimal: true });
      if (c.name === "new-road") expect(j.cheaperPlan).toMatchObject({ cost: 6, proven: true });
      if (c.name === "longer-road") expect(j).toMatchObject({ newCost: 22, optimal: true });
    }, 60_000);
  }
});
