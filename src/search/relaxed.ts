// The delete relaxation every heuristic here works on: one relaxed operator per action
// (and per conditional effect), negative conditions dropped, plus an artificial goal operator.
import type { Task } from "../ground/task.js";
import { rowsOf, type Rows } from "./compiled.js";
import { KeyHeap } from "./heap.js";
import { poll } from "../util/limits.js";

/**
 * Relaxed operators. Negative preconditions, negative effect conditions and negative goals
 * are ignored (the relaxation only grows, so heuristics stay admissible). An action with
 * conditional effects gives one operator for its unconditional adds (pre = the action's
 * positive preconditions) and one per conditional effect (pre = action pre ∪ positive
 * effect condition); all operators of an action share that action's cost. Fact `top`
 * (always true) is the precondition of operators that have none; fact `goal` is added by
 * the goal operator, whose preconditions are the positive goal facts.
 */
export class RelaxedTask {
  readonly numFacts: number; // task facts + top + goal
  readonly top: number;
  readonly goal: number;
  readonly numOps: number;
  readonly goalOp: number;
  readonly opPre: Rows;
  readonly opAdd: Rows;
  /** Owning action of each operator (-1 for the goal operator). */
  readonly opAction: Int32Array;
  readonly preCount: Int32Array;
  /** Operators having fact f among their preconditions. */
  readonly factPreOps: Rows;
  /** Operators adding fact f. */
  readonly factAchievers: Rows;
  readonly actionCost: Float64Array;
  readonly numActions: number;
  /** Operators of action a. */
  readonly actionOps: Rows;

  constructor(task: Task) {
    const F = task.facts.length;
    this.top = F;
    this.goal = F + 1;
    this.numFacts = F + 2;
    const pres: number[][] = [];
    const adds: number[][] = [];
    const owner: number[] = [];
    const withTop = (xs: number[]) => (xs.length === 0 ? [F] : xs);
    task.actions.forEach((a, i) => {
      if (a.add.length > 0) {
        pres.push(withTop([...a.pre]));
        adds.push([...a.add]);
        owner.push(i);
      }
      for (const ce of a.cond) {
        if (ce.add.length === 0) continue;
        const pre = [...new Set([...a.pre, ...ce.cond])].sort((x, y) => x - y);
        pres.push(withTop(pre));
        adds.push([...ce.add]);
        owner.push(i);
      }
    });
    this.goalOp = pres.length;
    pres.push(withTop([...task.goal]));
    adds.push([F + 1]);
    owner.push(-1);
    this.numOps = pres.length;
    this.opPre = rowsOf(pres);
    this.opAdd = rowsOf(adds);
    this.opAction = Int32Array.from(owner);
    this.preCount = Int32Array.from(pres.map((p) => p.length));
    const byPre: number[][] = Array.from({ length: this.numFacts }, () => []);
    const byAdd: number[][] = Array.from({ length: this.numFacts }, () => []);
    pres.forEach((p, o) => p.forEach((f) => byPre[f].push(o)));
    adds.forEach((ad, o) => ad.forEach((f) => byAdd[f].push(o)));
    this.factPreOps = rowsOf(byPre);
    this.factAchievers = rowsOf(byAdd);
    this.numActions = task.actions.length;
    const byAction: number[][] = Array.from({ length: this.numActions }, () => []);
    owner.forEach((a, o) => {
      if (a >= 0) byAction[a].push(o);
    });
    this.actionOps = rowsOf(byAction);
    this.actionCost = Float64Array.from(task.actions.map((a) => a.cost));
  }
}

export const MAX = 0;
export const ADD = 1;

/**
 * Generalised Dijkstra over the relaxed task from a packed state: h-max (combine
 * preconditions by max) or h-add (by sum). Keeps, per operator, the precondition whose
 * arrival triggered it (for h-max: a precondition of maximal cost, the "supporter"), and per
 * fact the operator that gave it its cost (best achiever).
 */
export class RelaxedExplorer {
  readonly rt: RelaxedTask;
  readonly factCost: Float64Array;
  readonly factBest: Int32Array;
  readonly opSupporter: Int32Array;
  private readonly opVal: Float64Array;
  private readonly unsat: Int32Array;
  private readonly done: Uint8Array;
  private readonly heap = new KeyHeap(256);
  /** Facts true in the last explored state (ids), and how many. */
  readonly stateFacts: Int32Array;
  stateFactCount = 0;

  constructor(rt: RelaxedTask) {
    this.rt = rt;
    this.factCost = new Float64Array(rt.numFacts);
    this.factBest = new Int32Array(rt.numFacts);
    this.done = new Uint8Array(rt.numFacts);
    this.opSupporter = new Int32Array(rt.numOps);
    this.opVal = new Float64Array(rt.numOps);
    this.unsat = new Int32Array(rt.numOps);
    this.stateFacts = new Int32Array(rt.numFacts);
  }

  /**
   * Explores from the state s[off..] (`words` words) with per-action costs `cost`; returns the
   * cost of the artificial goal fact (Infinity if relaxed-unreachable). With `stopAtGoal` the
   * exploration ends once the goal's cost is final (facts costlier than it stay unsettled).
   */
  explore(s: Uint32Array, off: number, words: number, cost: Float64Array, mode: number, stopAtGoal: boolean): number {
    const rt = this.rt;
    const fc = this.factCost;
    const best = this.factBest;
    const done = this.done;
    const sup = this.opSupporter;
    const opVal = this.opVal;
    const unsat = this.unsat;
    const heap = this.heap;
    fc.fill(Infinity);
    best.fill(-1);
    done.fill(0);
    sup.fill(-1);
    opVal.fill(0);
    unsat.set(rt.preCount);
    heap.clear();
    let nsf = 0;
    for (let w = 0; w < words; w++) {
      let bits = s[off + w];
      while (bits !== 0) {
        const low = bits & -bits;
        const f = (w << 5) + 31 - Math.clz32(low);
        bits ^= low;
        fc[f] = 0;
        this.stateFacts[nsf++] = f;
        heap.push(0, 0, f);
      }
    }
    this.stateFactCount = nsf;
    fc[rt.top] = 0;
    heap.push(0, 0, rt.top);
    const preOps = rt.factPreOps;
    const opAction = rt.opAction;
    const goal = rt.goal;
    while (heap.size > 0) {
      poll("heuristic");
      const f = heap.pop();
      if (done[f]) continue;
      done[f] = 1;
      const c = fc[f];
      if (f === goal && stopAtGoal) break;
      for (let k = preOps.start[f]; k < preOps.start[f + 1]; k++) {
        const o = preOps.data[k];
        if (mode === MAX) {
          if (c > opVal[o]) opVal[o] = c;
        } else opVal[o] += c;
        if (--unsat[o] === 0) {
          sup[o] = f;
          const a = opAction[o];
          const v = opVal[o] + (a < 0 ? 0 : cost[a]);
          this.relax(o, v);
        }
      }
    }
    return fc[goal];
  }

  /**
   * After a MAX exploration (without stopAtGoal), the costs of `count` actions listed in
   * `acts` were lowered in `cost`: brings the h-max values and supporters up to date by
   * propagating the decreases (reachability does not change), and returns the goal's cost.
   */
  decreaseMax(acts: Int32Array, count: number, cost: Float64Array): number {
    const rt = this.rt;
    const fc = this.factCost;
    const sup = this.opSupporter;
    const opVal = this.opVal;
    const unsat = this.unsat;
    const heap = this.heap;
    const opPre = rt.opPre;
    const preOps = rt.factPreOps;
    const opAction = rt.opAction;
    heap.clear();
    for (let i = 0; i < count; i++) {
      const a = acts[i];
      for (let k = rt.actionOps.start[a]; k < rt.actionOps.start[a + 1]; k++) {
        const o = rt.actionOps.data[k];
        if (unsat[o] !== 0) continue;
        const v = opVal[o] + cost[a];
        this.relax(o, v);
      }
    }
    while (heap.size > 0) {
      poll("heuristic");
      const f = heap.pop();
      if (heap.topKey1 > fc[f]) continue;
      for (let k = preOps.start[f]; k < preOps.start[f + 1]; k++) {
        const o = preOps.data[k];
        // only the supporter (a precondition of maximal cost) decides the operator's value
        if (unsat[o] !== 0 || sup[o] !== f) continue;
        let m = -1;
        let arg = -1;
        for (let j = opPre.start[o]; j < opPre.start[o + 1]; j++) {
          const p = opPre.data[j];
          if (fc[p] > m) {
            m = fc[p];
            arg = p;
          }
        }
        opVal[o] = m;
        sup[o] = arg;
        const a = opAction[o];
        const v = m + (a < 0 ? 0 : cost[a]);
        this.relax(o, v);
      }
    }
    return fc[rt.goal];
  }

  /** Offers cost v (operator o's value plus its cost) to each fact o adds. */
  private relax(o: number, v: number): void {
    const opAdd = this.rt.opAdd;
    const fc = this.factCost;
    for (let j = opAdd.start[o]; j < opAdd.start[o + 1]; j++) {
      const e = opAdd.data[j];
      if (v < fc[e]) {
        fc[e] = v;
        this.factBest[e] = o;
        this.heap.push(v, 0, e);
      }
    }
  }
}
