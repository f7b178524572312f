#!/usr/bin/env node
// Entry point of the `plumbline` binary: wires SIGINT to an abort signal and exits
// with the code runCli returns; all logic lives in the library and command files.
import { runCli } from "./program.js";

const controller = new AbortController();
let interrupted = false;
process.on("SIGINT", () => {
  if (interrupted) process.exit(130);
  interrupted = true;
  process.stderr.write("\nplumbline: interrupted; finishing up (press Ctrl-C again to quit at once)\n");
  controller.abort();
});

const code = await runCli(process.argv.slice(2), { stdout: process.stdout, stderr: process.stderr }, controller.signal);
process.exitCode = code;
