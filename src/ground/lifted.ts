// The normalised lifted model the grounder works on: numeric predicate and object ids,
// preconditions in disjunctive normal form, effects as flat (variables, condition, literals) items.
import type { SourcePos } from "../util/errors.js";

/** A term: an object id (≥ 0), or variable v encoded as -(v + 1). */
export type LTerm = number;

export const varTerm = (v: number): LTerm => -(v + 1);
export const termVar = (t: LTerm): number => -t - 1;
export const isVar = (t: LTerm): boolean => t < 0;

export interface LAtom {
  pred: number;
  args: LTerm[];
}

export interface LLit extends LAtom {
  neg: boolean;
}

/** `(= a b)` (or its negation when `neg`). */
export interface LEq {
  a: LTerm;
  b: LTerm;
  neg: boolean;
}

/** A conjunction of literals with the existential variables it introduced. */
export interface Conj {
  lits: LLit[];
  eqs: LEq[];
  vars: number[];
}

/** One effect scope: for every binding of `vars` where `cond` holds, add `adds` and delete `dels`. */
export interface LEffItem {
  vars: number[];
  cond: Conj;
  adds: LAtom[];
  dels: LAtom[];
}

export interface LCostTerm {
  fn: string;
  args: LTerm[];
  pos: SourcePos;
}

export interface LAction {
  /** Index of the schema in the domain's action list. */
  schema: number;
  name: string;
  /** Variables 0..nParams-1 are the schema parameters. */
  nParams: number;
  /** Allowed objects of each variable (sorted ids), indexed by variable. */
  varDomain: number[][];
  /** The precondition in DNF; an empty list means it can never hold. */
  disjuncts: Conj[];
  /** Unconditional, unquantified adds and deletes. */
  adds: LAtom[];
  dels: LAtom[];
  /** Quantified and/or conditional effect scopes. */
  items: LEffItem[];
  costConst: number;
  costTerms: LCostTerm[];
}
