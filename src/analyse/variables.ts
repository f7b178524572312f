// Finite-domain variables of a Task: mutex groups from h² pair reachability, chosen by a
// greedy clique cover, so that every fact belongs to exactly one variable.
import type { Task } from "../ground/task.js";
import type { PairReachability } from "./h2.js";
import { popcount32 } from "./state-store.js";
import { poll } from "../util/limits.js";

/**
 * Method (and why): h² mutexes (Haslum & Geffner 2000) on the ground Task, covered greedily
 * by cliques of pairwise-mutex facts. Invariant synthesis on the lifted model would give
 * groups that follow the schemas, but it needs the lifted model; this stage works on the
 * ground Task only (any front end, any compilation of ADL), and h² also sees mutexes that
 * come from the initial state. The price is quadratic memory in the number of facts, so
 * above a size limit the pair analysis is skipped and every fact becomes its own variable
 * (always sound, only less tight).
 */
export const VARIABLES_METHOD = "h2-mutex-groups/greedy-clique-cover";

export interface Variable {
  id: number;
  /** Fact ids (sorted); at most one of them is true in any reachable state. */
  facts: number[];
  /**
   * True when the group may be all-false in a reachable state, so the variable has an extra
   * value "none of these". False only when proven: exactly one fact initially true, and every
   * effect that may delete a fact of the group adds one (unconditionally, or in the same
   * conditional effect).
   */
  hasNone: boolean;
}

export interface Variables {
  method: string;
  note: string;
  variables: Variable[];
  /** Fact id → variable id. */
  varOfFact: Int32Array;
}

/** Number of values of a variable: its facts, plus "none of these" when needed. */
export function valueCount(v: Variable): number {
  return v.facts.length + (v.hasNone ? 1 : 0);
}

export function findVariables(task: Task, pairs: PairReachability): Variables {
  const F = task.facts.length;
  const groups: number[][] = [];
  const covered = new Uint8Array(F);
  let note: string;
  if (pairs.method === "h2" && F > 0) {
    const W = Math.ceil(F / 32);
    const reachMask = new Uint32Array(W);
    for (let f = 0; f < F; f++) if (pairs.reachable(f)) reachMask[f >>> 5] |= 1 << (f & 31);
    // mutex neighbours of f among reachable facts: not together, not f itself
    const nbrs = (f: number, out: Uint32Array): Uint32Array => {
      const row = pairs.row(f)!;
      for (let w = 0; w < W; w++) out[w] = ~row[w] & reachMask[w];
      out[f >>> 5] &= ~(1 << (f & 31));
      return out;
    };
    const tmp = new Uint32Array(W);
    const degree = new Int32Array(F);
    for (let f = 0; f < F; f++) {
      poll("analysis: variables");
      if (!pairs.reachable(f)) continue;
      nbrs(f, tmp);
      let d = 0;
      for (let w = 0; w < W; w++) d += popcount32(tmp[w]);
      degree[f] = d;
    }
    const order = [...Array(F).keys()].filter((f) => pairs.reachable(f)).sort((a, b) => degree[b] - degree[a] || a - b);
    const rank = new Int32Array(F);
    order.forEach((f, i) => (rank[f] = i));
    const uncovered = reachMask.slice();
    const cand = new Uint32Array(W);
    const nb = new Uint32Array(W);
    for (const seed of order) {
      poll("analysis: variables");
      if (covered[seed]) continue;
      const group = [seed];
      covered[seed] = 1;
      uncovered[seed >>> 5] &= ~(1 << (seed & 31));
      nbrs(seed, cand);
      for (let w = 0; w < W; w++) cand[w] &= uncovered[w];
      for (;;) {
        poll("analysis: variables");
        const members = bitsOf(cand);
        if (members.length === 0) break;
        let best = -1;
        let bestScore = -1;
        if (members.length <= 256) {
          for (const g of members) {
            nbrs(g, nb);
            let score = 0;
            for (let w = 0; w < W; w++) score += popcount32(nb[w] & cand[w]);
            if (score > bestScore || (score === bestScore && rank[g] < rank[best])) {
              best = g;
              bestScore = score;
            }
          }
        } else {
          for (const g of members) if (best < 0 || rank[g] < rank[best]) best = g;
        }
        group.push(best);
        covered[best] = 1;
        uncovered[best >>> 5] &= ~(1 << (best & 31));
        nbrs(best, nb);
        for (let w = 0; w < W; w++) cand[w] &= nb[w];
      }
      groups.push(group.sort((a, b) => a - b));
    }
    note = `h2 pair analysis (${pairs.note}); unreachable facts are singleton variables`;
  } else {
    note = pairs.method === "h2" ? "no facts" : `no mutexes: ${pairs.note}; every fact is its own variable`;
  }
  for (let f = 0; f < F; f++) if (!covered[f]) groups.push([f]);
  groups.sort((a, b) => a[0] - b[0]);
  const varOfFact = new Int32Array(F).fill(-1);
  const variables: Variable[] = groups.map((facts, id) => {
    for (const f of facts) varOfFact[f] = id;
    return { id, facts, hasNone: true };
  });
  for (const v of variables) v.hasNone = !exactlyOne(task, v.facts, varOfFact, v.id);
  return { method: VARIABLES_METHOD, note, variables, varOfFact };
}

function bitsOf(words: Uint32Array): number[] {
  const out: number[] = [];
  for (let w = 0; w < words.length; w++) {
    let x = words[w];
    while (x !== 0) {
      const low = x & -x;
      out.push(w * 32 + (31 - Math.clz32(low)));
      x ^= low;
    }
  }
  return out;
}

/**
 * Given that the facts are pairwise mutex: is exactly one of them true in every reachable
 * state? Initially exactly one; and every effect unit that may delete a member adds a member
 * whenever it takes effect (adds win over deletes in the Task semantics).
 */
function exactlyOne(task: Task, facts: number[], varOfFact: Int32Array, id: number): boolean {
  const inGroup = (f: number) => varOfFact[f] === id;
  if (task.init.filter(inGroup).length !== 1) return false;
  for (const a of task.actions) {
    poll("analysis: variables");
    const addsUncond = a.add.some(inGroup);
    if (a.del.some(inGroup) && !addsUncond) return false;
    for (const ce of a.cond) if (ce.del.some(inGroup) && !addsUncond && !ce.add.some(inGroup)) return false;
  }
  return facts.length > 0;
}
