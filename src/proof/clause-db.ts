// The checker's clause storage: literals of every formula clause and lemma in one typed array,
// per-clause flags, and a content hash so that a deletion can find its clause without allocating.
// Literals are stored as codes 2·v + sign (a literal and its negation are neighbours: x ^ 1).

export const FLAG_ACTIVE = 1;
export const FLAG_CORE = 2;
export const FLAG_TAUT = 4;

/** DIMACS literal → code 2·v + (negative ? 1 : 0). */
export function litCode(l: number): number {
  return l > 0 ? l << 1 : (-l << 1) | 1;
}

/** Code → DIMACS literal. */
export function litOf(x: number): number {
  return x & 1 ? -(x >> 1) : x >> 1;
}

function mix(x: number): number {
  let h = Math.imul(x ^ (x >>> 16), 0x45d9f3b);
  h = Math.imul(h ^ (h >>> 16), 0x45d9f3b);
  return h ^ (h >>> 16);
}

export class ClauseDb {
  /** Literal codes of all clauses, back to back; watched literals are kept in the first two slots. */
  lits: Int32Array;
  used = 0;
  start: Int32Array;
  len: Int32Array;
  flags: Uint8Array;
  /** The clause's first literal as written (the RAT pivot), as a code; −1 for the empty clause. */
  pivot: Int32Array;
  count = 0;
  // content hash: open chaining through typed arrays (bucket heads, per-clause next and hash)
  private buckets: Int32Array;
  private hashNext: Int32Array;
  private hashOf: Int32Array;
  private stamp: Int32Array; // per literal code
  private stampNo = 0;

  constructor(maxVar: number, expectedClauses: number, expectedLits: number) {
    const cap = Math.max(16, expectedClauses);
    this.lits = new Int32Array(Math.max(64, expectedLits));
    this.start = new Int32Array(cap);
    this.len = new Int32Array(cap);
    this.flags = new Uint8Array(cap);
    this.pivot = new Int32Array(cap);
    this.hashNext = new Int32Array(cap);
    this.hashOf = new Int32Array(cap);
    let nb = 16;
    while (nb < cap) nb <<= 1;
    this.buckets = new Int32Array(nb).fill(-1);
    this.stamp = new Int32Array(2 * maxVar + 2);
  }

  /**
   * Stores n DIMACS literals src[from..from+n) as a new active clause, without duplicate
   * literals (order kept, so the pivot stays first), and indexes it by content; flags a
   * tautology. Returns the clause id.
   */
  store(src: ArrayLike<number>, from: number, n: number): number {
    if (this.count === this.start.length) this.growClauses();
    if (this.used + n > this.lits.length) {
      let size = this.lits.length * 2;
      while (this.used + n > size) size *= 2;
      const b = new Int32Array(size);
      b.set(this.lits.subarray(0, this.used));
      this.lits = b;
    }
    const id = this.count++;
    const st = ++this.stampNo;
    const stamp = this.stamp;
    const lits = this.lits;
    let m = 0;
    let taut = false;
    const at = this.used;
    for (let i = 0; i < n; i++) {
      const x = litCode(src[from + i]);
      if (stamp[x] === st) continue;
      if (stamp[x ^ 1] === st) taut = true;
      stamp[x] = st;
      lits[at + m++] = x;
    }
    this.start[id] = at;
    this.len[id] = m;
    this.used += m;
    this.flags[id] = FLAG_ACTIVE | (taut ? FLAG_TAUT : 0);
    this.pivot[id] = m > 0 ? lits[at] : -1;
    this.hashInsert(id);
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
    if (this.buckets.length < n) this.rehash(n);
  }

  private rehash(n: number): void {
    this.buckets = new Int32Array(n).fill(-1);
    const mask = n - 1;
    for (let id = 0; id < this.count; id++) {
      const b = this.hashOf[id] & mask;
      this.hashNext[id] = this.buckets[b];
      this.buckets[b] = id;
    }
  }

  /** Order-independent hash of a set of literal codes (each counted once). */
  private hashCodes(lits: Int32Array, s: number, n: number): number {
    let h = 0;
    for (let i = 0; i < n; i++) h = (h + mix(lits[s + i])) | 0;
    return (h ^ mix(n + 0x9e3779b9)) | 0;
  }

  private hashInsert(id: number): void {
    const h = this.hashCodes(this.lits, this.start[id], this.len[id]);
    this.hashOf[id] = h;
    const b = h & (this.buckets.length - 1);
    this.hashNext[id] = this.buckets[b];
    this.buckets[b] = id;
  }

  /**
   * An active clause with exactly the literal set of DIMACS literals src[from..from+n), or −1.
   * No allocation: the literals are stamped, hashed as a set and compared by stamp.
   */
  find(src: ArrayLike<number>, from: number, n: number): number {
    const st = ++this.stampNo;
    const stamp = this.stamp;
    let h = 0;
    let distinct = 0;
    for (let i = 0; i < n; i++) {
      const x = litCode(src[from + i]);
      if (stamp[x] === st) continue;
      stamp[x] = st;
      h = (h + mix(x)) | 0;
      distinct++;
    }
    h = (h ^ mix(distinct + 0x9e3779b9)) | 0;
    const lits = this.lits;
    for (let id = this.buckets[h & (this.buckets.length - 1)]; id >= 0; id = this.hashNext[id]) {
      if (this.hashOf[id] !== h || this.len[id] !== distinct || (this.flags[id] & FLAG_ACTIVE) === 0) continue;
      const s = this.start[id];
      let same = true;
      for (let i = 0; i < distinct; i++) {
        if (stamp[lits[s + i]] !== st) {
          same = false;
          break;
        }
      }
      if (same) return id;
    }
    return -1;
  }

  /** The clause as DIMACS literals, pivot first (for messages and LRAT lines). */
  dimacs(id: number): number[] {
    const s = this.start[id];
    const n = this.len[id];
    const out: number[] = [];
    const p = this.pivot[id];
    if (p >= 0) out.push(litOf(p));
    for (let i = 0; i < n; i++) if (this.lits[s + i] !== p) out.push(litOf(this.lits[s + i]));
    return out;
  }
}
