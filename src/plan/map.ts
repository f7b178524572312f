// Maps plan steps to ground action ids of a Task. Several ground actions may share a name
// (one per precondition disjunct); the first one applicable in the state reached so far wins.
import { PlumblineError } from "../util/errors.js";
import type { Action, Task } from "../ground/index.js";
import { stepText, type PlanStep } from "./plan-file.js";

function applicable(a: Action, s: Uint8Array): boolean {
  for (const f of a.pre) if (!s[f]) return false;
  for (const f of a.preNeg) if (s[f]) return false;
  return true;
}

function apply(a: Action, s: Uint8Array): Uint8Array {
  const next = s.slice();
  const adds = [...a.add];
  for (const ce of a.cond) {
    if (ce.cond.every((f) => s[f]) && ce.condNeg.every((f) => !s[f])) {
      for (const f of ce.del) next[f] = 0;
      adds.push(...ce.add);
    }
  }
  for (const f of a.del) next[f] = 0;
  for (const f of adds) next[f] = 1;
  return next;
}

export interface MapOptions {
  /** Name for error positions (default "plan"). */
  planFile?: string;
  /** Append a synthetic goal action (disjunctive goals) applicable after the last step, if any. */
  appendGoalAction?: boolean;
}

/**
 * Ground action ids for `steps`. Candidates for a step are the non-synthetic actions named
 * `(name args…)`, in Task order; the first applicable in the state reached by the chosen
 * actions so far is taken, or the first candidate when none applies (the plan is then
 * invalid on the Task, and later steps also take their first candidate).
 * A step with no ground action at all (unreachable, or pruned) is a PlumblineError.
 */
export function actionNamesToIndices(task: Task, steps: readonly PlanStep[], opts: MapOptions = {}): number[] {
  const byName = new Map<string, number[]>();
  task.actions.forEach((a, i) => {
    if (a.synthetic) return;
    const l = byName.get(a.name);
    if (l) l.push(i);
    else byName.set(a.name, [i]);
  });
  let s: Uint8Array | null = new Uint8Array(task.facts.length);
  for (const f of task.init) s[f] = 1;
  const out: number[] = [];
  for (const [k, st] of steps.entries()) {
    const name = stepText({ name: st.name.toLowerCase(), args: st.args.map((x) => x.toLowerCase()) });
    const cands = byName.get(name);
    if (!cands) {
      throw new PlumblineError("semantic", `plan step ${k + 1} ${name} has no ground action in the task (it is unreachable or was pruned)`, {
        file: opts.planFile ?? "plan",
        line: st.line,
        col: st.col,
      });
    }
    let pick = cands[0];
    if (s) {
      const ok = cands.find((i) => applicable(task.actions[i], s!));
      if (ok !== undefined) {
        pick = ok;
        s = apply(task.actions[ok], s);
      } else s = null;
    }
    out.push(pick);
  }
  if (opts.appendGoalAction && s) {
    const g = task.actions.findIndex((a) => a.synthetic && applicable(a, s!));
    if (g >= 0) out.push(g);
  }
  return out;
}
