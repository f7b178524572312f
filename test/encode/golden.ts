// Test helper: the golden fixtures (encodings/golden/fixture.json), every formula id that has a
// golden CNF per fixture, and its file name — shared by the golden test and the regeneration script.
import { readFileSync } from "node:fs";
import { dirname, join } from "node:path";
import { fileURLToPath } from "node:url";
import { COST_ENCODINGS, encodePlanning, STEP_ENCODINGS, type CostEncodingId, type Encoding, type PartId, type StepEncodingId } from "../../src/encode/index.js";
import type { Task } from "../../src/ground/task.js";

export const GOLDEN_DIR = join(dirname(fileURLToPath(import.meta.url)), "../../encodings/golden");

export interface GoldenFixture {
  name: string;
  steps: number;
  mutexGroups: number[][];
  task: Task;
}

export function loadFixtures(): GoldenFixture[] {
  return (JSON.parse(readFileSync(join(GOLDEN_DIR, "fixture.json"), "utf8")) as { fixtures: GoldenFixture[] }).fixtures;
}

/** A formula with a golden CNF: step encoding + cost encoding + parts (canonical order). */
export interface GoldenFormula {
  id: string;
  encoding: StepEncodingId;
  cost: CostEncodingId;
  parts: PartId[];
  /** relaxed-suffix-1 formulas: state pairs, [t, t′] with t′ = −1 meaning the fixture's last step. */
  pairs?: [number, number][];
}

/** Every subset of the parts, in canonical order. */
export const PART_SETS: readonly PartId[][] = [[], ["reach-1"], ["empty-steps-last-1"], ["reach-1", "empty-steps-last-1"]];

/** Every step encoding × cost encoding × part set. */
export const GOLDEN_FORMULAS: readonly GoldenFormula[] = STEP_ENCODINGS.flatMap((encoding) =>
  COST_ENCODINGS.flatMap((cost) => PART_SETS.map((parts) => ({ id: [encoding, cost, ...parts].join("+"), encoding, cost, parts: [...parts] }))),
);

/** eager-steps-1 (parallel step encodings only), alone and with reach-1 and empty-steps-last-1. */
export const EAGER_FORMULAS: readonly GoldenFormula[] = STEP_ENCODINGS.filter((e) => e !== "seq-1").flatMap((encoding) =>
  COST_ENCODINGS.flatMap((cost) =>
    ([["eager-steps-1"], ["reach-1", "eager-steps-1", "empty-steps-last-1"]] as PartId[][]).map((parts) => ({ id: [encoding, cost, ...parts].join("+"), encoding, cost, parts })),
  ),
);

/** relaxed-suffix-1 with the other parts, every step × cost encoding, state pairs [0, 1] and [0, T]. */
export const SUFFIX_FORMULAS: readonly GoldenFormula[] = STEP_ENCODINGS.flatMap((encoding) =>
  COST_ENCODINGS.map((cost) => {
    const parts: PartId[] = ["reach-1", "relaxed-suffix-1", "empty-steps-last-1"];
    return { id: [encoding, cost, ...parts].join("+"), encoding, cost, parts, pairs: [[0, 1], [0, -1]] as [number, number][] };
  }),
);

/** cost-prune-1 with reach-1 and empty-steps-last-1, every step × cost encoding (threshold formulas). */
export const PRUNE_FORMULAS: readonly GoldenFormula[] = STEP_ENCODINGS.flatMap((encoding) =>
  COST_ENCODINGS.map((cost) => {
    const parts: PartId[] = ["reach-1", "cost-prune-1", "empty-steps-last-1"];
    return { id: [encoding, cost, ...parts].join("+"), encoding, cost, parts };
  }),
);

/** cost-prune-1 in the relaxed-suffix formulas of SUFFIX_FORMULAS (same state pairs). */
export const PRUNE_SUFFIX_FORMULAS: readonly GoldenFormula[] = SUFFIX_FORMULAS.map((f) => {
  const parts: PartId[] = ["reach-1", "relaxed-suffix-1", "cost-prune-1", "empty-steps-last-1"];
  return { ...f, id: [f.encoding, f.cost, ...parts].join("+"), parts };
});

/**
 * encodings/golden/<id>.<fixture>.cnf; the plain step encodings with cost-adder-1 and no parts
 * keep the name they had before cost encodings and parts existed: <step>.<fixture>.cnf.
 */
export function goldenFile(f: GoldenFormula | StepEncodingId, fx: GoldenFixture): string {
  if (typeof f === "string") return join(GOLDEN_DIR, `${f}.${fx.name}.cnf`);
  const plain = f.cost === "cost-adder-1" && f.parts.length === 0;
  return join(GOLDEN_DIR, `${plain ? f.encoding : f.id}.${fx.name}.cnf`);
}

/** The fixture's formula with its steps and mutex groups, default costBits / costCap. */
export function encodeFixture(f: GoldenFormula | StepEncodingId, fx: GoldenFixture): Encoding {
  const g: Omit<GoldenFormula, "id"> = typeof f === "string" ? { encoding: f, cost: "cost-adder-1" as const, parts: [] } : f;
  const partParams = g.pairs ? { "relaxed-suffix-1": { pairs: g.pairs.map(([t, u]): [number, number] => [t, u < 0 ? fx.steps : u]) } } : undefined;
  return encodePlanning(fx.task, { encoding: g.encoding, cost: g.cost, parts: g.parts, steps: fx.steps, mutexGroups: fx.mutexGroups, partParams });
}
