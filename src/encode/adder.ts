// The cost adder of spec cost-adder-1: weighted groups of literals summed by column
// compression of full and half adders, clauses in the "upward" polarity only (sum ≥ inputs).

/** "count the true literals of `lits`, times `weight`" — one term of the cost sum. */
export interface CostGroup {
  weight: number;
  lits: number[];
}

export interface AdderResult {
  /** Sum bit j (weight 2^j) as a literal; 0 means the constant false. */
  sum: number[];
  /** The largest value the inputs can sum to: Σ weight·|lits|. */
  maxSum: number;
  fullAdders: number;
  halfAdders: number;
}

interface Sink {
  newVar(label: string): number;
  add2(a: number, b: number): void;
  add3(a: number, b: number, c: number): void;
  addClause(lits: ArrayLike<number>, n?: number): void;
}

const LABEL = "adder";

/** Set bit positions of a non-negative safe integer, ascending. */
export function bitsOf(x: number): number[] {
  const out: number[] = [];
  for (let j = 0; x > 0; j++) {
    if (x % 2 === 1) out.push(j);
    x = Math.floor(x / 2);
  }
  return out;
}

/** Number of bits needed to write x in binary (0 for x = 0). */
export function bitLength(x: number): number {
  let n = 0;
  while (x > 0) {
    x = Math.floor(x / 2);
    n++;
  }
  return n;
}

class Compressor {
  fullAdders = 0;
  halfAdders = 0;
  private readonly four = new Int32Array(4);
  constructor(private readonly cnf: Sink) {}

  /** (sum, carry) with 2·carry + sum ≥ x + y + z. */
  full(x: number, y: number, z: number): [number, number] {
    const s = this.cnf.newVar(LABEL);
    const c = this.cnf.newVar(LABEL);
    this.cnf.add3(-x, -y, c);
    this.cnf.add3(-x, -z, c);
    this.cnf.add3(-y, -z, c);
    this.quad(-x, y, z, s);
    this.quad(x, -y, z, s);
    this.quad(x, y, -z, s);
    this.quad(-x, -y, -z, s);
    this.fullAdders++;
    return [s, c];
  }

  /** (sum, carry) with 2·carry + sum ≥ x + y. */
  half(x: number, y: number): [number, number] {
    const s = this.cnf.newVar(LABEL);
    const c = this.cnf.newVar(LABEL);
    this.cnf.add3(-x, -y, c);
    this.cnf.add3(-x, y, s);
    this.cnf.add3(x, -y, s);
    this.halfAdders++;
    return [s, c];
  }

  private quad(a: number, b: number, c: number, d: number): void {
    this.four[0] = a;
    this.four[1] = b;
    this.four[2] = c;
    this.four[3] = d;
    this.cnf.addClause(this.four, 4);
  }

  /**
   * Column compression: columns are FIFO queues of literals of weight 2^j. For j = 0, 1, …:
   * while ≥ 3 bits wait, the first three go into a full adder (sum to the back of column j,
   * carry to the back of column j+1); 2 left → half adder (sum is bit j, carry to j+1);
   * 1 left → it is bit j; 0 left → bit j is constant false. Trailing false bits are dropped.
   */
  compress(cols: number[][]): number[] {
    const out: number[] = [];
    for (let j = 0; j < cols.length; j++) {
      const q = cols[j];
      let h = 0;
      const carryTo = (c: number) => {
        if (cols.length === j + 1) cols.push([]);
        cols[j + 1].push(c);
      };
      while (q.length - h >= 3) {
        const [s, c] = this.full(q[h], q[h + 1], q[h + 2]);
        h += 3;
        q.push(s);
        carryTo(c);
      }
      if (q.length - h === 2) {
        const [s, c] = this.half(q[h], q[h + 1]);
        out.push(s);
        carryTo(c);
      } else out.push(q.length - h === 1 ? q[h] : 0);
    }
    while (out.length > 0 && out[out.length - 1] === 0) out.pop();
    return out;
  }
}

/**
 * Builds the sum circuit. Groups are taken in the given order; zero weights and empty
 * groups are skipped. A group whose weight is a power of two 2^k puts its literals straight
 * into column k; any other group is first counted (its literals compressed in a private
 * column 0, giving bits N_i) and N_i goes into column i + k for every set bit k of the
 * weight (k ascending, then i ascending). Finally all columns are compressed.
 */
export function buildAdder(cnf: Sink, groups: readonly CostGroup[]): AdderResult {
  const comp = new Compressor(cnf);
  const cols: number[][] = [];
  const put = (j: number, l: number) => {
    while (cols.length <= j) cols.push([]);
    cols[j].push(l);
  };
  let maxSum = 0;
  for (const g of groups) {
    if (g.weight === 0 || g.lits.length === 0) continue;
    maxSum += g.weight * g.lits.length;
    const wb = bitsOf(g.weight);
    if (wb.length === 1) {
      for (const l of g.lits) put(wb[0], l);
      continue;
    }
    const count = comp.compress([[...g.lits]]);
    for (const k of wb) for (let i = 0; i < count.length; i++) if (count[i] !== 0) put(i + k, count[i]);
  }
  if (!Number.isSafeInteger(maxSum)) throw new Error("encode: the cost sum exceeds 2^53");
  const sum = comp.compress(cols);
  return { sum, maxSum, fullAdders: comp.fullAdders, halfAdders: comp.halfAdders };
}
