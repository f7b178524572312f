// Applicable-action lookup without scanning every action: a decision tree over facts.
// Each node tests one fact; actions needing it true, false, or not at all go to three children.
import type { Task } from "../ground/task.js";
import { poll } from "../util/limits.js";

/**
 * Flattened tree. Node n tests fact nodeFact[n] and lists the actions whose conditions are
 * all decided on the way to n (immediate[immStart[n] .. immStart[n+1])). From n the lookup
 * continues at nodeTrue[n] if the fact holds, at nodeFalse[n] if it does not, and always at
 * nodeAny[n] (actions that do not mention the fact); -1 means no child.
 */
export class SuccessorTree {
  readonly nodeFact: Int32Array;
  readonly nodeTrue: Int32Array;
  readonly nodeFalse: Int32Array;
  readonly nodeAny: Int32Array;
  readonly immStart: Int32Array;
  readonly immediate: Int32Array;
  private readonly stack: Int32Array;

  constructor(task: Task) {
    // conditions per action as sorted literal lists: fact*2 + (1 if negative)
    const lits: Int32Array[] = task.actions.map((a) => {
      const l: number[] = [];
      for (const f of a.pre) l.push(f * 2);
      for (const f of a.preNeg) l.push(f * 2 + 1);
      l.sort((x, y) => x - y);
      return Int32Array.from(l);
    });
    const pos = new Int32Array(task.actions.length);
    const fact: number[] = [];
    const tChild: number[] = [];
    const fChild: number[] = [];
    const aChild: number[] = [];
    const imm: number[][] = [];
    const newNode = (): number => {
      fact.push(-1);
      tChild.push(-1);
      fChild.push(-1);
      aChild.push(-1);
      imm.push([]);
      return fact.length - 1;
    };
    // iterative construction (trees can be deeper than the call stack allows)
    const jobs: Array<{ node: number; acts: number[] }> = [{ node: newNode(), acts: task.actions.map((_, i) => i) }];
    while (jobs.length > 0) {
      const { node, acts } = jobs.pop()!;
      let v = Infinity;
      const rest: number[] = [];
      for (const a of acts) {
        poll("building the successor generator");
        if (pos[a] === lits[a].length) imm[node].push(a);
        else {
          rest.push(a);
          v = Math.min(v, lits[a][pos[a]] >> 1);
        }
      }
      if (rest.length === 0) continue;
      fact[node] = v;
      const t: number[] = [];
      const f: number[] = [];
      const any: number[] = [];
      for (const a of rest) {
        poll("building the successor generator");
        const lit = lits[a][pos[a]];
        if (lit >> 1 !== v) any.push(a);
        else {
          // a fact both required and forbidden leaves the action inapplicable: consume both
          let neg = false;
          let posLit = false;
          while (pos[a] < lits[a].length && lits[a][pos[a]] >> 1 === v) {
            if (lits[a][pos[a]] & 1) neg = true;
            else posLit = true;
            pos[a]++;
          }
          if (neg && posLit) continue;
          (neg ? f : t).push(a);
        }
      }
      if (t.length > 0) jobs.push({ node: (tChild[node] = newNode()), acts: t });
      if (f.length > 0) jobs.push({ node: (fChild[node] = newNode()), acts: f });
      if (any.length > 0) jobs.push({ node: (aChild[node] = newNode()), acts: any });
    }
    const n = fact.length;
    this.nodeFact = Int32Array.from(fact);
    this.nodeTrue = Int32Array.from(tChild);
    this.nodeFalse = Int32Array.from(fChild);
    this.nodeAny = Int32Array.from(aChild);
    this.immStart = new Int32Array(n + 1);
    let k = 0;
    for (let i = 0; i < n; i++) {
      this.immStart[i] = k;
      k += imm[i].length;
    }
    this.immStart[n] = k;
    this.immediate = new Int32Array(k);
    k = 0;
    for (const l of imm) for (const a of l) this.immediate[k++] = a;
    this.stack = new Int32Array(n + 1);
  }

  get size(): number {
    return this.nodeFact.length;
  }

  /**
   * Writes the ids of the actions applicable in the packed state s[off..] into `out`
   * (which must hold every action) and returns how many there are.
   */
  applicable(s: Uint32Array, off: number, out: Int32Array): number {
    const stack = this.stack;
    let sp = 0;
    let n = 0;
    stack[sp++] = 0;
    while (sp > 0) {
      const node = stack[--sp];
      for (let k = this.immStart[node]; k < this.immStart[node + 1]; k++) out[n++] = this.immediate[k];
      const f = this.nodeFact[node];
      if (f < 0) continue;
      const any = this.nodeAny[node];
      if (any >= 0) stack[sp++] = any;
      const next = (s[off + (f >>> 5)] & (1 << (f & 31))) !== 0 ? this.nodeTrue[node] : this.nodeFalse[node];
      if (next >= 0) stack[sp++] = next;
    }
    return n;
  }
}
