// Level-0 simplification: once a variable is fixed for good, clauses it satisfies are deleted
// and literals it falsifies are removed (each change written to the proof as add-then-delete).
import { collectGarbage, deleteClause } from "./reduce.js";
import { HEADER as HEADER_, META_DELETED as META_DELETED_, META_LEARNT as META_LEARNT_, PAD as PAD_, type SolverState } from "./state.js";
// module-local copies: imported bindings can compile to getter calls in hot loops
const HEADER = HEADER_;
const META_DELETED = META_DELETED_;
const META_LEARNT = META_LEARNT_;
const PAD = PAD_;

/** Simplifies the clause database; requires decision level 0 and a propagated, conflict-free trail. */
export function simplifyAtLevel0(s: SolverState, scratch: { buf: Int32Array }): void {
  s.logUnits();
  const vals = s.vals;
  const proof = s.proof;
  // long clauses
  for (let c = HEADER; c < s.arenaTop; ) {
    const arena = s.arena;
    if (arena[c] === PAD) {
      c++;
      continue;
    }
    const size = arena[c];
    const next = c + HEADER + size;
    const meta = arena[c + 1];
    if ((meta & META_DELETED) === 0) {
      let sat = false;
      let falses = 0;
      for (let k = c + HEADER; k < next; k++) {
        const v = vals[arena[k]];
        if (v === 1) {
          sat = true;
          break;
        }
        if (v === -1) falses++;
      }
      if (sat) deleteClause(s, c);
      else if (falses > 0) shrink(s, c, size, falses, scratch);
    }
    c = next;
  }
  // binary clauses: drop those with an assigned literal (satisfied after propagation)
  const bp = s.bins;
  const bd = bp.data;
  const numLits = 2 * (s.numVars + 1);
  for (let l = 2; l < numLits; l++) {
    const st = bp.start[l];
    const end = st + bp.size[l];
    const own = vals[l];
    let j = st;
    for (let i = st; i < end; i++) {
      const q = bd[i];
      if (own === 0 && vals[q] === 0) {
        bd[j++] = q;
        continue;
      }
      if (proof !== null && l < q) {
        scratch.buf[0] = l;
        scratch.buf[1] = q;
        proof.delete(scratch.buf, 0, 2);
      }
    }
    bp.size[l] = j - st;
  }
  collectGarbage(s);
  if (bp.fragmented) bp.compact(numLits);
}

/** Removes the false literals of clause `c` (its two watches are never false here). */
function shrink(s: SolverState, c: number, size: number, falses: number, scratch: { buf: Int32Array }): void {
  const arena = s.arena;
  const vals = s.vals;
  const newSize = size - falses;
  let buf = scratch.buf;
  if (buf.length < size) buf = scratch.buf = new Int32Array(size * 2);
  let n = 0;
  for (let k = c + HEADER; k < c + HEADER + size; k++) if (vals[arena[k]] === 0) buf[n++] = arena[k];
  if (s.proof !== null) {
    s.proof.add(buf, 0, n);
    s.proof.delete(arena, c + HEADER, c + HEADER + size);
  }
  if (newSize === 2) {
    // becomes a binary clause: move it to the implication lists
    arena[c + 1] |= META_DELETED;
    s.arenaWasted += HEADER + size;
    s.addBinary(buf[0], buf[1]);
    if (arena[c + 1] & META_LEARNT) s.numLearnedBinary++;
    else s.numOriginalBinary++;
    return;
  }
  for (let i = 0; i < n; i++) arena[c + HEADER + i] = buf[i];
  // the freed tail becomes a dummy deleted clause so arena walks stay aligned
  const tail = c + HEADER + n;
  const freed = size - n;
  arena[c] = n;
  if (freed >= HEADER) {
    arena[tail] = freed - HEADER;
    arena[tail + 1] = META_DELETED;
  } else {
    arena[tail] = PAD; // a one-word hole
  }
  s.arenaWasted += freed;
}
