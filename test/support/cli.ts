// Runs the plumbline CLI in-process for tests and captures stdout, stderr and the
// exit code (the same code path as the binary, minus process.exit).
import { Writable } from "node:stream";
import { runCli } from "../../src/cli/program.js";

export interface CliRun {
  code: number;
  stdout: string;
  stderr: string;
  /** stdout parsed as JSON (throws if it is not one JSON value). */
  json<T = any>(): T;
}

class Sink extends Writable {
  text = "";
  override _write(chunk: Buffer | string, _enc: BufferEncoding, cb: (e?: Error | null) => void): void {
    this.text += chunk.toString();
    cb();
  }
}

export async function cli(args: string[], signal?: AbortSignal): Promise<CliRun> {
  const out = new Sink();
  const err = new Sink();
  const code = await runCli(args, { stdout: out, stderr: err }, signal);
  // pino may write asynchronously to a stream destination; give it a tick
  await new Promise((r) => setImmediate(r));
  return {
    code,
    stdout: out.text,
    stderr: err.text,
    json: () => JSON.parse(out.text),
  };
}
