// The solver's data: assignment, trail, reasons, clause arena and watch pools, all in typed
// arrays; plus the few primitive operations (assign, backtrack, clause allocation) others build on.
import type { ProofSink } from "./types.js";
import { VarOrder } from "./var-order.js";
import { WatchPool } from "./watch-pool.js";

// Clause layout in the arena: [size, meta, lit0, lit1, ...]. Refs start at 2 so 0 means "none".
export const HEADER = 2;
/** Size slot value of a one-word hole left by shrinking a clause. */
export const PAD = -1;
export const META_LEARNT = 1;
export const META_DELETED = 2;
export const USED_SHIFT = 2; // 2 bits: recently used in conflict analysis
export const USED_MASK = 3 << USED_SHIFT;
export const TIER_SHIFT = 4; // 2 bits: 0 core, 1 tier2, 2 local (learned clauses only)
export const TIER_MASK = 3 << TIER_SHIFT;
export const LBD_SHIFT = 6;

export const TIER_CORE = 0;
export const TIER_MID = 1;
export const TIER_LOCAL = 2;

/** LBD tier boundaries (Oh 2015: core ≤ 2, tier2 ≤ 6, local otherwise). */
export function tierOf(lbd: number): number {
  return lbd <= 2 ? TIER_CORE : lbd <= 6 ? TIER_MID : TIER_LOCAL;
}

export class SolverState {
  numVars = 0;
  capacity = 0;
  /** Per literal (2·var + sign): 1 true, −1 false, 0 unassigned. */
  vals = new Int8Array(2);
  level = new Int32Array(1);
  /** 0 none (decision / level-0 unit), > 0 arena ref, < 0 binary clause: −(its false literal). */
  reason = new Int32Array(1);
  trail = new Int32Array(1);
  trailSize = 0;
  qhead = 0;
  trailLim = new Int32Array(1);
  decisionLevel = 0;
  /** Saved phase per variable: the sign bit of the last value (1 = negative). */
  phase = new Uint8Array(1);
  /** Target phases (stable mode): the values of the largest conflict-free trail seen lately. */
  target = new Uint8Array(1);
  targetSize = 0;
  seen = new Uint8Array(1);
  levelStamp = new Int32Array(1);
  stamp = 0;

  order = new VarOrder(0);
  watches = new WatchPool(2);
  bins = new WatchPool(2);

  arena = new Int32Array(1 << 12);
  arenaTop = HEADER;
  arenaWasted = 0;
  learnts = new Int32Array(64);
  numLearnts = 0;
  numOriginal = 0;
  numOriginalBinary = 0;
  numLearnedBinary = 0;

  /** Binary conflict literals when propagate returns −1. */
  binConfA = 0;
  binConfB = 0;

  proof: ProofSink | null = null;
  /** Level-0 trail prefix already written to the proof as unit lemmas. */
  unitsLogged = 0;
  ok = true;

  // statistics
  conflicts = 0;
  decisions = 0;
  propagations = 0;
  restarts = 0;
  reductions = 0;
  deleted = 0;
  learnedUnits = 0;
  minimised = 0;

  /** Grows every per-variable array to hold variables 1..n. */
  ensureVars(n: number): void {
    if (n <= this.capacity) {
      if (n > this.numVars) this.addVarsToOrder(n);
      return;
    }
    let cap = Math.max(16, this.capacity * 2);
    while (cap < n) cap *= 2;
    this.vals = growI8(this.vals, 2 * (cap + 1));
    this.level = growI32(this.level, cap + 1);
    this.reason = growI32(this.reason, cap + 1);
    this.trail = growI32(this.trail, cap + 1);
    this.trailLim = growI32(this.trailLim, cap + 1);
    const ph = new Uint8Array(cap + 1).fill(1);
    ph.set(this.phase.subarray(0, this.capacity + 1));
    this.phase = ph;
    const tg = new Uint8Array(cap + 1).fill(1);
    tg.set(this.target.subarray(0, this.capacity + 1));
    this.target = tg;
    this.seen = growU8(this.seen, cap + 1);
    this.levelStamp = growI32(this.levelStamp, cap + 2);
    this.order.grow(cap);
    this.watches.ensureLists(2 * (cap + 1));
    this.bins.ensureLists(2 * (cap + 1));
    this.capacity = cap;
    this.addVarsToOrder(n);
  }

  private addVarsToOrder(n: number): void {
    for (let v = this.numVars + 1; v <= n; v++) this.order.insert(v);
    this.numVars = n;
  }

  /** Makes `lit` true at the current level with the given reason. */
  assign(lit: number, why: number): void {
    this.vals[lit] = 1;
    this.vals[lit ^ 1] = -1;
    const v = lit >> 1;
    this.level[v] = this.decisionLevel;
    this.reason[v] = why;
    this.trail[this.trailSize++] = lit;
  }

  newDecisionLevel(): void {
    this.trailLim[this.decisionLevel++] = this.trailSize;
  }

  /** Undoes all assignments above `lvl`, saving phases and returning variables to the order. */
  cancelUntil(lvl: number): void {
    if (this.decisionLevel <= lvl) return;
    const trail = this.trail;
    const vals = this.vals;
    const phase = this.phase;
    const order = this.order;
    const stop = this.trailLim[lvl];
    for (let i = this.trailSize - 1; i >= stop; i--) {
      const lit = trail[i];
      vals[lit] = 0;
      vals[lit ^ 1] = 0;
      const v = lit >> 1;
      phase[v] = lit & 1;
      if (order.pos[v] < 0) order.insert(v);
    }
    this.trailSize = stop;
    this.qhead = stop;
    this.decisionLevel = lvl;
  }

  /** Copies `lits[0..n)` into a new arena clause and returns its ref. */
  allocClause(lits: ArrayLike<number>, n: number, meta: number): number {
    const need = this.arenaTop + HEADER + n;
    if (need > this.arena.length) {
      let len = this.arena.length * 2;
      while (len < need) len *= 2;
      const a = new Int32Array(len);
      a.set(this.arena.subarray(0, this.arenaTop));
      this.arena = a;
    }
    const c = this.arenaTop;
    const arena = this.arena;
    arena[c] = n;
    arena[c + 1] = meta;
    for (let i = 0; i < n; i++) arena[c + HEADER + i] = lits[i];
    this.arenaTop = need;
    return c;
  }

  /** Watches the first two literals of clause `c`. */
  attach(c: number): void {
    const l0 = this.arena[c + HEADER];
    const l1 = this.arena[c + HEADER + 1];
    this.watches.push2(l0, c, l1);
    this.watches.push2(l1, c, l0);
  }

  addBinary(a: number, b: number): void {
    this.bins.push(a, b);
    this.bins.push(b, a);
  }

  pushLearnt(c: number): void {
    if (this.numLearnts === this.learnts.length) this.learnts = growI32(this.learnts, this.learnts.length * 2);
    this.learnts[this.numLearnts++] = c;
  }

  /** Is clause `c` the reason of its first literal's current assignment? */
  locked(c: number): boolean {
    const l0 = this.arena[c + HEADER];
    return this.vals[l0] === 1 && this.reason[l0 >> 1] === c;
  }

  /** Writes level-0 assignments not yet in the proof as unit lemmas (before any deletion). */
  logUnits(): void {
    const proof = this.proof;
    const end = this.decisionLevel === 0 ? this.trailSize : this.trailLim[0];
    if (proof !== null) {
      // units with no reason came from unit clauses (original, or learned and already logged)
      for (let i = this.unitsLogged; i < end; i++) if (this.reason[this.trail[i] >> 1] !== 0) proof.add(this.trail, i, i + 1);
    }
    this.unitsLogged = end;
  }
}

export function growI32(a: Int32Array, n: number): Int32Array<ArrayBuffer> {
  const b = new Int32Array(n);
  b.set(a.subarray(0, Math.min(a.length, n)));
  return b;
}

function growI8(a: Int8Array, n: number): Int8Array<ArrayBuffer> {
  const b = new Int8Array(n);
  b.set(a);
  return b;
}

function growU8(a: Uint8Array, n: number): Uint8Array<ArrayBuffer> {
  const b = new Uint8Array(n);
  b.set(a);
  return b;
}
