// Grounding behaviour beyond counts: costs (static functions, unit model, errors), goal
// compilation (negative, disjunctive, unreachable), constant folding, determinism, DNF
// splitting, and goal-relevance pruning (never changes the optimal cost).
import { describe, expect, it } from "vitest";
import { ground, groundFiles, type Task } from "../../src/ground/index.js";
import { modelFromTexts } from "../../src/pddl/index.js";
import { optimalCost } from "../support/reference.js";
import { fixtureModel, fixturePath, hanoiProblem } from "../fixtures/frontend/problems.js";
import { expectPlumblineError, marked } from "../pddl/marker.js";

const ROADS = `(define (domain roads)
  (:requirements :typing :action-costs :negative-preconditions)
  (:types place)
  (:predicates (at ?p - place) (road ?a ?b - place) (visited ?p - place) (closed ?p - place))
  (:functions (total-cost) - number (len ?a ?b - place) - number)
  (:action go :parameters (?a ?b - place)
    :precondition (and (at ?a) (road ?a ?b) (not (closed ?b)))
    :effect (and (not (at ?a)) (at ?b) (visited ?b) «(increase (total-cost) (len ?a ?b))))
  (:action wait :parameters (?a - place) :precondition (at ?a) :effect (visited ?a)))`;

const roadsProblem = (goal: string, extraInit = "") => `(define (problem r) (:domain roads)
  (:objects x y z - place)
  (:init (at x) (road x y) (road y z) (road x z) (= (len x y) 2) (= (len y z) 0) (= (len x z) 5) ${extraInit})
  (:goal ${goal}))`;

const roads = (goal: string, extraInit = "") => modelFromTexts(marked(ROADS).text, "roads.pddl", roadsProblem(goal, extraInit), "r.pddl");
const names = (t: Task, ids: number[]) => ids.map((f) => t.facts[f]);
const byName = (t: Task, n: string) => t.actions.filter((a) => a.name === n);

describe("costs", () => {
  it("static cost functions give each ground action its cost; actions without increase cost 0", () => {
    const t = ground(roads("(visited z)"));
    expect(t.costModel).toBe("action-costs");
    expect(byName(t, "(go x y)")[0].cost).toBe(2);
    expect(byName(t, "(go y z)")[0].cost).toBe(0);
    expect(byName(t, "(go x z)")[0].cost).toBe(5);
    expect(byName(t, "(wait x)")[0].cost).toBe(0);
    // x→y→z costs 2 + 0 < 5; source: common practice, no source (sum of increase amounts)
    expect(optimalCost(t)?.cost).toBe(2);
  });

  it("a missing cost value for a reachable ground action is an error naming the action and the term", () => {
    const m = marked(ROADS);
    const model = modelFromTexts(m.text, "roads.pddl", roadsProblem("(visited z)").replace("(= (len y z) 0)", ""), "r.pddl");
    expectPlumblineError(() => ground(model), {
      code: "semantic",
      message: /action \(go y z\) needs the cost value \(len y z\), but the :init of r\.pddl does not set it/,
      file: "roads.pddl",
      line: m.line,
      col: m.col + "(increase (total-cost) ".length,
    });
  });

  it("no action costs at all: unit cost model, every action costs 1", () => {
    const t = ground(fixtureModel("gripper/domain.pddl", "gripper/four-balls.pddl"));
    expect(t.costModel).toBe("unit");
    expect(new Set(t.actions.map((a) => a.cost))).toEqual(new Set([1]));
  });
});

describe("goals", () => {
  it("negative goals become goalNeg", () => {
    const t = ground(roads("(and (visited y) (not (at x)))"));
    expect(names(t, t.goal)).toEqual(["(visited y)"]);
    expect(names(t, t.goalNeg)).toEqual(["(at x)"]);
    expect(t.actions.some((a) => a.synthetic)).toBe(false);
  });

  it("a disjunctive goal gets zero-cost synthetic actions that must come last", () => {
    const t = ground(roads("(or (visited z) (and (at y) (not (visited x))))"));
    const syn = t.actions.filter((a) => a.synthetic);
    expect(syn.map((a) => a.name)).toEqual(["(*reach-goal* 1)", "(*reach-goal* 2)"]);
    expect(syn.every((a) => a.cost === 0)).toBe(true);
    const g = t.facts.indexOf("(*goal-reached*)");
    expect(t.goal).toEqual([g]);
    expect(syn.map((a) => names(t, a.pre))).toEqual([["(visited z)"], ["(at y)"]]);
    expect(names(t, syn[1].preNeg)).toEqual(["(visited x)", "(*goal-reached*)"]);
    // every other action requires the goal fact false, so nothing follows the synthetic step
    for (const a of t.actions) expect(a.preNeg).toContain(g);
    // cheapest: go x y (2), then the second disjunct holds; source: common practice, no source
    expect(optimalCost(t)?.cost).toBe(2);
  });

  it("a goal no action can reach keeps its fact, so the task is visibly unsolvable", () => {
    const text = `(define (domain keys) (:predicates (ok ?x) (used ?x))
      (:action use :parameters (?x) :precondition (ok ?x) :effect (used ?x)))`;
    const m = modelFromTexts(text, "k.pddl", "(define (problem k) (:domain keys) (:objects a c) (:init (ok a)) (:goal (and (used a) (used c))))", "k.pddl");
    const t = ground(m);
    expect(names(t, t.goal)).toEqual(["(used a)", "(used c)"]);
    expect(t.actions.map((a) => a.name)).toEqual(["(use a)"]);
    expect(optimalCost(t)).toBeNull();
  });

  it("a goal that static facts make false becomes an unreachable goal fact", () => {
    const t = ground(roads("(and (visited z) (closed z))"));
    expect(names(t, t.goal)).toEqual(["(*goal-unreachable*)"]);
    expect(optimalCost(t)).toBeNull();
  });

  it("a disjunctive goal with no reachable disjunct gets an unreachable goal fact", () => {
    const t = ground(roads("(or (closed y) (closed z))"));
    expect(names(t, t.goal)).toEqual(["(*goal-unreachable*)"]);
    expect(optimalCost(t)).toBeNull();
  });

  it("a goal true by static facts alone is empty", () => {
    const t = ground(roads("(road x y)"));
    expect(t.goal).toEqual([]);
    expect(t.goalNeg).toEqual([]);
    expect(optimalCost(t)?.cost).toBe(0);
  });
});

describe("folding and normal form", () => {
  it("static predicates, equality and facts nothing can change are folded away", () => {
    const t = ground(roads("(visited z)", "(closed q-none)".replace("(closed q-none)", "")));
    expect(t.facts.some((f) => f.startsWith("(road") || f.startsWith("(closed"))).toBe(false);
    // (closed b) is static (no action changes it) and false for every b: the negative precondition folds away
    for (const a of t.actions) expect(names(t, a.preNeg)).toEqual([]);
    expect(byName(t, "(go x y)")[0]).toMatchObject({ pre: [t.facts.indexOf("(at x)")] });
  });

  it("an initial fact no action deletes is constant and leaves the task; preconditions on it disappear", () => {
    const text = `(define (domain keys) (:predicates (ok ?x) (broken ?x) (used ?x))
      (:action fix :parameters (?x) :precondition (broken ?x) :effect (and (ok ?x) (not (broken ?x))))
      (:action use :parameters (?x) :precondition (ok ?x) :effect (used ?x)))`;
    const m = modelFromTexts(text, "k.pddl", "(define (problem k) (:domain keys) (:objects a b) (:init (ok b) (broken a)) (:goal (and (used a) (used b))))", "k.pddl");
    const t = ground(m);
    expect(t.facts).toEqual(["(ok a)", "(broken a)", "(used a)", "(used b)"]);
    expect(byName(t, "(use b)")[0].pre).toEqual([]);
    expect(names(t, byName(t, "(use a)")[0].pre)).toEqual(["(ok a)"]);
    expect(optimalCost(t)?.cost).toBe(3);
  });

  it("a disjunctive precondition gives one ground action per disjunct, sharing the plan name", () => {
    const t = ground(fixtureModel("quay/domain.pddl", "quay/yard.pddl"));
    const loads = byName(t, "(load c1 truck1 depot1)");
    expect(loads.length).toBe(2);
    expect(loads.map((a) => names(t, a.pre))).toEqual([
      ["(at truck1 depot1)", "(on-ground c1 depot1)", "(sealed c1)"],
      ["(at truck1 main-quay)", "(at truck1 depot1)", "(on-ground c1 depot1)"],
    ]);
    // effects are the same whichever disjunct applies
    expect(loads[0].add).toEqual(loads[1].add);
    expect(loads[0].del).toEqual(loads[1].del);
    // at the main quay the second disjunct is implied by the first, so only one action is kept
    expect(byName(t, "(load c1 truck1 main-quay)").length).toBe(1);
  });

  it("conditional effects keep only conditions that can vary and drop those that can never fire", () => {
    const t = ground(fixtureModel("quay/domain.pddl", "quay/yard.pddl"));
    const drive = byName(t, "(drive truck1 main-quay depot1)")[0];
    // (fragile c1) is statically false, so only c2's conditional effect is left
    expect(drive.cond.map((c) => ({ cond: names(t, c.cond), add: names(t, c.add) }))).toEqual([{ cond: ["(in c2 truck1)"], add: ["(shaken c2)"] }]);
    const toggle = byName(t, "(toggle-busy truck1)")[0];
    expect(toggle.cond.length).toBe(2);
  });

  it("all fact-id arrays are sorted and duplicate-free", () => {
    const t = ground(fixtureModel("workshop/domain.pddl", "workshop/shift.pddl"));
    const ok = (xs: number[]) => xs.every((x, i) => i === 0 || xs[i - 1] < x) && xs.every((x) => x >= 0 && x < t.facts.length);
    for (const xs of [t.init, t.goal, t.goalNeg]) expect(ok(xs)).toBe(true);
    for (const a of t.actions) {
      for (const xs of [a.pre, a.preNeg, a.add, a.del]) expect(ok(xs)).toBe(true);
      for (const c of a.cond) for (const xs of [c.cond, c.condNeg, c.add, c.del]) expect(ok(xs)).toBe(true);
    }
  });
});

describe("determinism", () => {
  it("the same input gives the same Task, whatever the order of :init", () => {
    const model = fixtureModel("quay/domain.pddl", "quay/yard.pddl");
    const a = ground(model);
    const b = ground(fixtureModel("quay/domain.pddl", "quay/yard.pddl"));
    expect(JSON.stringify(b)).toBe(JSON.stringify(a));
    const p = hanoiProblem(3);
    const shuffled = hanoiProblem(3, true);
    expect(shuffled).not.toBe(p);
    const h1 = ground(fixtureModel("hanoi/domain.pddl", p));
    const h2 = ground(fixtureModel("hanoi/domain.pddl", shuffled));
    expect(JSON.stringify(h2)).toBe(JSON.stringify(h1));
  });

  it("groundFiles reads files and reports seconds", () => {
    const t0 = performance.now();
    const r = groundFiles(fixturePath("gripper/domain.pddl"), fixturePath("gripper/four-balls.pddl"));
    const outside = (performance.now() - t0) / 1000;
    expect(r.task.actions.length).toBe(36);
    // the reported time is the call's own: positive and within the time measured around it
    expect(r.seconds).toBeGreaterThan(0);
    expect(r.seconds).toBeLessThanOrEqual(outside);
    expect(r.model.problem.name).toBe("four-balls");
  });
});

describe("goal-relevance pruning", () => {
  it("drops actions that cannot matter and keeps the optimal cost", () => {
    const full = ground(roads("(at y)"));
    const pruned = ground(roads("(at y)"), { relevance: true });
    // (visited …) is never needed, so `wait` is irrelevant and the visited facts go
    expect(pruned.actions.some((a) => a.schema === "wait")).toBe(false);
    expect(pruned.facts.some((f) => f.startsWith("(visited"))).toBe(false);
    expect(full.actions.some((a) => a.schema === "wait")).toBe(true);
    expect(optimalCost(pruned)).toEqual(optimalCost(full));
  });

  it("keeps actions that change a fact some relevant action needs false", () => {
    const text = `(define (domain lock) (:predicates (locked) (open) (alarm))
      (:action unlock :precondition (locked) :effect (not (locked)))
      (:action lock :effect (locked))
      (:action ring :effect (alarm))
      (:action enter :precondition (not (locked)) :effect (open)))`;
    const m = modelFromTexts(text, "l.pddl", "(define (problem l) (:domain lock) (:init (locked)) (:goal (open)))", "l.pddl");
    const t = ground(m, { relevance: true });
    expect(t.actions.map((a) => a.name).sort()).toEqual(["(enter)", "(lock)", "(unlock)"]);
  });

  for (const [label, model] of [
    ["quay", () => fixtureModel("quay/domain.pddl", "quay/yard.pddl")],
    ["workshop", () => fixtureModel("workshop/domain.pddl", "workshop/shift.pddl")],
    ["hanoi 3", () => fixtureModel("hanoi/domain.pddl", hanoiProblem(3))],
  ] as const) {
    it(`${label}: same optimal cost with and without pruning (exact search)`, () => {
      const m = model();
      const full = optimalCost(ground(m));
      expect(full).not.toBeNull();
      expect(optimalCost(ground(m, { relevance: true }))?.cost).toBe(full!.cost);
    });
  }
});
