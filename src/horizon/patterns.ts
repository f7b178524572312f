// Lower bounds on what every plan pays beyond the cheapest positive cost per positive action,
// from projections onto goal variables and their ancestors (cheapest projected paths).
import type { DependencyGraph } from "../analyse/index.js";
import { IdHeap, type PackedStateSet } from "../analyse/index.js";
import { exploreProjection, type ProjectionContext, type ProjectionLimits } from "./projection.js";
import { poll } from "../util/limits.js";

/**
 * Why it is a lower bound. Every real plan π from the initial state projects onto a path of
 * the projection (projection.ts: each real step is an explored edge labelled with the same
 * action, from the projected initial state, state 0) that ends in a projected state holding the
 * goal facts of the projection's variables (and none of the negated goal facts). So the least
 * e-cost of such a projected path, e(a) = cost(a) − u for positive actions and 0 for zero-cost
 * ones, is at most e(π). The largest value over several projections is still a lower bound.
 */
export interface PatternExcess {
  variables: number[];
  states: number | null;
  /** Least e-cost of a projected path to a goal state; null when none (see note). */
  excess: number | null;
  note?: string;
}

export function patternExcessBounds(
  pctx: ProjectionContext,
  graph: DependencyGraph,
  unit: number,
  lim: Omit<ProjectionLimits, "zeroEdges" | "allEdges" | "keepStates">,
): PatternExcess[] {
  const { task, variables } = pctx;
  const goalVars = [...new Set([...task.goal, ...task.goalNeg].map((f) => variables.varOfFact[f]))].sort((x, y) => x - y);
  const ancestors = (s: number): Set<number> => {
    const seen = new Set<number>([s]);
    const stack = [s];
    while (stack.length > 0) for (const p of graph.parents[stack.pop()!]) if (!seen.has(p)) (seen.add(p), stack.push(p));
    return seen;
  };
  const varsOf = (sccs: Iterable<number>): number[] => [...sccs].flatMap((c) => graph.sccs[c]).sort((x, y) => x - y);
  const tried = new Set<string>();
  const out: PatternExcess[] = [];
  for (const v of goalVars) {
    const s = graph.sccOf[v];
    const candidates = [varsOf(ancestors(s)), varsOf([s, ...graph.parents[s]]), varsOf([s])];
    for (const vars of candidates) {
      poll("computing the horizon");
      const key = vars.join(",");
      if (tried.has(key)) break;
      tried.add(key);
      const r = exploreProjection(pctx, vars, { ...lim, zeroEdges: false, allEdges: true, keepStates: true });
      if (r.kind !== "explored") continue;
      out.push({ variables: vars, states: r.states, ...cheapestToGoal(task, r.facts!, r.stateSet!, r.allStart!, r.allTarget!, r.allAction!, unit) });
      break;
    }
  }
  return out;
}

function cheapestToGoal(
  task: ProjectionContext["task"],
  facts: number[],
  states: PackedStateSet,
  start: Int32Array,
  target: Int32Array,
  action: Int32Array,
  unit: number,
): { excess: number | null; note?: string } {
  const local = new Map(facts.map((f, i) => [f, i]));
  const pos = task.goal.filter((f) => local.has(f)).map((f) => local.get(f)!);
  const neg = task.goalNeg.filter((f) => local.has(f)).map((f) => local.get(f)!);
  const n = states.size;
  const dist = new Float64Array(n).fill(Number.POSITIVE_INFINITY);
  const done = new Uint8Array(n);
  // heap entries are snapshots (key, state): a key never changes once pushed
  const key: number[] = [];
  const node: number[] = [];
  const heap = new IdHeap((a, b) => key[a] < key[b] || (key[a] === key[b] && node[a] < node[b]));
  const push = (v: number) => {
    key.push(dist[v]);
    node.push(v);
    heap.push(node.length - 1);
  };
  dist[0] = 0;
  push(0);
  while (heap.size > 0) {
    poll("computing the horizon");
    const v = node[heap.pop()];
    if (done[v]) continue;
    done[v] = 1;
    if (pos.every((l) => states.hasBit(v, l)) && neg.every((l) => !states.hasBit(v, l))) return { excess: dist[v] };
    for (let e = start[v]; e < start[v + 1]; e++) {
      const c = task.actions[action[e]].cost;
      const d = dist[v] + (c > 0 ? c - unit : 0);
      const u = target[e];
      if (d < dist[u]) {
        dist[u] = d;
        push(u);
      }
    }
  }
  return { excess: null, note: "no projected goal state: no plan exists" };
}
