// Acyclicity of a graph whose edges are switched on by literals, as CNF by vertex elimination
// (Rankooh and Rintanen, AAAI 2022): the relaxed suffix's support graph must have no cycle.

/** Where the clauses and the fresh edge variables go (a CnfBuilder, or a counter for sizing). */
export interface AcyclicSink {
  newVar(label: string): number;
  addClause(lits: ArrayLike<number>, n?: number): void;
}

export interface AcyclicStats {
  /** Edges created by elimination (fresh variables). */
  fillEdges: number;
  clauses: number;
}

/** Thrown by `emitAcyclic` when elimination would create more than `maxClauses` clauses. */
export class AcyclicTooLarge extends Error {}

/**
 * Emits clauses that hold exactly when the graph of true edges is acyclic (for a suitable value
 * of the fresh variables). `edges[i] = [u, v, lit]`: edge u → v is present when `lit` is true
 * (vertices 0..n−1; u ≠ v; several edges may share a literal; a repeated (u, v) keeps its first
 * literal). Vertices are eliminated one at a time, each time the one with the fewest
 * in-neighbour × out-neighbour pairs among those left (ties: the smaller vertex); eliminating v,
 * for each remaining in-neighbour u (ascending by when the edge was made) and out-neighbour w
 * (likewise): if u = w, the clause [¬e(u,v), ¬e(v,u)]; otherwise the clause
 * [¬e(u,v), ¬e(v,w), e(u,w)], where e(u,w) is a new variable when there is no edge u → w yet (an
 * edge from then on), and when u → w is an edge of the input with literal x, a new variable p
 * with the clause [¬x, p] first, p standing for the edge from then on (an input literal is never
 * forced: it means something else to the caller).
 *
 * Why it is right. Acyclic ⇒ satisfiable: set every new variable of an edge u → w to "u reaches w
 * by true edges"; each clause then holds (reachability is transitive and contains the edges),
 * and no 2-cycle clause is violated since nothing reaches itself. Cyclic ⇒ unsatisfiable: take a
 * cycle of true edges and its vertex v eliminated first; its cycle neighbours u → v → w were
 * still present then (an input edge's stand-in is true with it), so either u = w and a clause
 * forbids the 2-cycle, or the edge u → w is forced true, giving a shorter cycle of true edges
 * among vertices eliminated later; by induction on the length, a contradiction.
 */
export function emitAcyclic(sink: AcyclicSink, n: number, edges: readonly (readonly [number, number, number])[], maxClauses = Infinity): AcyclicStats {
  const outs: Map<number, number>[] = [];
  const ins: Map<number, number>[] = [];
  for (let v = 0; v < n; v++) {
    outs.push(new Map());
    ins.push(new Map());
  }
  for (const [u, v, lit] of edges) {
    if (u === v || u < 0 || v < 0 || u >= n || v >= n) throw new RangeError(`encode: bad support edge ${u} -> ${v}`);
    if (outs[u].has(v)) continue;
    outs[u].set(v, lit);
    ins[v].set(u, lit);
  }
  const fresh = new Set<number>(); // literals this function made (may be forced)
  const gone = new Uint8Array(n);
  const score = (v: number) => ins[v].size * outs[v].size;
  // a binary heap of (score, vertex) with lazy deletion: stale entries are skipped
  const heap = new MinHeap();
  for (let v = 0; v < n; v++) heap.push(score(v), v);
  const stats: AcyclicStats = { fillEdges: 0, clauses: 0 };
  const c2 = new Int32Array(2);
  const c3 = new Int32Array(3);
  const touched: number[] = [];
  while (heap.size > 0) {
    const [s, v] = heap.pop();
    if (gone[v] || s !== score(v)) continue;
    gone[v] = 1;
    touched.length = 0;
    const inList = [...ins[v]];
    const outList = [...outs[v]];
    for (const [u, luv] of inList) {
      for (const [w, lvw] of outList) {
        if (u === w) {
          c2[0] = -luv;
          c2[1] = -lvw;
          sink.addClause(c2, 2);
          stats.clauses++;
        } else {
          let luw = outs[u].get(w);
          if (luw === undefined || !fresh.has(luw)) {
            const p = sink.newVar("suffix-order");
            fresh.add(p);
            stats.fillEdges++;
            if (luw !== undefined) {
              c2[0] = -luw;
              c2[1] = p;
              sink.addClause(c2, 2);
              stats.clauses++;
            }
            luw = p;
            outs[u].set(w, luw);
            ins[w].set(u, luw);
          }
          c3[0] = -luv;
          c3[1] = -lvw;
          c3[2] = luw;
          sink.addClause(c3, 3);
          stats.clauses++;
        }
        if (stats.clauses > maxClauses) throw new AcyclicTooLarge(`acyclicity by vertex elimination needs more than ${maxClauses} clauses`);
      }
    }
    for (const [u] of inList) {
      outs[u].delete(v);
      touched.push(u);
    }
    for (const [w] of outList) {
      ins[w].delete(v);
      touched.push(w);
    }
    ins[v].clear();
    outs[v].clear();
    for (const x of touched) if (!gone[x]) heap.push(score(x), x);
  }
  return stats;
}

/** Min-heap of (key, vertex) pairs ordered by key, then vertex. */
class MinHeap {
  private keys: number[] = [];
  private vals: number[] = [];
  get size(): number {
    return this.keys.length;
  }
  private less(i: number, j: number): boolean {
    return this.keys[i] < this.keys[j] || (this.keys[i] === this.keys[j] && this.vals[i] < this.vals[j]);
  }
  private swap(i: number, j: number): void {
    [this.keys[i], this.keys[j]] = [this.keys[j], this.keys[i]];
    [this.vals[i], this.vals[j]] = [this.vals[j], this.vals[i]];
  }
  push(key: number, val: number): void {
    this.keys.push(key);
    this.vals.push(val);
    let i = this.keys.length - 1;
    while (i > 0) {
      const p = (i - 1) >> 1;
      if (!this.less(i, p)) break;
      this.swap(i, p);
      i = p;
    }
  }
  pop(): [number, number] {
    const top: [number, number] = [this.keys[0], this.vals[0]];
    const lastK = this.keys.pop()!;
    const lastV = this.vals.pop()!;
    if (this.keys.length > 0) {
      this.keys[0] = lastK;
      this.vals[0] = lastV;
      let i = 0;
      for (;;) {
        const l = 2 * i + 1;
        const r = l + 1;
        let m = i;
        if (l < this.keys.length && this.less(l, m)) m = l;
        if (r < this.keys.length && this.less(r, m)) m = r;
        if (m === i) break;
        this.swap(i, m);
        i = m;
      }
    }
    return top;
  }
}
