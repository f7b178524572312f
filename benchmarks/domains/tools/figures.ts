// Exact figures of one instance from the scenario's explicit model (states, cheapest plan,
// shortest plan, cheapest plan of shortest length): what instances.json records.
import { cheapestPlan, cheapestWithin, countReachable, shortestPlan } from "../lib/explicit.js";
import type { Params, Scenario } from "../lib/scenario.js";

export interface Figures {
  states: number;
  optimalCost: number | null;
  /** Fewest actions among cheapest plans. */
  optimalLength: number | null;
  /** Fewest actions among all plans. */
  shortestLength: number | null;
  /** Cheapest cost among plans of at most shortestLength actions. */
  cheapestAtShortestLength: number | null;
  /** Every cheapest plan is longer than the shortest plan. */
  cheapestLongerThanShortest: boolean;
  plan: string[] | null;
  seconds: number;
}

export function analyseInstance(sc: Scenario, p: Params, cap = 2_000_000, layeredLimit = Infinity): Figures {
  const t0 = performance.now();
  const model = sc.model(sc.makeInstance(p));
  const states = countReachable(model, cap);
  const best = cheapestPlan(model, cap);
  const short = shortestPlan(model, cap);
  const sl = short ? short.plan.length : null;
  const atShort = sl === null || states > layeredLimit ? null : cheapestWithin(model, sl, cap);
  return {
    states,
    optimalCost: best ? best.cost : null,
    optimalLength: best ? best.plan.length : null,
    shortestLength: sl,
    cheapestAtShortestLength: atShort,
    cheapestLongerThanShortest: best !== null && sl !== null && best.plan.length > sl,
    plan: best ? best.plan : null,
    seconds: (performance.now() - t0) / 1000,
  };
}
