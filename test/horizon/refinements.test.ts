// The refinements behind the tighter horizons, each against the exact quantity it bounds:
// the excess lower bound (landmarks, projections) against the cheapest excess of any plan, the
// exact explicit method against brute force and the scenarios' own figures, and the pieces of
// the zero-cost bound (distances, split by context, whole-plan counts) against brute force.
import { readFileSync } from "node:fs";
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import type { Task } from "../../src/ground/task.js";
import { groundFiles } from "../../src/ground/index.js";
import { boundContext, computeMethod, METHODS } from "../../src/horizon/index.js";
import { cheapestWithin, optimalCost, reachableStates } from "../support/reference.js";
import { factoredTaskArb } from "../support/random-task.js";
import { richTaskArb, transitionTaskArb } from "./rich-task.js";

const tasks = (zeroShare: number) =>
  fc.oneof(
    transitionTaskArb({ maxVars: 5, zeroShare, maxCost: 4 }),
    richTaskArb({ maxFacts: 6, zeroShare, maxCost: 4 }),
    factoredTaskArb({ maxVars: 4, maxActions: 8, zeroCostShare: zeroShare, maxCost: 4 }),
  );

describe("excess lower bound", () => {
  it("never exceeds the least excess Σ max(0, cost − u) of any plan (brute force)", () => {
    let positive = 0;
    let checked = 0;
    fc.assert(
      fc.property(tasks(0.3), fc.integer({ min: 1, max: 6 }), (task, slack) => {
        const opt = optimalCost(task);
        fc.pre(opt !== null);
        const d = computeMethod(task, opt!.cost + slack, "zero-cost", { maxOptimalStates: 0 }).derivation;
        const u = d.minPositiveCost as number | null;
        if (u === null) return;
        const h = d.excessLowerBound as number;
        // every plan of the task maps to one of the reduced task no dearer in this excess (see excess.ts)
        const excessTask: Task = { ...task, actions: task.actions.map((a) => ({ ...a, cost: Math.max(0, a.cost - u) })) };
        const least = optimalCost(excessTask)!.cost;
        expect(h).toBeLessThanOrEqual(least);
        // and the positive-action count it implies holds for the cheapest plans
        expect(d.k as number).toBeLessThanOrEqual(d.kWithoutExcess as number);
        checked++;
        if (h > 0) positive++;
      }),
      { numRuns: 150, seed: 4501, maxSkipsPerRun: 60 },
    );
    expect(checked).toBeGreaterThan(100);
    expect(positive).toBeGreaterThan(15);
  });
});

describe("exact explicit method", () => {
  it("is the fewest actions among cost-optimal plans (brute force), with and without pruning", () => {
    let found = 0;
    fc.assert(
      fc.property(tasks(0.4), fc.boolean(), (task, relevance) => {
        const ref = optimalCost(task);
        const m = computeMethod(task, 50, "optimal-length", { relevance });
        if (ref === null) {
          expect(m.value).toBeNull(); // no plan: the method gives no (vacuous) horizon
          return;
        }
        expect(m.value).toBe(ref.length);
        expect(m.derivation.optimalCost).toBe(ref.cost);
        // a completeness threshold for every C above the optimum
        expect(cheapestWithin(task, m.value!)).toBe(ref.cost);
        found++;
      }),
      { numRuns: 150, seed: 4502 },
    );
    expect(found).toBeGreaterThan(50);
  });

  it("matches the scenario instances' own figures", () => {
    // source: benchmarks/domains/<scenario>/instances.json — Dijkstra on (cost, length) over each
    // scenario's PDDL-free TypeScript model, independent of the grounder and of this code
    const cases: Array<[string, string]> = [
      ["harbour", "problem-01"],
      ["harbour", "problem-02"],
      ["warehouse", "problem-01"],
      ["warehouse", "problem-03"],
      ["workshop", "problem-02"],
      ["workshop", "problem-03"],
    ];
    for (const [scenario, name] of cases) {
      const dir = `benchmarks/domains/${scenario}`;
      const fig = (JSON.parse(readFileSync(`${dir}/instances.json`, "utf8")) as Record<string, { optimalCost: number; optimalLength: number }>)[name];
      const { task } = groundFiles(`${dir}/domain.pddl`, `${dir}/${name}.pddl`);
      const m = computeMethod(task, fig.optimalCost + 1, "optimal-length");
      expect(m.value, `${scenario}/${name}`).toBe(fig.optimalLength);
      expect(m.derivation.optimalCost, `${scenario}/${name}`).toBe(fig.optimalCost);
    }
  });

  it("stays within its state cap and then does not apply", () => {
    fc.assert(
      fc.property(tasks(0.3), (task) => {
        const states = reachableStates(task)!.length;
        fc.pre(states >= 4);
        const m = computeMethod(task, 50, "optimal-length", { relevance: false, maxOptimalStates: 2 });
        if (m.value !== null) expect(m.derivation.statesStored as number).toBeLessThanOrEqual(2);
        else expect(String(m.derivation.notApplicable)).toMatch(/more than 2 states|no plan/);
      }),
      { numRuns: 60, seed: 4503, maxSkipsPerRun: 60 },
    );
  });
});

interface Parts {
  distance: number;
  split: number;
  global: number;
}

/** Which refinements the zero-cost method used on a task (to make sure the tests reach them). */
function parts(d: Record<string, unknown>, into: Parts): void {
  const comps = ((d.layered as { contributing?: Array<Record<string, unknown>> } | undefined)?.contributing ?? []) as Array<Record<string, unknown>>;
  for (const c of comps) {
    if (c.zeroDistance !== undefined && c.a === c.zeroDistance && c.bound === "segments") into.distance++;
    if (c.contextSplit !== undefined) into.split++;
    if (c.bound === "global") into.global++;
  }
}

describe("zero-cost bound refinements", () => {
  // small projection caps force the split by context on these small tasks
  const configs: Array<[string, Record<string, number>]> = [
    ["projections with context", { maxExplicitStates: 1, maxOptimalStates: 0 }],
    ["split by context", { maxExplicitStates: 1, maxOptimalStates: 0, maxProjectionStates: 6 }],
  ];
  for (const [name, opts] of configs) {
    it(`${name}: the cheapest plan within the horizon is optimal (brute force)`, () => {
      const used: Parts = { distance: 0, split: 0, global: 0 };
      let binding = 0;
      fc.assert(
        fc.property(tasks(0.6), fc.integer({ min: 1, max: 3 }), (task, slack) => {
          const opt = optimalCost(task);
          fc.pre(opt !== null && opt.length >= 2);
          const m = METHODS.find((x) => x.name === "zero-cost")!.run(boundContext(task, opts), opt!.cost + slack, []);
          if (m.value === null) return;
          parts(m.derivation, used);
          const states = reachableStates(task)!.length;
          if (m.value < states - 1) binding++;
          expect(cheapestWithin(task, Math.min(m.value, states))).toBe(opt!.cost);
        }),
        { numRuns: 120, seed: 4510, maxSkipsPerRun: 80 },
      );
      if (process.env.TALLY) console.log("TALLY", name, JSON.stringify(used), binding);
      expect(binding).toBeGreaterThan(10);
      if (name === "split by context") expect(used.split).toBeGreaterThan(3);
      else {
        expect(used.distance).toBeGreaterThan(3);
        expect(used.global).toBeGreaterThan(3);
      }
    });
  }
});
