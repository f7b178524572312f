// Part relaxed-suffix-1 (spec encodings/relaxed-suffix-1.md): after T real steps, the goal is
// reached from the last state by a delete-relaxed plan with acyclic support, its cost counted.
import type { Task } from "../ground/task.js";
import { emitAcyclic, type AcyclicStats } from "./acyclic.js";
import type { CnfBuilder } from "./cnf.js";
import type { Layout } from "./layout.js";
import { relaxedOps, type RelaxedOp } from "./relaxed-ops.js";
import type { ReachLayers } from "./reach.js";

/** The part's variables a driver and a decoder need. */
export interface SuffixVars {
  ops: RelaxedOp[];
  /** R(a): "action a belongs to the relaxed suffix" (0 when a has no relaxed operator). */
  actionLit: Int32Array;
  /** GH(t), t = 0..T−1: "the goal holds at time point t" (only ever true when it does). */
  goalHolds: Int32Array;
}

/** A suffix action that costs something: its literal feeds the cost part. */
export interface ExtraCostInput {
  lit: number;
  cost: number;
}

export interface SuffixStats extends AcyclicStats {
  suffixOps: number;
  suffixSupports: number;
}

/**
 * Emits the part's variables and clauses in spec order (see the spec's "Clauses"). Returns the
 * variables, the cost inputs (R(a) with cost(a) > 0, ascending a) and figures for reports.
 */
export function emitRelaxedSuffix(cnf: CnfBuilder, task: Task, L: Layout): { vars: SuffixVars; costInputs: ExtraCostInput[]; stats: SuffixStats } {
  const nF = L.nF;
  const nA = L.nA;
  const T = L.steps;
  const ops = relaxedOps(task);
  // variables
  const actionLit = new Int32Array(nA);
  for (const o of ops) actionLit[o.action] = 1;
  for (let a = 0; a < nA; a++) if (actionLit[a]) actionLit[a] = cnf.newVar("suffix-action");
  const opLit = new Int32Array(ops.length);
  ops.forEach((o, i) => {
    if (o.effect < 0) opLit[i] = actionLit[o.action];
  });
  ops.forEach((o, i) => {
    if (o.effect >= 0) opLit[i] = cnf.newVar("suffix-effect");
  });
  const g0 = cnf.newVars(nF, "suffix-fact"); // G(f) = g0 + f
  const supportStart = new Int32Array(ops.length + 1);
  ops.forEach((o, i) => (supportStart[i + 1] = supportStart[i] + o.add.length));
  const s0 = cnf.newVars(supportStart[ops.length], "suffix-support"); // S(o, add(o)[j]) = s0 + supportStart[o] + j
  const gh0 = cnf.newVars(T, "goal-holds"); // GH(t) = gh0 + t

  // 1. the goal is available
  for (const g of task.goal) cnf.add1(g0 + g);
  // 2. an available fact holds at T or has a supporter
  const supporters: number[][] = Array.from({ length: nF }, () => []);
  ops.forEach((o, i) => o.add.forEach((f, j) => supporters[f].push(s0 + supportStart[i] + j)));
  const buf: number[] = [];
  for (let f = 0; f < nF; f++) {
    buf.length = 0;
    buf.push(-(g0 + f), L.fact(T, f), ...supporters[f]);
    cnf.addClause(buf);
  }
  // 3. a supporter is used, supports only facts not already true at T, and needs its conditions
  ops.forEach((o, i) => {
    o.add.forEach((f, j) => {
      const S = s0 + supportStart[i] + j;
      cnf.add2(-S, opLit[i]);
      cnf.add2(-S, -L.fact(T, f));
    });
    for (const p of o.pre) cnf.add2(-opLit[i], g0 + p);
    if (o.effect >= 0) cnf.add2(-opLit[i], actionLit[o.action]);
  });
  // 4. support is acyclic: vertices facts 0..nF−1 and operators nF + i
  const edges: [number, number, number][] = [];
  ops.forEach((o, i) => {
    for (const p of o.pre) edges.push([p, nF + i, opLit[i]]);
    o.add.forEach((f, j) => edges.push([nF + i, f, s0 + supportStart[i] + j]));
  });
  const acyclic = emitAcyclic(cnf, nF + ops.length, edges);
  // 5. goal-holds literals, one direction only
  for (let t = 0; t < T; t++) {
    const gh = gh0 + t;
    for (const g of task.goal) cnf.add2(-gh, L.fact(t, g));
    for (const g of task.goalNeg) cnf.add2(-gh, -L.fact(t, g));
  }
  // 6. no empty step before the goal holds
  for (let s = 1; s <= T; s++) {
    buf.length = 0;
    buf.push(gh0 + s - 1);
    for (let a = 0; a < nA; a++) buf.push(L.action(s, a));
    cnf.addClause(buf);
  }

  const goalHolds = new Int32Array(T);
  for (let t = 0; t < T; t++) goalHolds[t] = gh0 + t;
  const costInputs: ExtraCostInput[] = [];
  for (let a = 0; a < nA; a++) if (actionLit[a] && task.actions[a].cost > 0) costInputs.push({ lit: actionLit[a], cost: task.actions[a].cost });
  return { vars: { ops, actionLit, goalHolds }, costInputs, stats: { ...acyclic, suffixOps: ops.length, suffixSupports: supportStart[ops.length] } };
}

/** The suffix's cost inputs without emitting anything (for sizing the cost part): R(a)'s costs. */
export function suffixCostValues(task: Task): number[] {
  const has = new Uint8Array(task.actions.length);
  for (const o of relaxedOps(task)) has[o.action] = 1;
  const out: number[] = [];
  task.actions.forEach((a, i) => {
    if (has[i] && a.cost > 0) out.push(a.cost);
  });
  return out;
}

/** Pairs of time points (t, t′), 0 ≤ t < t′ ≤ T, whose states must differ unless the goal holds at t. */
export type StatePair = readonly [number, number];

/** Checks a pair list against horizon T: whole numbers 0 ≤ t < t′ ≤ T, no repeats. Returns a copy. */
export function checkPairs(pairs: readonly (readonly number[])[] | undefined, T: number): [number, number][] {
  const out: [number, number][] = [];
  const seen = new Set<number>();
  for (const p of pairs ?? []) {
    if (!Array.isArray(p) || p.length !== 2) throw new RangeError(`encode: a state pair must be [t, t'], got ${JSON.stringify(p)}`);
    const [t, u] = p;
    if (!Number.isInteger(t) || !Number.isInteger(u) || t < 0 || u <= t || u > T) throw new RangeError(`encode: state pair [${t}, ${u}] is not 0 ≤ t < t' ≤ ${T}`);
    const key = t * (T + 1) + u;
    if (seen.has(key)) throw new RangeError(`encode: state pair [${t}, ${u}] is listed twice`);
    seen.add(key);
    out.push([t, u]);
  }
  return out;
}

/**
 * The clauses of one state pair (spec "Distinct states"): for each fact f that may differ
 * between t and t′ (by the reach-1 layers when given, else every fact), ascending, a new
 * variable D and [¬D, F(t,f), F(t′,f)], [¬D, ¬F(t,f), ¬F(t′,f)]; then [GH(t), D…]. When some fact
 * is certainly different (fixed to opposite values) the pair adds nothing.
 */
export function emitStatePair(cnf: CnfBuilder, L: Layout, vars: SuffixVars, pair: StatePair, layers: ReachLayers | null): void {
  const [t, u] = pair;
  const differ: number[] = [];
  for (let f = 0; f < L.nF; f++) {
    if (!layers) {
      differ.push(f);
      continue;
    }
    const tTrue = layers.mayTrue[t][f] === 1;
    const tFalse = layers.mayFalse[t][f] === 1;
    const uTrue = layers.mayTrue[u][f] === 1;
    const uFalse = layers.mayFalse[u][f] === 1;
    if ((tTrue && !tFalse && uFalse && !uTrue) || (tFalse && !tTrue && uTrue && !uFalse)) return; // fixed apart
    if ((tTrue && uFalse) || (tFalse && uTrue)) differ.push(f);
  }
  const big: number[] = [vars.goalHolds[t]];
  for (const f of differ) {
    const D = cnf.newVar("distinct");
    cnf.add3(-D, L.fact(t, f), L.fact(u, f));
    cnf.add3(-D, -L.fact(t, f), -L.fact(u, f));
    big.push(D);
  }
  cnf.addClause(big);
}
