// Reachability statistics of a small explicit graph (CSR): the largest set of states one
// state reaches, and the largest BFS distance — what the zero-cost bounds need.
import { withComponents } from "../analyse/index.js";
import { poll } from "../util/limits.js";

export interface ReachStats {
  /** Largest number of states reachable from one state (itself included). */
  largestSet: number;
  /** Largest shortest-path distance from a state to one it reaches; null when not computed. */
  largestDistance: number | null;
  /** BFS work spent (nodes plus edges visited). */
  work: number;
}

/**
 * BFS from every state with an out-edge, while the total work stays within `maxWork`
 * (exact). Past that: the largest set by SCC condensation and reachability bitsets when the
 * condensation is small enough, else the number of states (an upper bound); no distance.
 */
export function reachStats(n: number, start: Int32Array, target: Int32Array, maxWork = 50_000_000): ReachStats {
  if (n === 0) return { largestSet: 0, largestDistance: 0, work: 0 };
  const dist = new Int32Array(n).fill(-1);
  const queue = new Int32Array(n);
  let largestSet = 1;
  let largestDistance = 0;
  let work = 0;
  for (let s = 0; s < n; s++) {
    if (start[s + 1] === start[s]) continue;
    let head = 0;
    let tail = 0;
    queue[tail++] = s;
    dist[s] = 0;
    while (head < tail) {
      poll("computing the horizon");
      const v = queue[head++];
      if (dist[v] > largestDistance) largestDistance = dist[v];
      work += 1 + start[v + 1] - start[v];
      for (let e = start[v]; e < start[v + 1]; e++) {
        const u = target[e];
        if (dist[u] < 0) {
          dist[u] = dist[v] + 1;
          queue[tail++] = u;
        }
      }
    }
    if (tail > largestSet) largestSet = tail;
    for (let i = 0; i < tail; i++) dist[queue[i]] = -1;
    if (work > maxWork) return { largestSet: largestReachableSet(n, start, target), largestDistance: null, work };
  }
  return { largestSet, largestDistance, work };
}

/**
 * The largest number of states reachable (including the start) from one state. Exact via SCC
 * condensation and reachability bitsets when the condensation has at most `maxComponents`
 * components; otherwise the number of states (an upper bound).
 */
export function largestReachableSet(n: number, start: Int32Array, target: Int32Array, maxComponents = 8192): number {
  if (n === 0) return 0;
  const succ: number[][] = [];
  for (let v = 0; v < n; v++) {
    const out = new Set<number>();
    for (let e = start[v]; e < start[v + 1]; e++) if (target[e] !== v) out.add(target[e]);
    succ.push([...out]);
  }
  const g = withComponents(n, succ);
  const C = g.sccs.length;
  if (C > maxComponents) return n;
  const W = Math.ceil(C / 32);
  const reach = new Uint32Array(C * W);
  let best = 0;
  for (let c = C - 1; c >= 0; c--) {
    poll("computing the horizon");
    const base = c * W;
    reach[base + (c >>> 5)] |= 1 << (c & 31);
    for (const d of g.children[c]) for (let w = 0; w < W; w++) reach[base + w] |= reach[d * W + w];
    let count = 0;
    for (let w = 0; w < W; w++) {
      let x = reach[base + w];
      while (x !== 0) {
        const low = x & -x;
        count += g.sccs[w * 32 + (31 - Math.clz32(low))].length;
        x ^= low;
      }
    }
    if (count > best) best = count;
  }
  return best;
}
