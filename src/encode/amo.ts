// "At most one of these literals" constraints, shared by seq-1 (one action per step) and the
// optional mutex-group strengthening: pairwise for short lists, a sequential counter otherwise.
import type { CnfBuilder } from "./cnf.js";

/** Lists of at most this many literals are encoded pairwise (spec core-1, "AMO"). */
export const AMO_PAIRWISE_MAX = 5;

/**
 * Adds AMO(xs). n ≤ 5: every pair (¬x_i ∨ ¬x_j), i < j, in lexicographic order.
 * n ≥ 6: sequential counter (Sinz 2005) with n − 1 fresh variables s_1..s_{n−1}:
 * (¬x_1 ∨ s_1); for 1 < i < n: (¬x_i ∨ s_i), (¬s_{i−1} ∨ s_i), (¬x_i ∨ ¬s_{i−1}); (¬x_n ∨ ¬s_{n−1}).
 */
export function atMostOne(cnf: CnfBuilder, xs: readonly number[], label: string): void {
  const n = xs.length;
  if (n < 2) return;
  if (n <= AMO_PAIRWISE_MAX) {
    for (let i = 0; i < n; i++) for (let j = i + 1; j < n; j++) cnf.add2(-xs[i], -xs[j]);
    return;
  }
  const s0 = cnf.newVars(n - 1, label); // s_i = s0 + i − 1
  cnf.add2(-xs[0], s0);
  for (let i = 2; i < n; i++) {
    const si = s0 + i - 1;
    const prev = si - 1;
    cnf.add2(-xs[i - 1], si);
    cnf.add2(-prev, si);
    cnf.add2(-xs[i - 1], -prev);
  }
  cnf.add2(-xs[n - 1], -(s0 + n - 2));
}
