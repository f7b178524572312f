// A recorded A* search (claim landmark-search) against the reference optimum: the search that
// found the optimal plan, recorded as it stood, passes the audit's plain checker; no record over
// the state cap; and altered records — a missing successor, a cheaper-looking state, a weakened
// landmark, a bound above the optimum — are rejected.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { checkSearchRecord } from "../../src/certify/search-check.js";
import { astarRecorded } from "../../src/search/index.js";
import { factoredTaskArb, nonTrivial } from "../support/random-task.js";
import { optimalCost } from "../support/reference.js";

describe("recorded A* searches", () => {
  it("prove exactly the optimum, and altered records fail the plain checker", () => {
    let checked = 0;
    let pruned = 0;
    fc.assert(
      fc.property(nonTrivial(factoredTaskArb({ maxVars: 4, maxActions: 8, maxCost: 4, zeroCostShare: 0.3 })), (task) => {
        const opt = optimalCost(task); // source: exhaustive search (test/support/reference.ts)
        if (opt === null) return;
        // the search that found the optimal plan, recorded as it stood when the goal was popped
        const first = astarRecorded(task, {}, 1_000_000);
        expect(first.result.cost).toBe(opt.cost);
        const rec = first.record();
        expect(rec).not.toBeNull();
        const ok = checkSearchRecord(task, opt.cost, rec!.entries);
        expect(ok.reason ?? "valid").toBe("valid");
        checked++;
        expect(astarRecorded(task, {}, 0).record()).toBeNull(); // over the state cap: no record
        // the optimum's record does not prove a bound above it
        expect(checkSearchRecord(task, opt.cost + 1, rec!.entries).valid).toBe(false);
        // an expanded state that loses one successor
        const exp = rec!.entries.findIndex((e) => e.expanded);
        const victim = rec!.entries.findIndex((e, i) => i !== exp && i !== 0 && rec!.entries[exp] !== undefined && e.g > 0);
        if (victim > 0) expect(checkSearchRecord(task, opt.cost, rec!.entries.filter((_, i) => i !== victim)).valid).toBe(false);
        // a pruned state whose landmarks are dropped
        const pr = rec!.entries.findIndex((e) => !e.expanded && Array.isArray(e.landmarks) && e.landmarks.length > 0);
        if (pr >= 0) {
          pruned++;
          const copy = rec!.entries.map((e, i) => (i === pr ? { ...e, landmarks: [] } : e));
          expect(checkSearchRecord(task, opt.cost, copy).valid).toBe(false);
        }
      }),
      { numRuns: 300, seed: 3 },
    );
    expect(checked).toBeGreaterThan(60);
    expect(pruned).toBeGreaterThan(10);
  });
});
