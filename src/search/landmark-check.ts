// Re-checks a landmark-cut record from first principles, sharing no code with the
// landmark-cut implementation: each landmark by plain relaxed reachability, then the costs.
import type { Task } from "../ground/task.js";
import type { LandmarkRecord } from "./types.js";
import { poll } from "../util/limits.js";

/**
 * Can the positive goal be reached in the delete relaxation when the actions in `removed`
 * are left out? Negative preconditions and negative goals are ignored, and every conditional
 * effect may fire once its action's preconditions and its own positive conditions hold.
 * Both choices only enlarge what is reachable, so "unreachable" here implies every real
 * plan uses one of the removed actions.
 */
export function relaxedReachableWithout(task: Task, removed: ReadonlySet<number>): boolean {
  const reached = new Set<number>(task.init);
  const holds = (facts: readonly number[]) => facts.every((f) => reached.has(f));
  let changed = true;
  while (changed) {
    poll("checking landmarks");
    changed = false;
    task.actions.forEach((a, i) => {
      poll("checking landmarks");
      if (removed.has(i) || !holds(a.pre)) return;
      const adds = [...a.add];
      for (const ce of a.cond) if (holds(ce.cond)) adds.push(...ce.add);
      for (const f of adds) {
        if (!reached.has(f)) {
          reached.add(f);
          changed = true;
        }
      }
    });
  }
  return holds(task.goal);
}

export interface LandmarkCheck {
  valid: boolean;
  reason?: string;
}

/**
 * Verifies a landmark record: every landmark is a well-formed set of action ids whose
 * removal makes the goal relaxed-unreachable; every landmark cost is a non-negative finite
 * number; for every action, the costs of the landmarks containing it sum to at most the
 * action's cost; and the bound equals the sum of the landmark costs. Then every plan costs
 * at least `bound` (each plan contains an action of each landmark; cost partitioning).
 */
export function checkLandmarkCertificate(task: Task, rec: LandmarkRecord): LandmarkCheck {
  const n = task.actions.length;
  if (!rec || !Array.isArray(rec.landmarks) || typeof rec.bound !== "number") return { valid: false, reason: "malformed record" };
  const charged = new Float64Array(n);
  let sum = 0;
  for (let i = 0; i < rec.landmarks.length; i++) {
    poll("checking landmarks");
    const lm = rec.landmarks[i];
    const label = `landmark ${i + 1}`;
    if (!lm || !Array.isArray(lm.actions)) return { valid: false, reason: `${label}: malformed` };
    if (typeof lm.cost !== "number" || !Number.isFinite(lm.cost) || lm.cost < 0) {
      return { valid: false, reason: `${label}: cost ${String(lm.cost)} is not a non-negative finite number` };
    }
    const set = new Set<number>();
    for (const a of lm.actions) {
      if (!Number.isInteger(a) || a < 0 || a >= n) return { valid: false, reason: `${label}: ${String(a)} is not an action id` };
      if (set.has(a)) return { valid: false, reason: `${label}: action ${a} listed twice` };
      set.add(a);
    }
    if (relaxedReachableWithout(task, set)) {
      return { valid: false, reason: `${label}: the goal is still relaxed-reachable without its ${set.size} actions, so it is not a landmark` };
    }
    for (const a of set) charged[a] += lm.cost;
    sum += lm.cost;
  }
  for (let a = 0; a < n; a++) {
    if (charged[a] > task.actions[a].cost) {
      return { valid: false, reason: `cost partition: landmarks containing ${task.actions[a].name} charge ${charged[a]}, more than its cost ${task.actions[a].cost}` };
    }
  }
  if (sum !== rec.bound) return { valid: false, reason: `bound ${rec.bound} differs from the sum of the landmark costs ${sum}` };
  return { valid: true };
}
