// Turns each lifted action into the grounder's normal form: negations pushed to atoms,
// universal quantifiers expanded over typed objects, preconditions and effect conditions in DNF.
import { PlumblineError } from "../util/errors.js";
import { cartesian, type ActionDecl, type Effect, type Formula, type Term, type TypedName } from "../pddl/index.js";
import { isVar, varTerm, type Conj, type LAction, type LAtom, type LEffItem, type LLit, type LTerm } from "./lifted.js";
import { factKey, type World } from "./world.js";
import { poll } from "../util/limits.js";

/** Most disjuncts one formula may expand to, and most object tuples one `forall` may cover. */
export const MAX_DISJUNCTS = 20_000;
export const MAX_EXPANSION = 200_000;

type N =
  | { k: "true" }
  | { k: "false" }
  | { k: "lit"; lit: LLit }
  | { k: "eq"; a: LTerm; b: LTerm; neg: boolean }
  | { k: "and"; xs: N[] }
  | { k: "or"; xs: N[] }
  | { k: "exists"; vars: number[]; body: N };

const TRUE: N = { k: "true" };
const FALSE: N = { k: "false" };

function mk(kind: "and" | "or", xs: N[]): N {
  const unit = kind === "and" ? "true" : "false";
  const zero = kind === "and" ? "false" : "true";
  const out: N[] = [];
  for (const x of xs) {
    if (x.k === unit) continue;
    if (x.k === zero) return x;
    if (x.k === kind) out.push(...x.xs);
    else out.push(x);
  }
  if (out.length === 0) return kind === "and" ? TRUE : FALSE;
  if (out.length === 1) return out[0];
  return { k: kind, xs: out };
}

type Env = ReadonlyMap<string, LTerm>;

/** Normalises the formulas and effects of one action (or of the goal, with no parameters). */
export class Normalizer {
  /** Allowed objects per variable; the variable's index is its position here. */
  readonly varDomain: number[][] = [];

  constructor(
    private readonly w: World,
    private readonly where: string,
  ) {}

  newVar(types: readonly string[]): number {
    this.varDomain.push([...this.w.model.symbols.membersOf(types)]);
    return this.varDomain.length - 1;
  }

  term(t: Term, env: Env): LTerm {
    if (t.kind === "var") return env.get(t.name)!;
    return this.w.model.symbols.objectIndex.get(t.name)!;
  }

  atom(pred: string, args: readonly Term[], env: Env): LAtom {
    return { pred: this.w.predIndex.get(pred)!, args: args.map((a) => this.term(a, env)) };
  }

  private limit(what: string, pos: { file: string; line: number; col: number }): PlumblineError {
    return new PlumblineError("limit", `${what} in ${this.where} is too large to ground`, pos);
  }

  /** Negation normal form with `forall` expanded and static ground atoms evaluated. */
  nnf(f: Formula, env: Env, neg: boolean): N {
    switch (f.kind) {
      case "atom": {
        const a = this.atom(f.pred, f.args, env);
        if (this.w.isStatic[a.pred] && !a.args.some(isVar)) {
          return this.w.staticTrue.has(factKey(a.pred, a.args)) !== neg ? TRUE : FALSE;
        }
        return { k: "lit", lit: { pred: a.pred, args: a.args, neg } };
      }
      case "eq": {
        const a = this.term(f.left, env);
        const b = this.term(f.right, env);
        if (a === b) return neg ? FALSE : TRUE;
        if (!isVar(a) && !isVar(b)) return neg ? TRUE : FALSE;
        return { k: "eq", a, b, neg };
      }
      case "not":
        return this.nnf(f.arg, env, !neg);
      case "and":
      case "or":
        return mk((f.kind === "and") !== neg ? "and" : "or", f.args.map((x) => this.nnf(x, env, neg)));
      case "imply":
        return neg
          ? mk("and", [this.nnf(f.left, env, false), this.nnf(f.right, env, true)])
          : mk("or", [this.nnf(f.left, env, true), this.nnf(f.right, env, false)]);
      case "exists":
      case "forall": {
        if ((f.kind === "exists") !== neg) {
          const vars: number[] = [];
          const inner = new Map(env);
          for (const v of f.vars) {
            const id = this.newVar(v.types);
            if (this.varDomain[id].length === 0) return FALSE; // nothing of that type exists
            vars.push(id);
            inner.set(v.name, varTerm(id));
          }
          const body = this.nnf(f.body, inner, neg);
          return body.k === "true" || body.k === "false" ? body : { k: "exists", vars, body };
        }
        const parts: N[] = [];
        let count = 0;
        for (const tuple of this.tuples(f.vars, f.pos)) {
          poll("grounding: normalize");
          if (++count > MAX_EXPANSION) throw this.limit("a universal quantifier", f.pos);
          const inner = new Map(env);
          f.vars.forEach((v, i) => inner.set(v.name, tuple[i]));
          const x = this.nnf(f.body, inner, neg);
          if (x.k === "false") return FALSE;
          parts.push(x);
        }
        return mk("and", parts);
      }
    }
  }

  private tuples(vars: readonly TypedName[], pos: { file: string; line: number; col: number }): Generator<number[]> {
    const doms = vars.map((v) => this.w.model.symbols.membersOf(v.types));
    let total = 1;
    for (const d of doms) total *= d.length;
    if (total > MAX_EXPANSION) throw this.limit("a universal quantifier", pos);
    return cartesian(doms);
  }

  /** Disjunctive normal form; each conjunction is simplified (duplicates, contradictions). */
  dnf(n: N, pos: { file: string; line: number; col: number }): Conj[] {
    const raw = this.dnfRaw(n, pos);
    const out: Conj[] = [];
    for (const c of raw) {
      const s = simplifyConj(c);
      if (s) out.push(s);
    }
    return out;
  }

  private dnfRaw(n: N, pos: { file: string; line: number; col: number }): Conj[] {
    switch (n.k) {
      case "true":
        return [{ lits: [], eqs: [], vars: [] }];
      case "false":
        return [];
      case "lit":
        return [{ lits: [n.lit], eqs: [], vars: [] }];
      case "eq":
        return [{ lits: [], eqs: [{ a: n.a, b: n.b, neg: n.neg }], vars: [] }];
      case "or": {
        const out: Conj[] = [];
        for (const x of n.xs) {
          out.push(...this.dnfRaw(x, pos));
          if (out.length > MAX_DISJUNCTS) throw this.limit("the disjunctive normal form of a condition", pos);
        }
        return out;
      }
      case "exists":
        return this.dnfRaw(n.body, pos).map((c) => ({ ...c, vars: [...n.vars, ...c.vars] }));
      case "and": {
        let acc: Conj[] = [{ lits: [], eqs: [], vars: [] }];
        for (const x of n.xs) {
          const d = this.dnfRaw(x, pos);
          if (acc.length * d.length > MAX_DISJUNCTS) throw this.limit("the disjunctive normal form of a condition", pos);
          const next: Conj[] = [];
          for (const a of acc) for (const b of d) next.push({ lits: [...a.lits, ...b.lits], eqs: [...a.eqs, ...b.eqs], vars: [...a.vars, ...b.vars] });
          acc = next;
          if (acc.length === 0) break;
        }
        return acc;
      }
    }
  }

  /** The precondition (or goal) `f` in DNF. */
  condition(f: Formula | null, env: Env): Conj[] {
    if (!f) return [{ lits: [], eqs: [], vars: [] }];
    return this.dnf(this.nnf(f, env, false), f.pos);
  }
}

function litKey(l: LLit): string {
  return `${l.pred}:${l.args.join(",")}`;
}

/** Removes duplicate literals and unused existential variables; null if contradictory. */
function simplifyConj(c: Conj): Conj | null {
  const pos = new Set<string>();
  const neg = new Set<string>();
  const lits: LLit[] = [];
  for (const l of c.lits) {
    const k = litKey(l);
    if ((l.neg ? pos : neg).has(k)) return null;
    const mine = l.neg ? neg : pos;
    if (mine.has(k)) continue;
    mine.add(k);
    lits.push(l);
  }
  const eqSeen = new Set<string>();
  const eqs = c.eqs.filter((e) => {
    const k = `${e.neg ? 1 : 0}:${Math.min(e.a, e.b)},${Math.max(e.a, e.b)}`;
    const opposite = `${e.neg ? 0 : 1}:${Math.min(e.a, e.b)},${Math.max(e.a, e.b)}`;
    if (eqSeen.has(opposite)) eqSeen.add("#contradiction");
    if (eqSeen.has(k)) return false;
    eqSeen.add(k);
    return true;
  });
  if (eqSeen.has("#contradiction")) return null;
  const used = new Set<number>();
  for (const l of lits) for (const a of l.args) if (isVar(a)) used.add(a);
  for (const e of eqs) {
    if (isVar(e.a)) used.add(e.a);
    if (isVar(e.b)) used.add(e.b);
  }
  const vars = [...new Set(c.vars)].filter((v) => used.has(varTerm(v)));
  return { lits, eqs, vars };
}

interface ItemBuilder {
  vars: number[];
  cond: N[];
  adds: LAtom[];
  dels: LAtom[];
}

/** Normalises one action schema (index `schema` in the domain). */
export function normalizeAction(w: World, a: ActionDecl, schema: number): LAction {
  const nz = new Normalizer(w, `action '${a.name}'`);
  const env = new Map<string, LTerm>();
  for (const p of a.params) env.set(p.name, varTerm(nz.newVar(p.types)));
  const disjuncts = nz.condition(a.pre, env);
  const root: ItemBuilder = { vars: [], cond: [], adds: [], dels: [] };
  const scopes: ItemBuilder[] = [];
  let costConst = 0;
  const costTerms: LAction["costTerms"] = [];
  const walk = (e: Effect, env: Env, item: ItemBuilder): void => {
    switch (e.kind) {
      case "add":
        item.adds.push(nz.atom(e.atom.pred, e.atom.args, env));
        return;
      case "del":
        item.dels.push(nz.atom(e.atom.pred, e.atom.args, env));
        return;
      case "and":
        for (const x of e.effects) walk(x, env, item);
        return;
      case "forall": {
        const inner = new Map(env);
        const vars = [...item.vars];
        for (const v of e.vars) {
          const id = nz.newVar(v.types);
          vars.push(id);
          inner.set(v.name, varTerm(id));
        }
        const sub: ItemBuilder = { vars, cond: item.cond, adds: [], dels: [] };
        scopes.push(sub);
        walk(e.body, inner, sub);
        return;
      }
      case "when": {
        const sub: ItemBuilder = { vars: item.vars, cond: [...item.cond, nz.nnf(e.cond, env, false)], adds: [], dels: [] };
        scopes.push(sub);
        walk(e.body, env, sub);
        return;
      }
      case "cost":
        if (e.amount.kind === "number") costConst += e.amount.value;
        else costTerms.push({ fn: e.amount.name, args: e.amount.args.map((t) => nz.term(t, env)), pos: e.amount.pos });
        return;
    }
  };
  walk(a.effect, env, root);
  const adds = [...root.adds];
  const dels = [...root.dels];
  const items: LEffItem[] = [];
  for (const s of scopes) {
    if (s.adds.length === 0 && s.dels.length === 0) continue;
    for (const cond of nz.dnf(mk("and", s.cond), a.pos)) {
      poll("grounding: normalize");
      if (s.vars.length === 0 && cond.vars.length === 0 && cond.lits.length === 0 && cond.eqs.length === 0) {
        adds.push(...s.adds);
        dels.push(...s.dels);
      } else {
        items.push({ vars: [...s.vars, ...cond.vars], cond, adds: s.adds, dels: s.dels });
      }
    }
  }
  return { schema, name: a.name, nParams: a.params.length, varDomain: nz.varDomain, disjuncts, adds, dels, items, costConst, costTerms };
}
