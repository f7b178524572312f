// The compositional sublist-diameter bound over the SCC DAG of a dependency graph:
// N(S) = b(S)·(1 + Σ_{P parent of S} N(P)), ℓ ≤ Σ_S N(S), with b(S) from projections.
import type { DependencyGraph } from "../analyse/index.js";
import { readVariables, valueCount, writtenVariables } from "../analyse/index.js";
import { add, big, mul, toJson, type Big } from "./big.js";
import { exploreProjection, type ProjectionContext, type ProjectionLimits } from "./projection.js";
import { reachStats } from "./reach.js";

/**
 * Why Σ_S N(S) bounds the length needed (our own proof, written for this code's semantics;
 * the formula is published: Abdulaziz, Gretton & Norrish 2015).
 *
 * Let every action write variables of a single SCC (its home) and read only variables of its
 * home and of the home's parents — the dependency graph guarantees this. Take any run π from a
 * reachable state. Handle the SCCs children-first. For SCC S, cut π's timeline at every kept
 * action of a child of S (those actions need S's state as it was); inside each piece, while
 * the S-state sequence repeats a state, delete the S-actions between the repeats (loop
 * cutting). Loop cutting keeps the S-state before every kept S-action, at every cut, and at
 * the end exactly as in π; the parents of S are handled later with the kept S-actions as their
 * cuts, so every kept action sees the same home and parent values as in π: it stays
 * applicable and has the same effect. Within one piece the S-states left are distinct, so at
 * most b(S) S-actions remain, where b(S) + 1 bounds the S-states one piece can visit. Hence
 * K(S) ≤ b(S)·(1 + Σ_{children C} K(C)); summing over SCCs gives the sum over all directed
 * paths of the product of b along the path, which equals Σ_S N(S) with the parents-form above.
 * The result is a sub-sequence (sublist) of π with the same final state and no greater cost.
 *
 * Two kinds of b(S):
 * - "all": b(S) = (number of projected states reachable from the initial state) − 1: every
 *   S-state of a reachable state is among them.
 * - "zero": for runs of zero-cost actions only (dependency graph of the zero-cost actions)
 *   starting anywhere a plan can be: b(S) = max over projected states y (reached with ALL
 *   actions) of (states reachable from y by zero-cost projected steps) − 1. The start of each
 *   piece is a projection of a reachable state, and the piece only takes zero-cost steps.
 *   Variables no zero-cost action writes keep their value during a whole zero-cost run, so
 *   the projection may include those the zero-cost actions of S read (the context): zero-cost
 *   steps never change them, and the S-states one run visits lie in the zero-cost reachable
 *   set of (start, its context). This is tried first; without the context when too large.
 * When a projection is too large, b(S) = Π_{v ∈ S} (values of v) − 1, where the values of v are
 * those its own projection reaches (or its domain size when that projection fails) — also an
 * upper bound on the S-states of reachable states.
 */
export type BlockMode = "all" | "zero";

export interface ComponentBound {
  component: number;
  variables: number[];
  parents: number[];
  facts: number;
  /** How b was obtained. */
  via: "projection" | "projection-with-context" | "product" | "untouched";
  /** Mode "zero": variables fixed during zero-cost runs added to the projection. */
  contextVariables?: number[];
  projectionStates: number | null;
  /** For mode "zero": the largest zero-cost reachable set within the projection. */
  largestZeroReach: number | null;
  b: number | string;
  N: number | string;
  note?: string;
}

export interface CompositionalResult {
  total: Big;
  components: ComponentBound[];
  /** Projections explored / given up. */
  explored: number;
  gaveUp: number;
}

export function compositionalBound(
  ctx: ProjectionContext,
  graph: DependencyGraph,
  mode: BlockMode,
  lim: Omit<ProjectionLimits, "zeroEdges">,
): CompositionalResult {
  const { task, variables } = ctx;
  // variables written by the actions the graph is about
  const writtenByGraphActions = new Uint8Array(variables.variables.length);
  task.actions.forEach((a) => {
    if (mode === "zero" && a.cost !== 0) return;
    const mark = (f: number) => (writtenByGraphActions[variables.varOfFact[f]] = 1);
    a.add.forEach(mark);
    a.del.forEach(mark);
    for (const ce of a.cond) {
      ce.add.forEach(mark);
      ce.del.forEach(mark);
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
      for (const v of readVariables(a, variables.varOfFact)) if (!writtenByGraphActions[v]) context[s].add(v);
    });
  const singleCache = new Map<number, number>();
  const valuesOf = (v: number): number => {
    let c = singleCache.get(v);
    if (c === undefined) {
      const r = exploreProjection(ctx, [v], { ...lim, budget: { remaining: Math.max(lim.budget.remaining, 0) + valueCount(variables.variables[v]) + 1 }, zeroEdges: false });
      c = r.kind === "explored" ? Math.min(r.states, valueCount(variables.variables[v])) : valueCount(variables.variables[v]);
      singleCache.set(v, c);
    }
    return c;
  };
  const N: Big[] = [];
  const components: ComponentBound[] = [];
  let total: Big = 0n;
  let explored = 0;
  let gaveUp = 0;
  graph.sccs.forEach((vars, s) => {
    const facts = vars.reduce((n, v) => n + variables.variables[v].facts.length, 0);
    let b: Big;
    let via: ComponentBound["via"];
    let projectionStates: number | null = null;
    let largestZeroReach: number | null = null;
    let note: string | undefined;
    if (!vars.some((v) => writtenByGraphActions[v])) {
      b = 0n;
      via = "untouched";
    } else {
      const ctxVars = [...context[s]].sort((x, y) => x - y);
      let r = ctxVars.length > 0 ? exploreProjection(ctx, [...vars, ...ctxVars].sort((x, y) => x - y), { ...lim, zeroEdges: true }) : null;
      if (r !== null && r.kind === "explored") {
        explored++;
        projectionStates = r.states;
        via = "projection-with-context";
        largestZeroReach = reachStats(r.states, r.zeroStart!, r.zeroTarget!).largestSet;
        b = big(largestZeroReach - 1);
      } else if ((r = exploreProjection(ctx, vars, { ...lim, zeroEdges: mode === "zero" })).kind === "explored") {
        explored++;
        projectionStates = r.states;
        via = "projection";
        if (mode === "zero") {
          largestZeroReach = reachStats(r.states, r.zeroStart!, r.zeroTarget!).largestSet;
          b = big(largestZeroReach - 1);
        } else b = big(r.states - 1);
      } else {
        gaveUp++;
        via = "product";
        note = `projection abandoned: ${r.reason}`;
        let p: Big = 1n;
        for (const v of vars) p = mul(p, big(valuesOf(v)));
        b = p === null ? null : big(p - 1n);
      }
    }
    let parentsSum: Big = 1n;
    for (const p of graph.parents[s]) parentsSum = add(parentsSum, N[p]);
    const n = mul(b, parentsSum);
    N.push(n);
    total = add(total, n);
    const rec: ComponentBound = {
      component: s,
      variables: vars,
      parents: graph.parents[s],
      facts,
      via,
      projectionStates,
      largestZeroReach,
      b: toJson(b),
      N: toJson(n),
    };
    if (mode === "zero" && context[s].size > 0) rec.contextVariables = [...context[s]].sort((x, y) => x - y);
    if (note) rec.note = note;
    components.push(rec);
  });
  return { total, components, explored, gaveUp };
}
