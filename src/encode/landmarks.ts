// Part landmarks-1 (spec encodings/landmarks-1.md): every disjunctive action landmark has one of
// its actions in some step (or, with relaxed-suffix-1, in the relaxed suffix) — one clause each.
import type { CnfBuilder } from "./cnf.js";
import type { Layout } from "./layout.js";
import type { SuffixVars } from "./relaxed-suffix.js";

/** Checks a landmark list: non-empty lists of distinct action ids 0..nA−1, ascending. Returns a copy. */
export function checkLandmarks(raw: unknown, nA: number): number[][] {
  if (!Array.isArray(raw)) throw new RangeError("encode: landmarks-1 takes { landmarks: [[a, b, …], …] }");
  return raw.map((l, i) => {
    if (!Array.isArray(l) || l.length === 0) throw new RangeError(`encode: landmark ${i} must be a non-empty list of action ids`);
    l.forEach((a, j) => {
      if (!Number.isInteger(a) || a < 0 || a >= nA) throw new RangeError(`encode: landmark ${i} names action ${JSON.stringify(a)}, outside 0..${nA - 1}`);
      if (j > 0 && l[j - 1] >= a) throw new RangeError(`encode: landmark ${i} is not ascending and duplicate-free`);
    });
    return [...(l as number[])];
  });
}

/**
 * For each landmark L in order: [A(s,a) for s = 1..T, a ∈ L ascending, then R(a) for a ∈ L
 * ascending with a suffix literal] (R: relaxed-suffix-1's "a belongs to the relaxed suffix").
 */
export function emitLandmarks(cnf: CnfBuilder, L: Layout, landmarks: readonly number[][], suffix: SuffixVars | null): void {
  const buf: number[] = [];
  for (const lm of landmarks) {
    buf.length = 0;
    for (let s = 1; s <= L.steps; s++) for (const a of lm) buf.push(L.action(s, a));
    if (suffix) for (const a of lm) if (suffix.actionLit[a] !== 0) buf.push(suffix.actionLit[a]);
    cnf.addClause(buf);
  }
}
