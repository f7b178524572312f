// The variable dependency graph of a Task (v → u when an action reads or writes v and
// writes u) and its strongly connected components in a deterministic topological order.
import type { Action, Task } from "../ground/task.js";
import { IdHeap } from "./heap.js";
import type { Variables } from "./variables.js";
import { poll } from "../util/limits.js";

export interface DependencyGraph {
  /** Number of variables. */
  size: number;
  /** Sorted successor lists: v → u for u in succ[v] (no self-loops). */
  succ: number[][];
  /** Strongly connected components (sorted variable lists), parents before children. */
  sccs: number[][];
  /** Variable → index into sccs. */
  sccOf: Int32Array;
  /** SCC index → sorted indices of the SCCs with an edge into it. */
  parents: number[][];
  /** SCC index → sorted indices of the SCCs it has an edge into. */
  children: number[][];
}

/** Variables an action reads: its precondition and the conditions of its conditional effects. */
export function readVariables(a: Action, varOfFact: Int32Array): number[] {
  const s = new Set<number>();
  for (const f of a.pre) s.add(varOfFact[f]);
  for (const f of a.preNeg) s.add(varOfFact[f]);
  for (const ce of a.cond) {
    for (const f of ce.cond) s.add(varOfFact[f]);
    for (const f of ce.condNeg) s.add(varOfFact[f]);
  }
  return [...s].sort((x, y) => x - y);
}

/** Variables an action may write: every add and delete, conditional or not. */
export function writtenVariables(a: Action, varOfFact: Int32Array): number[] {
  const s = new Set<number>();
  for (const f of a.add) s.add(varOfFact[f]);
  for (const f of a.del) s.add(varOfFact[f]);
  for (const ce of a.cond) {
    for (const f of ce.add) s.add(varOfFact[f]);
    for (const f of ce.del) s.add(varOfFact[f]);
  }
  return [...s].sort((x, y) => x - y);
}

/**
 * Edges v → u (v ≠ u) whenever some included action has v among the variables it reads or
 * writes and u among those it writes. Conditions of conditional effects count as reads of
 * the whole action (a superset of the needed edges, which keeps every bound built on it
 * sound). Consequences the bounds rely on: all variables one action writes lie in one SCC,
 * and everything an action reads lies in that SCC or in a parent of it.
 */
export function dependencyGraph(task: Task, vars: Variables, include: (a: Action, index: number) => boolean = () => true): DependencyGraph {
  const n = vars.variables.length;
  const sets: Set<number>[] = Array.from({ length: n }, () => new Set<number>());
  task.actions.forEach((a, i) => {
    if (!include(a, i)) return;
    const w = writtenVariables(a, vars.varOfFact);
    if (w.length === 0) return;
    const r = readVariables(a, vars.varOfFact);
    for (const u of w) {
      poll("analysis: dependency");
      for (const v of r) if (v !== u) sets[v].add(u);
      for (const v of w) if (v !== u) sets[v].add(u);
    }
  });
  const succ = sets.map((s) => [...s].sort((x, y) => x - y));
  return withComponents(n, succ);
}

/** SCCs (Tarjan, iterative) and their topological order with ties broken by smallest variable. */
export function withComponents(n: number, succ: number[][]): DependencyGraph {
  const index = new Int32Array(n).fill(-1);
  const low = new Int32Array(n);
  const onStack = new Uint8Array(n);
  const stack: number[] = [];
  const comps: number[][] = [];
  let counter = 0;
  const edgePos = new Int32Array(n);
  for (let root = 0; root < n; root++) {
    if (index[root] >= 0) continue;
    const call: number[] = [root];
    index[root] = low[root] = counter++;
    stack.push(root);
    onStack[root] = 1;
    while (call.length > 0) {
      poll("analysis: dependency");
      const v = call[call.length - 1];
      if (edgePos[v] < succ[v].length) {
        const u = succ[v][edgePos[v]++];
        if (index[u] < 0) {
          index[u] = low[u] = counter++;
          stack.push(u);
          onStack[u] = 1;
          call.push(u);
        } else if (onStack[u]) low[v] = Math.min(low[v], index[u]);
      } else {
        call.pop();
        if (call.length > 0) {
          const p = call[call.length - 1];
          low[p] = Math.min(low[p], low[v]);
        }
        if (low[v] === index[v]) {
          const comp: number[] = [];
          for (;;) {
            const w = stack.pop()!;
            onStack[w] = 0;
            comp.push(w);
            if (w === v) break;
          }
          comps.push(comp.sort((x, y) => x - y));
        }
      }
    }
  }
  // order components: Kahn's algorithm, always taking the ready component with the smallest variable
  const compOf = new Int32Array(n);
  comps.forEach((c, i) => c.forEach((v) => (compOf[v] = i)));
  const cParents: Set<number>[] = comps.map(() => new Set<number>());
  const cChildren: Set<number>[] = comps.map(() => new Set<number>());
  for (let v = 0; v < n; v++)
    for (const u of succ[v]) {
      const a = compOf[v];
      const b = compOf[u];
      if (a !== b) {
        cChildren[a].add(b);
        cParents[b].add(a);
      }
    }
  const indeg = comps.map((_, i) => cParents[i].size);
  const ready = new IdHeap((a, b) => comps[a][0] < comps[b][0]);
  comps.forEach((_, i) => {
    if (indeg[i] === 0) ready.push(i);
  });
  const order: number[] = [];
  while (ready.size > 0) {
    poll("analysis: dependency");
    const c = ready.pop();
    order.push(c);
    for (const d of cChildren[c]) if (--indeg[d] === 0) ready.push(d);
  }
  const pos = new Int32Array(comps.length);
  order.forEach((c, i) => (pos[c] = i));
  const sccs = order.map((c) => comps[c]);
  const sccOf = new Int32Array(n);
  sccs.forEach((c, i) => c.forEach((v) => (sccOf[v] = i)));
  const parents = order.map((c) => [...cParents[c]].map((p) => pos[p]).sort((x, y) => x - y));
  const children = order.map((c) => [...cChildren[c]].map((p) => pos[p]).sort((x, y) => x - y));
  return { size: n, succ, sccs, sccOf, parents, children };
}

