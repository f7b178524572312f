// The one way solve, encode and audit go from a ground task to a formula: analyse once, then
// horizons, formula specs and formulas of that analysis (so prepareTask runs once per run).
import { prepareTask, type PreparedTask } from "../analyse/index.js";
import type { PartParams } from "../encode/index.js";
import type { Task } from "../ground/task.js";
import { boundContext, computeHorizon, type HorizonOptions, type HorizonReport } from "../horizon/index.js";
import { specFor, type EncodingChoice } from "./encoding-choice.js";
import { boundSettings, buildFormula, type Formula, type FormulaSpec } from "./formula.js";

export interface PlanningPipeline {
  /** The ground task (plans and certificates are about it). */
  readonly task: Task;
  /** Its analysis: the reduced task every formula is built from, with the maps back. */
  readonly prepared: PreparedTask;
  /** The analysis' finite-domain variables with more than one value, as fact-id groups. */
  readonly mutexGroups: number[][];
  /** The completeness thresholds for "a plan of cost < upper" (Infinity: any plan). */
  horizon(upper: number, opts?: Omit<HorizonOptions, "prepared" | "relevance" | "h2">): HorizonReport;
  /** The spec of a formula of `steps` steps able to ask "cost ≤ B" for every B < upper. */
  spec(choice: EncodingChoice, steps: number, upper: number, partParams?: PartParams): FormulaSpec;
  formula(spec: FormulaSpec): Formula;
  /**
   * The horizon's exact explicit search (Dijkstra on (cost, length) over the analysed task, capped):
   * the optimal cost and a plan with the fewest actions among optimal ones (ids of the analysed
   * task), or null when it does not apply (disabled, past its cap, or no plan). Cached per limits.
   */
  exactOptimum(opts?: Omit<HorizonOptions, "prepared" | "relevance" | "h2">): { cost: number; plan: number[]; states: number } | null;
}

/** Analyses `task` (goal relevance, h², simplification, variables) and returns the pipeline on it. */
export function planningPipeline(task: Task): PlanningPipeline {
  const prepared = prepareTask(task);
  const mutexGroups = prepared.variables.variables.filter((v) => v.facts.length > 1).map((v) => [...v.facts]);
  return {
    task,
    prepared,
    mutexGroups,
    horizon: (upper, opts = {}) => computeHorizon(task, upper, { ...opts, prepared }),
    spec(choice, steps, upper, partParams) {
      const spec = specFor(prepared.task, choice, { steps, ...boundSettings(upper), mutexGroups: mutexGroups.map((g) => [...g]) });
      if (partParams && Object.keys(partParams).length > 0) spec.partParams = partParams;
      return spec;
    },
    formula: (spec) => buildFormula(prepared.task, spec),
    exactOptimum(opts = {}) {
      const ctx = boundContext(task, { ...opts, prepared });
      if (ctx.limits.maxOptimalStates <= 0) return null;
      const o = ctx.optimal();
      return o.kind === "found" ? { cost: o.cost, plan: [...o.plan], states: o.statesStored } : null;
    },
  };
}
