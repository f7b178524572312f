// Certified lower bounds: landmark-cut at the initial state, recorded as its landmarks
// (sets of action ids) and their cost partition, so a checker can re-verify the bound.
import type { Task } from "../ground/task.js";
import { compileTask } from "./compiled.js";
import { LandmarkCutHeuristic } from "./landmark-cut.js";
import { RelaxedTask } from "./relaxed.js";
import type { Landmark, LandmarkRecord } from "./types.js";

/**
 * Landmark-cut at the initial state with its landmarks. null when the goal is
 * relaxed-unreachable (then the task is unsolvable and no finite bound is recorded).
 */
export function landmarkCutAtInit(task: Task): LandmarkRecord | null {
  const ct = compileTask(task);
  const lm = new LandmarkCutHeuristic(new RelaxedTask(task), ct.words);
  const landmarks: Landmark[] = [];
  lm.record = landmarks;
  if (lm.evaluate(ct.init, 0) === Infinity) return null;
  // the landmark sum itself (the heuristic's value may be raised to h-max; see LandmarkCutHeuristic)
  return { bound: lm.lastLandmarkSum, landmarks };
}
