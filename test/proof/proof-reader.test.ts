// The binary DRAT reader (rewritten for speed: shifts instead of powers, no per-literal calls)
// against an encoder written here from the format's description, over the full literal range.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { readProof } from "../../src/proof/proof-reader.js";
import { decodeProof } from "./support/naive-checker.js";

/** Binary DRAT: 'a'/'d', then each literal as 2·v + (negative ? 1 : 0) in 7-bit groups, least significant first, high bit = more; 0 ends the step. */
// source: binary DRAT format description (common practice, no source)
function encodeBinary(steps: { del: boolean; lits: number[] }[]): Uint8Array {
  const out: number[] = [];
  for (const s of steps) {
    out.push(s.del ? 0x64 : 0x61);
    for (const l of [...s.lits, 0]) {
      let x = l === 0 ? 0 : 2 * Math.abs(l) + (l < 0 ? 1 : 0);
      do {
        const b = x % 128;
        x = Math.floor(x / 128);
        out.push(x > 0 ? b | 128 : b);
      } while (x > 0);
    }
  }
  return Uint8Array.from(out);
}

const literal = fc.oneof(fc.integer({ min: 1, max: 200 }), fc.integer({ min: 1, max: 0x7fffffff })).chain((v) => fc.constantFrom(v, -v));
const step = fc.record({ del: fc.boolean(), lits: fc.array(literal, { maxLength: 6 }) });

describe("binary DRAT reader", () => {
  it("reads back what the format's encoding writes, for variables up to 2^31 − 1", () => {
    fc.assert(
      fc.property(fc.array(step, { minLength: 1, maxLength: 30 }), (steps) => {
        const bytes = encodeBinary(steps);
        const p = readProof(bytes);
        expect(p.error).toBeNull();
        expect(p.format).toBe("binary");
        expect(p.count).toBe(steps.length);
        const back = Array.from({ length: p.count }, (_, t) => ({ del: p.deletion[t] === 1, lits: Array.from(p.lits.subarray(p.start[t], p.start[t] + p.length[t])) }));
        expect(back).toEqual(steps);
        expect(decodeProof(bytes)).toEqual(steps); // the test oracle's own decoder agrees
        const maxVar = Math.max(0, ...steps.flatMap((s) => s.lits.map(Math.abs)));
        expect(p.maxVar).toBe(maxVar);
      }),
      { numRuns: 300, seed: 7 },
    );
  });

  it("grows its literal store past the first guess", () => {
    // 3000 steps of 40 one-byte literals: more literals than a quarter of the bytes
    const steps = Array.from({ length: 3000 }, (_, k) => ({ del: false, lits: Array.from({ length: 40 }, (_, i) => (i % 2 ? -1 : 1) * (1 + ((k + i) % 60))) }));
    const p = readProof(encodeBinary(steps));
    expect(p.error).toBeNull();
    expect(p.start[p.count - 1] + p.length[p.count - 1]).toBe(120_000);
    expect(Array.from(p.lits.subarray(p.start[2999], p.start[2999] + 40))).toEqual(steps[2999].lits);
  });

  it("reports truncation, bad tags, over-long and too-large literals with the byte offset", () => {
    expect(readProof(Uint8Array.from([0x61, 2, 0, 0x61, 4])).error).toMatch(/^byte 5: the proof ends inside a clause/);
    expect(readProof(Uint8Array.from([0x61, 2, 0, 0x61, 0x82])).error).toMatch(/^byte 5: the proof ends inside a literal/);
    expect(readProof(Uint8Array.from([0x61, 2, 0, 0x7a, 0])).error).toMatch(/^byte 3: expected 'a' or 'd'/);
    expect(readProof(Uint8Array.from([0x61, 0x80, 0x80, 0x80, 0x80, 0x80, 0x01, 0])).error).toMatch(/literal encoding too long/);
    // 2^33: variable 2^32, beyond what the checker's 32-bit arrays hold
    expect(readProof(Uint8Array.from([0x61, 0x80, 0x80, 0x80, 0x80, 0x20, 0])).error).toMatch(/too large/);
    expect(readProof(Uint8Array.from([0x61, 1, 0])).error).toMatch(/invalid literal code 1/);
  });
});
