// Unit propagation: binary implication lists first, then two watched literals with blocking
// literals over the clause arena. The hottest loop of the solver: locals only, no allocation.
import { HEADER as HEADER_, type SolverState } from "./state.js";
// module-local copies: imported bindings can compile to getter calls in hot loops
const HEADER = HEADER_;

/**
 * Propagates the trail from `qhead`. Returns 0 when no conflict, the conflicting clause's ref
 * (> 0), or −1 for a conflicting binary clause (its literals in `binConfA`/`binConfB`).
 */
export function propagate(s: SolverState): number {
  const vals = s.vals;
  const trail = s.trail;
  const level = s.level;
  const reason = s.reason;
  const arena = s.arena;
  const bp = s.bins;
  const bdata = bp.data;
  const bstart = bp.start;
  const bsize = bp.size;
  const wp = s.watches;
  const wstart = wp.start;
  const wsize = wp.size;
  const wcap = wp.cap;
  let wd = wp.data;
  const dl = s.decisionLevel;
  let qhead = s.qhead;
  let ts = s.trailSize;
  const from = qhead;
  let conflict = 0;

  outer: while (qhead < ts) {
    const fl = trail[qhead++] ^ 1; // the literal that just became false

    // binary clauses (fl ∨ q): q must be true
    for (let bi = bstart[fl], be = bi + bsize[fl]; bi < be; bi++) {
      const q = bdata[bi];
      const vq = vals[q];
      if (vq === 1) continue;
      if (vq === -1) {
        s.binConfA = fl;
        s.binConfB = q;
        conflict = -1;
        break outer;
      }
      vals[q] = 1;
      vals[q ^ 1] = -1;
      const v = q >> 1;
      level[v] = dl;
      reason[v] = -fl;
      trail[ts++] = q;
    }

    // long clauses watching fl
    const ws = wstart[fl];
    const end = ws + wsize[fl];
    let i = ws;
    let j = ws;
    while (i < end) {
      const c = wd[i];
      const blocker = wd[i + 1];
      i += 2;
      if (vals[blocker] === 1) {
        wd[j] = c;
        wd[j + 1] = blocker;
        j += 2;
        continue;
      }
      // keep the false literal at position 1
      let first = arena[c + HEADER];
      if (first === fl) {
        first = arena[c + HEADER + 1];
        arena[c + HEADER] = first;
        arena[c + HEADER + 1] = fl;
      }
      const vf = vals[first];
      if (vf === 1) {
        wd[j] = c;
        wd[j + 1] = first;
        j += 2;
        continue;
      }
      // look for a new literal to watch
      const litEnd = c + HEADER + arena[c];
      let k = c + HEADER + 2;
      while (k < litEnd && vals[arena[k]] === -1) k++;
      if (k < litEnd) {
        const lk = arena[k];
        arena[c + HEADER + 1] = lk;
        arena[k] = fl;
        const ls = wsize[lk];
        if (ls + 2 <= wcap[lk]) {
          const at = wstart[lk] + ls;
          wd[at] = c;
          wd[at + 1] = first;
          wsize[lk] = ls + 2;
        } else {
          wp.push2(lk, c, first);
          wd = wp.data;
        }
        continue;
      }
      // unit or conflicting
      wd[j] = c;
      wd[j + 1] = first;
      j += 2;
      if (vf === -1) {
        conflict = c;
        while (i < end) wd[j++] = wd[i++];
        wsize[fl] = j - ws;
        break outer;
      }
      vals[first] = 1;
      vals[first ^ 1] = -1;
      const v = first >> 1;
      level[v] = dl;
      reason[v] = c;
      trail[ts++] = first;
    }
    wsize[fl] = j - ws;
  }

  s.propagations += ts - from;
  s.trailSize = ts;
  s.qhead = conflict === 0 ? qhead : ts;
  return conflict;
}
