// What every horizon method works from, computed once per task: the reduced task, its
// variables, both dependency graphs, projections and (when small) the explicit state space.
import type { Task } from "../ground/task.js";
import { buildStateGraph, dependencyGraph, isExceeded, prepareTask, type DependencyGraph, type PreparedTask } from "../analyse/index.js";
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
  limits: Required<Omit<HorizonOptions, "relevance" | "h2">>;
  fullGraph(): DependencyGraph;
  zeroGraph(): DependencyGraph;
  /** The explicit state space explored up to `cap` states (default: the option's limit). */
  explicit(cap?: number): ExplicitSpace;
}

export function boundContext(task: Task, opts: HorizonOptions = {}): BoundContext {
  const prepared = prepareTask(task, { relevance: opts.relevance ?? true, h2: opts.h2 });
  const limits = {
    maxProjectionStates: opts.maxProjectionStates ?? HORIZON_DEFAULTS.maxProjectionStates,
    projectionBudget: opts.projectionBudget ?? HORIZON_DEFAULTS.projectionBudget,
    maxUncertainEffects: opts.maxUncertainEffects ?? HORIZON_DEFAULTS.maxUncertainEffects,
    maxExplicitStates: opts.maxExplicitStates ?? HORIZON_DEFAULTS.maxExplicitStates,
  };
  const projection = projectionContext(prepared.task, prepared.pairs, prepared.variables);
  let full: DependencyGraph | undefined;
  let zero: DependencyGraph | undefined;
  let space: ExplicitSpace | undefined;
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
  };
}

function explicitSpace(task: Task, maxStates: number): ExplicitSpace {
  // keep only the zero-cost edges: all the bounds need is the count and zero-cost reachability
  const g = buildStateGraph(task, maxStates, (a) => task.actions[a].cost === 0);
  if (isExceeded(g)) return { states: null, largestZeroReach: null, zeroCostDiameter: null, maxStates };
  const stats = reachStats(g.states.size, g.edgeStart, g.edgeTarget);
  return { states: g.states.size, largestZeroReach: stats.largestSet, zeroCostDiameter: stats.largestDistance, maxStates };
}
