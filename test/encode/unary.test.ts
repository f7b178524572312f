// cost-unary-1's counter (src/encode/unary.ts) against its spec worked by hand, and against plain
// arithmetic: for every choice of at most one literal per input, "sum ≤ B" is satisfiable iff it holds.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { buildUnary, CnfBuilder, unaryAssumptions, type UnaryInput } from "../../src/encode/index.js";
import { Solver } from "../../src/sat/index.js";
import { Oracle } from "./oracle.js";
import { runs } from "./rich-task.js";

function build(nLits: number, inputs: UnaryInput[], cap: number) {
  const cnf = new CnfBuilder();
  cnf.newVars(nLits, "input");
  const r = buildUnary(cnf, inputs, cap);
  const clauses: number[][] = [];
  cnf.streamTo({ addClause: (l) => clauses.push(Array.from(l)) });
  return { cnf, r, clauses };
}

describe("cost-unary-1 counter", () => {
  it("emits the clauses of the spec, worked by hand on inputs {x1: 2} and {x2: 1, x3: 1, x4: 3} with K = 4", () => {
    // source: worked by hand from encodings/cost-unary-1.md "Counter".
    // input 1: value word E_2 = x1 (single member); c = 0, m = min(4, 0 + 2) = 2: N = 5, 6.
    //   j=1: v=2, j ≤ v: [-1, 5]; j=2: [-1, 6].
    // input 2: values 1 (x2, x3: new word 7 with [-2,7], [-3,7]) and 3 (x4 alone);
    //   c = 2, m = min(4, 2 + 3) = 4: N = 8..11.
    //   j=1: [-5,8]; v=1: [-7,8]; v=3: [-4,8]
    //   j=2: [-6,9]; v=1: i=1 → [-7,-5,9]; v=3: [-4,9]
    //   j=3: (j > c); v=1: i=2 → [-7,-6,10]; v=3: [-4,10]
    //   j=4: v=1: i=3 > c, none; v=3: i=1 → [-4,-5,11]
    const { r, clauses } = build(4, [{ values: [2], lits: [1] }, { values: [1, 1, 3], lits: [2, 3, 4] }], 4);
    expect(clauses).toEqual([
      [-1, 5],
      [-1, 6],
      [-2, 7],
      [-3, 7],
      [-5, 8],
      [-7, 8],
      [-4, 8],
      [-6, 9],
      [-7, -5, 9],
      [-4, 9],
      [-7, -6, 10],
      [-4, 10],
      [-4, -5, 11],
    ]);
    expect(r.outputs).toEqual([8, 9, 10, 11]);
    expect(r.maxSum).toBe(5);
    expect(unaryAssumptions(r, 2)).toEqual([-10]);
    expect(unaryAssumptions(r, 5)).toEqual([]);
    expect(() => unaryAssumptions(r, 4)).toThrow(RangeError);
  });

  it("with K = 0 builds nothing and asks nothing", () => {
    const { r, clauses } = build(2, [{ values: [3], lits: [1] }, { values: [1], lits: [2] }], 0);
    expect(clauses).toEqual([]);
    expect(r.outputs).toEqual([]);
    expect(r.maxSum).toBe(4);
  });

  const inputsArb = fc
    .array(fc.array(fc.integer({ min: 1, max: 5 }), { minLength: 1, maxLength: 3 }), { minLength: 1, maxLength: 4 })
    .map((vss) => vss.map((vs) => [...vs].sort((a, b) => a - b)));

  it("sum ≤ B is satisfiable exactly when the chosen literals' values sum to at most B (every choice, every B < K)", () => {
    let checked = 0;
    fc.assert(
      fc.property(inputsArb, fc.integer({ min: 0, max: 10 }), (vss, capDraw) => {
        let next = 1;
        const inputs: UnaryInput[] = vss.map((vs) => ({ values: vs, lits: vs.map(() => next++) }));
        const maxSum = vss.reduce((s, vs) => s + vs[vs.length - 1], 0);
        const cap = Math.min(capDraw, maxSum);
        const { cnf, r } = build(next - 1, inputs, cap);
        expect(r.maxSum).toBe(maxSum);
        const oracle = new Oracle(cnf.toCnf());
        const solver = new Solver();
        cnf.streamTo(solver);
        // every choice: for each input, none or one of its literals
        const choices = vss.reduce<number[][]>((acc, vs, k) => acc.flatMap((c) => [-1, ...vs.keys()].map((i) => [...c, i])), [[]]);
        for (const choice of choices) {
          const fix: number[] = [];
          let sum = 0;
          choice.forEach((i, k) => {
            inputs[k].lits.forEach((l, j) => fix.push(j === i ? l : -l));
            if (i >= 0) sum += inputs[k].values[i];
          });
          for (let B = 0; B < cap; B++) {
            const assume = [...fix, ...unaryAssumptions(r, B)];
            // source: arithmetic (the sum of the chosen values), logic-solver (MiniSat) as SAT oracle
            expect(oracle.solve(assume) !== null, `choice ${choice} sum ${sum} B ${B}`).toBe(sum <= B);
            expect(solver.solve(assume)).toBe(sum <= B ? "sat" : "unsat");
            checked++;
          }
        }
      }),
      { numRuns: runs(15) },
    );
    expect(checked).toBeGreaterThan(200);
  });
});
