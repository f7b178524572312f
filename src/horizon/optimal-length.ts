// The fewest actions among cost-optimal plans, by Dijkstra on (cost, length) pairs over the
// explicit state space, under a cap on stored states — the exact-explicit horizon method.
import type { Task } from "../ground/task.js";
import { ActionIndex, PackedStateSet, applyAction, isGoalAt, packBits, wordsFor } from "../analyse/index.js";
import { poll } from "../util/limits.js";

export type OptimalLength =
  /** A cheapest plan costs `cost`; among cheapest plans the fewest actions is `length`. */
  | { kind: "found"; cost: number; length: number; statesStored: number; statesSettled: number; plan: number[] }
  /** Every reachable state was settled and none satisfies the goal. */
  | { kind: "no-plan"; statesStored: number }
  /** More than `maxStates` states would have to be stored. */
  | { kind: "exceeded"; maxStates: number };

/**
 * Lexicographic Dijkstra from the initial state: the key of a path is (cost, number of
 * actions), compared cost first. Edge keys (c(a), 1) are non-negative and the order is total
 * and compatible with addition, so the first goal state settled carries the least key of any
 * plan: the optimal cost, and the fewest actions among plans of that cost. The search stops
 * there, so only states whose key is at most the goal's are stored (plus their successors).
 * Deterministic: successors are generated in action order and ties broken by state index.
 * As a horizon (methods.ts, "optimal-length"): a plan of cost c < C means the optimum is at
 * most c, and a plan of the optimal cost with `length` actions exists. Past `maxStates` stored
 * states the result is "exceeded" and the method does not apply; the cap is a function of the
 * task and the options only, so an auditor with the same defaults reaches the same verdict.
 */
export function optimalLength(task: Task, maxStates: number): OptimalLength {
  const words = wordsFor(task);
  const states = new PackedStateSet(words, 1024);
  const start = packBits(task.init, new Uint32Array(words));
  states.add(start);
  const index = new ActionIndex(task);
  let gCost = new Float64Array(1024).fill(Number.POSITIVE_INFINITY);
  let gLen = new Int32Array(1024);
  let via = new Int32Array(1024).fill(-1);
  let parent = new Int32Array(1024).fill(-1);
  let done = new Uint8Array(1024);
  const grow = (n: number) => {
    if (n <= gCost.length) return;
    let cap = gCost.length;
    while (cap < n) cap *= 2;
    const c = new Float64Array(cap).fill(Number.POSITIVE_INFINITY);
    c.set(gCost);
    gCost = c;
    const l = new Int32Array(cap);
    l.set(gLen);
    gLen = l;
    const v = new Int32Array(cap).fill(-1);
    v.set(via);
    via = v;
    const p = new Int32Array(cap).fill(-1);
    p.set(parent);
    parent = p;
    const d = new Uint8Array(cap);
    d.set(done);
    done = d;
  };
  const heap = new KeyHeap();
  gCost[0] = 0;
  gLen[0] = 0;
  heap.push(0, 0, 0);
  const cur = new Uint32Array(words);
  const next = new Uint32Array(words);
  let settled = 0;
  let exceeded = false;
  while (heap.size > 0) {
    poll("computing the horizon");
    const v = heap.pop();
    if (done[v]) continue;
    done[v] = 1;
    settled++;
    states.copyTo(v, cur);
    if (isGoalAt(task, cur)) {
      const plan: number[] = [];
      for (let s = v; s !== 0; s = parent[s]) plan.push(via[s]);
      return { kind: "found", cost: gCost[v], length: gLen[v], statesStored: states.size, statesSettled: settled, plan: plan.reverse() };
    }
    const cv = gCost[v];
    const lv = gLen[v];
    index.forEachApplicable(task, cur, 0, words, (a) => {
      if (exceeded) return;
      applyAction(task.actions[a], cur, 0, words, next);
      const before = states.size;
      const u = states.add(next);
      if (states.size > before) {
        if (states.size > maxStates) {
          exceeded = true;
          return;
        }
        grow(states.size);
      }
      if (done[u]) return;
      const c = cv + task.actions[a].cost;
      const l = lv + 1;
      if (c < gCost[u] || (c === gCost[u] && l < gLen[u])) {
        gCost[u] = c;
        gLen[u] = l;
        via[u] = a;
        parent[u] = v;
        heap.push(c, l, u);
      }
    });
    if (exceeded) return { kind: "exceeded", maxStates };
  }
  return { kind: "no-plan", statesStored: states.size };
}

/** Binary min-heap of (cost, length, state) entries in typed arrays; ties by state index. */
class KeyHeap {
  private cost = new Float64Array(1024);
  private len = new Int32Array(1024);
  private state = new Int32Array(1024);
  size = 0;

  private less(i: number, j: number): boolean {
    const ci = this.cost[i];
    const cj = this.cost[j];
    if (ci !== cj) return ci < cj;
    const li = this.len[i];
    const lj = this.len[j];
    if (li !== lj) return li < lj;
    return this.state[i] < this.state[j];
  }

  private swap(i: number, j: number): void {
    const c = this.cost[i];
    this.cost[i] = this.cost[j];
    this.cost[j] = c;
    const l = this.len[i];
    this.len[i] = this.len[j];
    this.len[j] = l;
    const s = this.state[i];
    this.state[i] = this.state[j];
    this.state[j] = s;
  }

  push(cost: number, len: number, state: number): void {
    if (this.size === this.cost.length) {
      const c = new Float64Array(this.size * 2);
      c.set(this.cost);
      this.cost = c;
      const l = new Int32Array(this.size * 2);
      l.set(this.len);
      this.len = l;
      const s = new Int32Array(this.size * 2);
      s.set(this.state);
      this.state = s;
    }
    let i = this.size++;
    this.cost[i] = cost;
    this.len[i] = len;
    this.state[i] = state;
    while (i > 0) {
      const p = (i - 1) >> 1;
      if (!this.less(i, p)) break;
      this.swap(i, p);
      i = p;
    }
  }

  /** Removes the least entry and returns its state. */
  pop(): number {
    const top = this.state[0];
    this.size--;
    if (this.size > 0) {
      this.cost[0] = this.cost[this.size];
      this.len[0] = this.len[this.size];
      this.state[0] = this.state[this.size];
      let i = 0;
      for (;;) {
        const l = 2 * i + 1;
        const r = l + 1;
        let m = i;
        if (l < this.size && this.less(l, m)) m = l;
        if (r < this.size && this.less(r, m)) m = r;
        if (m === i) break;
        this.swap(i, m);
        i = m;
      }
    }
    return top;
  }
}
