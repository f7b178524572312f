// Part cost-prune-1 against brute force on small random tasks (zero-cost actions, conditional
// effects, negative conditions): no plan that takes a at step t costs less than lb(a,t); the
// least satisfiable bound of every formula is the same with and without the part.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { encodePlanning, type EncodeOptions, type Encoding, type PartId } from "../../src/encode/index.js";
import { costPruneBounds } from "../../src/encode/cost-prune.js";
import { taskInfo } from "../../src/encode/task-info.js";
import type { Task } from "../../src/ground/task.js";
import { Solver } from "../../src/sat/index.js";
import { applicable, cheapestWithin, initialState, isGoal, successor, type RefState } from "../support/reference.js";
import { nonTrivial, oneStepTask, richTaskArb, runs } from "./rich-task.js";

function leastBound(enc: Encoding): number {
  const solver = new Solver();
  enc.streamTo(solver);
  for (let B = 0; B <= enc.maxSum; B++) if (solver.solve(enc.boundAssumptions(B)) === "sat") return B;
  return Infinity;
}

const withPrune = (parts: readonly PartId[]): PartId[] =>
  (["reach-1", "relaxed-suffix-1", "landmarks-1", "cost-prune-1", "eager-steps-1", "empty-steps-last-1"] as PartId[]).filter((p) => p === "cost-prune-1" || parts.includes(p));

const SETTINGS: Omit<EncodeOptions, "steps">[] = [
  { encoding: "seq-1", cost: "cost-unary-1", parts: [] },
  { encoding: "seq-1", cost: "cost-adder-1", parts: ["reach-1", "empty-steps-last-1"] },
  { encoding: "forall-1", cost: "cost-adder-1", parts: ["reach-1", "empty-steps-last-1"] },
  { encoding: "forall-2", cost: "cost-unary-1", parts: ["reach-1", "eager-steps-1", "empty-steps-last-1"] },
  { encoding: "forall-2", cost: "cost-unary-1", parts: ["reach-1", "relaxed-suffix-1"] },
  { encoding: "seq-1", cost: "cost-adder-1", parts: ["relaxed-suffix-1", "empty-steps-last-1"] },
  { encoding: "forall-1", cost: "cost-adder-1", parts: ["reach-1", "relaxed-suffix-1", "empty-steps-last-1"] },
];

/**
 * Every execution of `steps` steps (each empty or one action) followed by up to `extra` more
 * actions, whose last state satisfies the goal (threshold: extra = 0, the goal at T). Calls
 * visit(actions per step, cost) — brute force, exact.
 */
function executions(task: Task, steps: number, extra: number, visit: (seq: number[], cost: number) => void): void {
  const seq: number[] = [];
  const go = (s: RefState, cost: number) => {
    const k = seq.length;
    if (k >= steps && isGoal(task, s)) visit(seq, cost);
    if (k >= steps + extra) return;
    if (k < steps) {
      seq.push(-1); // an empty step
      go(s, cost);
      seq.pop();
    }
    task.actions.forEach((a, i) => {
      if (!applicable(a, s)) return;
      seq.push(i);
      go(successor(a, s), cost + a.cost);
      seq.pop();
    });
  };
  go(initialState(task), 0);
}

const taskArb = nonTrivial(richTaskArb({ maxFacts: 4, maxActions: 5, zeroCostShare: 0.3 }));

/** Least slack cost − lb(a,t) over every brute-force execution and every (t, a) it takes in steps 1..T. */
function leastSlack(task: Task, T: number, anyHorizon: boolean, raise = 0): { slack: number; pruned: number } {
  const { lb, floor } = costPruneBounds(task, taskInfo(task), T, anyHorizon);
  let slack = Infinity;
  executions(task, T, anyHorizon ? 2 : 0, (seq, cost) => {
    for (let t = 1; t <= T; t++) if (seq[t - 1] >= 0) slack = Math.min(slack, cost - (lb[t][seq[t - 1]] + raise));
  });
  let pruned = 0;
  for (let t = 1; t <= T; t++) for (const v of lb[t]) if (v > floor) pruned++;
  return { slack, pruned };
}

describe("cost-prune-1", () => {
  it("bounds no execution from below wrongly: every plan taking a at step t costs ≥ lb(a,t) (threshold and any-horizon bounds)", () => {
    let tight = 0;
    let pruned = 0;
    fc.assert(
      fc.property(taskArb, fc.integer({ min: 1, max: 3 }), fc.boolean(), (task, T, anyHorizon) => {
        const r = leastSlack(task, T, anyHorizon);
        // source: exhaustive enumeration of the executions (the bound is a lower bound on each)
        expect(r.slack).toBeGreaterThanOrEqual(0);
        if (r.slack === 0) tight++;
        pruned += r.pruned;
      }),
      { numRuns: runs(150) },
    );
    // the bounds are often exact, so a bound one higher is wrong (see the next test) …
    expect(tight).toBeGreaterThan(10);
    // … and they often exceed the floor (clauses are emitted)
    expect(pruned).toBeGreaterThan(20);
  });

  it("the brute-force check fails on a bound off by one (the check can fail)", () => {
    const r = fc.check(
      fc.property(taskArb, fc.integer({ min: 1, max: 3 }), fc.boolean(), (task, T, anyHorizon) => leastSlack(task, T, anyHorizon, 1).slack >= 0),
      { numRuns: runs(150), seed: 12 },
    );
    expect(r.failed).toBe(true);
  });

  it("removes no model of the formula without it: A(t,a) with cost ≤ lb(a,t) − 1 is unsatisfiable there", () => {
    let checked = 0;
    fc.assert(
      fc.property(taskArb, fc.integer({ min: 1, max: 3 }), fc.integer({ min: 0, max: SETTINGS.length - 1 }), (task, T, k) => {
        const s = SETTINGS[k];
        const anyHorizon = (s.parts ?? []).includes("relaxed-suffix-1");
        const enc = encodePlanning(task, { ...s, steps: T });
        const { lb, floor } = costPruneBounds(task, taskInfo(task), T, anyHorizon);
        const solver = new Solver();
        enc.streamTo(solver);
        for (let t = 1; t <= T; t++) {
          for (let a = 0; a < task.actions.length; a++) {
            const v = lb[t][a];
            if (!(v > floor)) continue;
            const B = v === Infinity ? enc.maxSum : v - 1;
            if (B >= enc.maxSum && v !== Infinity) continue;
            const assume = [...enc.boundAssumptions(Math.min(B, enc.maxSum)), enc.actionVar(t, a)];
            // source: our own CDCL solver on the formula without the part (exact for its models)
            expect(solver.solve(assume)).toBe("unsat");
            checked++;
          }
        }
      }),
      { numRuns: runs(100) },
    );
    expect(checked).toBeGreaterThan(20);
  });

  it("changes no least satisfiable bound (threshold and relaxed-suffix formulas)", () => {
    let clauses = 0;
    fc.assert(
      fc.property(taskArb, fc.integer({ min: 0, max: 3 }), fc.integer({ min: 0, max: SETTINGS.length - 1 }), (task, T, k) => {
        const s = SETTINGS[k];
        const plain = leastBound(encodePlanning(task, { ...s, steps: T }));
        const enc = encodePlanning(task, { ...s, parts: withPrune(s.parts ?? []), steps: T });
        clauses += enc.stats.clausesByPart["cost-prune"] ?? 0;
        const pruned = leastBound(enc);
        expect(pruned).toBe(plain);
        // source: exhaustive search — sequential threshold formulas are exact for plans of ≤ T actions
        if (s.encoding === "seq-1" && !(s.parts ?? []).includes("relaxed-suffix-1")) expect(pruned).toBe(cheapestWithin(task, T) ?? Infinity);
      }),
      { numRuns: runs(120) },
    );
    expect(clauses).toBeGreaterThan(20);
  });

  it("asks nothing of a unary counter built without outputs and still builds", () => {
    const one = oneStepTask();
    const go = one.actions[0];
    const task: Task = { ...one, actions: [{ ...go, name: "(cheap)", del: [] }, { ...go, name: "(dear)", del: [], cost: 5 }] };
    // source: worked by hand — θ(dear, 1) = 0 + 5 and nothing is left to pay; floor = lb(cheap, 1) = 1
    const { lb, floor } = costPruneBounds(task, taskInfo(task), 1, false);
    expect([floor, lb[1][0], lb[1][1]]).toEqual([1, 1, 5]);
    const enc = encodePlanning(task, { encoding: "seq-1", cost: "cost-unary-1", parts: ["cost-prune-1"], steps: 1 });
    expect(enc.stats.clausesByPart["cost-prune"]).toBeGreaterThan(0);
    expect(leastBound(enc)).toBe(1);
    const none = encodePlanning(task, { encoding: "seq-1", cost: "cost-unary-1", costCap: 0, parts: ["cost-prune-1"], steps: 1 });
    expect(none.stats.clausesByPart["cost-prune"]).toBe(0);
  });
});
