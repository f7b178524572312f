// Per-literal lists (watches, binary implications) kept as segments of one Int32Array,
// so millions of literals cost no JS objects and propagation walks contiguous memory.

/**
 * One growable list of int32 per literal. A full segment moves to the end of the pool with
 * twice the room; `compact` reclaims abandoned segments. Moving never happens to the list
 * being iterated (pushes go to other literals' lists), but the `data` array may be replaced
 * when the pool grows: callers re-read `data` after any push.
 */
export class WatchPool {
  data: Int32Array;
  top = 0;
  wasted = 0;
  start: Int32Array;
  size: Int32Array;
  cap: Int32Array;

  constructor(numLists: number, initialInts = 1024) {
    this.data = new Int32Array(Math.max(16, initialInts));
    this.start = new Int32Array(numLists);
    this.size = new Int32Array(numLists);
    this.cap = new Int32Array(numLists);
  }

  /** Makes room for `numLists` lists (new ones empty). */
  ensureLists(numLists: number): void {
    if (numLists <= this.start.length) return;
    let n = this.start.length * 2;
    while (n < numLists) n *= 2;
    this.start = grow(this.start, n);
    this.size = grow(this.size, n);
    this.cap = grow(this.cap, n);
  }

  /** Appends one int to list `l`. */
  push(l: number, x: number): void {
    let s = this.size[l];
    if (s === this.cap[l]) this.relocate(l, s + 1);
    this.data[this.start[l] + s] = x;
    this.size[l] = s + 1;
  }

  /** Appends two ints to list `l`. */
  push2(l: number, x: number, y: number): void {
    const s = this.size[l];
    if (s + 2 > this.cap[l]) this.relocate(l, s + 2);
    const at = this.start[l] + s;
    this.data[at] = x;
    this.data[at + 1] = y;
    this.size[l] = s + 2;
  }

  private relocate(l: number, need: number): void {
    const oldCap = this.cap[l];
    const oldStart = this.start[l];
    let cap = oldCap < 4 ? 4 : oldCap * 2;
    while (cap < need) cap *= 2;
    if (oldCap > 0 && oldStart + oldCap === this.top) {
      // last segment in the pool: extend in place
      this.reserve(cap - oldCap);
      this.top += cap - oldCap;
      this.cap[l] = cap;
      return;
    }
    this.reserve(cap);
    const at = this.top;
    this.data.copyWithin(at, oldStart, oldStart + this.size[l]);
    this.top += cap;
    this.wasted += oldCap;
    this.start[l] = at;
    this.cap[l] = cap;
  }

  private reserve(extra: number): void {
    if (this.top + extra <= this.data.length) return;
    let n = this.data.length * 2;
    while (n < this.top + extra) n *= 2;
    const d = new Int32Array(n);
    d.set(this.data.subarray(0, this.top));
    this.data = d;
  }

  /**
   * Lays out empty segments with the given room per list (ints), so that a bulk load does not
   * relocate. Does nothing unless every list is still empty.
   */
  preallocate(room: Int32Array, numLists: number): void {
    for (let l = 0; l < numLists; l++) if (this.size[l] !== 0) return;
    let total = 0;
    for (let l = 0; l < numLists; l++) total += room[l];
    this.data = new Int32Array(Math.max(16, total + (total >> 3)));
    let at = 0;
    for (let l = 0; l < numLists; l++) {
      this.start[l] = at;
      this.cap[l] = room[l];
      at += room[l];
    }
    this.top = at;
    this.wasted = 0;
  }

  /** Removes all entries of list `l` (its room stays reserved). */
  clear(l: number): void {
    this.size[l] = 0;
  }

  /** Packs all lists densely (only call when no list is being iterated). */
  compact(numLists: number): void {
    let total = 0;
    for (let l = 0; l < numLists; l++) total += this.size[l] + (this.size[l] >> 1);
    const d = new Int32Array(Math.max(16, total + (total >> 2)));
    let at = 0;
    const old = this.data;
    for (let l = 0; l < numLists; l++) {
      const s = this.size[l];
      const cap = s === 0 ? 0 : s + (s >> 1);
      if (s > 0) d.set(old.subarray(this.start[l], this.start[l] + s), at);
      this.start[l] = at;
      this.cap[l] = cap;
      at += cap;
    }
    this.data = d;
    this.top = at;
    this.wasted = 0;
  }

  /** True when more than half the pool is abandoned segments. */
  get fragmented(): boolean {
    return this.wasted > 1 << 16 && this.wasted * 2 > this.top;
  }
}

function grow(a: Int32Array, n: number): Int32Array {
  const b = new Int32Array(n);
  b.set(a);
  return b;
}
