// Per-task tables the step encodings share: conditional effects numbered globally, each
// fact's possible causes of becoming true / false, and each action's possible writes and reads.
import type { Task } from "../ground/task.js";

/** A cause of a fact change: action `act`, unconditionally (eff = −1) or via global effect `eff`. */
export interface Causes {
  act: number[];
  eff: number[];
}

export interface TaskInfo {
  nF: number;
  nA: number;
  /** Global conditional-effect numbering: effects of action a are effStart[a] .. effStart[a+1]−1. */
  effStart: Int32Array;
  /** 1 if the global effect has a non-empty condition (it gets its own "fires" variable). */
  effHasCond: Uint8Array;
  /** Per fact: what can make it true (a with f ∈ add(a); effects e with f ∈ add(e)). */
  adders: Causes[];
  /** Per fact: what can make it false (f ∈ del(a) \ add(a); f ∈ del(e) \ add(a)). */
  deleters: Causes[];
  /** Per action: facts it may make true (PA), false (PD), and facts its effect conditions read (C). */
  mayAdd: number[][];
  mayDel: number[][];
  condReads: number[][];
}

function checkFacts(ids: readonly number[], nF: number, what: string): void {
  for (let i = 0; i < ids.length; i++) {
    const f = ids[i];
    if (!Number.isInteger(f) || f < 0 || f >= nF) throw new Error(`encode: ${what} names fact ${f}, outside 0..${nF - 1}`);
    if (i > 0 && ids[i - 1] >= f) throw new Error(`encode: ${what} is not sorted and duplicate-free`);
  }
}

const sortedUnion = (lists: readonly (readonly number[])[]): number[] => {
  const s = new Set<number>();
  for (const l of lists) for (const x of l) s.add(x);
  return [...s].sort((x, y) => x - y);
};

/** Builds the shared tables; throws on a malformed Task (ids out of range, bad cost). */
export function taskInfo(task: Task): TaskInfo {
  const nF = task.facts.length;
  const nA = task.actions.length;
  checkFacts(task.init, nF, "init");
  checkFacts(task.goal, nF, "goal");
  checkFacts(task.goalNeg, nF, "goalNeg");
  const effStart = new Int32Array(nA + 1);
  const hasCond: number[] = [];
  const adders: Causes[] = [];
  const deleters: Causes[] = [];
  for (let f = 0; f < nF; f++) {
    adders.push({ act: [], eff: [] });
    deleters.push({ act: [], eff: [] });
  }
  const mayAdd: number[][] = [];
  const mayDel: number[][] = [];
  const condReads: number[][] = [];
  let g = 0;
  for (let a = 0; a < nA; a++) {
    const act = task.actions[a];
    const where = `action ${a} ${act.name}`;
    if (!Number.isInteger(act.cost) || act.cost < 0 || !Number.isSafeInteger(act.cost)) throw new Error(`encode: ${where} has cost ${act.cost}`);
    checkFacts(act.pre, nF, `${where} pre`);
    checkFacts(act.preNeg, nF, `${where} preNeg`);
    checkFacts(act.add, nF, `${where} add`);
    checkFacts(act.del, nF, `${where} del`);
    effStart[a] = g;
    const addSet = new Set(act.add);
    for (const f of act.add) pushCause(adders[f], a, -1);
    for (const f of act.del) if (!addSet.has(f)) pushCause(deleters[f], a, -1);
    for (const ce of act.cond) {
      checkFacts(ce.cond, nF, `${where} effect condition`);
      checkFacts(ce.condNeg, nF, `${where} effect condition`);
      checkFacts(ce.add, nF, `${where} effect add`);
      checkFacts(ce.del, nF, `${where} effect del`);
      hasCond.push(ce.cond.length + ce.condNeg.length > 0 ? 1 : 0);
      for (const f of ce.add) pushCause(adders[f], a, g);
      for (const f of ce.del) if (!addSet.has(f)) pushCause(deleters[f], a, g);
      g++;
    }
    mayAdd.push(sortedUnion([act.add, ...act.cond.map((c) => c.add)]));
    mayDel.push(sortedUnion([act.del, ...act.cond.map((c) => c.del)]).filter((f) => !addSet.has(f)));
    condReads.push(sortedUnion(act.cond.flatMap((c) => [c.cond, c.condNeg])));
  }
  effStart[nA] = g;
  return { nF, nA, effStart, effHasCond: Uint8Array.from(hasCond), adders, deleters, mayAdd, mayDel, condReads };
}

function pushCause(c: Causes, act: number, eff: number): void {
  c.act.push(act);
  c.eff.push(eff);
}
