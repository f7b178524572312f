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
  toClear = new Int32Array(16);
  numClear = 0;
  pushed = false;
  /** A binary antecedent staged for the analysis loop. */
  readonly pair = new Int32Array(2);

  ensure(n: number): void {
    if (this.learnt.length >= n) return;
    let m = this.learnt.length;
    while (m < n) m *= 2;
    this.learnt = new Int32Array(m);
    this.stack = new Int32Array(m);
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
  let abstract = 0;
  for (let i = 1; i < n; i++) abstract |= 1 << (level[learnt[i] >> 1] & 31);
  let kept = 1;
  for (let i = 1; i < n; i++) {
    const q = learnt[i];
    if (reason[q >> 1] === 0 || !redundant(s, q, abstract, sc)) learnt[kept++] = q;
  }
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

/** Is `lit` (false, in the learned clause) implied by other literals marked seen? */
function redundant(s: SolverState, lit: number, abstract: number, sc: AnalyzeScratch): boolean {
  const arena = s.arena;
  const seen = s.seen;
  const reason = s.reason;
  const stack = sc.stack;
  const top = sc.numClear;
  let sp = 0;
  stack[sp++] = lit;
  while (sp > 0) {
    const r = reason[stack[--sp] >> 1];
    if (r < 0) {
      if (!visitAntecedent(s, -r, abstract, sc)) return fail(s, sc, top);
      if (sc.pushed) stack[sp++] = -r;
      continue;
    }
    const end = r + HEADER + arena[r];
    for (let k = r + HEADER + 1; k < end; k++) {
      const l = arena[k];
      if (!visitAntecedent(s, l, abstract, sc)) return fail(s, sc, top);
      if (sc.pushed) stack[sp++] = l;
    }
  }
  return true;
}

/** Looks at one antecedent literal; sets `sc.pushed` when it must be explored further. */
function visitAntecedent(s: SolverState, l: number, abstract: number, sc: AnalyzeScratch): boolean {
  const v = l >> 1;
  sc.pushed = false;
  if (s.seen[v] !== 0 || s.level[v] === 0) return true;
  if (s.reason[v] !== 0 && ((1 << (s.level[v] & 31)) & abstract) !== 0) {
    s.seen[v] = 1;
    sc.toClear[sc.numClear++] = l;
    sc.pushed = true;
    return true;
  }
  return false;
}

function fail(s: SolverState, sc: AnalyzeScratch, top: number): boolean {
  for (let i = top; i < sc.numClear; i++) s.seen[sc.toClear[i] >> 1] = 0;
  sc.numClear = top;
  return false;
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

