// Explicit exploration of a Task's projection onto a set of variables, from the projected
// initial state with ALL actions: an over-approximation of the values reachable states take.
import type { Task } from "../ground/task.js";
import type { PairReachability, Variables } from "../analyse/index.js";
import { PackedStateSet } from "../analyse/index.js";
import { poll } from "../util/limits.js";

/**
 * Projection semantics (sound over-approximation). A projected state is the set of true facts
 * among the facts F_S of the chosen variables. An action whose effects touch F_S applies in a
 * projected state y when its conditions on F_S hold in y and every positive precondition
 * outside F_S may hold together with every fact of y (h² pairs); conditions outside F_S are
 * otherwise unknown. A conditional effect fires when its condition on F_S holds and its
 * condition outside F_S is certain (implied by the precondition) or empty; when the outside
 * part is uncertain, both outcomes are explored. Deletes then adds, as in the Task semantics.
 * Projected states that contain an h² mutex pair, or miss every fact of an exactly-one
 * variable, are discarded: no reachable state projects onto them.
 *
 * Claim: for every state x reachable in the task, x ∩ F_S is reached here. (Induction on the
 * run: each real step projects onto one of the explored steps, and real states are never
 * discarded.)
 */
export interface ProjectionContext {
  task: Task;
  pairs: PairReachability;
  variables: Variables;
  /** Fact → sorted ids of the actions with an effect (conditional or not) on it. */
  touching: number[][];
  /** Scratch map global fact → local index (kept at -1 between calls). */
  scratch: Int32Array;
}

export function projectionContext(task: Task, pairs: PairReachability, variables: Variables): ProjectionContext {
  const touching: number[][] = task.facts.map(() => []);
  task.actions.forEach((a, i) => {
    const s = new Set<number>([...a.add, ...a.del]);
    for (const ce of a.cond) for (const f of [...ce.add, ...ce.del]) s.add(f);
    for (const f of s) touching[f].push(i);
  });
  return { task, pairs, variables, touching, scratch: new Int32Array(task.facts.length).fill(-1) };
}

export interface ProjectionExplored {
  kind: "explored";
  /** Number of projected states reached. */
  states: number;
  /** Number of actions that touch the projection. */
  actions: number;
  /** The projected states (bit i = fact `facts[i]`), when requested. */
  stateSet?: PackedStateSet;
  /** Sorted global ids of the projection's facts (the bit order of `stateSet`). */
  facts?: number[];
  /** CSR over the zero-cost projected transitions (when requested). */
  zeroStart?: Int32Array;
  zeroTarget?: Int32Array;
  /** CSR over all projected transitions that change the projected state (when requested). */
  allStart?: Int32Array;
  allTarget?: Int32Array;
  /** Action of each edge of the `all` CSR (when all edges are requested). */
  allAction?: Int32Array;
}

export interface ProjectionGaveUp {
  kind: "gave-up";
  reason: string;
  statesSeen: number;
}

export interface ProjectionLimits {
  maxStates: number;
  /** At most this many conditional effects with an uncertain outside condition per step. */
  maxUncertain: number;
  /** Shared budget of projected states across projections; decremented. */
  budget: { remaining: number };
  zeroEdges: boolean;
  /** Also record every transition between distinct projected states. */
  allEdges?: boolean;
  /** Also return the projected states. */
  keepStates?: boolean;
}

interface CompiledCond {
  cond: number[];
  condNeg: number[];
  add: number[];
  del: number[];
  /** Positive outside condition facts not implied by the precondition (global ids). */
  outside: number[];
  uncertain: boolean;
}

interface Compiled {
  action: number;
  pre: number[];
  preNeg: number[];
  outsidePre: number[];
  add: number[];
  del: number[];
  conds: CompiledCond[];
  zero: boolean;
}

export function exploreProjection(ctx: ProjectionContext, vars: readonly number[], lim: ProjectionLimits): ProjectionExplored | ProjectionGaveUp {
  const { task, pairs, variables, scratch } = ctx;
  const facts: number[] = [];
  for (const v of vars) facts.push(...variables.variables[v].facts);
  facts.sort((a, b) => a - b);
  facts.forEach((f, i) => (scratch[f] = i));
  try {
    return explore(ctx, vars, facts, lim);
  } finally {
    for (const f of facts) scratch[f] = -1;
  }
}

function explore(ctx: ProjectionContext, vars: readonly number[], facts: number[], lim: ProjectionLimits): ProjectionExplored | ProjectionGaveUp {
  const { task, pairs, variables, scratch } = ctx;
  const k = facts.length;
  const W = Math.max(1, Math.ceil(k / 32));
  const local = (xs: readonly number[]) => xs.filter((f) => scratch[f] >= 0).map((f) => scratch[f]);
  const outside = (xs: readonly number[]) => xs.filter((f) => scratch[f] < 0);
  const usePairs = pairs.method === "h2";

  const actionIds = new Set<number>();
  for (const f of facts) for (const a of ctx.touching[f]) actionIds.add(a);
  const compiled: Compiled[] = [];
  for (const ai of [...actionIds].sort((x, y) => x - y)) {
    const a = task.actions[ai];
    const pre = new Set(a.pre);
    const preNeg = new Set(a.preNeg);
    const conds: CompiledCond[] = [];
    for (const ce of a.cond) {
      const add = local(ce.add);
      const del = local(ce.del);
      if (add.length + del.length === 0) continue;
      const oc = outside(ce.cond).filter((f) => !pre.has(f));
      const ocn = outside(ce.condNeg).filter((f) => !preNeg.has(f));
      if (ocn.some((f) => pre.has(f))) continue; // can never fire
      if (usePairs && oc.some((f) => !pairs.reachable(f) || a.pre.some((p) => !pairs.together(f, p)))) continue;
      conds.push({ cond: local(ce.cond), condNeg: local(ce.condNeg), add, del, outside: oc, uncertain: oc.length + ocn.length > 0 });
    }
    compiled.push({
      action: ai,
      pre: local(a.pre),
      preNeg: local(a.preNeg),
      outsidePre: usePairs ? outside(a.pre) : [],
      add: local(a.add),
      del: local(a.del),
      conds,
      zero: a.cost === 0,
    });
  }
  // exactly-one variables inside the projection: one of their facts must be true
  const exactlyOne: number[][] = [];
  for (const v of vars) if (!variables.variables[v].hasNone) exactlyOne.push(local(variables.variables[v].facts));

  const states = new PackedStateSet(W, 256);
  const y0 = new Uint32Array(W);
  for (const f of task.init) if (scratch[f] >= 0) y0[scratch[f] >>> 5] |= 1 << (scratch[f] & 31);
  states.add(y0);
  if (--lim.budget.remaining < 0) return { kind: "gave-up", reason: "projection budget exhausted", statesSeen: 1 };
  const has = (s: Uint32Array, l: number) => (s[l >>> 5] & (1 << (l & 31))) !== 0;
  const all = (s: Uint32Array, ls: number[]) => ls.every((l) => has(s, l));
  const none = (s: Uint32Array, ls: number[]) => ls.every((l) => !has(s, l));
  const zeroFrom: number[] = [];
  const zeroTo: number[] = [];
  const allFrom: number[] = [];
  const allTo: number[] = [];
  const allAct: number[] = [];
  const y = new Uint32Array(W);
  const next = new Uint32Array(W);
  const trueGlobal = (s: Uint32Array): number[] => {
    const out: number[] = [];
    for (let w = 0; w < W; w++) {
      let x = s[w];
      while (x !== 0) {
        const low = x & -x;
        out.push(facts[w * 32 + (31 - Math.clz32(low))]);
        x ^= low;
      }
    }
    return out;
  };
  const compatible = (f: number, ys: number[]) => {
    for (const g of ys) if (!pairs.together(f, g)) return false;
    return true;
  };
  for (let i = 0; i < states.size; i++) {
    poll("computing the horizon");
    states.copyTo(i, y);
    const yTrue = usePairs ? trueGlobal(y) : [];
    for (const c of compiled) {
      poll("computing the horizon");
      if (!all(y, c.pre) || !none(y, c.preNeg)) continue;
      if (usePairs && !c.outsidePre.every((f) => compatible(f, yTrue))) continue;
      const certain: CompiledCond[] = [];
      const uncertain: CompiledCond[] = [];
      for (const ce of c.conds) {
        if (!all(y, ce.cond) || !none(y, ce.condNeg)) continue;
        if (!ce.uncertain) certain.push(ce);
        else if (!usePairs || ce.outside.every((f) => compatible(f, yTrue))) uncertain.push(ce);
      }
      if (uncertain.length > lim.maxUncertain)
        return { kind: "gave-up", reason: `${uncertain.length} conditional effects with conditions outside the projection in one step (limit ${lim.maxUncertain})`, statesSeen: states.size };
      const combos = 1 << uncertain.length;
      for (let m = 0; m < combos; m++) {
        next.set(y);
        const clear = (ls: number[]) => ls.forEach((l) => (next[l >>> 5] &= ~(1 << (l & 31))));
        const set = (ls: number[]) => ls.forEach((l) => (next[l >>> 5] |= 1 << (l & 31)));
        clear(c.del);
        for (const ce of certain) clear(ce.del);
        uncertain.forEach((ce, u) => {
          if (m & (1 << u)) clear(ce.del);
        });
        set(c.add);
        for (const ce of certain) set(ce.add);
        uncertain.forEach((ce, u) => {
          if (m & (1 << u)) set(ce.add);
        });
        if (!admissible(next, exactlyOne, has, usePairs ? pairs : null, trueGlobal)) continue;
        const before = states.size;
        const j = states.add(next);
        if (states.size > before) {
          if (states.size > lim.maxStates) return { kind: "gave-up", reason: `more than ${lim.maxStates} projected states`, statesSeen: states.size };
          if (--lim.budget.remaining < 0) return { kind: "gave-up", reason: "projection budget exhausted", statesSeen: states.size };
        }
        if (lim.zeroEdges && c.zero && j !== i) {
          zeroFrom.push(i);
          zeroTo.push(j);
        }
        if (lim.allEdges && j !== i) {
          allFrom.push(i);
          allTo.push(j);
          allAct.push(c.action);
        }
      }
    }
  }
  const out: ProjectionExplored = { kind: "explored", states: states.size, actions: compiled.length };
  if (lim.keepStates) {
    out.stateSet = states;
    out.facts = facts;
  }
  if (lim.zeroEdges) [out.zeroStart, out.zeroTarget] = toCsr(states.size, zeroFrom, zeroTo);
  if (lim.allEdges) [out.allStart, out.allTarget, out.allAction] = toCsr(states.size, allFrom, allTo, allAct);
  return out;
}

/** Edge lists → CSR (edges of a source keep their order), with an optional edge label list. */
export function toCsr(n: number, from: readonly number[], to: readonly number[], label: readonly number[] = []): [Int32Array, Int32Array, Int32Array] {
  const start = new Int32Array(n + 1);
  for (const f of from) start[f + 1]++;
  for (let v = 0; v < n; v++) start[v + 1] += start[v];
  const fill = start.slice(0, n);
  const target = new Int32Array(from.length);
  const labels = new Int32Array(label.length > 0 ? from.length : 0);
  from.forEach((f, e) => {
    const at = fill[f]++;
    target[at] = to[e];
    if (label.length > 0) labels[at] = label[e];
  });
  return [start, target, labels];
}

function admissible(
  s: Uint32Array,
  exactlyOne: number[][],
  has: (s: Uint32Array, l: number) => boolean,
  pairs: PairReachability | null,
  trueGlobal: (s: Uint32Array) => number[],
): boolean {
  for (const g of exactlyOne) if (!g.some((l) => has(s, l))) return false;
  if (pairs) {
    const t = trueGlobal(s);
    for (let i = 0; i < t.length; i++) for (let j = i; j < t.length; j++) if (!pairs.together(t[i], t[j])) return false;
  }
  return true;
}
