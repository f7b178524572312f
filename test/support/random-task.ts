// fast-check generators of small random ground Tasks (factored systems: a few variables
// with 2–3 values each, random actions and costs, zeros included) for property tests.
import fc from "fast-check";
import type { Action, Task } from "../../src/ground/task.js";

export interface FactoredSpec {
  domains: number[]; // domain size per variable
  init: number[]; // value per variable
  goal: Array<[number, number]>; // (variable, value) pairs
  actions: Array<{
    pre: Array<[number, number]>;
    eff: Array<[number, number]>;
    cost: number;
  }>;
}

/** Fact id of variable v having value x, for the given domain sizes. */
export function factId(domains: number[], v: number, x: number): number {
  let id = 0;
  for (let i = 0; i < v; i++) id += domains[i];
  return id + x;
}

const uniqSorted = (xs: number[]) => [...new Set(xs)].sort((a, b) => a - b);

/** STRIPS Task of a factored spec: facts "(v<i> <x>)", an effect v:=x deletes every other value of v. */
export function taskFromSpec(spec: FactoredSpec): Task {
  const { domains } = spec;
  const facts: string[] = [];
  domains.forEach((d, v) => {
    for (let x = 0; x < d; x++) facts.push(`(v${v} x${x})`);
  });
  const actions: Action[] = spec.actions.map((a, i) => {
    const preMap = new Map<number, number>();
    for (const [v, x] of a.pre) preMap.set(v, x);
    const effMap = new Map<number, number>();
    for (const [v, x] of a.eff) effMap.set(v, x);
    const pre = uniqSorted([...preMap].map(([v, x]) => factId(domains, v, x)));
    const add = uniqSorted([...effMap].map(([v, x]) => factId(domains, v, x)));
    const del: number[] = [];
    for (const [v, x] of effMap) for (let y = 0; y < domains[v]; y++) if (y !== x) del.push(factId(domains, v, y));
    return { name: `(a${i})`, schema: `a${i}`, args: [], pre, preNeg: [], add, del: uniqSorted(del), cond: [], cost: a.cost };
  });
  const goalMap = new Map<number, number>();
  for (const [v, x] of spec.goal) goalMap.set(v, x);
  return {
    domainName: "random",
    problemName: "random",
    facts,
    init: spec.init.map((x, v) => factId(domains, v, x)),
    goal: uniqSorted([...goalMap].map(([v, x]) => factId(domains, v, x))),
    goalNeg: [],
    actions,
    costModel: "action-costs",
  };
}

export interface FactoredArbOptions {
  minVars?: number;
  maxVars?: number;
  maxDomain?: number;
  maxActions?: number;
  maxCost?: number;
  /** probability weight of zero-cost actions (0..1); default 0.3 */
  zeroCostShare?: number;
}

export function factoredSpecArb(o: FactoredArbOptions = {}): fc.Arbitrary<FactoredSpec> {
  const minVars = o.minVars ?? 2;
  const maxVars = o.maxVars ?? 5;
  const maxDomain = o.maxDomain ?? 3;
  const maxActions = o.maxActions ?? 8;
  const maxCost = o.maxCost ?? 4;
  const zeroShare = o.zeroCostShare ?? 0.3;
  return fc
    .array(fc.integer({ min: 2, max: maxDomain }), { minLength: minVars, maxLength: maxVars })
    .chain((domains) => {
      const n = domains.length;
      const varVal = fc.integer({ min: 0, max: n - 1 }).chain((v) => fc.tuple(fc.constant(v), fc.integer({ min: 0, max: domains[v] - 1 })));
      // an integer draw (fast-check biases doubles toward 0, which made nearly every cost 0)
      const cost = fc.noBias(fc.integer({ min: 0, max: 999 })).chain((r) => (r < zeroShare * 1000 ? fc.constant(0) : fc.integer({ min: 1, max: maxCost })));
      const action = fc.record({
        pre: fc.array(varVal, { minLength: 0, maxLength: Math.min(3, n) }),
        eff: fc.array(varVal, { minLength: 1, maxLength: Math.min(2, n) }),
        cost,
      });
      return fc.record({
        domains: fc.constant(domains),
        init: fc.tuple(...domains.map((d) => fc.integer({ min: 0, max: d - 1 }))),
        goal: fc.array(varVal, { minLength: 1, maxLength: n }),
        actions: fc.array(action, { minLength: 1, maxLength: maxActions }),
      });
    })
    .map((r) => ({ ...r, init: [...r.init] }));
}

export function factoredTaskArb(o: FactoredArbOptions = {}): fc.Arbitrary<Task> {
  return factoredSpecArb(o).map(taskFromSpec);
}

/**
 * A cost in 0..maxCost that is 0 with probability zeroShare: the coin is an unbiased draw
 * from 0..99 (fast-check biases its numbers towards the minimum; through a double in [0, 1)
 * almost every action would be free).
 */
export function costArb(maxCost: number, zeroShare: number): fc.Arbitrary<number> {
  return fc.tuple(fc.noBias(fc.nat({ max: 99 })), fc.integer({ min: 1, max: maxCost })).map(([r, c]) => (r < zeroShare * 100 ? 0 : c));
}

/** Drops tasks whose goal already holds initially (they make every query trivial). */
export function nonTrivial(arb: fc.Arbitrary<Task>): fc.Arbitrary<Task> {
  return arb.filter((t) => !(t.goal.every((f) => t.init.includes(f)) && t.goalNeg.every((f) => !t.init.includes(f))));
}
