// The compositional plan-length bound over the SCC DAG of a dependency graph, computed
// children first: K(S) ≤ M·a(S) + b(S)·Σ_{children C} K(C), with a, b from projections.
import type { DependencyGraph } from "../analyse/index.js";
import { readVariables, valueCount, writtenVariables } from "../analyse/index.js";
import { add, big, min, mul, toJson, type Big } from "./big.js";
import { condense, type Condensation } from "./condensation.js";
import { splitByContext } from "./context-split.js";
import { exploreProjection, type ProjectionContext, type ProjectionExplored, type ProjectionLimits } from "./projection.js";
import { reachStats } from "./reach.js";
import { poll } from "../util/limits.js";

/**
 * Why the total bounds the length needed (our own proof for this code's semantics; the
 * compositional form N(S) = b(S)·(1 + Σ_parents N(P)) is published: Abdulaziz, Gretton &
 * Norrish 2015; with b(S) = a(S) and M = 1 the total below is exactly that sum).
 *
 * Setting. Every action writes variables of a single SCC (its home) and reads only its home
 * and the home's parents (the dependency graph guarantees this). A piece of S is a maximal
 * stretch of the plan (in mode "zero": of one zero-cost segment, i.e. between two consecutive
 * positive-cost actions) without an action of a child of S.
 *
 * Transformations, each valid on any plan, never raising the cost and always shortening it:
 *  T0 drop an action that leaves the state unchanged (mode "zero": zero-cost ones only);
 *  T1 loop cutting: if the S-state repeats inside a piece of S, drop the S-actions between the
 *     repeats. Only S-actions and children of S read S, and no child action lies in between,
 *     so every later action sees the same values;
 *  T2 (mode "zero", S a root of the zero-cost graph whose projection with its context is exact)
 *     replace the S-actions of a piece by a shortest zero-cost S-path between the same S-states:
 *     the other actions of the piece neither read S nor write S or its context (the context
 *     is never written by zero-cost actions), so the S-actions commute with them and the
 *     projection's path lifts to the real task.
 * Apply them until none applies (the length falls each time, so this ends). Positive-cost
 * actions are never touched in mode "zero". In the final plan, for every S at once:
 *  - within one piece the S-states are pairwise distinct (T1) and form a walk along the edges
 *    of the projection (zero-cost edges in mode "zero"). The walk passes through the
 *    projection's strongly connected components along a path of the component DAG; the walk
 *    moves between components at most (components on the path − 1) times over the whole
 *    segment, and inside a component Q each piece adds at most |Q| − 1 moves. With X child
 *    actions in the segment (so at most X + 1 pieces): K_segment(S) ≤ a + b·X, where
 *    a = (nodes on the heaviest path of the component DAG) − 1 and b = (largest component) − 1.
 *    (Both are at most projected states − 1, the classical b(S).)
 *  - with T2, each piece holds at most d S-actions, d the largest zero-cost distance in the
 *    exact projection: K_segment(S) ≤ d + d·X.
 *  - mode "zero", S a zero-cost root whose projection with its context is too large (split by
 *    context, context-split.ts): within a segment the context value γ is fixed, so the walk of a
 *    piece lies in the exact graph for γ; the same two counts over that graph give
 *    a = max_γ (nodes on its heaviest path) − 1 and b = max_γ (largest component) − 1, and T2
 *    uses d = max_γ largest zero-cost distance. (An earlier version took "heaviest path − 2",
 *    which dropped the last move of a piece: a single gated zero-cost action then got K = 0;
 *    test/horizon/soundness.test.ts keeps that example.)
 *  - mode "zero", "global": when the projection onto S with ALL actions has no cycle, the S-state
 *    changes along the whole plan follow a path of that DAG, so S has at most its longest path
 *    of zero-cost actions in total (after T0 every S-action changes the S-state).
 * Summing a segment bound over the M segments: K(S) ≤ M·a + b·Σ_children K(C). In mode "all"
 * (M = 1), SCCs written only by positive-cost actions hold at most `positiveCap` actions
 * together (the final plan is no dearer than the original).
 * Projection sizes come from the projection of the FULL task (all actions, from the initial
 * state; see projection.ts), in mode "zero" too: a segment starts wherever a plan can be.
 * Variables no zero-cost action writes keep their value during a zero-cost segment, so the
 * projection may include those the zero-cost actions of S read (the context). When a
 * projection is too large: a = b = Π_{v ∈ S} (values of v) − 1.
 */
export type BlockMode = "all" | "zero";

export interface ComponentBound {
  component: number;
  variables: number[];
  children: number[];
  facts: number;
  /** How the per-segment coefficients were obtained. */
  via: "projection" | "projection-with-context" | "product" | "untouched";
  contextVariables?: number[];
  projectionStates: number | null;
  /** Condensation of the projection's (zero-cost, in mode "zero") transition graph. */
  condensation?: { components: number; largestComponent: number; heaviestPath: number };
  /** Mode "zero", exact projection of a zero-cost root: largest zero-cost distance. */
  zeroDistance?: number;
  /** Mode "zero": longest path of the acyclic all-actions projection onto S. */
  globalLongestPath?: number;
  /** Mode "zero", zero-cost root whose context did not fit: the graphs per context value. */
  contextSplit?: { contexts: number; starts: number; nodes: number; heaviestPath: number; largestComponent: number; zeroDistance: number | null };
  /** Per segment: K ≤ a + b·X. */
  a: number | string;
  b: number | string;
  /** Σ of the children's K. */
  X: number | string;
  K: number | string;
  bound: "segments" | "global" | "positive-cap" | "untouched";
  note?: string;
}

export interface CompositionalResult {
  total: Big;
  components: ComponentBound[];
  /** Projections explored / given up. */
  explored: number;
  gaveUp: number;
  /** Mode "all": Σ K over SCCs written only by positive-cost actions, before the cap. */
  positiveSum?: Big;
}

export interface CompositionalOptions extends Omit<ProjectionLimits, "zeroEdges" | "allEdges"> {
  /** Number of segments M (mode "zero": positive actions + 1; default 1). */
  segments?: Big;
  /** Mode "all": at most this many positive-cost actions in a plan considered. */
  positiveCap?: Big;
  /** BFS work allowed for the zero-cost distances of one projection (default 5,000,000). */
  maxDistanceWork?: number;
  /**
   * Action applications allowed for one split by context (default 80,000,000), and BFS work for
   * its distances (default 100,000,000). Measured on warehouse/problem-05 (289 contexts, 1.95
   * million start pairs): the old 20,000,000 stopped the split at 110 contexts (K = 87,724); with
   * these it completes (K = 221) in 1.6–1.9× the time of the abandoned attempt (same script, 4 runs).
   */
  maxSplitWork?: number;
  maxSplitDistanceWork?: number;
  /** Do not split by context (it is the costliest refinement). */
  skipSplit?: boolean;
}

export function compositionalBound(ctx: ProjectionContext, graph: DependencyGraph, mode: BlockMode, lim: CompositionalOptions): CompositionalResult {
  const { task, variables } = ctx;
  const M = lim.segments ?? 1n;
  const plim = { maxStates: lim.maxStates, maxUncertain: lim.maxUncertain, budget: lim.budget };
  // variables written by the actions the graph is about; SCCs written only by positive actions
  const written = new Uint8Array(variables.variables.length);
  const zeroWritten = new Uint8Array(variables.variables.length);
  task.actions.forEach((a) => {
    if (mode === "zero" && a.cost !== 0) return;
    for (const v of writtenVariables(a, variables.varOfFact)) {
      written[v] = 1;
      if (a.cost === 0) zeroWritten[v] = 1;
    }
  });
  // mode "zero": per SCC, the variables its zero-cost actions read that no zero-cost action writes
  const context: Set<number>[] = graph.sccs.map(() => new Set<number>());
  if (mode === "zero")
    task.actions.forEach((a) => {
      if (a.cost !== 0) return;
      const w = writtenVariables(a, variables.varOfFact);
      if (w.length === 0) return;
      const s = graph.sccOf[w[0]];
      for (const v of readVariables(a, variables.varOfFact)) if (!written[v]) context[s].add(v);
    });
  const singleCache = new Map<number, number>();
  const valuesOf = (v: number): number => {
    let c = singleCache.get(v);
    if (c === undefined) {
      const r = exploreProjection(ctx, [v], { ...plim, budget: { remaining: Math.max(lim.budget.remaining, 0) + valueCount(variables.variables[v]) + 1 }, zeroEdges: false });
      c = r.kind === "explored" ? Math.min(r.states, valueCount(variables.variables[v])) : valueCount(variables.variables[v]);
      singleCache.set(v, c);
    }
    return c;
  };
  const K: Big[] = new Array(graph.sccs.length).fill(0n);
  const components: ComponentBound[] = new Array(graph.sccs.length);
  let explored = 0;
  let gaveUp = 0;
  let positiveSum: Big = 0n;
  let otherSum: Big = 0n;
  for (let s = graph.sccs.length - 1; s >= 0; s--) {
    poll("computing the horizon");
    const vars = graph.sccs[s];
    const facts = vars.reduce((n, v) => n + variables.variables[v].facts.length, 0);
    let X: Big = 0n;
    for (const c of graph.children[s]) X = add(X, K[c]);
    const rec: ComponentBound = { component: s, variables: vars, children: graph.children[s], facts, via: "untouched", projectionStates: null, a: 0, b: 0, X: toJson(X), K: 0, bound: "untouched" };
    components[s] = rec;
    if (!vars.some((v) => written[v])) continue;
    // the per-segment options (a, b); the best M·a + b·X wins
    const options: Array<[Big, Big]> = [];
    const ctxVars = [...context[s]].sort((x, y) => x - y);
    // a root of the zero-cost actions: every parent SCC is context (no zero-cost action writes it)
    const isZeroRoot = mode === "zero" && graph.parents[s].every((p) => !graph.sccs[p].some((v) => written[v]));
    const edgeGraph = (r: ProjectionExplored): [Int32Array, Int32Array] => (mode === "zero" ? [r.zeroStart!, r.zeroTarget!] : [r.allStart!, r.allTarget!]);
    let own: ProjectionExplored | null = null; // projection onto S alone with all edges
    let r = ctxVars.length > 0 ? exploreProjection(ctx, [...vars, ...ctxVars].sort((x, y) => x - y), { ...plim, zeroEdges: true }) : null;
    if (r !== null && r.kind === "explored") {
      rec.via = "projection-with-context";
      rec.contextVariables = ctxVars;
    } else {
      if (r !== null) rec.note = `projection with context abandoned: ${r.reason}`;
      r = exploreProjection(ctx, vars, { ...plim, zeroEdges: mode === "zero", allEdges: true, keepStates: isZeroRoot && ctxVars.length > 0 });
      if (r.kind === "explored") {
        rec.via = "projection";
        own = r;
        if (isZeroRoot && ctxVars.length > 0 && !lim.skipSplit) {
          // the context does not fit into one projection: one context value at a time
          rec.contextVariables = ctxVars;
          const sp = splitByContext(ctx, vars, ctxVars, r, { ...plim, maxWork: lim.maxSplitWork ?? 80_000_000, maxDistanceWork: lim.maxSplitDistanceWork ?? 100_000_000 });
          if (sp.kind === "split") {
            // moves along one walk: nodes on the heaviest component path − 1 (see the proof above)
            rec.contextSplit = { contexts: sp.contexts, starts: sp.starts, nodes: sp.nodes, heaviestPath: sp.heaviestPath, largestComponent: sp.largestComponent, zeroDistance: sp.zeroDistance };
            options.push([big(Math.max(0, sp.heaviestPath - 1)), big(Math.max(0, sp.largestComponent - 1))]);
            if (sp.zeroDistance !== null) options.push([big(sp.zeroDistance), big(sp.zeroDistance)]);
          } else rec.note = `${rec.note}; split by context abandoned: ${sp.reason}`;
        }
      }
    }
    if (r.kind === "explored") {
      explored++;
      rec.projectionStates = r.states;
      const [start, target] = edgeGraph(r);
      const cd: Condensation = condense(r.states, start, target);
      rec.condensation = { components: cd.components, largestComponent: cd.largestComponent, heaviestPath: cd.heaviestPath };
      options.push([big(Math.max(0, cd.heaviestPath - 1)), big(Math.max(0, cd.largestComponent - 1))]);
      // exact projection of a zero-cost root: every outside condition is in the context
      if (isZeroRoot && (rec.via === "projection-with-context" || ctxVars.length === 0)) {
        const d = reachStats(r.states, start, target, lim.maxDistanceWork ?? 5_000_000).largestDistance;
        if (d !== null) {
          rec.zeroDistance = d;
          options.push([big(d), big(d)]);
        }
      }
    } else {
      gaveUp++;
      rec.via = "product";
      rec.note = `${rec.note ? rec.note + "; " : ""}projection abandoned: ${r.reason}`;
      let p: Big = 1n;
      for (const v of vars) p = mul(p, big(valuesOf(v)));
      const b = p === null ? null : big(p - 1n);
      options.push([b, b]);
    }
    let best: Big = null;
    for (const [a, b] of options) {
      poll("computing the horizon");
      const k = add(mul(M, a), mul(b, X));
      if (best === null || (k !== null && k < best)) {
        best = k;
        rec.a = toJson(a);
        rec.b = toJson(b);
      }
    }
    rec.bound = "segments";
    if (mode === "zero") {
      // global: the all-actions projection onto S alone has no cycle
      if (own === null && rec.via === "projection-with-context") {
        const o = exploreProjection(ctx, vars, { ...plim, zeroEdges: false, allEdges: true });
        if (o.kind === "explored") own = o;
      }
      if (own !== null) {
        const cd = condense(own.states, own.allStart!, own.allTarget!);
        if (cd.acyclic) {
          rec.globalLongestPath = cd.heaviestPath - 1;
          const g = big(cd.heaviestPath - 1);
          if (best === null || g! < best) {
            best = g;
            rec.bound = "global";
          }
        }
      }
    }
    const positiveOnly = mode === "all" && !vars.some((v) => zeroWritten[v]);
    if (positiveOnly && lim.positiveCap !== undefined && (best === null || lim.positiveCap! < best)) {
      best = lim.positiveCap!;
      rec.bound = "positive-cap";
    }
    K[s] = best;
    rec.K = toJson(best);
    if (positiveOnly) positiveSum = add(positiveSum, best);
    else otherSum = add(otherSum, best);
  }
  const cappedPositive = mode === "all" && lim.positiveCap !== undefined ? min(positiveSum, lim.positiveCap!) : positiveSum;
  const out: CompositionalResult = { total: add(otherSum, cappedPositive), components, explored, gaveUp };
  if (mode === "all") out.positiveSum = positiveSum;
  return out;
}
