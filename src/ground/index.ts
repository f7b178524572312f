// The grounding stage's public surface: ground a checked model into the Task every later
// stage works on (task.ts is the contract), with optional goal-relevance pruning.
export * from "./task.js";
export { ground, groundFiles, costModelOf, costModelNote, type GroundOptions } from "./ground.js";
export { pruneIrrelevant, pruneIrrelevantMapped } from "./relevance.js";
export { GOAL_FACT, GOAL_ACTION_SCHEMA, UNREACHABLE_GOAL_FACT } from "./goal.js";
export { diffTasks, type TaskDiff, type TaskChangeKind } from "./diff.js";
