// Path measures of an explicit state graph: the traversal diameter (most distinct states one
// path visits, minus 1) via SCCs, and the recurrence diameter (longest path without a repeated
// state) by capped exhaustive search.
import type { StateGraph } from "../analyse/index.js";
import { withComponents } from "../analyse/index.js";
import { boundedMeasure, exactMeasure, type Measure } from "./types.js";
import { poll } from "../util/limits.js";

/** Successor lists without duplicates and self-loops. */
export function simpleSuccessors(g: StateGraph): number[][] {
  const n = g.states.size;
  const out: number[][] = [];
  for (let v = 0; v < n; v++) {
    const s = new Set<number>();
    for (let e = g.edgeStart[v]; e < g.edgeStart[v + 1]; e++) if (g.edgeTarget[e] !== v) s.add(g.edgeTarget[e]);
    out.push([...s].sort((a, b) => a - b));
  }
  return out;
}

/**
 * A path can visit every state of each strongly connected component it passes through (walks
 * may repeat states), and components form a DAG; so the most distinct states one path visits
 * is the heaviest chain of components, weighted by their sizes.
 */
export function traversalDiameter(succ: number[][]): number {
  const n = succ.length;
  if (n === 0) return 0;
  const g = withComponents(n, succ);
  const C = g.sccs.length;
  const w = new Float64Array(C);
  let best = 0;
  for (let c = C - 1; c >= 0; c--) {
    let m = 0;
    for (const d of g.children[c]) if (w[d] > m) m = w[d];
    w[c] = g.sccs[c].length + m;
    if (w[c] > best) best = w[c];
  }
  return best - 1;
}

/** Longest path visiting no state twice, from any reachable state (exhaustive, capped). */
export function recurrenceDiameter(succ: number[][], upper: number, maxNodes: number): Measure {
  const n = succ.length;
  let best = 0;
  let nodes = 0;
  const onPath = new Uint8Array(n);
  const stackV = new Int32Array(n + 1);
  const stackE = new Int32Array(n + 1);
  if (upper <= 0) return exactMeasure(0);
  for (let x = 0; x < n; x++) {
    let depth = 0;
    stackV[0] = x;
    stackE[0] = 0;
    onPath[x] = 1;
    while (depth >= 0) {
      poll("measuring the state graph");
      const v = stackV[depth];
      const list = succ[v];
      if (stackE[depth] < list.length) {
        const u = list[stackE[depth]++];
        if (onPath[u]) continue;
        if (++nodes > maxNodes) {
          for (let d = 0; d <= depth; d++) onPath[stackV[d]] = 0;
          return boundedMeasure(best, upper, `search stopped after ${maxNodes} partial paths tried; upper bound is the traversal diameter`);
        }
        depth++;
        stackV[depth] = u;
        stackE[depth] = 0;
        onPath[u] = 1;
        if (depth > best) best = depth;
        if (best >= upper) return exactMeasure(best); // the upper bound is attained
      } else {
        onPath[v] = 0;
        depth--;
      }
    }
  }
  return exactMeasure(best);
}
