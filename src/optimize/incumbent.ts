// A known plan to start from (OptimizeOptions.incumbent) instead of the GBFS first plan: used
// when a recorded plan is re-judged against a changed model, so only the final refutation is left.
import type { Task } from "../ground/index.js";
import { actionNamesToIndices, parsePlan, stepText } from "../plan/index.js";
import { reachesGoal } from "./plan-check.js";

/**
 * Ground action ids of the plan-file lines `lines` on `task`, or null when they do not form a
 * plan of the task. Steps with no ground action (pruned as irrelevant to the goal) are left out:
 * such an action adds and deletes no relevant fact, so the remaining steps keep their conditions
 * and still reach the goal — checked here on the Task, and again by the lifted replay every plan
 * of the optimizer passes (`checkPlan`).
 */
export function incumbentIds(task: Task, lines: readonly string[]): number[] | null {
  const names = new Set<string>();
  for (const a of task.actions) if (!a.synthetic) names.add(a.name);
  let steps;
  try {
    steps = parsePlan(lines.join("\n"), "incumbent").filter((s) => names.has(stepText(s)));
  } catch {
    return null;
  }
  const ids = actionNamesToIndices(task, steps, { appendGoalAction: true });
  return reachesGoal(task, ids) ? ids : null;
}
