// Evaluates lifted formulas and effects directly on a state of ground atoms (the replay's
// semantics, independent of the grounder), and names the literal that makes a condition fail.
import { PlumblineError } from "../util/errors.js";
import { atomText, cartesian, formulaText, termText, type Effect, type Formula, type Model, type TypedName } from "../pddl/index.js";

/** A state: the set of true ground atoms, written "(pred a b)". */
export type LiftedState = ReadonlySet<string>;
export type Binding = ReadonlyMap<string, string>;

function tuples(model: Model, vars: readonly TypedName[]): Generator<string[]> {
  const sym = model.symbols;
  return cartesian(vars.map((v) => sym.membersOf(v.types).map((o) => sym.objects[o])));
}

function extend(b: Binding, vars: readonly TypedName[], vals: readonly string[]): Map<string, string> {
  const m = new Map(b);
  vars.forEach((v, i) => m.set(v.name, vals[i]));
  return m;
}

export function holds(model: Model, f: Formula, b: Binding, s: LiftedState): boolean {
  switch (f.kind) {
    case "atom":
      return s.has(atomText(f.pred, f.args.map((t) => termText(t, b))));
    case "eq":
      return termText(f.left, b) === termText(f.right, b);
    case "not":
      return !holds(model, f.arg, b, s);
    case "and":
      return f.args.every((x) => holds(model, x, b, s));
    case "or":
      return f.args.some((x) => holds(model, x, b, s));
    case "imply":
      return !holds(model, f.left, b, s) || holds(model, f.right, b, s);
    case "exists":
      for (const t of tuples(model, f.vars)) if (holds(model, f.body, extend(b, f.vars, t), s)) return true;
      return false;
    case "forall":
      for (const t of tuples(model, f.vars)) if (!holds(model, f.body, extend(b, f.vars, t), s)) return false;
      return true;
  }
}

/**
 * null when `f` holds; otherwise the smallest ground part that fails, in readable form:
 * a literal such as "(at truck1 quay)" or "(not (busy crane2))", or a whole
 * disjunction / existential when no single literal is to blame.
 */
export function whyFails(model: Model, f: Formula, b: Binding, s: LiftedState): string | null {
  switch (f.kind) {
    case "atom":
    case "eq":
      return holds(model, f, b, s) ? null : formulaText(f, b);
    case "not":
      if (!holds(model, f.arg, b, s)) return null;
      if (f.arg.kind === "not") return whyFails(model, f.arg.arg, b, s);
      return `(not ${formulaText(f.arg, b)})`;
    case "and":
      for (const x of f.args) {
        const w = whyFails(model, x, b, s);
        if (w) return w;
      }
      return null;
    case "imply":
      if (!holds(model, f.left, b, s)) return null;
      return whyFails(model, f.right, b, s);
    case "forall":
      for (const t of tuples(model, f.vars)) {
        const w = whyFails(model, f.body, extend(b, f.vars, t), s);
        if (w) return w;
      }
      return null;
    case "or":
    case "exists":
      return holds(model, f, b, s) ? null : formulaText(f, b);
  }
}

export interface EffectResult {
  adds: Set<string>;
  dels: Set<string>;
  /** Sum of (increase (total-cost) …) amounts. */
  cost: number;
}

/** Collects the effects of `e` under `b`, conditions read in `s` (the state before). */
export function applyEffect(model: Model, e: Effect, b: Binding, s: LiftedState, out: EffectResult, where: string): void {
  switch (e.kind) {
    case "add":
      out.adds.add(atomText(e.atom.pred, e.atom.args.map((t) => termText(t, b))));
      return;
    case "del":
      out.dels.add(atomText(e.atom.pred, e.atom.args.map((t) => termText(t, b))));
      return;
    case "and":
      for (const x of e.effects) applyEffect(model, x, b, s, out, where);
      return;
    case "forall":
      for (const t of tuples(model, e.vars)) applyEffect(model, e.body, extend(b, e.vars, t), s, out, where);
      return;
    case "when":
      if (holds(model, e.cond, b, s)) applyEffect(model, e.body, b, s, out, where);
      return;
    case "cost": {
      const a = e.amount;
      if (a.kind === "number") {
        out.cost += a.value;
        return;
      }
      const args = a.args.map((t) => termText(t, b));
      const sym = model.symbols;
      const v = sym.costValues.get(sym.costKey(a.name, args));
      if (!v) throw new PlumblineError("semantic", `${where} needs the cost value ${atomText(a.name, args)}, but the :init of ${model.problemPath} does not set it`, a.pos);
      out.cost += v.value;
      return;
    }
  }
}

/** The successor state: deletes first, then adds (an atom both added and deleted stays true). */
export function successorState(s: LiftedState, eff: EffectResult): Set<string> {
  const next = new Set(s);
  for (const a of eff.dels) next.delete(a);
  for (const a of eff.adds) next.add(a);
  return next;
}

/** The initial state of the model (static atoms included). */
export function initialState(model: Model): Set<string> {
  return new Set(model.problem.init.map((a) => atomText(a.pred, a.args)));
}
