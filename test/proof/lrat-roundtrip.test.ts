// LRAT output of the backward DRAT check, re-checked by the separate LRAT checker: solver proofs
// of pigeonhole formulas and of random unsatisfiable 3-SAT (answers from logic-solver) must give
// LRAT proofs that checkLrat accepts, with plausible counts.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { checkDrat, checkLrat } from "../../src/proof/index.js";
import { pigeonhole, randomKSat } from "../sat/support/generators.js";
import { referenceAnswer } from "../sat/support/reference.js";
import { parseLrat, solverProof } from "./support/lrat-text.js";
import { mutate, mutationArb } from "./support/mutate-drat.js";
import { decodeProof, encodeText } from "./support/naive-checker.js";

describe("DRAT → LRAT round trip", () => {
  // source: Haken 1985 (PHP(n+1, n) is unsatisfiable for every n)
  for (const n of [1, 2, 3, 4, 5, 6]) {
    it(`PHP(${n + 1},${n}): the LRAT written from the solver's proof is accepted`, () => {
      const php = pigeonhole(n);
      const cnf = { numVars: php.numVars, clauses: php.clauses };
      const proof = solverProof(php.clauses, n % 2 ? "binary" : "text");
      expect(proof).not.toBeNull();
      const d = checkDrat(cnf, proof as Uint8Array, { lrat: true });
      expect(d.valid, d.reason).toBe(true);
      expect(d.lrat).toBeDefined();
      const l = checkLrat(cnf, d.lrat as Uint8Array);
      expect(l.valid, l.reason).toBe(true);
      // counts: the core is part of the DRAT lemmas; the LRAT additions are the core lemmas, one
      // unit per top-level literal the chains use (at most one per variable) and the empty clause
      expect(d.stats.coreLemmas).toBeLessThanOrEqual(d.stats.lemmas);
      expect(l.stats.additions).toBeGreaterThanOrEqual(d.stats.coreLemmas + 1);
      expect(l.stats.additions).toBeLessThanOrEqual(d.stats.coreLemmas + php.numVars + 1);
      expect(l.stats.additions + l.stats.deletions).toBe(d.stats.lratLines);
      expect(l.stats.ratAdditions).toBe(0); // the solver learns by resolution only: every lemma is RUP
      // the text itself: ids strictly increasing from above the formula, last line the empty clause
      const lines = parseLrat(d.lrat as Uint8Array);
      const adds = lines.filter((x) => x.kind === "add");
      expect(adds[0].id).toBeGreaterThan(php.clauses.length);
      for (let i = 1; i < adds.length; i++) expect(adds[i].id).toBeGreaterThan(adds[i - 1].id);
      const last = lines[lines.length - 1];
      expect(last.kind === "add" && last.lits.length === 0).toBe(true);
      // the same proof written through the chunked sink is byte-identical
      const chunks: string[] = [];
      const viaSink = checkDrat(cnf, proof as Uint8Array, { lrat: (c) => chunks.push(c) });
      expect(viaSink.valid).toBe(true);
      expect(chunks.join("")).toBe(Buffer.from(d.lrat as Uint8Array).toString("latin1"));
    });
  }

  it("a formula refuted by unit propagation alone needs no DRAT lemmas; its LRAT proof is short and accepted", () => {
    // source: worked by hand — (1), (-1 2), (-2) propagate to a conflict
    const cnf = { numVars: 2, clauses: [[1], [-1, 2], [-2]] };
    const d = checkDrat(cnf, new Uint8Array(0), { lrat: true });
    expect(d.valid).toBe(true);
    const l = checkLrat(cnf, d.lrat as Uint8Array);
    expect(l.valid, l.reason).toBe(true);
    expect(l.stats.additions).toBeLessThanOrEqual(2); // at most the unit 2 and the empty clause
    // the same formula without (-2) is satisfiable: no LRAT proof, and nothing returned
    const sat = checkDrat({ numVars: 2, clauses: [[1], [-1, 2]] }, new Uint8Array(0), { lrat: true });
    expect(sat.valid).toBe(false);
    expect(sat.lrat).toBeUndefined();
  });

  it("random 3-SAT near the threshold (unsat per logic-solver): every valid DRAT proof, mutated ones included, gives an accepted LRAT proof", () => {
    let checked = 0;
    let withDeletions = 0;
    let mutatedAccepted = 0;
    fc.assert(
      fc.property(
        fc.integer({ min: 1, max: 1_000_000 }),
        mutationArb,
        (seed, m) => {
          const n = 24 + (seed % 13);
          const cnf = randomKSat(n, Math.round(n * 4.26), 3, seed);
          // source: logic-solver (npm), reference SAT library — only unsatisfiable formulas have proofs
          if (referenceAnswer(cnf) !== "unsat") return;
          const proof = solverProof(cnf.clauses, seed % 2 ? "binary" : "text", { reduceFirst: 3, reduceIncrement: 1 });
          expect(proof).not.toBeNull();
          const c = { numVars: n, clauses: cnf.clauses };
          const d = checkDrat(c, proof as Uint8Array, { lrat: true });
          expect(d.valid, d.reason).toBe(true);
          const l = checkLrat(c, d.lrat as Uint8Array);
          expect(l.valid, l.reason).toBe(true);
          expect(d.stats.coreLemmas).toBeLessThanOrEqual(d.stats.lemmas);
          checked++;
          if (d.stats.deletions > 0) withDeletions++;
          // a mutated proof: whenever the backward check still accepts it (it checks only the lemmas
          // the refutation needs), the LRAT written from it must be accepted as well
          const bad = encodeText(mutate(decodeProof(proof as Uint8Array), m, n));
          const dm = checkDrat(c, bad, { lrat: true });
          if (dm.valid) {
            const lm = checkLrat(c, dm.lrat as Uint8Array);
            expect(lm.valid, lm.reason).toBe(true);
            mutatedAccepted++;
          } else expect(dm.lrat).toBeUndefined();
        },
      ),
      { numRuns: 40, seed: 4262026 },
    );
    // the property must have had unsatisfiable formulas (and proofs with deletions) to bite on
    expect(checked).toBeGreaterThan(10);
    expect(withDeletions).toBeGreaterThan(2);
    expect(mutatedAccepted).toBeGreaterThan(3);
  });
});
