// Conflict analysis: first-UIP learning, recursive clause minimisation (Sorensson and Biere
// 2009), LBD (Audemard and Simon 2009), and the failed-assumption core of an unsat-under-assumptions.
import { HEADER as HEADER_, LBD_SHIFT as LBD_SHIFT_, META_LEARNT as META_LEARNT_, TIER_MASK as TIER_MASK_, TIER_SHIFT as TIER_SHIFT_, USED_MASK as USED_MASK_, USED_SHIFT as USED_SHIFT_, tierOf, type SolverState } from "./state.js";
// module-local copies: imported bindings can compile to getter calls in hot loops
const HEADER = HEADER_;
const LBD_SHIFT = LBD_SHIFT_;
const META_LEARNT = META_LEARNT_;
const TIER_MASK = TIER_MASK_;
const TIER_SHIFT = TIER_SHIFT_;
const USED_MASK = USED_MASK_;
const USED_SHIFT = USED_SHIFT_;

/** Scratch buffers reused across conflicts (no allocation per conflict). */
export class AnalyzeScratch {
  learnt = new Int32Array(16);
  size = 0;
  /** Backjump level and LBD of the last learned clause. */
  btLevel = 0;
  lbd = 0;
  stack = new Int32Array(16);
  stackPos = new Int32Array(16);
  /** Clause literals per decision level during minimisation (all zero in between). */
  perLevel = new Int32Array(16);
  toClear = new Int32Array(16);
  numClear = 0;
  /** A binary antecedent staged for the analysis loop. */
  readonly pair = new Int32Array(2);

  ensure(n: number): void {
    if (this.learnt.length >= n) return;
    let m = this.learnt.length;
    while (m < n) m *= 2;
    this.learnt = new Int32Array(m);
    this.stack = new Int32Array(m);
    this.stackPos = new Int32Array(m);
    this.perLevel = new Int32Array(m);
    this.toClear = new Int32Array(m);
  }
}

/** Marks a learned clause as used in analysis and lowers its stored LBD if it improved. */
function touchClause(s: SolverState, c: number): void {
  const arena = s.arena;
  let meta = arena[c + 1];
  if ((meta & META_LEARNT) === 0) return;
  meta = (meta & ~USED_MASK) | (2 << USED_SHIFT);
  const old = meta >>> LBD_SHIFT;
  if (old > 2) {
    const lbd = computeLbd(s, arena, c + HEADER, c + HEADER + arena[c]);
    if (lbd < old) {
      const tier = Math.min((meta & TIER_MASK) >> TIER_SHIFT, tierOf(lbd));
      meta = (meta & ((1 << LBD_SHIFT) - 1) & ~TIER_MASK) | (tier << TIER_SHIFT) | (lbd << LBD_SHIFT);
    }
  }
  arena[c + 1] = meta;
}

/** Number of distinct decision levels among lits[from..to). */
export function computeLbd(s: SolverState, lits: Int32Array, from: number, to: number): number {
  const stampArr = s.levelStamp;
  const level = s.level;
  const st = ++s.stamp;
  let n = 0;
  for (let i = from; i < to; i++) {
    const lv = level[lits[i] >> 1];
    if (stampArr[lv] !== st) {
      stampArr[lv] = st;
      n++;
    }
  }
  return n;
}

/**
 * Derives the first-UIP clause of `conflict` (as returned by propagate) into `sc.learnt`
 * (asserting literal first, a literal of the backjump level second), minimised.
 */
export function analyze(s: SolverState, conflict: number, sc: AnalyzeScratch): void {
  const arena = s.arena;
  const seen = s.seen;
  const level = s.level;
  const reason = s.reason;
  const trail = s.trail;
  const order = s.order;
  const dl = s.decisionLevel;
  sc.ensure(s.numVars + 2);
  const learnt = sc.learnt;
  let n = 1;
  let pathC = 0;
  let p = 0;
  let idx = s.trailSize - 1;
  let confl = conflict;

  for (;;) {
    // the literals of the current antecedent (all but p): a clause in the arena, or a binary
    // clause (conflict: both literals; reason: its false literal) staged in `sc.pair`
    let src: Int32Array = arena;
    let k: number;
    let end: number;
    if (confl > 0) {
      touchClause(s, confl);
      k = confl + HEADER + (p === 0 ? 0 : 1);
      end = confl + HEADER + arena[confl];
    } else {
      src = sc.pair;
      if (confl === -1) {
        src[0] = s.binConfA;
        src[1] = s.binConfB;
        k = 0;
      } else {
        src[1] = -confl;
        k = 1;
      }
      end = 2;
    }
    for (; k < end; k++) {
      const q = src[k];
      const v = q >> 1;
      if (seen[v] === 0 && level[v] > 0) {
        seen[v] = 1;
        order.bump(v);
        if (level[v] >= dl) pathC++;
        else learnt[n++] = q;
      }
    }
    // next literal of the current level on the trail
    while (seen[trail[idx] >> 1] === 0) idx--;
    p = trail[idx--];
    const v = p >> 1;
    seen[v] = 0;
    if (--pathC === 0) break;
    confl = reason[v];
  }
  learnt[0] = p ^ 1;

  // minimise: drop literals implied by the others
  const toClear = sc.toClear;
  let nc = 0;
  for (let i = 1; i < n; i++) toClear[nc++] = learnt[i];
  sc.numClear = nc;
  const perLevel = sc.perLevel;
  for (let i = 1; i < n; i++) perLevel[level[learnt[i] >> 1]]++;
  // a literal alone on its level is kept without a search: a walk from it stays on its level
  // (every implied literal has an antecedent on its own level) down to the decision
  let kept = 1;
  for (let i = 1; i < n; i++) {
    const q = learnt[i];
    if (reason[q >> 1] === 0 || perLevel[level[q >> 1]] === 1 || !redundant(s, q, sc)) learnt[kept++] = q;
  }
  for (let i = 0; i < n - 1; i++) perLevel[level[toClear[i] >> 1]] = 0; // (the original literals)
  s.minimised += n - kept;
  n = kept;
  for (let i = 0; i < sc.numClear; i++) seen[sc.toClear[i] >> 1] = 0;

  // put a literal of the highest remaining level second
  let bt = 0;
  if (n > 1) {
    let maxI = 1;
    for (let i = 2; i < n; i++) if (level[learnt[i] >> 1] > level[learnt[maxI] >> 1]) maxI = i;
    const t = learnt[1];
    learnt[1] = learnt[maxI];
    learnt[maxI] = t;
    bt = level[learnt[1] >> 1];
  }
  sc.size = n;
  sc.btLevel = bt;
  sc.lbd = computeLbd(s, learnt, 0, n);
}

/**
 * Is `lit` (false, in the learned clause) implied by other literals of the clause? A depth-first
 * walk over reasons; marks in `seen`: 1 = in the clause or shown implied by it (set when a
 * literal's walk completes), 2 = shown not implied (every literal on the path to a failure), so
 * no literal is explored twice in one minimisation. Marks are cleared via `toClear`.
 */
function redundant(s: SolverState, lit: number, sc: AnalyzeScratch): boolean {
  const arena = s.arena;
  const seen = s.seen;
  const reason = s.reason;
  const level = s.level;
  const stack = sc.stack;
  const stackPos = sc.stackPos;
  const toClear = sc.toClear;
  const perLevel = sc.perLevel; // clause literals per level: none there means not implied
  let nc = sc.numClear;
  // frame: the literal and the position of the next antecedent to look at (binary reasons:
  // 0 = their one literal not yet looked at; arena reasons: an arena index)
  let sp = 1;
  stack[0] = lit;
  stackPos[0] = firstPos(arena, reason[lit >> 1]);
  while (sp > 0) {
    const top = stack[sp - 1];
    const r = reason[top >> 1];
    let next = -1;
    if (r < 0) {
      if (stackPos[sp - 1] === 0) {
        stackPos[sp - 1] = 1;
        next = -r;
      }
    } else {
      let k = stackPos[sp - 1];
      const end = r + HEADER + arena[r];
      if (k < end) {
        next = arena[k];
        stackPos[sp - 1] = k + 1;
      }
    }
    if (next < 0) {
      // every antecedent of `top` is implied
      sp--;
      if (sp > 0) {
        seen[top >> 1] = 1;
        toClear[nc++] = top;
      }
      continue;
    }
    const v = next >> 1;
    const m = seen[v];
    if (m === 1 || level[v] === 0) continue;
    if (m === 2 || reason[v] === 0 || perLevel[level[v]] === 0) {
      for (let i = 1; i < sp; i++) {
        seen[stack[i] >> 1] = 2;
        toClear[nc++] = stack[i];
      }
      if (m === 0) {
        seen[v] = 2;
        toClear[nc++] = next;
      }
      sc.numClear = nc;
      return false;
    }
    stack[sp] = next;
    stackPos[sp] = firstPos(arena, reason[v]);
    sp++;
  }
  sc.numClear = nc;
  return true;
}

/** Start position of a reason's antecedents for `redundant` (first literal is the implied one). */
function firstPos(arena: Int32Array, r: number): number {
  return r < 0 ? 0 : r + HEADER + 1;
}

/**
 * The assumptions responsible for `failed` (an assumption found false): walks the
 * implication graph of its negation back to the assumption decisions. Returns DIMACS literals.
 */
export function analyzeFinal(s: SolverState, failed: number): number[] {
  const out = [failed];
  if (s.decisionLevel === 0) return out.map(toDimacs);
  const seen = s.seen;
  const trail = s.trail;
  const reason = s.reason;
  const level = s.level;
  const arena = s.arena;
  seen[failed >> 1] = 1;
  for (let i = s.trailSize - 1; i >= s.trailLim[0]; i--) {
    const lit = trail[i];
    const v = lit >> 1;
    if (seen[v] === 0) continue;
    const r = reason[v];
    if (r === 0) {
      out.push(lit); // an assumption decision (or the negation of `failed`, itself assumed)
    } else if (r > 0) {
      const end = r + HEADER + arena[r];
      for (let k = r + HEADER + 1; k < end; k++) {
        const u = arena[k] >> 1;
        if (level[u] > 0) seen[u] = 1;
      }
    } else {
      const u = -r >> 1;
      if (level[u] > 0) seen[u] = 1;
    }
    seen[v] = 0;
  }
  seen[failed >> 1] = 0;
  return out.map(toDimacs);
}

function toDimacs(lit: number): number {
  return lit & 1 ? -(lit >> 1) : lit >> 1;
}

