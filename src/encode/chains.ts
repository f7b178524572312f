// Linear-size "no E-action together with a different R-action" constraints (spec forall-2):
// one chain of "some E-action so far" variables over the family's actions in a chosen order.
import type { CnfBuilder } from "./cnf.js";
import type { Family } from "./interference.js";

/**
 * The family's actions in chain order u_0..u_{n−1}: first E \ R, then E ∩ R, then R \ E
 * (each part ascending). In this order every forbidden pair {e, r} (e ∈ E, r ∈ R, e ≠ r) has
 * an E-member before an R-member, so one forward chain forbids them all.
 */
export interface ChainPlan {
  U: number[];
  inE: Uint8Array;
  inR: Uint8Array;
  /** chain positions [i0, i1]: i0 = first E position, i1 = last R position (null if i0 ≥ i1) */
  span: [number, number] | null;
  clauses: number;
  vars: number;
}

export function chainPlan(f: Family): ChainPlan {
  const inRset = new Set(f.R);
  const inEset = new Set(f.E);
  const U = [...f.E.filter((e) => !inRset.has(e)), ...f.E.filter((e) => inRset.has(e)), ...f.R.filter((r) => !inEset.has(r))];
  const inE = Uint8Array.from(U, (u) => (inEset.has(u) ? 1 : 0));
  const inR = Uint8Array.from(U, (u) => (inRset.has(u) ? 1 : 0));
  const i0 = inE.indexOf(1);
  const i1 = inR.lastIndexOf(1);
  const span: [number, number] | null = i0 >= 0 && i0 < i1 ? [i0, i1] : null;
  let clauses = 0;
  let vars = 0;
  if (span) {
    vars = i1 - i0;
    clauses = i1 - i0 - 1; // links
    for (let i = i0; i < i1; i++) clauses += inE[i];
    for (let i = i0 + 1; i <= i1; i++) clauses += inR[i];
  }
  return { U, inE, inR, span, clauses, vars };
}

/**
 * Emits the chain of one family at one step; `act(u)` is the step's variable of action u.
 * For i = i0 … i1 (p_i: "an E-action at a position ≤ i is taken"):
 *   if i > i0 and u_i ∈ R: (¬p_{i−1} ∨ ¬u_i);
 *   if i < i1: new variable p_i; if u_i ∈ E: (¬u_i ∨ p_i); if i > i0: (¬p_{i−1} ∨ p_i).
 */
export function emitChain(cnf: CnfBuilder, plan: ChainPlan, act: (u: number) => number): void {
  if (!plan.span) return;
  const [i0, i1] = plan.span;
  const { U, inE, inR } = plan;
  let prev = 0;
  for (let i = i0; i <= i1; i++) {
    const u = act(U[i]);
    if (i > i0 && inR[i]) cnf.add2(-prev, -u);
    if (i === i1) break;
    const p = cnf.newVar("chain");
    if (inE[i]) cnf.add2(-u, p);
    if (i > i0) cnf.add2(-prev, p);
    prev = p;
  }
}
