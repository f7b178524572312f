// The zero-cost transition graph of a root SCC of the zero-cost actions, one fixed context at a
// time: used when the projection onto the SCC together with its context is too large to explore.
import { writtenVariables } from "../analyse/index.js";
import { PackedStateSet } from "../analyse/index.js";
import { condense } from "./condensation.js";
import { exploreProjection, toCsr, type ProjectionContext, type ProjectionExplored, type ProjectionLimits } from "./projection.js";
import { reachStats } from "./reach.js";
import { poll } from "../util/limits.js";

/**
 * Setting: S is a root of the zero-cost dependency graph, so its zero-cost actions read only S
 * and context variables that no zero-cost action writes (they stay fixed during a zero-cost
 * segment). For each context value γ of the projection onto the context variables (all
 * actions, from the initial state: every context value of a reachable state is among them)
 * and each S-value s of the projection onto S that h² allows together with γ (every S-value of
 * a reachable state is among these), the zero-cost S-transitions from (s, γ) are computed
 * exactly: all their conditions lie in S and the context. So every real zero-cost S-walk of a
 * segment is a walk of the graph for its γ, and the graph's shortest paths from a real start
 * are real S-paths. Per γ: the condensation (heaviest component path, largest component) and,
 * within a work cap, the largest BFS distance. Their maxima over γ are what compositional.ts
 * uses as the per-segment coefficients.
 */
export interface ContextSplit {
  kind: "split";
  contexts: number;
  /** Start pairs (s, γ) kept by the h² check, summed over γ. */
  starts: number;
  /** Graph nodes summed over γ (starts plus the states they reach). */
  nodes: number;
  heaviestPath: number;
  largestComponent: number;
  /** Largest zero-cost distance over all γ; null when the BFS work cap was reached. */
  zeroDistance: number | null;
}

export interface SplitLimits extends Omit<ProjectionLimits, "zeroEdges" | "allEdges" | "keepStates"> {
  /** Action applications allowed over all contexts. */
  maxWork: number;
  /** BFS work allowed for the distances over all contexts. */
  maxDistanceWork: number;
}

interface Compiled {
  pre: number[];
  preNeg: number[];
  ctxPre: number[];
  ctxPreNeg: number[];
  add: number[];
  del: number[];
  conds: Array<{ cond: number[]; condNeg: number[]; ctxCond: number[]; ctxCondNeg: number[]; add: number[]; del: number[] }>;
}

export function splitByContext(
  pctx: ProjectionContext,
  vars: readonly number[],
  ctxVars: readonly number[],
  own: ProjectionExplored,
  lim: SplitLimits,
): ContextSplit | { kind: "gave-up"; reason: string } {
  const { task, pairs, variables } = pctx;
  if (!own.stateSet || !own.facts) return { kind: "gave-up", reason: "projection states not kept" };
  const cp = exploreProjection(pctx, ctxVars, { maxStates: lim.maxStates, maxUncertain: lim.maxUncertain, budget: lim.budget, zeroEdges: false, keepStates: true });
  if (cp.kind !== "explored") return { kind: "gave-up", reason: `context projection: ${cp.reason}` };
  const sFacts = own.facts;
  const cFacts = cp.facts!;
  const sLocal = new Map(sFacts.map((f, i) => [f, i]));
  const cLocal = new Map(cFacts.map((f, i) => [f, i]));
  const inS = new Set(vars);
  // the zero-cost actions of S, with their conditions split into S and context parts
  const compiled: Compiled[] = [];
  let outside = false;
  const split = (xs: readonly number[]): [number[], number[]] => {
    const s: number[] = [];
    const c: number[] = [];
    for (const f of xs) {
      const l = sLocal.get(f);
      if (l !== undefined) s.push(l);
      else {
        const m = cLocal.get(f);
        if (m === undefined) outside = true;
        else c.push(m);
      }
    }
    return [s, c];
  };
  for (const a of task.actions) {
    if (a.cost !== 0) continue;
    const w = writtenVariables(a, variables.varOfFact);
    if (w.length === 0 || !inS.has(w[0])) continue;
    const [pre, ctxPre] = split(a.pre);
    const [preNeg, ctxPreNeg] = split(a.preNeg);
    const conds = a.cond.map((ce) => {
      const [cond, ctxCond] = split(ce.cond);
      const [condNeg, ctxCondNeg] = split(ce.condNeg);
      return { cond, condNeg, ctxCond, ctxCondNeg, add: split(ce.add)[0], del: split(ce.del)[0] };
    });
    compiled.push({ pre, preNeg, ctxPre, ctxPreNeg, add: split(a.add)[0], del: split(a.del)[0], conds });
  }
  if (outside) return { kind: "gave-up", reason: "a zero-cost action reads a variable outside the SCC and its context" };

  const W = own.stateSet.words;
  const nS = own.stateSet.size;
  const trueOf = (set: PackedStateSet, i: number, facts: number[]): number[] => {
    const out: number[] = [];
    const v = set.view(i);
    for (let w = 0; w < v.length; w++) {
      let x = v[w];
      while (x !== 0) {
        const low = x & -x;
        out.push(facts[w * 32 + (31 - Math.clz32(low))]);
        x ^= low;
      }
    }
    return out;
  };
  const has = (s: Uint32Array, l: number) => (s[l >>> 5] & (1 << (l & 31))) !== 0;
  const all = (s: Uint32Array, ls: number[]) => ls.every((l) => has(s, l));
  const none = (s: Uint32Array, ls: number[]) => ls.every((l) => !has(s, l));
  const usePairs = pairs.method === "h2";

  let work = 0;
  let distanceWork = 0;
  let starts = 0;
  let nodes = 0;
  let heaviest = 0;
  let largest = 0;
  let distance: number | null = 0;
  const cur = new Uint32Array(W);
  const next = new Uint32Array(W);
  const mask = (ls: number[], out: Uint32Array, off: number) => {
    for (const l of ls) out[off + (l >>> 5)] |= 1 << (l & 31);
  };
  for (let g = 0; g < cp.states; g++) {
    poll("computing the horizon");
    const gamma = cp.stateSet!.view(g);
    const gTrue = trueOf(cp.stateSet!, g, cFacts);
    // actions and conditional effects enabled under γ, as word masks over S
    const on = compiled.filter((c) => all(gamma, c.ctxPre) && none(gamma, c.ctxPreNeg));
    if (on.length === 0) continue;
    const E = on.length;
    const preM = new Uint32Array(E * W);
    const negM = new Uint32Array(E * W);
    const addM = new Uint32Array(E * W);
    const delM = new Uint32Array(E * W);
    const conds = on.map((c) => c.conds.filter((ce) => all(gamma, ce.ctxCond) && none(gamma, ce.ctxCondNeg)));
    on.forEach((c, e) => {
      mask(c.pre, preM, e * W);
      mask(c.preNeg, negM, e * W);
      mask(c.add, addM, e * W);
      mask(c.del, delM, e * W);
    });
    // S facts h² rules out beside γ: an S-value is a start exactly when it holds none of them
    const forbidden = new Uint32Array(W);
    if (usePairs) sFacts.forEach((f, l) => gTrue.every((h) => pairs.together(f, h)) || (forbidden[l >>> 5] |= 1 << (l & 31)));
    const states = new PackedStateSet(W, 1024);
    for (let i = 0; i < nS; i++) {
      poll("computing the horizon");
      const y = own.stateSet.view(i);
      let ok = true;
      for (let w = 0; w < W && ok; w++) ok = (y[w] & forbidden[w]) === 0;
      if (ok) states.add(y);
    }
    starts += states.size;
    const from: number[] = [];
    const to: number[] = [];
    for (let i = 0; i < states.size; i++) {
      poll("computing the horizon");
      states.copyTo(i, cur);
      work += E;
      for (let e = 0; e < E; e++) {
        poll("computing the horizon");
        const o = e * W;
        let ok = true;
        for (let w = 0; w < W && ok; w++) ok = (cur[w] & preM[o + w]) === preM[o + w] && (cur[w] & negM[o + w]) === 0;
        if (!ok) continue;
        const ce = conds[e];
        if (ce.length === 0) for (let w = 0; w < W; w++) next[w] = (cur[w] & ~delM[o + w]) | addM[o + w];
        else {
          const fired = ce.filter((x) => all(cur, x.cond) && none(cur, x.condNeg));
          for (let w = 0; w < W; w++) next[w] = cur[w] & ~delM[o + w];
          for (const x of fired) for (const l of x.del) next[l >>> 5] &= ~(1 << (l & 31));
          for (let w = 0; w < W; w++) next[w] |= addM[o + w];
          for (const x of fired) for (const l of x.add) next[l >>> 5] |= 1 << (l & 31);
        }
        const j = states.add(next);
        if (j !== i) {
          from.push(i);
          to.push(j);
        }
      }
      if (work > lim.maxWork) return { kind: "gave-up", reason: `more than ${lim.maxWork} action applications over ${g + 1} of ${cp.states} contexts` };
    }
    nodes += states.size;
    const [start, target] = toCsr(states.size, from, to);
    const cd = condense(states.size, start, target);
    if (cd.heaviestPath > heaviest) heaviest = cd.heaviestPath;
    if (cd.largestComponent > largest) largest = cd.largestComponent;
    if (distance !== null) {
      const left = lim.maxDistanceWork - distanceWork;
      const r = left > 0 ? reachStats(states.size, start, target, left) : null;
      if (r === null || r.largestDistance === null) distance = null;
      else {
        distance = Math.max(distance, r.largestDistance);
        distanceWork += r.work;
      }
    }
  }
  return { kind: "split", contexts: cp.states, starts, nodes, heaviestPath: heaviest, largestComponent: largest, zeroDistance: distance };
}
