// The Task in flat typed arrays (CSR lists of fact ids per action and per conditional
// effect), so the search's hot loops read numbers, not objects; built once per search.
import type { Task } from "../ground/task.js";
import { packFacts, wordsFor } from "./bitstate.js";

/** Compressed rows: row r is data[start[r] .. start[r+1]). */
export interface Rows {
  start: Int32Array;
  data: Int32Array;
}

export function rowsOf(lists: ReadonlyArray<readonly number[]>): Rows {
  const start = new Int32Array(lists.length + 1);
  let n = 0;
  for (let i = 0; i < lists.length; i++) {
    start[i] = n;
    n += lists[i].length;
  }
  start[lists.length] = n;
  const data = new Int32Array(n);
  let k = 0;
  for (const l of lists) for (const x of l) data[k++] = x;
  return { start, data };
}

export interface CompiledTask {
  readonly task: Task;
  readonly numFacts: number;
  readonly words: number;
  readonly numActions: number;
  readonly init: Uint32Array;
  /** Goal masks: a state s is a goal when (s & goalMask) == goalMask and (s & goalNegMask) == 0. */
  readonly goalMask: Uint32Array;
  readonly goalNegMask: Uint32Array;
  readonly cost: Float64Array;
  readonly add: Rows;
  readonly del: Rows;
  /** Conditional effects of action a are ids condOf.start[a] .. condOf.start[a+1] (into the ce* rows). */
  readonly condOf: Int32Array;
  readonly ceCond: Rows;
  readonly ceCondNeg: Rows;
  readonly ceAdd: Rows;
  readonly ceDel: Rows;
  readonly hasZeroCost: boolean;
}

export function compileTask(task: Task): CompiledTask {
  const numFacts = task.facts.length;
  const words = wordsFor(numFacts);
  const acts = task.actions;
  const condOf = new Int32Array(acts.length + 1);
  const ces: Array<{ cond: number[]; condNeg: number[]; add: number[]; del: number[] }> = [];
  acts.forEach((a, i) => {
    condOf[i] = ces.length;
    for (const ce of a.cond) ces.push(ce);
  });
  condOf[acts.length] = ces.length;
  const cost = new Float64Array(acts.length);
  let hasZeroCost = false;
  acts.forEach((a, i) => {
    cost[i] = a.cost;
    if (a.cost === 0) hasZeroCost = true;
  });
  return {
    task,
    numFacts,
    words,
    numActions: acts.length,
    init: packFacts(task.init, words),
    goalMask: packFacts(task.goal, words),
    goalNegMask: packFacts(task.goalNeg, words),
    cost,
    add: rowsOf(acts.map((a) => a.add)),
    del: rowsOf(acts.map((a) => a.del)),
    condOf,
    ceCond: rowsOf(ces.map((c) => c.cond)),
    ceCondNeg: rowsOf(ces.map((c) => c.condNeg)),
    ceAdd: rowsOf(ces.map((c) => c.add)),
    ceDel: rowsOf(ces.map((c) => c.del)),
    hasZeroCost,
  };
}

export function isGoalState(ct: CompiledTask, s: Uint32Array, off: number): boolean {
  const gm = ct.goalMask;
  const gn = ct.goalNegMask;
  for (let w = 0; w < ct.words; w++) {
    const x = s[off + w];
    // bit tests only against 0: `&` yields a signed int32, Uint32Array reads are unsigned
    if ((gm[w] & ~x) !== 0 || (x & gn[w]) !== 0) return false;
  }
  return true;
}

function allSet(s: Uint32Array, off: number, rows: Rows, r: number): boolean {
  for (let k = rows.start[r]; k < rows.start[r + 1]; k++) {
    const f = rows.data[k];
    if ((s[off + (f >>> 5)] & (1 << (f & 31))) === 0) return false;
  }
  return true;
}

function noneSet(s: Uint32Array, off: number, rows: Rows, r: number): boolean {
  for (let k = rows.start[r]; k < rows.start[r + 1]; k++) {
    const f = rows.data[k];
    if ((s[off + (f >>> 5)] & (1 << (f & 31))) !== 0) return false;
  }
  return true;
}

/**
 * Writes the successor of the state at src[srcOff] under action a into dst[dstOff]
 * (the action must be applicable). Conditions are read in the source state, deletes are
 * applied before adds. `fired` is scratch space of at least the action's effect count.
 */
export function applyAction(ct: CompiledTask, a: number, src: Uint32Array, srcOff: number, dst: Uint32Array, dstOff: number, fired: Int32Array): void {
  const W = ct.words;
  let nf = 0;
  for (let e = ct.condOf[a]; e < ct.condOf[a + 1]; e++) {
    if (allSet(src, srcOff, ct.ceCond, e) && noneSet(src, srcOff, ct.ceCondNeg, e)) fired[nf++] = e;
  }
  for (let w = 0; w < W; w++) dst[dstOff + w] = src[srcOff + w];
  const del = ct.del;
  for (let k = del.start[a]; k < del.start[a + 1]; k++) {
    const f = del.data[k];
    dst[dstOff + (f >>> 5)] &= ~(1 << (f & 31));
  }
  for (let i = 0; i < nf; i++) {
    const e = fired[i];
    for (let k = ct.ceDel.start[e]; k < ct.ceDel.start[e + 1]; k++) {
      const f = ct.ceDel.data[k];
      dst[dstOff + (f >>> 5)] &= ~(1 << (f & 31));
    }
  }
  const add = ct.add;
  for (let k = add.start[a]; k < add.start[a + 1]; k++) {
    const f = add.data[k];
    dst[dstOff + (f >>> 5)] |= 1 << (f & 31);
  }
  for (let i = 0; i < nf; i++) {
    const e = fired[i];
    for (let k = ct.ceAdd.start[e]; k < ct.ceAdd.start[e + 1]; k++) {
      const f = ct.ceAdd.data[k];
      dst[dstOff + (f >>> 5)] |= 1 << (f & 31);
    }
  }
}

/** Largest number of conditional effects of any action (size of applyAction's scratch). */
export function maxCondEffects(ct: CompiledTask): number {
  let m = 1;
  for (let a = 0; a < ct.numActions; a++) m = Math.max(m, ct.condOf[a + 1] - ct.condOf[a]);
  return m;
}
