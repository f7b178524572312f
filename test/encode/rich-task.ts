// Test helper: fast-check generator of small ground Tasks with everything the factored
// generator lacks — negative preconditions, conditional effects, negative goals, add∩del.
import fc from "fast-check";
import type { Action, CondEffect, Task } from "../../src/ground/task.js";
import { costArb, factId, factoredSpecArb, taskFromSpec, type FactoredArbOptions } from "../support/random-task.js";

export { costArb, nonTrivial } from "../support/random-task.js";

export interface RichTaskOptions {
  minFacts?: number;
  maxFacts?: number;
  minActions?: number;
  maxActions?: number;
  maxCost?: number;
  /** At most one fact per precondition/effect list (more independent actions). */
  sparse?: boolean;
  /** Probability that an action costs 0. */
  zeroCostShare?: number;
}

/** Re-draws every action's cost of the tasks of `arb` with costArb. */
export function withCosts(arb: fc.Arbitrary<Task>, maxCost: number, zeroShare = 0.3): fc.Arbitrary<Task> {
  return arb.chain((t) =>
    fc.array(costArb(maxCost, zeroShare), { minLength: t.actions.length, maxLength: t.actions.length }).map((cs) => ({
      ...t,
      actions: t.actions.map((a, i) => ({ ...a, cost: cs[i] })),
    })),
  );
}

export function richTaskArb(o: RichTaskOptions = {}): fc.Arbitrary<Task> {
  const maxFacts = o.maxFacts ?? 5;
  const maxActions = o.maxActions ?? 6;
  const maxCost = o.maxCost ?? 3;
  const zero = o.zeroCostShare ?? 0.3;
  return fc.integer({ min: o.minFacts ?? 2, max: maxFacts }).chain((nF) => {
    const ids = Array.from({ length: nF }, (_, i) => i);
    const small = fc.subarray(ids, { minLength: 0, maxLength: Math.min(o.sparse ? 1 : 2, nF) });
    const cost = costArb(maxCost, zero);
    const condEffect: fc.Arbitrary<CondEffect> = fc.record({ cond: small, condNeg: small, add: small, del: small }).map((c) => ({
      ...c,
      condNeg: c.condNeg.filter((f) => !c.cond.includes(f)),
    }));
    const action = fc.record({ pre: small, preNeg: small, add: small, del: small, cond: fc.array(condEffect, { maxLength: 2 }), cost });
    return fc.record({
      init: fc.subarray(ids),
      goal: fc.subarray(ids, { minLength: 1, maxLength: 2 }),
      goalNeg: small,
      actions: fc.array(action, { minLength: o.minActions ?? 1, maxLength: maxActions }),
    }).map((r): Task => ({
      domainName: "rich",
      problemName: "rich",
      facts: ids.map((i) => `(p${i})`),
      init: r.init,
      goal: r.goal,
      goalNeg: r.goalNeg.filter((f) => !r.goal.includes(f)),
      actions: r.actions.map((a, i): Action => ({
        name: `(r${i})`,
        schema: `r${i}`,
        args: [],
        pre: a.pre,
        preNeg: a.preNeg.filter((f) => !a.pre.includes(f)),
        add: a.add,
        del: a.del,
        cond: a.cond,
        cost: a.cost,
      })),
      costModel: "action-costs",
    }));
  });
}

/** Mostly solvable tasks (3 in 4), the rest unrestricted (unsolvable ones test UNSAT answers). */
export function mostlySolvable(arb: fc.Arbitrary<Task>, solvable: (t: Task) => boolean): fc.Arbitrary<Task> {
  return fc.oneof({ weight: 3, arbitrary: arb.filter(solvable) }, { weight: 1, arbitrary: arb });
}

/** fast-check run counts: the given number normally, five times as many under PLUMBLINE_SLOW. */
export const runs = (n: number): number => (process.env.PLUMBLINE_SLOW ? 5 * n : n);

/**
 * Factored tasks (test/support/random-task.ts) with fresh costs and their natural mutex
 * groups: the facts of each variable (exactly one of them holds in every state).
 */
export function factoredWithGroups(o: FactoredArbOptions, maxCost: number): fc.Arbitrary<{ task: Task; groups: number[][] }> {
  return factoredSpecArb(o).chain((spec) => {
    const groups = spec.domains.map((d, v) => Array.from({ length: d }, (_, x) => factId(spec.domains, v, x)));
    return withCosts(fc.constant(taskFromSpec(spec)), maxCost).map((task) => ({ task, groups }));
  });
}

/**
 * "Move" tasks: most actions change one variable from one value to another, maybe reading a
 * value of another variable (as robots moving between cells); the others set a variable
 * without requiring its old value, after reading another one. Each variable's movers form a
 * cost clique (spec forall-2); setters and readers may share a step, which is exactly what a
 * clique must never contain.
 */
export function movesTaskArb(maxCost = 5): fc.Arbitrary<{ task: Task; groups: number[][] }> {
  type VV = [number, number];
  return fc
    .array(fc.integer({ min: 2, max: 3 }), { minLength: 2, maxLength: 3 })
    .chain((domains) => {
      const n = domains.length;
      const val = (v: number) => fc.integer({ min: 0, max: domains[v] - 1 });
      const vv = (v: number) => fc.tuple(fc.constant(v), val(v));
      const other = (v: number) => fc.integer({ min: 0, max: n - 1 }).filter((w) => w !== v);
      const move = fc.integer({ min: 0, max: n - 1 }).chain((v) =>
        fc
          .tuple(vv(v), fc.integer({ min: 1, max: domains[v] - 1 }), fc.option(other(v).chain(vv)))
          .map(([[, x], k, read]) => ({ pre: [[v, x] as VV, ...(read ? [read as VV] : [])], eff: [[v, (x + k) % domains[v]] as VV] })),
      );
      const setter = fc.integer({ min: 0, max: n - 1 }).chain((u) => fc.tuple(vv(u), other(u).chain(vv)).map(([eff, read]) => ({ pre: [read as VV], eff: [eff as VV] })));
      return fc.record({
        domains: fc.constant(domains),
        init: fc.tuple(...domains.map((_, v) => val(v))),
        goal: fc.array(fc.integer({ min: 0, max: n - 1 }).chain(vv), { minLength: 1, maxLength: n }),
        actions: fc
          .noBias(fc.integer({ min: 5, max: 8 }))
          .chain((len) => fc.array(fc.oneof({ weight: 3, arbitrary: move }, { weight: 1, arbitrary: setter }), { minLength: len, maxLength: len })),
      });
    })
    .map((r) => ({
      domains: r.domains,
      init: [...r.init],
      goal: r.goal as VV[],
      actions: r.actions.map((a) => ({ ...a, cost: 1 })),
    }))
    .chain((spec) => {
      const groups = spec.domains.map((d, v) => Array.from({ length: d }, (_, x) => factId(spec.domains, v, x)));
      return withCosts(fc.constant(taskFromSpec(spec)), maxCost).map((task) => ({ task, groups }));
    });
}

/** The smallest task with a plan: (a) holds, (go) turns it into the goal (b) at cost 1. */
export function oneStepTask(): Task {
  return {
    domainName: "d",
    problemName: "p",
    facts: ["(a)", "(b)"],
    init: [0],
    goal: [1],
    goalNeg: [],
    actions: [{ name: "(go)", schema: "go", args: [], pre: [0], preNeg: [], add: [1], del: [0], cond: [], cost: 1 }],
    costModel: "action-costs",
  };
}
