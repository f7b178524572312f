// cost-adder-1 by enumeration: for every input assignment of small weighted groups and every
// bound B, "sum ≤ B" is satisfiable exactly when the arithmetic sum is ≤ B, and the sum bits
// can take the exact binary sum but never a smaller value.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { buildAdder, CnfBuilder, comparatorAssumptions, emitComparator } from "../../src/encode/index.js";
import { bitLength, bitsOf } from "../../src/encode/adder.js";
import { Oracle } from "./oracle.js";
import { runs } from "./rich-task.js";

/** Builds groups over fresh input variables; returns the oracle and the pieces. */
function circuit(weights: number[], sizes: number[], extraBits = 0) {
  const cnf = new CnfBuilder();
  const groups = weights.map((w, i) => ({ weight: w, lits: Array.from({ length: sizes[i] }, () => cnf.newVar("input")) }));
  const adder = buildAdder(cnf, groups);
  const m = bitLength(adder.maxSum) + extraBits;
  const cmp = emitComparator(cnf, adder.sum, m);
  return { groups, adder, cmp, oracle: new Oracle(cnf.toCnf()), m };
}

function checkCircuit(weights: number[], sizes: number[], extraBits = 0): void {
  const { groups, adder, cmp, oracle, m } = circuit(weights, sizes, extraBits);
  const inputs = groups.flatMap((g) => g.lits.map((l) => ({ l, w: g.weight })));
  // source: arithmetic — Σ weight·[input true], compared with the circuit's answers
  expect(adder.maxSum).toBe(inputs.reduce((s, x) => s + x.w, 0));
  for (let mask = 0; mask < 1 << inputs.length; mask++) {
    const fix = inputs.map((x, i) => (mask & (1 << i) ? x.l : -x.l));
    const sum = inputs.reduce((s, x, i) => s + (mask & (1 << i) ? x.w : 0), 0);
    const top = 2 ** m - 1;
    for (const B of [...Array(Math.min(top, adder.maxSum + 1) + 1).keys(), top]) {
      const sat = oracle.solve([...fix, ...comparatorAssumptions(cmp, B)]) !== null;
      expect(sat, `weights ${weights} sizes ${sizes} mask ${mask} B ${B}`).toBe(sum <= B);
    }
    // sum bits: the exact value is possible, one less is not
    const bitsFor = (v: number) => adder.sum.map((l, j) => (Math.floor(v / 2 ** j) % 2 === 1 ? l : -l)).filter((l) => l !== 0);
    const zeroBitsOk = (v: number) => adder.sum.every((l, j) => l !== 0 || Math.floor(v / 2 ** j) % 2 === 0);
    expect(zeroBitsOk(sum)).toBe(true);
    expect(oracle.solve([...fix, ...bitsFor(sum)])).not.toBeNull();
    if (sum > 0 && zeroBitsOk(sum - 1)) expect(oracle.solve([...fix, ...bitsFor(sum - 1)])).toBeNull();
  }
}

describe("cost-adder-1", () => {
  it("bitsOf / bitLength", () => {
    // source: arithmetic (binary expansions)
    expect(bitsOf(0)).toEqual([]);
    expect(bitsOf(13)).toEqual([0, 2, 3]);
    expect(bitsOf(2 ** 40 + 1)).toEqual([0, 40]);
    expect(bitLength(0)).toBe(0);
    expect(bitLength(1)).toBe(1);
    expect(bitLength(8)).toBe(4);
    expect(bitLength(2 ** 40)).toBe(41);
  });

  it("sums unit, power-of-two and composite weights exactly (all inputs, all bounds)", () => {
    checkCircuit([1], [5]); // pure counter
    checkCircuit([3], [4]); // counted then shifted twice
    checkCircuit([1, 2, 4], [2, 2, 1]);
    checkCircuit([0, 5, 6], [1, 2, 2]); // zero weight contributes nothing
    checkCircuit([7], [3], 2); // bound bits beyond the sum's width
  });

  it("sums random small groups exactly", () => {
    fc.assert(
      fc.property(
        fc.array(fc.tuple(fc.integer({ min: 0, max: 9 }), fc.integer({ min: 1, max: 3 })), { minLength: 1, maxLength: 3 }).filter((gs) => gs.reduce((s, g) => s + g[1], 0) <= 5),
        (gs) => checkCircuit(gs.map((g) => g[0]), gs.map((g) => g[1])),
      ),
      { numRuns: runs(6) },
    );
  });

  it("uses exactly n − (number of output bits) full adders for a counter of n unit inputs", () => {
    // each full adder removes one bit, a half adder none: the n input bits end as bitLength(n) sum bits
    // source: arithmetic on the column compression scheme (spec cost-adder-1)
    for (const n of [1, 2, 3, 7, 8, 31, 100]) {
      const cnf = new CnfBuilder();
      const lits = Array.from({ length: n }, () => cnf.newVar("input"));
      const r = buildAdder(cnf, [{ weight: 1, lits }]);
      expect(r.sum.length).toBe(bitLength(n));
      expect(r.fullAdders).toBe(n - r.sum.length);
    }
  });
});
