// The plan stage's public surface: plan files, lifted replay (validation), and mapping
// plan steps to ground action ids of a Task.
export { parsePlan, formatPlan, planFileText, readPlanFileHeader, stepText, PLAN_FILE_MARK, type PlanStep, type PlanFileInfo, type PlanFileHeader } from "./plan-file.js";
export { replayPlan, resolveSteps, type ReplayResult, type ReplayError, type ReplayTraceStep, type ReplayOptions } from "./replay.js";
export { actionNamesToIndices, type MapOptions } from "./map.js";
export { holds, whyFails, applyEffect, successorState, initialState, type LiftedState, type EffectResult } from "./evaluate.js";
