// The horizon methods, each a proven completeness threshold for "is there a plan of cost < C?"
// with a derivation listing every number used, so an auditor can recompute each one.
import { add, big, less, mul, toJson, toNumber, toText, type Big } from "./big.js";
import { compositionalBound, type CompositionalResult } from "./compositional.js";
import { optimalStateCap, type BoundContext } from "./context.js";
import { positiveActionBound, type PositiveCount } from "./excess.js";
import type { MethodResult } from "./types.js";

/** A method sees the results of the methods before it (the explicit one uses them to stop early). */
export type HorizonMethod = (ctx: BoundContext, upperCost: number, previous: readonly MethodResult[]) => MethodResult;

function result(method: string, value: Big | undefined, derivation: Record<string, unknown>): MethodResult {
  if (value === undefined) return { method, value: null, valueText: null, sound: true, derivation };
  return { method, value: toNumber(value), valueText: toText(value), sound: true, derivation: { ...derivation, value: toJson(value) } };
}

function costStats(ctx: BoundContext): { actions: number; zero: number; minCost: number | null; minPositive: number | null } {
  let zero = 0;
  let minCost: number | null = null;
  let minPositive: number | null = null;
  for (const a of ctx.prepared.task.actions) {
    if (a.cost === 0) zero++;
    else if (minPositive === null || a.cost < minPositive) minPositive = a.cost;
    if (minCost === null || a.cost < minCost) minCost = a.cost;
  }
  return { actions: ctx.prepared.task.actions.length, zero, minCost, minPositive };
}

/** The positive-action count bound k for C (null when no action has a positive cost). */
function positiveCount(ctx: BoundContext, C: number, unit: number | null): PositiveCount | null {
  if (unit === null) return null;
  return positiveActionBound(C, unit, ctx.excess(unit));
}

function countRecord(p: PositiveCount): Record<string, unknown> {
  const out: Record<string, unknown> = {
    k: toJson(p.k),
    kWithoutExcess: toJson(p.kPlain),
    excessLowerBound: p.excessBound,
    excessLandmarkBound: p.landmarkBound,
    excessLandmarks: p.landmarks,
    excessLandmarkCosts: p.landmarkCosts,
    excessProjections: p.patterns,
  };
  if (p.note) out.excessNote = p.note;
  return out;
}

/**
 * (a) All costs positive: a plan of cost < C has at most k = floor((C − 1 − h) / c_min)
 * actions, h a lower bound on Σ (cost − c_min) over every plan (certified landmark-cut, or
 * cheapest projected paths: excess.ts), so that many steps contain it.
 */
export const costMethod: HorizonMethod = (ctx, C) => {
  const s = costStats(ctx);
  const base = { formula: "floor((C - 1 - h) / minCost), h = lower bound on the sum of (cost - minCost) over a plan", C: finiteOrText(C), actions: s.actions, zeroCostActions: s.zero, minCost: s.minCost };
  if (!Number.isFinite(C)) return result("cost", undefined, { ...base, notApplicable: "no finite upper cost C" });
  if (C <= 0) return result("cost", 0n, { ...base, note: "no plan costs less than 0" });
  if (s.actions === 0) return result("cost", 0n, { ...base, note: "no actions left after pruning: only the empty plan" });
  if (s.zero > 0) return result("cost", undefined, { ...base, notApplicable: "zero-cost actions present" });
  const p = positiveCount(ctx, C, s.minCost)!;
  return result("cost", p.k, { ...base, ...countRecord(p) });
};

/**
 * (b) Zero-cost actions: a plan of cost < C has at most k = floor((C − 1 − h) / c_min⁺)
 * positive-cost actions (excess.ts), so at most k + 1 zero-cost segments. The zero-cost actions
 * are bounded per SCC S of the zero-cost dependency graph, children first (compositional.ts,
 * mode "zero", M = k + 1 segments): K(S) = (k + 1)·a(S) + b(S)·Σ_children K(C), or a bound for
 * the whole plan when S can never return to an earlier state. H = k + Σ_S K(S). When the state
 * space is small, also H = k + (k + 1)·ℓ₀ with ℓ₀ the exact largest zero-cost distance between
 * reachable states (a zero-cost segment can be replaced by a shortest zero-cost path between
 * its ends); the smaller value is reported.
 */
export const zeroCostMethod: HorizonMethod = (ctx, C, previous) => {
  const s = costStats(ctx);
  const base = {
    formula: "min(k + sum over zero-cost SCCs S of K(S), k + (k + 1) * l0), k = floor((C - 1 - h) / minPositiveCost)",
    C: finiteOrText(C),
    zeroCostActions: s.zero,
    minPositiveCost: s.minPositive,
  };
  if (!Number.isFinite(C)) return result("zero-cost", undefined, { ...base, notApplicable: "no finite upper cost C" });
  if (C <= 0) return result("zero-cost", 0n, { ...base, note: "no plan costs less than 0" });
  const p = positiveCount(ctx, C, s.minPositive);
  const k = p === null ? 0n : p.k;
  const counts = p === null ? { k: 0, note: "no positive-cost actions" } : countRecord(p);
  if (s.zero === 0) return result("zero-cost", k, { ...base, ...counts, note: "no zero-cost actions: k alone" });
  // The exact explicit method (run before this one) supersedes the costly parts: when it
  // applies, every threshold of this kind is at least its value (for C above the optimum), so
  // the split by context and the explicit ℓ₀ are skipped; when it ran past its state cap, the
  // explicit ℓ₀ (a BFS from every reachable state) is not attempted either.
  const exact = previous.find((m) => m.method === "optimal-length");
  const exactApplies = exact !== undefined && exact.value !== null;
  const comp = runCompositional(ctx, "zero", { segments: add(k, 1n), skipSplit: exactApplies });
  const layered = add(k, comp.total);
  let h = layered;
  let source = "layered";
  let explicit: Record<string, unknown>;
  const ex = exactApplies || exact?.derivation.stateCapReached === true ? null : ctx.explicit();
  if (ex === null) explicit = { notComputed: "superseded by the optimal-length method" };
  else if (ex.states !== null && ex.largestZeroReach !== null) {
    // exact zero-cost diameter when affordable, else the largest zero-cost reachable set − 1
    const l0 = big(ex.zeroCostDiameter ?? ex.largestZeroReach - 1);
    const viaL0 = add(k, mul(add(k, 1n), l0));
    explicit = { reachableStates: ex.states, largestZeroCostReachableSet: ex.largestZeroReach, zeroCostDiameter: ex.zeroCostDiameter, l0: toJson(l0), value: toJson(viaL0) };
    if (less(viaL0, h)) {
      h = viaL0;
      source = "explicit";
    }
  } else explicit = { notApplicable: `more than ${ex.maxStates} reachable states` };
  return result("zero-cost", h, { ...base, ...counts, source, layered: { value: toJson(layered), segments: toJson(add(k, 1n)), ...compositionalRecord(comp) }, explicit });
};

/**
 * (c) Compositional sublist bound of the whole task (compositional.ts, mode "all"): any plan
 * has a sub-sequence of at most Σ_S K(S) actions reaching the same final state at no greater
 * cost — a completeness threshold whatever the costs (and for plain plan existence, C = ∞).
 * With a finite C, SCCs written only by positive-cost actions hold at most k of them together.
 */
export const compositionalMethod: HorizonMethod = (ctx, C) => {
  const s = costStats(ctx);
  const p = Number.isFinite(C) && C > 0 ? positiveCount(ctx, C, s.minPositive) : null;
  const comp = runCompositional(ctx, "all", p === null ? {} : { positiveCap: p.k });
  const rec: Record<string, unknown> = {
    formula: "sum over SCCs S of K(S), K(S) = a(S) + b(S) * (sum of K over children), positive-only SCCs together at most k",
    C: finiteOrText(C),
    ...compositionalRecord(comp),
  };
  if (p !== null) Object.assign(rec, countRecord(p), { positiveOnlySum: toJson(comp.positiveSum ?? 0n) });
  return result("compositional", comp.total, rec);
};

/**
 * (d) Exact, on small state spaces: the fewest actions L* among cost-optimal plans, found by
 * Dijkstra on (cost, length) (optimal-length.ts). If a plan costs c < C, the optimum is at
 * most c and a plan of the optimal cost with L* actions exists: a completeness threshold for
 * every C. Its soundness rests on the explicit search, which an auditor repeats (up to the
 * same state cap); the SAT query at this horizon is still a real check of the claim. Not used
 * when no plan exists (a horizon would then be vacuous): the other methods bound existence.
 */
export const explicitOptimalMethod: HorizonMethod = (ctx, C) => {
  const cap = optimalStateCap(ctx.prepared.task, ctx.limits.maxOptimalStates);
  const base = { formula: "fewest actions among cost-optimal plans (Dijkstra on (cost, length))", C: finiteOrText(C), stateCap: cap };
  if (ctx.limits.maxOptimalStates <= 0) return result("optimal-length", undefined, { ...base, notApplicable: "disabled (maxOptimalStates = 0)" });
  const o = ctx.optimal();
  if (o.kind === "exceeded") return result("optimal-length", undefined, { ...base, stateCapReached: true, notApplicable: `more than ${o.maxStates} states to store` });
  if (o.kind === "no-plan")
    return result("optimal-length", undefined, { ...base, notApplicable: `no plan: all ${o.statesStored} reachable states searched (the other methods bound plan existence)` });
  return result("optimal-length", big(o.length), {
    ...base,
    optimalCost: o.cost,
    fewestActions: o.length,
    statesStored: o.statesStored,
    statesSettled: o.statesSettled,
  });
};

/**
 * Explicit: when the reachable state space is small, a run that visits no state twice has at
 * most (reachable states − 1) actions, and cutting loops from a plan gives such a run. The
 * exploration stops one state past the best value of the methods before it (it could not win).
 */
export const explicitMethod: HorizonMethod = (ctx, C, previous) => {
  let best = Number.POSITIVE_INFINITY;
  for (const m of previous) if (m.value !== null && m.value < best) best = m.value;
  const cap = Math.min(ctx.limits.maxExplicitStates, best + 1);
  const ex = ctx.explicit(cap);
  const base = { formula: "reachable states - 1", C: finiteOrText(C) };
  if (ex.states === null) {
    const why = cap < ctx.limits.maxExplicitStates ? ` (explored only as far as could beat the best other method, ${best})` : "";
    return result("reachable-states", undefined, { ...base, notApplicable: `more than ${ex.maxStates} reachable states${why}` });
  }
  return result("reachable-states", big(Math.max(0, ex.states - 1)), { ...base, reachableStates: ex.states });
};

export const METHODS: ReadonlyArray<{ name: string; run: HorizonMethod }> = [
  { name: "cost", run: costMethod },
  { name: "optimal-length", run: explicitOptimalMethod },
  { name: "zero-cost", run: zeroCostMethod },
  { name: "compositional", run: compositionalMethod },
  { name: "reachable-states", run: explicitMethod },
];

function runCompositional(ctx: BoundContext, mode: "all" | "zero", extra: { segments?: Big; positiveCap?: Big; skipSplit?: boolean }): CompositionalResult {
  const graph = mode === "all" ? ctx.fullGraph() : ctx.zeroGraph();
  return compositionalBound(ctx.projection, graph, mode, {
    maxStates: ctx.limits.maxProjectionStates,
    maxUncertain: ctx.limits.maxUncertainEffects,
    budget: { remaining: ctx.limits.projectionBudget },
    ...extra,
  });
}

function compositionalRecord(comp: CompositionalResult): Record<string, unknown> {
  return {
    total: toJson(comp.total),
    components: comp.components.length,
    projectionsExplored: comp.explored,
    projectionsAbandoned: comp.gaveUp,
    // components with K = 0 contribute nothing; list the others
    contributing: comp.components.filter((c) => c.K !== 0),
  };
}

function finiteOrText(C: number): number | string {
  return Number.isFinite(C) ? C : "Infinity";
}
