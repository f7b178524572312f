// Indexed tuple sets for the grounder's joins: the tuples of one predicate with lazily built
// hash indexes on any set of bound argument positions, keyed by numbers when they fit.
const MAX_EXACT = 2 ** 52;

export type Key = number | string;

export class TupleSet {
  readonly tuples: number[][] = [];
  private readonly indexes = new Map<number, Map<Key, number[]>>();
  private readonly full = new Map<Key, number>();
  private readonly numeric: boolean;

  constructor(
    readonly arity: number,
    readonly radix: number,
  ) {
    this.numeric = radix ** Math.max(arity, 1) < MAX_EXACT;
  }

  get size(): number {
    return this.tuples.length;
  }

  /** Key of `args` restricted to the positions of `mask` (ascending). */
  keyOf(args: ArrayLike<number>, mask: number): Key {
    if (this.numeric) {
      let k = 0;
      for (let p = 0; p < this.arity; p++) if (mask & (1 << p)) k = k * this.radix + args[p];
      return k;
    }
    let s = "";
    for (let p = 0; p < this.arity; p++) if (mask & (1 << p)) s += args[p] + ",";
    return s;
  }

  /** Key built from values listed in position order (what a join step has at hand). */
  keyOfValues(values: ArrayLike<number>, n: number): Key {
    if (this.numeric) {
      let k = 0;
      for (let i = 0; i < n; i++) k = k * this.radix + values[i];
      return k;
    }
    let s = "";
    for (let i = 0; i < n; i++) s += values[i] + ",";
    return s;
  }

  /** Index of the tuple equal to `args`, or -1. */
  find(args: ArrayLike<number>): number {
    return this.full.get(this.keyOf(args, (1 << this.arity) - 1)) ?? -1;
  }

  findByKey(key: Key): number {
    return this.full.get(key) ?? -1;
  }

  /** Adds a tuple; returns its index and whether it was new. */
  add(args: readonly number[]): { index: number; isNew: boolean } {
    const fk = this.keyOf(args, (1 << this.arity) - 1);
    const old = this.full.get(fk);
    if (old !== undefined) return { index: old, isNew: false };
    const index = this.tuples.length;
    this.tuples.push(args as number[]);
    this.full.set(fk, index);
    for (const [mask, idx] of this.indexes) {
      const k = this.keyOf(args, mask);
      const b = idx.get(k);
      if (b) b.push(index);
      else idx.set(k, [index]);
    }
    return { index, isNew: true };
  }

  /** The index on the positions of `mask`, built on first use and kept up to date after. */
  index(mask: number): Map<Key, number[]> {
    let idx = this.indexes.get(mask);
    if (!idx) {
      idx = new Map();
      for (let i = 0; i < this.tuples.length; i++) {
        const k = this.keyOf(this.tuples[i], mask);
        const b = idx.get(k);
        if (b) b.push(i);
        else idx.set(k, [i]);
      }
      this.indexes.set(mask, idx);
    }
    return idx;
  }
}
