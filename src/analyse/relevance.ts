// Goal-relevance (backward) pruning for the bounds: the grounder's Task-level pruning, plus
// the maps from the pruned task's facts and actions back to the original ones.
import type { Task } from "../ground/task.js";
import { pruneIrrelevant } from "../ground/index.js";
import type { RestrictedTask } from "./restrict.js";

/**
 * `pruneIrrelevant` (src/ground) keeps the actions that add or delete — plainly or
 * conditionally — a fact the goal or a kept action's conditions mention. Why that is sound
 * here: dropped actions never change a relevant fact and every condition of a kept action is
 * relevant, so removing the dropped actions from a plan leaves the relevant part of every
 * state unchanged; the plan stays valid at no more cost. Optimal costs are equal, and a
 * completeness threshold of the pruned task is one of the original for the same cost bound.
 * (Tested against the reference Dijkstra in test/analyse.)
 */
export function relevanceFilter(task: Task): RestrictedTask {
  const pruned = pruneIrrelevant(task);
  const factIds = new Map(task.facts.map((f, i) => [f, i]));
  const actionIds = new Map(task.actions.map((a, i) => [a.name, i]));
  return {
    task: pruned,
    factMap: Int32Array.from(pruned.facts, (f) => factIds.get(f)!),
    actionMap: Int32Array.from(pruned.actions, (a) => actionIds.get(a.name)!),
  };
}
