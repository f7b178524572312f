// The measure stage's public API: exact graph measures of a small task's reachable state
// graph (diameters, optimal cost and length), each exact or with proven bounds and a note.
import type { Task } from "../ground/task.js";
import { buildStateGraph, isExceeded, type StateGraph } from "../analyse/index.js";
import { PlumblineError } from "../util/errors.js";
import { diameter, type DiameterOptions } from "./diameter.js";
import { optimalPlan, type OptimalResult } from "./optimal.js";
import { recurrenceDiameter, simpleSuccessors, traversalDiameter } from "./paths.js";
import { sublistAndSubset, type SublistOptions } from "./sublist.js";
import { exactMeasure, type Measure } from "./types.js";

export type { Measure } from "./types.js";
export type { OptimalResult } from "./optimal.js";
export { diameter, eccentricity, isSymmetricGraph, symmetryOrbits, type DiameterOptions } from "./diameter.js";
export { objectSwaps, type Symmetry } from "./symmetry.js";
export { traversalDiameter, recurrenceDiameter, simpleSuccessors } from "./paths.js";
export { sublistAndSubset, type SublistOptions } from "./sublist.js";
export { optimalPlan } from "./optimal.js";

export const DEFAULT_MAX_STATES = 250_000;

export interface MeasureOptions {
  /** Reachable states allowed (default 250,000); more is a "limit" error (exit code 3). */
  maxStates?: number;
  diameter?: DiameterOptions;
  /** Partial paths the recurrence diameter search may try (default 2,000,000). */
  maxPathNodes?: number;
  sublist?: SublistOptions;
  /**
   * Tighten the bounds of inexact measures with the proven ordering
   * diameter ≤ subset ≤ sublist ≤ recurrence ≤ traversal (default true). Tests switch it off
   * to check the ordering on independently computed values.
   */
  combine?: boolean;
}

export interface MeasureReport {
  states: number;
  edges: number;
  goalStates: number;
  /** Largest BFS depth from the initial state. */
  initialEccentricity: number;
  diameter: Measure & { orbits: number; symmetries: string[]; bfsRuns: number };
  subsetDiameter: Measure;
  sublistDiameter: Measure;
  recurrenceDiameter: Measure;
  traversalDiameter: Measure;
  /** Optimal plan cost and the fewest actions among optimal plans (null: unsolvable). */
  optimal: { cost: number | null; length: number | null };
}

/** Explores the reachable state graph, or throws a "limit" PlumblineError (exit 3) past the cap. */
export function reachableGraph(task: Task, maxStates = DEFAULT_MAX_STATES): StateGraph {
  const g = buildStateGraph(task, maxStates);
  if (isExceeded(g))
    throw new PlumblineError(
      "limit",
      `the task has more than ${maxStates} reachable states (stopped at ${g.statesSeen}); exact measures need the whole state graph — raise --max-reachable-states or measure a smaller instance`,
      undefined,
      3,
    );
  return g;
}

export function measureTask(task: Task, opts: MeasureOptions = {}): MeasureReport {
  const g = reachableGraph(task, opts.maxStates ?? DEFAULT_MAX_STATES);
  return measureGraph(g, opts);
}

export function measureGraph(g: StateGraph, opts: MeasureOptions = {}): MeasureReport {
  const n = g.states.size;
  let initialEccentricity = 0;
  for (let v = 0; v < n; v++) if (g.depth[v] > initialEccentricity) initialEccentricity = g.depth[v];
  const succ = simpleSuccessors(g);
  const td = traversalDiameter(succ);
  const traversal = exactMeasure(td);
  const recurrence = recurrenceDiameter(succ, td, opts.maxPathNodes ?? 2_000_000);
  const { sublist, subset } = sublistAndSubset(g, recurrence.exact ? recurrence.value! : recurrence.upper ?? td, opts.sublist);
  const diam = diameter(g, opts.diameter);
  const opt: OptimalResult = optimalPlan(g);
  const report: MeasureReport = {
    states: n,
    edges: g.edgeTarget.length,
    goalStates: opt.goalStates,
    initialEccentricity,
    diameter: diam,
    subsetDiameter: subset,
    sublistDiameter: sublist,
    recurrenceDiameter: recurrence,
    traversalDiameter: traversal,
    optimal: { cost: opt.cost, length: opt.length },
  };
  if (opts.combine ?? true) combineBounds(report);
  return report;
}

/** diameter ≤ subset ≤ sublist ≤ recurrence ≤ traversal: push lower bounds up, upper bounds down. */
function combineBounds(r: MeasureReport): void {
  const chain: Measure[] = [r.diameter, r.subsetDiameter, r.sublistDiameter, r.recurrenceDiameter, r.traversalDiameter];
  for (let i = 1; i < chain.length; i++) chain[i].lower = Math.max(chain[i].lower, chain[i - 1].lower);
  for (let i = chain.length - 2; i >= 0; i--) {
    const up = chain[i + 1].upper;
    if (up !== null) chain[i].upper = chain[i].upper === null ? up : Math.min(chain[i].upper!, up);
  }
  for (const m of chain)
    if (!m.exact && m.upper !== null && m.lower === m.upper) {
      m.exact = true;
      m.value = m.lower;
      m.note = `${m.note ?? ""}${m.note ? "; " : ""}exact by the ordering of the measures`;
    }
}
