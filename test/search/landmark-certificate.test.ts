// Certified landmark-cut bounds: untouched records pass the independent checker and never
// exceed the optimum; tampered landmarks, costs and bounds are rejected.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import type { Action, Task } from "../../src/ground/task.js";
import { checkLandmarkCertificate, evaluateState, landmarkCutAtInit, type LandmarkRecord } from "../../src/search/index.js";
import { optimalCost } from "../support/reference.js";
import { factoredTaskArb } from "../support/random-task.js";
import { nonTrivial, richTaskArb, withRandomCosts } from "./rich-task.js";

const clone = (r: LandmarkRecord): LandmarkRecord => JSON.parse(JSON.stringify(r));

const tasks = fc.oneof(nonTrivial(richTaskArb()), nonTrivial(withRandomCosts(factoredTaskArb({ maxActions: 10 }))));

describe("landmark-cut certificate", () => {
  it("untouched records are accepted and bound ≤ optimal cost", () => {
    fc.assert(
      fc.property(tasks, (task) => {
        const rec = landmarkCutAtInit(task);
        const opt = optimalCost(task);
        if (rec === null) {
          // null means relaxed-unreachable: then no plan exists at all
          expect(opt).toBeNull();
          return;
        }
        expect(checkLandmarkCertificate(task, rec)).toEqual({ valid: true });
        if (opt !== null) expect(rec.bound).toBeLessThanOrEqual(opt.cost); // admissibility (source: Helmert & Domshlak 2009)
        expect(rec.bound).toBeLessThanOrEqual(evaluateState(task, "landmark-cut"));
        expect(rec.bound).toBe(rec.landmarks.reduce((s, l) => s + l.cost, 0));
      }),
      { numRuns: 300 },
    );
  });

  it("rejects a raised bound, an overcharged action, an emptied landmark and bad ids", () => {
    let tampered = 0;
    fc.assert(
      fc.property(tasks, (task) => {
        const rec = landmarkCutAtInit(task);
        if (rec === null || rec.landmarks.length === 0) return;
        tampered++;
        const up = clone(rec);
        up.bound += 1;
        expect(checkLandmarkCertificate(task, up).valid).toBe(false);

        // charge the first landmark more than its dearest action costs, bound kept consistent
        const over = clone(rec);
        const lm = over.landmarks[0];
        const extra = Math.max(...lm.actions.map((a) => task.actions[a].cost)) + 1 - lm.cost;
        lm.cost += extra;
        over.bound += extra;
        const r1 = checkLandmarkCertificate(task, over);
        expect(r1.valid).toBe(false);
        expect(r1.reason).toMatch(/cost partition/);

        // the goal is relaxed-reachable from the initial state (rec is not null): {} is no landmark
        const empty = clone(rec);
        empty.landmarks[0].actions = [];
        const r2 = checkLandmarkCertificate(task, empty);
        expect(r2.valid).toBe(false);
        expect(r2.reason).toMatch(/not a landmark/);

        const bad = clone(rec);
        bad.landmarks[0].actions = [...bad.landmarks[0].actions, task.actions.length];
        expect(checkLandmarkCertificate(task, bad).valid).toBe(false);
        const neg = clone(rec);
        neg.landmarks[0].cost = -1;
        neg.bound = neg.landmarks.reduce((s, l) => s + l.cost, 0);
        expect(checkLandmarkCertificate(task, neg).valid).toBe(false);
      }),
      { numRuns: 300 },
    );
    expect(tampered).toBeGreaterThan(50);
  });

  // Two routes to the goal: via x (cost 3) or via y (cost 5), then a final step z (cost 2).
  const step = (name: string, pre: number[], add: number[], cost: number): Action => ({
    name: `(${name})`, schema: name, args: [], pre, preNeg: [], add, del: [], cond: [], cost,
  });
  const routes: Task = {
    domainName: "routes", problemName: "routes", facts: ["(start)", "(mid)", "(end)"],
    init: [0], goal: [2], goalNeg: [],
    actions: [step("x", [0], [1], 3), step("y", [0], [1], 5), step("z", [1], [2], 2)],
    costModel: "action-costs",
  };

  it("on a hand-built task: records {z}:2 and {x,y}:3, bound 5", () => {
    const rec = landmarkCutAtInit(routes)!;
    // hand-checked: every plan uses z and one of x, y; cheapest plan x, z costs 5
    expect(rec.bound).toBe(5);
    const sorted = [...rec.landmarks].sort((a, b) => a.actions.length - b.actions.length);
    expect(sorted).toEqual([{ actions: [2], cost: 2 }, { actions: [0, 1], cost: 3 }]);
    expect(checkLandmarkCertificate(routes, rec).valid).toBe(true);
  });

  it("on a hand-built task: a landmark missing an alternative is rejected", () => {
    const forged: LandmarkRecord = { bound: 5, landmarks: [{ actions: [2], cost: 2 }, { actions: [0], cost: 3 }] };
    const r = checkLandmarkCertificate(routes, forged);
    expect(r.valid).toBe(false);
    expect(r.reason).toMatch(/landmark 2/);
    // moving cost between landmarks beyond an action's cost is rejected
    const shifted: LandmarkRecord = { bound: 5, landmarks: [{ actions: [2], cost: 3 }, { actions: [0, 1], cost: 2 }] };
    expect(checkLandmarkCertificate(routes, shifted).reason).toMatch(/cost partition/);
  });

  it("returns null exactly for relaxed-unreachable goals", () => {
    const stuck: Task = { ...routes, actions: [step("x", [0], [1], 3)] };
    expect(landmarkCutAtInit(stuck)).toBeNull();
  });
});
