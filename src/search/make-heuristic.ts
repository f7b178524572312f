// Builds a heuristic by name over a compiled task: the one place that maps the names
// used by the CLI and the library ("landmark-cut", "max", "add", "ff", "blind") to classes.
import type { CompiledTask } from "./compiled.js";
import { isGoalState } from "./compiled.js";
import { BlindHeuristic, FFHeuristic, RelaxationHeuristic, type StateHeuristic } from "./heuristic.js";
import { LandmarkCutHeuristic } from "./landmark-cut.js";
import { RelaxedTask } from "./relaxed.js";
import type { HeuristicName } from "./types.js";

export const HEURISTIC_NAMES: readonly HeuristicName[] = ["landmark-cut", "max", "blind", "add", "ff"];
export const ADMISSIBLE_HEURISTICS: readonly HeuristicName[] = ["landmark-cut", "max", "blind"];

export function makeHeuristic(name: HeuristicName, ct: CompiledTask, rt?: RelaxedTask): StateHeuristic {
  if (name === "blind") return new BlindHeuristic((s, off) => isGoalState(ct, s, off), ct.cost);
  const relaxed = rt ?? new RelaxedTask(ct.task);
  switch (name) {
    case "max":
    case "add":
      return new RelaxationHeuristic(name, relaxed, ct.words);
    case "ff":
      return new FFHeuristic(relaxed, ct.words);
    case "landmark-cut":
      return new LandmarkCutHeuristic(relaxed, ct.words);
    default:
      throw new Error(`unknown heuristic ${String(name)}`);
  }
}
