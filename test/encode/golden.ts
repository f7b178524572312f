// Test helper: the golden fixtures (encodings/golden/fixture.json) and the file name of each
// (encoding, fixture) golden CNF, shared by the golden test and the regeneration script.
import { readFileSync } from "node:fs";
import { dirname, join } from "node:path";
import { fileURLToPath } from "node:url";
import { encodePlanning, type Encoding, type StepEncodingId } from "../../src/encode/index.js";
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

export const goldenFile = (id: StepEncodingId, fx: GoldenFixture) => join(GOLDEN_DIR, `${id}.${fx.name}.cnf`);

export const encodeFixture = (id: StepEncodingId, fx: GoldenFixture): Encoding =>
  encodePlanning(fx.task, { encoding: id, steps: fx.steps, mutexGroups: fx.mutexGroups });
