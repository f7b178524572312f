// The cost-encoding choice (src/encode/cost-choice.ts): sizes equal the parts the encoder really
// emits, the rule is applied as documented, and a huge unary part is never built just to compare.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { chooseCostEncoding, costPartSizes, encodePlanning, UNARY_MAX_RATIO, UNARY_SMALL, type PartId } from "../../src/encode/index.js";
import type { Task } from "../../src/ground/task.js";
import { factoredWithGroups, runs } from "./rich-task.js";

const partSets: PartId[][] = [[], ["reach-1"], ["reach-1", "empty-steps-last-1"]];

describe("chooseCostEncoding", () => {
  it("sizes are the cost parts' own counts in the encoder, and the choice follows the documented rule", () => {
    fc.assert(
      fc.property(factoredWithGroups({ maxVars: 3, maxActions: 6 }, 9), fc.integer({ min: 0, max: 6 }), fc.integer({ min: 1, max: 40 }), fc.constantFrom(...partSets), fc.constantFrom("seq-1" as const, "forall-1" as const, "forall-2" as const), ({ task, groups }, T, C, parts, encoding) => {
          const opts = { encoding, steps: T, mutexGroups: groups, parts, costCap: C, costBits: 6 };
          const sizes = costPartSizes(task, opts);
          // the encoder's own bookkeeping of its parts, without reach-1's simplification
          const enc = encodePlanning(task, { ...opts, cost: "cost-unary-1", reachMode: "units" });
          expect(sizes["cost-unary-1"].clauses).toBe(enc.stats.clausesByPart.unary ?? 0);
          expect(sizes["cost-unary-1"].vars).toBe(enc.stats.varsByPart.unary ?? 0);
          const u = sizes["cost-unary-1"].clauses;
          const a = sizes["cost-adder-1"].clauses;
          // source: the rule as documented in encodings/README.md and DEVELOPERS.md
          const expected = u <= UNARY_SMALL || u <= UNARY_MAX_RATIO * a ? "cost-unary-1" : "cost-adder-1";
          expect(chooseCostEncoding(task, opts).id).toBe(expected);
        },
      ),
      { numRuns: runs(60) },
    );
  });

  it("stops counting a unary part that could not be chosen (150 actions of cost ≈ 50, cap 3000, 30 steps)", () => {
    const nF = 150;
    const task: Task = {
      domainName: "d",
      problemName: "p",
      facts: Array.from({ length: nF }, (_, i) => `(f${i})`),
      init: [0],
      goal: [nF - 1],
      goalNeg: [],
      costModel: "action-costs",
      actions: Array.from({ length: nF }, (_, a) => ({ name: `(a${a})`, schema: "a", args: [], pre: [a], preNeg: [], add: [(a + 1) % nF], del: [], cond: [], cost: 50 + (a % 7) })),
    };
    const r = chooseCostEncoding(task, { encoding: "forall-1", steps: 30, costCap: 3000, costBits: 12 });
    expect(r.id).toBe("cost-adder-1");
    expect(r.sizes["cost-unary-1"].atLeast).toBe(true);
    // counting stopped at the deciding limit (the full part has about 27 million clauses)
    expect(r.sizes["cost-unary-1"].clauses).toBe(Math.max(UNARY_SMALL, UNARY_MAX_RATIO * r.sizes["cost-adder-1"].clauses) + 1);
  });
});
