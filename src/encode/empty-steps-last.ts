// Part empty-steps-last-1 (spec encodings/empty-steps-last-1.md): "step s is non-empty"
// variables with the non-empty steps first, so a plan has one placement among empty steps.
import type { CnfBuilder } from "./cnf.js";
import type { Layout } from "./layout.js";

/**
 * New variables n_1..n_T (consecutive, after every variable so far). For s = 1..T:
 * (¬A(s,a) ∨ n_s) for a = 0..nA−1; (¬n_s ∨ A(s,0) ∨ … ∨ A(s,nA−1)); for s ≥ 2: (¬n_s ∨ n_{s−1}).
 * Sound for completeness thresholds: a plan of m ≤ T actions, one per step in steps 1..m and the
 * rest empty, satisfies these clauses, and a single action is a valid step of every encoding.
 */
export function emitEmptyStepsLast(cnf: CnfBuilder, L: Layout): void {
  const T = L.steps;
  const n0 = cnf.newVars(T, "non-empty"); // n_s = n0 + s − 1
  const big: number[] = [];
  for (let s = 1; s <= T; s++) {
    const n = n0 + s - 1;
    big.length = 0;
    big.push(-n);
    for (let a = 0; a < L.nA; a++) {
      const x = L.action(s, a);
      cnf.add2(-x, n);
      big.push(x);
    }
    cnf.addClause(big);
    if (s >= 2) cnf.add2(-n, n - 1);
  }
}
