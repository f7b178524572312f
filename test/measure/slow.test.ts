// Larger checks run only with PLUMBLINE_SLOW=1 (`npm run test:slow`): bigger puzzles, and the
// threshold property on larger random tasks with more runs.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { computeHorizon } from "../../src/horizon/index.js";
import { diameter, reachableGraph } from "../../src/measure/index.js";
import { cheapestWithin, optimalCost, reachableStates } from "../support/reference.js";
import { richTaskArb, transitionTaskArb } from "../horizon/rich-task.js";
import { blocksWorld, hanoi } from "./puzzles.js";

describe.skipIf(!process.env.PLUMBLINE_SLOW)("slow: larger instances", () => {
  it("Towers of Hanoi n = 5, 6: 3^n states, diameter 2^n − 1", () => {
    for (const n of [5, 6]) {
      const g = reachableGraph(hanoi(n));
      expect(g.states.size).toBe(3 ** n); // source: standard result (Hanoi graph)
      expect(diameter(g, { symmetry: false }).value).toBe(2 ** n - 1); // source: standard result (Hanoi graph diameter)
    }
  });

  it("blocks world with 6 blocks: 4051 states", () => {
    expect(reachableGraph(blocksWorld(6)).states.size).toBe(4051); // source: OEIS A000262
  });

  it("the horizon is a completeness threshold on larger random tasks", () => {
    let checked = 0;
    fc.assert(
      fc.property(fc.oneof(transitionTaskArb({ maxVars: 6, maxActions: 14, zeroShare: 0.5 }), richTaskArb({ maxFacts: 9, maxActions: 12, zeroShare: 0.5 })), fc.integer({ min: 1, max: 6 }), (task, slack) => {
        const opt = optimalCost(task);
        fc.pre(opt !== null && opt.length >= 2);
        const H = computeHorizon(task, opt!.cost + slack).horizon;
        expect(cheapestWithin(task, Math.min(H, reachableStates(task)!.length))).toBe(opt!.cost);
        checked++;
      }),
      { numRuns: 600, seed: 4501, maxSkipsPerRun: 60 },
    );
    expect(checked).toBe(600);
  });
});
