// The graph measures the bounds are built from — condensation (components, largest component,
// heaviest component path) and reachability (largest reachable set, largest BFS distance) —
// against naive computations straight from the definitions on random small graphs.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { condense } from "../../src/horizon/condensation.js";
import { toCsr } from "../../src/horizon/projection.js";
import { largestReachableSet, reachStats } from "../../src/horizon/reach.js";

/** Random directed graphs with up to 9 nodes; self-loops and repeated edges included. */
const graphArb = fc.integer({ min: 1, max: 9 }).chain((n) =>
  fc.record({ n: fc.constant(n), edges: fc.array(fc.tuple(fc.nat({ max: n - 1 }), fc.nat({ max: n - 1 })), { maxLength: 20 }) }),
);

/** dist[u][v]: BFS distance, -1 when v is not reachable from u. */
function distances(n: number, edges: Array<[number, number]>): number[][] {
  const out: number[][] = [];
  for (let s = 0; s < n; s++) {
    const d = new Array<number>(n).fill(-1);
    d[s] = 0;
    const queue = [s];
    for (let i = 0; i < queue.length; i++)
      for (const [a, b] of edges)
        if (a === queue[i] && d[b] < 0) {
          d[b] = d[a] + 1;
          queue.push(b);
        }
    out.push(d);
  }
  return out;
}

/** The largest total size of the components met along one path of the component DAG. */
function heaviestPath(n: number, dist: number[][]): { comps: number; largest: number; heaviest: number } {
  const comp = new Array<number>(n).fill(-1);
  const sizes: number[] = [];
  for (let v = 0; v < n; v++) {
    if (comp[v] >= 0) continue;
    const c = sizes.length;
    sizes.push(0);
    for (let u = 0; u < n; u++) if (dist[v][u] >= 0 && dist[u][v] >= 0) (comp[u] = c), sizes[c]++;
  }
  const memo = new Map<number, number>();
  const best = (c: number): number => {
    if (memo.has(c)) return memo.get(c)!;
    let tail = 0;
    for (let d = 0; d < sizes.length; d++) {
      if (d === c) continue;
      const u = comp.indexOf(c);
      const w = comp.indexOf(d);
      if (dist[u][w] >= 0) tail = Math.max(tail, best(d));
    }
    memo.set(c, sizes[c] + tail);
    return sizes[c] + tail;
  };
  return { comps: sizes.length, largest: Math.max(...sizes), heaviest: Math.max(...sizes.map((_, c) => best(c))) };
}

describe("graph measures against their definitions", () => {
  it("condensation: components, largest component, heaviest component path, acyclicity", () => {
    fc.assert(
      fc.property(graphArb, ({ n, edges }) => {
        const [start, target] = toCsr(n, edges.map((e) => e[0]), edges.map((e) => e[1]));
        const got = condense(n, start, target);
        // source: definitions (mutual reachability classes; longest path in the component DAG), computed naively
        const want = heaviestPath(n, distances(n, edges));
        expect(got.components).toBe(want.comps);
        expect(got.largestComponent).toBe(want.largest);
        expect(got.heaviestPath).toBe(want.heaviest);
        expect(got.acyclic).toBe(want.largest === 1);
      }),
      { numRuns: 300, seed: 5400 },
    );
  });

  it("reachability: largest reachable set and largest BFS distance; the fallback is an upper bound", () => {
    fc.assert(
      fc.property(graphArb, ({ n, edges }) => {
        const [start, target] = toCsr(n, edges.map((e) => e[0]), edges.map((e) => e[1]));
        const dist = distances(n, edges);
        // source: definitions (BFS from every node), computed naively
        const largestSet = Math.max(...dist.map((d) => d.filter((x) => x >= 0).length));
        const largestDistance = Math.max(...dist.flat());
        const r = reachStats(n, start, target);
        expect(r.largestSet).toBe(largestSet);
        expect(r.largestDistance).toBe(largestDistance);
        expect(largestReachableSet(n, start, target)).toBe(largestSet);
        // past the component cap: the number of nodes, never less than the truth
        expect(largestReachableSet(n, start, target, 0)).toBeGreaterThanOrEqual(largestSet);
        // past the work cap: no distance, and the set by condensation
        const capped = reachStats(n, start, target, 0);
        if (capped.largestDistance === null) expect(capped.largestSet).toBeGreaterThanOrEqual(largestSet);
        else expect(capped.largestDistance).toBe(largestDistance);
      }),
      { numRuns: 300, seed: 5401 },
    );
  });
});
