// Steps may stay empty: every sequential plan of k ≤ T actions, placed in ANY k of the T
// steps, is a model of every step encoding at its exact cost — and not at one less.
// This is what makes a completeness threshold on plan length a valid step horizon.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { encodePlanning, STEP_ENCODINGS } from "../../src/encode/index.js";
import type { Task } from "../../src/ground/task.js";
import { factoredTaskArb } from "../support/random-task.js";
import { applicable, initialState, successor } from "../support/reference.js";
import { Oracle } from "./oracle.js";
import { richTaskArb, runs, withCosts } from "./rich-task.js";

interface Walk {
  plan: number[];
  end: Set<number>;
  cost: number;
}

/** A random applicable action sequence of at most `len` actions (reference semantics). */
function randomWalk(task: Task, choices: number[]): Walk {
  let s = initialState(task);
  const plan: number[] = [];
  let cost = 0;
  for (const c of choices) {
    const app = task.actions.map((a, i) => (applicable(a, s) ? i : -1)).filter((i) => i >= 0);
    if (app.length === 0) break;
    const a = app[c % app.length];
    plan.push(a);
    cost += task.actions[a].cost;
    s = successor(task.actions[a], s);
  }
  return { plan, end: s, cost };
}

function checkFits(task: Task, choices: number[], T: number, slotSeed: number): void {
  const walk = randomWalk(task, choices.slice(0, T));
  // goal: exactly the state the walk ends in
  const goalTask: Task = {
    ...task,
    goal: [...walk.end].sort((x, y) => x - y),
    goalNeg: task.facts.map((_, f) => f).filter((f) => !walk.end.has(f)),
  };
  // choose which k of the T steps carry the walk's actions (the others stay empty)
  const slots = [...Array(T).keys()].map((i) => i + 1);
  let seed = slotSeed;
  while (slots.length > walk.plan.length) {
    slots.splice(seed % slots.length, 1);
    seed = Math.floor(seed / 3) + 7;
  }
  for (const id of STEP_ENCODINGS) {
    const enc = encodePlanning(goalTask, { encoding: id, steps: T });
    const oracle = new Oracle(enc.toCnf());
    const fix: number[] = [];
    for (let s = 1; s <= T; s++) {
      const k = slots.indexOf(s);
      for (let a = 0; a < task.actions.length; a++) fix.push(k >= 0 && walk.plan[k] === a ? enc.actionVar(s, a) : -enc.actionVar(s, a));
    }
    // source: reference semantics (test/support/reference.ts) replayed the walk; logic-solver answers
    expect(oracle.solve([...fix, ...enc.boundAssumptions(walk.cost)]), `${id} plan ${walk.plan} in steps ${slots}`).not.toBeNull();
    if (walk.cost > 0) expect(oracle.solve([...fix, ...enc.boundAssumptions(walk.cost - 1)])).toBeNull();
  }
}

describe("every sequential plan of at most T actions fits in T steps", () => {
  const choices = fc.array(fc.nat(), { minLength: 6, maxLength: 6 });
  it("on factored tasks", () => {
    fc.assert(
      fc.property(withCosts(factoredTaskArb({ maxVars: 3, maxActions: 6 }), 6), choices, fc.integer({ min: 0, max: 6 }), fc.nat(), checkFits),
      { numRuns: runs(20) },
    );
  });
  it("on tasks with negative conditions and conditional effects", () => {
    fc.assert(fc.property(richTaskArb({ maxFacts: 5, maxActions: 6 }), choices, fc.integer({ min: 0, max: 6 }), fc.nat(), checkFits), { numRuns: runs(20) });
  });
});
