// Each bound against the exact quantity it over-approximates: the compositional bound against
// the exact sublist diameter, ℓ₀ of the zero-cost method against the largest zero-cost
// distance between reachable states; plus determinism and faithful huge values.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import type { Action, Task } from "../../src/ground/task.js";
import { computeHorizon, computeMethod, horizonReportJson } from "../../src/horizon/index.js";
import { measureTask } from "../../src/measure/index.js";
import { applicable, reachableStates, stateKey, successor } from "../support/reference.js";
import { richTaskArb, transitionTaskArb } from "./rich-task.js";

const noPruning = { relevance: false };

/** max over reachable x, y reachable from x by zero-cost actions, of that zero-cost distance */
function zeroCostDiameter(task: Task): number {
  let best = 0;
  for (const x of reachableStates(task)!) {
    const seen = new Set([stateKey(x)]);
    let layer = [x];
    for (let d = 1; layer.length > 0; d++) {
      const next: Set<number>[] = [];
      for (const s of layer)
        for (const a of task.actions) {
          if (a.cost !== 0 || !applicable(a, s)) continue;
          const t = successor(a, s);
          const k = stateKey(t);
          if (!seen.has(k)) {
            seen.add(k);
            next.push(t);
            best = Math.max(best, d);
          }
        }
      layer = next;
    }
  }
  return best;
}

describe("bounds over-approximate what they bound", () => {
  it("compositional bound ≥ exact sublist diameter", () => {
    let tight = 0;
    let checked = 0;
    fc.assert(
      fc.property(fc.oneof(transitionTaskArb({ maxVars: 4 }), richTaskArb({ maxFacts: 5 })), (task) => {
        fc.pre(reachableStates(task)!.length >= 3);
        const m = measureTask(task, { combine: false, maxPathNodes: 200_000, sublist: { maxNodes: 200_000 } });
        if (!m.sublistDiameter.exact) return;
        const c = computeMethod(task, Number.POSITIVE_INFINITY, "compositional", noPruning);
        expect(c.value!).toBeGreaterThanOrEqual(m.sublistDiameter.value!);
        checked++;
        if (c.value === m.sublistDiameter.value) tight++;
      }),
      { numRuns: 120, seed: 4401, maxSkipsPerRun: 50 },
    );
    expect(checked).toBeGreaterThan(100);
    expect(tight).toBeGreaterThan(5);
  });

  it("one zero-cost segment's bound ≥ zero-cost distances between reachable states", () => {
    let positive = 0;
    let exact = 0;
    fc.assert(
      fc.property(fc.oneof(transitionTaskArb({ maxVars: 4, zeroShare: 0.6 }), richTaskArb({ zeroShare: 0.6 })), (task) => {
        const truth = zeroCostDiameter(task);
        // C = 1: no positive action fits, so the zero-cost method bounds a single zero-cost
        // segment — projections only (no explicit state space, no exact search)
        const projected = computeMethod(task, 1, "zero-cost", { ...noPruning, maxExplicitStates: 1, maxOptimalStates: 0 });
        if (task.actions.some((a) => a.cost === 0)) expect(projected.value!).toBeGreaterThanOrEqual(truth);
        // with the explicit state space, its ℓ₀ is exact
        const explicit = computeMethod(task, 10, "zero-cost", { ...noPruning, maxOptimalStates: 0 }).derivation.explicit as { zeroCostDiameter?: number } | undefined;
        if (explicit?.zeroCostDiameter !== undefined) {
          expect(explicit.zeroCostDiameter).toBe(truth);
          exact++;
        }
        if (truth > 0) positive++;
      }),
      { numRuns: 150, seed: 4402 },
    );
    expect(positive).toBeGreaterThan(50);
    expect(exact).toBeGreaterThan(50);
  });
});

describe("derivations", () => {
  it("are deterministic: the same task gives byte-identical JSON", () => {
    fc.assert(
      fc.property(richTaskArb({ maxFacts: 7 }), fc.integer({ min: 0, max: 30 }), (task, C) => {
        const a = JSON.stringify(horizonReportJson(computeHorizon(task, C)));
        const b = JSON.stringify(horizonReportJson(computeHorizon(structuredClone(task), C)));
        expect(a).toBe(b);
      }),
      { numRuns: 60, seed: 4403 },
    );
  });

  it("computeMethod gives each method's numbers exactly as computeHorizon reports them", () => {
    fc.assert(
      fc.property(fc.oneof(richTaskArb({ maxFacts: 6 }), transitionTaskArb({ maxVars: 4 })), fc.integer({ min: 1, max: 20 }), (task, C) => {
        const all = computeHorizon(task, C);
        for (const m of all.methods) expect(JSON.stringify(computeMethod(task, C, m.method))).toBe(JSON.stringify(m));
      }),
      { numRuns: 40, seed: 4404 },
    );
  });

  it("report values past 2^53 exactly, as decimal strings", () => {
    // a chain of m three-valued variables, each changeable only while its predecessor has value 0:
    // b = 2 for each, N_i = 2·(1 + N_{i-1}) = 2^{i+1} − 2, total Σ = 2^{m+2} − 4 − 2m (worked by hand)
    const m = 60;
    const facts: string[] = [];
    for (let i = 0; i < m; i++) for (let x = 0; x < 3; x++) facts.push(`(v${i} x${x})`);
    const id = (i: number, x: number) => 3 * i + x;
    const actions: Action[] = [];
    for (let i = 0; i < m; i++)
      for (let x = 0; x < 3; x++)
        for (let y = 0; y < 3; y++) {
          if (x === y) continue;
          const pre = i === 0 ? [id(i, x)] : [id(i - 1, 0), id(i, x)].sort((p, q) => p - q);
          actions.push({ name: `(set v${i} x${x} x${y})`, schema: "set", args: [], pre, preNeg: [], add: [id(i, y)], del: [id(i, x)], cond: [], cost: 1 });
        }
    const task: Task = {
      domainName: "chain",
      problemName: "chain",
      facts,
      init: Array.from({ length: m }, (_, i) => id(i, 0)),
      goal: [id(m - 1, 2)],
      goalNeg: [],
      actions,
      costModel: "unit",
    };
    const r = computeMethod(task, Number.POSITIVE_INFINITY, "compositional", noPruning);
    const expected = 2n ** BigInt(m + 2) - 4n - 2n * BigInt(m);
    expect(r.valueText).toBe(expected.toString());
    expect(r.value).toBe(Number.POSITIVE_INFINITY); // never rounded down
    // for plan existence (C = ∞) the huge sum is the horizon, in JSON as an exact decimal string
    const json = horizonReportJson(computeHorizon(task, Number.POSITIVE_INFINITY, { ...noPruning, maxOptimalStates: 0 }));
    expect(json.horizon).toBe(expected.toString());
    expect(json.winner).toBe("compositional");
    // with C = 100 every plan considered has at most 99 actions (all cost 1): the cap applies
    const capped = horizonReportJson(computeHorizon(task, 100, { ...noPruning, maxOptimalStates: 0 }));
    expect((capped.methods as Array<{ method: string; value: unknown }>).find((x) => x.method === "compositional")!.value).toBe(99);
    expect(capped.horizon).toBe(99); // the cost bound wins (first in order): floor((100 − 1) / 1)
    expect(capped.winner).toBe("cost");
  });
});
