// A* returns optimal plans: its cost equals the exact Dijkstra optimum of the reference
// semantics on random small tasks (zero-cost actions included), for every admissible heuristic.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { astar, type AdmissibleHeuristicName } from "../../src/search/index.js";
import { optimalCost, replayGround, isGoal } from "../support/reference.js";
import { factoredTaskArb } from "../support/random-task.js";
import { nonTrivial, richTaskArb, shiftFacts, withRandomCosts } from "./rich-task.js";
import type { Task } from "../../src/ground/task.js";

const HEURISTICS: AdmissibleHeuristicName[] = ["landmark-cut", "max", "blind"];
const FACTORED = nonTrivial(withRandomCosts(factoredTaskArb({ maxActions: 12 })));
const RICH = nonTrivial(richTaskArb());

function checkOptimal(task: Task, heuristic: AdmissibleHeuristicName): void {
  const ref = optimalCost(task);
  const r = astar(task, { heuristic });
  if (ref === null) {
    expect(r.status).toBe("unsolvable");
    expect(r.plan).toBeNull();
    return;
  }
  expect(r.status).toBe("solved");
  // exact optimum by brute force (common practice, no source: Dijkstra 1959 on the explicit state graph)
  expect(r.cost).toBe(ref.cost);
  const replay = replayGround(task, r.plan!);
  expect(replay.ok).toBe(true);
  if (replay.ok) {
    expect(isGoal(task, replay.state)).toBe(true);
    expect(replay.cost).toBe(ref.cost);
  }
  expect(r.lowerBound).toBe(ref.cost);
}

describe("A* is optimal", () => {
  for (const heuristic of HEURISTICS) {
    it(`matches Dijkstra on random factored tasks with zero-cost actions (${heuristic})`, () => {
      fc.assert(fc.property(FACTORED, (task) => checkOptimal(task, heuristic)), { numRuns: 200 });
    });
    it(`matches Dijkstra on random tasks with negative and conditional parts (${heuristic})`, () => {
      fc.assert(fc.property(RICH, (task) => checkOptimal(task, heuristic)), { numRuns: 250 });
    });
  }

  it("with facts on bit 31 and across 32-bit word boundaries (landmark-cut and blind)", () => {
    const shifted = fc.tuple(RICH, fc.constantFrom(25, 27, 29, 31, 59)).map(([t, k]) => shiftFacts(t, k));
    fc.assert(
      fc.property(shifted, (task) => {
        checkOptimal(task, "landmark-cut");
        checkOptimal(task, "blind");
      }),
      { numRuns: 150 },
    );
  });

  it("with only zero-cost actions finds a cost-0 plan", () => {
    fc.assert(
      fc.property(factoredTaskArb({ zeroCostShare: 1 }), (task) => {
        const ref = optimalCost(task);
        const r = astar(task);
        expect(r.cost).toBe(ref === null ? null : 0);
      }),
      { numRuns: 100 },
    );
  });

  it("stops at maxExpansions with status limit and a lower bound not above the optimum", () => {
    fc.assert(
      fc.property(richTaskArb(), (task) => {
        const ref = optimalCost(task);
        const r = astar(task, { maxExpansions: 1 });
        if (r.status === "limit") {
          expect(r.stopReason).toBe("expansions");
          expect(r.plan).toBeNull();
          if (ref !== null) expect(r.lowerBound!).toBeLessThanOrEqual(ref.cost);
        }
        expect(r.expanded).toBeLessThanOrEqual(1);
      }),
      { numRuns: 150 },
    );
  });

  it("honours an aborted signal and a past deadline", () => {
    const task: Task = {
      domainName: "d", problemName: "p", facts: ["(a)", "(b)"], init: [0], goal: [1], goalNeg: [],
      actions: [{ name: "(go)", schema: "go", args: [], pre: [0], preNeg: [], add: [1], del: [0], cond: [], cost: 1 }],
      costModel: "action-costs",
    };
    const ac = new AbortController();
    ac.abort();
    expect(astar(task, { signal: ac.signal })).toMatchObject({ status: "limit", stopReason: "aborted" });
    expect(astar(task, { deadline: Date.now() - 1 })).toMatchObject({ status: "limit", stopReason: "deadline" });
    expect(astar(task)).toMatchObject({ status: "solved", cost: 1, plan: [0] });
  });

  it("with a cost bound: finds plans within it, otherwise reports a lower bound above it", () => {
    fc.assert(
      fc.property(richTaskArb(), fc.integer({ min: 0, max: 8 }), (task, bound) => {
        const ref = optimalCost(task);
        const r = astar(task, { costBound: bound });
        if (ref !== null && ref.cost <= bound) {
          expect(r.status).toBe("solved");
          expect(r.cost).toBe(ref.cost);
        } else if (ref !== null) {
          expect(r).toMatchObject({ status: "limit", stopReason: "cost-bound" });
          expect(r.lowerBound!).toBeGreaterThan(bound);
          expect(r.lowerBound!).toBeLessThanOrEqual(ref.cost);
        } else {
          expect(r.status === "unsolvable" || r.stopReason === "cost-bound").toBe(true);
        }
      }),
      { numRuns: 200 },
    );
  });
});
