// Goal-relevance (backward) pruning for the bounds: the grounder's Task-level pruning, plus
// the maps from the pruned task's facts and actions back to the original ones.
import type { Task } from "../ground/task.js";
import { pruneIrrelevantMapped } from "../ground/index.js";
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
  return pruneIrrelevantMapped(task);
}
