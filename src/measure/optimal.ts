// The optimal plan cost of an explicit state graph (Dijkstra) and, among cost-optimal plans,
// the fewest actions (ties on cost broken by length, lexicographically).
import type { StateGraph } from "../analyse/index.js";
import { IdHeap, isGoalAt } from "../analyse/index.js";
import { poll } from "../util/limits.js";

export interface OptimalResult {
  /** null when no reachable state satisfies the goal. */
  cost: number | null;
  /** Fewest actions among plans of optimal cost. */
  length: number | null;
  goalStates: number;
  /** One cost-optimal plan of that length (action ids). */
  plan: number[] | null;
}

export function optimalPlan(g: StateGraph): OptimalResult {
  const n = g.states.size;
  const task = g.task;
  const cost = new Float64Array(n).fill(Number.POSITIVE_INFINITY);
  const len = new Int32Array(n).fill(0x3fffffff);
  const via = new Int32Array(n).fill(-1); // edge index
  const done = new Uint8Array(n);
  // heap entries are snapshots (cost, length, state): keys never change once pushed
  const eCost: number[] = [];
  const eLen: number[] = [];
  const eState: number[] = [];
  const less = (a: number, b: number) => eCost[a] < eCost[b] || (eCost[a] === eCost[b] && (eLen[a] < eLen[b] || (eLen[a] === eLen[b] && eState[a] < eState[b])));
  const heap = new IdHeap(less);
  const push = (v: number) => {
    eCost.push(cost[v]);
    eLen.push(len[v]);
    eState.push(v);
    heap.push(eState.length - 1);
  };
  let goalStates = 0;
  for (let v = 0; v < n; v++) if (isGoalAt(task, g.states.view(v))) goalStates++;
  cost[0] = 0;
  len[0] = 0;
  push(0);
  // stale entries are skipped through `done`; an improved state is pushed again
  while (heap.size > 0) {
    poll("measuring the state graph");
    const v = eState[heap.pop()];
    if (done[v]) continue;
    done[v] = 1;
    if (isGoalAt(task, g.states.view(v))) {
      const plan: number[] = [];
      for (let s = v; s !== 0; ) {
        const e = via[s];
        plan.push(g.edgeAction[e]);
        s = edgeSource(g, e);
      }
      return { cost: cost[v], length: len[v], goalStates, plan: plan.reverse() };
    }
    for (let e = g.edgeStart[v]; e < g.edgeStart[v + 1]; e++) {
      const u = g.edgeTarget[e];
      if (done[u]) continue;
      const c = cost[v] + task.actions[g.edgeAction[e]].cost;
      const l = len[v] + 1;
      if (c < cost[u] || (c === cost[u] && l < len[u])) {
        cost[u] = c;
        len[u] = l;
        via[u] = e;
        push(u);
      }
    }
  }
  return { cost: null, length: null, goalStates, plan: null };
}

/** The source state of edge e (binary search in the CSR offsets). */
function edgeSource(g: StateGraph, e: number): number {
  let lo = 0;
  let hi = g.states.size - 1;
  while (lo < hi) {
    const mid = (lo + hi + 1) >> 1;
    if (g.edgeStart[mid] <= e) lo = mid;
    else hi = mid - 1;
  }
  return lo;
}
