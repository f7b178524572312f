// Part relaxed-suffix-1 against brute force: vertex-elimination acyclicity on random graphs, and
// the least satisfiable bound of F_T(B) on random tasks with zero costs and conditional effects
// compared with h⁺ (enumerated action subsets) and the optimum (exhaustive search).
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { CnfBuilder, emitAcyclic, encodePlanning, readSuffixModel, type Encoding, type EncodeOptions } from "../../src/encode/index.js";
import type { Task } from "../../src/ground/task.js";
import { Solver } from "../../src/sat/index.js";
import { initialState, optimalCost, reachableStates, replayGround } from "../support/reference.js";
import { Oracle } from "./oracle.js";
import { nonTrivial, oneStepTask, richTaskArb, runs } from "./rich-task.js";

/** Does the digraph (n vertices, edges) have a cycle? Plain DFS colouring. */
function hasCycle(n: number, edges: readonly [number, number][]): boolean {
  const adj: number[][] = Array.from({ length: n }, () => []);
  for (const [u, v] of edges) adj[u].push(v);
  const colour = new Uint8Array(n);
  const visit = (u: number): boolean => {
    colour[u] = 1;
    for (const v of adj[u]) {
      if (colour[v] === 1) return true;
      if (colour[v] === 0 && visit(v)) return true;
    }
    colour[u] = 2;
    return false;
  };
  for (let u = 0; u < n; u++) if (colour[u] === 0 && visit(u)) return true;
  return false;
}

describe("acyclicity by vertex elimination", () => {
  it("is satisfiable under an assignment of the edge literals exactly when the true edges are acyclic", () => {
    const graph = fc.integer({ min: 2, max: 6 }).chain((n) =>
      fc.record({
        n: fc.constant(n),
        edges: fc.uniqueArray(fc.tuple(fc.integer({ min: 0, max: n - 1 }), fc.integer({ min: 0, max: n - 1 })).filter(([u, v]) => u !== v), {
          maxLength: 9,
          selector: ([u, v]) => u * 10 + v,
        }),
      }),
    );
    let cyclic = 0;
    let acyclic = 0;
    fc.assert(
      fc.property(graph, ({ n, edges }) => {
        const cnf = new CnfBuilder();
        const lits = edges.map(() => cnf.newVar("edge"));
        emitAcyclic(
          cnf,
          n,
          edges.map(([u, v], i) => [u, v, lits[i]] as [number, number, number]),
        );
        const oracle = new Oracle(cnf.toCnf()); // logic-solver: an outside SAT solver
        for (let mask = 0; mask < 1 << edges.length; mask++) {
          const on = edges.filter((_, i) => (mask >> i) & 1);
          const sat = oracle.solve(lits.map((l, i) => ((mask >> i) & 1 ? l : -l))) !== null;
          const cyc = hasCycle(n, on);
          if (cyc) cyclic++;
          else acyclic++;
          expect(sat).toBe(!cyc);
        }
      }),
      { numRuns: runs(60) },
    );
    expect(cyclic).toBeGreaterThan(50);
    expect(acyclic).toBeGreaterThan(50);
  });
});

/** h⁺ of the initial state by enumerating action subsets (delete relaxation, negative conditions ignored). */
function hPlusBrute(task: Task): number {
  const nA = task.actions.length;
  let best = Infinity;
  for (let mask = 0; mask < 1 << nA; mask++) {
    let cost = 0;
    for (let a = 0; a < nA; a++) if ((mask >> a) & 1) cost += task.actions[a].cost;
    if (cost >= best) continue;
    const have = initialState(task);
    for (let changed = true; changed; ) {
      changed = false;
      for (let a = 0; a < nA; a++) {
        if (!((mask >> a) & 1)) continue;
        const act = task.actions[a];
        if (!act.pre.every((f) => have.has(f))) continue;
        const adds = [...act.add];
        for (const ce of act.cond) if (ce.cond.every((f) => have.has(f))) adds.push(...ce.add);
        for (const f of adds)
          if (!have.has(f)) {
            have.add(f);
            changed = true;
          }
      }
    }
    if (task.goal.every((g) => have.has(g))) best = cost;
  }
  return best;
}

/** Every pair 0 ≤ t < t′ ≤ T. */
function allPairs(T: number): [number, number][] {
  const out: [number, number][] = [];
  for (let u = 1; u <= T; u++) for (let t = 0; t < u; t++) out.push([t, u]);
  return out;
}

/**
 * The least B for which F_T(B) is satisfiable (Infinity when none), with our solver; every model
 * found is decoded and checked, and the answer at B and B − 1 is confirmed by logic-solver.
 */
function leastBound(task: Task, enc: Encoding): number {
  const solver = new Solver();
  enc.streamTo(solver);
  const maxB = enc.maxSum;
  for (let B = 0; B <= maxB; B++) {
    const r = solver.solve(enc.boundAssumptions(B));
    if (r !== "sat") continue;
    const m = readSuffixModel(task, enc, (v) => solver.value(v) === true);
    if (m.kind === "plan") {
      const rp = replayGround(task, m.plan);
      expect(rp.ok).toBe(true);
      expect(m.cost).toBeLessThanOrEqual(B);
    } else {
      expect(m.repeats).toEqual([]); // every pair is in the formula
      expect(m.cost).toBeLessThanOrEqual(B);
    }
    const oracle = new Oracle(enc.toCnf());
    expect(oracle.solve(enc.boundAssumptions(B))).not.toBeNull();
    if (B > 0) expect(oracle.solve(enc.boundAssumptions(B - 1))).toBeNull();
    return B;
  }
  expect(solver.solve([])).toBe("unsat");
  return Infinity;
}

const SETTINGS: Omit<EncodeOptions, "steps">[] = [
  { encoding: "seq-1", cost: "cost-unary-1", parts: ["relaxed-suffix-1"] },
  { encoding: "forall-1", cost: "cost-adder-1", parts: ["reach-1", "relaxed-suffix-1", "empty-steps-last-1"] },
  { encoding: "forall-2", cost: "cost-unary-1", parts: ["reach-1", "relaxed-suffix-1"] },
  { encoding: "forall-1", cost: "cost-unary-1", parts: ["reach-1", "relaxed-suffix-1", "eager-steps-1", "empty-steps-last-1"] },
  { encoding: "forall-2", cost: "cost-adder-1", parts: ["relaxed-suffix-1", "eager-steps-1"] },
  { encoding: "seq-1", cost: "cost-adder-1", parts: ["reach-1", "relaxed-suffix-1", "empty-steps-last-1"] },
];

describe("relaxed-suffix-1 against brute force", () => {
  const tasks = nonTrivial(richTaskArb({ maxFacts: 4, maxActions: 5, zeroCostShare: 0.4 }));
  // larger tasks: chains of facts through several operators, so vertex elimination builds paths
  // through edges it created itself
  const larger = nonTrivial(richTaskArb({ minFacts: 5, maxFacts: 6, minActions: 5, maxActions: 7, zeroCostShare: 0.4 }));
  it("on larger tasks, the least bound at T = 0 is h⁺ and never exceeds the optimum", () => {
    let finite = 0;
    fc.assert(
      fc.property(larger, fc.integer({ min: 0, max: SETTINGS.length - 1 }), fc.integer({ min: 0, max: 2 }), (task, k, T) => {
        const opt = optimalCost(task)?.cost ?? Infinity; // source: exhaustive search (test/support/reference.ts)
        const hplus = hPlusBrute(task); // h⁺ by definition (Hoffmann and Nebel 2001)
        const L = leastBound(task, encodePlanning(task, { ...SETTINGS[k], steps: T, partParams: { "relaxed-suffix-1": { pairs: allPairs(T) } } }));
        if (T === 0) expect(L).toBe(hplus);
        expect(L).toBeGreaterThanOrEqual(hplus);
        expect(L).toBeLessThanOrEqual(opt);
        if (Number.isFinite(hplus)) finite++;
      }),
      { numRuns: runs(30) },
    );
    expect(finite).toBeGreaterThan(10);
  });

  it("the least satisfiable bound is h⁺ at T = 0, lies between h⁺ and the optimum, never decreases with T, and is the optimum once T reaches the reachable states", () => {
    let reachedOptimum = 0;
    let strictlyBetween = 0;
    let rose = 0;
    fc.assert(
      fc.property(tasks, fc.integer({ min: 0, max: SETTINGS.length - 1 }), (task, k) => {
        const opt = optimalCost(task)?.cost ?? Infinity; // source: exhaustive search (test/support/reference.ts)
        const hplus = hPlusBrute(task); // h⁺ by definition (Hoffmann and Nebel 2001): cheapest relaxed plan
        const N = reachableStates(task)!.length;
        const Tmax = Math.min(N, 5);
        let prev = -1;
        for (let T = 0; T <= Tmax; T++) {
          const enc = encodePlanning(task, { ...SETTINGS[k], steps: T, partParams: { "relaxed-suffix-1": { pairs: allPairs(T) } } });
          const L = leastBound(task, enc);
          if (T === 0) expect(L).toBe(hplus);
          expect(L).toBeGreaterThanOrEqual(hplus);
          expect(L).toBeLessThanOrEqual(opt); // F_T(B) unsatisfiable ⇒ no plan of cost ≤ B
          expect(L).toBeGreaterThanOrEqual(prev);
          if (T > 0 && L > prev) rose++;
          if (L > hplus && L < opt) strictlyBetween++;
          if (T >= N) {
            expect(L).toBe(opt);
            reachedOptimum++;
          }
          prev = L;
        }
      }),
      { numRuns: runs(80) },
    );
    // the properties must have had something to bite on
    expect(reachedOptimum).toBeGreaterThan(10);
    expect(rose).toBeGreaterThan(5);
    expect(strictlyBetween).toBeGreaterThan(0);
  });

  it("adding state pairs one by one as models repeat states gives the same least bound as all pairs at once", () => {
    fc.assert(
      fc.property(tasks, fc.integer({ min: 1, max: 4 }), fc.integer({ min: 0, max: SETTINGS.length - 1 }), (task, T, k) => {
        const eager = leastBound(task, encodePlanning(task, { ...SETTINGS[k], steps: T, partParams: { "relaxed-suffix-1": { pairs: allPairs(T) } } }));
        const enc = encodePlanning(task, { ...SETTINGS[k], steps: T });
        const solver = new Solver();
        enc.streamTo(solver);
        let lazy = Infinity;
        for (let B = 0; B <= enc.maxSum && lazy === Infinity; ) {
          const r = solver.solve(enc.boundAssumptions(B));
          if (r !== "sat") {
            B++;
            continue;
          }
          const m = readSuffixModel(task, enc, (v) => solver.value(v) === true);
          if (m.kind === "relaxed" && m.repeats.length > 0) {
            for (const [t, u] of m.repeats) {
              const first = enc.addStatePair(t, u);
              for (let i = first; i < enc.numClauses; i++) solver.addClause(enc.cnf.clause(i));
            }
            continue;
          }
          lazy = B;
        }
        expect(lazy).toBe(eager);
        // the CNF grown pair by pair is the CNF built with those pairs from the start
        const rebuilt = encodePlanning(task, { ...SETTINGS[k], steps: T, partParams: enc.params.partParams });
        expect(rebuilt.toDimacs()).toBe(enc.toDimacs());
      }),
      { numRuns: runs(60) },
    );
  });

  it("rejects pairs outside 0 ≤ t < t' ≤ T, repeated pairs, and parameters for parts not in the formula", () => {
    const task = oneStepTask();
    const base = { encoding: "seq-1" as const, steps: 2, parts: ["relaxed-suffix-1" as const] };
    expect(() => encodePlanning(task, { ...base, partParams: { "relaxed-suffix-1": { pairs: [[1, 1]] } } })).toThrow(/not 0 ≤ t < t' ≤ 2/);
    expect(() => encodePlanning(task, { ...base, partParams: { "relaxed-suffix-1": { pairs: [[0, 3]] } } })).toThrow(/not 0 ≤ t < t' ≤ 2/);
    expect(() => encodePlanning(task, { ...base, partParams: { "relaxed-suffix-1": { pairs: [[0, 1], [0, 1]] } } })).toThrow(/twice/);
    expect(() => encodePlanning(task, { encoding: "seq-1", steps: 2, partParams: { "relaxed-suffix-1": { pairs: [] } } })).toThrow(/not a part of this formula/);
    const enc = encodePlanning(task, base);
    enc.addStatePair(0, 2);
    expect(() => enc.addStatePair(0, 2)).toThrow(/already/);
  });
});
