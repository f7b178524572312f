// Removes what can never happen: actions and conditional effects whose conditions are
// unreachable or contradictory (by pair reachability), facts that never change, no-op actions.
import type { Action, CondEffect, Task } from "../ground/task.js";
import type { PairReachability } from "./h2.js";
import { restrictTask, type RestrictedTask } from "./restrict.js";
import { poll } from "../util/limits.js";

export interface SimplifyResult extends RestrictedTask {
  /** Facts that are never true (pair analysis) or always true (initially true, never deleted). */
  neverTrue: number;
  alwaysTrue: number;
  removedActions: number;
}

/**
 * Sound simplification: every removed action can never be applied in a reachable state (its
 * precondition holds no reachable state) or never changes the state; every removed
 * conditional effect can never fire; a removed fact has the same value in every reachable
 * state, so dropping it from conditions and effects changes no transition. The reachable
 * transitions of the result are those of the input (with constant facts projected away), so
 * plans, their costs and completeness thresholds carry over.
 */
export function simplifyTask(task: Task, pairs: PairReachability): SimplifyResult {
  const F = task.facts.length;
  const never = new Uint8Array(F);
  for (let f = 0; f < F; f++) if (!pairs.reachable(f)) never[f] = 1;
  const inInit = new Uint8Array(F);
  for (const f of task.init) inInit[f] = 1;
  const together = (xs: readonly number[], ys: readonly number[]): boolean => {
    for (const x of xs) for (const y of ys) if (!pairs.together(x, y)) return false;
    return true;
  };
  const meets = (xs: readonly number[], mark: Uint8Array): boolean => xs.some((f) => mark[f] === 1);
  const overlap = (xs: readonly number[], ys: readonly number[]): boolean => {
    const s = new Set(xs);
    return ys.some((f) => s.has(f));
  };

  // live actions and conditional effects, and the always-true facts, to a fixpoint
  let always = new Uint8Array(F);
  let live: boolean[] = [];
  let liveCond: boolean[][] = [];
  // monotone (always-true facts only grow), so this reaches its fixpoint within F rounds
  for (;;) {
    poll("analysis: simplify");
    live = task.actions.map((a) => {
      poll("analysis: simplify");
      return !meets(a.pre, never) && !meets(a.preNeg, always) && !overlap(a.pre, a.preNeg) && together(a.pre, a.pre);
    });
    liveCond = task.actions.map((a) =>
      a.cond.map(
        (ce) =>
          !meets(ce.cond, never) &&
          !meets(ce.condNeg, always) &&
          !overlap(ce.cond, ce.condNeg) &&
          !overlap(ce.cond, a.preNeg) &&
          !overlap(ce.condNeg, a.pre) &&
          together(ce.cond, ce.cond) &&
          together(ce.cond, a.pre),
      ),
    );
    const deleted = new Uint8Array(F);
    task.actions.forEach((a, i) => {
      if (!live[i]) return;
      for (const f of a.del) deleted[f] = 1;
      a.cond.forEach((ce, ci) => {
        if (liveCond[i][ci]) for (const f of ce.del) deleted[f] = 1;
      });
    });
    const next = new Uint8Array(F);
    for (let f = 0; f < F; f++) if (inInit[f] && !deleted[f]) next[f] = 1;
    let same = true;
    for (let f = 0; f < F; f++) if (next[f] !== always[f]) same = false;
    always = next;
    if (same) break;
  }
  const drop = new Uint8Array(F);
  for (let f = 0; f < F; f++) if (never[f] || always[f]) drop[f] = 1;
  // keep facts the goal needs in a way that no state provides (an unsolvable goal stays visible)
  for (const f of task.goal) if (never[f]) drop[f] = 0;
  for (const f of task.goalNeg) if (always[f]) drop[f] = 0;

  const keepF = (xs: readonly number[]) => xs.filter((f) => !drop[f]);
  const kept: Array<{ source: number; action: Action }> = [];
  task.actions.forEach((a, i) => {
    if (!live[i]) return;
    const cond: CondEffect[] = [];
    a.cond.forEach((ce, ci) => {
      if (!liveCond[i][ci]) return;
      const c: CondEffect = { cond: keepF(ce.cond), condNeg: keepF(ce.condNeg), add: keepF(ce.add), del: keepF(ce.del) };
      if (c.add.length + c.del.length > 0) cond.push(c);
    });
    const b: Action = { ...a, pre: keepF(a.pre), preNeg: keepF(a.preNeg), add: keepF(a.add), del: keepF(a.del), cond };
    if (b.add.length + b.del.length + b.cond.length === 0) return; // never changes the state
    kept.push({ source: i, action: b });
  });
  const keepFact = new Uint8Array(F);
  for (let f = 0; f < F; f++) keepFact[f] = drop[f] ? 0 : 1;
  const goalTask: Task = { ...task, goal: task.goal.filter((f) => !drop[f]), goalNeg: task.goalNeg.filter((f) => !drop[f]) };
  const r = restrictTask(goalTask, keepFact, kept);
  let nNever = 0;
  let nAlways = 0;
  for (let f = 0; f < F; f++) {
    poll("analysis: simplify");
    if (never[f]) nNever++;
    if (always[f]) nAlways++;
  }
  return { ...r, neverTrue: nNever, alwaysTrue: nAlways, removedActions: task.actions.length - kept.length };
}
