// One-off heuristic values of a given state (a list of true facts), for callers that
// want a bound without running a search (tests, the optimizer's initial lower bound).
import type { Task } from "../ground/task.js";
import { packFacts } from "./bitstate.js";
import { compileTask } from "./compiled.js";
import { makeHeuristic } from "./make-heuristic.js";
import type { HeuristicName } from "./types.js";

/** Heuristic `name` of the state whose true facts are `facts` (Infinity: relaxed dead end). */
export function evaluateState(task: Task, name: HeuristicName, facts: readonly number[] = task.init): number {
  const ct = compileTask(task);
  return makeHeuristic(name, ct).evaluate(packFacts(facts, ct.words), 0);
}
