// Goal-relevance (backward) pruning: keeps only actions that can touch a fact the goal, or
// a kept action's conditions, depend on. Conservative with negative conditions and
// conditional effects: touching means adding or deleting, plain or conditional.
import type { Task } from "./task.js";
import { sortedUnique } from "./draft.js";
import { poll } from "../util/limits.js";

export function pruneIrrelevant(task: Task): Task {
  return pruneIrrelevantMapped(task).task;
}

/**
 * The pruned task with, for each kept fact and action, its index in `task`. Names cannot serve
 * as the map: the branches of a disjunctive precondition are separate actions with one name.
 */
export function pruneIrrelevantMapped(task: Task): { task: Task; factMap: Int32Array; actionMap: Int32Array } {
  const n = task.facts.length;
  const touching: number[][] = Array.from({ length: n }, () => []);
  task.actions.forEach((a, i) => {
    poll("grounding: relevance");
    const t = new Set<number>([...a.add, ...a.del]);
    for (const ce of a.cond) for (const f of [...ce.add, ...ce.del]) t.add(f);
    for (const f of t) touching[f].push(i);
  });
  const relFact = new Uint8Array(n);
  const relAction = new Uint8Array(task.actions.length);
  const queue: number[] = [];
  const mark = (f: number) => {
    if (!relFact[f]) {
      relFact[f] = 1;
      queue.push(f);
    }
  };
  for (const f of task.goal) mark(f);
  for (const f of task.goalNeg) mark(f);
  for (let qi = 0; qi < queue.length; qi++) {
    poll("grounding: relevance");
    for (const ai of touching[queue[qi]]) {
      if (relAction[ai]) continue;
      relAction[ai] = 1;
      const a = task.actions[ai];
      for (const f of a.pre) mark(f);
      for (const f of a.preNeg) mark(f);
      for (const ce of a.cond) {
        for (const f of ce.cond) mark(f);
        for (const f of ce.condNeg) mark(f);
      }
    }
  }
  const map = new Int32Array(n).fill(-1);
  const facts: string[] = [];
  for (let f = 0; f < n; f++) {
    if (relFact[f]) {
      map[f] = facts.length;
      facts.push(task.facts[f]);
    }
  }
  const m = (xs: readonly number[]) => sortedUnique(xs.filter((f) => map[f] >= 0).map((f) => map[f]));
  const kept: number[] = [];
  for (let i = 0; i < task.actions.length; i++) if (relAction[i]) kept.push(i);
  const actions = kept
    .map((i) => task.actions[i])
    .map((a) => ({
      ...a,
      pre: m(a.pre),
      preNeg: m(a.preNeg),
      add: m(a.add),
      del: m(a.del),
      cond: a.cond
        .map((ce) => ({ cond: m(ce.cond), condNeg: m(ce.condNeg), add: m(ce.add), del: m(ce.del) }))
        .filter((ce) => ce.add.length + ce.del.length > 0),
    }));
  const factMap = new Int32Array(facts.length);
  for (let f = 0; f < n; f++) if (map[f] >= 0) factMap[map[f]] = f;
  return { task: { ...task, facts, init: m(task.init), goal: m(task.goal), goalNeg: m(task.goalNeg), actions }, factMap, actionMap: Int32Array.from(kept) };
}
