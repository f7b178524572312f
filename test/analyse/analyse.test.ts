// Checks the analyse stage against brute force: h² pair reachability is sound, variables are
// real mutex groups partitioning the facts, relevance pruning and simplification keep the
// optimal cost, and the dependency graph's SCCs come in a deterministic topological order.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import type { Task } from "../../src/ground/task.js";
import { dependencyGraph, findVariables, pairReachability, prepareTask, relevanceFilter, simplifyTask, withComponents } from "../../src/analyse/index.js";
import { ground } from "../../src/ground/index.js";
import { modelFromTexts } from "../../src/pddl/index.js";
import { optimalCost, reachableStates } from "../support/reference.js";
import { richTaskArb, transitionTaskArb } from "../horizon/rich-task.js";
import { blocksWorld, eightPuzzle, hanoi } from "../measure/puzzles.js";

const anyTask = fc.oneof(richTaskArb({ maxFacts: 7 }), transitionTaskArb({ maxVars: 4 }));

describe("h² pair reachability", () => {
  it("marks every fact and pair that some reachable state holds (soundness)", () => {
    let mutexesSeen = 0;
    fc.assert(
      fc.property(anyTask, (task) => {
        const pairs = pairReachability(task);
        const states = reachableStates(task)!;
        const seen = new Set<string>();
        for (const s of states) {
          const xs = [...s];
          for (const f of xs) for (const g of xs) seen.add(`${f},${g}`);
        }
        for (const k of seen) {
          const [f, g] = k.split(",").map(Number);
          expect(pairs.together(f, g)).toBe(true);
        }
        for (let f = 0; f < task.facts.length; f++) for (let g = 0; g < task.facts.length; g++) if (!pairs.together(f, g)) mutexesSeen++;
      }),
      { numRuns: 150, seed: 4201 },
    );
    expect(mutexesSeen).toBeGreaterThan(100); // the analysis finds mutexes, not just "all possible"
  });
});

function checkVariables(task: Task): { multi: number } {
  const pairs = pairReachability(task);
  const vars = findVariables(task, pairs);
  // every fact in exactly one variable
  const count = new Int32Array(task.facts.length);
  for (const v of vars.variables) for (const f of v.facts) count[f]++;
  expect([...count].every((c) => c === 1)).toBe(true);
  vars.variables.forEach((v) => v.facts.forEach((f) => expect(vars.varOfFact[f]).toBe(v.id)));
  // groups are mutex and "exactly one" claims hold in every reachable state
  const states = reachableStates(task)!;
  for (const s of states)
    for (const v of vars.variables) {
      const n = v.facts.filter((f) => s.has(f)).length;
      expect(n).toBeLessThanOrEqual(1);
      if (!v.hasNone) expect(n).toBe(1);
    }
  return { multi: vars.variables.filter((v) => v.facts.length > 1).length };
}

describe("finite-domain variables", () => {
  it("partition the facts into real mutex groups (random tasks, brute force)", () => {
    let multi = 0;
    fc.assert(
      fc.property(anyTask, (task) => {
        multi += checkVariables(task).multi;
      }),
      { numRuns: 150, seed: 4202 },
    );
    expect(multi).toBeGreaterThan(50);
  });

  it("find the multi-valued variables of the classic puzzles", () => {
    for (const task of [hanoi(3), blocksWorld(3)]) expect(checkVariables(task).multi).toBeGreaterThan(0);
    // 8-puzzle: every tile is in exactly one cell and every cell holds exactly one tile or the
    // blank, so a cover by 9-fact groups with no "none" value exists (common practice, no source)
    const p = eightPuzzle();
    const vars = findVariables(p, pairReachability(p));
    expect(vars.variables.length).toBeLessThanOrEqual(10);
    expect(vars.variables.filter((v) => v.facts.length === 9 && !v.hasNone).length).toBeGreaterThanOrEqual(8);
  });
});

describe("relevance pruning and simplification", () => {
  it("maps each branch of a disjunctive precondition to its own ground action (they share a name)", () => {
    const domain = `(define (domain branches) (:requirements :strips :disjunctive-preconditions)
      (:predicates (p) (q) (noise) (g))
      (:action make-noise :parameters () :precondition () :effect (noise))
      (:action make-p :parameters () :precondition (q) :effect (and (p) (not (q))))
      (:action go :parameters () :precondition (or (p) (q)) :effect (g)))`;
    const problem = `(define (problem b1) (:domain branches) (:init (q)) (:goal (g)))`;
    const task = ground(modelFromTexts(domain, "d.pddl", problem, "p.pddl"), { relevance: false });
    const branches = task.actions.map((a, i) => [a, i] as const).filter(([a]) => a.name === "(go)");
    expect(branches.length).toBe(2); // one ground action per disjunct, both named (go)
    const r = relevanceFilter(task);
    const ids = [...r.actionMap];
    expect(new Set(ids).size).toBe(ids.length);
    r.task.actions.forEach((a, i) => {
      const orig = task.actions[r.actionMap[i]];
      expect(a.name).toBe(orig.name);
      expect(a.pre.map((f) => task.facts[r.factMap[f]])).toEqual(orig.pre.map((f) => task.facts[f]));
    });
  });

  it("never change the optimal cost (Dijkstra on both)", () => {
    let pruned = 0;
    fc.assert(
      fc.property(anyTask, (task) => {
        const before = optimalCost(task);
        const r = relevanceFilter(task);
        expect(optimalCost(r.task)?.cost ?? null).toBe(before?.cost ?? null);
        const s = simplifyTask(r.task, pairReachability(r.task));
        expect(optimalCost(s.task)?.cost ?? null).toBe(before?.cost ?? null);
        const p = prepareTask(task);
        expect(optimalCost(p.task)?.cost ?? null).toBe(before?.cost ?? null);
        // plans of the reduced task map back to action ids of the original
        // (the same action: its conditions and effects, read through the fact map, are the original's)
        p.actionMap.forEach((orig, i) => {
          const mine = p.task.actions[i];
          const theirs = task.actions[orig];
          expect(mine.name).toBe(theirs.name);
          expect(mine.cost).toBe(theirs.cost);
          for (const key of ["pre", "preNeg", "add", "del"] as const) {
            for (const f of mine[key]) expect(theirs[key]).toContain(p.factMap[f]);
          }
        });
        if (p.task.actions.length < task.actions.length) pruned++;
      }),
      { numRuns: 200, seed: 4203 },
    );
    expect(pruned).toBeGreaterThan(40);
  });

  it("keeps an action that only deletes a fact the goal needs false", () => {
    const task: Task = {
      domainName: "d",
      problemName: "p",
      facts: ["(door-open)", "(inside)", "(noise)"],
      init: [0],
      goal: [1],
      goalNeg: [],
      actions: [
        { name: "(close)", schema: "close", args: [], pre: [], preNeg: [], add: [], del: [0], cond: [], cost: 1 },
        { name: "(enter)", schema: "enter", args: [], pre: [], preNeg: [0], add: [1], del: [], cond: [], cost: 1 },
        { name: "(shout)", schema: "shout", args: [], pre: [], preNeg: [], add: [2], del: [], cond: [], cost: 1 },
      ],
      costModel: "action-costs",
    };
    const r = relevanceFilter(task);
    expect(r.task.actions.map((a) => a.name)).toEqual(["(close)", "(enter)"]);
    expect(optimalCost(r.task)).toEqual({ cost: 2, length: 2 }); // worked by hand
  });
});

describe("dependency graph", () => {
  it("orders SCCs topologically, ties by smallest variable, each strongly connected", () => {
    fc.assert(
      fc.property(anyTask, (task) => {
        const vars = findVariables(task, pairReachability(task));
        const g = dependencyGraph(task, vars);
        const n = vars.variables.length;
        expect(g.sccs.flat().sort((a, b) => a - b)).toEqual([...Array(n).keys()]);
        for (let v = 0; v < n; v++) for (const u of g.succ[v]) expect(g.sccOf[v]).toBeLessThanOrEqual(g.sccOf[u]);
        // reachability closure to check strong connectivity and maximality
        const reach = (s: number) => {
          const seen = new Set([s]);
          const q = [s];
          while (q.length) for (const u of g.succ[q.pop()!]) if (!seen.has(u)) (seen.add(u), q.push(u));
          return seen;
        };
        const R = [...Array(n).keys()].map(reach);
        for (let v = 0; v < n; v++) for (let u = 0; u < n; u++) expect(R[v].has(u) && R[u].has(v)).toBe(g.sccOf[v] === g.sccOf[u]);
        // every action writes into one SCC and reads only from it or its parents
        for (const a of task.actions) {
          const w = new Set([...a.add, ...a.del, ...a.cond.flatMap((c) => [...c.add, ...c.del])].map((f) => g.sccOf[vars.varOfFact[f]]));
          expect(w.size).toBeLessThanOrEqual(1);
          const home = [...w][0];
          if (home === undefined) continue;
          for (const f of [...a.pre, ...a.preNeg, ...a.cond.flatMap((c) => [...c.cond, ...c.condNeg])]) {
            const s = g.sccOf[vars.varOfFact[f]];
            expect(s === home || g.parents[home].includes(s)).toBe(true);
          }
        }
      }),
      { numRuns: 150, seed: 4204 },
    );
  });

  it("breaks ties between independent components by their smallest variable", () => {
    // 0 → 3, 2 → 1, 4 alone: ready sets {0, 2, 4} → 0, then {2, 3, 4} → 2, …
    const g = withComponents(5, [[3], [], [1], [], []]);
    expect(g.sccs).toEqual([[0], [2], [1], [3], [4]]);
  });
});
