// Part reach-1 (spec encodings/reach-1.md): which facts can be true / false at each time point
// and which actions can be taken at each step — relaxed layers forward from the initial state,
// relevance layers backward from the goal — so the encoder can fix the rest with unit clauses.
import type { Task } from "../ground/task.js";
import type { CnfBuilder } from "./cnf.js";
import type { Layout } from "./layout.js";
import type { TaskInfo } from "./task-info.js";

export interface ReachLayers {
  /** mayTrue[t][f] = 1: fact f may hold at time t (t = 0..T). Layers may be shared between t. */
  mayTrue: Uint8Array[];
  /** mayFalse[t][f] = 1: fact f may be false at time t. */
  mayFalse: Uint8Array[];
  /** possible[s][a] = 1: action a may be taken in step s (s = 1..T; index 0 is unused). */
  possible: Uint8Array[];
  /** Counts for reports: fixed fact variables (t ≥ 1) and action variables fixed false. */
  fixedFacts: number;
  fixedActions: number;
}

const sameBytes = (x: Uint8Array, y: Uint8Array) => x.length === y.length && x.every((v, i) => v === y[i]);

/**
 * Forward (an over-approximation of every execution): mayTrue(0) = init, mayFalse(0) = the
 * other facts; fwd(s) = actions whose pre ⊆ mayTrue(s−1) and preNeg ⊆ mayFalse(s−1);
 * mayTrue(s) = mayTrue(s−1) ∪ add(a) ∪ add(e) for a ∈ fwd(s) and effects e of a whose
 * cond ⊆ mayTrue(s−1) and condNeg ⊆ mayFalse(s−1); mayFalse(s) likewise with
 * del(a) \ add(a) and del(e) \ add(a).
 *
 * Backward (relevance): Rel⁺(T) = goal, Rel⁻(T) = goalNeg; for s = T..1:
 * possible(s) = {a ∈ fwd(s) : PA(a) ∩ Rel⁺(s) ≠ ∅ or PD(a) ∩ Rel⁻(s) ≠ ∅};
 * Rel⁺(s−1) = Rel⁺(s) ∪ pre(a) ∪ C(a), Rel⁻(s−1) = Rel⁻(s) ∪ preNeg(a) ∪ C(a), over
 * a ∈ possible(s) (C(a): facts its effect conditions read, in both polarities).
 */
export function reachLayers(task: Task, info: TaskInfo, T: number, goalAtEnd = true): ReachLayers {
  const { nF, nA } = info;
  const mayTrue: Uint8Array[] = [];
  const mayFalse: Uint8Array[] = [];
  const fwd: Uint8Array[] = [new Uint8Array(0)];
  const t0 = new Uint8Array(nF);
  for (const f of task.init) t0[f] = 1;
  mayTrue.push(t0);
  mayFalse.push(t0.map((x) => 1 - x));
  const holds = (fs: readonly number[], layer: Uint8Array) => fs.every((f) => layer[f] === 1);
  let saturated = false;
  for (let s = 1; s <= T; s++) {
    const pt = mayTrue[s - 1];
    const pf = mayFalse[s - 1];
    if (saturated) {
      mayTrue.push(pt);
      mayFalse.push(pf);
      fwd.push(fwd[s - 1]);
      continue;
    }
    const nt = pt.slice();
    const nf = pf.slice();
    const acts = new Uint8Array(nA);
    for (let a = 0; a < nA; a++) {
      const act = task.actions[a];
      if (!holds(act.pre, pt) || !act.preNeg.every((f) => pf[f] === 1)) continue;
      acts[a] = 1;
      const addSet = new Set(act.add);
      for (const f of act.add) nt[f] = 1;
      for (const f of act.del) if (!addSet.has(f)) nf[f] = 1;
      for (const ce of act.cond) {
        if (!holds(ce.cond, pt) || !ce.condNeg.every((f) => pf[f] === 1)) continue;
        for (const f of ce.add) nt[f] = 1;
        for (const f of ce.del) if (!addSet.has(f)) nf[f] = 1;
      }
    }
    saturated = sameBytes(nt, pt) && sameBytes(nf, pf) && sameBytes(acts, fwd[s - 1]);
    mayTrue.push(saturated ? pt : nt);
    mayFalse.push(saturated ? pf : nf);
    fwd.push(saturated ? fwd[s - 1] : acts);
  }

  const possible: Uint8Array[] = new Array(T + 1);
  possible[0] = new Uint8Array(0);
  if (!goalAtEnd) {
    // a part finishes the plan after T (relaxed-suffix-1): no backward relevance, possible = fwd
    for (let s = 1; s <= T; s++) possible[s] = fwd[s];
    return withCounts(mayTrue, mayFalse, possible, nF, nA, T);
  }
  let relPos = new Uint8Array(nF);
  let relNeg = new Uint8Array(nF);
  for (const f of task.goal) relPos[f] = 1;
  for (const f of task.goalNeg) relNeg[f] = 1;
  for (let s = T; s >= 1; s--) {
    const acts = new Uint8Array(nA);
    const np = relPos.slice();
    const nn = relNeg.slice();
    for (let a = 0; a < nA; a++) {
      if (!fwd[s][a]) continue;
      if (!info.mayAdd[a].some((f) => relPos[f] === 1) && !info.mayDel[a].some((f) => relNeg[f] === 1)) continue;
      acts[a] = 1;
      const act = task.actions[a];
      for (const f of act.pre) np[f] = 1;
      for (const f of act.preNeg) nn[f] = 1;
      for (const f of info.condReads[a]) {
        np[f] = 1;
        nn[f] = 1;
      }
    }
    possible[s] = acts;
    relPos = np;
    relNeg = nn;
  }
  return withCounts(mayTrue, mayFalse, possible, nF, nA, T);
}

function withCounts(mayTrue: Uint8Array[], mayFalse: Uint8Array[], possible: Uint8Array[], nF: number, nA: number, T: number): ReachLayers {
  let fixedFacts = 0;
  let fixedActions = 0;
  for (let t = 1; t <= T; t++) for (let f = 0; f < nF; f++) if (!mayTrue[t][f] || !mayFalse[t][f]) fixedFacts++;
  for (let s = 1; s <= T; s++) for (let a = 0; a < nA; a++) if (!possible[s][a]) fixedActions++;
  return { mayTrue, mayFalse, possible, fixedFacts, fixedActions };
}

/** "simplify" (the spec'd reach-1): the other clauses are simplified by the fixed values; "units": measurements only. */
export type ReachMode = "simplify" | "units";

/**
 * Emits the unit clauses of reach-1 — for t = 1..T, f ascending: [−F(t,f)] if f cannot be true
 * at t, [F(t,f)] if it cannot be false; then for s = 1..T, a ascending: [−A(s,a)] if a cannot be
 * taken in step s — and returns the fixed values the later clauses are simplified by: these,
 * the initial state (t = 0) and the goal literals at T (where they do not contradict the layers).
 */
export function emitReachUnits(cnf: CnfBuilder, task: Task, L: Layout, r: ReachLayers, goalAtEnd = true): Int8Array {
  const fixed = new Int8Array(L.auxBase);
  for (let f = 0; f < L.nF; f++) fixed[L.fact(0, f)] = r.mayTrue[0][f] ? 1 : -1;
  for (let t = 1; t <= L.steps; t++) {
    const mt = r.mayTrue[t];
    const mf = r.mayFalse[t];
    for (let f = 0; f < L.nF; f++) {
      const v = L.fact(t, f);
      if (!mt[f]) {
        cnf.add1(-v);
        fixed[v] = -1;
      } else if (!mf[f]) {
        cnf.add1(v);
        fixed[v] = 1;
      }
    }
  }
  for (let s = 1; s <= L.steps; s++) {
    const p = r.possible[s];
    for (let a = 0; a < L.nA; a++) {
      if (p[a]) continue;
      const v = L.action(s, a);
      cnf.add1(-v);
      fixed[v] = -1;
    }
  }
  const T = L.steps;
  if (T > 0 && goalAtEnd) {
    for (const f of task.goal) if (fixed[L.fact(T, f)] === 0) fixed[L.fact(T, f)] = 1;
    for (const f of task.goalNeg) if (fixed[L.fact(T, f)] === 0) fixed[L.fact(T, f)] = -1;
  }
  return fixed;
}
