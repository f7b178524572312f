// The scenario generators: deterministic for a seed, every size preset parses and grounds,
// the shared command line behaves, and on random small instances the scenario's PDDL-free
// model and the grounded PDDL agree on the reachable states and the optimum.
import { execFileSync } from "node:child_process";
import { mkdtempSync, readFileSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join, resolve } from "node:path";
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  SIZE_NAMES,
  cheapestPlan,
  countReachable,
  generateProblem,
  resolveParams,
  scenarioByName,
  scenarios,
} from "../../benchmarks/domains/index.js";
import { parseGeneratorArgs } from "../../benchmarks/domains/lib/cli.js";
import { ground } from "../../src/ground/index.js";
import { modelFromTexts } from "../../src/pddl/index.js";
import { optimalCost, reachableStates } from "../support/reference.js";

const ROOT = resolve(__dirname, "../..");

for (const sc of scenarios) {
  const domainPath = join(sc.dir, "domain.pddl");
  const domainText = readFileSync(domainPath, "utf8");

  describe(`generator ${sc.name}`, () => {
    for (const size of SIZE_NAMES) {
      it(`${size}: the same seed gives the same file, and it parses and grounds`, () => {
        const a = generateProblem(sc, size, 7);
        expect(generateProblem(sc, size, 7)).toBe(a);
        const model = modelFromTexts(domainText, domainPath, a, `${size}.pddl`);
        const task = ground(model);
        expect(task.actions.length).toBeGreaterThan(0);
        expect(task.actions.some((x) => x.cost === 0)).toBe(true);
      });
    }

    it("different seeds give different files", () => {
      const texts = new Set([1, 2, 3, 4, 5].map((seed) => generateProblem(sc, "small", seed)));
      expect(texts.size).toBeGreaterThan(1);
    });

    it("reads its flags: size preset, overrides, seed; rejects unknown flags and out-of-range values", () => {
      const r = parseGeneratorArgs(sc, ["--size", "tiny", "--seed", "3"]);
      expect("text" in r && r.text).toBe(generateProblem(sc, "tiny", 3));
      const first = sc.params[0];
      const v = Math.max(first.min, Math.min(first.max, sc.sizes.tiny[first.name] + 1));
      const o = parseGeneratorArgs(sc, ["--size", "tiny", `--${first.name}`, String(v), "--seed", "3"]);
      expect("text" in o && o.text).toBe(generateProblem(sc, "tiny", 3, { [first.name]: v }));
      expect("help" in parseGeneratorArgs(sc, ["--help"])).toBe(true);
      expect(() => parseGeneratorArgs(sc, ["--no-such-flag", "1"])).toThrow(/unknown flag/);
      expect(() => parseGeneratorArgs(sc, [`--${first.name}`, String(first.max + 1)])).toThrow(/must be an integer/);
      expect(() => parseGeneratorArgs(sc, ["--size", "huge"])).toThrow(/--size/);
    });

    it("on random tiny instances the explicit model and the grounded PDDL agree on states and optimum", () => {
      // each size parameter at its tiny value or one more; combinations the generator refuses are skipped
      const bumps = fc.tuple(...sc.params.map(() => fc.integer({ min: 0, max: 1 })));
      fc.assert(
        fc.property(fc.integer({ min: 0, max: 1_000_000 }), bumps, (seed, bump) => {
          const overrides = Object.fromEntries(sc.params.map((p, i) => [p.name, Math.min(p.max, sc.sizes.tiny[p.name] + bump[i])]));
          let inst: unknown;
          try {
            inst = sc.makeInstance(resolveParams(sc, "tiny", seed, overrides));
          } catch {
            fc.pre(false);
          }
          const task = ground(modelFromTexts(domainText, domainPath, sc.toPddl(inst), "random.pddl"));
          const m = sc.model(inst);
          expect(reachableStates(task)?.length).toBe(countReachable(m));
          const best = cheapestPlan(m);
          const ref = optimalCost(task);
          expect(ref === null ? null : ref.cost).toBe(best === null ? null : best.cost);
          expect(ref === null ? null : ref.length).toBe(best === null ? null : best.plan.length);
        }),
        { numRuns: 15, seed: 20240611 },
      );
    });
  });
}

describe("generator scripts", () => {
  it("a generate.ts run with tsx writes the same problem to --out as the library call", () => {
    const dir = mkdtempSync(join(tmpdir(), "plumbline-gen-"));
    try {
      const out = join(dir, "p.pddl");
      const tsx = join(ROOT, "node_modules", ".bin", "tsx");
      execFileSync(tsx, [join(ROOT, "benchmarks/domains/workshop/generate.ts"), "--size", "tiny", "--seed", "5", "--out", out], { cwd: ROOT });
      expect(readFileSync(out, "utf8")).toBe(generateProblem(scenarioByName("workshop"), "tiny", 5));
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });
});
