// A second, independent derivation for the audit: redoes the arithmetic of the recorded horizon
// methods and, on small tasks, the exact optimum, fewest actions and reachable states by a plain
// search over the ground Task. Shares no code with src/horizon, src/analyse or src/search.
import type { Task } from "../ground/index.js";
import { poll } from "../util/limits.js";

/** Work cap (states × actions) of the plain search; above it the search is not run. */
export const REDERIVE_WORK = 20_000_000;

export interface Rederived {
  /** Each comparison made, in words. */
  checked: string[];
  /** Disagreements (any one rejects the certificate). */
  problems: string[];
  /** What could not be re-derived, and why. */
  skipped: string[];
}

interface Exact {
  states: number;
  /** Cheapest plan cost and, among cheapest plans, fewest actions (null: no plan). */
  optimum: { cost: number; length: number } | null;
}

/** Successor of `s` by action `a` (conditions read in `s`; deletes, then adds), or null when `a` does not apply. */
function apply(task: Task, s: Uint8Array, ai: number): Uint8Array | null {
  const a = task.actions[ai];
  for (const f of a.pre) if (!s[f]) return null;
  for (const f of a.preNeg) if (s[f]) return null;
  const dels: number[] = [...a.del];
  const adds: number[] = [...a.add];
  for (const ce of a.cond) {
    if (ce.cond.every((f) => s[f] === 1) && ce.condNeg.every((f) => s[f] === 0)) {
      dels.push(...ce.del);
      adds.push(...ce.add);
    }
  }
  const t = s.slice();
  for (const f of dels) t[f] = 0;
  for (const f of adds) t[f] = 1;
  return t;
}

const isGoal = (task: Task, s: Uint8Array) => task.goal.every((f) => s[f] === 1) && task.goalNeg.every((f) => s[f] === 0);

/**
 * Dijkstra on (cost, length) over every reachable state, plainly: states as byte strings in a Map,
 * a binary heap of [cost, length, id]. Null when the work cap is reached.
 */
const searched = new WeakMap<Task, Exact | null>();

/** exactSearch with the default cap, once per Task object (the audit asks twice for a state-space claim). */
export function exactSearchOnce(task: Task): Exact | null {
  if (!searched.has(task)) searched.set(task, exactSearch(task));
  return searched.get(task)!;
}

export function exactSearch(task: Task, maxWork = REDERIVE_WORK): Exact | null {
  const n = task.actions.length;
  const key = (s: Uint8Array) => Buffer.from(s).toString("latin1");
  const states: Uint8Array[] = [];
  const ids = new Map<string, number>();
  const best: Array<[number, number]> = [];
  const heap: Array<[number, number, number]> = [];
  const less = (x: [number, number, number], y: [number, number, number]) => x[0] < y[0] || (x[0] === y[0] && x[1] < y[1]);
  const push = (e: [number, number, number]) => {
    heap.push(e);
    for (let i = heap.length - 1; i > 0; ) {
      const p = (i - 1) >> 1;
      if (!less(heap[i], heap[p])) break;
      [heap[i], heap[p]] = [heap[p], heap[i]];
      i = p;
    }
  };
  const pop = (): [number, number, number] => {
    const top = heap[0];
    const last = heap.pop()!;
    if (heap.length > 0) {
      heap[0] = last;
      for (let i = 0; ; ) {
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
  const init = new Uint8Array(task.facts.length);
  for (const f of task.init) init[f] = 1;
  ids.set(key(init), 0);
  states.push(init);
  best.push([0, 0]);
  push([0, 0, 0]);
  let optimum: Exact["optimum"] = null;
  let work = 0;
  while (heap.length > 0) {
    const [c, len, id] = pop();
    if (c !== best[id][0] || len !== best[id][1]) continue;
    const s = states[id];
    if (optimum === null && isGoal(task, s)) optimum = { cost: c, length: len };
    work += n;
    if (work > maxWork) return null;
    for (let ai = 0; ai < n; ai++) {
      poll("re-deriving the horizon");
      const t = apply(task, s, ai);
      if (t === null) continue;
      const k = key(t);
      const nc = c + task.actions[ai].cost;
      const nl = len + 1;
      let tid = ids.get(k);
      if (tid === undefined) {
        tid = states.length;
        ids.set(k, tid);
        states.push(t);
        best.push([nc, nl]);
        push([nc, nl, tid]);
      } else if (nc < best[tid][0] || (nc === best[tid][0] && nl < best[tid][1])) {
        best[tid] = [nc, nl];
        push([nc, nl, tid]);
      }
    }
  }
  return { states: states.length, optimum };
}

type Rec = Record<string, unknown>;
const num = (v: unknown): number | null => (typeof v === "number" && Number.isFinite(v) ? v : null);

/**
 * Re-derives what can be re-derived of a certificate's claim. `horizon` is the recorded horizon
 * report (or null), `accepted` the horizon the audit rebuilt the formula with (or null),
 * `claimed` the claimed cost (null for unsolvability).
 */
export function rederive(task: Task, horizon: Rec | null, accepted: number | null, claimed: number | null): Rederived {
  const out: Rederived = { checked: [], problems: [], skipped: [] };
  const methods = Array.isArray(horizon?.methods) ? (horizon!.methods as Rec[]) : [];
  const costs = task.actions.map((a) => a.cost);
  const positive = costs.filter((c) => c > 0);
  for (const m of methods) {
    const d = (m.derivation ?? {}) as Rec;
    const value = num(m.value);
    if (value === null) continue;
    if (m.method === "cost") {
      const C = num(d.C);
      const cmin = num(d.minCost);
      const h = num(d.excessLowerBound) ?? 0;
      if (C === null || cmin === null || cmin <= 0) out.problems.push(`cost method: the recorded C ${JSON.stringify(d.C)} or minCost ${JSON.stringify(d.minCost)} is not usable`);
      else {
        const again = Math.floor((C - 1 - h) / cmin);
        out.checked.push(`cost method floor((${C} - 1 - ${h}) / ${cmin}) = ${again}`);
        if (again !== value) out.problems.push(`cost method: floor((${C} - 1 - ${h}) / ${cmin}) is ${again}, the certificate records ${value}`);
        if (!costs.includes(cmin) || Math.min(...positive) > cmin) out.problems.push(`cost method: minCost ${cmin} is not a positive action cost of the task (smallest ${Math.min(...positive)})`);
      }
    }
    if (m.method === "zero-cost") {
      const C = num(d.C);
      const u = num(d.minPositiveCost);
      const h = num(d.excessLowerBound) ?? 0;
      const k = num(d.k);
      if (C !== null && u !== null && u > 0 && k !== null) {
        const again = Math.floor((C - 1 - h) / u);
        out.checked.push(`zero-cost method k = floor((${C} - 1 - ${h}) / ${u}) = ${again}`);
        if (again !== k) out.problems.push(`zero-cost method: k = floor((${C} - 1 - ${h}) / ${u}) is ${again}, the certificate records ${k}`);
      }
    }
    if (m.method === "optimal-length" && claimed !== null) {
      const opt = num(d.optimalCost);
      if (opt !== null) {
        out.checked.push(`the exact method's optimum ${opt} against the claimed cost ${claimed}`);
        if (opt !== claimed) out.problems.push(`the exact method recorded the optimum ${opt}, but the claimed cost is ${claimed}`);
      }
    }
  }
  // the plain search: optimum, fewest actions, reachable states
  const exact = exactSearchOnce(task);
  if (exact === null) {
    out.skipped.push(`the plain search (more than ${REDERIVE_WORK.toLocaleString("en")} state × action steps)`);
    return out;
  }
  out.checked.push(`plain search: ${exact.states} reachable states, ${exact.optimum ? `optimum ${exact.optimum.cost} in ${exact.optimum.length} actions` : "no plan"}`);
  if (claimed === null && exact.optimum !== null) out.problems.push(`a plan of cost ${exact.optimum.cost} exists, but the certificate claims there is none`);
  if (claimed !== null && exact.optimum === null) out.problems.push("no plan exists, but the certificate claims one");
  if (claimed !== null && exact.optimum !== null && exact.optimum.cost !== claimed) out.problems.push(`the optimum is ${exact.optimum.cost}, the certificate claims ${claimed}`);
  // the horizon promises: any plan cheaper than its upper cost U has a counterpart of at most H actions
  // that is no dearer — so when the optimum is below U, a cheapest plan must fit in H steps
  const upper = horizon?.upperCost === "Infinity" ? Infinity : num(horizon?.upperCost);
  if (accepted !== null && upper !== null && exact.optimum !== null && exact.optimum.cost < upper) {
    out.checked.push(`the horizon ${accepted} against ${exact.optimum.length}, the fewest actions of a cheapest plan (optimum ${exact.optimum.cost} < upper cost ${upper})`);
    if (accepted < exact.optimum.length) out.problems.push(`the horizon ${accepted} is below ${exact.optimum.length}, the fewest actions of a cheapest plan, although the optimum ${exact.optimum.cost} is below the horizon's upper cost ${upper}`);
  }
  for (const m of methods) {
    const d = (m.derivation ?? {}) as Rec;
    const rs = num(d.reachableStates);
    if (m.method === "reachable-states" && rs !== null) {
      // the method counts the analysed (pruned) task, whose states are projections of these
      out.checked.push(`explicit method: ${rs} reachable states ≤ ${exact.states} by the plain search`);
      if (rs > exact.states) out.problems.push(`the explicit method records ${rs} reachable states, the plain search finds ${exact.states}`);
    }
  }
  return out;
}
