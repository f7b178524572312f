// Name resolution and arity checks shared by domain actions and problem goals: every
// predicate, function, variable and constant used must be declared, with the right arity.
import { PlumblineError, type SourcePos } from "../util/errors.js";
import { TOTAL_COST, type Effect, type Formula, type FunctionDecl, type PredicateDecl, type Term, type TypedName } from "./ast.js";
import type { TypeTable } from "./types.js";

export interface CheckEnv {
  types: TypeTable;
  predicates: ReadonlyMap<string, PredicateDecl>;
  functions: ReadonlyMap<string, FunctionDecl>;
  /** Names a constant term may take (domain constants, plus problem objects in a problem). */
  objects: ReadonlySet<string>;
  /** "constant" in a domain, "object" in a problem (for messages). */
  objectWord: "constant" | "object";
}

export type Scope = ReadonlyMap<string, readonly string[]>;

function err(message: string, pos: SourcePos): PlumblineError {
  return new PlumblineError("semantic", message, pos);
}

export function checkTerm(env: CheckEnv, t: Term, scope: Scope): void {
  if (t.kind === "var") {
    if (!scope.has(t.name)) throw err(`variable '${t.name}' is not declared here (not a parameter or quantified variable)`, t.pos);
  } else if (!env.objects.has(t.name)) {
    throw err(env.objectWord === "constant" ? `'${t.name}' is not a declared constant` : `unknown object '${t.name}'`, t.pos);
  }
}

/** Extends `scope` with quantified or parameter variables, checking their types. */
export function bindVars(env: CheckEnv, vars: readonly TypedName[], scope: Scope, what: string): Map<string, readonly string[]> {
  const out = new Map(scope);
  const seen = new Set<string>();
  for (const v of vars) {
    if (seen.has(v.name)) throw err(`${what} '${v.name}' is declared twice`, v.pos);
    seen.add(v.name);
    env.types.check(v.types, v.typePos ?? v.pos);
    out.set(v.name, v.types);
  }
  return out;
}

function checkArity(kind: string, name: string, want: number, got: number, pos: SourcePos): void {
  if (want !== got) throw err(`${kind} '${name}' takes ${want} argument${want === 1 ? "" : "s"}, found ${got}`, pos);
}

export function checkAtom(env: CheckEnv, pred: string, args: readonly Term[], pos: SourcePos, scope: Scope): void {
  const d = env.predicates.get(pred);
  if (!d) throw err(`unknown predicate '${pred}'`, pos);
  checkArity("predicate", pred, d.params.length, args.length, pos);
  for (const a of args) checkTerm(env, a, scope);
}

export function checkFormula(env: CheckEnv, f: Formula, scope: Scope): void {
  switch (f.kind) {
    case "atom":
      return checkAtom(env, f.pred, f.args, f.pos, scope);
    case "eq":
      checkTerm(env, f.left, scope);
      return checkTerm(env, f.right, scope);
    case "not":
      return checkFormula(env, f.arg, scope);
    case "and":
    case "or":
      for (const a of f.args) checkFormula(env, a, scope);
      return;
    case "imply":
      checkFormula(env, f.left, scope);
      return checkFormula(env, f.right, scope);
    case "exists":
    case "forall":
      return checkFormula(env, f.body, bindVars(env, f.vars, scope, "quantified variable"));
  }
}

/** `nested` is true inside forall/when, where a cost change would be conditional. */
export function checkEffect(env: CheckEnv, e: Effect, scope: Scope, nested = false): void {
  switch (e.kind) {
    case "add":
    case "del":
      return checkAtom(env, e.atom.pred, e.atom.args, e.atom.pos, scope);
    case "and":
      for (const x of e.effects) checkEffect(env, x, scope, nested);
      return;
    case "forall":
      return checkEffect(env, e.body, bindVars(env, e.vars, scope, "quantified variable"), true);
    case "when":
      checkFormula(env, e.cond, scope);
      return checkEffect(env, e.body, scope, true);
    case "cost": {
      if (nested) {
        throw new PlumblineError("unsupported", "an (increase (total-cost) …) inside 'forall' or 'when' (a conditional action cost) is not supported", e.pos);
      }
      const a = e.amount;
      if (a.kind === "function") {
        if (a.name === TOTAL_COST) throw err("(total-cost) cannot be its own increase amount", a.pos);
        const d = env.functions.get(a.name);
        if (!d) throw err(`unknown function '${a.name}'`, a.pos);
        checkArity("function", a.name, d.params.length, a.args.length, a.pos);
        for (const t of a.args) checkTerm(env, t, scope);
      }
      return;
    }
  }
}
