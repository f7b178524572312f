// The thread that runs A* with landmark-cut beside the SAT queries (the second core): it looks
// for an optimal plan of the analysed task and posts it back (search-helper.ts starts it).
import { parentPort, workerData } from "node:worker_threads";
import type { Task } from "../ground/task.js";
import { astarRecorded } from "../search/index.js";

interface SearchInput {
  task: Task;
  deadline?: number;
  maxStates?: number;
  costBound?: number;
}

const input = workerData as SearchInput;
/** Largest search the record is made of (states): the audit checks every one of them. */
const RECORD_STATES = 500_000;

const { result: r, record } = astarRecorded(input.task, { deadline: input.deadline, maxStates: input.maxStates, costBound: input.costBound }, RECORD_STATES);
const result = { status: r.status, plan: r.plan, cost: r.cost, lowerBound: r.lowerBound ?? null, expanded: r.expanded, stopReason: r.stopReason ?? null, seconds: r.seconds, record: null };
parentPort!.postMessage(result);
// an optimal plan found: the search that found it is recorded (every state it stored), so the
// optimum can be certified without SAT (claim landmark-search, checked by the audit)
const rec = record();
// a second message always follows a solved result: the record, or null when none could be made
if (r.status === "solved") parentPort!.postMessage({ ...result, record: rec, recordDone: true });
