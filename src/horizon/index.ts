// The horizon stage's public API: completeness thresholds for "is there a plan of cost < C?"
// by every method, each with its derivation, and the smallest of them as the horizon.
import type { Task } from "../ground/task.js";
import { PlumblineError } from "../util/errors.js";
import { boundContext, type BoundContext } from "./context.js";
import { METHODS, type HorizonMethod } from "./methods.js";
import type { HorizonOptions, HorizonReport, MethodResult } from "./types.js";

export type { HorizonOptions, HorizonReport, MethodResult } from "./types.js";
export { HORIZON_DEFAULTS } from "./types.js";
export { costMethod, zeroCostMethod, compositionalMethod, explicitOptimalMethod, explicitMethod, METHODS, type HorizonMethod } from "./methods.js";
export { boundContext, type BoundContext, type ExplicitSpace } from "./context.js";
export { compositionalBound, type ComponentBound, type CompositionalResult, type BlockMode } from "./compositional.js";
export { reachStats, largestReachableSet, type ReachStats } from "./reach.js";
export { exploreProjection, projectionContext, type ProjectionContext } from "./projection.js";
export { type Big, toJson as bigToJson, toText as bigToText } from "./big.js";

/** Checks C: a non-negative integer, or +Infinity for "any plan at all". */
export function checkUpperCost(upperCost: number): void {
  if (upperCost === Number.POSITIVE_INFINITY) return;
  if (!Number.isSafeInteger(upperCost) || upperCost < 0)
    throw new PlumblineError("usage", `the upper cost bound must be a non-negative integer (or Infinity), found ${upperCost}`);
}

/**
 * Every method's completeness threshold for "a plan of cost < upperCost" on `task`, and the
 * smallest as the horizon. Deterministic: the same task and options give identical JSON.
 */
export function computeHorizon(task: Task, upperCost: number, opts: HorizonOptions = {}): HorizonReport {
  checkUpperCost(upperCost);
  const ctx = boundContext(task, opts);
  return assemble(ctx, upperCost, runMethods(ctx, upperCost, METHODS.length));
}

function runMethods(ctx: BoundContext, upperCost: number, count: number): MethodResult[] {
  const out: MethodResult[] = [];
  for (const m of METHODS.slice(0, count)) out.push(m.run(ctx, upperCost, out));
  return out;
}

/**
 * One method's result by name, exactly as computeHorizon reports it (the methods before it
 * are run too, since the explicit method uses their values) — for auditors comparing number
 * by number.
 */
export function computeMethod(task: Task, upperCost: number, name: string, opts: HorizonOptions = {}): MethodResult {
  checkUpperCost(upperCost);
  const i = METHODS.findIndex((x) => x.name === name);
  if (i < 0) throw new PlumblineError("usage", `unknown horizon method "${name}" (known: ${METHODS.map((x) => x.name).join(", ")})`);
  return runMethods(boundContext(task, opts), upperCost, i + 1)[i];
}

function assemble(ctx: BoundContext, upperCost: number, methods: MethodResult[]): HorizonReport {
  let best: MethodResult | null = null;
  for (const m of methods) {
    if (!m.sound || m.value === null) continue;
    if (best === null || lessText(m.valueText!, best.valueText!)) best = m;
  }
  const p = ctx.prepared;
  const vars = p.variables.variables;
  return {
    horizon: best ? best.value! : Number.POSITIVE_INFINITY,
    horizonText: best ? best.valueText! : "Infinity",
    winner: best ? best.method : "none",
    upperCost,
    methods,
    analysis: {
      reduction: p.steps,
      variables: {
        method: p.variables.method,
        note: p.variables.note,
        count: vars.length,
        multiValued: vars.filter((v) => v.facts.length > 1).length,
        withNoneValue: vars.filter((v) => v.hasNone).length,
        largest: vars.reduce((n, v) => Math.max(n, v.facts.length), 0),
      },
    },
  };
}

/** Compares exact decimal texts ("Infinity" largest). */
function lessText(a: string, b: string): boolean {
  if (a === "Infinity") return false;
  if (b === "Infinity") return true;
  return BigInt(a) < BigInt(b);
}

/** The report as plain JSON data: huge values as decimal strings, +∞ as "Infinity". */
export function horizonReportJson(r: HorizonReport): Record<string, unknown> {
  const num = (v: number | null, text: string | null): number | string | null => (v === null ? null : Number.isFinite(v) ? v : text);
  return {
    horizon: num(r.horizon, r.horizonText),
    winner: r.winner,
    upperCost: Number.isFinite(r.upperCost) ? r.upperCost : "Infinity",
    methods: r.methods.map((m) => ({ method: m.method, value: num(m.value, m.valueText), sound: m.sound, derivation: m.derivation })),
    analysis: r.analysis,
  };
}
