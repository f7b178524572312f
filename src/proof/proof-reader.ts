// Reads a DRAT proof, binary or text (told apart by the zero byte that ends every binary
// clause and never occurs in text), into flat arrays of steps for the checker.
import { gunzipSync } from "node:zlib";

export interface ProofSteps {
  format: "binary" | "text";
  /** Literals of all steps (DIMACS signs), back to back. */
  lits: Int32Array;
  start: Int32Array;
  length: Int32Array;
  /** 1 = deletion, 0 = addition. */
  deletion: Uint8Array;
  /** Text: 1-based line of the step; binary: byte offset of the step. */
  where: Int32Array;
  count: number;
  maxVar: number;
  /** Set when the proof could not be read to the end (for example it was truncated mid-clause). */
  error: string | null;
}

/** Undoes gzip compression if the bytes carry the gzip magic number (throws on a broken stream). */
export function maybeGunzip(bytes: Uint8Array): Uint8Array {
  if (bytes.length >= 2 && bytes[0] === 0x1f && bytes[1] === 0x8b) return gunzipSync(bytes);
  return bytes;
}

/** Why a proof that looks gzip-compressed cannot be read. */
export const BROKEN_GZIP = "the proof is gzip-compressed but the compressed data is truncated or corrupted";

/** `maybeGunzip`, or null when the gzip stream is truncated or corrupted (a rejected proof, not a crash). */
export function gunzipOrNull(bytes: Uint8Array): Uint8Array | null {
  try {
    return maybeGunzip(bytes);
  } catch {
    return null;
  }
}

class StepBuilder {
  lits = new Int32Array(1024);
  nl = 0;
  start = new Int32Array(256);
  length = new Int32Array(256);
  deletion = new Uint8Array(256);
  where = new Int32Array(256);
  count = 0;
  maxVar = 0;
  open = -1;

  begin(del: boolean, where: number): void {
    if (this.count === this.start.length) {
      const n = this.count * 2;
      this.start = resize32(this.start, n);
      this.length = resize32(this.length, n);
      this.where = resize32(this.where, n);
      const d = new Uint8Array(n);
      d.set(this.deletion);
      this.deletion = d;
    }
    this.start[this.count] = this.nl;
    this.deletion[this.count] = del ? 1 : 0;
    this.where[this.count] = where;
    this.open = this.count;
  }

  lit(x: number): void {
    if (this.nl === this.lits.length) this.lits = resize32(this.lits, this.nl * 2);
    this.lits[this.nl++] = x;
    const v = x < 0 ? -x : x;
    if (v > this.maxVar) this.maxVar = v;
  }

  end(): void {
    this.length[this.count] = this.nl - this.start[this.count];
    this.count++;
    this.open = -1;
  }

  finish(format: "binary" | "text", error: string | null): ProofSteps {
    return { format, lits: this.lits, start: this.start, length: this.length, deletion: this.deletion, where: this.where, count: this.count, maxVar: this.maxVar, error };
  }
}

function resize32(a: Int32Array, n: number): Int32Array<ArrayBuffer> {
  const b = new Int32Array(n);
  b.set(a.subarray(0, Math.min(n, a.length)));
  return b;
}

export function isBinaryProof(bytes: Uint8Array): boolean {
  return bytes.indexOf(0) >= 0;
}

export function readProof(bytes: Uint8Array): ProofSteps {
  return isBinaryProof(bytes) ? readBinary(bytes) : readText(bytes);
}

function readBinary(b: Uint8Array): ProofSteps {
  const sb = new StepBuilder();
  // a literal takes at least one byte, and every step two more: start with a quarter, grow by doubling
  sb.lits = new Int32Array(Math.max(1024, b.length >> 2));
  let lits = sb.lits;
  let nl = 0;
  let maxVar = 0;
  let i = 0;
  const n = b.length;
  const fail = (msg: string): ProofSteps => {
    sb.lits = lits;
    sb.nl = nl;
    sb.maxVar = maxVar;
    return sb.finish("binary", msg);
  };
  while (i < n) {
    const tag = b[i];
    if (tag !== 0x61 && tag !== 0x64) return fail(`byte ${i}: expected 'a' or 'd' to start a proof step, found byte ${tag}`);
    sb.nl = nl;
    sb.begin(tag === 0x64, i);
    i++;
    for (;;) {
      if (i >= n) return fail(`byte ${n}: the proof ends inside a clause (truncated?)`);
      // 7-bit groups, least significant first; up to 4 groups fit a small integer exactly
      let byte = b[i++];
      let x = byte & 127;
      let shift = 7;
      while (byte & 128) {
        if (i >= n) return fail(`byte ${n}: the proof ends inside a literal (truncated?)`);
        if (shift >= 35) return fail(`byte ${i}: literal encoding too long`);
        byte = b[i++];
        x += shift < 28 ? (byte & 127) << shift : (byte & 127) * 2 ** shift;
        shift += 7;
      }
      if (x === 0) break;
      if (x < 2) return fail(`byte ${i - 1}: invalid literal code ${x}`);
      const v = Math.floor(x / 2);
      if (v > 0x7fffffff) return fail(`byte ${i - 1}: literal code ${x} is too large`);
      if (v > maxVar) maxVar = v;
      if (nl === lits.length) sb.lits = lits = resize32(lits, 2 * nl);
      lits[nl++] = x & 1 ? -v : v;
    }
    sb.nl = nl;
    sb.end();
  }
  sb.lits = lits;
  sb.nl = nl;
  sb.maxVar = maxVar;
  return sb.finish("binary", null);
}

function readText(b: Uint8Array): ProofSteps {
  const sb = new StepBuilder();
  let i = 0;
  const n = b.length;
  let line = 1;
  while (i < n) {
    const c = b[i];
    if (c === 10) {
      line++;
      i++;
      continue;
    }
    if (c === 32 || c === 9 || c === 13) {
      i++;
      continue;
    }
    if (c === 0x63 && sb.open < 0) {
      while (i < n && b[i] !== 10) i++;
      continue;
    }
    if (c === 0x64 && sb.open < 0) {
      sb.begin(true, line);
      i++;
      continue;
    }
    if (c === 0x2d || (c >= 48 && c <= 57)) {
      const neg = c === 0x2d;
      if (neg) i++;
      let x = 0;
      const s = i;
      while (i < n && b[i] >= 48 && b[i] <= 57) {
        x = x * 10 + (b[i] - 48);
        i++;
      }
      if (i === s || x > 0x3fffffff) return sb.finish("text", `line ${line}: malformed literal`);
      if (sb.open < 0) sb.begin(false, line);
      if (x === 0) sb.end();
      else sb.lit(neg ? -x : x);
      continue;
    }
    return sb.finish("text", `line ${line}: unexpected character '${String.fromCharCode(c)}'`);
  }
  if (sb.open >= 0) return sb.finish("text", `line ${line}: the proof ends inside a clause (truncated?)`);
  return sb.finish("text", null);
}
