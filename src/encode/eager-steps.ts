// Part eager-steps-1 (spec encodings/eager-steps-1.md): every action of a parallel step after the
// first depends on an action of the step before — each action as early as it can go.
import type { Task } from "../ground/task.js";
import type { CnfBuilder } from "./cnf.js";
import type { Layout } from "./layout.js";
import type { TaskInfo } from "./task-info.js";

/**
 * New variables, for s = 1..T−1 (steps that have a next one) and f = 0..nF−1: w(s,f) "an action
 * of step s may write f", then x(s,f) "an action of step s may read or write f" (all w of step s,
 * then all x of step s, step by step). Clauses, step s = 1..T−1 in order:
 * for f ascending: [¬w(s,f), A(s,a) for every a writing f]; [¬x(s,f), A(s,a) for every a reading
 * or writing f] (a ascending); then for each action b ascending:
 * [¬A(s+1,b), A(s,b), w(s,f) for f ∈ reads(b), x(s,f) for f ∈ writes(b)] (facts ascending, each
 * once). reads(a) = pre ∪ preNeg ∪ the facts its effect conditions read; writes(a) = the facts
 * any of its effects may add or delete.
 */
export function emitEagerSteps(cnf: CnfBuilder, task: Task, info: TaskInfo, L: Layout): void {
  const { nF, nA } = info;
  const T = L.steps;
  const reads: number[][] = [];
  const writes: number[][] = [];
  const writers: number[][] = Array.from({ length: nF }, () => []);
  const touchers: number[][] = Array.from({ length: nF }, () => []);
  for (let a = 0; a < nA; a++) {
    const act = task.actions[a];
    const r = [...new Set([...act.pre, ...act.preNeg, ...info.condReads[a]])].sort((x, y) => x - y);
    const w = [...new Set([...info.mayAdd[a], ...info.mayDel[a]])].sort((x, y) => x - y);
    reads.push(r);
    writes.push(w);
    for (const f of w) writers[f].push(a);
    for (const f of new Set([...r, ...w])) touchers[f].push(a);
  }
  for (const list of touchers) list.sort((x, y) => x - y);
  const buf: number[] = [];
  for (let s = 1; s < T; s++) {
    const w0 = cnf.newVars(nF, "eager-writes"); // w(s,f) = w0 + f
    const x0 = cnf.newVars(nF, "eager-touches"); // x(s,f) = x0 + f
    for (let f = 0; f < nF; f++) {
      buf.length = 0;
      buf.push(-(w0 + f));
      for (const a of writers[f]) buf.push(L.action(s, a));
      cnf.addClause(buf);
      buf.length = 0;
      buf.push(-(x0 + f));
      for (const a of touchers[f]) buf.push(L.action(s, a));
      cnf.addClause(buf);
    }
    for (let b = 0; b < nA; b++) {
      buf.length = 0;
      buf.push(-L.action(s + 1, b), L.action(s, b));
      for (const f of reads[b]) buf.push(w0 + f);
      for (const f of writes[b]) buf.push(x0 + f);
      cnf.addClause(buf);
    }
  }
}
