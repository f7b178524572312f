// From a satisfying assignment back to a plan: linearise each step, then re-simulate on the
// Task and compare with the model's fact variables — any disagreement is an encoder bug.
import type { Action, Task } from "../ground/task.js";
import type { Encoding } from "./encoding.js";

/** A state as one byte per fact. */
export type State = Uint8Array;

export function initialState(task: Task): State {
  const s = new Uint8Array(task.facts.length);
  for (const f of task.init) s[f] = 1;
  return s;
}

export function isApplicable(act: Action, s: State): boolean {
  for (const f of act.pre) if (!s[f]) return false;
  for (const f of act.preNeg) if (s[f]) return false;
  return true;
}

/** Applies `act` to `s` in place (Task semantics: conditions read before, deletes then adds). */
export function applyInPlace(act: Action, s: State): void {
  const firing = act.cond.filter((ce) => ce.cond.every((f) => s[f]) && ce.condNeg.every((f) => !s[f]));
  for (const f of act.del) s[f] = 0;
  for (const ce of firing) for (const f of ce.del) s[f] = 0;
  for (const f of act.add) s[f] = 1;
  for (const ce of firing) for (const f of ce.add) s[f] = 1;
}

export function goalHolds(task: Task, s: State): boolean {
  return task.goal.every((f) => s[f] === 1) && task.goalNeg.every((f) => s[f] === 0);
}

const sameState = (x: State, y: State) => x.every((v, i) => v === y[i]);

function runOrder(task: Task, order: readonly number[], from: State): State | number {
  const s = from.slice();
  for (let i = 0; i < order.length; i++) {
    const act = task.actions[order[i]];
    if (!isApplicable(act, s)) return i;
    applyInPlace(act, s);
  }
  return s;
}

/**
 * Orders each step's actions by ascending id and concatenates the steps. Every step is
 * re-simulated in that order and, when it holds several actions, in the reverse order too:
 * both must be executable and agree (the ∀-step property). A failure throws — it means the
 * encoding let through something it must not, which is a bug, not a user error.
 */
export function linearise(task: Task, steps: readonly (readonly number[])[]): number[] {
  let s = initialState(task);
  const plan: number[] = [];
  steps.forEach((step, k) => {
    const order = [...step].sort((x, y) => x - y);
    const fwd = runOrder(task, order, s);
    if (typeof fwd === "number") throw new Error(`encode: step ${k + 1}: action ${task.actions[order[fwd]].name} is not applicable in the decoded order (encoder bug)`);
    if (order.length > 1) {
      const bwd = runOrder(task, [...order].reverse(), s);
      if (typeof bwd === "number" || !sameState(fwd, bwd)) throw new Error(`encode: step ${k + 1}: its actions do not commute (encoder bug)`);
    }
    s = fwd;
    plan.push(...order);
  });
  return plan;
}

export interface ExtractedPlan {
  /** Actions per step, as in the model. */
  steps: number[][];
  /** The linearised plan (action ids), synthetic actions included. */
  plan: number[];
  cost: number;
}

/**
 * Decodes a model, linearises it, and checks it end to end: every state after a step must
 * equal the model's fact variables at that time point, and the goal must hold at the end.
 */
export function extractPlan(task: Task, enc: Encoding, model: (v: number) => boolean): ExtractedPlan {
  const steps = enc.decode(model);
  const plan = linearise(task, steps);
  let s = initialState(task);
  let cost = 0;
  const check = (t: number) => {
    for (let f = 0; f < task.facts.length; f++) {
      if ((s[f] === 1) !== model(enc.factVar(t, f))) throw new Error(`encode: state after step ${t} disagrees with the model on ${task.facts[f]} (encoder bug)`);
    }
  };
  check(0);
  steps.forEach((step, k) => {
    for (const a of [...step].sort((x, y) => x - y)) {
      applyInPlace(task.actions[a], s);
      cost += task.actions[a].cost;
    }
    check(k + 1);
  });
  if (!goalHolds(task, s)) throw new Error("encode: decoded plan does not reach the goal (encoder bug)");
  return { steps, plan, cost };
}
