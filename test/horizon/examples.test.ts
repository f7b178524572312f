// Worked examples of the pitfalls the horizon must avoid with zero-cost actions: the diameter
// is not a completeness threshold, and neither is a zero-cost bound that counts only the
// states zero-cost actions reach from the initial state.
import { describe, expect, it } from "vitest";
import type { Action, Task } from "../../src/ground/task.js";
import { computeHorizon, computeMethod } from "../../src/horizon/index.js";
import { measureTask } from "../../src/measure/index.js";
import { applicable, cheapestWithin, initialState, optimalCost, stateKey, successor } from "../support/reference.js";

function act(name: string, pre: number[], add: number[], del: number[], cost: number): Action {
  return { name, schema: name.slice(1, -1).split(" ")[0], args: [], pre, preNeg: [], add, del, cond: [], cost };
}

describe("zero-cost pitfalls", () => {
  it("the diameter is not a completeness threshold: a cheaper plan is longer than it", () => {
    // positions p0..p5 on a track; free steps p_i → p_{i+1}; an express ride p0 → p5 costs 10.
    // Worked by hand: the longest shortest path is p0 → p4 (4 steps); the express makes p0 → p5
    // one step; the only cheapest plan takes the 5 free steps.
    const facts = [0, 1, 2, 3, 4, 5].map((i) => `(at p${i})`);
    const actions = [0, 1, 2, 3, 4].map((i) => act(`(step p${i} p${i + 1})`, [i], [i + 1], [i], 0));
    actions.push(act("(express p0 p5)", [0], [5], [0], 10));
    const task: Task = { domainName: "track", problemName: "track", facts, init: [0], goal: [5], goalNeg: [], actions, costModel: "action-costs" };
    const m = measureTask(task);
    expect(m.diameter.value).toBe(4); // worked by hand
    expect(optimalCost(task)).toEqual({ cost: 0, length: 5 }); // worked by hand
    // with the express plan known (C = 10), the diameter as a horizon misses the optimum
    expect(cheapestWithin(task, m.diameter.value!)).toBe(10);
    const h = computeHorizon(task, 10);
    expect(h.horizon).toBeGreaterThanOrEqual(5);
    expect(cheapestWithin(task, h.horizon)).toBe(0);
  });

  it("ℓ₀ must count states reached with all actions, not only zero-cost ones from the start", () => {
    // a lock (cost 1 to open) and a corridor x0..x5 walked for free once the lock is open.
    // From the initial state no zero-cost action applies, so "states zero-cost actions reach
    // from the initial state" is 1 and would give ℓ₀ = 0 — but after the paid action a free
    // run of 5 steps is needed. Worked by hand: optimum cost 1, length 6.
    const facts = ["(open)", ...[0, 1, 2, 3, 4, 5].map((i) => `(at x${i})`)];
    const at = (i: number) => i + 1;
    const actions = [act("(unlock)", [], [0], [], 1)];
    for (let i = 0; i < 5; i++) actions.push(act(`(walk x${i} x${i + 1})`, [0, at(i)], [at(i + 1)], [at(i)], 0));
    actions.push(act("(fly x0 x5)", [at(0)], [at(5)], [at(0)], 2));
    const task: Task = { domainName: "corridor", problemName: "corridor", facts, init: [at(0)], goal: [at(5)], goalNeg: [], actions, costModel: "action-costs" };
    expect(optimalCost(task)).toEqual({ cost: 1, length: 6 }); // worked by hand
    const C = 2; // the cost of the plan (fly x0 x5)
    // the unsound variant: zero-cost reachability from the initial state only
    const start = initialState(task);
    const zeroFromInit = new Set([stateKey(start)]);
    for (const a of task.actions) if (a.cost === 0 && applicable(a, start)) zeroFromInit.add(stateKey(successor(a, start)));
    expect(zeroFromInit.size).toBe(1);
    const k = Math.floor((C - 1) / 1);
    const unsound = k + (k + 1) * (zeroFromInit.size - 1);
    expect(unsound).toBe(1);
    expect(cheapestWithin(task, unsound)).toBe(2); // misses the optimum 1
    // ours: projections of the full task see the 5 free steps after the paid one
    for (const opts of [{ maxOptimalStates: 0 }, { maxOptimalStates: 0, maxExplicitStates: 1 } /* projections only */]) {
      const z = computeMethod(task, C, "zero-cost", opts);
      expect(z.value!).toBeGreaterThanOrEqual(6);
      expect(cheapestWithin(task, z.value!)).toBe(1);
    }
    const explicitL0 = computeMethod(task, C, "zero-cost", { maxOptimalStates: 0 }).derivation.explicit as { l0: number };
    expect(explicitL0.l0).toBe(5); // worked by hand: the corridor x0 → x5 after unlocking
    expect(cheapestWithin(task, computeHorizon(task, C).horizon)).toBe(1);
  });
});
