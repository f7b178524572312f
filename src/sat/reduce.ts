// Learned-clause database reduction in LBD tiers (core kept, tier-2 kept while used, the
// worse half of the local tier deleted), plus watch-list cleaning and arena compaction.
import { HEADER as HEADER_, PAD as PAD_, LBD_SHIFT as LBD_SHIFT_, META_DELETED as META_DELETED_, TIER_LOCAL as TIER_LOCAL_, TIER_MASK as TIER_MASK_, TIER_MID as TIER_MID_, TIER_SHIFT as TIER_SHIFT_, USED_MASK as USED_MASK_, USED_SHIFT as USED_SHIFT_, type SolverState } from "./state.js";
// module-local copies: imported bindings can compile to getter calls in hot loops
const HEADER = HEADER_;
const PAD = PAD_;
const LBD_SHIFT = LBD_SHIFT_;
const META_DELETED = META_DELETED_;
const TIER_LOCAL = TIER_LOCAL_;
const TIER_MASK = TIER_MASK_;
const TIER_MID = TIER_MID_;
const TIER_SHIFT = TIER_SHIFT_;
const USED_MASK = USED_MASK_;
const USED_SHIFT = USED_SHIFT_;

/** Marks clause `c` deleted and writes the deletion to the proof. */
export function deleteClause(s: SolverState, c: number): void {
  const arena = s.arena;
  if (s.proof !== null) s.proof.delete(arena, c + HEADER, c + HEADER + arena[c]);
  arena[c + 1] |= META_DELETED;
  s.arenaWasted += HEADER + arena[c];
  s.deleted++;
}

/** One reduction round; call between conflicts (any decision level). */
export function reduceDb(s: SolverState): void {
  s.reductions++;
  const arena = s.arena;
  const learnts = s.learnts;
  const candidates: number[] = [];
  for (let i = 0; i < s.numLearnts; i++) {
    const c = learnts[i];
    let meta = arena[c + 1];
    if (meta & META_DELETED) continue;
    const tier = (meta & TIER_MASK) >> TIER_SHIFT;
    const used = (meta & USED_MASK) >> USED_SHIFT;
    if (used > 0) meta = (meta & ~USED_MASK) | ((used - 1) << USED_SHIFT);
    if (tier === TIER_MID && used === 0) meta = (meta & ~TIER_MASK) | (TIER_LOCAL << TIER_SHIFT);
    arena[c + 1] = meta;
    if (tier === TIER_LOCAL && used === 0 && !s.locked(c)) candidates.push(c);
  }
  // delete the half with the highest LBD (ties: longer first)
  candidates.sort((a, b) => (arena[b + 1] >>> LBD_SHIFT) - (arena[a + 1] >>> LBD_SHIFT) || arena[b] - arena[a]);
  const kill = candidates.length >> 1;
  for (let i = 0; i < kill; i++) deleteClause(s, candidates[i]);
  collectGarbage(s);
}

/** Drops deleted clauses from the watch lists and the learned list; compacts the arena when worth it. */
export function collectGarbage(s: SolverState): void {
  const compact = s.arenaWasted > (s.arenaTop >> 2);
  const old = s.arena;
  let arena = old;
  if (compact) {
    // copy live clauses into a fresh arena; the old header's size slot records the new ref
    arena = new Int32Array(Math.max(1 << 12, (s.arenaTop - s.arenaWasted) * 1.25) | 0);
    let top = HEADER;
    for (let c = HEADER; c < s.arenaTop; ) {
      if (old[c] === PAD) {
        c++;
        continue;
      }
      const size = old[c];
      const next = c + HEADER + size;
      if ((old[c + 1] & META_DELETED) === 0) {
        arena.set(old.subarray(c, next), top);
        old[c + 1] = top; // forward pointer (old arena is discarded)
        top += HEADER + size;
      } else {
        old[c + 1] = 0;
      }
      c = next;
    }
    s.arena = arena;
    s.arenaTop = top;
    s.arenaWasted = 0;
    // reasons of assigned variables
    const reason = s.reason;
    const trail = s.trail;
    for (let i = 0; i < s.trailSize; i++) {
      const v = trail[i] >> 1;
      const r = reason[v];
      if (r > 0) reason[v] = old[r + 1];
    }
  }
  // watches
  const wp = s.watches;
  const wd = wp.data;
  const numLits = 2 * (s.numVars + 1);
  for (let l = 2; l < numLits; l++) {
    const st = wp.start[l];
    const end = st + wp.size[l];
    let j = st;
    for (let i = st; i < end; i += 2) {
      const c = wd[i];
      if (compact) {
        const nc = old[c + 1];
        if (nc === 0) continue;
        wd[j] = nc;
      } else {
        if (old[c + 1] & META_DELETED) continue;
        wd[j] = c;
      }
      wd[j + 1] = wd[i + 1];
      j += 2;
    }
    wp.size[l] = j - st;
  }
  if (wp.fragmented) wp.compact(numLits);
  // learned list
  let k = 0;
  const learnts = s.learnts;
  for (let i = 0; i < s.numLearnts; i++) {
    const c = learnts[i];
    if (compact) {
      const nc = old[c + 1];
      if (nc !== 0) learnts[k++] = nc;
    } else if ((old[c + 1] & META_DELETED) === 0) learnts[k++] = c;
  }
  s.numLearnts = k;
}
