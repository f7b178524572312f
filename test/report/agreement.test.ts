// Coverage counts, the outcome table and the cross-configuration checks: a planted
// disagreement on a proven optimum (and every other contradiction) must be flagged loudly.
import { describe, expect, it } from "vitest";
import { checkAgreement, findingsBanner } from "../../src/report/agreement.js";
import { coverage, geometricMean, median, tightness } from "../../src/report/summary.js";
import { textSummary } from "../../src/report/tables.js";
import { rec } from "./records.js";

describe("coverage", () => {
  it("counts proven optima per configuration and domain", () => {
    const rs = [
      rec({ instance: "harbour/a", configuration: "sat-forall", status: "optimal" }),
      rec({ instance: "harbour/b", configuration: "sat-forall", status: "unknown", cost: null }),
      rec({ instance: "harbour/a", configuration: "astar-landmark-cut", status: "optimal" }),
      rec({ instance: "harbour/b", configuration: "astar-landmark-cut", status: "optimal" }),
      rec({ instance: "workshop/c", configuration: "astar-landmark-cut", status: "feasible" }),
    ];
    const c = coverage(rs, ["sat-forall", "astar-landmark-cut"]);
    expect(c.configurations).toEqual(["sat-forall", "astar-landmark-cut"]);
    expect(c.domains).toEqual(["harbour", "workshop"]);
    expect(c.instances).toEqual({ total: 3, harbour: 2, workshop: 1 });
    expect(c.optimal["sat-forall"]).toEqual({ total: 1, harbour: 1, workshop: 0 });
    expect(c.optimal["astar-landmark-cut"]).toEqual({ total: 2, harbour: 2, workshop: 0 });
    expect(c.runs["sat-forall"]).toEqual({ total: 2, harbour: 2, workshop: 0 });
    const { text } = textSummary(rs, ["sat-forall", "astar-landmark-cut"]);
    expect(text).toMatch(/configuration +harbour \(2\)  workshop \(1\)  total \(3\)/); // first column as wide as the longest name
    // sat-forall did not run on workshop/c: the cell says how many runs there were
    expect(text).toMatch(/sat-forall\s+1\s+0 of 0\s+1 of 2/);
    expect(text).toMatch(/astar-landmark-cut\s+2\s+0\s+2/);
  });

  it("median, geometric mean and tightness ratios", () => {
    // source: definitions (median of an even count is the mean of the middle two; geometric mean of 1, 4, 16 is 4)
    expect(median([1, 2, 3, 10])).toBe(2.5);
    expect(median([])).toBeNull();
    expect(geometricMean([1, 4, 16])).toBeCloseTo(4, 12);
    const t = tightness([rec({ instance: "h/a", configuration: "sat", horizon: 30, planLength: 6 }), rec({ instance: "h/b", configuration: "sat", horizon: 9, planLength: 0 })]);
    expect(t).toEqual([{ instance: "h/a", configuration: "sat", horizon: 30, planLength: 6, ratio: 5 }]);
  });
});

describe("agreement", () => {
  it("is quiet when proven optima agree", () => {
    const rs = [
      rec({ instance: "h/a", configuration: "sat-forall", cost: 22, lowerBound: 22 }),
      rec({ instance: "h/a", configuration: "astar-landmark-cut", cost: 22, lowerBound: 22 }),
      rec({ instance: "h/b", configuration: "sat-forall", status: "feasible", cost: 30, lowerBound: 25 }),
      rec({ instance: "h/b", configuration: "astar-landmark-cut", cost: 28 }),
    ];
    const a = checkAgreement(rs);
    expect(a.findings).toEqual([]);
    expect(a.instances.map((x) => [x.instance, x.verdict])).toEqual([
      ["h/a", "agree"],
      ["h/b", "one-proof"],
    ]);
    expect(findingsBanner(a.findings)).toBe("");
    expect(textSummary(rs).text).toContain("Agreement: no contradictions (1 instance proven optimal by two or more configurations, all equal).");
  });

  it("flags a planted disagreement on a proven optimum loudly", () => {
    const rs = [rec({ instance: "h/a", configuration: "sat-forall", cost: 21 }), rec({ instance: "h/a", configuration: "astar-landmark-cut", cost: 22 })];
    const a = checkAgreement(rs);
    expect(a.findings).toHaveLength(1);
    expect(a.findings[0]).toMatchObject({ kind: "optimum-disagreement", instance: "h/a", configurations: ["sat-forall", "astar-landmark-cut"] });
    expect(a.instances[0].verdict).toBe("disagree");
    const { text } = textSummary(rs);
    expect(text).toContain("!!  1 DISAGREEMENT BETWEEN CONFIGURATIONS — THIS MEANS A BUG IN PLUMBLINE");
    expect(text).toContain("h/a: proven optimal costs differ: sat-forall = 21, astar-landmark-cut = 22");
    expect(text).toMatch(/h\/a\s+21\*\s+22\*\s+DISAGREE !!/);
  });

  it("flags plans below an optimum, bounds above a plan, unsolvable beside a plan, rejected audits", () => {
    const rs = [
      rec({ instance: "h/a", configuration: "sat-forall", cost: 22, lowerBound: 22 }),
      rec({ instance: "h/a", configuration: "gbfs", status: "feasible", cost: 20 }),
      rec({ instance: "h/b", configuration: "sat-forall", status: "unknown", cost: null, lowerBound: 31 }),
      rec({ instance: "h/b", configuration: "astar-landmark-cut", status: "feasible", cost: 30 }),
      rec({ instance: "h/c", configuration: "sat-forall", status: "unsolvable", cost: null }),
      rec({ instance: "h/c", configuration: "astar-landmark-cut", status: "optimal", cost: 4 }),
      rec({ instance: "h/d", configuration: "sat-seq", status: "optimal", cost: 4, audit: "rejected", auditReason: "check proof failed" }),
    ];
    const kinds = checkAgreement(rs).findings.map((f) => `${f.instance} ${f.kind}`);
    expect(kinds).toEqual(["h/a bound-above-plan", "h/a plan-below-optimum", "h/b bound-above-plan", "h/c unsolvable-with-plan", "h/d audit-rejected"]);
  });
});
