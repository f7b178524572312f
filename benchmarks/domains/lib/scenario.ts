// What every scenario generator provides (sizes, parameters, instance data, PDDL text, an
// independent explicit model), so one CLI runner, one registry and one test serve them all.
import type { ExplicitModel } from "./explicit.js";

export type SizeName = "tiny" | "small" | "medium" | "large";
export const SIZE_NAMES: readonly SizeName[] = ["tiny", "small", "medium", "large"];

/** Generator parameters: integer size knobs plus the seed. */
export type Params = Record<string, number> & { seed: number };

export interface ParamInfo {
  /** Flag name without dashes, also the key in Params. */
  name: string;
  help: string;
  min: number;
  max: number;
}

export interface Scenario<I = unknown> {
  name: string;
  /** One line for --help and the registry. */
  summary: string;
  /** Absolute path of the scenario folder (holds domain.pddl). */
  dir: string;
  params: readonly ParamInfo[];
  /** Parameter presets per size (without the seed). */
  sizes: Record<SizeName, Record<string, number>>;
  /** Instance data from parameters; deterministic in the parameters (seed included). */
  makeInstance(p: Params): I;
  /** The problem file text of an instance. */
  toPddl(inst: I): string;
  /**
   * A direct model of the same mechanics written without PDDL, for cross-checks: its states
   * correspond one to one to the ground task's states and its action names are plan-file form.
   */
  model(inst: I): ExplicitModel<unknown>;
}

/** Fills in a size preset, then explicit overrides, and checks every bound. */
export function resolveParams(sc: Scenario, size: SizeName, seed: number, overrides: Record<string, number> = {}): Params {
  const p: Record<string, number> = { ...sc.sizes[size], ...overrides, seed };
  for (const info of sc.params) {
    const v = p[info.name];
    if (v === undefined) throw new Error(`${sc.name}: parameter ${info.name} missing`);
    if (!Number.isInteger(v) || v < info.min || v > info.max)
      throw new Error(`${sc.name}: --${info.name} must be an integer in [${info.min}, ${info.max}], got ${v}`);
  }
  if (!Number.isInteger(seed) || seed < 0) throw new Error(`${sc.name}: --seed must be a non-negative integer, got ${seed}`);
  return p as Params;
}

/** Problem text for a size preset (plus overrides) and a seed. */
export function generateProblem(sc: Scenario, size: SizeName, seed: number, overrides: Record<string, number> = {}): string {
  return sc.toPddl(sc.makeInstance(resolveParams(sc, size, seed, overrides)));
}
