// Turning action ids into what a plan file holds: the user's actions in order, with the
// grounder's synthetic actions (e.g. for disjunctive goals) dropped.
import type { Task } from "../ground/task.js";

/** Steps {name, args} of a plan of action ids, synthetic actions dropped. */
export function planSteps(task: Task, plan: readonly number[]): Array<{ name: string; args: string[] }> {
  const out: Array<{ name: string; args: string[] }> = [];
  for (const i of plan) {
    const a = task.actions[i];
    if (a.synthetic) continue;
    out.push({ name: a.schema, args: [...a.args] });
  }
  return out;
}

/** Plan-file names "(drive truck1 quay depot)" of a plan, synthetic actions dropped. */
export function planNames(task: Task, plan: readonly number[]): string[] {
  const out: string[] = [];
  for (const i of plan) if (!task.actions[i].synthetic) out.push(task.actions[i].name);
  return out;
}
