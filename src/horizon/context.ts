// What every horizon method works from, computed once per task: the reduced task, its
// variables, both dependency graphs, projections and (when small) the explicit state space.
import type { Task } from "../ground/task.js";
import { buildStateGraph, dependencyGraph, isExceeded, prepareTask, type DependencyGraph, type PreparedTask } from "../analyse/index.js";
import { excessLowerBound, type ExcessBound } from "./excess.js";
import { optimalLength, type OptimalLength } from "./optimal-length.js";
import { patternExcessBounds } from "./patterns.js";
import { reachStats } from "./reach.js";
import { projectionContext, type ProjectionContext } from "./projection.js";
import { HORIZON_DEFAULTS, type HorizonOptions } from "./types.js";

export interface ExplicitSpace {
  /** Reachable states of the reduced task; null when more than the cap. */
  states: number | null;
  /** Largest set of states reachable from one reachable state by zero-cost actions. */
  largestZeroReach: number | null;
  /**
   * Largest zero-cost distance from a reachable state to a state it reaches by zero-cost
   * actions (exact, by BFS from every state); null when that is more work than allowed.
   */
  zeroCostDiameter: number | null;
  maxStates: number;
}

export interface BoundContext {
  prepared: PreparedTask;
  projection: ProjectionContext;
  limits: Required<Omit<HorizonOptions, "relevance" | "h2" | "prepared">>;
  fullGraph(): DependencyGraph;
  zeroGraph(): DependencyGraph;
  /** The explicit state space explored up to `cap` states (default: the option's limit). */
  explicit(cap?: number): ExplicitSpace;
  /** Certified lower bound on every plan's cost beyond `unit` per positive action (cached). */
  excess(unit: number): ExcessBound;
  /** Optimal cost and fewest actions among optimal plans, by explicit search (cached). */
  optimal(): OptimalLength;
}

/**
 * Contexts are cached per Task object and options: everything in them is a function of those,
 * and the optimizer asks for horizons of the same task at several costs. The cached parts do
 * not depend on C or on the order of requests (explicit(cap) answers as a fresh exploration up
 * to `cap` would), so an auditor computing one C from scratch gets the same numbers
 * (test/horizon/soundness.test.ts, "determinism").
 */
const contexts = new WeakMap<Task, Map<string, BoundContext>>();

export function boundContext(task: Task, opts: HorizonOptions = {}): BoundContext {
  const key = JSON.stringify([opts.relevance ?? true, opts.h2 ?? null, opts.maxProjectionStates, opts.projectionBudget, opts.maxUncertainEffects, opts.maxExplicitStates, opts.maxOptimalStates]);
  let byOptions = contexts.get(task);
  if (!byOptions) contexts.set(task, (byOptions = new Map()));
  let ctx = byOptions.get(key);
  if (!ctx) byOptions.set(key, (ctx = newContext(task, opts)));
  return ctx;
}

function newContext(task: Task, opts: HorizonOptions): BoundContext {
  if (opts.prepared && opts.prepared.original !== task) throw new Error("horizon: the prepared task given is not an analysis of this task");
  const prepared = opts.prepared ?? prepareTask(task, { relevance: opts.relevance ?? true, h2: opts.h2 });
  const limits = {
    maxProjectionStates: opts.maxProjectionStates ?? HORIZON_DEFAULTS.maxProjectionStates,
    projectionBudget: opts.projectionBudget ?? HORIZON_DEFAULTS.projectionBudget,
    maxUncertainEffects: opts.maxUncertainEffects ?? HORIZON_DEFAULTS.maxUncertainEffects,
    maxExplicitStates: opts.maxExplicitStates ?? HORIZON_DEFAULTS.maxExplicitStates,
    maxOptimalStates: opts.maxOptimalStates ?? HORIZON_DEFAULTS.maxOptimalStates,
  };
  const projection = projectionContext(prepared.task, prepared.pairs, prepared.variables);
  let full: DependencyGraph | undefined;
  let zero: DependencyGraph | undefined;
  let space: ExplicitSpace | undefined;
  let optimal: OptimalLength | undefined;
  const excess = new Map<number, ExcessBound>();
  const explicit = (cap: number = limits.maxExplicitStates): ExplicitSpace => {
    if (space) {
      if (space.states !== null) return space.states <= cap ? space : { states: null, largestZeroReach: null, zeroCostDiameter: null, maxStates: cap };
      if (space.maxStates >= cap) return { ...space, maxStates: cap };
    }
    space = explicitSpace(prepared.task, cap);
    return space;
  };
  return {
    prepared,
    projection,
    limits,
    fullGraph: () => (full ??= dependencyGraph(prepared.task, prepared.variables)),
    zeroGraph: () => (zero ??= dependencyGraph(prepared.task, prepared.variables, (a) => a.cost === 0)),
    explicit,
    excess: (unit) => {
      let e = excess.get(unit);
      if (!e) {
        e = excessLowerBound(prepared.task, unit);
        if (prepared.task.actions.some((a) => a.cost > unit))
          e.patterns = patternExcessBounds(projection, (full ??= dependencyGraph(prepared.task, prepared.variables)), unit, {
            maxStates: limits.maxProjectionStates,
            maxUncertain: limits.maxUncertainEffects,
            budget: { remaining: limits.projectionBudget },
          });
        excess.set(unit, e);
      }
      return e;
    },
    optimal: () => (optimal ??= optimalLength(prepared.task, optimalStateCap(prepared.task, limits.maxOptimalStates))),
  };
}

/** The state cap of the exact explicit method: the option, and at most 2^25 stored words. */
export function optimalStateCap(task: Task, maxStates: number): number {
  const words = Math.max(1, Math.ceil(task.facts.length / 32));
  return Math.max(1, Math.min(maxStates, Math.floor(2 ** 25 / words)));
}

function explicitSpace(task: Task, maxStates: number): ExplicitSpace {
  // keep only the zero-cost edges: all the bounds need is the count and zero-cost reachability
  const g = buildStateGraph(task, maxStates, (a) => task.actions[a].cost === 0);
  if (isExceeded(g)) return { states: null, largestZeroReach: null, zeroCostDiameter: null, maxStates };
  const stats = reachStats(g.states.size, g.edgeStart, g.edgeTarget);
  return { states: g.states.size, largestZeroReach: stats.largestSet, zeroCostDiameter: stats.largestDistance, maxStates };
}
