// The horizon methods, each a proven completeness threshold for "is there a plan of cost < C?"
// with a derivation listing every number used, so an auditor can recompute each one.
import { add, big, mul, toJson, toNumber, toText, type Big } from "./big.js";
import { compositionalBound, type CompositionalResult } from "./compositional.js";
import type { BoundContext } from "./context.js";
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

/** Positive actions a plan of cost < C can contain: floor((C − 1) / c). C ≥ 1 here. */
function maxPositiveActions(upperCost: number, c: number): bigint {
  return (BigInt(upperCost) - 1n) / BigInt(c);
}

/**
 * (a) All costs positive: a plan of cost < C has at most floor((C − 1) / c_min) actions, so
 * that many steps contain it.
 */
export const costMethod: HorizonMethod = (ctx, C) => {
  const s = costStats(ctx);
  const base = { formula: "floor((C - 1) / c_min)", C: finiteOrText(C), actions: s.actions, zeroCostActions: s.zero, c_min: s.minCost };
  if (!Number.isFinite(C)) return result("cost", undefined, { ...base, notApplicable: "no finite upper cost C" });
  if (C <= 0) return result("cost", 0n, { ...base, note: "no plan costs less than 0" });
  if (s.actions === 0) return result("cost", 0n, { ...base, note: "no actions left after pruning: only the empty plan" });
  if (s.zero > 0) return result("cost", undefined, { ...base, notApplicable: "zero-cost actions present" });
  return result("cost", maxPositiveActions(C, s.minCost!), base);
};

/**
 * (b) Zero-cost actions: a plan of cost < C has at most k = floor((C − 1) / c_min⁺)
 * positive-cost actions; each run of zero-cost actions between them goes from one state a plan
 * can pass through to another and can be replaced by a shortest zero-cost path between the
 * same two states, of at most ℓ₀ actions. H = k + (k + 1)·ℓ₀. ℓ₀ is the smaller of the
 * compositional bound of the zero-cost actions (their dependency graph; projections of the
 * full task, which bound the sublist length and so the distance) and, when the state space is
 * small, the exact largest zero-cost distance between reachable states (or, when that BFS is
 * too much work, the largest set of states one reachable state reaches by zero-cost actions,
 * minus 1).
 */
export const zeroCostMethod: HorizonMethod = (ctx, C) => {
  const s = costStats(ctx);
  const base = { formula: "k + (k + 1) * l0, k = floor((C - 1) / c_min_positive)", C: finiteOrText(C), zeroCostActions: s.zero, c_min_positive: s.minPositive };
  if (!Number.isFinite(C)) return result("zero-cost", undefined, { ...base, notApplicable: "no finite upper cost C" });
  if (C <= 0) return result("zero-cost", 0n, { ...base, note: "no plan costs less than 0" });
  const k = s.minPositive === null ? 0n : maxPositiveActions(C, s.minPositive);
  let l0: Big = 0n;
  const sources: Record<string, unknown> = {};
  let l0Source = "no zero-cost actions";
  if (s.zero > 0) {
    const comp = runCompositional(ctx, "zero");
    sources.compositional = compositionalRecord(comp);
    l0 = comp.total;
    l0Source = "compositional";
    const ex = ctx.explicit();
    if (ex.states !== null && ex.largestZeroReach !== null) {
      // exact zero-cost diameter when affordable, else the largest zero-cost reachable set − 1
      const e = big(ex.zeroCostDiameter ?? ex.largestZeroReach - 1);
      sources.explicit = {
        reachableStates: ex.states,
        largestZeroCostReachableSet: ex.largestZeroReach,
        zeroCostDiameter: ex.zeroCostDiameter,
        l0: toJson(e),
      };
      if (l0 === null || (e !== null && e < l0)) {
        l0 = e;
        l0Source = "explicit";
      }
    } else sources.explicit = { notApplicable: `more than ${ex.maxStates} reachable states` };
  }
  const h = add(k, mul(add(k, 1n), l0));
  return result("zero-cost", h, { ...base, k: toJson(k), l0: toJson(l0), l0Source, ...sources });
};

/**
 * (c) Compositional sublist-diameter bound of the whole task: any plan has a sub-sequence of
 * at most Σ_S N(S) actions reaching the same final state at no greater cost — a completeness
 * threshold whatever the costs (and for plain plan existence, C = ∞).
 */
export const compositionalMethod: HorizonMethod = (ctx, C) => {
  const comp = runCompositional(ctx, "all");
  return result("compositional", comp.total, { formula: "sum over SCCs S of N(S), N(S) = b(S) * (1 + sum of N(P) over parents P)", C: finiteOrText(C), ...compositionalRecord(comp) });
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
    return result("explicit", undefined, { ...base, notApplicable: `more than ${ex.maxStates} reachable states${why}` });
  }
  return result("explicit", big(Math.max(0, ex.states - 1)), { ...base, reachableStates: ex.states });
};

export const METHODS: ReadonlyArray<{ name: string; run: HorizonMethod }> = [
  { name: "cost", run: costMethod },
  { name: "zero-cost", run: zeroCostMethod },
  { name: "compositional", run: compositionalMethod },
  { name: "explicit", run: explicitMethod },
];

function runCompositional(ctx: BoundContext, mode: "all" | "zero"): CompositionalResult {
  const graph = mode === "all" ? ctx.fullGraph() : ctx.zeroGraph();
  return compositionalBound(ctx.projection, graph, mode, {
    maxStates: ctx.limits.maxProjectionStates,
    maxUncertain: ctx.limits.maxUncertainEffects,
    budget: { remaining: ctx.limits.projectionBudget },
  });
}

function compositionalRecord(comp: CompositionalResult): Record<string, unknown> {
  return {
    total: toJson(comp.total),
    components: comp.components.length,
    projectionsExplored: comp.explored,
    projectionsAbandoned: comp.gaveUp,
    // components with b = 0 contribute nothing; list the others
    contributing: comp.components.filter((c) => c.b !== 0),
  };
}

function finiteOrText(C: number): number | string {
  return Number.isFinite(C) ? C : "Infinity";
}
