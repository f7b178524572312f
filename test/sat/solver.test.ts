// The CDCL solver on formulas with known answers: pigeonhole (unsat, proofs checked), n-queens
// solution counts by model enumeration, and random 3-SAT against logic-solver.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { checkDrat } from "../../src/proof/index.js";
import { MemoryProofWriter, Solver, type Cnf } from "../../src/sat/index.js";
import { pigeonhole, queens, randomKSat, satisfies, unrolledCircuit } from "./support/generators.js";
import { referenceAnswer } from "./support/reference.js";

function load(cnf: Cnf, s = new Solver()): Solver {
  for (const c of cnf.clauses) s.addClause(c);
  return s;
}

describe("pigeonhole PHP(n+1, n)", () => {
  const maxN = process.env.PLUMBLINE_SLOW ? 8 : 7;
  for (let n = 1; n <= maxN; n++) {
    it(`n = ${n}: unsat, and the binary DRAT proof checks`, () => {
      const cnf = pigeonhole(n);
      const mem = new MemoryProofWriter("binary");
      const s = load(cnf, new Solver({ proof: mem }));
      expect(s.solve()).toBe("unsat"); // source: Haken 1985 (pigeonhole formulas are unsatisfiable)
      const r = checkDrat(cnf, mem.bytes());
      expect(r.valid, r.reason).toBe(true);
    });
  }

  it("text proofs check too (n = 5)", () => {
    const cnf = pigeonhole(5);
    const mem = new MemoryProofWriter("text");
    expect(load(cnf, new Solver({ proof: mem })).solve()).toBe("unsat"); // source: Haken 1985
    expect(checkDrat(cnf, mem.bytes()).valid).toBe(true);
    expect(Buffer.from(mem.bytes()).toString("latin1")).toMatch(/^(-?\d+ )*0\n/);
  });
});

describe("n-queens by model enumeration", () => {
  /** Counts models over the board variables by adding a blocking clause after each one. */
  function countQueens(n: number): number {
    const cnf = queens(n);
    const s = load(cnf);
    let count = 0;
    while (s.solve() === "sat") {
      const m = s.model();
      expect(satisfies(cnf, m)).toBe(true);
      const queensPlaced = [];
      for (let v = 1; v <= n * n; v++) if (m[v] === 1) queensPlaced.push(v);
      expect(queensPlaced.length).toBe(n);
      count++;
      s.addClause(queensPlaced.map((v) => -v));
    }
    return count;
  }
  it("6 → 4 solutions", () => expect(countQueens(6)).toBe(4)); // source: OEIS A000170
  it("8 → 92 solutions", () => expect(countQueens(8)).toBe(92)); // source: OEIS A000170
});

/**
 * Solves `cnf` with proof logging and frequent reductions; checks the answer against
 * logic-solver, a model against every clause, an unsat proof with the checker. Returns the answer.
 */
function solveChecked(cnf: Cnf, format: "binary" | "text"): "sat" | "unsat" {
  const mem = new MemoryProofWriter(format);
  const s = load(cnf, new Solver({ proof: mem, reduceFirst: 20, reduceIncrement: 10 }));
  const ours = s.solve();
  expect(ours).toBe(referenceAnswer(cnf)); // source: logic-solver (npm), reference library
  if (ours === "sat") {
    expect(satisfies(cnf, s.model())).toBe(true);
    return "sat";
  }
  const r = checkDrat(cnf, mem.bytes());
  expect(r.valid, r.reason).toBe(true);
  return "unsat";
}

describe("random 3-SAT near the threshold", () => {
  it("agrees with logic-solver; models satisfy every clause; unsat proofs check", () => {
    const count = { sat: 0, unsat: 0 };
    fc.assert(
      fc.property(fc.integer({ min: 5, max: 60 }), fc.integer({ min: 1, max: 1 << 30 }), (n, seed) => {
        count[solveChecked(randomKSat(n, Math.round(n * 4.26), 3, seed), seed % 2 ? "binary" : "text")]++;
      }),
      { numRuns: process.env.PLUMBLINE_SLOW ? 400 : 60, seed: 4260 },
    );
    expect(count.sat).toBeGreaterThan(10);
    expect(count.unsat).toBeGreaterThan(10);
  });
});

describe("unrolled random circuits (deep implication chains, several literals per level)", () => {
  it("agrees with logic-solver; models satisfy every clause; unsat proofs check", () => {
    const count = { sat: 0, unsat: 0 };
    fc.assert(
      fc.property(fc.integer({ min: 20, max: 40 }), fc.integer({ min: 8, max: 14 }), fc.integer({ min: 8, max: 16 }), fc.integer({ min: 1, max: 1 << 30 }), (width, steps, tenths, seed) => {
        count[solveChecked(unrolledCircuit(width, steps, Math.round((width * tenths) / 10), seed), "binary")]++;
      }),
      { numRuns: process.env.PLUMBLINE_SLOW ? 400 : 60, seed: 1207 },
    );
    expect(count.sat).toBeGreaterThan(5);
    expect(count.unsat).toBeGreaterThan(5);
  });
});

describe("limits", () => {
  it("a conflict limit, a past deadline and an aborted signal give unknown; the solver stays usable", () => {
    const cnf = pigeonhole(8);
    const s = load(cnf);
    expect(s.solve([], { conflicts: 100 })).toBe("unknown");
    expect(s.stats().conflicts).toBe(100);
    expect(s.solve([], { deadline: Date.now() - 1 })).toBe("unknown");
    const ac = new AbortController();
    ac.abort();
    expect(s.solve([], { signal: ac.signal })).toBe("unknown");
    expect(s.model().length).toBe(0);
    const small = load(pigeonhole(4));
    expect(small.solve([], { conflicts: 1_000_000 })).toBe("unsat"); // source: Haken 1985
  });

  it("solveAsync stops when its signal is aborted while it runs", async () => {
    const s = load(pigeonhole(10));
    const ac = new AbortController();
    setTimeout(() => ac.abort(), 50);
    expect(await s.solveAsync([], { signal: ac.signal })).toBe("unknown");
    expect(await load(queens(6)).solveAsync()).toBe("sat");
  });

  it("solveAsync resumes across its time slices: same search as solve", async () => {
    const sync = load(pigeonhole(7));
    expect(sync.solve()).toBe("unsat");
    const asyncSolver = load(pigeonhole(7));
    expect(await asyncSolver.solveAsync()).toBe("unsat");
    expect(asyncSolver.stats().conflicts).toBe(sync.stats().conflicts);
  });

  it("statistics count the work", () => {
    const s = load(pigeonhole(5));
    s.solve();
    const st = s.stats();
    expect(st.conflicts).toBeGreaterThan(0);
    expect(st.decisions).toBeGreaterThan(0);
    expect(st.propagations).toBeGreaterThan(st.conflicts);
    expect(st.vars).toBe(30);
    expect(st.originalClauses).toBe(6 + 5 * 15);
  });
});
