// The encode module's edges: CNF store and DIMACS text, variable map, bound assumptions,
// horizon 0, costBits choices, mutex-group strengthening, and malformed inputs.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { CnfBuilder, encodePlanning, extractPlan, toDimacs } from "../../src/encode/index.js";
import type { Task } from "../../src/ground/task.js";
import { factId, factoredSpecArb, taskFromSpec } from "../support/random-task.js";
import { cheapestWithin } from "../support/reference.js";
import { loadFixtures } from "./golden.js";
import { Oracle } from "./oracle.js";
import { runs, withCosts } from "./rich-task.js";

const harbour = loadFixtures().find((f) => f.name === "harbour")!.task;

describe("CnfBuilder and DIMACS", () => {
  it("writes the DIMACS CNF text format", () => {
    const cnf = new CnfBuilder();
    const x = cnf.newVars(3, "x");
    cnf.add2(x, -(x + 1));
    cnf.addClause([x + 2]);
    cnf.addClause([-x, x + 1, -(x + 2)]);
    // source: DIMACS CNF format (header "p cnf VARS CLAUSES", clauses end in 0) — common practice
    expect(toDimacs(cnf, ["hello"])).toBe("c hello\np cnf 3 3\n1 -2 0\n3 0\n-1 2 -3 0\n");
    expect(cnf.numLiterals).toBe(6);
    const streamed: number[][] = [];
    cnf.streamTo({ addClause: (l) => streamed.push(Array.from(l)) });
    expect(streamed).toEqual(cnf.toCnf().clauses.map((c) => Array.from(c)));
    expect(Array.from(cnf.toCompact().lits)).toEqual([1, -2, 0, 3, 0, -1, 2, -3, 0]);
    expect(cnf.toCompact().numClauses).toBe(3);
  });

  it("rejects literals of unallocated variables", () => {
    const cnf = new CnfBuilder();
    cnf.newVar("x");
    expect(() => cnf.addClause([2])).toThrow(/bad literal/);
    expect(() => cnf.addClause([0])).toThrow(/bad literal/);
    expect(() => cnf.addClause([1.5])).toThrow(/bad literal/);
  });

  it("grows past its initial capacity without losing clauses", () => {
    const cnf = new CnfBuilder();
    const v = cnf.newVars(50_000, "x");
    for (let i = 0; i < 50_000; i++) cnf.add3(v + i, -(v + ((i + 1) % 50_000)), v + ((i + 7) % 50_000));
    expect(cnf.numClauses).toBe(50_000);
    expect(Array.from(cnf.clause(49_999))).toEqual([v + 49_999, -v, v + 6]);
    expect(cnf.labelOf(v + 123)).toEqual({ label: "x", start: v });
  });
});

describe("encodePlanning", () => {
  it("maps variables back to facts and actions", () => {
    const enc = encodePlanning(harbour, { encoding: "forall-1", steps: 3 });
    expect(enc.factVar(0, 0)).toBe(1);
    expect(enc.describeVar(enc.factVar(2, 3))).toBe("fact (ship-docked) @2");
    expect(enc.describeVar(enc.actionVar(3, 2))).toBe("action (undock-ship) @step 3");
    expect(enc.describeVar(enc.numVars)).toMatch(/^compare#|^bound-bit#/);
    expect(() => enc.actionVar(0, 0)).toThrow(RangeError);
    expect(() => enc.factVar(4, 0)).toThrow(RangeError);
    expect(enc.params).toEqual({ encoding: "forall-1", cost: "cost-adder-1", steps: 3, costBits: enc.params.costBits!, mutexGroups: [] });
    expect(enc.stats.clauses).toBe(enc.numClauses);
    const parts = Object.values(enc.stats.clausesByPart).reduce((s, x) => s + x, 0);
    expect(parts).toBe(enc.numClauses);
  });

  it("bound assumptions: none needed at or above the maximum sum, errors outside the range", () => {
    const enc = encodePlanning(harbour, { encoding: "seq-1", steps: 3 });
    expect(enc.boundAssumptions(enc.maxSum)).toEqual([]);
    expect(enc.boundAssumptions(enc.maxSum + 100)).toEqual([]);
    expect(enc.boundAssumptions(0).length).toBe(1 + enc.params.costBits!);
    expect(() => enc.boundAssumptions(-1)).toThrow(RangeError);
    expect(() => enc.boundAssumptions(1.5)).toThrow(RangeError);
    const narrow = encodePlanning(harbour, { encoding: "seq-1", steps: 3, costBits: 2 });
    expect(narrow.maxRepresentableCost).toBe(3);
    expect(() => narrow.boundAssumptions(4)).toThrow(/costBits/);
  });

  it("horizon 0 is satisfiable exactly when the goal holds initially", () => {
    const enc = encodePlanning(harbour, { encoding: "seq-1", steps: 0 });
    expect(new Oracle(enc.toCnf()).solve()).toBeNull();
    const done: Task = { ...harbour, goal: [0, 2], goalNeg: [1] };
    const enc2 = encodePlanning(done, { encoding: "forall-2", steps: 0 });
    const model = new Oracle(enc2.toCnf()).solve(enc2.boundAssumptions(0));
    expect(model).not.toBeNull();
    expect(extractPlan(done, enc2, model!)).toEqual({ steps: [], plan: [], cost: 0 });
  });

  it("answers the same with wider bound registers (costBits above the default)", () => {
    fc.assert(
      fc.property(withCosts(factoredSpecArb({ maxVars: 3, maxActions: 5 }).map(taskFromSpec), 5), fc.integer({ min: 1, max: 4 }), (task, T) => {
        const enc = encodePlanning(task, { encoding: "seq-1", steps: T });
        const wide = encodePlanning(task, { encoding: "seq-1", steps: T, costBits: enc.params.costBits! + 3 });
        const best = cheapestWithin(task, T); // source: reference exhaustive search
        const oracle = new Oracle(wide.toCnf());
        for (let B = 0; B <= Math.min(wide.maxSum, 12); B++) expect(oracle.solve(wide.boundAssumptions(B)) !== null).toBe(best !== null && best <= B);
      }),
      { numRuns: runs(10) },
    );
  });

  it("mutex groups (each variable's values) change nothing but add clauses", () => {
    fc.assert(
      fc.property(factoredSpecArb({ maxVars: 3, maxActions: 5 }), fc.integer({ min: 1, max: 4 }), (spec, T) => {
        const task = withCostsOf(taskFromSpec(spec));
        const groups = spec.domains.map((d, v) => Array.from({ length: d }, (_, x) => factId(spec.domains, v, x)));
        for (const id of ["seq-1", "forall-2"] as const) {
          const plain = encodePlanning(task, { encoding: id, steps: T });
          const strong = encodePlanning(task, { encoding: id, steps: T, mutexGroups: groups });
          expect(strong.stats.clausesByPart.mutex).toBeGreaterThan(0);
          expect(strong.params.mutexGroups).toEqual(groups);
          const [o1, o2] = [new Oracle(plain.toCnf()), new Oracle(strong.toCnf())];
          for (const B of [0, 2, 5, plain.maxSum]) expect(o2.solve(strong.boundAssumptions(B)) !== null).toBe(o1.solve(plain.boundAssumptions(B)) !== null);
        }
      }),
      { numRuns: runs(10) },
    );
  });

  it("rejects malformed tasks and groups", () => {
    expect(() => encodePlanning(harbour, { encoding: "seq-1", steps: 2, mutexGroups: [[0, 2]] })).toThrow(/two facts true initially/);
    expect(() => encodePlanning(harbour, { encoding: "seq-1", steps: 2, mutexGroups: [[0, 9]] })).toThrow(RangeError);
    expect(() => encodePlanning(harbour, { encoding: "seq-1", steps: -1 })).toThrow(RangeError);
    expect(() => encodePlanning(harbour, { encoding: "bogus" as never, steps: 1 })).toThrow(/unknown encoding/);
    const badFact: Task = { ...harbour, goal: [7] };
    expect(() => encodePlanning(badFact, { encoding: "seq-1", steps: 1 })).toThrow(/outside/);
    const badCost: Task = { ...harbour, actions: harbour.actions.map((a) => ({ ...a, cost: -1 })) };
    expect(() => encodePlanning(badCost, { encoding: "seq-1", steps: 1 })).toThrow(/cost/);
  });
});

/** Deterministic varied costs (0..4) so the mutex test does not depend on the cost generator. */
function withCostsOf(task: Task): Task {
  return { ...task, actions: task.actions.map((a, i) => ({ ...a, cost: (i * 3) % 5 })) };
}
