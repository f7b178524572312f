// Incremental use: solving under assumptions, failed-assumption cores, clauses added between
// solves, and one DRAT proof spanning several solves (checked as formula + assumption units).
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { checkDrat } from "../../src/proof/index.js";
import { MemoryProofWriter, Solver, type Cnf } from "../../src/sat/index.js";
import { pigeonhole, randomKSat, satisfies } from "./support/generators.js";
import { referenceAnswer } from "./support/reference.js";

function withUnits(cnf: Cnf, units: number[]): Cnf {
  return { numVars: cnf.numVars, clauses: [...cnf.clauses, ...units.map((u) => Int32Array.of(u))] };
}

describe("assumptions and failed-assumption cores", () => {
  it("a small hand example: the core names exactly the contradictory assumptions", () => {
    // (¬1 ∨ ¬2): assuming 3, 1, 2 fails because of 1 and 2 only — source: worked by hand
    const s = new Solver();
    s.addClause([-1, -2]);
    s.addClause([3, 4]);
    expect(s.solve([3, 1, 2])).toBe("unsat");
    expect(s.failedAssumptions().sort()).toEqual([1, 2]);
    expect(s.solve([3, 1])).toBe("sat");
    expect(s.value(1)).toBe(true);
    expect(s.value(2)).toBe(false);
    expect(s.solve([1, -1])).toBe("unsat");
    expect(s.failedAssumptions().sort()).toEqual([-1, 1]);
    expect(s.solve()).toBe("sat"); // assumptions leave no trace
  });

  it("random formulas: answers under assumptions match logic-solver with the assumptions as units; cores are unsat on their own", () => {
    fc.assert(
      fc.property(fc.integer({ min: 8, max: 40 }), fc.integer({ min: 1, max: 1 << 30 }), fc.array(fc.integer({ min: 1, max: 8 }), { maxLength: 6 }), (n, seed, raw) => {
        const cnf = randomKSat(n, Math.round(n * 3.5), 3, seed);
        const assumptions = [...new Set(raw)].map((v, i) => ((seed >> i) & 1 ? v : -v));
        const s = new Solver();
        for (const c of cnf.clauses) s.addClause(c);
        const r = s.solve(assumptions);
        expect(r).toBe(referenceAnswer(withUnits(cnf, assumptions))); // source: logic-solver (npm)
        if (r === "sat") {
          expect(satisfies(cnf, s.model())).toBe(true);
          for (const a of assumptions) expect(s.value(Math.abs(a))).toBe(a > 0);
        } else if (s.okay) {
          const core = s.failedAssumptions();
          for (const a of core) expect(assumptions).toContain(a);
          expect(s.solve(core)).toBe("unsat");
        }
      }),
      { numRuns: 40, seed: 77 },
    );
  });
});

describe("incremental solving with one proof", () => {
  it("clauses added between solves; each unsat-under-assumptions ends the proof with the negated core", () => {
    const mem = new MemoryProofWriter("binary");
    const s = new Solver({ proof: mem });
    const php = pigeonhole(5); // variables 1..30
    // guard every pigeonhole clause with selector 31: PHP is active only when 31 is assumed
    const guarded: Cnf = { numVars: 32, clauses: php.clauses.map((c) => Int32Array.from([...c, -31])) };
    for (const c of guarded.clauses) s.addClause(c);
    expect(s.solve([31])).toBe("unsat"); // source: Haken 1985
    expect(s.failedAssumptions()).toEqual([31]);
    const afterFirst = mem.bytes().slice();
    expect(checkDrat(withUnits(guarded, [31]), afterFirst).valid).toBe(true);
    expect(s.solve([-31])).toBe("sat");

    // new clauses after the first solves: 32 → 31
    const extra = Int32Array.of(-32, 31);
    s.addClause(extra);
    const all: Cnf = { numVars: 32, clauses: [...guarded.clauses, extra] };
    expect(s.solve([32])).toBe("unsat");
    expect(s.failedAssumptions()).toEqual([32]);
    const proof = mem.bytes().slice();
    // formula (all clauses ever added) + a unit per assumption of the last solve + the whole proof
    const r = checkDrat(withUnits(all, [32]), proof);
    expect(r.valid, r.reason).toBe(true);
    // without the assumption unit the proof is not a refutation (the formula is satisfiable)
    expect(checkDrat(all, proof).valid).toBe(false);

    // and finally a plain unsat: the proof ends with the empty clause
    s.addClause([31]);
    expect(s.solve()).toBe("unsat");
    const final = checkDrat({ numVars: 32, clauses: [...all.clauses, Int32Array.of(31)] }, mem.bytes());
    expect(final.valid, final.reason).toBe(true);
    expect(s.addClause([1, 2])).toBe(false);
  });

  it("enumeration with blocking clauses and a proof that covers every solve", () => {
    // all 2^3 assignments of x1..x3 blocked one by one: the last solve is unsat — source: worked by hand
    const mem = new MemoryProofWriter("text");
    const s = new Solver({ proof: mem });
    s.addClause([1, 2, 3, 4]);
    const added: Int32Array[] = [Int32Array.of(1, 2, 3, 4), Int32Array.of(-4)];
    s.addClause([-4]);
    let models = 0;
    while (s.solve() === "sat") {
      models++;
      const block = Int32Array.from([1, 2, 3], (v) => (s.value(v) ? -v : v));
      added.push(block);
      s.addClause(block);
    }
    expect(models).toBe(7); // x4 false forces x1 ∨ x2 ∨ x3: 7 of the 8 assignments
    expect(checkDrat({ numVars: 4, clauses: added }, mem.bytes()).valid).toBe(true);
  });
});
