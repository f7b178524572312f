// Output streams writing straight to a file descriptor, synchronously: the worker thread that runs
// a command writes stdout and stderr itself, so nothing queues up in memory and nothing is lost at exit.
import * as fs from "node:fs";
import { Writable } from "node:stream";
import { isatty } from "node:tty";

const pause = new Int32Array(new SharedArrayBuffer(4));

/** Writes all of `buf` to `fd`, waiting while a non-blocking pipe is full; false when the reader is gone. */
function writeAll(fd: number, buf: Buffer): boolean {
  let off = 0;
  while (off < buf.length) {
    try {
      off += fs.writeSync(fd, buf, off, buf.length - off);
    } catch (e) {
      const code = (e as NodeJS.ErrnoException).code;
      if (code === "EAGAIN") {
        Atomics.wait(pause, 0, 0, 2);
        continue;
      }
      if (code === "EPIPE") return false;
      throw e;
    }
  }
  return true;
}

/** A Writable on `fd` (1 or 2). After the reader went away (EPIPE), further output is dropped. */
export class FdStream extends Writable {
  readonly isTTY: boolean;
  private readerGone = false;

  constructor(readonly fd: number) {
    super({ decodeStrings: true });
    this.isTTY = isatty(fd);
  }

  override _write(chunk: Buffer, _enc: BufferEncoding, cb: (e?: Error | null) => void): void {
    if (!this.readerGone && !writeAll(this.fd, chunk)) this.readerGone = true;
    cb();
  }
}
