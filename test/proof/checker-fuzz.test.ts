// The fast checker against the naive oracle on solver proofs of random unsatisfiable 3-SAT and
// on randomly mutated copies: forward mode must agree exactly; backward mode may accept more
// (it checks only needed lemmas) but never rejects what the oracle accepts.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { checkDrat } from "../../src/proof/index.js";
import { MemoryProofWriter, Solver } from "../../src/sat/index.js";
import { randomKSat } from "../sat/support/generators.js";
import { mutate, mutationArb } from "./support/mutate-drat.js";
import { decodeProof, encodeText, naiveCheck, type NaiveStep } from "./support/naive-checker.js";

function unsatInstance(seed: number): { clauses: number[][]; numVars: number; steps: NaiveStep[] } | null {
  const n = 20 + (seed % 21);
  const cnf = randomKSat(n, Math.round(n * 5), 3, seed);
  const mem = new MemoryProofWriter(seed % 2 ? "text" : "binary");
  // frequent reductions, so that proofs also carry deletions
  const s = new Solver({ proof: mem, reduceFirst: 3, reduceIncrement: 1 });
  for (const c of cnf.clauses) s.addClause(c);
  if (s.solve() !== "unsat") return null;
  return { numVars: n, clauses: cnf.clauses.map((c) => Array.from(c)), steps: decodeProof(mem.bytes().slice()) };
}

describe("fast checker agrees with the naive oracle", () => {
  it("accepts untouched solver proofs; on mutations forward agrees exactly and backward is never stricter", () => {
    let instances = 0;
    let rejected = 0;
    let deletions = 0;
    fc.assert(
      fc.property(
        fc.integer({ min: 1, max: 1_000_000 }),
        mutationArb,
        (seed, m) => {
          const inst = unsatInstance(seed);
          if (inst === null) return;
          instances++;
          deletions += inst.steps.filter((st) => st.del).length;
          const cnf = { numVars: inst.numVars, clauses: inst.clauses };
          // untouched
          expect(naiveCheck(inst.clauses, inst.steps)).toBe(true);
          expect(checkDrat(cnf, encodeText(inst.steps)).valid).toBe(true);
          expect(checkDrat(cnf, encodeText(inst.steps), { mode: "forward" }).valid).toBe(true);
          // mutated
          const bad = mutate(inst.steps, m, inst.numVars);
          const oracle = naiveCheck(inst.clauses, bad);
          const fwd = checkDrat(cnf, encodeText(bad), { mode: "forward" }).valid;
          const bwd = checkDrat(cnf, encodeText(bad), { mode: "backward" }).valid;
          expect(fwd).toBe(oracle);
          if (oracle) expect(bwd).toBe(true);
          else rejected++;
        },
      ),
      { numRuns: 150, seed: 20240601 },
    );
    // the property must have had something to bite on
    expect(instances).toBeGreaterThan(100);
    expect(rejected).toBeGreaterThan(20);
    expect(deletions).toBeGreaterThan(0);
  });
});
