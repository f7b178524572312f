// Stores every state a search meets, packed in one growing Uint32Array, and finds a
// state's id by open-addressing hash lookup (linear probing) — no string keys anywhere.
import { hashWords } from "./bitstate.js";

export class StateTable {
  readonly words: number;
  /** Packed states: state i occupies arena[i*words .. (i+1)*words). */
  arena: Uint32Array;
  private hashes: Uint32Array;
  private slots: Int32Array; // state id + 1, 0 = empty
  private mask: number;
  private n = 0;

  constructor(words: number, initialCapacity = 1024) {
    this.words = words;
    const cap = Math.max(16, initialCapacity);
    this.arena = new Uint32Array(cap * words);
    this.hashes = new Uint32Array(cap);
    let size = 32;
    while (size < cap * 2) size *= 2;
    this.slots = new Int32Array(size);
    this.mask = size - 1;
  }

  get size(): number {
    return this.n;
  }

  get bytes(): number {
    return this.arena.byteLength + this.hashes.byteLength + this.slots.byteLength;
  }

  /** Offset of state `id` in `arena` (re-read `arena` after an insert: it may have grown). */
  offset(id: number): number {
    return id * this.words;
  }

  /**
   * Returns the id of the state in buf[bufOff..]; inserts it if new. `isNew` tells which.
   */
  isNew = false;
  intern(buf: Uint32Array, bufOff: number): number {
    const W = this.words;
    const h = hashWords(buf, bufOff, W);
    let i = h & this.mask;
    const arena = this.arena;
    for (;;) {
      const slot = this.slots[i];
      if (slot === 0) break;
      const id = slot - 1;
      if (this.hashes[id] === h) {
        const o = id * W;
        let same = true;
        for (let w = 0; w < W; w++) {
          if (arena[o + w] !== buf[bufOff + w]) {
            same = false;
            break;
          }
        }
        if (same) {
          this.isNew = false;
          return id;
        }
      }
      i = (i + 1) & this.mask;
    }
    const id = this.n;
    if (id === this.hashes.length) this.growStates();
    const o = id * W;
    for (let w = 0; w < W; w++) this.arena[o + w] = buf[bufOff + w];
    this.hashes[id] = h;
    this.slots[i] = id + 1;
    this.n++;
    if (this.n * 2 > this.slots.length) this.rehash();
    this.isNew = true;
    return id;
  }

  private growStates(): void {
    const cap = this.hashes.length * 2;
    const arena = new Uint32Array(cap * this.words);
    arena.set(this.arena);
    this.arena = arena;
    const hashes = new Uint32Array(cap);
    hashes.set(this.hashes);
    this.hashes = hashes;
  }

  private rehash(): void {
    const size = this.slots.length * 2;
    const slots = new Int32Array(size);
    const mask = size - 1;
    for (let id = 0; id < this.n; id++) {
      let i = this.hashes[id] & mask;
      while (slots[i] !== 0) i = (i + 1) & mask;
      slots[i] = id + 1;
    }
    this.slots = slots;
    this.mask = mask;
  }
}

/** A Float64Array / Int32Array that doubles when written past its end. */
export class GrowF64 {
  a: Float64Array;
  constructor(n = 1024, readonly fill = 0) {
    this.a = new Float64Array(n).fill(fill);
  }
  ensure(i: number): void {
    if (i < this.a.length) return;
    let n = this.a.length * 2;
    while (n <= i) n *= 2;
    const b = new Float64Array(n).fill(this.fill);
    b.set(this.a);
    this.a = b;
  }
}

export class GrowI32 {
  a: Int32Array;
  constructor(n = 1024, readonly fill = 0) {
    this.a = new Int32Array(n).fill(fill);
  }
  ensure(i: number): void {
    if (i < this.a.length) return;
    let n = this.a.length * 2;
    while (n <= i) n *= 2;
    const b = new Int32Array(n).fill(this.fill);
    b.set(this.a);
    this.a = b;
  }
}
