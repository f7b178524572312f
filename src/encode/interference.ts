// The ∀-step interference relation (specs forall-1, forall-2), as "families": for a fact f,
// no action of E and a different action of R may share a step. Computed once per task.
import type { Task } from "../ground/task.js";
import type { TaskInfo } from "./task-info.js";

/** Forbid every pair (e, r), e ∈ E, r ∈ R, e ≠ r, in one step. Lists ascending. */
export interface Family {
  E: number[];
  R: number[];
}

const merge = (...lists: number[][]): number[] => {
  const s = new Set<number>();
  for (const l of lists) for (const x of l) s.add(x);
  return [...s].sort((x, y) => x - y);
};

/**
 * For every fact f (ascending), two families:
 *   K1(f): E = {a : f ∈ PD(a)},  R = {b : f ∈ pre(b) ∪ C(b) ∪ PA(b)}
 *   K2(f): E = {a : f ∈ PA(a)},  R = {b : f ∈ preNeg(b) ∪ C(b)}
 * (PA may-add, PD may-delete, C conditions read — TaskInfo). Families that cannot forbid
 * anything (E or R empty, or E = R = {a}) are dropped; a family equal to an earlier one
 * (same E and R) is dropped too.
 */
export function interferenceFamilies(task: Task, info: TaskInfo): Family[] {
  const { nF, nA } = info;
  const byFact = () => Array.from({ length: nF }, () => [] as number[]);
  const pre = byFact();
  const preNeg = byFact();
  const cond = byFact();
  const mayAdd = byFact();
  const mayDel = byFact();
  for (let a = 0; a < nA; a++) {
    const act = task.actions[a];
    for (const f of act.pre) pre[f].push(a);
    for (const f of act.preNeg) preNeg[f].push(a);
    for (const f of info.condReads[a]) cond[f].push(a);
    for (const f of info.mayAdd[a]) mayAdd[f].push(a);
    for (const f of info.mayDel[a]) mayDel[f].push(a);
  }
  const out: Family[] = [];
  const seen = new Set<string>();
  const keep = (E: number[], R: number[]) => {
    if (E.length === 0 || R.length === 0) return;
    if (E.length === 1 && R.length === 1 && E[0] === R[0]) return;
    const key = `${E.join(",")}|${R.join(",")}`;
    if (seen.has(key)) return;
    seen.add(key);
    out.push({ E, R });
  };
  for (let f = 0; f < nF; f++) {
    keep(mayDel[f], merge(pre[f], cond[f], mayAdd[f]));
    keep(mayAdd[f], merge(preNeg[f], cond[f]));
  }
  return out;
}

/** All unordered interfering pairs [a, b], a < b, of the given families, sorted. */
export function familyPairs(families: readonly Family[], nA: number): Array<[number, number]> {
  const keys = new Set<number>();
  for (const { E, R } of families) {
    for (const e of E)
      for (const r of R) {
        if (e === r) continue;
        keys.add(e < r ? e * nA + r : r * nA + e);
      }
  }
  return [...keys].sort((x, y) => x - y).map((k) => [Math.floor(k / nA), k % nA]);
}

/** Number of distinct unordered pairs one family forbids. */
export function familyPairCount(f: Family): number {
  const inR = new Set(f.R);
  const both = f.E.filter((e) => inR.has(e)).length;
  // ordered (e, r) pairs with e ≠ r, minus those counted twice (both ends in E ∩ R)
  return f.E.length * f.R.length - both - (both * (both - 1)) / 2;
}
