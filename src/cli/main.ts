#!/usr/bin/env node
// Entry point of the `plumbline` binary. The command runs in a worker thread; this thread only
// waits, so SIGINT and SIGTERM are handled at once even while the command computes without pause:
// the first raises the shared abort flag (the command stops and writes its best result, exit 3),
// a second one ends the process at once.
import * as fs from "node:fs";
import type { Worker } from "node:worker_threads";
import { abortFlagBuffer, requestAbort } from "../util/limits.js";
import { startThread } from "../util/thread.js";

const say = (s: string) => {
  try {
    fs.writeSync(2, s);
  } catch {
    /* stderr gone */
  }
};

let worker: Worker | null = null;
let exitCode: number | null = null;
let failure: Error | null = null;
let signals = 0;

function onSignal(name: NodeJS.Signals): void {
  signals++;
  if (signals > 1) {
    say(`plumbline: ${name} again: stopping at once (temporary files may remain)\n`);
    process.exit(name === "SIGINT" ? 130 : 143);
  }
  say(`\nplumbline: ${name === "SIGINT" ? "interrupted" : "terminated"}; finishing up and writing the best result so far (send it again to quit at once)\n`);
  requestAbort(); // a worker not started yet sees the flag as soon as it starts
  worker?.postMessage({ abort: name });
}
process.on("SIGINT", onSignal);
process.on("SIGTERM", onSignal);

// the worker: compiled JavaScript as is; TypeScript sources (run through tsx) with tsx's loader
worker = startThread(import.meta.url, "worker", { argv: process.argv.slice(2), flag: abortFlagBuffer() });

worker.on("message", (m: { exitCode?: number }) => {
  if (typeof m?.exitCode === "number") exitCode = m.exitCode;
});
worker.on("error", (e) => {
  failure = e;
});
worker.on("exit", () => {
  if (exitCode !== null) {
    process.exitCode = exitCode;
    return;
  }
  const err = failure as (Error & { code?: string }) | null;
  if (err?.code === "ERR_WORKER_OUT_OF_MEMORY") {
    say("plumbline: memory limit reached: the JavaScript heap is full (raise it with NODE_OPTIONS=--max-old-space-size=MB, or set a --memory-limit)\n");
    process.exitCode = 3;
    return;
  }
  say(`plumbline: internal error: ${err?.message ?? "the command ended without a result"}\n`);
  if (process.env.PLUMBLINE_DEBUG && err?.stack) say(`${err.stack}\n`);
  process.exitCode = 4;
});
