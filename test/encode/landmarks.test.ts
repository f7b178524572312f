// Part landmarks-1: with landmark-cut's landmarks (each re-checked by relaxed reachability) the
// least satisfiable bound of every formula is the one without the part — the clauses cut off no
// plan and no relaxed-suffix witness — and malformed landmark lists are refused.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { encodePlanning, type EncodeOptions, type Encoding } from "../../src/encode/index.js";
import type { Task } from "../../src/ground/task.js";
import { Solver } from "../../src/sat/index.js";
import { landmarkCutAtInit, relaxedReachableWithout } from "../../src/search/index.js";
import { cheapestWithin } from "../support/reference.js";
import { nonTrivial, oneStepTask, richTaskArb, runs } from "./rich-task.js";

function leastBound(enc: Encoding): number {
  const solver = new Solver();
  enc.streamTo(solver);
  for (let B = 0; B <= enc.maxSum; B++) if (solver.solve(enc.boundAssumptions(B)) === "sat") return B;
  return Infinity;
}

const SETTINGS: Omit<EncodeOptions, "steps">[] = [
  { encoding: "seq-1", cost: "cost-unary-1", parts: [] },
  { encoding: "forall-1", cost: "cost-adder-1", parts: ["reach-1", "empty-steps-last-1"] },
  { encoding: "forall-2", cost: "cost-unary-1", parts: ["reach-1", "relaxed-suffix-1"] },
  { encoding: "seq-1", cost: "cost-adder-1", parts: ["relaxed-suffix-1", "empty-steps-last-1"] },
];

describe("landmarks-1", () => {
  it("changes no least satisfiable bound (threshold and relaxed-suffix formulas)", () => {
    let withLandmarks = 0;
    fc.assert(
      fc.property(nonTrivial(richTaskArb({ maxFacts: 5, maxActions: 6, zeroCostShare: 0.3 })), fc.integer({ min: 0, max: 3 }), fc.integer({ min: 0, max: SETTINGS.length - 1 }), (task: Task, T, k) => {
        const rec = landmarkCutAtInit(task);
        const landmarks = (rec?.landmarks ?? []).map((l) => [...l.actions].sort((x, y) => x - y));
        for (const l of landmarks) expect(relaxedReachableWithout(task, new Set(l))).toBe(false);
        if (landmarks.length > 0) withLandmarks++;
        const s = SETTINGS[k];
        const parts = [...(s.parts ?? [])];
        const withPart = ["reach-1", "relaxed-suffix-1", "landmarks-1", "eager-steps-1", "empty-steps-last-1"].filter((p) => p === "landmarks-1" || parts.includes(p as never)) as EncodeOptions["parts"];
        const plain = leastBound(encodePlanning(task, { ...s, steps: T }));
        const lm = leastBound(encodePlanning(task, { ...s, parts: withPart, steps: T, partParams: { "landmarks-1": { landmarks } } }));
        expect(lm).toBe(plain);
        // source: exhaustive search — sequential threshold formulas are exact for plans of ≤ T actions
        if (s.encoding === "seq-1" && !parts.includes("relaxed-suffix-1")) expect(lm).toBe(cheapestWithin(task, T) ?? Infinity);
      }),
      { numRuns: runs(80) },
    );
    expect(withLandmarks).toBeGreaterThan(10);
  });

  it("refuses malformed landmark lists", () => {
    const task = oneStepTask();
    const base = { encoding: "seq-1" as const, steps: 1, parts: ["landmarks-1" as const] };
    expect(() => encodePlanning(task, { ...base, partParams: { "landmarks-1": { landmarks: [[]] } } })).toThrow(/non-empty/);
    expect(() => encodePlanning(task, { ...base, partParams: { "landmarks-1": { landmarks: [[1]] } } })).toThrow(/outside 0\.\.0/);
    expect(encodePlanning(task, { ...base, partParams: { "landmarks-1": { landmarks: [[0]] } } }).numClauses).toBeGreaterThan(0);
  });
});
