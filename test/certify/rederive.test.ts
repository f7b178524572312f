// The audit's second derivation (src/certify/rederive.ts) against the reference semantics: its
// plain search must find exactly the reachable states and the optimum of random small tasks, and
// doctored horizon records must be caught.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { exactSearch, rederive } from "../../src/certify/rederive.js";
import { optimalCost, reachableStates } from "../support/reference.js";
import { richTaskArb } from "../horizon/rich-task.js";

describe("second derivation", () => {
  it("the plain search finds the reachable states and the optimum of the reference", () => {
    let solvable = 0;
    fc.assert(
      fc.property(richTaskArb(), (task) => {
        const e = exactSearch(task)!;
        // source: exhaustive search over the explicit state space (test/support/reference.ts)
        expect(e.states).toBe(reachableStates(task)!.length);
        const opt = optimalCost(task);
        expect(e.optimum?.cost ?? null).toBe(opt?.cost ?? null);
        if (opt) solvable++;
        // a wrong claim is caught; the right one passes
        if (opt) {
          expect(rederive(task, null, null, opt.cost).problems).toEqual([]);
          expect(rederive(task, null, null, opt.cost + 1).problems.length).toBeGreaterThan(0);
          expect(rederive(task, null, null, null).problems.length).toBeGreaterThan(0);
          // a horizon too short for a cheapest plan, when the optimum lies below the horizon's upper cost
          if (e.optimum!.length > 0) {
            expect(rederive(task, { upperCost: opt.cost + 1, methods: [] }, e.optimum!.length - 1, opt.cost).problems.join()).toMatch(/below/);
            expect(rederive(task, { upperCost: opt.cost, methods: [] }, e.optimum!.length - 1, opt.cost).problems).toEqual([]);
          }
        } else expect(rederive(task, null, null, null).problems).toEqual([]);
      }),
      { numRuns: 150, seed: 1414 },
    );
    expect(solvable).toBeGreaterThan(30);
  });

  it("redoes the recorded arithmetic and cross-checks the exact method's optimum", () => {
    const task = { facts: ["a", "g"], init: [0], goal: [1], goalNeg: [], actions: [{ name: "(go)", schema: "go", args: [], pre: [0], preNeg: [], add: [1], del: [], cond: [], cost: 3 }] } as never;
    const cost = (value: number) => ({ methods: [{ method: "cost", value, derivation: { C: 10, minCost: 3, excessLowerBound: 0 } }] });
    // floor((10 - 1 - 0) / 3) = 3 (arithmetic by hand)
    expect(rederive(task, cost(3), 3, 3).problems).toEqual([]);
    expect(rederive(task, cost(4), 4, 3).problems.join()).toMatch(/floor\(\(10 - 1 - 0\) \/ 3\) is 3, the certificate records 4/);
    const exact = (optimalCost: number) => ({ methods: [{ method: "optimal-length", value: 1, derivation: { optimalCost } }] });
    expect(rederive(task, exact(3), 1, 3).problems).toEqual([]);
    expect(rederive(task, exact(2), 1, 3).problems.join()).toMatch(/recorded the optimum 2, but the claimed cost is 3/);
  });
});
