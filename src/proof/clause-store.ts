// The checker's clause database and top-level assignment: clause storage with a content hash
// (deletions name clauses by their literals), two-watched-literal propagation, RUP and RAT tests,
// and core marking. Written independently of src/sat: DIMACS-signed literals, plain arrays.

export const FLAG_ACTIVE = 1;
export const FLAG_CORE = 2;
export const FLAG_TAUT = 4;

function mix(x: number): number {
  let h = Math.imul(x ^ (x >>> 16), 0x45d9f3b);
  h = Math.imul(h ^ (h >>> 16), 0x45d9f3b);
  return h ^ (h >>> 16);
}

export class ClauseStore {
  readonly nv: number;
  // clauses
  lits: Int32Array;
  used = 0;
  start: Int32Array;
  len: Int32Array;
  flags: Uint8Array;
  pivot: Int32Array;
  count = 0;
  private hashHead = new Map<number, number>();
  private hashNext: Int32Array;
  private hashOf: Int32Array;
  // assignment: literal values indexed by literal + nv (1 true, −1 false, 0 unassigned)
  lv: Int8Array;
  reason: Int32Array;
  /** Trail position of each assigned variable. */
  tpos: Int32Array;
  trail: Int32Array;
  tlen = 0;
  qhead = 0;
  /** Per literal (index literal + nv): pairs (clause id, blocking literal); `wn` holds the lengths. */
  wl: (Int32Array | null)[];
  wn: Int32Array;
  lastConflict = -1;
  private stamp: Int32Array; // per literal (index lit + nv)
  private stampNo = 0;
  private seen: Uint8Array;
  /** Top-level variables whose whole chain of reasons is already marked core. */
  private chainMarked: Uint8Array;
  private stack: number[] = [];

  constructor(maxVar: number, expectedClauses: number) {
    this.nv = maxVar;
    const cap = Math.max(16, expectedClauses);
    this.lits = new Int32Array(cap * 4);
    this.start = new Int32Array(cap);
    this.len = new Int32Array(cap);
    this.flags = new Uint8Array(cap);
    this.pivot = new Int32Array(cap);
    this.hashNext = new Int32Array(cap);
    this.hashOf = new Int32Array(cap);
    this.lv = new Int8Array(2 * maxVar + 1);
    this.reason = new Int32Array(maxVar + 1).fill(-1);
    this.trail = new Int32Array(maxVar + 1);
    this.tpos = new Int32Array(maxVar + 1);
    this.wl = new Array<Int32Array | null>(2 * maxVar + 1).fill(null);
    this.wn = new Int32Array(2 * maxVar + 1);
    this.stamp = new Int32Array(2 * maxVar + 1);
    this.seen = new Uint8Array(maxVar + 1);
    this.chainMarked = new Uint8Array(maxVar + 1);
  }

  /** 1 if literal l is true, −1 if false, 0 if unassigned. */
  val(l: number): number {
    return this.lv[l + this.nv];
  }

  // ---- storage ------------------------------------------------------------------------

  /** Stores src[from..from+n) without duplicate literals (order kept, so the pivot stays first). */
  store(src: ArrayLike<number>, from: number, n: number): number {
    if (this.count === this.start.length) this.growClauses();
    while (this.used + n > this.lits.length) {
      const b = new Int32Array(this.lits.length * 2);
      b.set(this.lits);
      this.lits = b;
    }
    const id = this.count++;
    const st = ++this.stampNo;
    const nv = this.nv;
    let m = 0;
    let taut = false;
    const at = this.used;
    for (let i = 0; i < n; i++) {
      const l = src[from + i];
      if (this.stamp[l + nv] === st) continue;
      if (this.stamp[-l + nv] === st) taut = true;
      this.stamp[l + nv] = st;
      this.lits[at + m++] = l;
    }
    this.start[id] = at;
    this.len[id] = m;
    this.used += m;
    this.flags[id] = FLAG_ACTIVE | (taut ? FLAG_TAUT : 0);
    this.pivot[id] = m > 0 ? this.lits[at] : 0;
    return id;
  }

  private growClauses(): void {
    const n = this.start.length * 2;
    const g32 = (a: Int32Array) => {
      const b = new Int32Array(n);
      b.set(a);
      return b;
    };
    this.start = g32(this.start);
    this.len = g32(this.len);
    this.pivot = g32(this.pivot);
    this.hashNext = g32(this.hashNext);
    this.hashOf = g32(this.hashOf);
    const f = new Uint8Array(n);
    f.set(this.flags);
    this.flags = f;
  }

  private hashLits(src: ArrayLike<number>, from: number, n: number, dedupe: boolean): number {
    let h = 0;
    let k = 0;
    const st = ++this.stampNo;
    for (let i = 0; i < n; i++) {
      const l = src[from + i];
      if (dedupe) {
        if (this.stamp[l + this.nv] === st) continue;
        this.stamp[l + this.nv] = st;
      }
      h = (h + mix(l)) | 0;
      k++;
    }
    return (h ^ mix(k + 0x9e3779b9)) | 0;
  }

  hashInsert(id: number): void {
    const h = this.hashLits(this.lits, this.start[id], this.len[id], false);
    this.hashOf[id] = h;
    const head = this.hashHead.get(h);
    this.hashNext[id] = head === undefined ? -1 : head;
    this.hashHead.set(h, id);
  }

  /** An active clause with exactly the literals of src[from..from+n), or −1. */
  find(src: ArrayLike<number>, from: number, n: number): number {
    const h = this.hashLits(src, from, n, true);
    // the literal set is stamped now; count its distinct literals
    const st = this.stampNo;
    let distinct = 0;
    const nv = this.nv;
    for (let i = 0; i < n; i++) {
      const l = src[from + i];
      if (this.stamp[l + nv] === st) {
        this.stamp[l + nv] = st - 1; // count each once
        distinct++;
      }
    }
    const st2 = ++this.stampNo;
    for (let i = 0; i < n; i++) this.stamp[src[from + i] + nv] = st2;
    for (let id = this.hashHead.get(h) ?? -1; id >= 0; id = this.hashNext[id]) {
      if ((this.flags[id] & FLAG_ACTIVE) === 0 || this.len[id] !== distinct || this.hashOf[id] !== h) continue;
      const s = this.start[id];
      let same = true;
      for (let i = 0; i < distinct; i++) {
        if (this.stamp[this.lits[s + i] + nv] !== st2) {
          same = false;
          break;
        }
      }
      if (same) return id;
    }
    return -1;
  }

  /** Is clause `id` the reason of a current assignment? (Its implied literal is one of its first two.) */
  isReason(id: number): boolean {
    const s = this.start[id];
    for (let i = 0; i < 2 && i < this.len[id]; i++) {
      const l = this.lits[s + i];
      if (this.reason[l < 0 ? -l : l] === id && this.val(l) === 1) return true;
    }
    return false;
  }

  // ---- assignment -----------------------------------------------------------------------

  private assign(l: number, why: number): void {
    const v = l < 0 ? -l : l;
    this.lv[l + this.nv] = 1;
    this.lv[-l + this.nv] = -1;
    this.reason[v] = why;
    this.tpos[v] = this.tlen;
    this.trail[this.tlen++] = l;
  }

  /** Unassigns everything after the first `to` trail entries. */
  backtrack(to: number): void {
    for (let i = this.tlen - 1; i >= to; i--) {
      const l = this.trail[i];
      const v = l < 0 ? -l : l;
      this.lv[v + this.nv] = 0;
      this.lv[-v + this.nv] = 0;
      this.reason[v] = -1;
      this.chainMarked[v] = 0;
    }
    if (to < this.tlen) this.tlen = to;
    this.qhead = this.tlen;
  }

  private trailPos(l: number): number {
    return this.tpos[l < 0 ? -l : l];
  }

  /**
   * Watches clause `id` under the current assignment: two non-false literals if it has them,
   * else its only non-false literal (assigned if unassigned) and the most recently falsified one.
   * Returns the id of a falsified clause (conflict) or −1.
   */
  private attach(id: number, allowAssign: boolean): number {
    const n = this.len[id];
    if (this.flags[id] & FLAG_TAUT) return -1;
    if (n === 0) return id;
    const s = this.start[id];
    const lits = this.lits;
    if (n === 1) {
      const v = this.val(lits[s]);
      if (v === -1) return id;
      if (v === 0 && allowAssign) this.assign(lits[s], id);
      return -1;
    }
    // bring non-false literals to the front
    let k = 0;
    for (let i = 0; i < n && k < 2; i++) {
      if (this.val(lits[s + i]) !== -1) {
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
        const p = this.trailPos(lits[s + i]);
        if (p > bestPos) {
          bestPos = p;
          best = i;
        }
      }
      const t = lits[s + 1];
      lits[s + 1] = lits[s + best];
      lits[s + best] = t;
    }
    // binary clauses are marked by a complemented id: the blocker is then the other literal
    const tag = n === 2 ? ~id : id;
    this.watch(lits[s], tag, lits[s + 1]);
    this.watch(lits[s + 1], tag, lits[s]);
    if (k === 1 && this.val(lits[s]) === 0 && allowAssign) this.assign(lits[s], id);
    return -1;
  }

  private watch(l: number, id: number, blocker: number): void {
    const k = l + this.nv;
    const n = this.wn[k];
    let a = this.wl[k];
    if (a === null || n + 2 > a.length) {
      const b = new Int32Array(n < 4 ? 8 : n * 2);
      if (a !== null) b.set(a.subarray(0, n));
      this.wl[k] = a = b;
    }
    a[n] = id;
    a[n + 1] = blocker;
    this.wn[k] = n + 2;
  }

  /** Adds clause `id` to the top level and propagates; returns a conflicting clause id or −1. */
  attachAndPropagate(id: number): number {
    let c = this.attach(id, true);
    if (c < 0) c = this.propagate();
    this.lastConflict = c;
    return c;
  }

  /** Re-watches a clause whose deletion is undone (backward pass); it cannot be unit here. */
  reattach(id: number): void {
    if (this.len[id] >= 2) this.attach(id, false);
  }

  /**
   * Unit propagation from `qhead`; returns a conflicting clause id or −1. Watch lists hold
   * pairs (clause id, blocking literal); a true blocker spares a visit to the clause.
   */
  propagate(): number {
    const lits = this.lits;
    const nv = this.nv;
    const lv = this.lv;
    const flags = this.flags;
    const start = this.start;
    const len = this.len;
    const wl = this.wl;
    const wn = this.wn;
    while (this.qhead < this.tlen) {
      const fl = -this.trail[this.qhead++];
      const ws = wl[fl + nv];
      if (ws === null) continue;
      const n = wn[fl + nv];
      let j = 0;
      for (let i = 0; i < n; i += 2) {
        const id = ws[i];
        const blk = ws[i + 1];
        const vb = lv[blk + nv];
        if (vb === 1) {
          // satisfied by the blocker (a stale or inactive entry kept here is dropped later)
          ws[j++] = id;
          ws[j++] = blk;
          continue;
        }
        if (id < 0) {
          // binary clause (fl ∨ blk): no need to look at the clause itself
          const cid = ~id;
          if ((flags[cid] & FLAG_ACTIVE) === 0) continue;
          ws[j++] = id;
          ws[j++] = blk;
          if (vb === -1) return this.stopAtConflict(ws, fl + nv, i, j, n, cid);
          this.assign(blk, cid);
          continue;
        }
        if ((flags[id] & FLAG_ACTIVE) === 0) continue; // lazily dropped
        const s = start[id];
        let other = lits[s];
        if (other === fl) {
          other = lits[s + 1];
          lits[s] = other;
          lits[s + 1] = fl;
        } else if (lits[s + 1] !== fl) continue; // stale entry: no longer watched here
        const ov = lv[other + nv];
        if (ov === 1) {
          ws[j++] = id;
          ws[j++] = other;
          continue;
        }
        const end = s + len[id];
        let k = s + 2;
        while (k < end && lv[lits[k] + nv] === -1) k++;
        if (k < end) {
          const w = lits[k];
          lits[k] = fl;
          lits[s + 1] = w;
          this.watch(w, id, other);
          continue;
        }
        ws[j++] = id;
        ws[j++] = other;
        if (ov === -1) return this.stopAtConflict(ws, fl + nv, i, j, n, id);
        this.assign(other, id);
      }
      wn[fl + nv] = j;
    }
    return -1;
  }

  /** Ends propagation at a conflict: keeps the unvisited watch entries and returns the clause. */
  private stopAtConflict(ws: Int32Array, key: number, i: number, j: number, n: number, id: number): number {
    for (let r = i + 2; r < n; r++) ws[j++] = ws[r];
    this.wn[key] = j;
    this.qhead = this.tlen;
    return id;
  }

  // ---- RUP, RAT, core ---------------------------------------------------------------------

  /** Is src[from..from+n) implied by unit propagation? Marks the clauses used when asked. */
  rup(src: ArrayLike<number>, from: number, n: number, markCore: boolean): boolean {
    const saved = this.tlen;
    for (let i = 0; i < n; i++) {
      const l = src[from + i];
      if (this.val(l) === 1) {
        if (markCore) this.markFromVar(l < 0 ? -l : l, saved);
        return true;
      }
    }
    for (let i = 0; i < n; i++) {
      const l = src[from + i];
      if (this.val(l) === 0) this.assign(-l, -1);
    }
    this.qhead = saved;
    const c = this.propagate();
    if (c >= 0 && markCore) this.markConflict(c, saved);
    this.backtrack(saved);
    return c >= 0;
  }

  /** RAT on `pivot` for lemma `id`: null if every resolvent is RUP, else the clause that fails. */
  ratCounterexample(id: number, pivot: number, markCore: boolean): number[] | null {
    const s = this.start[id];
    const n = this.len[id];
    const buf: number[] = [];
    for (let d = 0; d < this.count; d++) {
      if (d === id || (this.flags[d] & FLAG_ACTIVE) === 0 || this.flags[d] & FLAG_TAUT) continue;
      const ds = this.start[d];
      const dn = this.len[d];
      let has = false;
      for (let i = 0; i < dn; i++) if (this.lits[ds + i] === -pivot) has = true;
      if (!has) continue;
      buf.length = 0;
      for (let i = 0; i < n; i++) buf.push(this.lits[s + i]);
      let taut = false;
      for (let i = 0; i < dn; i++) {
        const l = this.lits[ds + i];
        if (l === -pivot) continue;
        if (buf.includes(-l)) taut = true;
        buf.push(l);
      }
      if (taut) continue;
      if (!this.rup(buf, 0, buf.length, markCore)) return Array.from(this.lits.subarray(ds, ds + dn));
    }
    return null;
  }

  /**
   * Marks clause `c` and, transitively, the reasons of its literals as core. Variables on the
   * first `topLen` trail entries are remembered as fully marked (their reasons cannot change
   * while they stay assigned), so later markings stop there.
   */
  markConflict(c: number, topLen: number = this.tlen): void {
    if (c < 0) return;
    this.flags[c] |= FLAG_CORE;
    const s = this.start[c];
    for (let i = 0; i < this.len[c]; i++) this.pushVar(this.lits[s + i]);
    this.drainMarks(topLen);
  }

  private markFromVar(v: number, topLen: number): void {
    this.pushVar(v);
    this.drainMarks(topLen);
  }

  private pushVar(l: number): void {
    const v = l < 0 ? -l : l;
    if (this.seen[v] || this.chainMarked[v]) return;
    this.seen[v] = 1;
    this.stack.push(v);
  }

  private drainMarks(topLen: number): void {
    const visited: number[] = [];
    while (this.stack.length > 0) {
      const v = this.stack.pop() as number;
      visited.push(v);
      const r = this.reason[v];
      if (r < 0) continue;
      this.flags[r] |= FLAG_CORE;
      const s = this.start[r];
      for (let i = 0; i < this.len[r]; i++) this.pushVar(this.lits[s + i]);
    }
    for (const v of visited) {
      this.seen[v] = 0;
      if (this.lv[v + this.nv] !== 0 && this.tpos[v] < topLen) this.chainMarked[v] = 1;
    }
  }
}
