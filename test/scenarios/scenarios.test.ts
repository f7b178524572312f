// The committed scenario instances under benchmarks/domains: each file is exactly its
// generator's output, its plan replays with the recorded cost, and for tiny and small
// instances the reference Dijkstra on the grounded PDDL reproduces the recorded optimum,
// state count and lengths that the scenario's own PDDL-free model produced.
import { readFileSync } from "node:fs";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { scenarios, resolveParams, type SizeName } from "../../benchmarks/domains/index.js";
import { readInstances } from "../../benchmarks/domains/tools/instances.js";
import { groundFiles, planCost } from "../../src/ground/index.js";
import { actionNamesToIndices, parsePlan, replayPlan } from "../../src/plan/index.js";
import { cheapestWithin, isGoal, optimalCost, reachableStates, replayGround } from "../support/reference.js";

const SLOW = Boolean(process.env.PLUMBLINE_SLOW);
const LAYERED_LIMIT = 2_000;
/** The reference searches' default state cap (test/support/reference.ts). */
const REFERENCE_CAP = 200_000;

for (const sc of scenarios) {
  const records = readInstances(sc.dir);
  const domain = join(sc.dir, "domain.pddl");

  describe(`scenario ${sc.name}`, () => {
    it("has tiny or small instances, a medium one, and one whose every cheapest plan is longer than a shortest plan", () => {
      const recs = Object.values(records);
      expect(recs.filter((r) => r.size === "tiny" || r.size === "small").length).toBeGreaterThanOrEqual(3);
      expect(recs.some((r) => r.size === "medium")).toBe(true);
      expect(recs.some((r) => r.size !== "medium" && r.cheapestLongerThanShortest === true)).toBe(true);
    });

    for (const [file, rec] of Object.entries(records)) {
      const problem = join(sc.dir, `${file}.pddl`);
      const planPath = join(sc.dir, `${file}.plan`);

      it(`${file}: the committed file is the generator's output for the recorded parameters`, () => {
        const params = resolveParams(sc, rec.size as SizeName, rec.generator.seed, rec.generator);
        expect(readFileSync(problem, "utf8")).toBe(sc.toPddl(sc.makeInstance(params)));
      });

      it(`${file}: grounds with zero-cost and positive-cost actions; the plan replays with the recorded cost`, () => {
        const { model, task } = groundFiles(domain, problem);
        expect(task.costModel).toBe("action-costs");
        expect(task.actions.some((a) => a.cost === 0)).toBe(true);
        expect(task.actions.some((a) => a.cost > 0)).toBe(true);
        const steps = parsePlan(readFileSync(planPath, "utf8"), planPath);
        const lifted = replayPlan(model, steps, planPath);
        expect(lifted.error).toBeNull();
        expect(lifted.valid).toBe(true);
        expect(lifted.cost).toBe(rec.planCost);
        expect(lifted.length).toBe(rec.planLength);
        // the same plan on the ground task, replayed by the reference semantics
        const ids = actionNamesToIndices(task, steps, { planFile: planPath });
        const g = replayGround(task, ids);
        expect(g.ok).toBe(true);
        if (g.ok) expect(isGoal(task, g.state)).toBe(true);
        expect(planCost(task, ids)).toBe(rec.planCost);
        // the optimal plan has the fewest actions among cheapest plans, so its figures are the record's
        expect(rec.planCost).toBe(rec.optimalCost);
        expect(rec.planLength).toBe(rec.optimalLength);
        expect(rec.cheapestLongerThanShortest).toBe(rec.optimalLength! > rec.shortestLength!);
      });

      // tiny and small always; a medium instance under PLUMBLINE_SLOW when the reference can hold it
      if (rec.size === "tiny" || rec.size === "small" || (SLOW && rec.states! <= REFERENCE_CAP)) {
        it(`${file}: the reference Dijkstra on the grounded task agrees with the recorded figures`, () => {
          const { task } = groundFiles(domain, problem);
          expect(task.actions.some((a) => a.synthetic)).toBe(false);
          // source: Dijkstra over the scenario's PDDL-free model (benchmarks/domains/tools/build-instances.ts)
          expect(reachableStates(task)?.length).toBe(rec.states);
          expect(optimalCost(task)).toEqual({ cost: rec.optimalCost, length: rec.optimalLength });
        });

        // the layered search re-walks every state once per step: only the smaller instances
        // run it by default, all tiny and small ones under PLUMBLINE_SLOW, never a medium one
        it.runIf(rec.size !== "medium" && (rec.states! <= LAYERED_LIMIT || SLOW))(`${file}: the reference layered search agrees with the recorded lengths`, () => {
          const { task } = groundFiles(domain, problem);
          const shortest = rec.shortestLength!;
          expect(shortest === 0 || cheapestWithin(task, shortest - 1) === null).toBe(true);
          expect(cheapestWithin(task, shortest)).toBe(rec.cheapestAtShortestLength);
          if (rec.cheapestLongerThanShortest) expect(rec.cheapestAtShortestLength!).toBeGreaterThan(rec.optimalCost!);
        });
      }
    }
  });
}
