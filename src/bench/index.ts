// The bench stage's public API: suites, configurations, the parallel runner, cluster
// export / task / merge. The CLI and scripts import from here.
export { loadSuite, parseSuite, type Suite, type InstanceSpec } from "./suite.js";
export { instancesInDirectory } from "./suite-dir.js";
export { parseJsonSource, type JsonSource, type Json } from "./json-source.js";
export { CONFIGURATIONS, DEFAULT_CONFIGURATIONS, configRegistry, type Configuration, type Limits, type RunFiles } from "./configs.js";
export { runBench, planBench, defaultGrace, DEFAULT_TIME_LIMIT, DEFAULT_MEMORY_LIMIT, type BenchOptions, type BenchResult } from "./bench.js";
export { executeRun, runId, runDirOf, interpretAudit, runAuditChild, type RunSpec, type RunOptions } from "./run-one.js";
export { runChild, type ChildSpec, type ChildOutcome } from "./child.js";
export { parseOutcome, jsonOf } from "./outcome.js";
export { readResults, writeResults, appendResult, latestById } from "./results.js";
export { exportSlurm, runTask, mergeTasks, readTasks, sbatchScript, TASKS_FILE, SCRIPT_FILE, type TaskLine } from "./slurm.js";
export { cliCommand, packageRoot } from "./paths.js";
