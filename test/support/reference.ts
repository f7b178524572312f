// Reference semantics for ground Tasks, written for obviousness rather than speed:
// tests use it as the exact brute-force oracle (applicability, successors, Dijkstra).
import type { Action, Task } from "../../src/ground/task.js";

export type RefState = ReadonlySet<number>;

export function initialState(task: Task): Set<number> {
  return new Set(task.init);
}

export function applicable(a: Action, s: RefState): boolean {
  return a.pre.every((f) => s.has(f)) && a.preNeg.every((f) => !s.has(f));
}

/** Successor per the Task contract: conditions read in s, deletes first, then adds. */
export function successor(a: Action, s: RefState): Set<number> {
  const adds = [...a.add];
  const dels = [...a.del];
  for (const ce of a.cond) {
    if (ce.cond.every((f) => s.has(f)) && ce.condNeg.every((f) => !s.has(f))) {
      adds.push(...ce.add);
      dels.push(...ce.del);
    }
  }
  const next = new Set(s);
  for (const f of dels) next.delete(f);
  for (const f of adds) next.add(f);
  return next;
}

export function isGoal(task: Task, s: RefState): boolean {
  return task.goal.every((f) => s.has(f)) && task.goalNeg.every((f) => !s.has(f));
}

export function stateKey(s: RefState): string {
  return [...s].sort((x, y) => x - y).join(",");
}

/** Replays a sequence of action indices; returns the final state or the failing step. */
export function replayGround(task: Task, plan: readonly number[]): { ok: true; state: Set<number>; cost: number } | { ok: false; step: number } {
  let s = initialState(task);
  let cost = 0;
  for (let i = 0; i < plan.length; i++) {
    const a = task.actions[plan[i]];
    if (!applicable(a, s)) return { ok: false, step: i };
    s = successor(a, s);
    cost += a.cost;
  }
  return { ok: true, state: s, cost };
}

/** All states reachable from init (breadth-first), capped. Returns null past the cap. */
export function reachableStates(task: Task, cap = 200_000): Set<number>[] | null {
  const start = initialState(task);
  const seen = new Map<string, Set<number>>([[stateKey(start), start]]);
  const queue: Set<number>[] = [start];
  for (let qi = 0; qi < queue.length; qi++) {
    const s = queue[qi];
    for (const a of task.actions) {
      if (!applicable(a, s)) continue;
      const t = successor(a, s);
      const k = stateKey(t);
      if (!seen.has(k)) {
        if (seen.size >= cap) return null;
        seen.set(k, t);
        queue.push(t);
      }
    }
  }
  return queue;
}

/**
 * Exact optimum by Dijkstra over the explicit state graph: the cheapest plan cost and,
 * among cheapest plans, the fewest actions. null when the goal is unreachable.
 */
export function optimalCost(task: Task, cap = 200_000): { cost: number; length: number } | null {
  const start = initialState(task);
  // (cost, length) lexicographic; a simple binary heap over entries
  type Entry = { cost: number; len: number; s: Set<number>; k: string };
  const heap: Entry[] = [];
  const less = (a: Entry, b: Entry) => a.cost < b.cost || (a.cost === b.cost && a.len < b.len);
  const push = (e: Entry) => {
    heap.push(e);
    let i = heap.length - 1;
    while (i > 0) {
      const p = (i - 1) >> 1;
      if (!less(heap[i], heap[p])) break;
      [heap[i], heap[p]] = [heap[p], heap[i]];
      i = p;
    }
  };
  const pop = (): Entry => {
    const top = heap[0];
    const last = heap.pop()!;
    if (heap.length > 0) {
      heap[0] = last;
      let i = 0;
      for (;;) {
        const l = 2 * i + 1;
        const r = l + 1;
        let m = i;
        if (l < heap.length && less(heap[l], heap[m])) m = l;
        if (r < heap.length && less(heap[r], heap[m])) m = r;
        if (m === i) break;
        [heap[i], heap[m]] = [heap[m], heap[i]];
        i = m;
      }
    }
    return top;
  };
  const done = new Set<string>();
  push({ cost: 0, len: 0, s: start, k: stateKey(start) });
  while (heap.length > 0) {
    const e = pop();
    if (done.has(e.k)) continue;
    done.add(e.k);
    if (done.size > cap) throw new Error("reference Dijkstra: state cap exceeded");
    if (isGoal(task, e.s)) return { cost: e.cost, length: e.len };
    for (const a of task.actions) {
      if (!applicable(a, e.s)) continue;
      const t = successor(a, e.s);
      const k = stateKey(t);
      if (!done.has(k)) push({ cost: e.cost + a.cost, len: e.len + 1, s: t, k });
    }
  }
  return null;
}

/**
 * The cheapest plan using at most `maxLen` actions (exhaustive layered search over
 * (state, steps) pairs); null if no plan of at most maxLen actions exists.
 */
export function cheapestWithin(task: Task, maxLen: number, cap = 200_000): number | null {
  let layer = new Map<string, { s: Set<number>; cost: number }>();
  const start = initialState(task);
  layer.set(stateKey(start), { s: start, cost: 0 });
  let best: number | null = isGoal(task, start) ? 0 : null;
  for (let step = 0; step < maxLen; step++) {
    const next = new Map<string, { s: Set<number>; cost: number }>();
    for (const { s, cost } of layer.values()) {
      for (const a of task.actions) {
        if (!applicable(a, s)) continue;
        const t = successor(a, s);
        const k = stateKey(t);
        const c = cost + a.cost;
        const old = next.get(k);
        if (!old || c < old.cost) next.set(k, { s: t, cost: c });
      }
    }
    if (next.size > cap) throw new Error("reference cheapestWithin: cap exceeded");
    for (const { s, cost } of next.values()) if (isGoal(task, s) && (best === null || cost < best)) best = cost;
    // keep states of the previous layer too (plans may be shorter): merge, min cost
    for (const [k, v] of layer) {
      const o = next.get(k);
      if (!o || v.cost < o.cost) next.set(k, v);
    }
    layer = next;
  }
  return best;
}
