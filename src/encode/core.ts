// The clause schemas every step encoding shares (spec encodings/core-1.md): initial state,
// goal, preconditions, conditional-effect "fires" variables, effects, explanatory frame axioms.
import type { Task } from "../ground/task.js";
import type { CnfBuilder } from "./cnf.js";
import type { Layout } from "./layout.js";
import type { TaskInfo } from "./task-info.js";

/**
 * Unit clauses: the initial state (every fact, by id) and the goal (positive, then negative) —
 * the goal only when `goalAtEnd` (a part such as relaxed-suffix-1 may finish the plan instead).
 */
export function emitInitAndGoal(cnf: CnfBuilder, task: Task, L: Layout, goalAtEnd = true): void {
  const init = new Uint8Array(L.nF);
  for (const f of task.init) init[f] = 1;
  for (let f = 0; f < L.nF; f++) cnf.add1(init[f] ? L.fact(0, f) : -L.fact(0, f));
  if (!goalAtEnd) return;
  for (const f of task.goal) cnf.add1(L.fact(L.steps, f));
  for (const f of task.goalNeg) cnf.add1(-L.fact(L.steps, f));
}

/** One delete clause template of an action: trigger (−1 = the action itself, else a global effect). */
interface DelTemplate {
  trigger: number;
  fact: number;
  /** global effects of the same action that add `fact` (they rescue it: deletes first, then adds) */
  rescuers: number[];
}

/** Per-action templates, computed once and instantiated at every step. */
export interface CoreTemplates {
  dels: DelTemplate[][];
}

export function coreTemplates(task: Task, info: TaskInfo): CoreTemplates {
  const dels: DelTemplate[][] = [];
  for (let a = 0; a < info.nA; a++) {
    const act = task.actions[a];
    const addSet = new Set(act.add);
    const g0 = info.effStart[a];
    const rescuersOf = (f: number): number[] => {
      const r: number[] = [];
      act.cond.forEach((ce, k) => {
        if (ce.add.includes(f)) r.push(g0 + k);
      });
      return r;
    };
    const list: DelTemplate[] = [];
    for (const f of act.del) if (!addSet.has(f)) list.push({ trigger: -1, fact: f, rescuers: rescuersOf(f) });
    act.cond.forEach((ce, k) => {
      for (const f of ce.del) if (!addSet.has(f)) list.push({ trigger: g0 + k, fact: f, rescuers: rescuersOf(f) });
    });
    dels.push(list);
  }
  return { dels };
}

/**
 * Emits the core clauses of step s (time s−1 → s) and returns the fire literal of every
 * global conditional effect at this step (the action's own literal when the condition is empty).
 */
export function emitStepCore(cnf: CnfBuilder, task: Task, info: TaskInfo, tpl: CoreTemplates, L: Layout, s: number): Int32Array {
  const fire = new Int32Array(info.effStart[info.nA]);
  const buf: number[] = [];
  // preconditions and fire definitions, action by action
  for (let a = 0; a < info.nA; a++) {
    const act = task.actions[a];
    const A = L.action(s, a);
    for (const f of act.pre) cnf.add2(-A, L.fact(s - 1, f));
    for (const f of act.preNeg) cnf.add2(-A, -L.fact(s - 1, f));
    for (let k = 0; k < act.cond.length; k++) {
      const g = info.effStart[a] + k;
      if (!info.effHasCond[g]) {
        fire[g] = A;
        continue;
      }
      const ce = act.cond[k];
      const X = cnf.newVar("fires");
      fire[g] = X;
      cnf.add2(-X, A);
      for (const c of ce.cond) cnf.add2(-X, L.fact(s - 1, c));
      for (const c of ce.condNeg) cnf.add2(-X, -L.fact(s - 1, c));
      buf.length = 0;
      buf.push(-A);
      for (const c of ce.cond) buf.push(-L.fact(s - 1, c));
      for (const c of ce.condNeg) buf.push(L.fact(s - 1, c));
      buf.push(X);
      cnf.addClause(buf);
    }
  }
  // effects, action by action
  for (let a = 0; a < info.nA; a++) {
    const act = task.actions[a];
    const A = L.action(s, a);
    for (const f of act.add) cnf.add2(-A, L.fact(s, f));
    for (let k = 0; k < act.cond.length; k++) {
      const X = fire[info.effStart[a] + k];
      for (const f of act.cond[k].add) cnf.add2(-X, L.fact(s, f));
    }
    for (const d of tpl.dels[a]) {
      const trig = d.trigger < 0 ? A : fire[d.trigger];
      buf.length = 0;
      buf.push(-trig, -L.fact(s, d.fact));
      let taut = false;
      for (const g of d.rescuers) {
        const x = fire[g];
        if (x === trig) taut = true;
        else if (!buf.includes(x)) buf.push(x);
      }
      if (!taut) cnf.addClause(buf);
    }
  }
  // explanatory frame axioms, fact by fact: a change needs a cause
  for (let f = 0; f < info.nF; f++) {
    frameClause(cnf, buf, L.fact(s - 1, f), -L.fact(s, f), info.adders[f], fire, L, s);
    frameClause(cnf, buf, -L.fact(s - 1, f), L.fact(s, f), info.deleters[f], fire, L, s);
  }
  return fire;
}

function frameClause(cnf: CnfBuilder, buf: number[], l0: number, l1: number, causes: TaskInfo["adders"][number], fire: Int32Array, L: Layout, s: number): void {
  buf.length = 0;
  buf.push(l0, l1);
  // causes of one action are contiguous; duplicates (an empty-condition effect's literal is
  // the action's own) can only occur within one action's run
  let runStart = buf.length;
  for (let i = 0; i < causes.act.length; i++) {
    if (i > 0 && causes.act[i] !== causes.act[i - 1]) runStart = buf.length;
    const e = causes.eff[i];
    const x = e < 0 ? L.action(s, causes.act[i]) : fire[e];
    let dup = false;
    for (let j = runStart; j < buf.length; j++) if (buf[j] === x) dup = true;
    if (!dup) buf.push(x);
  }
  cnf.addClause(buf);
}
