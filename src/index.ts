// The library API: what a script imports from "plumbline". Each stage re-exports
// its public functions here as it lands.
export { PlumblineError, type SourcePos } from "./util/errors.js";
export type { Task, Action, CondEffect, CostModel } from "./ground/task.js";
