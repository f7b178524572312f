// The checker's assignment and unit propagation. Core-first: clauses already known to be needed
// (core) are propagated to a fixpoint before any other clause is looked at, and binary clauses
// before longer ones, so conflicts are found with the clauses the proof already relies on and
// the core stays small (core-first propagation in backward checking: Wetzler, Heule & Hunt 2014).
import { type ClauseDb, FLAG_ACTIVE, FLAG_CORE, FLAG_TAUT } from "./clause-db.js";
import { WatchLists } from "./watch-lists.js";

// imported flag values copied once: under a transpiling loader (tsx) every use of an imported
// binding can be a getter call, which showed up at ~9% of the backward check's profile
const ACTIVE = FLAG_ACTIVE;
const CORE = FLAG_CORE;
const TAUT = FLAG_TAUT;

/** propagate() found no conflict. */
export const NO_CONFLICT = -1;
/** A pass over a list of non-core clauses stopped after an implied literal (internal). */
const PAUSED = -2;

export class Propagator {
  readonly db: ClauseDb;
  /** Per literal code: 1 true, −1 false, 0 unassigned. */
  readonly val: Int8Array;
  /** Per variable: the clause that implied it, or −1 (assumed). */
  readonly reason: Int32Array;
  /** Per variable: its position on the trail while assigned. */
  readonly tpos: Int32Array;
  /** True literal codes in assignment order. */
  readonly trail: Int32Array;
  tlen = 0;
  // one queue head per watch-list kind: core binary, core long, other binary, other long
  private qcb = 0;
  private qcl = 0;
  private qrb = 0;
  private qrl = 0;
  /** Binary lists hold (other literal, clause); long lists hold (clause, blocking literal). */
  private readonly coreBin: WatchLists;
  private readonly coreLong: WatchLists;
  private readonly restBin: WatchLists;
  private readonly restLong: WatchLists;
  // a pass over an "other" list stops after each implied literal (the core propagates it
  // first) and resumes later where it stopped: visited i, kept j (entries in [j, i) are dropped)
  private rbI = 0;
  private rbJ = 0;
  private rlI = 0;
  private rlJ = 0;

  constructor(db: ClauseDb, maxVar: number) {
    this.db = db;
    const codes = 2 * maxVar + 2;
    this.val = new Int8Array(codes);
    this.reason = new Int32Array(maxVar + 1).fill(-1);
    this.tpos = new Int32Array(maxVar + 1);
    this.trail = new Int32Array(maxVar + 1);
    this.coreBin = new WatchLists(codes);
    this.coreLong = new WatchLists(codes);
    this.restBin = new WatchLists(codes);
    this.restLong = new WatchLists(codes);
  }

  assign(x: number, why: number): void {
    const v = x >> 1;
    this.val[x] = 1;
    this.val[x ^ 1] = -1;
    this.reason[v] = why;
    this.tpos[v] = this.tlen;
    this.trail[this.tlen++] = x;
  }

  /** Unassigns everything after the first `to` trail entries; `onUnassign` sees each variable. */
  backtrack(to: number, onUnassign?: (v: number) => void): void {
    this.settle();
    const val = this.val;
    for (let i = this.tlen - 1; i >= to; i--) {
      const x = this.trail[i];
      val[x] = 0;
      val[x ^ 1] = 0;
      this.reason[x >> 1] = -1;
      if (onUnassign) onUnassign(x >> 1);
    }
    if (to < this.tlen) this.tlen = to;
    this.qcb = this.qcl = this.qrb = this.qrl = this.tlen;
  }

  /** Restarts propagation at trail position `from` (for literals assumed from there on). */
  queueFrom(from: number): void {
    this.settle();
    this.qcb = this.qcl = this.qrb = this.qrl = from;
  }

  /**
   * Watches clause `id` (as a non-core clause) under the current assignment: two non-false
   * literals if it has them, else its only non-false literal (assigned when `allowAssign`) and
   * the most recently falsified one. Returns the clause id if it is falsified, else −1.
   */
  attach(id: number, allowAssign: boolean): number {
    const db = this.db;
    const n = db.len[id];
    if (db.flags[id] & TAUT) return NO_CONFLICT;
    if (n === 0) return id;
    const s = db.start[id];
    const lits = db.lits;
    const val = this.val;
    if (n === 1) {
      const v = val[lits[s]];
      if (v === -1) return id;
      if (v === 0 && allowAssign) this.assign(lits[s], id);
      return NO_CONFLICT;
    }
    // bring non-false literals to the front
    let k = 0;
    for (let i = 0; i < n && k < 2; i++) {
      if (val[lits[s + i]] !== -1) {
        const t = lits[s + k];
        lits[s + k] = lits[s + i];
        lits[s + i] = t;
        k++;
      }
    }
    if (k === 0) return id;
    if (k === 1) {
      // second watch: the false literal assigned last
      let best = 1;
      let bestPos = -1;
      for (let i = 1; i < n; i++) {
        const p = this.tpos[lits[s + i] >> 1];
        if (p > bestPos) {
          bestPos = p;
          best = i;
        }
      }
      const t = lits[s + 1];
      lits[s + 1] = lits[s + best];
      lits[s + best] = t;
    }
    this.watch(id, false);
    if (k === 1 && val[lits[s]] === 0 && allowAssign) this.assign(lits[s], id);
    return NO_CONFLICT;
  }

  /** Adds watch entries for clause `id` on its first two literals, in the core or other lists. */
  private watch(id: number, core: boolean): void {
    const db = this.db;
    const s = db.start[id];
    const a = db.lits[s];
    const b = db.lits[s + 1];
    if (db.len[id] === 2) {
      const w = core ? this.coreBin : this.restBin;
      w.push(a, b, id);
      w.push(b, a, id);
    } else {
      const w = core ? this.coreLong : this.restLong;
      w.push(a, id, b);
      w.push(b, id, a);
    }
  }

  /**
   * Clause `id` has just been marked core: from now on it is watched in the core lists (its
   * entries in the other lists are dropped when next visited).
   */
  promote(id: number): void {
    const db = this.db;
    if (db.len[id] >= 2 && (db.flags[id] & (TAUT | ACTIVE)) === ACTIVE) this.watch(id, true);
  }

  /**
   * Unit propagation from the queue heads to a fixpoint or a conflict: core binary clauses,
   * then core longer clauses, and only when the core is at a fixpoint the other clauses, one
   * implied literal at a time. Returns a falsified clause or −1.
   */
  propagate(): number {
    const trail = this.trail;
    for (;;) {
      if (this.qcb < this.tlen) {
        const c = this.binPass(this.coreBin, trail[this.qcb++] ^ 1, false);
        if (c >= 0) return this.stop(c);
        continue;
      }
      if (this.qcl < this.tlen) {
        const c = this.longPass(this.coreLong, trail[this.qcl++] ^ 1, false);
        if (c >= 0) return this.stop(c);
        continue;
      }
      if (this.qrb < this.tlen) {
        const c = this.binPass(this.restBin, trail[this.qrb] ^ 1, true);
        if (c >= 0) return this.stop(c);
        if (c === NO_CONFLICT) this.qrb++; // else paused: back to the core first
        continue;
      }
      if (this.qrl < this.tlen) {
        const c = this.longPass(this.restLong, trail[this.qrl] ^ 1, true);
        if (c >= 0) return this.stop(c);
        if (c === NO_CONFLICT) this.qrl++;
        continue;
      }
      return NO_CONFLICT;
    }
  }

  private stop(c: number): number {
    this.settle();
    this.qcb = this.qcl = this.qrb = this.qrl = this.tlen;
    return c;
  }

  /** Ends a paused pass: closes the gap of dropped entries in its list. */
  private settle(): void {
    if (this.rbI !== this.rbJ) this.closeGap(this.restBin, this.trail[this.qrb] ^ 1, this.rbI, this.rbJ);
    if (this.rlI !== this.rlJ) this.closeGap(this.restLong, this.trail[this.qrl] ^ 1, this.rlI, this.rlJ);
    this.rbI = this.rbJ = this.rlI = this.rlJ = 0;
  }

  private closeGap(w: WatchLists, fl: number, i: number, j: number): void {
    const ws = w.lists[fl] as Int32Array;
    const n = w.n[fl];
    for (let r = i; r < n; r++) ws[j++] = ws[r];
    w.n[fl] = j;
  }

  /**
   * Visits the binary clauses watching the false literal `fl`. In the other lists (`rest`), it
   * pauses after each implied literal (returning PAUSED) so that the core propagates it first.
   */
  private binPass(w: WatchLists, fl: number, rest: boolean): number {
    const ws = w.lists[fl];
    if (ws === null) return NO_CONFLICT;
    const n = w.n[fl];
    const val = this.val;
    const flags = this.db.flags;
    // an entry is live when its clause is active (and, in the other lists, not core)
    const live = ACTIVE;
    const mask = rest ? ACTIVE | CORE : ACTIVE;
    let i = 0;
    let j = 0;
    if (rest) {
      i = this.rbI;
      j = this.rbJ;
      this.rbI = this.rbJ = 0;
    }
    for (; i < n; i += 2) {
      const other = ws[i];
      const id = ws[i + 1];
      const v = val[other];
      if (v !== 1) {
        if ((flags[id] & mask) !== live) continue; // lazily dropped
        if (v === -1) return this.keepRest(w, ws, fl, i, j, n, id);
        ws[j++] = other;
        ws[j++] = id;
        this.assign(other, id);
        if (rest) {
          this.rbI = i + 2;
          this.rbJ = j;
          return PAUSED;
        }
        continue;
      }
      ws[j++] = other;
      ws[j++] = id;
    }
    w.n[fl] = j;
    return NO_CONFLICT;
  }

  /** Visits the longer clauses watching the false literal `fl` (two watched literals, blockers). */
  private longPass(w: WatchLists, fl: number, rest: boolean): number {
    const ws = w.lists[fl];
    if (ws === null) return NO_CONFLICT;
    const n = w.n[fl];
    const val = this.val;
    const db = this.db;
    const flags = db.flags;
    const lits = db.lits;
    const start = db.start;
    const len = db.len;
    const live = ACTIVE;
    const mask = rest ? ACTIVE | CORE : ACTIVE;
    let i = 0;
    let j = 0;
    if (rest) {
      i = this.rlI;
      j = this.rlJ;
      this.rlI = this.rlJ = 0;
    }
    for (; i < n; i += 2) {
      const id = ws[i];
      const blk = ws[i + 1];
      if (val[blk] === 1) {
        ws[j++] = id;
        ws[j++] = blk;
        continue;
      }
      if ((flags[id] & mask) !== live) continue; // lazily dropped
      const s = start[id];
      let other = lits[s];
      if (other === fl) {
        other = lits[s + 1];
        lits[s] = other;
        lits[s + 1] = fl;
      } else if (lits[s + 1] !== fl) continue; // stale entry: no longer watched here
      const ov = val[other];
      if (ov === 1) {
        ws[j++] = id;
        ws[j++] = other;
        continue;
      }
      const end = s + len[id];
      let k = s + 2;
      while (k < end && val[lits[k]] === -1) k++;
      if (k < end) {
        const nw = lits[k];
        lits[k] = fl;
        lits[s + 1] = nw;
        w.push(nw, id, other);
        continue;
      }
      if (ov === -1) return this.keepRest(w, ws, fl, i, j, n, id);
      ws[j++] = id;
      ws[j++] = other;
      this.assign(other, id);
      if (rest) {
        this.rlI = i + 2;
        this.rlJ = j;
        return PAUSED;
      }
    }
    w.n[fl] = j;
    return NO_CONFLICT;
  }

  /** Leaves a list at a conflict: keeps the entries from `i` on (unvisited) and returns `id`. */
  private keepRest(w: WatchLists, ws: Int32Array, fl: number, i: number, j: number, n: number, id: number): number {
    if (j !== i) for (let r = i; r < n; r++) ws[j++] = ws[r];
    else j = n;
    w.n[fl] = j;
    return id;
  }
}
