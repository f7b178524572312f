// Exhaustive search over a scenario's own explicit model (no PDDL involved): the cheapest
// plan, the shortest plan and state counts that the committed instances record.
import { KeyHeap } from "../../../src/search/heap.js";

export interface Successor<S> {
  /** Plan-file form, lower case: "(drive t1 quay1 yard2)". */
  action: string;
  cost: number;
  next: S;
}

export interface ExplicitModel<S> {
  init: S;
  /** Equal keys ⇔ equal states. */
  key(s: S): string;
  successors(s: S): Successor<S>[];
  isGoal(s: S): boolean;
}

export class StateCapError extends Error {
  constructor(cap: number) {
    super(`explicit search: more than ${cap} states`);
  }
}

/** Number of states reachable from the initial state. */
export function countReachable<S>(m: ExplicitModel<S>, cap = 2_000_000): number {
  const seen = new Set<string>([m.key(m.init)]);
  const queue: S[] = [m.init];
  for (let i = 0; i < queue.length; i++) {
    for (const t of m.successors(queue[i])) {
      const k = m.key(t.next);
      if (seen.has(k)) continue;
      if (seen.size >= cap) throw new StateCapError(cap);
      seen.add(k);
      queue.push(t.next);
    }
  }
  return seen.size;
}

export interface ExplicitPlan {
  cost: number;
  plan: string[];
}

/** Fewest actions of any plan (breadth-first), with one such plan; null if none. */
export function shortestPlan<S>(m: ExplicitModel<S>, cap = 2_000_000): ExplicitPlan | null {
  const parent = new Map<string, { from: string; action: string; cost: number } | null>([[m.key(m.init), null]]);
  const queue: S[] = [m.init];
  for (let i = 0; i < queue.length; i++) {
    const s = queue[i];
    const ks = m.key(s);
    if (m.isGoal(s)) return unwind(parent, ks);
    for (const t of m.successors(s)) {
      const k = m.key(t.next);
      if (parent.has(k)) continue;
      if (parent.size >= cap) throw new StateCapError(cap);
      parent.set(k, { from: ks, action: t.action, cost: t.cost });
      queue.push(t.next);
    }
  }
  return null;
}

function unwind(parent: Map<string, { from: string; action: string; cost: number } | null>, k: string): ExplicitPlan {
  const plan: string[] = [];
  let cost = 0;
  for (let e = parent.get(k); e; e = parent.get(e.from)) {
    plan.push(e.action);
    cost += e.cost;
  }
  return { cost, plan: plan.reverse() };
}

/**
 * Dijkstra with (cost, length) compared lexicographically: a cheapest plan and, among
 * cheapest plans, one with the fewest actions. null if the goal is unreachable.
 */
export function cheapestPlan<S>(m: ExplicitModel<S>, cap = 2_000_000): ExplicitPlan | null {
  // per discovered state: the state, its best (cost, length) so far, and how it was reached
  const states: S[] = [m.init];
  const cost: number[] = [0];
  const len: number[] = [0];
  const from: number[] = [-1];
  const via: Array<{ action: string; cost: number } | null> = [null];
  const index = new Map<string, number>([[m.key(m.init), 0]]);
  const done: boolean[] = [false];
  const heap = new KeyHeap();
  heap.push(0, 0, 0);
  while (heap.size > 0) {
    const i = heap.pop();
    if (done[i] || heap.topKey1 !== cost[i] || heap.topKey2 !== len[i]) continue;
    done[i] = true;
    if (m.isGoal(states[i])) {
      const plan: string[] = [];
      for (let j = i; from[j] >= 0; j = from[j]) plan.push(via[j]!.action);
      return { cost: cost[i], plan: plan.reverse() };
    }
    for (const t of m.successors(states[i])) {
      const k = m.key(t.next);
      const c = cost[i] + t.cost;
      const l = len[i] + 1;
      let j = index.get(k);
      if (j === undefined) {
        if (states.length >= cap) throw new StateCapError(cap);
        j = states.length;
        index.set(k, j);
        states.push(t.next), cost.push(c), len.push(l), from.push(i), via.push(t), done.push(false);
      } else if (done[j] || !(c < cost[j] || (c === cost[j] && l < len[j]))) continue;
      else (cost[j] = c), (len[j] = l), (from[j] = i), (via[j] = t);
      heap.push(c, l, j);
    }
  }
  return null;
}

/**
 * The cheapest cost over plans of at most `maxLen` actions (layered dynamic programme over
 * states); null if no plan is that short.
 */
export function cheapestWithin<S>(m: ExplicitModel<S>, maxLen: number, cap = 2_000_000): number | null {
  let layer = new Map<string, { s: S; cost: number }>([[m.key(m.init), { s: m.init, cost: 0 }]]);
  let best: number | null = m.isGoal(m.init) ? 0 : null;
  for (let step = 0; step < maxLen; step++) {
    const next = new Map(layer);
    for (const { s, cost } of layer.values()) {
      for (const t of m.successors(s)) {
        const k = m.key(t.next);
        const c = cost + t.cost;
        const old = next.get(k);
        if (!old || c < old.cost) next.set(k, { s: t.next, cost: c });
      }
    }
    if (next.size > cap) throw new StateCapError(cap);
    layer = next;
  }
  for (const { s, cost } of layer.values()) if (m.isGoal(s) && (best === null || cost < best)) best = cost;
  return best;
}
