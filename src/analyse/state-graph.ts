// The explicit reachable state graph of a Task (breadth-first from the initial state) in
// typed arrays: packed states plus CSR edge lists labelled with action ids, under a state cap.
import type { Task } from "../ground/task.js";
import { PackedStateSet, packBits } from "./state-store.js";
import { applicableAt, applyAction, wordsFor } from "./successor.js";
import { poll } from "../util/limits.js";

export interface StateGraph {
  task: Task;
  states: PackedStateSet;
  /** CSR: the out-edges of state i are edgeTarget[edgeStart[i] .. edgeStart[i+1]). */
  edgeStart: Int32Array;
  edgeTarget: Int32Array;
  edgeAction: Int32Array;
  /** BFS depth of each state from the initial state (index 0). */
  depth: Int32Array;
}

export interface StateGraphLimitExceeded {
  exceeded: true;
  /** States found before the cap stopped the exploration. */
  statesSeen: number;
  maxStates: number;
}

/** Applicable actions are found through the smallest fact of their precondition. */
export class ActionIndex {
  private readonly byFact: Int32Array[];
  private readonly unconditioned: Int32Array;

  constructor(task: Task) {
    const buckets: number[][] = task.facts.map(() => []);
    const free: number[] = [];
    task.actions.forEach((a, i) => {
      if (a.pre.length === 0) free.push(i);
      else buckets[a.pre[0]].push(i);
    });
    this.byFact = buckets.map((b) => Int32Array.from(b));
    this.unconditioned = Int32Array.from(free);
  }

  /** Calls `fn(actionId)` for every action applicable in the packed state at `off`. */
  forEachApplicable(task: Task, s: Uint32Array, off: number, words: number, fn: (a: number) => void): void {
    const actions = task.actions;
    for (let i = 0; i < this.unconditioned.length; i++) {
      const a = this.unconditioned[i];
      if (applicableAt(actions[a], s, off)) fn(a);
    }
    for (let w = 0; w < words; w++) {
      let x = s[off + w];
      while (x !== 0) {
        const low = x & -x;
        const f = w * 32 + (31 - Math.clz32(low));
        x ^= low;
        const bucket = this.byFact[f];
        for (let i = 0; i < bucket.length; i++) {
          const a = bucket[i];
          if (applicableAt(actions[a], s, off)) fn(a);
        }
      }
    }
  }
}

/**
 * Explores every state reachable from the initial state, recording all edges (one per
 * applicable action, self-loops included) — or only those whose action passes `keepEdge`.
 * Returns a limit record past `maxStates`.
 */
export function buildStateGraph(task: Task, maxStates: number, keepEdge?: (action: number) => boolean): StateGraph | StateGraphLimitExceeded {
  const words = wordsFor(task);
  const states = new PackedStateSet(words, 1024);
  const init = packBits(task.init, new Uint32Array(words));
  states.add(init);
  const index = new ActionIndex(task);
  const next = new Uint32Array(words);
  const cur = new Uint32Array(words);
  let edgeStart = new Int32Array(1024);
  let target = new Int32Array(4096);
  let act = new Int32Array(4096);
  let depth = new Int32Array(1024);
  let edges = 0;
  let exceeded = false;
  for (let i = 0; i < states.size && !exceeded; i++) {
    poll("exploring states");
    if (i + 1 >= edgeStart.length) {
      const grown = new Int32Array(edgeStart.length * 2);
      grown.set(edgeStart);
      edgeStart = grown;
    }
    edgeStart[i] = edges;
    states.copyTo(i, cur);
    index.forEachApplicable(task, cur, 0, words, (a) => {
      if (exceeded) return;
      applyAction(task.actions[a], cur, 0, words, next);
      const before = states.size;
      const j = states.add(next);
      if (states.size > before) {
        if (states.size > maxStates) {
          exceeded = true;
          return;
        }
        if (j >= depth.length) {
          const grown = new Int32Array(depth.length * 2);
          grown.set(depth);
          depth = grown;
        }
        depth[j] = depth[i] + 1;
      }
      if (keepEdge && !keepEdge(a)) return;
      if (edges >= target.length) {
        const t2 = new Int32Array(target.length * 2);
        t2.set(target);
        target = t2;
        const a2 = new Int32Array(act.length * 2);
        a2.set(act);
        act = a2;
      }
      target[edges] = j;
      act[edges] = a;
      edges++;
    });
  }
  if (exceeded) return { exceeded: true, statesSeen: states.size, maxStates };
  const n = states.size;
  const start = new Int32Array(n + 1);
  start.set(edgeStart.subarray(0, n));
  start[n] = edges;
  return {
    task,
    states,
    edgeStart: start,
    edgeTarget: target.slice(0, edges),
    edgeAction: act.slice(0, edges),
    depth: depth.slice(0, n),
  };
}

export function isExceeded(g: StateGraph | StateGraphLimitExceeded): g is StateGraphLimitExceeded {
  return (g as StateGraphLimitExceeded).exceeded === true;
}
