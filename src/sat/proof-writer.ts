// DRAT proof sinks: binary or text encoding into a byte buffer, kept in memory or streamed
// to a file in large writes (temp name, renamed on close, so no partial proof is ever left).
import * as fs from "node:fs";
import { PlumblineError } from "../util/errors.js";
import { tempNameFor } from "../util/files.js";
import type { ProofSink } from "./types.js";

export type ProofFormat = "binary" | "text";

const ADD = 0x61; // 'a'
const DEL = 0x64; // 'd'

/** Encodes proof steps into a growable byte buffer; subclasses decide where full buffers go. */
abstract class ByteProofSink implements ProofSink {
  protected buf: Uint8Array;
  protected pos = 0;
  lemmas = 0;
  deletions = 0;
  readonly format: ProofFormat;

  constructor(format: ProofFormat, size: number) {
    this.format = format;
    this.buf = new Uint8Array(size);
  }

  add(lits: ArrayLike<number>, from: number, to: number): void {
    this.lemmas++;
    this.step(false, lits, from, to);
  }

  delete(lits: ArrayLike<number>, from: number, to: number): void {
    this.deletions++;
    this.step(true, lits, from, to);
  }

  /** Makes room for `n` more bytes (by flushing or growing). */
  protected abstract room(n: number): void;
  abstract flush(): void;

  private step(del: boolean, lits: ArrayLike<number>, from: number, to: number): void {
    // worst case: 5 bytes per binary literal, 12 per text literal, plus framing
    this.room((to - from) * 12 + 8);
    const b = this.buf;
    let p = this.pos;
    if (this.format === "binary") {
      b[p++] = del ? DEL : ADD;
      for (let i = from; i < to; i++) {
        let x = lits[i] >>> 0;
        while (x > 127) {
          b[p++] = (x & 127) | 128;
          x >>>= 7;
        }
        b[p++] = x;
      }
      b[p++] = 0;
    } else {
      if (del) {
        b[p++] = DEL;
        b[p++] = 0x20;
      }
      for (let i = from; i < to; i++) {
        const l = lits[i];
        if (l & 1) b[p++] = 0x2d; // '-'
        p = writeUint(b, p, l >>> 1);
        b[p++] = 0x20;
      }
      b[p++] = 0x30; // '0'
      b[p++] = 0x0a;
    }
    this.pos = p;
  }
}

function writeUint(b: Uint8Array, p: number, x: number): number {
  if (x < 10) {
    b[p] = 0x30 + x;
    return p + 1;
  }
  let digits = 0;
  for (let y = x; y > 0; y = Math.floor(y / 10)) digits++;
  for (let i = digits - 1; i >= 0; i--) {
    b[p + i] = 0x30 + (x % 10);
    x = Math.floor(x / 10);
  }
  return p + digits;
}

/** Keeps the whole proof in memory (tests, small runs, certificates written later). */
export class MemoryProofWriter extends ByteProofSink {
  constructor(format: ProofFormat = "binary") {
    super(format, 1 << 16);
  }

  protected room(n: number): void {
    if (this.pos + n <= this.buf.length) return;
    let len = this.buf.length * 2;
    while (len < this.pos + n) len *= 2;
    const b = new Uint8Array(len);
    b.set(this.buf.subarray(0, this.pos));
    this.buf = b;
  }

  flush(): void {}

  /** The proof so far (a view; copy it before writing more). */
  bytes(): Uint8Array {
    return this.buf.subarray(0, this.pos);
  }

  get size(): number {
    return this.pos;
  }
}

/**
 * Streams the proof to `path` through a 1 MiB buffer. Bytes go to a temporary sibling file;
 * `close()` renames it to `path`, `abort()` removes it.
 */
export class FileProofWriter extends ByteProofSink {
  readonly path: string;
  private readonly tmp: string;
  private fd: number | null;
  written = 0;

  constructor(path: string, format: ProofFormat = "binary", bufferBytes = 1 << 20) {
    super(format, Math.max(1 << 12, bufferBytes));
    this.path = path;
    this.tmp = tempNameFor(path);
    try {
      this.fd = fs.openSync(this.tmp, "w");
    } catch (e) {
      throw new PlumblineError("io", `cannot write proof ${path}: ${(e as Error).message}`);
    }
  }

  protected room(n: number): void {
    if (this.pos + n <= this.buf.length) return;
    this.flush();
    if (n > this.buf.length) this.buf = new Uint8Array(n * 2);
  }

  flush(): void {
    if (this.fd === null || this.pos === 0) return;
    let off = 0;
    while (off < this.pos) off += fs.writeSync(this.fd, this.buf, off, this.pos - off);
    this.written += this.pos;
    this.pos = 0;
  }

  /** Total bytes of proof so far (written plus buffered). */
  get size(): number {
    return this.written + this.pos;
  }

  /** Flushes, closes and moves the proof to its final name. */
  close(): void {
    if (this.fd === null) return;
    this.flush();
    fs.closeSync(this.fd);
    this.fd = null;
    fs.renameSync(this.tmp, this.path);
  }

  /** Discards the partial proof. */
  abort(): void {
    if (this.fd !== null) {
      fs.closeSync(this.fd);
      this.fd = null;
    }
    fs.rmSync(this.tmp, { force: true });
  }
}
