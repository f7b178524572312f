// The thread that runs A* with landmark-cut beside the SAT queries (the second core): it looks
// for an optimal plan of the analysed task and posts it back (search-helper.ts starts it).
import { parentPort, workerData } from "node:worker_threads";
import type { Task } from "../ground/task.js";
import { astar } from "../search/index.js";

interface SearchInput {
  task: Task;
  deadline?: number;
  maxStates?: number;
  costBound?: number;
}

const input = workerData as SearchInput;
const r = astar(input.task, { heuristic: "landmark-cut", deadline: input.deadline, maxStates: input.maxStates, costBound: input.costBound });
parentPort!.postMessage({ status: r.status, plan: r.plan, cost: r.cost, lowerBound: r.lowerBound ?? null, expanded: r.expanded, stopReason: r.stopReason ?? null, seconds: r.seconds });
