// Relaxed-reachability fixpoint: starting from the initial facts, instantiates action
// schemas only where their positive conditions are reachable (deletes and negative fluent
// conditions ignored), so grounding never enumerates the cross product of all objects.
import { PlumblineError } from "../util/errors.js";
import { compilePlan, Joiner, type Body, type Plan } from "./join.js";
import type { LAction, LAtom, Conj, LEffItem } from "./lifted.js";
import { TupleSet } from "./store.js";
import type { World } from "./world.js";
import { poll } from "../util/limits.js";

/** One reachable binding of an action's precondition disjunct. */
export interface Instance {
  action: number;
  disjunct: number;
  /** Values of the action's variables (only those of the disjunct's rule are meaningful). */
  binding: Int32Array;
}

export interface Reached {
  /** All reachable fluent facts: predicate and arguments per global fact number. */
  factPred: number[];
  factArgs: number[][];
  /** Per predicate: the reachable tuples (fluent) or the initial ones (static). */
  sets: TupleSet[];
  /** Per predicate: global fact number of each tuple index of `sets` (fluent only). */
  gid: number[][];
  instances: Instance[];
  /** Per action: one Joiner (binding array and variable domains). */
  joiners: Joiner[];
}

/** Domain bitmaps and lists for every variable of an action. */
export function actionJoiner(w: World, a: LAction, fluent: readonly TupleSet[], statics: readonly TupleSet[]): Joiner {
  const masks = a.varDomain.map((d) => {
    const m = new Uint8Array(w.nObjects);
    for (const o of d) m[o] = 1;
    return m;
  });
  return new Joiner(a.varDomain.length, masks, a.varDomain, fluent, statics);
}

/** The join body of a precondition disjunct (plus an effect scope's condition). */
export function bodyOf(w: World, a: LAction, d: Conj, item: LEffItem | null): Body {
  const lits = item ? [...d.lits, ...item.cond.lits] : d.lits;
  const vars: number[] = [];
  for (let v = 0; v < a.nParams; v++) vars.push(v);
  vars.push(...d.vars);
  if (item) vars.push(...item.vars);
  return {
    atoms: lits.filter((l) => !l.neg),
    negStatic: lits.filter((l) => l.neg && w.isStatic[l.pred]),
    eqs: item ? [...d.eqs, ...item.cond.eqs] : d.eqs,
    vars: [...new Set(vars)],
  };
}

interface Rule {
  action: number;
  disjunct: number;
  isAction: boolean;
  vars: number[];
  head: LAtom[];
}

/** Upper bound on reachable ground action instances before grounding gives up. */
export const MAX_INSTANCES = 5_000_000;

export function reach(w: World, actions: readonly LAction[]): Reached {
  const radix = w.nObjects + 1;
  const sets = w.predArity.map((n) => new TupleSet(n, radix));
  const processed = w.predArity.map((n, p) => (w.isStatic[p] ? sets[p] : new TupleSet(n, radix)));
  const gid: number[][] = w.predArity.map(() => []);
  const factPred: number[] = [];
  const factArgs: number[][] = [];
  const queue: number[] = [];
  const addFact = (pred: number, args: number[]): void => {
    const r = sets[pred].add(args);
    if (!r.isNew) return;
    const id = factPred.length;
    factPred.push(pred);
    factArgs.push(args);
    gid[pred].push(id);
    queue.push(id);
  };
  for (const f of w.init) {
    if (w.isStatic[f.pred]) sets[f.pred].add(f.args);
    else addFact(f.pred, f.args);
  }

  const joiners = actions.map((a) => actionJoiner(w, a, processed, sets));
  const rules: Rule[] = [];
  const triggers: Array<Array<{ rule: number; plan: Plan }>> = w.predArity.map(() => []);
  const startPlans: Array<{ rule: number; plan: Plan }> = [];
  actions.forEach((a, ai) => {
    a.disjuncts.forEach((d, di) => {
      const scopes: Array<LEffItem | null> = [null, ...a.items.filter((it) => it.adds.length > 0)];
      for (const item of scopes) {
        const body = bodyOf(w, a, d, item);
        const ri = rules.length;
        rules.push({ action: ai, disjunct: di, isAction: item === null, vars: body.vars, head: item ? item.adds : a.adds });
        let fluentAtoms = 0;
        body.atoms.forEach((at, j) => {
          if (w.isStatic[at.pred]) return;
          fluentAtoms++;
          triggers[at.pred].push({ rule: ri, plan: compilePlan(body, w.isStatic, [], j) });
        });
        if (fluentAtoms === 0) startPlans.push({ rule: ri, plan: compilePlan(body, w.isStatic, []) });
      }
    });
  });

  const instances: Instance[] = [];
  const seen = actions.map(() => new Set<string>());
  let current: Rule = rules[0];
  const emit = (): void => {
    poll("grounding: reach");
    const r = current;
    const j = joiners[r.action];
    const b = j.binding;
    if (r.isAction) {
      let key = `${r.disjunct}`;
      for (const v of r.vars) key += "," + b[v];
      const s = seen[r.action];
      if (!s.has(key)) {
        s.add(key);
        instances.push({ action: r.action, disjunct: r.disjunct, binding: b.slice() });
        if (instances.length > MAX_INSTANCES) {
          throw new PlumblineError("limit", `more than ${MAX_INSTANCES} reachable ground actions; the task is too large to ground`);
        }
      }
    }
    for (const h of r.head) {
      const args = new Array<number>(h.args.length);
      for (let i = 0; i < args.length; i++) {
        const t = h.args[i];
        args[i] = t >= 0 ? t : b[-t - 1];
      }
      addFact(h.pred, args);
    }
  };
  for (const sp of startPlans) {
    current = rules[sp.rule];
    joiners[current.action].run(sp.plan, emit);
  }
  for (let qi = 0; qi < queue.length; qi++) {
    poll("grounding: reach");
    const f = queue[qi];
    const pred = factPred[f];
    const args = factArgs[f];
    processed[pred].add(args);
    for (const t of triggers[pred]) {
      current = rules[t.rule];
      joiners[current.action].run(t.plan, emit, args);
    }
  }
  return { factPred, factArgs, sets, gid, instances, joiners };
}
