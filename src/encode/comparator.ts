// The comparator "sum ≤ B" of spec cost-adder-1, built once for symbolic bound bits: asking
// "cost ≤ B" means assuming the enable literal and B's bits, so tightening never re-encodes.
import type { CnfBuilder } from "./cnf.js";

export interface Comparator {
  /** While false (or unassumed) the comparator constrains nothing. */
  enable: number;
  /** b_0..b_{m−1}: bit j of the bound B has weight 2^j. */
  boundBits: number[];
}

// constant literals while building; never written to the CNF
const TRUE = Number.MAX_SAFE_INTEGER;
const FALSE = -TRUE;

/**
 * Emits the comparator for sum bits S (0 = constant false) against m bound bits.
 * n = max(|S|, m); S_j = false for j ≥ |S|, B_j = false for j ≥ m; t_{n−1} = true and
 * t_j (j < n−1, fresh) means "S and B agree on every bit above j". For j = n−1 … 0:
 *   (¬enable ∨ ¬t_j ∨ ¬S_j ∨ B_j)                         — S may not exceed B at the top difference
 *   for j ≥ 1: (¬t_j ∨ ¬S_j ∨ ¬B_j ∨ t_{j−1}), (¬t_j ∨ S_j ∨ B_j ∨ t_{j−1})  — equal bit: keep going
 * Constant-true literals drop the clause, constant-false literals drop out of it.
 */
export function emitComparator(cnf: CnfBuilder, sum: readonly number[], m: number): Comparator {
  const enable = cnf.newVar("bound-enable");
  const b0 = cnf.newVars(m, "bound-bit");
  const boundBits = Array.from({ length: m }, (_, j) => b0 + j);
  const n = Math.max(sum.length, m);
  const S = (j: number) => (j < sum.length && sum[j] !== 0 ? sum[j] : FALSE);
  const B = (j: number) => (j < m ? boundBits[j] : FALSE);
  const buf: number[] = [];
  const emit = (lits: number[]) => {
    buf.length = 0;
    for (const l of lits) {
      if (l === TRUE) return;
      if (l !== FALSE) buf.push(l);
    }
    cnf.addClause(buf);
  };
  let t = TRUE;
  for (let j = n - 1; j >= 0; j--) {
    emit([-enable, -t, -S(j), B(j)]);
    if (j === 0) break;
    const next = cnf.newVar("compare");
    emit([-t, -S(j), -B(j), next]);
    emit([-t, S(j), B(j), next]);
    t = next;
  }
  return { enable, boundBits };
}

/** Assumption literals fixing the comparator to "sum ≤ B" (B must fit in the bound bits). */
export function comparatorAssumptions(c: Comparator, B: number): number[] {
  const out = [c.enable];
  let x = B;
  for (const b of c.boundBits) {
    out.push(x % 2 === 1 ? b : -b);
    x = Math.floor(x / 2);
  }
  return out;
}

/**
 * cost-prune-1 on cost-adder-1: for each lb ascending a new variable q ("prune-bound") with, for
 * each bit j of lb that is 1 (j descending), [−q, −enable, b_j, b_k for j < k < m with bit k of
 * lb 0 (ascending)] — bound bits past m are constant false and left out. q ⇒ (enable ⇒ B ≥ lb): the
 * clauses say "B ≥ lb" (the top bit where B and lb differ is 1 in B).
 */
export function comparatorAtLeast(cnf: CnfBuilder, c: Comparator, lbs: readonly number[]): number[] {
  const m = c.boundBits.length;
  return lbs.map((lb) => {
    const q = cnf.newVar("prune-bound");
    const bits: number[] = [];
    for (let x = lb; x > 0; x = Math.floor(x / 2)) bits.push(x % 2);
    for (let j = bits.length - 1; j >= 0; j--) {
      if (bits[j] !== 1) continue;
      const cl = [-q, -c.enable];
      if (j < m) cl.push(c.boundBits[j]);
      for (let k = j + 1; k < m; k++) if (k >= bits.length || bits[k] === 0) cl.push(c.boundBits[k]);
      cnf.addClause(cl);
    }
    return q;
  });
}
