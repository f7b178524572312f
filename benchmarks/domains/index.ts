// The registry of scenario domains: benchmark scripts, suites and property tests look
// scenarios up here instead of hard-coding folder names.
import type { Scenario } from "./lib/scenario.js";
import { harbour } from "./harbour/generate.js";
import { workshop } from "./workshop/generate.js";
import { warehouse } from "./warehouse/generate.js";

export type { Scenario, Params, SizeName, ParamInfo } from "./lib/scenario.js";
export { SIZE_NAMES, resolveParams, generateProblem } from "./lib/scenario.js";
export type { ExplicitModel, ExplicitPlan, Successor } from "./lib/explicit.js";
export { cheapestPlan, shortestPlan, cheapestWithin, countReachable } from "./lib/explicit.js";

export const scenarios: readonly Scenario[] = [harbour as Scenario, workshop as Scenario, warehouse as Scenario];

export function scenarioByName(name: string): Scenario {
  const sc = scenarios.find((s) => s.name === name);
  if (!sc) throw new Error(`unknown scenario "${name}" (known: ${scenarios.map((s) => s.name).join(", ")})`);
  return sc;
}
