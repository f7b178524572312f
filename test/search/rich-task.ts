// fast-check generator of small random STRIPS tasks with what the factored generator
// lacks: negative preconditions and goals, conditional effects, zero-cost actions.
import fc from "fast-check";
import type { Action, CondEffect, Task } from "../../src/ground/task.js";

const sorted = (xs: number[]) => [...new Set(xs)].sort((a, b) => a - b);

export interface RichOptions {
  maxFacts?: number;
  maxActions?: number;
  /** Allow conditional effects (default true). */
  cond?: boolean;
  /** Allow negative preconditions, conditions and goals (default true). */
  neg?: boolean;
}

export function richTaskArb(o: RichOptions = {}): fc.Arbitrary<Task> {
  const maxFacts = o.maxFacts ?? 7;
  const maxActions = o.maxActions ?? 9;
  const useCond = o.cond ?? true;
  const useNeg = o.neg ?? true;
  return fc.integer({ min: 2, max: maxFacts }).chain((nf) => {
    const fact = fc.integer({ min: 0, max: nf - 1 });
    const facts = (max: number) => fc.array(fact, { maxLength: max }).map(sorted);
    const negFacts = useNeg ? facts(1) : fc.constant([] as number[]);
    const ce: fc.Arbitrary<CondEffect> = fc.record({ cond: facts(2), condNeg: negFacts, add: facts(2), del: facts(1) });
    const cost = fc.oneof(fc.constant(0), fc.integer({ min: 1, max: 4 }), fc.integer({ min: 1, max: 4 }));
    const action = fc.record({
      pre: facts(2),
      preNeg: negFacts,
      add: fc.array(fact, { minLength: 1, maxLength: 2 }).map(sorted),
      del: facts(2),
      cond: useCond ? fc.array(ce, { maxLength: 2 }) : fc.constant([] as CondEffect[]),
      cost,
    });
    return fc.record({
      init: facts(nf),
      goal: fc.array(fact, { minLength: 1, maxLength: 3 }).map(sorted),
      goalNeg: negFacts,
      actions: fc.array(action, { minLength: 1, maxLength: maxActions }),
    }).map(({ init, goal, goalNeg, actions }): Task => ({
      domainName: "rich",
      problemName: "rich",
      facts: Array.from({ length: nf }, (_, i) => `(p${i})`),
      init,
      goal,
      goalNeg: goalNeg.filter((f) => !goal.includes(f)),
      actions: actions.map((a, i): Action => ({ name: `(act${i})`, schema: `act${i}`, args: [], ...a })),
      costModel: "action-costs",
    }));
  });
}

/** The same task with another initial state (for heuristic checks at every state). */
export function withInit(task: Task, init: Iterable<number>): Task {
  return { ...task, init: sorted([...init]) };
}

/**
 * Re-draws the action costs of generated tasks: about a third zero, the rest 1..maxCost.
 * (The shared factored generator draws its zero/positive choice from a double that
 * fast-check biases toward 0, so almost all of its costs come out 0.)
 */
export function withRandomCosts(arb: fc.Arbitrary<Task>, maxCost = 4): fc.Arbitrary<Task> {
  return arb.chain((t) =>
    fc
      .array(fc.oneof(fc.constant(0), fc.integer({ min: 1, max: maxCost }), fc.integer({ min: 1, max: maxCost })), {
        minLength: t.actions.length,
        maxLength: t.actions.length,
      })
      .map((costs) => ({ ...t, actions: t.actions.map((a, i) => ({ ...a, cost: costs[i] })) })),
  );
}

export { nonTrivial } from "../support/random-task.js";

/**
 * The same task with `k` unused facts in front, so its facts land on other bit positions
 * (e.g. bit 31 of a word and across word boundaries of packed states).
 */
export function shiftFacts(task: Task, k: number): Task {
  const m = (xs: number[]) => xs.map((f) => f + k);
  return {
    ...task,
    facts: [...Array.from({ length: k }, (_, i) => `(pad${i})`), ...task.facts],
    init: m(task.init),
    goal: m(task.goal),
    goalNeg: m(task.goalNeg),
    actions: task.actions.map((a) => ({
      ...a,
      pre: m(a.pre),
      preNeg: m(a.preNeg),
      add: m(a.add),
      del: m(a.del),
      cond: a.cond.map((c) => ({ cond: m(c.cond), condNeg: m(c.condNeg), add: m(c.add), del: m(c.del) })),
    })),
  };
}
