// Condensation of a small explicit graph (CSR): its strongly connected components, the largest
// one, and the heaviest path through the component DAG — what the affine block bounds need.
import { poll } from "../util/limits.js";

export interface Condensation {
  /** Number of nodes. */
  states: number;
  /** Number of strongly connected components. */
  components: number;
  /** Nodes in the largest component. */
  largestComponent: number;
  /** Largest total number of nodes in the components along one path of the component DAG. */
  heaviestPath: number;
  /** No cycle through two distinct nodes (every component is a single node). */
  acyclic: boolean;
}

/**
 * Tarjan's algorithm (iterative) over CSR edges; self-loops and repeated edges are harmless.
 * Components are emitted sinks first, so one pass in emission order gives, for each component,
 * the heaviest path starting in it.
 */
export function condense(n: number, start: Int32Array, target: Int32Array): Condensation {
  if (n === 0) return { states: 0, components: 0, largestComponent: 0, heaviestPath: 0, acyclic: true };
  const index = new Int32Array(n).fill(-1);
  const low = new Int32Array(n);
  const comp = new Int32Array(n).fill(-1);
  const onStack = new Uint8Array(n);
  const stack = new Int32Array(n);
  const call = new Int32Array(n);
  const edgePos = new Int32Array(n);
  let sp = 0;
  let counter = 0;
  let comps = 0;
  const sizes: number[] = [];
  const heavy: number[] = [];
  let largest = 0;
  let heaviest = 0;
  for (let root = 0; root < n; root++) {
    if (index[root] >= 0) continue;
    let cp = 0;
    call[cp++] = root;
    index[root] = low[root] = counter++;
    stack[sp++] = root;
    onStack[root] = 1;
    edgePos[root] = start[root];
    while (cp > 0) {
      poll("computing the horizon");
      const v = call[cp - 1];
      if (edgePos[v] < start[v + 1]) {
        const u = target[edgePos[v]++];
        if (index[u] < 0) {
          index[u] = low[u] = counter++;
          stack[sp++] = u;
          onStack[u] = 1;
          edgePos[u] = start[u];
          call[cp++] = u;
        } else if (onStack[u] && index[u] < low[v]) low[v] = index[u];
        continue;
      }
      cp--;
      if (cp > 0) {
        const p = call[cp - 1];
        if (low[v] < low[p]) low[p] = low[v];
      }
      if (low[v] !== index[v]) continue;
      // v is the root of a component: pop it, then its heaviest outgoing path
      const c = comps++;
      let size = 0;
      let first = sp;
      do {
        const w = stack[--sp];
        onStack[w] = 0;
        comp[w] = c;
        size++;
        first = sp;
      } while (stack[sp] !== v);
      let best = 0;
      for (let i = first; i < first + size; i++) {
        poll("computing the horizon");
        const w = stack[i];
        for (let e = start[w]; e < start[w + 1]; e++) {
          const d = comp[target[e]];
          if (d !== c && heavy[d] > best) best = heavy[d];
        }
      }
      sizes.push(size);
      heavy.push(size + best);
      if (size > largest) largest = size;
      if (size + best > heaviest) heaviest = size + best;
    }
  }
  return { states: n, components: comps, largestComponent: largest, heaviestPath: heaviest, acyclic: largest === 1 };
}
