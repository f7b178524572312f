// What changed between two ground tasks of (two versions of) one model: facts, initial state,
// goal, actions added or removed, and costs — by name, so the ids and order do not matter.
import type { Action, Task } from "./task.js";

export type TaskChangeKind = "none" | "costs" | "actions-added" | "actions-removed" | "other";

export interface TaskDiff {
  /**
   * "none": the same task (same names, conditions, effects, costs, initial state and goal, maybe in
   * another order); "costs": only action costs differ; "actions-added" / "actions-removed": only
   * whole actions are new / gone (facts, initial state, goal and the other actions unchanged);
   * "other": anything else.
   */
  kind: TaskChangeKind;
  factsAdded: string[];
  factsRemoved: string[];
  initChanged: boolean;
  goalChanged: boolean;
  actionsAdded: string[];
  actionsRemoved: string[];
  costsChanged: Array<{ action: string; from: number; to: number }>;
}

/** An action's conditions and effects by fact name: equal keys mean the same transition. */
function actionKey(t: Task, a: Action): string {
  const f = (ids: readonly number[]) => ids.map((i) => t.facts[i]).sort().join(" ");
  const cond = a.cond.map((c) => `[${f(c.cond)}|${f(c.condNeg)}|${f(c.add)}|${f(c.del)}]`).sort().join("");
  return `${a.name}|${a.synthetic ? "*" : ""}|${f(a.pre)}|${f(a.preNeg)}|${f(a.add)}|${f(a.del)}|${cond}`;
}

/** key → costs of the actions with that key (sorted; one per copy). */
function actionTable(t: Task): Map<string, { name: string; costs: number[] }> {
  const m = new Map<string, { name: string; costs: number[] }>();
  for (const a of t.actions) {
    const k = actionKey(t, a);
    const e = m.get(k);
    if (e) e.costs.push(a.cost);
    else m.set(k, { name: a.name, costs: [a.cost] });
  }
  for (const e of m.values()) e.costs.sort((x, y) => x - y);
  return m;
}

const names = (t: Task, ids: readonly number[]) => ids.map((i) => t.facts[i]).sort();
const sameList = (a: readonly string[], b: readonly string[]) => a.length === b.length && a.every((x, i) => x === b[i]);

/** The differences from `before` to `after` (lists sorted by name). */
export function diffTasks(before: Task, after: Task): TaskDiff {
  const fb = new Set(before.facts);
  const fa = new Set(after.facts);
  const factsAdded = after.facts.filter((x) => !fb.has(x)).sort();
  const factsRemoved = before.facts.filter((x) => !fa.has(x)).sort();
  const initChanged = !sameList(names(before, before.init), names(after, after.init));
  const goalChanged = !sameList(names(before, before.goal), names(after, after.goal)) || !sameList(names(before, before.goalNeg), names(after, after.goalNeg));
  const tb = actionTable(before);
  const ta = actionTable(after);
  const actionsAdded: string[] = [];
  const actionsRemoved: string[] = [];
  const costsChanged: TaskDiff["costsChanged"] = [];
  for (const [k, e] of ta) {
    const old = tb.get(k);
    if (!old) actionsAdded.push(e.name);
    else if (!old.costs.every((c, i) => c === e.costs[i]) || old.costs.length !== e.costs.length) {
      if (old.costs.length === e.costs.length) costsChanged.push({ action: e.name, from: old.costs[0], to: e.costs[0] });
      else (old.costs.length < e.costs.length ? actionsAdded : actionsRemoved).push(e.name);
    }
  }
  for (const [k, e] of tb) if (!ta.has(k)) actionsRemoved.push(e.name);
  actionsAdded.sort();
  actionsRemoved.sort();
  costsChanged.sort((x, y) => (x.action < y.action ? -1 : x.action > y.action ? 1 : 0));
  const sameFrame = factsAdded.length === 0 && factsRemoved.length === 0 && !initChanged && !goalChanged && before.costModel === after.costModel;
  const only = (n: number) => sameFrame && [actionsAdded.length, actionsRemoved.length, costsChanged.length].filter((x) => x > 0).length <= 1 && n > 0;
  const kind: TaskChangeKind =
    sameFrame && actionsAdded.length + actionsRemoved.length + costsChanged.length === 0
      ? "none"
      : only(costsChanged.length)
        ? "costs"
        : only(actionsAdded.length)
          ? "actions-added"
          : only(actionsRemoved.length)
            ? "actions-removed"
            : "other";
  return { kind, factsAdded, factsRemoved, initChanged, goalChanged, actionsAdded, actionsRemoved, costsChanged };
}
