// Random small ADL models (typed parameters, constants, static and fluent predicates,
// or/imply/exists/forall/= conditions, forall/when effects, disjunctive goals) are grounded,
// and the Task is checked against the lifted semantics along random walks.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { ground } from "../../src/ground/index.js";
import { modelFromTexts } from "../../src/pddl/index.js";
import { holds, initialState } from "../../src/plan/index.js";
import { applicable, optimalCost, successor } from "../support/reference.js";
import { liftedMoves } from "./lifted-oracle.js";

const TYPES = ["ta", "tb", "object", "(either ta tb)"];
const ALL_OBJECTS = ["c1", "c3", "o1", "o2"];
// predicate name → arity; s* are static (never in an effect)
const PREDS: Array<[string, number]> = [
  ["f0", 0],
  ["f1", 1],
  ["g1", 1],
  ["f2", 2],
  ["s1", 1],
  ["s2", 2],
];
/** More random models under `npm run test:slow`. */
const SLOW = !!process.env.PLUMBLINE_SLOW;
const FLUENT = PREDS.filter(([p]) => !p.startsWith("s"));

type Gen<T> = fc.Arbitrary<T>;

/** A condition over the variables in scope (names with their types). */
/** Constants a domain may name; a goal may also name problem objects. */
const DOMAIN_TERMS = ["c1", "c3"];
const GOAL_TERMS = ["c1", "o2"];

function formula(scope: string[], depth: number, fresh: { n: number }, names = DOMAIN_TERMS): Gen<string> {
  const term = fc.constantFrom(...scope, ...names);
  const atom = fc.constantFrom(...PREDS).chain(([p, n]) => fc.array(term, { minLength: n, maxLength: n }).map((args) => `(${[p, ...args].join(" ")})`));
  const eq = fc.tuple(term, term).map(([a, b]) => `(= ${a} ${b})`);
  const leaf = fc.oneof({ weight: 4, arbitrary: atom }, { weight: 1, arbitrary: eq });
  if (depth === 0) return fc.oneof(leaf, leaf.map((x) => `(not ${x})`));
  const sub = () => formula(scope, depth - 1, fresh, names);
  return fc.oneof(
    { weight: 3, arbitrary: leaf },
    { weight: 1, arbitrary: leaf.map((x) => `(not ${x})`) },
    { weight: 2, arbitrary: fc.array(sub(), { minLength: 0, maxLength: 3 }).map((xs) => `(and ${xs.join(" ")})`) },
    { weight: 2, arbitrary: fc.array(sub(), { minLength: 1, maxLength: 3 }).map((xs) => `(or ${xs.join(" ")})`) },
    { weight: 1, arbitrary: fc.tuple(sub(), sub()).map(([a, b]) => `(imply ${a} ${b})`) },
    { weight: 1, arbitrary: sub().map((x) => `(not ${x})`) },
    {
      weight: 2,
      arbitrary: fc.tuple(fc.constantFrom("exists", "forall"), fc.constantFrom(...TYPES)).chain(([q, t]) => {
        const v = `?q${fresh.n++}`;
        return formula([...scope, v], depth - 1, fresh, names).map((body) => `(${q} (${v} - ${t}) ${body})`);
      }),
    },
  );
}

function literal(scope: string[]): Gen<string> {
  const term = fc.constantFrom(...scope, ...DOMAIN_TERMS);
  return fc
    .tuple(fc.constantFrom(...FLUENT), fc.boolean())
    .chain(([[p, n], neg]) => fc.array(term, { minLength: n, maxLength: n }).map((args) => (neg ? `(not (${[p, ...args].join(" ")}))` : `(${[p, ...args].join(" ")})`)));
}

function effect(scope: string[], fresh: { n: number }): Gen<string> {
  return fc.oneof(
    { weight: 3, arbitrary: literal(scope) },
    {
      weight: 1,
      arbitrary: fc.constantFrom(...TYPES).chain((t) => {
        const v = `?e${fresh.n++}`;
        return fc.array(literal([...scope, v]), { minLength: 1, maxLength: 2 }).map((ls) => `(forall (${v} - ${t}) (and ${ls.join(" ")}))`);
      }),
    },
    { weight: 2, arbitrary: fc.tuple(formula(scope, 1, fresh), fc.array(literal(scope), { minLength: 1, maxLength: 2 })).map(([c, ls]) => `(when ${c} (and ${ls.join(" ")}))`) },
    {
      weight: 1,
      arbitrary: fc.constantFrom(...TYPES).chain((t) => {
        const v = `?e${fresh.n++}`;
        return fc.tuple(formula([...scope, v], 0, fresh), literal([...scope, v])).map(([c, l]) => `(forall (${v} - ${t}) (when ${c} ${l}))`);
      }),
    },
  );
}

const action = (i: number): Gen<string> =>
  fc.array(fc.constantFrom(...TYPES), { maxLength: 2 }).chain((types) => {
    const params = types.map((_, k) => `?p${k}`);
    const fresh = { n: 0 };
    return fc
      .tuple(formula(params, 2, fresh), fc.array(effect(params, fresh), { minLength: 1, maxLength: 3 }), fc.integer({ min: 0, max: 3 }))
      .map(([pre, effs, cost]) => `(:action a${i} :parameters (${params.map((p, k) => `${p} - ${types[k]}`).join(" ")})
    :precondition ${pre}
    :effect (and ${effs.join(" ")} (increase (total-cost) ${cost})))`);
  });

const groundAtoms = PREDS.flatMap(([p, n]) => {
  const objs = ALL_OBJECTS;
  if (n === 0) return [`(${p})`];
  if (n === 1) return objs.map((o) => `(${p} ${o})`);
  return objs.flatMap((a) => objs.map((b) => `(${p} ${a} ${b})`));
});

const modelArb = fc
  .tuple(fc.array(fc.nat(), { minLength: 1, maxLength: 3 }), fc.subarray(groundAtoms, { maxLength: 12 }), formula([], 2, { n: 100 }, GOAL_TERMS))
  .chain(([as, init, goal]) =>
    fc.tuple(...as.map((_, i) => action(i))).map((actions) => ({
      domain: `(define (domain rnd) (:requirements :adl :typing :action-costs)
  (:types ta tb)
  (:constants c1 - ta c3 - tb)
  (:predicates (f0) (f1 ?x) (g1 ?x) (f2 ?x ?y) (s1 ?x) (s2 ?x ?y))
  (:functions (total-cost) - number)
  ${actions.join("\n  ")})`,
      problem: `(define (problem r) (:domain rnd) (:objects o1 - ta o2 - tb)
  (:init ${init.join(" ")})
  (:goal ${goal}))`,
    })),
  );

describe("random ADL models: ground Task = lifted semantics", () => {
  it("same applicable actions, successors, costs and goal verdicts along random walks", () => {
    fc.assert(
      fc.property(modelArb, fc.array(fc.nat(), { maxLength: 6 }), fc.boolean(), ({ domain, problem }, walk, relevance) => {
        const model = modelFromTexts(domain, "rnd.pddl", problem, "r.pddl");
        const task = ground(model, { relevance });
        const synthetic = task.actions.filter((a) => a.synthetic);
        const userFacts = task.facts.map((f, i) => [f, i] as const).filter(([f]) => !f.startsWith("(*"));
        let ls = initialState(model);
        let gs = new Set(task.init);
        for (let k = 0; ; k++) {
          for (const [name, id] of userFacts) expect(gs.has(id), name).toBe(ls.has(name));
          const goalLifted = holds(model, model.problem.goal, new Map(), ls);
          const goalGround = synthetic.length ? synthetic.some((a) => applicable(a, gs)) : task.goal.every((f) => gs.has(f)) && task.goalNeg.every((f) => !gs.has(f));
          expect(goalGround).toBe(goalLifted);
          const moves = liftedMoves(model, ls);
          const app = task.actions.filter((a) => !a.synthetic && applicable(a, gs));
          const liftedNames = new Set(moves.map((m) => m.name));
          if (relevance) for (const a of app) expect(liftedNames.has(a.name)).toBe(true);
          else expect(new Set(app.map((a) => a.name))).toEqual(liftedNames);
          if (k >= walk.length) break;
          const pool = moves.filter((m) => app.some((a) => a.name === m.name));
          if (pool.length === 0) break;
          const m = pool[walk[k] % pool.length];
          const same = app.filter((a) => a.name === m.name);
          const next = same.map((a) => [...successor(a, gs)].sort((x, y) => x - y).join(","));
          for (const a of same) expect(a.cost).toBe(m.cost);
          expect(new Set(next).size).toBe(1);
          ls = m.next;
          gs = successor(same[0], gs);
        }
      }),
      { numRuns: SLOW ? 2000 : 150 },
    );
  });

  it("goal-relevance pruning never changes the optimal cost (exact search on both)", () => {
    let compared = 0;
    fc.assert(
      fc.property(modelArb, ({ domain, problem }) => {
        const model = modelFromTexts(domain, "rnd.pddl", problem, "r.pddl");
        let full: ReturnType<typeof optimalCost>;
        try {
          full = optimalCost(ground(model), 20_000);
        } catch {
          return; // state space too large for the exact reference
        }
        compared++;
        expect(optimalCost(ground(model, { relevance: true }), 20_000)?.cost ?? null).toBe(full?.cost ?? null);
      }),
      { numRuns: SLOW ? 600 : 120 },
    );
    expect(compared).toBeGreaterThan(60);
  });
});
