// A recorded A* search (claim landmark-search) against the reference optimum: the record made at
// the optimum passes the audit's plain checker; no record exists above it; and altered records —
// a missing successor, a cheaper-looking state, a weakened landmark, a bound above the optimum —
// are rejected.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { checkSearchRecord } from "../../src/certify/search-check.js";
import { searchRecord } from "../../src/search/index.js";
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
        const rec = searchRecord(task, opt.cost);
        expect(rec).not.toBeNull();
        const ok = checkSearchRecord(task, opt.cost, rec!.entries);
        expect(ok.reason ?? "valid").toBe("valid");
        checked++;
        // a bound above the optimum: A* finds the optimal plan, so no record; and the optimum's record does not prove it
        expect(searchRecord(task, opt.cost + 1)).toBeNull();
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
