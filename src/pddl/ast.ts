// The lifted model as parsed: domain and problem syntax trees, every node keeping its
// source position so later stages (checks, grounding, replay) can name file:line:col.
import type { SourcePos } from "../util/errors.js";

export type { SourcePos };

/** A declared name with its type: several types mean `(either t1 t2 …)`. */
export interface TypedName {
  name: string;
  types: string[];
  pos: SourcePos;
  /** Position of the type after '-' (absent for untyped names). */
  typePos?: SourcePos;
}

export type Term = { kind: "var"; name: string; pos: SourcePos } | { kind: "const"; name: string; pos: SourcePos };

export interface AtomFormula {
  kind: "atom";
  pred: string;
  args: Term[];
  pos: SourcePos;
}

export type Formula =
  | AtomFormula
  | { kind: "eq"; left: Term; right: Term; pos: SourcePos }
  | { kind: "not"; arg: Formula; pos: SourcePos }
  | { kind: "and"; args: Formula[]; pos: SourcePos }
  | { kind: "or"; args: Formula[]; pos: SourcePos }
  | { kind: "imply"; left: Formula; right: Formula; pos: SourcePos }
  | { kind: "exists"; vars: TypedName[]; body: Formula; pos: SourcePos }
  | { kind: "forall"; vars: TypedName[]; body: Formula; pos: SourcePos };

/** The amount of an `(increase (total-cost) …)` effect. */
export type CostAmount =
  | { kind: "number"; value: number; pos: SourcePos }
  | { kind: "function"; name: string; args: Term[]; pos: SourcePos };

export type Effect =
  | { kind: "add"; atom: AtomFormula; pos: SourcePos }
  | { kind: "del"; atom: AtomFormula; pos: SourcePos }
  | { kind: "and"; effects: Effect[]; pos: SourcePos }
  | { kind: "forall"; vars: TypedName[]; body: Effect; pos: SourcePos }
  | { kind: "when"; cond: Formula; body: Effect; pos: SourcePos }
  | { kind: "cost"; amount: CostAmount; pos: SourcePos };

export interface TypeDecl {
  name: string;
  /** Direct super-types (more than one only with `either` or repeated declarations). */
  parents: string[];
  pos: SourcePos;
}

export interface PredicateDecl {
  name: string;
  params: TypedName[];
  pos: SourcePos;
}

export interface FunctionDecl {
  name: string;
  params: TypedName[];
  pos: SourcePos;
}

export interface ActionDecl {
  name: string;
  params: TypedName[];
  /** null: no precondition (always applicable). */
  pre: Formula | null;
  effect: Effect;
  pos: SourcePos;
}

export interface Requirement {
  name: string;
  pos: SourcePos;
}

export interface Domain {
  file: string;
  name: string;
  requirements: Requirement[];
  types: TypeDecl[];
  constants: TypedName[];
  predicates: PredicateDecl[];
  functions: FunctionDecl[];
  actions: ActionDecl[];
  /** True when some action has an `(increase (total-cost) …)` effect. */
  hasActionCosts: boolean;
  pos: SourcePos;
}

export interface InitAtom {
  pred: string;
  args: string[];
  pos: SourcePos;
}

/** `(= (f a b) 12)` in :init. */
export interface InitValue {
  fn: string;
  args: string[];
  value: number;
  pos: SourcePos;
  /** Position of the number itself. */
  valuePos: SourcePos;
}

export interface Problem {
  file: string;
  name: string;
  domainName: string;
  domainPos: SourcePos;
  requirements: Requirement[];
  objects: TypedName[];
  init: InitAtom[];
  initValues: InitValue[];
  goal: Formula;
  /** `(:metric minimize (total-cost))`, or null when absent. */
  metric: { pos: SourcePos } | null;
  pos: SourcePos;
}

/** The name every model has implicitly as the root type. */
export const OBJECT_TYPE = "object";
/** The one numeric fluent plumbline supports. */
export const TOTAL_COST = "total-cost";
