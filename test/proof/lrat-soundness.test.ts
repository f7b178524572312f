// Soundness of the LRAT checker against the naive oracle: random corruptions of a valid LRAT
// proof (hints replaced, dropped or swapped, literals flipped or dropped) may still be valid,
// but whenever checkLrat accepts one, every lemma it added must be implied (RUP or RAT by
// plain unit propagation over the clauses present at that line) and the proof must end in ⊥.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { checkDrat, checkLrat } from "../../src/proof/index.js";
import { pigeonhole } from "../sat/support/generators.js";
import { copyLines, parseLrat, printLrat, solverProof, type LratLine } from "./support/lrat-text.js";
import { upConflict } from "./support/naive-checker.js";

/** Naive semantics: every addition RUP or RAT (first literal) over the clauses present; ends in the empty clause. */
function naiveLratSound(formula: number[][], lines: LratLine[]): boolean {
  const present = new Map<number, number[]>();
  formula.forEach((c, i) => present.set(i + 1, c));
  for (const l of lines) {
    if (l.kind === "del") {
      for (const k of l.ids) present.delete(k);
      continue;
    }
    const cs = [...present.values()];
    const neg = l.lits.map((x) => -x);
    let ok = upConflict(cs, neg);
    if (!ok && l.lits.length > 0) {
      const p = l.lits[0];
      ok = cs.filter((d) => d.includes(-p)).every((d) => upConflict(cs, [...neg, ...d.filter((x) => x !== -p).map((x) => -x)]));
    }
    if (!ok) return false;
    present.set(l.id, l.lits);
    if (l.lits.length === 0) return true;
  }
  return false;
}

type Corruption = { line: number; kind: "replace" | "drop" | "swap" | "flip" | "dropLit"; a: number; b: number };

function corrupt(lines: LratLine[], c: Corruption, maxId: number): LratLine[] {
  const m = copyLines(lines);
  const adds = m.map((l, i) => (l.kind === "add" ? i : -1)).filter((i) => i >= 0);
  const l = m[adds[c.line % adds.length]] as Extract<LratLine, { kind: "add" }>;
  const h = l.hints.length;
  switch (c.kind) {
    case "replace":
      if (h > 0) l.hints[c.a % h] = 1 + (c.b % maxId);
      break;
    case "drop":
      if (h > 0) l.hints.splice(c.a % h, 1);
      break;
    case "swap":
      if (h > 1) [l.hints[c.a % h], l.hints[c.b % h]] = [l.hints[c.b % h], l.hints[c.a % h]];
      break;
    case "flip":
      if (l.lits.length > 0) l.lits[c.a % l.lits.length] *= -1;
      break;
    case "dropLit":
      if (l.lits.length > 0) l.lits.splice(c.a % l.lits.length, 1);
      break;
  }
  return m;
}

describe("LRAT checker soundness against naive unit propagation", () => {
  it("accepts a corrupted proof only when every lemma in it is still implied", () => {
    const php = pigeonhole(3); // PHP(4,3), source: Haken 1985
    const formula = php.clauses.map((c) => Array.from(c));
    const cnf = { numVars: php.numVars, clauses: formula };
    const d = checkDrat(cnf, solverProof(formula) as Uint8Array, { lrat: true });
    expect(d.valid).toBe(true);
    const good = parseLrat(d.lrat as Uint8Array);
    expect(naiveLratSound(formula, good)).toBe(true);
    const maxId = Math.max(...good.map((l) => l.id));
    let accepted = 0;
    let rejected = 0;
    fc.assert(
      fc.property(
        fc.record({ line: fc.nat(), kind: fc.constantFrom("replace", "drop", "swap", "flip", "dropLit"), a: fc.nat(), b: fc.nat() }) as fc.Arbitrary<Corruption>,
        (c) => {
          const m = corrupt(good, c, maxId);
          const r = checkLrat(cnf, printLrat(m));
          if (r.valid) {
            accepted++;
            expect(naiveLratSound(formula, m)).toBe(true);
          } else {
            rejected++;
            expect(r.reason).toMatch(/^line \d+: /);
          }
        },
      ),
      { numRuns: 400, seed: 31337 },
    );
    // both outcomes occurred, so the property compared something
    expect(rejected).toBeGreaterThan(100);
    expect(accepted).toBeGreaterThan(5);
  });
});
