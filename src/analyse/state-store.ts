// A hash set of fixed-width packed states (bit vectors in Uint32 words) with dense indices,
// shared by projection exploration, explicit state graphs and measures; no per-state objects.

/** Packs a sorted list of bit positions into `out` (cleared first). */
export function packBits(bits: readonly number[], out: Uint32Array): Uint32Array {
  out.fill(0);
  for (const b of bits) out[b >>> 5] |= 1 << (b & 31);
  return out;
}

/** Bit positions set in a packed vector, ascending. */
export function unpackBits(words: Uint32Array, offset = 0, count = words.length - offset): number[] {
  const out: number[] = [];
  for (let w = 0; w < count; w++) {
    let x = words[offset + w];
    while (x !== 0) {
      const low = x & -x;
      out.push(w * 32 + (31 - Math.clz32(low)));
      x ^= low;
    }
  }
  return out;
}

export function popcount32(x: number): number {
  x = x - ((x >>> 1) & 0x55555555);
  x = (x & 0x33333333) + ((x >>> 2) & 0x33333333);
  return (((x + (x >>> 4)) & 0x0f0f0f0f) * 0x01010101) >>> 24;
}

/**
 * Set of packed states of `words` Uint32 words each. States get indices 0, 1, 2, … in
 * insertion order. Open addressing with linear probing; grows by doubling.
 */
export class PackedStateSet {
  readonly words: number;
  private data: Uint32Array;
  private table: Int32Array;
  private mask: number;
  private count = 0;

  constructor(words: number, initialCapacity = 1024) {
    this.words = Math.max(1, words);
    let cap = 16;
    while (cap < initialCapacity * 2) cap *= 2;
    this.table = new Int32Array(cap).fill(-1);
    this.mask = cap - 1;
    this.data = new Uint32Array(Math.max(16, initialCapacity) * this.words);
  }

  get size(): number {
    return this.count;
  }

  private hash(src: Uint32Array, off: number): number {
    let h = 0x811c9dc5 | 0;
    for (let i = 0; i < this.words; i++) {
      h = Math.imul(h ^ src[off + i], 0x01000193);
      h ^= h >>> 15;
    }
    h = Math.imul(h ^ (h >>> 13), 0x5bd1e995);
    return (h ^ (h >>> 16)) >>> 0;
  }

  private equalsAt(index: number, src: Uint32Array, off: number): boolean {
    const base = index * this.words;
    for (let i = 0; i < this.words; i++) if (this.data[base + i] !== src[off + i]) return false;
    return true;
  }

  /** Index of the state, or -1. */
  indexOf(src: Uint32Array, off = 0): number {
    let slot = this.hash(src, off) & this.mask;
    for (;;) {
      const idx = this.table[slot];
      if (idx < 0) return -1;
      if (this.equalsAt(idx, src, off)) return idx;
      slot = (slot + 1) & this.mask;
    }
  }

  /**
   * Adds the state if absent. Returns its index; `index === size - 1` right after the
   * call tells a new state from an old one (use `addIsNew` for clarity).
   */
  add(src: Uint32Array, off = 0): number {
    let slot = this.hash(src, off) & this.mask;
    for (;;) {
      const idx = this.table[slot];
      if (idx < 0) break;
      if (this.equalsAt(idx, src, off)) return idx;
      slot = (slot + 1) & this.mask;
    }
    const idx = this.count++;
    if (this.count * this.words > this.data.length) {
      const grown = new Uint32Array(this.data.length * 2);
      grown.set(this.data);
      this.data = grown;
    }
    const base = idx * this.words;
    for (let i = 0; i < this.words; i++) this.data[base + i] = src[off + i];
    this.table[slot] = idx;
    if (this.count * 2 > this.table.length) this.rehash();
    return idx;
  }

  private rehash(): void {
    const cap = this.table.length * 2;
    this.table = new Int32Array(cap).fill(-1);
    this.mask = cap - 1;
    for (let idx = 0; idx < this.count; idx++) {
      let slot = this.hash(this.data, idx * this.words) & this.mask;
      while (this.table[slot] >= 0) slot = (slot + 1) & this.mask;
      this.table[slot] = idx;
    }
  }

  /** A read-only view of state `index` (valid until the next add). */
  view(index: number): Uint32Array {
    return this.data.subarray(index * this.words, (index + 1) * this.words);
  }

  /** Copies state `index` into `out`. */
  copyTo(index: number, out: Uint32Array): Uint32Array {
    const base = index * this.words;
    for (let i = 0; i < this.words; i++) out[i] = this.data[base + i];
    return out;
  }

  hasBit(index: number, bit: number): boolean {
    return (this.data[index * this.words + (bit >>> 5)] & (1 << (bit & 31))) !== 0;
  }
}
