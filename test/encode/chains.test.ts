// forall-2's chain, by brute force: for random families (E, R), an assignment of the actions
// extends to a model of the chain clauses exactly when no e ∈ E and different r ∈ R are both
// true — checked by trying every value of the chain variables (no SAT solver involved).
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { chainPlan, emitChain } from "../../src/encode/chains.js";
import { CnfBuilder } from "../../src/encode/index.js";
import { familyPairCount } from "../../src/encode/interference.js";
import { runs } from "./rich-task.js";

const subsetOf = (n: number) => fc.subarray([...Array(n).keys()], { minLength: 1 });

describe("forall-2 chains", () => {
  it("forbid exactly the E–R pairs", () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 2, max: 7 }).chain((n) => fc.tuple(fc.constant(n), subsetOf(n), subsetOf(n))),
        ([n, E, R]) => {
          const cnf = new CnfBuilder();
          const x0 = cnf.newVars(n, "action");
          const plan = chainPlan({ E, R });
          emitChain(cnf, plan, (u) => x0 + u);
          const aux = cnf.numVars - n;
          expect(aux).toBe(plan.vars);
          expect(cnf.numClauses).toBe(plan.clauses);
          const clauses = cnf.toCnf().clauses;
          let forbiddenPairs = 0;
          for (let a = 0; a < n; a++) for (let b = a + 1; b < n; b++) if ((E.includes(a) && R.includes(b)) || (E.includes(b) && R.includes(a))) forbiddenPairs++;
          // source: counting by definition (unordered pairs {e, r}, e ∈ E, r ∈ R, e ≠ r)
          expect(familyPairCount({ E, R })).toBe(forbiddenPairs);
          for (let xs = 0; xs < 1 << n; xs++) {
            const on = (u: number) => (xs >> u) & 1;
            let allowed = true;
            for (const e of E) for (const r of R) if (e !== r && on(e) && on(r)) allowed = false;
            let extends_ = false;
            for (let ps = 0; ps < 1 << aux && !extends_; ps++) {
              const val = (v: number) => (v <= n ? on(v - x0) === 1 : ((ps >> (v - n - 1)) & 1) === 1);
              extends_ = clauses.every((cl) => Array.from(cl).some((l) => (l > 0 ? val(l) : !val(-l))));
            }
            expect(extends_, `E=${E} R=${R} actions=${xs.toString(2)}`).toBe(allowed);
          }
        },
      ),
      { numRuns: runs(40) },
    );
  });
});
