// A compact, growable CNF store: all literals in one Int32Array, clause ends in another,
// plus labelled variable ranges so any variable can be traced back to what it means.
import { poll } from "../util/limits.js";

/** The plain CNF shape the SAT module and the proof checker read. */
export interface PlainCnf {
  numVars: number;
  clauses: Int32Array[];
}

/** The zero-terminated single-array shape (the SAT module's compact CNF has these fields). */
export interface CompactClauses {
  numVars: number;
  numClauses: number;
  lits: Int32Array;
}

/** Anything clauses can be streamed into (a SAT solver, a proof checker's loader, …). */
export interface ClauseSink {
  addClause(lits: ArrayLike<number>): unknown;
}

interface VarRange {
  start: number; // first variable (inclusive)
  end: number; // last variable + 1
  label: string;
}

export class CnfBuilder {
  private lits = new Int32Array(1 << 12);
  private litCount = 0;
  private ends = new Int32Array(1 << 10);
  private clauseCount = 0;
  private varCount = 0;
  private readonly ranges: VarRange[] = [];
  /** Per variable: 1 fixed true, −1 fixed false, 0 free (null: no simplification). */
  private fixed: Int8Array | null = null;
  private readonly kept: number[] = [];

  get numVars(): number {
    return this.varCount;
  }

  get numClauses(): number {
    return this.clauseCount;
  }

  /** Total number of literal occurrences over all clauses. */
  get numLiterals(): number {
    return this.litCount;
  }

  /** Allocates `count` consecutive variables under `label`; returns the first one. */
  newVars(count: number, label: string): number {
    const first = this.varCount + 1;
    if (count <= 0) return first;
    this.varCount += count;
    const last = this.ranges[this.ranges.length - 1];
    if (last && last.label === label && last.end === first) last.end = this.varCount + 1;
    else this.ranges.push({ start: first, end: this.varCount + 1, label });
    return first;
  }

  newVar(label: string): number {
    return this.newVars(1, label);
  }

  /** The label of the range variable `v` was allocated in, or null if unknown. */
  labelOf(v: number): { label: string; start: number } | null {
    let lo = 0;
    let hi = this.ranges.length - 1;
    while (lo <= hi) {
      const mid = (lo + hi) >> 1;
      const r = this.ranges[mid];
      if (v < r.start) hi = mid - 1;
      else if (v >= r.end) lo = mid + 1;
      else return { label: r.label, start: r.start };
    }
    return null;
  }

  /**
   * From now on, simplify every added clause by the fixed values (1 true, −1 false, 0 free;
   * variables past the array's end are free): a clause with a fixed-true literal is dropped,
   * fixed-false literals are left out — unless every literal is fixed false, then the clause
   * is kept whole (so the CNF never holds an empty clause). null switches this off.
   */
  simplifyWith(fixed: Int8Array | null): void {
    this.fixed = fixed;
  }

  /** Appends the first `n` literals of `lits` as one clause (literals must name allocated variables). */
  addClause(lits: ArrayLike<number>, n: number = lits.length): void {
    poll("encoding");
    const fixed = this.fixed;
    if (fixed !== null) {
      const kept = this.kept;
      kept.length = 0;
      for (let i = 0; i < n; i++) {
        const l = lits[i];
        const v = l < 0 ? -l : l;
        const val = v < fixed.length ? fixed[v] : 0;
        if (val === 0) kept.push(l);
        else if ((val > 0) === (l > 0)) return; // satisfied by a fixed literal
      }
      if (kept.length > 0 && kept.length < n) {
        this.fixed = null;
        try {
          this.addClause(kept);
        } finally {
          this.fixed = fixed;
        }
        return;
      }
    }
    if (this.litCount + n > this.lits.length) this.lits = grow(this.lits, this.litCount + n);
    for (let i = 0; i < n; i++) {
      const l = lits[i];
      const v = l < 0 ? -l : l;
      if (v === 0 || v > this.varCount || !Number.isInteger(l)) throw new Error(`CnfBuilder: bad literal ${l}`);
      this.lits[this.litCount++] = l;
    }
    if (this.clauseCount + 1 > this.ends.length) this.ends = grow(this.ends, this.clauseCount + 1);
    this.ends[this.clauseCount++] = this.litCount;
  }

  add1(a: number): void {
    scratch[0] = a;
    this.addClause(scratch, 1);
  }

  add2(a: number, b: number): void {
    scratch[0] = a;
    scratch[1] = b;
    this.addClause(scratch, 2);
  }

  add3(a: number, b: number, c: number): void {
    scratch[0] = a;
    scratch[1] = b;
    scratch[2] = c;
    this.addClause(scratch, 3);
  }

  /** Clause i as a view into the store (valid until the next addClause). */
  clause(i: number): Int32Array {
    const start = i === 0 ? 0 : this.ends[i - 1];
    return this.lits.subarray(start, this.ends[i]);
  }

  /** Streams every clause, in order, into `sink` (views: a sink that keeps them must copy). */
  streamTo(sink: ClauseSink): void {
    let start = 0;
    for (let i = 0; i < this.clauseCount; i++) {
      const end = this.ends[i];
      sink.addClause(this.lits.subarray(start, end));
      start = end;
    }
  }

  /** One array, every clause followed by a 0 (as in DIMACS): a fresh copy, one allocation. */
  toCompact(): CompactClauses {
    const out = new Int32Array(this.litCount + this.clauseCount);
    let start = 0;
    let o = 0;
    for (let i = 0; i < this.clauseCount; i++) {
      const end = this.ends[i];
      out.set(this.lits.subarray(start, end), o);
      o += end - start + 1; // the 0 is already there
      start = end;
    }
    return { numVars: this.varCount, numClauses: this.clauseCount, lits: out };
  }

  /** The `{ numVars, clauses }` shape; clauses are views into this store, no copying. */
  toCnf(): PlainCnf {
    const clauses: Int32Array[] = new Array(this.clauseCount);
    let start = 0;
    for (let i = 0; i < this.clauseCount; i++) {
      const end = this.ends[i];
      clauses[i] = this.lits.subarray(start, end);
      start = end;
    }
    return { numVars: this.varCount, clauses };
  }
}

const scratch = new Int32Array(3);

function grow(a: Int32Array<ArrayBuffer>, need: number): Int32Array<ArrayBuffer> {
  let size = a.length * 2;
  while (size < need) size *= 2;
  const b = new Int32Array(size);
  b.set(a.subarray(0, a.length));
  return b;
}
