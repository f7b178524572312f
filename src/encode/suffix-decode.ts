// Reading a model of a formula with relaxed-suffix-1: a real plan when the goal holds at some time
// point, otherwise the prefix, its relaxed finish and the repeated states the driver must forbid.
import type { Task } from "../ground/task.js";
import { applyInPlace, goalHolds, initialState, linearise, type State } from "./decode.js";
import type { Encoding } from "./encoding.js";

export type SuffixModel =
  | {
      kind: "plan";
      /** Linearised plan: the steps up to the first time point where the goal holds. */
      plan: number[];
      cost: number;
      /** The time point where the goal first holds. */
      goalAt: number;
    }
  | {
      kind: "relaxed";
      /** Cost of the T real steps plus the relaxed suffix's actions (what the bound constrained). */
      cost: number;
      prefixCost: number;
      suffixCost: number;
      /** The relaxed suffix's actions (ascending ids). */
      suffix: number[];
      /** Pairs (t, t′), t < t′, with equal states and the goal not holding at t (must be forbidden). */
      repeats: [number, number][];
    };

const sameState = (x: State, y: State) => x.every((v, i) => v === y[i]);

/**
 * Decodes and checks a model: the steps are re-simulated on the Task and compared with the
 * model's fact variables (as extractPlan does); the relaxed suffix is checked to reach the goal
 * from the last state ignoring deletes and negative conditions. Any disagreement throws (an
 * encoder bug). Repeats are listed at most `maxRepeats` (earliest t′ first, then t).
 */
export function readSuffixModel(task: Task, enc: Encoding, model: (v: number) => boolean, maxRepeats = 64): SuffixModel {
  const sv = enc.suffix;
  if (!sv) throw new Error("encode: readSuffixModel needs a formula with relaxed-suffix-1");
  const T = enc.params.steps;
  const steps = enc.decode(model);
  linearise(task, steps); // throws on a step that is not a valid ∀-step
  const states: State[] = [];
  let s = initialState(task);
  const check = (t: number) => {
    for (let f = 0; f < task.facts.length; f++) {
      if ((s[f] === 1) !== model(enc.factVar(t, f))) throw new Error(`encode: state after step ${t} disagrees with the model on ${task.facts[f]} (encoder bug)`);
    }
    states.push(s.slice());
  };
  check(0);
  let prefixCost = 0;
  let goalAt = goalHolds(task, s) ? 0 : -1;
  let costAtGoal = 0;
  for (let k = 0; k < T; k++) {
    for (const a of [...steps[k]].sort((x, y) => x - y)) {
      applyInPlace(task.actions[a], s);
      prefixCost += task.actions[a].cost;
    }
    check(k + 1);
    if (goalAt < 0 && goalHolds(task, s)) {
      goalAt = k + 1;
      costAtGoal = prefixCost;
    }
  }
  if (goalAt >= 0) return { kind: "plan", plan: linearise(task, steps.slice(0, goalAt)), cost: costAtGoal, goalAt };

  // the relaxed suffix: its actions' operators must reach the goal from the last state
  const suffix: number[] = [];
  for (let a = 0; a < task.actions.length; a++) if (sv.actionLit[a] !== 0 && model(sv.actionLit[a])) suffix.push(a);
  const inSuffix = new Uint8Array(task.actions.length);
  for (const a of suffix) inSuffix[a] = 1;
  const avail = states[T].slice();
  for (let changed = true; changed; ) {
    changed = false;
    for (const o of sv.ops) {
      if (!inSuffix[o.action] || !o.pre.every((f) => avail[f] === 1)) continue;
      for (const f of o.add)
        if (!avail[f]) {
          avail[f] = 1;
          changed = true;
        }
    }
  }
  const missing = task.goal.filter((g) => !avail[g]);
  if (missing.length > 0) throw new Error(`encode: the relaxed suffix of a model does not reach ${task.facts[missing[0]]} (encoder bug)`);
  let suffixCost = 0;
  for (const a of suffix) suffixCost += task.actions[a].cost;
  const repeats: [number, number][] = [];
  for (let u = 1; u <= T && repeats.length < maxRepeats; u++)
    for (let t = 0; t < u && repeats.length < maxRepeats; t++) if (sameState(states[t], states[u])) repeats.push([t, u]);
  return { kind: "relaxed", cost: prefixCost + suffixCost, prefixCost, suffixCost, suffix, repeats };
}
