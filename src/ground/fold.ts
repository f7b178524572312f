// Folds facts no action can change (true initially and never deleted, or false initially and
// never added) out of the task, drops actions that can then never apply, and numbers the rest
// in canonical order so the same input always gives the same Task.
import { compareKeys, sortedUnique, type Draft, type DraftAction } from "./draft.js";
import { finishEffects } from "./instantiate.js";
import type { Action, CondEffect, Task } from "./task.js";
import { poll } from "../util/limits.js";

/** Removes constant facts from conditions and effects until nothing changes. */
export function foldConstants(d: Draft): void {
  const n = d.facts.length;
  const init = new Uint8Array(n);
  for (const f of d.init) init[f] = 1;
  for (;;) {
    poll("grounding: fold");
    const added = new Uint8Array(n);
    const deleted = new Uint8Array(n);
    for (const a of d.actions) {
      poll("grounding: fold");
      for (const f of a.add) added[f] = 1;
      for (const f of a.del) deleted[f] = 1;
      for (const ce of a.cond) {
        for (const f of ce.add) added[f] = 1;
        for (const f of ce.del) deleted[f] = 1;
      }
    }
    const isTrue = (f: number) => init[f] === 1 && deleted[f] === 0;
    const isFalse = (f: number) => init[f] === 0 && added[f] === 0;
    let removed = false;
    const kept: DraftAction[] = [];
    for (const a of d.actions) {
      poll("grounding: fold");
      if (a.pre.some(isFalse) || a.preNeg.some(isTrue)) {
        removed = true;
        continue;
      }
      a.pre = a.pre.filter((f) => !isTrue(f));
      a.preNeg = a.preNeg.filter((f) => !isFalse(f));
      const ces: CondEffect[] = [];
      for (const ce of a.cond) {
        if (ce.cond.some(isFalse) || ce.condNeg.some(isTrue)) continue;
        ces.push({ cond: ce.cond.filter((f) => !isTrue(f)), condNeg: ce.condNeg.filter((f) => !isFalse(f)), add: ce.add, del: ce.del });
      }
      const eff = finishEffects(a.add, a.del, ces);
      a.add = eff.add;
      a.del = eff.del;
      a.cond = eff.cond;
      kept.push(a);
    }
    d.actions = kept;
    if (!removed) {
      // Constant facts can go, except those the goal still mentions (kept to show an unreachable goal).
      d.goal = d.goal.filter((f) => !isTrue(f));
      d.goalNeg = d.goalNeg.filter((f) => !isFalse(f));
      const needed = new Set([...d.goal, ...d.goalNeg]);
      const constant = new Uint8Array(n);
      for (let f = 0; f < n; f++) if ((isTrue(f) || isFalse(f)) && !needed.has(f)) constant[f] = 1;
      const drop = (xs: number[]) => xs.filter((f) => !constant[f]);
      for (const a of d.actions) {
        poll("grounding: fold");
        a.pre = drop(a.pre);
        a.preNeg = drop(a.preNeg);
        a.add = drop(a.add);
        a.del = drop(a.del);
        a.cond = a.cond
          .map((ce) => ({ cond: drop(ce.cond), condNeg: drop(ce.condNeg), add: drop(ce.add), del: drop(ce.del) }))
          .filter((ce) => ce.add.length + ce.del.length > 0);
        const eff = finishEffects(a.add, a.del, a.cond);
        a.add = eff.add;
        a.del = eff.del;
        a.cond = eff.cond;
      }
      const keep = new Uint8Array(n);
      for (let f = 0; f < n; f++) keep[f] = constant[f] ? 0 : 1;
      renumber(d, keep);
      return;
    }
  }
}

/** Keeps facts with keep[f] = 1, renumbered in canonical order (facts elsewhere must be dropped already). */
export function renumber(d: Draft, keep: Uint8Array): void {
  const ids: number[] = [];
  for (let f = 0; f < d.facts.length; f++) if (keep[f]) ids.push(f);
  ids.sort((x, y) => compareKeys(d.factKeys[x], d.factKeys[y]));
  const map = new Int32Array(d.facts.length).fill(-1);
  ids.forEach((f, i) => (map[f] = i));
  const m = (xs: readonly number[]) => sortedUnique(xs.filter((f) => map[f] >= 0).map((f) => map[f]));
  d.facts = ids.map((f) => d.facts[f]);
  d.factKeys = ids.map((f) => d.factKeys[f]);
  d.init = m(d.init);
  d.goal = m(d.goal);
  d.goalNeg = m(d.goalNeg);
  for (const a of d.actions) {
    poll("grounding: fold");
    a.pre = m(a.pre);
    a.preNeg = m(a.preNeg);
    a.add = m(a.add);
    a.del = m(a.del);
    a.cond = a.cond.map((ce) => ({ cond: m(ce.cond), condNeg: m(ce.condNeg), add: m(ce.add), del: m(ce.del) }));
  }
  d.actions.sort((x, y) => compareKeys(x.sortKey, y.sortKey));
}

export function draftToTask(d: Draft, costModel: Task["costModel"]): Task {
  const actions: Action[] = d.actions.map((a) => {
    const out: Action = { name: a.name, schema: a.schema, args: a.args, pre: a.pre, preNeg: a.preNeg, add: a.add, del: a.del, cond: a.cond, cost: a.cost };
    if (a.synthetic) out.synthetic = true;
    return out;
  });
  return { domainName: d.domainName, problemName: d.problemName, facts: d.facts, init: d.init, goal: d.goal, goalNeg: d.goalNeg, actions, costModel };
}
