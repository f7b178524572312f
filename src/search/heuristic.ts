// The heuristic interface searches call per state, and the simple heuristics on the
// relaxation: blind, h-max, h-add (Bonet & Geffner 2001) and h-FF (Hoffmann & Nebel 2001).
import { ADD, MAX, RelaxedExplorer, RelaxedTask } from "./relaxed.js";

export interface StateHeuristic {
  readonly name: string;
  /** Never overestimates the optimal cost from any state. */
  readonly admissible: boolean;
  /** Estimate for the packed state s[off..off+words); Infinity marks a proven dead end. */
  evaluate(s: Uint32Array, off: number): number;
  /**
   * Heuristics that compute a relaxed plan mark its actions applicable in the evaluated
   * state here (helpful actions); others leave it undefined.
   */
  readonly helpful?: HelpfulActions;
}

/** Marks for "this action is helpful in the last evaluated state" (stamp equality). */
export class HelpfulActions {
  readonly stamp: Int32Array;
  current = 1;
  constructor(numActions: number) {
    this.stamp = new Int32Array(numActions);
  }
  has(a: number): boolean {
    return this.stamp[a] === this.current;
  }
}

/** 0 at goal states, otherwise the cheapest action cost (admissible: some action is still needed). */
export class BlindHeuristic implements StateHeuristic {
  readonly name = "blind";
  readonly admissible = true;
  private readonly minCost: number;
  constructor(
    private readonly isGoal: (s: Uint32Array, off: number) => boolean,
    costs: Float64Array,
  ) {
    let m = Infinity;
    for (const c of costs) m = Math.min(m, c);
    this.minCost = Number.isFinite(m) ? m : 0;
  }
  evaluate(s: Uint32Array, off: number): number {
    return this.isGoal(s, off) ? 0 : this.minCost;
  }
}

/** h-max (preconditions combined by max; admissible) or h-add (by sum; not admissible). */
export class RelaxationHeuristic implements StateHeuristic {
  readonly admissible: boolean;
  private readonly ex: RelaxedExplorer;
  private readonly mode: number;
  constructor(
    readonly name: "max" | "add",
    rt: RelaxedTask,
    private readonly words: number,
  ) {
    this.ex = new RelaxedExplorer(rt);
    this.mode = name === "max" ? MAX : ADD;
    this.admissible = name === "max";
  }
  evaluate(s: Uint32Array, off: number): number {
    return this.ex.explore(s, off, this.words, this.ex.rt.actionCost, this.mode, true);
  }
}

/**
 * h-FF: a relaxed plan read off the h-add best achievers, valued at the sum of its distinct
 * actions' costs. With `plusOne` every action counts its cost + 1, so zero-cost steps still
 * guide a greedy search. Marks the plan's actions whose operators are applicable as helpful.
 */
export class FFHeuristic implements StateHeuristic {
  readonly name = "ff";
  readonly admissible = false;
  readonly helpful: HelpfulActions;
  private readonly ex: RelaxedExplorer;
  private readonly opMark: Int32Array;
  private readonly actMark: Int32Array;
  private readonly stack: Int32Array;
  private stampValue = 0;
  constructor(
    rt: RelaxedTask,
    private readonly words: number,
    private readonly plusOne = true,
  ) {
    this.ex = new RelaxedExplorer(rt);
    this.opMark = new Int32Array(rt.numOps);
    this.actMark = new Int32Array(rt.numActions);
    this.stack = new Int32Array(rt.opPre.data.length + 1);
    this.helpful = new HelpfulActions(rt.numActions);
  }
  evaluate(s: Uint32Array, off: number): number {
    const ex = this.ex;
    const rt = ex.rt;
    const hadd = ex.explore(s, off, this.words, rt.actionCost, ADD, true);
    this.helpful.current++;
    if (!Number.isFinite(hadd)) return Infinity;
    const stamp = ++this.stampValue;
    const best = ex.factBest;
    const cost = rt.actionCost;
    const stack = this.stack;
    let sp = 0;
    stack[sp++] = rt.goal;
    let h = 0;
    while (sp > 0) {
      const f = stack[--sp];
      const o = best[f];
      if (o < 0 || this.opMark[o] === stamp) continue;
      this.opMark[o] = stamp;
      const a = rt.opAction[o];
      let applicable = true;
      for (let k = rt.opPre.start[o]; k < rt.opPre.start[o + 1]; k++) {
        const p = rt.opPre.data[k];
        if (best[p] >= 0) applicable = false;
        stack[sp++] = p;
      }
      if (a >= 0) {
        if (this.actMark[a] !== stamp) {
          this.actMark[a] = stamp;
          h += this.plusOne ? cost[a] + 1 : cost[a];
        }
        if (applicable) this.helpful.stamp[a] = this.helpful.current;
      }
    }
    return h;
  }
}
