// Builds a smaller Task from a subset of facts and (already filtered) actions, renumbering
// fact ids and remembering where each fact and action came from.
import type { Action, CondEffect, Task } from "../ground/task.js";

export interface RestrictedTask {
  task: Task;
  /** New fact id → fact id in the source task. */
  factMap: Int32Array;
  /** New action id → action id in the source task. */
  actionMap: Int32Array;
}

/**
 * Keeps the facts with keepFact[f] and the given actions (each already stripped of
 * conditions and effects it should lose; every fact it still mentions must be kept).
 */
export function restrictTask(task: Task, keepFact: Uint8Array, actions: Array<{ source: number; action: Action }>): RestrictedTask {
  const newId = new Int32Array(task.facts.length).fill(-1);
  const factMap: number[] = [];
  for (let f = 0; f < task.facts.length; f++) {
    if (!keepFact[f]) continue;
    newId[f] = factMap.length;
    factMap.push(f);
  }
  const map = (xs: readonly number[]): number[] => {
    const out: number[] = [];
    for (const f of xs) {
      const g = newId[f];
      if (g < 0) throw new Error(`restrictTask: fact ${task.facts[f]} is used but was dropped`);
      out.push(g);
    }
    return out.sort((a, b) => a - b);
  };
  const keepOnly = (xs: readonly number[]): number[] => xs.filter((f) => newId[f] >= 0).map((f) => newId[f]);
  const newActions: Action[] = actions.map(({ action: a }) => {
    const cond: CondEffect[] = a.cond.map((ce) => ({ cond: map(ce.cond), condNeg: map(ce.condNeg), add: map(ce.add), del: map(ce.del) }));
    const out: Action = {
      name: a.name,
      schema: a.schema,
      args: a.args,
      pre: map(a.pre),
      preNeg: map(a.preNeg),
      add: map(a.add),
      del: map(a.del),
      cond,
      cost: a.cost,
    };
    if (a.synthetic) out.synthetic = true;
    return out;
  });
  return {
    task: {
      domainName: task.domainName,
      problemName: task.problemName,
      facts: factMap.map((f) => task.facts[f]),
      init: keepOnly(task.init),
      goal: map(task.goal),
      goalNeg: map(task.goalNeg),
      actions: newActions,
      costModel: task.costModel,
    },
    factMap: Int32Array.from(factMap),
    actionMap: Int32Array.from(actions.map((a) => a.source)),
  };
}

/** Composes two maps: outer[i] indexes inner. */
export function composeMaps(inner: Int32Array, outer: Int32Array): Int32Array {
  return outer.map((i) => inner[i]);
}
