// The analyse stage's public API: finite-domain variables from mutex groups, the variable
// dependency graph and its SCCs, relevance pruning and explicit state spaces of a Task.
export { pairReachability, type PairReachability, type H2Options } from "./h2.js";
export { findVariables, valueCount, VARIABLES_METHOD, type Variable, type Variables } from "./variables.js";
export { dependencyGraph, withComponents, readVariables, writtenVariables, type DependencyGraph } from "./dependency.js";
export { relevanceFilter } from "./relevance.js";
export { simplifyTask, type SimplifyResult } from "./simplify.js";
export { restrictTask, type RestrictedTask } from "./restrict.js";
export { prepareTask, type PreparedTask, type PrepareOptions, type PrepareStep } from "./prepare.js";
export { PackedStateSet, packBits, unpackBits, popcount32 } from "./state-store.js";
export { applyAction, applicableAt, holds, isGoalAt, wordsFor } from "./successor.js";
export { buildStateGraph, isExceeded, ActionIndex, type StateGraph, type StateGraphLimitExceeded } from "./state-graph.js";
export { IdHeap } from "./heap.js";
