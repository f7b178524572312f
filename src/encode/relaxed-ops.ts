// The delete relaxation the relaxed suffix reasons about: one relaxed operator per action and
// per conditional effect (negative conditions and deletes dropped), with what each may add.
import type { Task } from "../ground/task.js";

export interface RelaxedOp {
  /** The action whose cost the operator is charged to. */
  action: number;
  /** −1: the action's own effect; k ≥ 0: its conditional effect k. */
  effect: number;
  /** Facts that must be available (the action's precondition, plus the effect's condition). */
  pre: number[];
  /** Facts it makes available, those in `pre` left out (ascending, non-empty). */
  add: number[];
}

/**
 * Operators in action order, each action's own effect before its conditional effects (Task
 * order). An operator whose adds all lie in its own precondition adds nothing and is left out.
 */
export function relaxedOps(task: Task): RelaxedOp[] {
  const out: RelaxedOp[] = [];
  task.actions.forEach((a, i) => {
    const push = (effect: number, pre: number[], add: readonly number[]) => {
      const p = new Set(pre);
      const adds = add.filter((f) => !p.has(f));
      if (adds.length > 0) out.push({ action: i, effect, pre, add: adds });
    };
    push(-1, [...a.pre], a.add);
    a.cond.forEach((ce, k) => push(k, [...new Set([...a.pre, ...ce.cond])].sort((x, y) => x - y), ce.add));
  });
  return out;
}
