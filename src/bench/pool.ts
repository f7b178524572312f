// Runs a list of runs N at a time, appending each record to results.jsonl the moment it
// finishes; an interrupted run is not recorded, so a re-run picks it up again.
import type { RunRecord } from "../report/record.js";
import type { ConfigRegistry } from "./configs.js";
import { appendResult } from "./results.js";
import { executeRun, type RunOptions, type RunSpec } from "./run-one.js";
import { Progress, type ProgressSink } from "./progress.js";

export interface PoolOptions extends RunOptions {
  jobs: number;
  resultsFile: string;
  progress: ProgressSink | null;
  /** Runs already finished before (shown in the progress count). */
  skipped: number;
}

export async function runPool(runs: readonly RunSpec[], registry: ConfigRegistry, opts: PoolOptions): Promise<RunRecord[]> {
  const progress = new Progress(opts.progress, runs.length, opts.skipped);
  const out: RunRecord[] = [];
  let next = 0;
  const worker = async () => {
    while (next < runs.length && !opts.signal?.aborted) {
      const spec = runs[next++];
      const config = registry.get(spec.configuration);
      if (!config) throw new Error(`configuration ${spec.configuration} vanished from the registry`);
      progress.started();
      const rec = await executeRun(spec, config, opts);
      if (opts.signal?.aborted) break; // killed by the interrupt: leave it for the next attempt
      appendResult(opts.resultsFile, rec);
      out.push(rec);
      progress.finished(rec);
    }
  };
  try {
    await Promise.all(Array.from({ length: Math.max(1, Math.min(opts.jobs, runs.length)) }, worker));
  } finally {
    progress.stop();
  }
  return out;
}
