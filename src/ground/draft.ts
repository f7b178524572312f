// The grounder's working copy of a task before final numbering: facts are reachability
// numbers, actions carry a sort key; folding and goal compilation edit it in place.
import type { Action } from "./task.js";

export interface DraftAction extends Action {
  /** Canonical order: schema index, argument ids, disjunct, witness values. */
  sortKey: number[];
}

export interface Draft {
  domainName: string;
  problemName: string;
  /** Fact names, index = draft fact number. */
  facts: string[];
  /** Canonical sort key per fact (predicate index, argument ids); synthetic facts sort last. */
  factKeys: number[][];
  init: number[];
  goal: number[];
  goalNeg: number[];
  actions: DraftAction[];
}

export function sortedUnique(xs: Iterable<number>): number[] {
  const a = [...new Set(xs)];
  a.sort((x, y) => x - y);
  return a;
}

export function compareKeys(a: readonly number[], b: readonly number[]): number {
  const n = Math.min(a.length, b.length);
  for (let i = 0; i < n; i++) if (a[i] !== b[i]) return a[i] - b[i];
  return a.length - b.length;
}

/** Adds a fact that no predicate produces (synthetic goal facts); returns its number. */
export function addSyntheticFact(d: Draft, name: string): number {
  d.facts.push(name);
  d.factKeys.push([Number.MAX_SAFE_INTEGER, d.facts.length]);
  return d.facts.length - 1;
}
