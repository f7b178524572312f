// A* with landmark-cut on a second thread while the SAT queries run: an optimal plan found there
// becomes the incumbent at once, so the SAT side is left with the one refutation that proves it.
import { availableParallelism } from "node:os";
import type { Worker } from "node:worker_threads";
import type { Task } from "../ground/task.js";
import { startThread } from "../util/thread.js";

export interface HelperResult {
  status: "solved" | "unsolvable" | "limit" | "failed";
  /** Action ids of the task it was given (an optimal plan when solved). */
  plan: number[] | null;
  cost: number | null;
  /** A* lower bound (exact when solved; not certified). */
  lowerBound: number | null;
  expanded: number;
  stopReason: string | null;
  seconds: number;
}

/** Bytes per stored state the helper is allowed, for turning a memory limit into a state cap. */
const BYTES_PER_STATE = 400;

export class SearchHelper {
  private readonly worker: Worker;
  private done: HelperResult | null = null;
  private taken = false;
  readonly finished: Promise<HelperResult>;

  constructor(task: Task, opts: { deadline: number; memoryLimitBytes: number; costBound?: number }) {
    const maxStates = Number.isFinite(opts.memoryLimitBytes) ? Math.max(10_000, Math.floor(opts.memoryLimitBytes / 3 / BYTES_PER_STATE)) : 20_000_000;
    this.worker = startThread(import.meta.url, "search-worker", { task, deadline: Number.isFinite(opts.deadline) ? opts.deadline : undefined, maxStates, costBound: opts.costBound });
    this.finished = new Promise((resolve) => {
      const settle = (r: HelperResult) => {
        if (this.done === null) this.done = r;
        resolve(this.done);
      };
      this.worker.on("message", (m: HelperResult) => settle(m));
      this.worker.on("error", (e) => settle({ status: "failed", plan: null, cost: null, lowerBound: null, expanded: 0, stopReason: e.message, seconds: 0 }));
      this.worker.on("exit", () => settle({ status: "failed", plan: null, cost: null, lowerBound: null, expanded: 0, stopReason: "stopped", seconds: 0 }));
    });
    this.worker.unref();
  }

  /** The result, once, when it has arrived (null before, and after it was taken). */
  take(): HelperResult | null {
    if (this.done === null || this.taken) return null;
    this.taken = true;
    return this.done;
  }

  /** Has a result arrived that was not taken yet? */
  get pending(): boolean {
    return this.done !== null && !this.taken;
  }

  stop(): void {
    void this.worker.terminate();
  }
}

/** Is there a second core for the helper? */
export function helperCoreAvailable(): boolean {
  return availableParallelism() >= 2;
}
