// A* with landmark-cut on a second thread while the SAT queries run: an optimal plan found there
// becomes the incumbent at once, so the SAT side is left with the one refutation that proves it.
import { availableParallelism } from "node:os";
import type { Worker } from "node:worker_threads";
import type { Task } from "../ground/task.js";
import type { SearchRecord } from "../search/index.js";
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
  /** After an optimal plan: the record of a search proving no plan is cheaper (a second message). */
  record: SearchRecord | null;
}

/** Bytes per stored state the helper is allowed, for turning a memory limit into a state cap. */
const BYTES_PER_STATE = 400;

export class SearchHelper {
  private readonly worker: Worker;
  private done: HelperResult | null = null;
  private taken = false;
  /** The search record, when the worker sent one after its result. */
  record: SearchRecord | null = null;
  /** The worker has sent its search record (or said it has none), or has ended. */
  recordSettled = false;
  readonly finished: Promise<HelperResult>;
  /** Resolves when the thread has ended (after its result and any search record). */
  readonly exited: Promise<void>;

  constructor(task: Task, opts: { deadline: number; memoryLimitBytes: number; costBound?: number }) {
    const maxStates = Number.isFinite(opts.memoryLimitBytes) ? Math.max(10_000, Math.floor(opts.memoryLimitBytes / 3 / BYTES_PER_STATE)) : 20_000_000;
    this.worker = startThread(import.meta.url, "search-worker", { task, deadline: Number.isFinite(opts.deadline) ? opts.deadline : undefined, maxStates, costBound: opts.costBound });
    this.finished = new Promise((resolve) => {
      const settle = (r: HelperResult) => {
        if (this.done === null) this.done = r;
        resolve(this.done);
      };
      this.worker.on("message", (m: HelperResult & { recordDone?: boolean }) => {
        if (m.recordDone) {
          this.record = m.record;
          this.recordSettled = true;
        } else settle(m);
      });
      this.worker.on("error", (e) => settle({ status: "failed", plan: null, cost: null, lowerBound: null, expanded: 0, stopReason: e.message, seconds: 0, record: null }));
      this.worker.on("exit", () => {
        this.recordSettled = true;
        settle({ status: "failed", plan: null, cost: null, lowerBound: null, expanded: 0, stopReason: "stopped", seconds: 0, record: null });
      });
    });
    this.exited = new Promise((resolve) => this.worker.once("exit", () => resolve()));
    this.worker.unref();
  }

  /** The result, once, when it has arrived (null before, and after it was taken). */
  take(): HelperResult | null {
    if (this.done === null || this.taken) return null;
    this.taken = true;
    return this.done;
  }

  /** Is the search still looking for its first result? */
  get running(): boolean {
    return this.done === null;
  }

  /** Has a result arrived that was not taken yet? */
  get pending(): boolean {
    return this.done !== null && !this.taken;
  }

  stop(): void {
    void this.worker.terminate();
  }
}

/** Cores a run uses by default: the machine's, at most 2 (the SAT queries and the A* helper). */
export function defaultThreads(): number {
  return Math.min(2, availableParallelism());
}
