// The DRAT checker on small proofs worked out by hand: valid ones accepted (RUP and RAT),
// and each kind of corruption (dropped, flipped, truncated, bogus lemma) rejected with its reason.
import { gzipSync } from "node:zlib";
import { describe, expect, it } from "vitest";
import { checkDrat, readCnfForChecker } from "../../src/proof/index.js";
import { MemoryProofWriter, Solver } from "../../src/sat/index.js";
import { pigeonhole } from "../sat/support/generators.js";
import { decodeProof, encodeText, naiveCheck } from "./support/naive-checker.js";

const text = (s: string) => Buffer.from(s, "latin1");

// F = G ∪ H. G = {(1 8), (1 -8)} forces x1. H = PHP(3,2) (variables 2..7) with ¬x1 added to every
// clause, so F ∧ x1 is PHP(3,2), which unit propagation alone does not refute.
// source: worked by hand (pigeonhole formulas unsatisfiable: Haken 1985)
const F = {
  numVars: 8,
  clauses: [
    [1, 8], [1, -8],
    [-1, 2, 3], [-1, 4, 5], [-1, 6, 7],
    [-1, -2, -4], [-1, -2, -6], [-1, -4, -6],
    [-1, -3, -5], [-1, -3, -7], [-1, -5, -7],
  ],
};
// (1) is RUP via G; (-2) is RUP given x1 (2 → ¬4, ¬6 → 5, 7 → conflict); then x1, ¬2 propagate to a conflict.
const GOOD = "1 0\n-2 0\n0\n";

describe("DRAT checker on hand-made proofs", () => {
  it("accepts the hand-made refutation, in both modes", () => {
    for (const mode of ["backward", "forward"] as const) {
      const r = checkDrat(F, text(GOOD), { mode });
      expect(r.valid, r.reason).toBe(true);
      expect(naiveCheck(F.clauses, [{ del: false, lits: [1] }, { del: false, lits: [-2] }, { del: false, lits: [] }])).toBe(true);
    }
  });

  it("rejects a proof with a needed lemma dropped", () => {
    // without (1), (-2) is still RAT (its only resolvent, with (-1 2 3), is RUP), but the
    // empty clause then has no unit-propagation conflict behind it
    const r = checkDrat(F, text("-2 0\n0\n"));
    expect(r.valid).toBe(false);
    expect(r.failedLemma?.index).toBe(2);
    expect(r.failedLemma?.clause).toEqual([]);
  });

  it("rejects a proof with a flipped literal, naming the lemma and why", () => {
    // (-1): with x1 true, H is PHP(3,2): no conflict, so not RUP; its resolvent (-1 8) with (1 8) is not RUP either
    for (const mode of ["backward", "forward"] as const) {
      const r = checkDrat(F, text("-1 0\n-2 0\n0\n"), { mode });
      expect(r.valid).toBe(false);
      expect(r.failedLemma?.index).toBe(1);
      expect(r.failedLemma?.line).toBe(1);
      expect(r.failedLemma?.reason).toMatch(/not RUP/);
      expect(r.failedLemma?.reason).toMatch(/not RAT/);
    }
  });

  it("rejects a truncated proof", () => {
    const r = checkDrat(F, text("1 0\n"));
    expect(r.valid).toBe(false);
    expect(r.reason).toMatch(/no refutation/);
    const cut = checkDrat(F, text("1 0\n-2"));
    expect(cut.valid).toBe(false);
    expect(cut.reason).toMatch(/truncated/);
  });

  it("rejects a bogus clause, inserted or appended after the empty clause", () => {
    const bogus = checkDrat(F, text("1 0\n-1 0\n0\n"));
    expect(bogus.valid).toBe(false);
    expect(bogus.failedLemma?.index).toBe(2);
    const appended = checkDrat(F, text(GOOD + "5 0\n"));
    expect(appended.valid).toBe(false);
    expect(appended.reason).toMatch(/continues after the empty clause/);
  });

  it("accepts RAT lemmas (a definition x13 ↔ x1 over a fresh variable) and counts them", () => {
    // source: worked by hand — in PHP(4,3), (13 -1) is RAT on 13 (no clause holds -13) and not RUP
    // (placing pigeon 0 leaves PHP(3,2), which propagation does not refute); (-13 1) is RAT on -13
    // (its one resolvent, with (13 -1), is a tautology) and not RUP. The solver's proof follows.
    const php = pigeonhole(3);
    const mem = new MemoryProofWriter("text");
    const s = new Solver({ proof: mem });
    for (const c of php.clauses) s.addClause(c);
    expect(s.solve()).toBe("unsat");
    const proof = Buffer.concat([text("13 -1 0\n-13 1 0\n"), mem.bytes()]);
    const cnf = { numVars: php.numVars, clauses: php.clauses.map((c) => Array.from(c)) };
    const fwd = checkDrat(cnf, proof, { mode: "forward" });
    expect(fwd.valid, fwd.reason).toBe(true);
    expect(fwd.stats.ratLemmas).toBe(2);
    expect(naiveCheck(cnf.clauses, decodeProof(proof))).toBe(true);
    // the same lemma with its pivot moved to -1 is neither RUP nor RAT: resolving on -1 with
    // (1 2 3) gives (13 2 3), and propagation from ¬13 ¬2 ¬3 only places pigeon 0 in hole 0
    const moved = checkDrat(cnf, Buffer.concat([text("-1 13 0\n"), mem.bytes()]), { mode: "forward" });
    expect(moved.valid).toBe(false);
    expect(moved.failedLemma?.index).toBe(1);
    expect(moved.failedLemma?.reason).toMatch(/not RAT on its first literal -1/);
  });

  it("reads binary proofs, gzip-compressed proofs, and deletions", () => {
    // binary DRAT: 'a', literals as 2·v + sign in 7-bit groups, 0 ends the clause
    const bin = Uint8Array.from([0x61, 2, 0, 0x61, 5, 0, 0x61, 0]); // a 1 0, a -2 0, a 0
    const r = checkDrat(F, bin);
    expect(r.valid, r.reason).toBe(true);
    expect(r.stats.format).toBe("binary");
    expect(checkDrat(F, gzipSync(text(GOOD))).valid).toBe(true);
    // deleting (1 8) after (1) is derived does not hurt; deleting a clause never added is counted
    const withDel = checkDrat(F, text("1 0\nd 1 8 0\nd 4 4 4 0\n-2 0\n0\n"));
    expect(withDel.valid, withDel.reason).toBe(true);
    expect(withDel.stats.missingDeletions).toBe(1);
  });

  it("a formula that unit propagation refutes needs no lemmas; an empty proof of a satisfiable one is rejected", () => {
    expect(checkDrat({ numVars: 1, clauses: [[1], [-1]] }, new Uint8Array(0)).valid).toBe(true);
    expect(checkDrat({ numVars: 2, clauses: [[1, 2]] }, new Uint8Array(0)).valid).toBe(false);
  });

  it("reports an unreadable proof instead of throwing", () => {
    const r = checkDrat(F, text("1 x 0\n"));
    expect(r.valid).toBe(false);
    expect(r.reason).toMatch(/unexpected character/);
  });

  it("its own DIMACS reader names file:line:col on bad input", () => {
    expect(() => readCnfForChecker("p cnf 2 1\n1 3 0\n", "f.cnf")).toThrow(/f\.cnf:2:3: literal 3 is out of range/);
    expect(() => readCnfForChecker("1 2 0\n", "f.cnf")).toThrow(/f\.cnf:1:1: expected the header/);
    expect(() => readCnfForChecker("p cnf 2 1\n1 2\n", "f.cnf")).toThrow(/f\.cnf:2:3: the last clause is missing its terminating 0/);
    expect(readCnfForChecker("p cnf 2 3\n1 2 0\n", "f.cnf").warnings[0]).toMatch(/declares 3 clauses but the file has 1/);
  });

  it("encodeText round-trips through the checker", () => {
    const steps = [{ del: false, lits: [1] }, { del: false, lits: [-2] }, { del: false, lits: [] }];
    expect(checkDrat(F, encodeText(steps)).valid).toBe(true);
  });
});
