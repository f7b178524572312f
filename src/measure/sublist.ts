// Sublist and subset diameters of an explicit state graph by capped exhaustive search over
// runs that visit no state twice (cutting a loop gives a sub-sequence, so these suffice).
import type { StateGraph } from "../analyse/index.js";
import { boundedMeasure, exactMeasure, type Measure } from "./types.js";
import { poll } from "../util/limits.js";

const INF = 0x3fffffff;

export interface SublistOptions {
  /** Partial paths (runs) tried in total (default 1,000,000). */
  maxNodes?: number;
  /** Largest states × actions successor table (default 5,000,000). */
  maxTable?: number;
  /** Largest states² distance matrix for the subset diameter (default 4,000,000). */
  maxDistances?: number;
  /** Largest (state, used-actions) space per subset search (default 2,000,000). */
  maxSubsetSpace?: number;
}

/**
 * sublist: max over reachable x and runs π from x of the length of the shortest sub-sequence
 * of π (same order, executable from x) that ends in the same state;
 * subset: the same with the kept actions in any order (a sub-multiset of π).
 * `upper` is a proven upper bound for both (the recurrence diameter or its bound).
 */
export function sublistAndSubset(g: StateGraph, upper: number, opts: SublistOptions = {}): { sublist: Measure; subset: Measure } {
  const n = g.states.size;
  const A = g.task.actions.length;
  const maxNodes = opts.maxNodes ?? 1_000_000;
  if (n * A > (opts.maxTable ?? 5_000_000)) {
    const why = `not computed: ${n} states × ${A} actions exceeds the successor-table cap`;
    return { sublist: boundedMeasure(0, upper, why), subset: boundedMeasure(0, upper, why) };
  }
  const succ = new Int32Array(A * n).fill(-1);
  for (let v = 0; v < n; v++) for (let e = g.edgeStart[v]; e < g.edgeStart[v + 1]; e++) succ[g.edgeAction[e] * n + v] = g.edgeTarget[e];
  const dist = n * n <= (opts.maxDistances ?? 4_000_000) ? allDistances(g) : null;
  const maxSpace = opts.maxSubsetSpace ?? 2_000_000;

  let sublistBest = 0;
  let subsetLower = 0; // max over runs of a proven lower bound of their subset minimum
  let subsetUpper = 0; // max over runs of a proven upper bound of it
  let subsetExact = dist !== null;
  let nodes = 0;
  let stopped = false;
  const rows = new Int32Array((n + 1) * n);
  const onPath = new Uint8Array(n);
  const pathV = new Int32Array(n + 1);
  const pathE = new Int32Array(n + 1); // next edge to try at each depth
  const pathA = new Int32Array(n + 1); // action taken to reach depth d (d ≥ 1)

  outer: for (let x = 0; x < n; x++) {
    rows.fill(INF, 0, n);
    rows[x] = 0;
    let depth = 0;
    pathV[0] = x;
    pathE[0] = g.edgeStart[x];
    onPath[x] = 1;
    while (depth >= 0) {
      poll("measuring the state graph");
      const v = pathV[depth];
      if (pathE[depth] < g.edgeStart[v + 1]) {
        const e = pathE[depth]++;
        const u = g.edgeTarget[e];
        if (u === v || onPath[u]) continue;
        if (++nodes > maxNodes) {
          stopped = true;
          for (let d = 0; d <= depth; d++) onPath[pathV[d]] = 0;
          break outer;
        }
        const a = g.edgeAction[e];
        const from = depth * n;
        const to = from + n;
        rows.copyWithin(to, from, from + n);
        for (let z = 0; z < n; z++) {
          const l = rows[from + z];
          if (l === INF) continue;
          const t = succ[a * n + z];
          if (t >= 0 && l + 1 < rows[to + t]) rows[to + t] = l + 1;
        }
        depth++;
        pathV[depth] = u;
        pathE[depth] = g.edgeStart[u];
        pathA[depth] = a;
        onPath[u] = 1;
        const minSub = rows[to + u];
        if (minSub > sublistBest) sublistBest = minSub;
        if (minSub > subsetUpper) {
          if (dist === null) subsetUpper = minSub;
          else {
            const r = subsetMinimum(x, u, pathA.subarray(1, depth + 1), minSub, succ, n, dist, maxSpace);
            if (!r.exact) subsetExact = false;
            if (r.upper > subsetUpper) subsetUpper = r.upper;
            if (r.lower > subsetLower) subsetLower = r.lower;
          }
        }
      } else {
        onPath[v] = 0;
        depth--;
      }
    }
  }
  if (stopped) {
    const why = `search stopped after ${maxNodes} partial paths tried; upper bound from the recurrence diameter`;
    return { sublist: boundedMeasure(sublistBest, upper, why), subset: boundedMeasure(subsetLower, upper, why) };
  }
  const sublist = exactMeasure(sublistBest);
  if (dist === null) return { sublist, subset: boundedMeasure(0, sublistBest, "not computed: distance matrix too large; upper bound is the sublist diameter") };
  const subset = subsetExact && subsetLower === subsetUpper ? exactMeasure(subsetLower) : boundedMeasure(subsetLower, subsetUpper, "some subset searches exceeded their space cap");
  return { sublist, subset };
}

/** All-pairs BFS distances (INF when unreachable), row-major. */
function allDistances(g: StateGraph): Int32Array {
  const n = g.states.size;
  const d = new Int32Array(n * n).fill(INF);
  const queue = new Int32Array(n);
  for (let s = 0; s < n; s++) {
    const row = s * n;
    let head = 0;
    let tail = 0;
    queue[tail++] = s;
    d[row + s] = 0;
    while (head < tail) {
      poll("measuring the state graph");
      const v = queue[head++];
      for (let e = g.edgeStart[v]; e < g.edgeStart[v + 1]; e++) {
        const u = g.edgeTarget[e];
        if (d[row + u] === INF) {
          d[row + u] = d[row + v] + 1;
          queue[tail++] = u;
        }
      }
    }
  }
  return d;
}

/**
 * The fewest actions, taken from the multiset `actions` in any order, leading from x to u
 * (at most `ub`, which the run's own shortest sub-sequence achieves). Breadth-first over
 * (state, how many of each action are used), pruned by the distance lower bound.
 */
function subsetMinimum(
  x: number,
  u: number,
  actions: Int32Array,
  ub: number,
  succ: Int32Array,
  n: number,
  dist: Int32Array,
  maxSpace: number,
): { exact: boolean; lower: number; upper: number } {
  const lb = dist[x * n + u];
  if (lb >= ub) return { exact: true, lower: ub, upper: ub };
  const counts = new Map<number, number>();
  for (const a of actions) counts.set(a, (counts.get(a) ?? 0) + 1);
  const distinct = [...counts.keys()].sort((p, q) => p - q);
  const mult = distinct.map((a) => counts.get(a)!);
  const radix: number[] = [];
  let R = 1;
  for (const m of mult) {
    radix.push(R);
    R *= m + 1;
  }
  if (R * n > maxSpace) return { exact: false, lower: lb, upper: ub };
  const seen = new Set<number>();
  let frontier: number[] = [x * R];
  seen.add(x * R);
  for (let depth = 1; depth < ub; depth++) {
    const next: number[] = [];
    for (const key of frontier) {
      poll("measuring the state graph");
      const s = Math.floor(key / R);
      const code = key - s * R;
      for (let i = 0; i < distinct.length; i++) {
        const used = Math.floor(code / radix[i]) % (mult[i] + 1);
        if (used >= mult[i]) continue;
        const t = succ[distinct[i] * n + s];
        if (t < 0) continue;
        if (t === u) return { exact: true, lower: depth, upper: depth };
        if (depth + dist[t * n + u] >= ub) continue;
        const k2 = t * R + code + radix[i];
        if (!seen.has(k2)) {
          seen.add(k2);
          next.push(k2);
        }
      }
    }
    frontier = next;
    if (frontier.length === 0) break;
  }
  return { exact: true, lower: ub, upper: ub };
}
