// The cost circuits' inputs: OR-words over actions that can never share a step (bit words for
// seq-1, one word per same-cost clique for forall-2), plain action literals, and cost-unary-1's groups.
import type { Task } from "../ground/task.js";
import { bitsOf, type CostGroup } from "./adder.js";
import type { CnfBuilder } from "./cnf.js";
import type { Family } from "./interference.js";
import type { Layout } from "./layout.js";
import type { TaskInfo } from "./task-info.js";

/** Part reach-1: may action a be taken in step s? (Without the part every action may.) */
export type Possible = (s: number, a: number) => boolean;

/**
 * seq-1 (spec cost-adder-1, "bit words"): `members` can never share a step. For s = 1..T, for
 * each bit j (ascending) set in some member's cost: a fresh W and (¬a@s ∨ W) for each member a
 * (ascending) with bit j. Groups: for j ascending, weight 2^j with the W of bit j, s ascending.
 * With `possible` (part reach-1) impossible members are left out, and a word without a possible
 * member is not created.
 */
export function bitWordGroups(task: Task, cnf: CnfBuilder, L: Layout, members: readonly number[], possible?: Possible): CostGroup[] {
  const byBit: number[][] = [];
  for (const a of members)
    for (const j of bitsOf(task.actions[a].cost)) {
      while (byBit.length <= j) byBit.push([]);
      byBit[j].push(a);
    }
  const words: number[][] = byBit.map(() => []);
  for (let s = 1; s <= L.steps; s++) {
    for (let j = 0; j < byBit.length; j++) {
      if (byBit[j].length === 0) continue;
      if (possible && !byBit[j].some((a) => possible(s, a))) continue;
      const w = cnf.newVar("cost-word");
      for (const a of byBit[j]) if (!possible || possible(s, a)) cnf.add2(-L.action(s, a), w);
      words[j].push(w);
    }
  }
  const groups: CostGroup[] = [];
  words.forEach((ws, j) => {
    if (ws.length > 0) groups.push({ weight: 2 ** j, lits: ws });
  });
  return groups;
}

/**
 * forall-1 / forall-2 ("cost classes"): `cliques` are sets of same-cost actions of which at
 * most one can be taken per step (the caller guarantees it by clauses already in the CNF).
 * For s = 1..T, for each clique k in order: a fresh W and (¬a@s ∨ W) for each member a
 * (ascending). Groups: for each distinct positive cost c (ascending), weight c with, for s
 * ascending, the W of the cliques of cost c (clique order), then a@s for each action a of
 * cost c not in a clique (ascending). With `possible` (part reach-1) impossible actions are left
 * out, and a clique word without a possible member is not created.
 */
export function costClassGroups(task: Task, cnf: CnfBuilder, L: Layout, cliques: readonly number[][], possible?: Possible): CostGroup[] {
  const words: number[][] = cliques.map(() => []);
  const can = (s: number, a: number) => !possible || possible(s, a);
  for (let s = 1; s <= L.steps; s++) {
    cliques.forEach((members, k) => {
      if (!members.some((a) => can(s, a))) {
        words[k].push(0);
        return;
      }
      const w = cnf.newVar("cost-word");
      for (const a of members) if (can(s, a)) cnf.add2(-L.action(s, a), w);
      words[k].push(w);
    });
  }
  const inClique = new Set(cliques.flat());
  const costs = [...new Set(task.actions.map((a) => a.cost).filter((c) => c > 0))].sort((x, y) => x - y);
  return costs.map((c) => {
    const ks = cliques.map((m, k) => (task.actions[m[0]].cost === c ? k : -1)).filter((k) => k >= 0);
    const rest = [...task.actions.keys()].filter((a) => task.actions[a].cost === c && !inClique.has(a));
    const lits: number[] = [];
    for (let s = 1; s <= L.steps; s++) {
      for (const k of ks) if (words[k][s - 1] !== 0) lits.push(words[k][s - 1]);
      for (const a of rest) if (can(s, a)) lits.push(L.action(s, a));
    }
    return { weight: c, lits };
  });
}

/**
 * Candidate step-exclusive sets of positive-cost actions, in this order: for each mutex group G,
 * the positive-cost actions that require and may delete some fact of G (two of them either require
 * different facts of G — excluded by G's at-most-one at the step's start — or consume the same
 * fact — excluded by interference); then for each interference family, E ∩ R restricted to
 * positive costs. Returned by descending size (ties: candidate order).
 */
function cliqueCandidates(task: Task, info: TaskInfo, families: readonly Family[], groups: readonly number[][]): number[][] {
  const positive = (a: number) => task.actions[a].cost > 0;
  const cands: number[][] = [];
  for (const g of groups) {
    const gs = new Set(g);
    const members: number[] = [];
    for (let a = 0; a < info.nA; a++) {
      if (!positive(a)) continue;
      const del = new Set(info.mayDel[a]);
      if (task.actions[a].pre.some((f) => gs.has(f) && del.has(f))) members.push(a);
    }
    cands.push(members);
  }
  for (const f of families) {
    const r = new Set(f.R);
    cands.push(f.E.filter((a) => r.has(a) && positive(a)));
  }
  return cands
    .map((c, i) => ({ c, i }))
    .sort((x, y) => y.c.length - x.c.length || x.i - y.i)
    .map((x) => x.c);
}

/**
 * Cost cliques for forall-2: candidates (cliqueCandidates) by descending size, stopping at the
 * first of size < 2; within one, for each cost c (ascending), its still-unassigned members of
 * cost c become a clique when there are at least two of them. Cliques list their members ascending.
 */
export function forallCliques(task: Task, info: TaskInfo, families: readonly Family[], groups: readonly number[][]): number[][] {
  const assigned = new Uint8Array(info.nA);
  const cliques: number[][] = [];
  for (const c of cliqueCandidates(task, info, families, groups)) {
    if (c.length < 2) break;
    const free = c.filter((a) => !assigned[a]);
    const costs = [...new Set(free.map((a) => task.actions[a].cost))].sort((x, y) => x - y);
    for (const cost of costs) {
      const same = free.filter((a) => task.actions[a].cost === cost);
      if (same.length < 2) continue;
      for (const a of same) assigned[a] = 1;
      cliques.push(same);
    }
  }
  return cliques;
}

/**
 * Step-exclusive groups for cost-unary-1 under ∀-steps, costs mixed: candidates (cliqueCandidates)
 * by descending size, stopping at the first of size < 2; the still-unassigned members of each
 * (ascending) form a group when there are at least two. Then every positive-cost action not in a
 * group, ascending, is a group of its own. Every positive-cost action is in exactly one group.
 */
export function unaryForallGroups(task: Task, info: TaskInfo, families: readonly Family[], groups: readonly number[][]): number[][] {
  const assigned = new Uint8Array(info.nA);
  const out: number[][] = [];
  for (const c of cliqueCandidates(task, info, families, groups)) {
    if (c.length < 2) break;
    const free = c.filter((a) => !assigned[a]);
    if (free.length < 2) continue;
    for (const a of free) assigned[a] = 1;
    out.push(free);
  }
  for (let a = 0; a < info.nA; a++) if (task.actions[a].cost > 0 && !assigned[a]) out.push([a]);
  return out;
}
