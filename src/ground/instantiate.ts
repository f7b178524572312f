// Builds ground actions from the reachable instances: fact ids for conditions and effects,
// conditional effects enumerated and simplified against the precondition, costs looked up.
import { PlumblineError } from "../util/errors.js";
import { atomText } from "../pddl/index.js";
import { compilePlan, type Plan } from "./join.js";
import type { LAction, LAtom, LLit } from "./lifted.js";
import { bodyOf, type Reached } from "./reach.js";
import { compareKeys, sortedUnique, type DraftAction } from "./draft.js";
import type { CondEffect, CostModel } from "./task.js";
import type { World } from "./world.js";
import { poll } from "../util/limits.js";

/** Looks up reachable fact numbers for ground atoms. */
export class FactLookup {
  constructor(
    private readonly w: World,
    private readonly r: Reached,
  ) {}

  /** Draft fact number of the atom under `b`, or -1 when it is not reachable. */
  /** Ids of reachable atoms under `b`; unreachable ones are skipped, or an error when `required`. */
  ids(atoms: readonly LAtom[], b: Int32Array, required: string | null): number[] {
    const out: number[] = [];
    for (const at of atoms) {
      const id = this.id(at, b);
      if (id >= 0) out.push(id);
      else if (required) throw new Error(`grounder: unreached ${required}`);
    }
    return out;
  }

  id(a: LAtom, b: Int32Array): number {
    const args = a.args.map((t) => (t >= 0 ? t : b[-t - 1]));
    const i = this.r.sets[a.pred].find(args);
    return i < 0 ? -1 : this.r.gid[a.pred][i];
  }

  name(f: number): string {
    const sym = this.w.model.symbols;
    return atomText(this.w.predNames[this.r.factPred[f]], this.r.factArgs[f].map((o) => sym.objects[o]));
  }
}

function intersects(a: readonly number[], b: ReadonlySet<number>): boolean {
  for (const x of a) if (b.has(x)) return true;
  return false;
}

/** Turns one conditional effect into canonical form relative to the precondition; null = drop. */
export function simplifyCond(ce: CondEffect, pre: ReadonlySet<number>, preNeg: ReadonlySet<number>): CondEffect | null {
  if (intersects(ce.cond, preNeg) || intersects(ce.condNeg, pre)) return null; // can never fire
  const cond = sortedUnique(ce.cond.filter((f) => !pre.has(f)));
  const condNeg = sortedUnique(ce.condNeg.filter((f) => !preNeg.has(f)));
  const cs = new Set(cond);
  if (condNeg.some((f) => cs.has(f))) return null;
  const add = sortedUnique(ce.add);
  const adds = new Set(add);
  const del = sortedUnique(ce.del.filter((f) => !adds.has(f)));
  if (add.length === 0 && del.length === 0) return null;
  return { cond, condNeg, add, del };
}

/**
 * Merges unconditional effects into the main lists, joins effects with equal conditions,
 * and applies "an added fact is not deleted". Returns the action's final effect lists.
 */
export function finishEffects(add: number[], del: number[], ces: CondEffect[]): { add: number[]; del: number[]; cond: CondEffect[] } {
  const mainAdd = new Set(add);
  const mainDel = new Set(del);
  const byCond = new Map<string, CondEffect>();
  for (const ce of ces) {
    if (ce.cond.length === 0 && ce.condNeg.length === 0) {
      for (const f of ce.add) mainAdd.add(f);
      for (const f of ce.del) mainDel.add(f);
      continue;
    }
    const k = `${ce.cond.join(",")}|${ce.condNeg.join(",")}`;
    const old = byCond.get(k);
    if (old) {
      old.add = sortedUnique([...old.add, ...ce.add]);
      old.del = sortedUnique([...old.del, ...ce.del]);
    } else byCond.set(k, { ...ce });
  }
  for (const f of mainAdd) mainDel.delete(f);
  const cond: CondEffect[] = [];
  for (const ce of byCond.values()) {
    // effects the main part already has change nothing
    const a = ce.add.filter((f) => !mainAdd.has(f));
    const as = new Set(ce.add);
    const d = ce.del.filter((f) => !mainDel.has(f) && !mainAdd.has(f) && !as.has(f));
    if (a.length || d.length) cond.push({ cond: ce.cond, condNeg: ce.condNeg, add: a, del: d });
  }
  cond.sort((x, y) => compareKeys([...x.cond, -1, ...x.condNeg], [...y.cond, -1, ...y.condNeg]));
  return { add: sortedUnique(mainAdd), del: sortedUnique(mainDel), cond };
}

export function instantiate(w: World, actions: readonly LAction[], r: Reached, costModel: CostModel): DraftAction[] {
  const sym = w.model.symbols;
  const facts = new FactLookup(w, r);
  const itemPlans = new Map<string, Plan>();
  const out: DraftAction[] = [];
  const fluentIds = (lits: readonly LLit[], neg: boolean, b: Int32Array, required: boolean): number[] | null => {
    const ids: number[] = [];
    for (const l of lits) {
      if (l.neg !== neg || w.isStatic[l.pred]) continue;
      const id = facts.id(l, b);
      if (id < 0) {
        if (required) return null;
        continue;
      }
      ids.push(id);
    }
    return ids;
  };
  for (const inst of r.instances) {
    poll("grounding: instantiate");
    const a = actions[inst.action];
    const d = a.disjuncts[inst.disjunct];
    const b = inst.binding;
    const pre = fluentIds(d.lits, false, b, true);
    if (!pre) throw new Error(`grounder: unreachable precondition in a reachable instance of ${a.name}`);
    const preNeg = fluentIds(d.lits, true, b, false)!;
    const preSet = new Set(pre);
    const preNegSet = new Set(preNeg);
    if (intersects(pre, preNegSet)) continue; // contradictory: never applicable
    const args = [];
    for (let v = 0; v < a.nParams; v++) args.push(sym.objects[b[v]]);
    const name = `(${[a.name, ...args].join(" ")})`;
    const add = facts.ids(a.adds, b, `add effect of ${name}`);
    const del = facts.ids(a.dels, b, null);
    const ces: CondEffect[] = [];
    const joiner = r.joiners[inst.action];
    a.items.forEach((item, ii) => {
      const key = `${inst.action}:${inst.disjunct}:${ii}`;
      let plan = itemPlans.get(key);
      if (!plan) {
        const actionVars = bodyOf(w, a, d, null).vars;
        const body = { atoms: item.cond.lits.filter((l) => !l.neg), negStatic: item.cond.lits.filter((l) => l.neg && w.isStatic[l.pred]), eqs: item.cond.eqs, vars: item.vars };
        plan = compilePlan(body, w.isStatic, actionVars);
        itemPlans.set(key, plan);
      }
      joiner.binding.set(b);
      joiner.run(plan, () => {
        const jb = joiner.binding;
        const cond = fluentIds(item.cond.lits, false, jb, true);
        if (!cond) return;
        const condNeg = fluentIds(item.cond.lits, true, jb, false)!;
        const ce = simplifyCond({ cond, condNeg, add: facts.ids(item.adds, jb, `conditional add of ${name}`), del: facts.ids(item.dels, jb, null) }, preSet, preNegSet);
        if (ce) ces.push(ce);
      });
    });
    const eff = finishEffects(add, del, ces);
    let cost = a.costConst;
    for (const t of a.costTerms) {
      const targs = t.args.map((x) => sym.objects[x >= 0 ? x : b[-x - 1]]);
      const v = sym.costValues.get(sym.costKey(t.fn, targs));
      if (!v) {
        throw new PlumblineError(
          "semantic",
          `action ${name} needs the cost value ${atomText(t.fn, targs)}, but the :init of ${w.model.problemPath} does not set it`,
          t.pos,
        );
      }
      cost += v.value;
    }
    if (!Number.isSafeInteger(cost)) throw new PlumblineError("semantic", `the cost of action ${name} is too large`, a.costTerms[0]?.pos);
    if (costModel === "unit") cost = 1;
    const sortKey = [a.schema, ...Array.from(b.subarray(0, a.nParams)), inst.disjunct, ...d.vars.map((v) => b[v])];
    out.push({ name, schema: a.name, args, pre: sortedUnique(pre), preNeg: sortedUnique(preNeg), ...eff, cost, sortKey });
  }
  return out;
}

/** Drops, per action name, disjunct instances whose conditions include another's. */
export function dropSubsumed(actions: DraftAction[]): DraftAction[] {
  const groups = new Map<string, DraftAction[]>();
  for (const a of actions) {
    const g = groups.get(a.name);
    if (g) g.push(a);
    else groups.set(a.name, [a]);
  }
  const keep = new Set<DraftAction>();
  for (const g of groups.values()) {
    if (g.length === 1) {
      keep.add(g[0]);
      continue;
    }
    const sorted = [...g].sort((x, y) => x.pre.length + x.preNeg.length - (y.pre.length + y.preNeg.length));
    const kept: DraftAction[] = [];
    for (const a of sorted) {
      const ps = new Set(a.pre);
      const ns = new Set(a.preNeg);
      if (kept.some((k) => k.pre.every((f) => ps.has(f)) && k.preNeg.every((f) => ns.has(f)))) continue;
      kept.push(a);
    }
    for (const k of kept) keep.add(k);
  }
  return actions.filter((a) => keep.has(a));
}

