// The analysis pipeline every bound starts from: goal-relevance pruning, h² pair analysis,
// removal of what can never happen, and finite-domain variables of what is left.
import type { Task } from "../ground/task.js";
import { pairReachability, type H2Options, type PairReachability } from "./h2.js";
import { relevanceFilter } from "./relevance.js";
import { composeMaps } from "./restrict.js";
import { simplifyTask } from "./simplify.js";
import { findVariables, type Variables } from "./variables.js";

export interface PrepareStep {
  step: "input" | "relevance" | "simplify";
  facts: number;
  actions: number;
  note?: string;
}

export interface PreparedTask {
  original: Task;
  /** The reduced task; its completeness thresholds are thresholds of the original. */
  task: Task;
  /** Reduced fact id → original fact id. */
  factMap: Int32Array;
  /** Reduced action id → original action id. */
  actionMap: Int32Array;
  /** Pair reachability of the reduced task. */
  pairs: PairReachability;
  variables: Variables;
  steps: PrepareStep[];
}

export interface PrepareOptions {
  /** Goal-relevance pruning (default true). */
  relevance?: boolean;
  h2?: H2Options;
}

/**
 * Relevance → h² → simplify → relevance again (removed actions can make more facts
 * irrelevant) → h² of the final task → variables. Deterministic.
 */
export function prepareTask(task: Task, opts: PrepareOptions = {}): PreparedTask {
  const steps: PrepareStep[] = [{ step: "input", facts: task.facts.length, actions: task.actions.length }];
  let cur = task;
  let factMap: Int32Array = Int32Array.from(task.facts.keys());
  let actionMap: Int32Array = Int32Array.from(task.actions.keys());
  const relevance = opts.relevance ?? true;
  const prune = () => {
    if (!relevance) return;
    const r = relevanceFilter(cur);
    cur = r.task;
    factMap = composeMaps(factMap, r.factMap);
    actionMap = composeMaps(actionMap, r.actionMap);
    steps.push({ step: "relevance", facts: cur.facts.length, actions: cur.actions.length });
  };
  prune();
  const first = pairReachability(cur, opts.h2);
  const s = simplifyTask(cur, first);
  cur = s.task;
  factMap = composeMaps(factMap, s.factMap);
  actionMap = composeMaps(actionMap, s.actionMap);
  steps.push({
    step: "simplify",
    facts: cur.facts.length,
    actions: cur.actions.length,
    note: `${first.method === "h2" ? "h2" : "no pair analysis"}: ${s.neverTrue} facts never true, ${s.alwaysTrue} always true, ${s.removedActions} actions never applicable or without effect`,
  });
  prune();
  const pairs = pairReachability(cur, opts.h2);
  const variables = findVariables(cur, pairs);
  return { original: task, task: cur, factMap, actionMap, pairs, variables, steps };
}
