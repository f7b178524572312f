// Every plan the optimizer reports passes through here: ids of the working task are mapped
// back to the ground task, written as plan text, and replayed on the LIFTED model.
import type { PreparedTask } from "../analyse/index.js";
import { planCost, type Task } from "../ground/task.js";
import type { Model } from "../pddl/index.js";
import { parsePlan, planFileText, replayPlan, stepText } from "../plan/index.js";
import { planSteps } from "../search/index.js";

/** A plan that replayed on the lifted model with the cost the ground task gives it. */
export interface CheckedPlan {
  /** Action ids of the ground task (synthetic actions included). */
  groundIds: number[];
  /** Plan-file lines "(drive t1 a b)", synthetic actions dropped. */
  names: string[];
  cost: number;
  /** Number of plan-file steps. */
  length: number;
  /** The plan file text (plumbline's layout, status feasible: see `planFile` for a proven plan). */
  text: string;
  /** "unit" when the model has no action costs (every action counts 1). */
  costModel: Task["costModel"];
}

/** The plan file of a checked plan, stating `proof` (a proof word such as horizon-unsat) when optimality is proven. */
export function planFile(plan: CheckedPlan, proof: string | null): string {
  return planFileText(plan.names, { cost: plan.cost, status: proof ? "optimal" : "feasible", proof, costModel: plan.costModel });
}

/** An internal inconsistency: a bug in plumbline, never a verdict about the user's input. */
export class InternalError extends Error {
  constructor(message: string) {
    super(`${message} (this is a bug in plumbline; please report it)`);
    this.name = "InternalError";
  }
}

/** Runs a plan of action ids on the Task, leaving out positions in `skip`; goal reached? */
export function reachesGoal(task: Task, ids: readonly number[], skip: ReadonlySet<number> = new Set()): boolean {
  const s = new Uint8Array(task.facts.length);
  for (const f of task.init) s[f] = 1;
  for (let i = 0; i < ids.length; i++) {
    if (skip.has(i)) continue;
    const a = task.actions[ids[i]];
    for (const f of a.pre) if (!s[f]) return false;
    for (const f of a.preNeg) if (s[f]) return false;
    const firing = a.cond.filter((ce) => ce.cond.every((f) => s[f]) && ce.condNeg.every((f) => !s[f]));
    for (const f of a.del) s[f] = 0;
    for (const ce of firing) for (const f of ce.del) s[f] = 0;
    for (const f of a.add) s[f] = 1;
    for (const ce of firing) for (const f of ce.add) s[f] = 1;
  }
  return task.goal.every((f) => s[f] === 1) && task.goalNeg.every((f) => s[f] === 0);
}

/**
 * Drops actions the plan does not need: single actions, then pairs (an idle load and unload
 * go together), front to back, until nothing more can go. An action or pair goes only when
 * the plan without it still reaches the goal; costs are non-negative, so the cost never
 * rises. SAT models often carry idle zero-cost moves that this removes. Plans longer than
 * `maxLength` are returned unchanged (the pair pass is cubic).
 */
export function dropRedundant(task: Task, ids: readonly number[], maxLength = 300): number[] {
  if (ids.length > maxLength || !reachesGoal(task, ids, new Set())) return [...ids];
  let plan = [...ids];
  const without = (drop: number[]) => plan.filter((_, k) => !drop.includes(k));
  for (let changed = true; changed; ) {
    changed = false;
    for (let i = 0; i < plan.length; ) {
      if (reachesGoal(task, plan, new Set([i]))) {
        plan = without([i]);
        changed = true;
      } else i++;
    }
    for (let i = 0; i < plan.length && !changed; i++) {
      for (let j = i + 1; j < plan.length; j++) {
        if (reachesGoal(task, plan, new Set([i, j]))) {
          plan = without([i, j]);
          changed = true;
          break;
        }
      }
    }
  }
  return plan;
}

/** Maps ids of the prepared (reduced) task to ground-task ids. */
export function toGroundIds(prepared: PreparedTask, workIds: readonly number[]): number[] {
  return workIds.map((i) => {
    const g = prepared.actionMap[i];
    if (g === undefined || g < 0) throw new InternalError(`action ${i} of the reduced task has no ground action`);
    return g;
  });
}

/**
 * Validates a plan of ground ids on the lifted model. A plan that does not replay, or whose
 * lifted cost differs from the ground cost, is an internal error (thrown, never reported).
 */
export function checkPlan(model: Model, task: Task, groundIds: readonly number[], origin: string): CheckedPlan {
  const cost = planCost(task, groundIds);
  const steps = planSteps(task, groundIds);
  const text = planFileText(steps, { cost, status: "feasible", proof: null, costModel: task.costModel });
  const parsed = parsePlan(text, "plan.txt");
  const r = replayPlan(model, parsed, "plan.txt");
  if (!r.valid) throw new InternalError(`the plan from ${origin} fails on the lifted model: ${r.error?.message ?? "invalid"}`);
  if (r.cost !== cost) throw new InternalError(`the plan from ${origin} costs ${r.cost} on the lifted model but ${cost} on the ground task`);
  return { groundIds: [...groundIds], names: parsed.map((s) => stepText(s)), cost, length: parsed.length, text, costModel: task.costModel };
}
