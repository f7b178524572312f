// The search stage's public API: A*, GBFS, the heuristics, certified landmark-cut lower
// bounds and the plan comparison behind `plumbline compare`.
export type {
  SearchOptions,
  SearchResult,
  StopReason,
  AstarOptions,
  GbfsOptions,
  HeuristicName,
  AdmissibleHeuristicName,
  Landmark,
  LandmarkRecord,
} from "./types.js";
export { astar, astarWith } from "./astar.js";
export { gbfs } from "./gbfs.js";
export { limitStop } from "./limits.js";
export { compileTask, applyAction, isGoalState, type CompiledTask } from "./compiled.js";
export { SuccessorTree } from "./successor-tree.js";
export { StateTable } from "./state-table.js";
export { packFacts, unpackFacts, wordsFor } from "./bitstate.js";
export { RelaxedTask } from "./relaxed.js";
export { BlindHeuristic, RelaxationHeuristic, FFHeuristic, type StateHeuristic } from "./heuristic.js";
export { LandmarkCutHeuristic } from "./landmark-cut.js";
export { makeHeuristic, HEURISTIC_NAMES, ADMISSIBLE_HEURISTICS } from "./make-heuristic.js";
export { landmarkCutAtInit } from "./landmark-record.js";
export { checkLandmarkCertificate, relaxedReachableWithout, type LandmarkCheck } from "./landmark-check.js";
export { evaluateState } from "./evaluate.js";
export { planSteps, planNames } from "./plan-steps.js";
export { astarProver, type OptimumProver, type OptimumProof, type ProverOptions } from "./prover.js";
export { comparePlan, type CompareOptions, type CompareResult, type Verdict } from "./compare.js";
export { sideBySide, firstDivergence, type Column } from "./side-by-side.js";
export { astarRecorded, type SearchRecord, type SearchRecordEntry } from "./search-record.js";
