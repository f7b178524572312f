// Compiles a conjunctive rule body into a join plan (most-bound literal first, static
// relations preferred) and runs it over indexed tuple sets, calling back per binding.
import { isVar, termVar, type LEq, type LLit, type LTerm } from "./lifted.js";
import type { TupleSet } from "./store.js";
import { poll } from "../util/limits.js";

/** A conjunctive body: positive atoms to join, negative static atoms and (in)equalities to check. */
export interface Body {
  atoms: LLit[];
  negStatic: LLit[];
  eqs: LEq[];
  /** Every variable that must end up bound (others in the body are bound through atoms). */
  vars: number[];
}

interface MatchOp {
  k: 0;
  atom: number;
  args: LTerm[];
  pred: number;
  isStatic: boolean;
  mask: number;
  /** Terms at the bound positions, in position order. */
  boundTerms: LTerm[];
  /** First occurrences of unbound variables: [position, variable]. */
  free: Array<[number, number]>;
  /** Later occurrences of the same unbound variables. */
  repeats: Array<[number, number]>;
  full: boolean;
}

interface EnumOp {
  k: 1;
  v: number;
}

type Op = MatchOp | EnumOp;

type Check = { k: "neg"; lit: LLit } | { k: "eq"; a: LTerm; b: LTerm; neg: boolean };

export interface Plan {
  /** For a triggered plan: the atom bound from the new fact. */
  trigger: MatchOp | null;
  ops: Op[];
  /** checks[i] run after op i-1 completes (checks[0]: before the first op). */
  checks: Check[][];
}

function termsVars(ts: readonly LTerm[], out: Set<number>): void {
  for (const t of ts) if (isVar(t)) out.add(termVar(t));
}

function matchOp(a: LLit, atom: number, isStatic: boolean, bound: Set<number>): MatchOp {
  let mask = 0;
  const boundTerms: LTerm[] = [];
  const free: Array<[number, number]> = [];
  const repeats: Array<[number, number]> = [];
  const seen = new Set<number>();
  a.args.forEach((t, p) => {
    if (!isVar(t) || bound.has(termVar(t))) {
      mask |= 1 << p;
      boundTerms.push(t);
    } else {
      const v = termVar(t);
      if (seen.has(v)) repeats.push([p, v]);
      else {
        seen.add(v);
        free.push([p, v]);
      }
    }
  });
  return { k: 0, atom, args: a.args, pred: a.pred, isStatic, mask, boundTerms, free, repeats, full: free.length === 0 };
}

/**
 * Plans the join of `body` given the variables already bound; `trigger` (an atom index)
 * is bound from a new fact first and skipped afterwards.
 */
export function compilePlan(body: Body, isStatic: readonly boolean[], initiallyBound: Iterable<number>, trigger = -1): Plan {
  const bound = new Set<number>(initiallyBound);
  if (trigger >= 0 && bound.size > 0) throw new Error("compilePlan: a triggered plan starts with no bound variables");
  const checks: Check[][] = [];
  const pending: Check[] = [
    ...body.negStatic.map((lit): Check => ({ k: "neg", lit })),
    ...body.eqs.map((e): Check => ({ k: "eq", a: e.a, b: e.b, neg: e.neg })),
  ];
  const ready = (): Check[] => {
    const out: Check[] = [];
    for (let i = pending.length - 1; i >= 0; i--) {
      const c = pending[i];
      const vs = new Set<number>();
      if (c.k === "neg") termsVars(c.lit.args, vs);
      else termsVars([c.a, c.b], vs);
      if ([...vs].every((v) => bound.has(v))) {
        out.push(c);
        pending.splice(i, 1);
      }
    }
    return out.reverse();
  };
  let triggerOp: MatchOp | null = null;
  if (trigger >= 0) {
    triggerOp = matchOp(body.atoms[trigger], trigger, false, bound);
    termsVars(body.atoms[trigger].args, bound);
  }
  const ops: Op[] = [];
  checks.push(ready());
  const left = body.atoms.map((_, i) => i).filter((i) => i !== trigger);
  while (left.length) {
    let best = -1;
    let bestScore = Infinity;
    for (let j = 0; j < left.length; j++) {
      const a = body.atoms[left[j]];
      const unbound = new Set<number>();
      let boundCount = 0;
      for (const t of a.args) {
        if (isVar(t) && !bound.has(termVar(t))) unbound.add(termVar(t));
        else boundCount++;
      }
      // fewer new variables first; static relations on ties; then more bound positions
      const score = unbound.size * 1000 + (isStatic[a.pred] ? 0 : 100) - boundCount;
      if (score < bestScore) {
        bestScore = score;
        best = j;
      }
    }
    const ai = left.splice(best, 1)[0];
    const a = body.atoms[ai];
    ops.push(matchOp(a, ai, isStatic[a.pred], bound));
    termsVars(a.args, bound);
    checks.push(ready());
  }
  const rest = new Set<number>(body.vars);
  for (const c of pending) {
    if (c.k === "neg") termsVars(c.lit.args, rest);
    else termsVars([c.a, c.b], rest);
  }
  for (const v of [...rest].sort((x, y) => x - y)) {
    if (bound.has(v)) continue;
    ops.push({ k: 1, v });
    bound.add(v);
    checks.push(ready());
  }
  return { trigger: triggerOp, ops, checks };
}

/** Runs plans against tuple sets; one instance per rule family (it owns the binding array). */
export class Joiner {
  readonly binding: Int32Array;
  private readonly keyBuf: number[] = [];

  constructor(
    nVars: number,
    /** Allowed objects per variable: membership bitmap and sorted list. */
    private readonly domMask: Uint8Array[],
    private readonly domList: number[][],
    private readonly fluent: readonly TupleSet[],
    private readonly statics: readonly TupleSet[],
  ) {
    this.binding = new Int32Array(Math.max(nVars, 1));
  }

  private val(t: LTerm): number {
    return t >= 0 ? t : this.binding[-t - 1];
  }

  private checksPass(cs: Check[]): boolean {
    for (const c of cs) {
      if (c.k === "eq") {
        if ((this.val(c.a) === this.val(c.b)) === c.neg) return false;
      } else {
        const args = c.lit.args.map((t) => this.val(t));
        if (this.statics[c.lit.pred].find(args) >= 0) return false;
      }
    }
    return true;
  }

  /** Binds the trigger atom from `tuple`; false if it does not match. */
  private bindTrigger(op: MatchOp, tuple: readonly number[]): boolean {
    const args = op.args;
    for (let p = 0; p < args.length; p++) {
      const t = args[p];
      if (t >= 0 && tuple[p] !== t) return false;
    }
    for (const [p, v] of op.free) {
      const x = tuple[p];
      if (!this.domMask[v][x]) return false;
      this.binding[v] = x;
    }
    for (const [p, v] of op.repeats) if (tuple[p] !== this.binding[v]) return false;
    return true;
  }

  /** Runs `plan`; when it has a trigger, `tuple` is the new fact's arguments. */
  run(plan: Plan, emit: () => void, tuple?: readonly number[]): void {
    if (plan.trigger && (!tuple || !this.bindTrigger(plan.trigger, tuple))) return;
    if (!this.checksPass(plan.checks[0])) return;
    this.step(plan, 0, emit);
  }

  private step(plan: Plan, i: number, emit: () => void): void {
    if (i === plan.ops.length) {
      emit();
      return;
    }
    const op = plan.ops[i];
    const after = plan.checks[i + 1];
    if (op.k === 1) {
      for (const x of this.domList[op.v]) {
        poll("grounding: join");
        this.binding[op.v] = x;
        if (this.checksPass(after)) this.step(plan, i + 1, emit);
      }
      return;
    }
    const set = op.isStatic ? this.statics[op.pred] : this.fluent[op.pred];
    const kb = this.keyBuf;
    const n = op.boundTerms.length;
    for (let j = 0; j < n; j++) kb[j] = this.val(op.boundTerms[j]);
    if (op.full) {
      if (set.findByKey(set.keyOfValues(kb, n)) >= 0 && this.checksPass(after)) this.step(plan, i + 1, emit);
      return;
    }
    let bucket: readonly number[] | undefined;
    if (op.mask === 0) bucket = undefined;
    else {
      bucket = set.index(op.mask).get(set.keyOfValues(kb, n));
      if (!bucket) return;
    }
    const count = bucket ? bucket.length : set.size;
    const tuples = set.tuples;
    outer: for (let j = 0; j < count; j++) {
      poll("grounding: join");
      const tup = tuples[bucket ? bucket[j] : j];
      for (const [p, v] of op.free) {
        const x = tup[p];
        if (!this.domMask[v][x]) continue outer;
        this.binding[v] = x;
      }
      for (const [p, v] of op.repeats) if (tup[p] !== this.binding[v]) continue outer;
      if (this.checksPass(after)) this.step(plan, i + 1, emit);
    }
  }
}

