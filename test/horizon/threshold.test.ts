// The central soundness property: every horizon reported is a completeness threshold — the
// cheapest plan within H actions costs exactly the optimum — checked against brute force.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import type { Task } from "../../src/ground/task.js";
import { boundContext, computeHorizon, METHODS, type HorizonOptions } from "../../src/horizon/index.js";
import { cheapestWithin, optimalCost, reachableStates } from "../support/reference.js";
import { factoredTaskArb } from "../support/random-task.js";
import { richTaskArb, transitionTaskArb } from "./rich-task.js";

interface Tally {
  checked: number;
  /** cases where H was below (reachable states − 1), i.e. where the check has teeth */
  binding: number;
}

/**
 * For C = optimum + slack (slack ≥ 1, so a plan of cost < C exists), the cheapest plan with at
 * most H actions must cost the optimum: every method guarantees a plan of cost ≤ c within H
 * whenever some plan costs c < C (cost counting; zero-cost runs shortened; sublists are never
 * dearer). H beyond (reachable states − 1) is clamped there: loop-free optimal plans always
 * fit, so the clamp changes no answer. Trivial cases (no plan, or an optimal plan of < 2
 * actions) are discarded.
 */
function checkThreshold(task: Task, slack: number, tally: Tally, method?: string, opts: HorizonOptions = {}): void {
  const opt = optimalCost(task);
  fc.pre(opt !== null && opt.length >= 2);
  const C = opt!.cost + slack;
  // a method alone: run without the results of the others (the explicit one would stop early)
  const value = method ? METHODS.find((m) => m.name === method)!.run(boundContext(task, opts), C, []).value : computeHorizon(task, C, opts).horizon;
  if (value === null) return;
  const states = reachableStates(task)!.length;
  const H = Math.min(value, states);
  if (value < states - 1) tally.binding++;
  tally.checked++;
  expect(cheapestWithin(task, H)).toBe(opt!.cost);
}

const params = { maxSkipsPerRun: 60 };

describe("horizon is a completeness threshold", () => {
  const families: Array<[string, fc.Arbitrary<Task>]> = [
    ["random factored tasks", factoredTaskArb({ maxVars: 3, maxActions: 8, zeroCostShare: 0.4 })],
    ["transition-shaped factored tasks", transitionTaskArb({ maxVars: 5, zeroShare: 0.4 })],
    ["tasks with negative conditions and conditional effects", richTaskArb({ maxFacts: 7, zeroShare: 0.4 })],
  ];
  families.forEach(([name, arb], i) => {
    // with the exact explicit method (it wins on tasks this small) and with structural bounds only
    for (const [label, opts] of [["", {}], [" (structural methods only)", { maxOptimalStates: 0 }]] as Array<[string, HorizonOptions]>) {
      it(`computeHorizon on ${name}${label}`, () => {
        const tally: Tally = { checked: 0, binding: 0 };
        fc.assert(
          fc.property(arb, fc.integer({ min: 1, max: 4 }), (task, slack) => checkThreshold(task, slack, tally, undefined, opts)),
          { numRuns: 80, seed: 4100 + i, ...params },
        );
        expect(tally.checked).toBeGreaterThan(70);
        expect(tally.binding).toBeGreaterThan(8);
      });
    }
  });

  // "zero-cost/projections": ℓ₀ from the compositional bound only (explicit state space disabled)
  for (const method of ["zero-cost", "zero-cost/projections", "compositional", "optimal-length", "reachable-states"]) {
    it(`the ${method} method alone`, () => {
      const tally: Tally = { checked: 0, binding: 0 };
      const [name, opts] = method === "zero-cost/projections" ? ["zero-cost", { maxExplicitStates: 1 }] : [method, {}];
      fc.assert(
        fc.property(fc.oneof(transitionTaskArb({ maxVars: 5, zeroShare: 0.6 }), richTaskArb({ zeroShare: 0.6 })), fc.integer({ min: 1, max: 3 }), (task, slack) =>
          checkThreshold(task, slack, tally, name, opts),
        ),
        { numRuns: 60, seed: 4110, ...params },
      );
      if (process.env.TALLY) console.log("TALLY", method, JSON.stringify(tally));
      expect(tally.checked).toBeGreaterThan(50);
      expect(tally.binding).toBeGreaterThan(4);
    });
  }
});
