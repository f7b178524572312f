// diffTasks: what changed between two ground tasks, by name — invariant under renumbering facts
// and reordering actions, and each single kind of edit is classified as that kind.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { diffTasks, type Task } from "../../src/ground/index.js";
import { factoredTaskArb } from "../support/random-task.js";

/** The same task with fact ids permuted by `perm` and the actions in reverse order. */
function renumbered(t: Task, perm: number[]): Task {
  const map = (ids: readonly number[]) => ids.map((i) => perm[i]).sort((a, b) => a - b);
  const facts: string[] = new Array(t.facts.length);
  t.facts.forEach((f, i) => (facts[perm[i]] = f));
  return {
    ...t,
    facts,
    init: map(t.init),
    goal: map(t.goal),
    goalNeg: map(t.goalNeg),
    actions: [...t.actions].reverse().map((a) => ({ ...a, pre: map(a.pre), preNeg: map(a.preNeg), add: map(a.add), del: map(a.del), cond: a.cond.map((c) => ({ cond: map(c.cond), condNeg: map(c.condNeg), add: map(c.add), del: map(c.del) })) })),
  };
}

const taskAndPerm = factoredTaskArb({ maxVars: 4, maxActions: 6, maxCost: 4 })
  .filter((t) => t.actions.length > 0 && new Set(t.actions.map((a) => a.name)).size === t.actions.length)
  .chain((t) => fc.tuple(fc.constant(t), fc.shuffledSubarray([...t.facts.keys()], { minLength: t.facts.length, maxLength: t.facts.length }), fc.nat()));

describe("diffTasks", () => {
  it("a renumbered, reordered copy is 'none'; one cost, one action removed or added is that kind, naming the action", () => {
    fc.assert(
      fc.property(taskAndPerm, ([t, perm, k]) => {
        const same = renumbered(t, perm);
        expect(diffTasks(t, same).kind).toBe("none");
        const i = k % t.actions.length;
        const a = same.actions[i];
        const dearer = { ...same, actions: same.actions.map((x, j) => (j === i ? { ...x, cost: x.cost + 3 } : x)) };
        expect(diffTasks(t, dearer)).toMatchObject({ kind: "costs", costsChanged: [{ action: a.name, from: a.cost, to: a.cost + 3 }], actionsAdded: [], actionsRemoved: [] });
        const fewer = { ...same, actions: same.actions.filter((_, j) => j !== i) };
        expect(diffTasks(t, fewer)).toMatchObject({ kind: "actions-removed", actionsRemoved: [a.name] });
        expect(diffTasks(fewer, same)).toMatchObject({ kind: "actions-added", actionsAdded: [a.name] });
        // two kinds at once, or a changed initial state or goal, is "other"
        expect(diffTasks(t, { ...fewer, actions: fewer.actions.map((x) => ({ ...x, cost: x.cost + 1 })) }).kind).toBe(fewer.actions.length ? "other" : "actions-removed");
        expect(diffTasks(t, { ...same, goal: [] }).kind).toBe(t.goal.length ? "other" : "none");
      }),
      { numRuns: 200 },
    );
  });

  it("a changed effect under the same name counts as one action removed and one added", () => {
    fc.assert(
      fc.property(taskAndPerm, ([t]) => {
        const changed = { ...t, actions: t.actions.map((a, j) => (j === 0 ? { ...a, add: a.add.length ? [] : [0] } : a)) };
        const d = diffTasks(t, changed);
        expect(d).toMatchObject({ kind: "other", actionsAdded: [t.actions[0].name], actionsRemoved: [t.actions[0].name] });
      }),
      { numRuns: 100 },
    );
  });
});
