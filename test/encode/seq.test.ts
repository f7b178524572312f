// seq-1 against exhaustive search: at horizon T, "cost ≤ B" is satisfiable exactly when the
// cheapest plan of at most T actions costs ≤ B; decoded plans replay with the claimed cost.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { encodePlanning, extractPlan } from "../../src/encode/index.js";
import type { Task } from "../../src/ground/task.js";
import { factoredTaskArb } from "../support/random-task.js";
import { cheapestWithin, isGoal, optimalCost, replayGround } from "../support/reference.js";
import { Oracle } from "./oracle.js";
import { mostlySolvable, nonTrivial, richTaskArb, runs, withCosts } from "./rich-task.js";

const solvable = (t: Task) => optimalCost(t) !== null;
const factored = mostlySolvable(nonTrivial(withCosts(factoredTaskArb({ maxVars: 3, maxActions: 6 }), 5)), solvable);
const rich = mostlySolvable(nonTrivial(richTaskArb({ maxFacts: 4, maxActions: 5 })), solvable);

/** Checks every bound of interest at horizon T; returns how many queries were SAT. */
function checkSeq(task: Task, T: number, extraB: number): number {
  const enc = encodePlanning(task, { encoding: "seq-1", steps: T });
  const oracle = new Oracle(enc.toCnf());
  // source: exhaustive layered search (test/support/reference.ts) vs logic-solver (MiniSat)
  const best = cheapestWithin(task, T);
  const bounds = new Set([0, extraB, enc.maxSum]);
  if (best !== null) for (const d of [-2, -1, 0, 1]) if (best + d >= 0) bounds.add(best + d);
  let sat = 0;
  for (const B of [...bounds].sort((x, y) => x - y)) {
    const model = oracle.solve(enc.boundAssumptions(B));
    const expected = best !== null && best <= B;
    expect(model !== null, `T=${T} B=${B} best=${best}`).toBe(expected);
    if (!model) continue;
    sat++;
    const got = extractPlan(task, enc, model);
    expect(got.plan.length).toBeLessThanOrEqual(T);
    for (const step of got.steps) expect(step.length).toBeLessThanOrEqual(1);
    const replay = replayGround(task, got.plan);
    expect(replay.ok).toBe(true);
    if (replay.ok) {
      expect(isGoal(task, replay.state)).toBe(true);
      expect(replay.cost).toBe(got.cost);
      expect(replay.cost).toBeLessThanOrEqual(B);
    }
  }
  return sat;
}

describe("seq-1 + cost-adder-1", () => {
  const cases: Array<[string, fc.Arbitrary<Task>, number]> = [
    ["random factored tasks (zero costs included)", factored, 12],
    ["tasks with negative conditions and conditional effects", rich, 8],
  ];
  for (const [what, arb, maxB] of cases) {
    it(`matches cheapestWithin on ${what}`, () => {
      let sat = 0;
      fc.assert(
        fc.property(arb, fc.integer({ min: 0, max: 5 }), fc.integer({ min: 0, max: maxB }), (task, T, B) => {
          sat += checkSeq(task, T, B);
        }),
        { numRuns: runs(40) },
      );
      expect(sat).toBeGreaterThan(20); // the property must not pass vacuously
    });
  }
});
