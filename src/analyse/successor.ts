// Applies ground actions to packed states (the Task semantics: conditions read before,
// deletes then adds); used to explore explicit state spaces without allocating per step.
import type { Action, Task } from "../ground/task.js";

/** True when every bit of `pos` is set and no bit of `neg` is set in state `s` (at offset `off`). */
export function holds(s: Uint32Array, off: number, pos: readonly number[], neg: readonly number[]): boolean {
  for (let i = 0; i < pos.length; i++) {
    const f = pos[i];
    if ((s[off + (f >>> 5)] & (1 << (f & 31))) === 0) return false;
  }
  for (let i = 0; i < neg.length; i++) {
    const f = neg[i];
    if ((s[off + (f >>> 5)] & (1 << (f & 31))) !== 0) return false;
  }
  return true;
}

export function applicableAt(a: Action, s: Uint32Array, off = 0): boolean {
  return holds(s, off, a.pre, a.preNeg);
}

/**
 * Writes the successor of `s` (words at `off`, `words` long) under action `a` into `out`.
 * Does not check applicability.
 */
export function applyAction(a: Action, s: Uint32Array, off: number, words: number, out: Uint32Array): Uint32Array {
  for (let i = 0; i < words; i++) out[i] = s[off + i];
  if (a.cond.length === 0) {
    for (const f of a.del) out[f >>> 5] &= ~(1 << (f & 31));
    for (const f of a.add) out[f >>> 5] |= 1 << (f & 31);
    return out;
  }
  const fired: boolean[] = a.cond.map((ce) => holds(s, off, ce.cond, ce.condNeg));
  for (const f of a.del) out[f >>> 5] &= ~(1 << (f & 31));
  a.cond.forEach((ce, i) => {
    if (fired[i]) for (const f of ce.del) out[f >>> 5] &= ~(1 << (f & 31));
  });
  for (const f of a.add) out[f >>> 5] |= 1 << (f & 31);
  a.cond.forEach((ce, i) => {
    if (fired[i]) for (const f of ce.add) out[f >>> 5] |= 1 << (f & 31);
  });
  return out;
}

export function wordsFor(task: Task): number {
  return Math.max(1, Math.ceil(task.facts.length / 32));
}

export function isGoalAt(task: Task, s: Uint32Array, off = 0): boolean {
  return holds(s, off, task.goal, task.goalNeg);
}
