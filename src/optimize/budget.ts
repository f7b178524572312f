// The optimizer's limits in one place: wall-clock deadline, resident-memory ceiling (polled)
// and the abort signal (SIGINT), plus elapsed time and peak memory for the report.

import { isAborted } from "../util/limits.js";

export type StopReason = "time" | "memory" | "interrupted";

/** The absolute deadline of `timeLimit` (seconds from now) and `deadline`, whichever comes first. */
export function deadlineOf(opts: { timeLimit?: number; deadline?: number }): number {
  const fromLimit = opts.timeLimit !== undefined ? Date.now() + opts.timeLimit * 1000 : Infinity;
  return Math.min(fromLimit, opts.deadline ?? Infinity);
}

export class Budget {
  readonly t0 = performance.now();
  readonly deadline: number;
  readonly memoryLimitBytes: number;
  readonly signal: AbortSignal | undefined;
  peakRss = 0;

  constructor(opts: { timeLimit?: number; deadline?: number; memoryLimitMb?: number; signal?: AbortSignal }) {
    this.deadline = deadlineOf(opts);
    this.memoryLimitBytes = opts.memoryLimitMb !== undefined ? opts.memoryLimitMb * 1048576 : Infinity;
    this.signal = opts.signal;
    this.rss();
  }

  /** Seconds since the start. */
  elapsed(): number {
    return (performance.now() - this.t0) / 1000;
  }

  /** Current resident set size (bytes); updates the peak. */
  rss(): number {
    const r = process.memoryUsage.rss();
    if (r > this.peakRss) this.peakRss = r;
    return r;
  }

  /** Why to stop now, or null to go on. */
  stop(): StopReason | null {
    if (isAborted(this.signal)) return "interrupted";
    if (Date.now() >= this.deadline) return "time";
    if (this.rss() > this.memoryLimitBytes) return "memory";
    return null;
  }

  /**
   * Waits `ms` milliseconds without using the CPU, in pieces of at most 250 ms that end early at
   * the deadline or once an abort is requested (so a pause never delays a stop).
   */
  async sleep(ms: number): Promise<void> {
    const until = Math.min(Date.now() + ms, this.deadline);
    while (Date.now() < until && !isAborted(this.signal)) {
      await new Promise<void>((resolve) => setTimeout(resolve, Math.min(250, until - Date.now())));
    }
  }

  /** Seconds left (Infinity without a time limit). */
  left(): number {
    return this.deadline === Infinity ? Infinity : Math.max(0, (this.deadline - Date.now()) / 1000);
  }

  /** Bytes still available under the memory limit (Infinity without one). */
  memoryLeft(): number {
    return this.memoryLimitBytes === Infinity ? Infinity : Math.max(0, this.memoryLimitBytes - this.rss());
  }
}
