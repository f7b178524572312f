// Every horizon method separately, under settings that force each refinement (tiny projection
// caps, no pruning, capped explicit search), against exact brute force; plus determinism.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import type { Task } from "../../src/ground/task.js";
import { boundContext, computeHorizon, computeMethod, horizonReportJson, METHODS, type HorizonOptions, type MethodResult } from "../../src/horizon/index.js";
import { cheapestWithin, optimalCost, reachableStates } from "../support/reference.js";
import { factoredTaskArb } from "../support/random-task.js";
import { gatedTaskArb, richTaskArb, transitionTaskArb } from "./rich-task.js";

/** PLUMBLINE_SLOW (npm run test:slow) runs ten times as many cases. */
const RUNS = process.env.PLUMBLINE_SLOW ? 10 : 1;
const TIMEOUT = RUNS > 1 ? 900_000 : undefined;

/** Small tasks with zero-cost actions, negative conditions and conditional effects. */
const tasks = fc.oneof(
  richTaskArb({ maxFacts: 6, zeroShare: 0.5, maxCost: 4 }),
  transitionTaskArb({ maxVars: 5, zeroShare: 0.5, maxCost: 4 }),
  factoredTaskArb({ maxVars: 4, maxActions: 8, zeroCostShare: 0.5, maxCost: 4 }),
);

/**
 * Settings under which different refinements decide the value: the defaults; no relevance
 * pruning; projection caps of 2–4 states (projections with context abandoned, so the split by
 * context and the product fallback are used); an exhausted projection budget; the exact
 * explicit search capped at 3 states (it must then step aside).
 */
const CONFIGS: Array<[string, HorizonOptions]> = [
  ["defaults", {}],
  ["no pruning", { relevance: false, maxOptimalStates: 0 }],
  ["projection cap 2", { maxProjectionStates: 2, maxExplicitStates: 1, maxOptimalStates: 0 }],
  ["projection cap 3", { maxProjectionStates: 3, maxExplicitStates: 1, maxOptimalStates: 0, relevance: false }],
  ["projection cap 4", { maxProjectionStates: 4, maxExplicitStates: 1, maxOptimalStates: 0 }],
  ["projection cap 6", { maxProjectionStates: 6, maxExplicitStates: 1, maxOptimalStates: 0 }],
  ["no projection budget", { projectionBudget: 2, maxUncertainEffects: 0, maxExplicitStates: 1, maxOptimalStates: 0 }],
  ["exact search capped", { maxOptimalStates: 3, relevance: false }],
];

interface Tally {
  /** per method: checks where H < reachable states − 1 (the check has teeth) */
  binding: Record<string, number>;
  /** refinements seen in derivations */
  parts: Record<string, number>;
}

/** Which refinements a derivation used (so the test can insist they are all exercised). */
function recordParts(m: MethodResult, parts: Record<string, number>): void {
  const bump = (k: string) => (parts[k] = (parts[k] ?? 0) + 1);
  const d = m.derivation;
  if (typeof d.excessLowerBound === "number" && d.excessLowerBound > 0) bump("excess");
  const comps = [...(((d.layered as Record<string, unknown> | undefined)?.contributing ?? []) as Array<Record<string, unknown>>), ...((d.contributing ?? []) as Array<Record<string, unknown>>)];
  for (const c of comps) {
    if (c.contextSplit !== undefined) bump("split");
    if (c.via === "product") bump("product");
    if (c.via === "projection-with-context") bump("context");
    if (c.bound === "global") bump("global");
    if (c.bound === "positive-cap") bump("positive-cap");
    if (c.zeroDistance !== undefined) bump("zero-distance");
  }
}

/** The method's value and, for the zero-cost method, both values it took the minimum of. */
function valuesOf(m: MethodResult): Array<[string, number]> {
  const out: Array<[string, number]> = [[m.method, m.value!]];
  const d = m.derivation;
  for (const part of ["layered", "explicit"]) {
    const v = (d[part] as Record<string, unknown> | undefined)?.value;
    if (typeof v === "number") out.push([`${m.method}/${part}`, v]);
  }
  return out;
}

/**
 * The claim every method makes (DEVELOPERS "Horizons"): a plan of cost c < C implies a plan of
 * cost ≤ c with at most H actions. With the optimum opt < C that means the cheapest plan
 * within H actions costs exactly opt; for C = ∞ too (plan existence). H is clamped at the
 * number of reachable states (a loop-free optimal plan always fits, so the clamp changes no
 * answer).
 */
function checkTask(task: Task, opts: HorizonOptions, tally: Tally): void {
  const opt = optimalCost(task);
  const states = reachableStates(task)!.length;
  const within = new Map<number, number | null>();
  const cheapest = (H: number) => {
    const h = Math.min(H, states);
    if (!within.has(h)) within.set(h, cheapestWithin(task, h));
    return within.get(h)!;
  };
  const costs = opt === null ? [Number.POSITIVE_INFINITY, 3] : [opt.cost + 1, opt.cost + 2, opt.cost + 5, Number.POSITIVE_INFINITY, opt.cost, Math.max(0, opt.cost - 1)];
  for (const C of costs) {
    // each method alone (no earlier results to lean on) and as computeHorizon runs it
    const alone = METHODS.map((m) => m.run(boundContext(task, opts), C, []));
    const report = computeHorizon(task, C, opts);
    for (const m of [...alone, ...report.methods]) {
      if (m.value === null) continue;
      // a threshold counts actions: a whole number (or unbounded), never fractional or negative
      expect(Number.isSafeInteger(m.value) ? m.value >= 0 : m.value === Number.POSITIVE_INFINITY, `${m.method} = ${m.value}`).toBe(true);
      recordParts(m, tally.parts);
      if (opt === null || opt.cost >= C) continue; // no plan cheaper than C: nothing to keep
      // the value, and each alternative the zero-cost method took the minimum of
      for (const [label, H] of valuesOf(m)) {
        if (H < states - 1) tally.binding[label] = (tally.binding[label] ?? 0) + 1;
        // source: exhaustive search over the explicit state space (test/support/reference.ts, shares no code with src/)
        expect(cheapest(H), `${label} = ${H} for C = ${C}, optimum ${opt.cost}`).toBe(opt.cost);
      }
    }
    if (opt !== null && opt.cost < C) expect(cheapest(report.horizon)).toBe(opt.cost);
  }
}

describe("every method is a completeness threshold under every setting (brute force)", () => {
  const all: Tally = { binding: {}, parts: {} };
  CONFIGS.forEach(([name, opts], i) => {
    it(name, () => {
      fc.assert(
        fc.property(tasks, (task) => checkTask(task, opts, all)),
        { numRuns: 50 * RUNS, seed: 5200 + i },
      );
    }, TIMEOUT);
  });
  // zero-cost moves gated by context only positive actions change: the split by context
  it("gated zero-cost moves, projection caps 3–6", () => {
    fc.assert(
      fc.property(gatedTaskArb(), fc.integer({ min: 3, max: 6 }), (task, cap) => checkTask(task, { maxProjectionStates: cap, maxExplicitStates: 1, maxOptimalStates: 0, relevance: false }, all)),
      { numRuns: 100 * RUNS, seed: 5290 },
    );
  }, TIMEOUT);
  // slow runs only: larger tasks (deeper dependency graphs, more context), every setting
  it.skipIf(RUNS === 1)("larger tasks under every setting", () => {
    const larger = fc.oneof(
      richTaskArb({ maxFacts: 8, maxActions: 12, zeroShare: 0.5, maxCost: 5 }),
      transitionTaskArb({ maxVars: 6, maxActions: 14, zeroShare: 0.5, maxCost: 5 }),
      gatedTaskArb({ maxContext: 3, maxCost: 5 }),
    );
    fc.assert(
      fc.property(larger, fc.constantFrom(...CONFIGS.map((c) => c[1])), (task, opts) => {
        fc.pre(reachableStates(task, 3000) !== null);
        checkTask(task, opts, all);
      }),
      { numRuns: 60 * RUNS, seed: 5295 },
    );
  }, TIMEOUT);
  it("the checks reached every method and every refinement", () => {
    if (process.env.TALLY) console.log("TALLY", JSON.stringify(all));
    for (const m of [...METHODS.map((x) => x.name), "zero-cost/layered", "zero-cost/explicit"]) expect(all.binding[m] ?? 0, m).toBeGreaterThan(10);
    for (const p of ["excess", "split", "product", "context", "global", "positive-cap", "zero-distance"]) expect(all.parts[p] ?? 0, p).toBeGreaterThan(3);
  });
});

describe("a zero-cost action enabled by a positive one, projections too small for the pair", () => {
  // p ← (zero cost, needs c); c ← (cost 1). The only plan: set c, then p (2 actions, cost 1).
  // source: worked example, checked by hand
  const task: Task = {
    domainName: "d",
    problemName: "p",
    facts: ["(p)", "(c)"],
    init: [],
    goal: [0],
    goalNeg: [],
    costModel: "action-costs",
    actions: [
      { name: "(set-c)", schema: "set-c", args: [], pre: [], preNeg: [], add: [1], del: [], cond: [], cost: 1 },
      { name: "(set-p)", schema: "set-p", args: [], pre: [1], preNeg: [], add: [0], del: [], cond: [], cost: 0 },
    ],
  };
  it("the split by context keeps the zero-cost action (horizon ≥ 2 for C = 2)", () => {
    const opts = { maxExplicitStates: 1, maxOptimalStates: 0, maxProjectionStates: 2, relevance: false };
    const m = METHODS.find((x) => x.name === "zero-cost")!.run(boundContext(task, opts), 2, []);
    const layered = m.derivation.layered as { contributing: Array<Record<string, unknown>> };
    expect(layered.contributing.some((c) => c.contextSplit !== undefined)).toBe(true);
    expect(m.value).toBeGreaterThanOrEqual(2);
    expect(cheapestWithin(task, m.value!)).toBe(1);
  });
});

describe("determinism", () => {
  it("the same numbers fresh, after other upper costs on the same task, from a JSON copy, and by computeMethod", () => {
    fc.assert(
      fc.property(tasks, fc.integer({ min: 0, max: 12 }), fc.integer({ min: 0, max: 12 }), fc.constantFrom(...CONFIGS.map((c) => c[1])), (task, C, other, opts) => {
        // common practice, no source: a certificate's numbers must be reproducible by anyone
        const fresh = JSON.stringify(horizonReportJson(computeHorizon(structuredClone(task), C, opts)));
        // the context cache holds results for another C first (as in the optimizer's loop)
        const reused = structuredClone(task);
        computeHorizon(reused, other, opts);
        computeHorizon(reused, Number.POSITIVE_INFINITY, opts);
        expect(JSON.stringify(horizonReportJson(computeHorizon(reused, C, opts)))).toBe(fresh);
        const copy = JSON.parse(JSON.stringify(task)) as Task;
        const report = horizonReportJson(computeHorizon(copy, C, opts));
        expect(JSON.stringify(report)).toBe(fresh);
        // a JSON round trip of the report loses nothing (what certificates store)
        expect(JSON.stringify(JSON.parse(fresh))).toBe(fresh);
        // each method alone, by name, on a fresh copy, as the report has it
        const methods = report.methods as Array<{ method: string; derivation: unknown }>;
        for (const m of methods) expect(JSON.stringify(computeMethod(structuredClone(task), C, m.method, opts).derivation)).toBe(JSON.stringify(m.derivation));
      }),
      { numRuns: 40 * RUNS, seed: 5300 },
    );
  }, TIMEOUT);
});
