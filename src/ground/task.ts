// The ground task every later stage works on: STRIPS with negative conditions,
// conditional effects and non-negative integer action costs. This file is the contract.

/**
 * A ground conditional effect: when every fact of `cond` is true and every fact of
 * `condNeg` is false in the state BEFORE the action, `add` and `del` take effect too.
 */
export interface CondEffect {
  cond: number[];
  condNeg: number[];
  add: number[];
  del: number[];
}

/**
 * A ground action. All fact-id arrays are sorted ascending and duplicate-free.
 *
 * Semantics (DESIGN "Conventions"): in state s the action is applicable when
 * pre ⊆ s and preNeg ∩ s = ∅. Let A = add ∪ (add of every conditional effect whose
 * condition holds in s) and D likewise for deletes. The successor is (s \ D) ∪ A:
 * deletes first, then adds (a fact both added and deleted ends up true).
 */
export interface Action {
  /**
   * Plan-file form, lower case: "(drive truck1 quay depot)". Unique within a Task, except
   * that the disjuncts of one ground action's disjunctive precondition become separate
   * actions sharing the name (their effects agree whenever they apply).
   */
  name: string;
  /** Lifted schema name ("drive") and its arguments, in order. */
  schema: string;
  args: string[];
  pre: number[];
  preNeg: number[];
  add: number[];
  del: number[];
  cond: CondEffect[];
  /** Non-negative integer. */
  cost: number;
  /**
   * True for an action the grounder invented (e.g. to reach a disjunctive goal); it is
   * not part of the user's model and is dropped when a plan is written out.
   */
  synthetic?: boolean;
}

/** How action costs were obtained (DESIGN "Cost semantics"). */
export type CostModel =
  /** `(:metric minimize (total-cost))` with `increase` effects; actions without one cost 0. */
  | "action-costs"
  /** No action costs in the model: every action costs 1 (plan length). */
  | "unit";

export interface Task {
  domainName: string;
  problemName: string;
  /** Fact names in plan-file style, lower case: "(at truck1 quay)". Index = fact id. */
  facts: string[];
  /** Facts true initially (sorted). Every other fact is false initially. */
  init: number[];
  /** Facts that must be true at the end (sorted). */
  goal: number[];
  /** Facts that must be false at the end (sorted). */
  goalNeg: number[];
  actions: Action[];
  costModel: CostModel;
}

/** Statistics the `ground` command prints. */
export interface GroundStats {
  facts: number;
  actions: number;
  zeroCostActions: number;
  conditionalEffects: number;
  seconds: number;
}

export function groundStats(task: Task, seconds: number): GroundStats {
  let zero = 0;
  let cond = 0;
  for (const a of task.actions) {
    if (a.cost === 0) zero++;
    cond += a.cond.length;
  }
  return { facts: task.facts.length, actions: task.actions.length, zeroCostActions: zero, conditionalEffects: cond, seconds };
}

/** Sum of action costs of a sequence of action indices. */
export function planCost(task: Task, plan: readonly number[]): number {
  let c = 0;
  for (const i of plan) c += task.actions[i].cost;
  return c;
}
