// Part cost-prune-1 (spec encodings/cost-prune-1.md): "action a in step t ⇒ cost ≥ lb(a,t)" for
// admissible layered h-max bounds, as clauses on the cost encoding's literals — sound for every B.
import type { Task } from "../ground/task.js";
import { poll } from "../util/limits.js";
import type { CnfBuilder } from "./cnf.js";
import type { CostPart } from "./cost-part.js";
import type { Possible } from "./cost-inputs.js";
import type { Layout } from "./layout.js";
import type { TaskInfo } from "./task-info.js";

export interface CostPruneBounds {
  /** The least cost any model can have by the same bound (max over goal facts of g_T, or of g_∞). */
  floor: number;
  /** lb[t][a], t = 1..T (index 0 unused): every model with A(t,a) costs ≥ lb[t][a] (Infinity: no model has it). */
  lb: Float64Array[];
}

/**
 * One relaxed layer (spec "Bounds"): out(f) = min(prev(f), min over actions b with f ∈ PA(b) of
 * cost(b) + max over p ∈ pre(b) of prev(p)). Returns true when some value dropped.
 */
function relaxLayer(task: Task, info: TaskInfo, prev: Float64Array, out: Float64Array): boolean {
  out.set(prev);
  let changed = false;
  for (let b = 0; b < info.nA; b++) {
    poll("encoding");
    const act = task.actions[b];
    let m = 0;
    for (const p of act.pre) {
      const v = prev[p];
      if (v > m) m = v;
    }
    if (m === Infinity) continue;
    const v = m + act.cost;
    for (const f of info.mayAdd[b]) {
      if (v < out[f]) {
        out[f] = v;
        changed = true;
      }
    }
  }
  return changed;
}

/** Max over the goal facts (0 for an empty goal). */
function goalValue(task: Task, d: Float64Array): number {
  let m = 0;
  for (const g of task.goal) if (d[g] > m) m = d[g];
  return m;
}

/** `layers` more relaxed layers from `start` (Infinity: to the fixpoint); returns the goal value. */
function runLayers(task: Task, info: TaskInfo, start: Float64Array, layers: number): number {
  let cur: Float64Array = start;
  let next: Float64Array = new Float64Array(cur.length);
  for (let k = 0; k < layers; k++) {
    if (!relaxLayer(task, info, cur, next)) break;
    [cur, next] = [next, cur];
  }
  return goalValue(task, cur);
}

/**
 * The bounds of spec cost-prune-1: g_k from the initial state (k = 0..T); for each step t and
 * action a, θ = max over pre(a) of g_{t−1} plus cost(a), and lb = θ + h(t, θ), where h(t, θ) is
 * the goal value of T − t more layers (anyHorizon: layers to the fixpoint) from the start values
 * max(0, g_t(p) − θ). h depends on (t, θ) only and is computed once per pair.
 */
export function costPruneBounds(task: Task, info: TaskInfo, T: number, anyHorizon: boolean): CostPruneBounds {
  const { nF, nA } = info;
  const g: Float64Array[] = [new Float64Array(nF).fill(Infinity)];
  for (const f of task.init) g[0][f] = 0;
  for (let k = 1; k <= T; k++) {
    const out = new Float64Array(nF);
    relaxLayer(task, info, g[k - 1], out);
    g.push(out);
  }
  const floor = anyHorizon ? runLayers(task, info, g[T].slice(), Infinity) : goalValue(task, g[T]);
  const lb: Float64Array[] = [new Float64Array(0)];
  const start = new Float64Array(nF);
  for (let t = 1; t <= T; t++) {
    const row = new Float64Array(nA);
    const memo = new Map<number, number>();
    const prev = g[t - 1];
    const now = g[t];
    for (let a = 0; a < nA; a++) {
      poll("encoding");
      const act = task.actions[a];
      let m = 0;
      for (const p of act.pre) if (prev[p] > m) m = prev[p];
      const theta = m + act.cost;
      if (theta === Infinity) {
        row[a] = Infinity;
        continue;
      }
      let h = memo.get(theta);
      if (h === undefined) {
        for (let f = 0; f < nF; f++) start[f] = now[f] > theta ? now[f] - theta : 0;
        h = runLayers(task, info, start.slice(), anyHorizon ? Infinity : T - t);
        memo.set(theta, h);
      }
      row[a] = theta + h;
    }
    lb.push(row);
  }
  return { floor, lb };
}

/**
 * Clauses (spec "Clauses"): for the pairs (t, a) with lb(a,t) > floor (a possible at t), the
 * cost encoding's literals for the distinct finite bounds, ascending (CostPart.atLeast); then
 * for t = 1..T, a ascending: [−A(t,a)] if lb is Infinity or its literal is constant false, else
 * [−A(t,a), literal]. Returns the number of pairs.
 */
export function emitCostPrune(cnf: CnfBuilder, task: Task, info: TaskInfo, L: Layout, cost: CostPart, anyHorizon: boolean, possible?: Possible): number {
  const { floor, lb } = costPruneBounds(task, info, L.steps, anyHorizon);
  const pairs: number[] = []; // t, a, t, a, …
  const finite = new Set<number>();
  for (let t = 1; t <= L.steps; t++) {
    for (let a = 0; a < info.nA; a++) {
      const v = lb[t][a];
      if (!(v > floor) || (possible && !possible(t, a))) continue;
      pairs.push(t, a);
      if (v !== Infinity) finite.add(v);
    }
  }
  const bounds = [...finite].sort((x, y) => x - y);
  const lits = bounds.length > 0 ? cost.atLeast(cnf, bounds) : [];
  const litOf = new Map<number, number>();
  if (lits !== null) bounds.forEach((b, i) => litOf.set(b, lits[i]));
  let n = 0;
  for (let i = 0; i < pairs.length; i += 2) {
    const t = pairs[i];
    const a = pairs[i + 1];
    const v = lb[t][a];
    const lit = v === Infinity ? 0 : litOf.get(v);
    if (lit === undefined) continue; // no bound can be asked of this cost encoding (costCap 0)
    if (lit === 0) cnf.addClause([-L.action(t, a)]);
    else cnf.addClause([-L.action(t, a), lit]);
    n++;
  }
  return n;
}
