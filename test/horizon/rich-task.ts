// fast-check generator of small random ground Tasks that use everything the Task contract
// allows: negative preconditions, conditional effects (with negative conditions), zero costs.
import fc from "fast-check";
import type { Action, CondEffect, Task } from "../../src/ground/task.js";
import { costArb, taskFromSpec, type FactoredSpec } from "../support/random-task.js";

const sortedUniq = (xs: number[]) => [...new Set(xs)].sort((a, b) => a - b);

export interface RichOptions {
  minFacts?: number;
  maxFacts?: number;
  maxActions?: number;
  maxCost?: number;
  zeroShare?: number;
  /** Allow negative preconditions and conditional effects (default true). */
  rich?: boolean;
  maxPre?: number;
}

export function richTaskArb(o: RichOptions = {}): fc.Arbitrary<Task> {
  const minFacts = o.minFacts ?? 3;
  const maxFacts = o.maxFacts ?? 6;
  const rich = o.rich ?? true;
  return fc.integer({ min: minFacts, max: maxFacts }).chain((F) => {
    const fact = fc.integer({ min: 0, max: F - 1 });
    const facts = (max: number) => fc.array(fact, { maxLength: max }).map(sortedUniq);
    const cost = costArb(o.maxCost ?? 3, o.zeroShare ?? 0.3);
    const cond: fc.Arbitrary<CondEffect> = fc.record({ cond: facts(2), condNeg: facts(1), add: facts(2), del: facts(2) });
    const action = fc.record({
      pre: facts(o.maxPre ?? 1),
      preNeg: rich ? facts(1) : fc.constant([] as number[]),
      add: facts(2),
      del: facts(2),
      cond: rich ? fc.array(cond, { maxLength: 2 }) : fc.constant([] as CondEffect[]),
      cost,
    });
    return fc.record({
      F: fc.constant(F),
      init: facts(F),
      goal: facts(2),
      goalNeg: rich ? facts(1) : fc.constant([] as number[]),
      actions: fc.array(action, { minLength: 1, maxLength: o.maxActions ?? 9 }),
    });
  }).map(({ F, init, goal: goal0, goalNeg, actions }) => {
    let goal = goal0;
    const acts: Action[] = actions.map((a, i) => ({
      name: `(r${i})`,
      schema: `r${i}`,
      args: [],
      pre: a.pre,
      preNeg: a.preNeg.filter((f) => !a.pre.includes(f)),
      add: a.add,
      del: a.del,
      cond: a.cond.map((c) => ({ ...c, condNeg: c.condNeg.filter((f) => !c.cond.includes(f)) })),
      cost: a.cost,
    }));
    // the goal needs at least one fact that is initially false
    if (goal.every((f) => init.includes(f))) goal = [...new Set([...goal, ...Array.from({ length: F }, (_, f) => f).filter((f) => !init.includes(f)).slice(0, 1)])].sort((a, b) => a - b);
    return {
      domainName: "rich",
      problemName: "rich",
      facts: Array.from({ length: F }, (_, i) => `(p${i})`),
      init,
      goal,
      goalNeg: goalNeg.filter((f) => !goal.includes(f)),
      actions: acts,
      costModel: "action-costs" as const,
    };
  });
}

/**
 * Factored tasks shaped like planning domains: each action moves one variable from one value
 * to another (its precondition), sometimes needs a value of another variable, and sometimes
 * changes a second variable too. Goals are 1–2 variable values.
 */
export function transitionTaskArb(o: { minVars?: number; maxVars?: number; maxDomain?: number; maxActions?: number; maxCost?: number; zeroShare?: number } = {}): fc.Arbitrary<Task> {
  return fc
    .array(fc.integer({ min: 2, max: o.maxDomain ?? 3 }), { minLength: o.minVars ?? 2, maxLength: o.maxVars ?? 4 })
    .chain((domains) => {
      const n = domains.length;
      const val = (v: number) => fc.integer({ min: 0, max: domains[v] - 1 });
      const varVal = fc.integer({ min: 0, max: n - 1 }).chain((v) => fc.tuple(fc.constant(v), val(v)));
      const cost = costArb(o.maxCost ?? 3, o.zeroShare ?? 0.3);
      const action = fc.integer({ min: 0, max: n - 1 }).chain((v) =>
        fc.record({
          v: fc.constant(v),
          from: fc.option(val(v), { freq: 4 }),
          to: val(v),
          extraPre: fc.option(varVal, { freq: 2 }),
          extraEff: fc.option(varVal, { freq: 3 }),
          cost,
        }),
      );
      return fc.record({
        domains: fc.constant(domains),
        init: fc.tuple(...domains.map((_, v) => val(v))),
        goal: fc.array(varVal, { minLength: 1, maxLength: 2 }),
        actions: fc.array(action, { minLength: 2, maxLength: o.maxActions ?? 10 }),
      });
    })
    .map((r): FactoredSpec => ({
      domains: r.domains,
      init: [...r.init],
      // the first goal variable always wants a value other than its initial one
      goal: r.goal.map(([v, x], i) => (i === 0 && x === r.init[v] ? [v, (x + 1) % r.domains[v]] : [v, x]) as [number, number]),
      actions: r.actions.map((a) => ({
        pre: [...(a.from === null ? [] : [[a.v, a.from] as [number, number]]), ...(a.extraPre === null || a.extraPre[0] === a.v ? [] : [a.extraPre])],
        eff: [[a.v, a.to] as [number, number], ...(a.extraEff === null || a.extraEff[0] === a.v ? [] : [a.extraEff])],
        cost: a.cost,
      })),
    }))
    .map(taskFromSpec);
}

/**
 * Factored tasks where zero-cost moves of one variable (values 2–4) are gated by "context"
 * variables that only positive-cost actions change — the shape the zero-cost bound splits by
 * context value when the projection onto the variable and its context is too large.
 */
export function gatedTaskArb(o: { maxContext?: number; maxCost?: number } = {}): fc.Arbitrary<Task> {
  return fc
    .record({ s: fc.integer({ min: 2, max: 4 }), ctx: fc.array(fc.integer({ min: 2, max: 3 }), { minLength: 1, maxLength: o.maxContext ?? 2 }) })
    .chain(({ s, ctx }) => {
      const domains = [s, ...ctx];
      const val = (v: number) => fc.integer({ min: 0, max: domains[v] - 1 });
      const ctxVal = fc.integer({ min: 1, max: ctx.length }).chain((v) => fc.tuple(fc.constant(v), val(v)));
      const cost = fc.integer({ min: 1, max: o.maxCost ?? 3 });
      const move = fc.record({ from: fc.option(val(0), { freq: 3 }), to: val(0), gate: fc.option(ctxVal, { freq: 5 }), cost: fc.constant(0) });
      const setCtx = fc.record({ v: ctxVal, from: fc.option(fc.nat(), { freq: 2 }), cost });
      const positiveMove = fc.record({ from: fc.option(val(0), { freq: 2 }), to: val(0), gate: fc.constant(null), cost });
      return fc.record({
        domains: fc.constant(domains),
        init: fc.tuple(...domains.map((_, v) => val(v))),
        goal: fc.tuple(val(0), fc.option(ctxVal, { freq: 2 })),
        moves: fc.array(fc.oneof({ arbitrary: move, weight: 4 }, { arbitrary: positiveMove, weight: 1 }), { minLength: 2, maxLength: 7 }),
        sets: fc.array(setCtx, { minLength: 1, maxLength: 4 }),
      });
    })
    .map((r): FactoredSpec => ({
      domains: r.domains,
      init: [...r.init],
      goal: [[0, r.goal[0] === r.init[0] ? (r.goal[0] + 1) % r.domains[0] : r.goal[0]] as [number, number], ...(r.goal[1] === null ? [] : [r.goal[1]])],
      actions: [
        ...r.moves.map((m) => ({
          pre: [...(m.from === null ? [] : [[0, m.from] as [number, number]]), ...(m.gate === null ? [] : [m.gate])],
          eff: [[0, m.to] as [number, number]],
          cost: m.cost,
        })),
        ...r.sets.map((x) => ({
          pre: x.from === null ? [] : [[x.v[0], x.from % r.domains[x.v[0]]] as [number, number]],
          eff: [x.v],
          cost: x.cost,
        })),
      ],
    }))
    .map(taskFromSpec);
}
