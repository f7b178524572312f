// Grounds the goal: a conjunction becomes goal/goalNeg; a disjunction gets one synthetic
// zero-cost action per disjunct adding a fresh goal fact, and every other action then
// requires that fact false, so the synthetic action is always the last step of a plan.
import { compilePlan, Joiner } from "./join.js";
import type { Conj } from "./lifted.js";
import { Normalizer } from "./normalize.js";
import type { Reached } from "./reach.js";
import { FactLookup } from "./instantiate.js";
import { addSyntheticFact, sortedUnique, type Draft } from "./draft.js";
import type { World } from "./world.js";

export const GOAL_FACT = "(*goal-reached*)";
export const UNREACHABLE_GOAL_FACT = "(*goal-unreachable*)";
export const GOAL_ACTION_SCHEMA = "*reach-goal*";

interface GroundConj {
  pos: number[];
  neg: number[];
}

function groundDisjuncts(w: World, r: Reached, nz: Normalizer, conjs: Conj[], facts: FactLookup): GroundConj[] {
  const masks = nz.varDomain.map((d) => {
    const m = new Uint8Array(w.nObjects);
    for (const o of d) m[o] = 1;
    return m;
  });
  const joiner = new Joiner(nz.varDomain.length, masks, nz.varDomain, r.sets, r.sets);
  const out: GroundConj[] = [];
  const seen = new Set<string>();
  for (const c of conjs) {
    const body = { atoms: c.lits.filter((l) => !l.neg), negStatic: c.lits.filter((l) => l.neg && w.isStatic[l.pred]), eqs: c.eqs, vars: c.vars };
    joiner.run(compilePlan(body, w.isStatic, []), () => {
      const b = joiner.binding;
      const pos: number[] = [];
      const neg: number[] = [];
      for (const l of c.lits) {
        if (w.isStatic[l.pred]) continue;
        const id = facts.id(l, b);
        if (l.neg) {
          if (id >= 0) neg.push(id);
        } else pos.push(id);
      }
      const g = { pos: sortedUnique(pos), neg: sortedUnique(neg) };
      const k = `${g.pos.join(",")}|${g.neg.join(",")}`;
      if (!seen.has(k)) {
        seen.add(k);
        out.push(g);
      }
    });
  }
  return out;
}

/** Sets draft.goal / goalNeg, adding synthetic facts and actions for a disjunctive goal. */
export function compileGoal(w: World, r: Reached, draft: Draft): void {
  const nz = new Normalizer(w, "the goal");
  const conjs = nz.condition(w.model.problem.goal, new Map());
  const facts = new FactLookup(w, r);
  if (conjs.length === 1 && conjs[0].vars.length === 0 && conjs[0].eqs.length === 0) {
    // A plain conjunction: keep even unreachable goal facts, so the task shows why it is unsolvable.
    const pos: number[] = [];
    const neg: number[] = [];
    const b = new Int32Array(1);
    for (const l of conjs[0].lits) {
      if (w.isStatic[l.pred]) {
        // static literals with variables cannot occur here (no variables); ground ones were folded
        continue;
      }
      let id = facts.id(l, b);
      if (id < 0) {
        if (l.neg) continue; // never true, so "not" holds
        const sym = w.model.symbols;
        const name = `(${[w.predNames[l.pred], ...l.args.map((o) => sym.objects[o])].join(" ")})`;
        id = draft.facts.indexOf(name);
        if (id < 0) id = addSyntheticFact(draft, name);
      }
      (l.neg ? neg : pos).push(id);
    }
    draft.goal = sortedUnique(pos);
    draft.goalNeg = sortedUnique(neg);
    return;
  }
  const ds = groundDisjuncts(w, r, nz, conjs, facts);
  if (ds.some((d) => d.pos.length === 0 && d.neg.length === 0)) {
    draft.goal = [];
    draft.goalNeg = [];
    return;
  }
  if (ds.length === 0) {
    draft.goal = [addSyntheticFact(draft, UNREACHABLE_GOAL_FACT)];
    draft.goalNeg = [];
    return;
  }
  if (ds.length === 1) {
    draft.goal = ds[0].pos;
    draft.goalNeg = ds[0].neg;
    return;
  }
  const g = addSyntheticFact(draft, GOAL_FACT);
  for (const a of draft.actions) a.preNeg = sortedUnique([...a.preNeg, g]);
  ds.forEach((d, i) => {
    draft.actions.push({
      name: `(${GOAL_ACTION_SCHEMA} ${i + 1})`,
      schema: GOAL_ACTION_SCHEMA,
      args: [String(i + 1)],
      pre: d.pos,
      preNeg: sortedUnique([...d.neg, g]),
      add: [g],
      del: [],
      cond: [],
      cost: 0,
      synthetic: true,
      sortKey: [Number.MAX_SAFE_INTEGER, i],
    });
  });
  draft.goal = [g];
  draft.goalNeg = [];
}
