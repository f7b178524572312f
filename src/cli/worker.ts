// The thread that runs a command: the main thread (main.ts) stays idle so SIGINT and SIGTERM are
// seen at once; it raises the shared abort flag, which this thread's long loops poll.
import { parentPort, workerData } from "node:worker_threads";
import { adoptAbortFlag, pollGaps } from "../util/limits.js";
import { FdStream } from "./fd-stream.js";
import { runCli } from "./program.js";

interface WorkerInput {
  argv: string[];
  flag: SharedArrayBuffer;
}

const input = workerData as WorkerInput;
adoptAbortFlag(input.flag);
const controller = new AbortController();
parentPort!.on("message", (m: { abort?: string }) => {
  if (m?.abort) controller.abort();
});
const code = await runCli(input.argv, { stdout: new FdStream(1), stderr: new FdStream(2) }, controller.signal);
if (pollGaps().size > 0) {
  // PLUMBLINE_POLL_GAPS=1 (bench:limits): how long the polled loops went without a check
  const rows = [...pollGaps()].sort((a, b) => b[1] - a[1]).map(([p, ms]) => `  ${ms.toFixed(0).padStart(7)} ms  ${p}`);
  process.stderr.write(`plumbline: longest time between limit checks, per phase:\n${rows.join("\n")}\n`);
}
parentPort!.postMessage({ exitCode: code });
parentPort!.close();
