// The records a horizon computation returns: one per method with its value and every number
// that went into it (the derivation), plus the winner — what certificates and audits compare.
import type { H2Options, PreparedTask } from "../analyse/index.js";

export interface MethodResult {
  /** "cost", "optimal-length", "zero-cost", "compositional" or "reachable-states" (README "Words plumbline uses"). */
  method: string;
  /**
   * The completeness threshold this method proves (a number of actions), null when the method
   * does not apply; +Infinity when it exceeds 2^53 − 1 (the exact value is in valueText).
   */
  value: number | null;
  /** Exact decimal value ("Infinity" past 10^300), null when not applicable. */
  valueText: string | null;
  /** Every method reported here is a proven completeness threshold when applicable. */
  sound: boolean;
  /** JSON-safe record of every number the value was computed from. */
  derivation: Record<string, unknown>;
}

export interface HorizonReport {
  /** The smallest value among applicable sound methods (+Infinity if none is finite). */
  horizon: number;
  horizonText: string;
  /** Name of the method that gave the horizon. */
  winner: string;
  /** The cost C of a known plan: the horizon covers "is there a plan of cost < C?". */
  upperCost: number;
  methods: MethodResult[];
  /** What the methods worked on: the reduced task, its variables and dependency graph. */
  analysis: Record<string, unknown>;
}

export interface HorizonOptions {
  /** Goal-relevance pruning before bounding (default true; sound). */
  relevance?: boolean;
  /** States per projection before falling back to the product of domain sizes (default 20,000). */
  maxProjectionStates?: number;
  /** Projected states over all projections of one method (default 400,000). */
  projectionBudget?: number;
  /** Conditional effects with unknown outside conditions per projected step (default 8). */
  maxUncertainEffects?: number;
  /** Reachable states for the explicit method and the exact zero-cost distances (default 500,000). */
  maxExplicitStates?: number;
  /** States stored by the exact explicit search for the shortest optimal plan (default 300,000; 0 disables it). */
  maxOptimalStates?: number;
  h2?: H2Options;
  /**
   * The analysis of this very task with the same `relevance` and `h2` settings, when the caller
   * already has it (one prepareTask per run; the planning pipeline passes it).
   */
  prepared?: PreparedTask;
}

export const HORIZON_DEFAULTS = {
  maxProjectionStates: 20_000,
  projectionBudget: 400_000,
  maxUncertainEffects: 8,
  maxExplicitStates: 500_000,
  maxOptimalStates: 300_000,
} as const;
