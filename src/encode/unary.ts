// Cost encoding cost-unary-1 (spec encodings/cost-unary-1.md): a saturating prefix counter over
// step-exclusive action groups, whose outputs o_j ("cost ≥ j") make "cost ≤ B" one literal ¬o_{B+1}.

/** One input of the counter: at most one of its literals is true in any model (the caller's clauses guarantee it). */
export interface UnaryInput {
  /** lits[i] true means the input contributes values[i]; values positive, lits listed by ascending value. */
  values: number[];
  lits: number[];
}

export interface UnaryResult {
  /** outputs[j − 1] is the literal of "sum ≥ j" for j = 1..cap (0 = constant false). */
  outputs: number[];
  /** Σ over inputs of its largest value: the largest sum any model can have. */
  maxSum: number;
  /** Prefix layers built (inputs with at least one literal). */
  layers: number;
}

interface Sink {
  newVar(label: string): number;
  addClause(lits: ArrayLike<number>, n?: number): void;
}

/**
 * Value words, then the counter (spec cost-unary-1, "Counter"). For each input in order, with at
 * least one literal: for each distinct value v ascending, the word E_v is the input's only literal
 * of value v, or a new variable with (¬x ∨ E_v) for each such literal x (in order). Then new
 * variables N_1..N_m, m = min(cap, curMax + largest value), and for j = 1..m: (¬cur_j ∨ N_j) if
 * j ≤ curMax; for each value v ascending: (¬E_v ∨ N_j) if j ≤ v, else (¬E_v ∨ ¬cur_{j−v} ∨ N_j) if
 * j − v ≤ curMax. Every model has N_j true whenever the prefix sum is ≥ j (upward only).
 */
export function buildUnary(sink: Sink, inputs: readonly UnaryInput[], cap: number): UnaryResult {
  if (!Number.isInteger(cap) || cap < 0) throw new RangeError(`encode: costCap must be a non-negative integer, got ${cap}`);
  let cur: number[] = []; // cur[j − 1] = literal of "prefix ≥ j"
  let maxSum = 0;
  let layers = 0;
  const c2 = new Int32Array(2);
  const c3 = new Int32Array(3);
  for (const inp of inputs) {
    if (inp.lits.length === 0) continue;
    const vals: number[] = [];
    const members: number[][] = [];
    inp.values.forEach((v, i) => {
      if (!Number.isSafeInteger(v) || v <= 0) throw new RangeError(`encode: unary input value ${v} is not a positive integer`);
      if (vals.length > 0 && vals[vals.length - 1] > v) throw new RangeError("encode: unary input literals must be listed by ascending value");
      if (vals.length === 0 || vals[vals.length - 1] !== v) {
        vals.push(v);
        members.push([]);
      }
      members[members.length - 1].push(inp.lits[i]);
    });
    maxSum += vals[vals.length - 1];
    if (!Number.isSafeInteger(maxSum)) throw new Error("encode: the cost sum exceeds 2^53");
    if (cap === 0) continue;
    const words = members.map((ms) => {
      if (ms.length === 1) return ms[0];
      const w = sink.newVar("unary-word");
      for (const x of ms) {
        c2[0] = -x;
        c2[1] = w;
        sink.addClause(c2, 2);
      }
      return w;
    });
    const curMax = cur.length;
    const m = Math.min(cap, curMax + vals[vals.length - 1]);
    const next: number[] = [];
    for (let j = 1; j <= m; j++) next.push(sink.newVar("unary-count"));
    for (let j = 1; j <= m; j++) {
      const N = next[j - 1];
      if (j <= curMax) {
        c2[0] = -cur[j - 1];
        c2[1] = N;
        sink.addClause(c2, 2);
      }
      for (let k = 0; k < vals.length; k++) {
        const i = j - vals[k];
        if (i <= 0) {
          c2[0] = -words[k];
          c2[1] = N;
          sink.addClause(c2, 2);
        } else if (i <= curMax) {
          c3[0] = -words[k];
          c3[1] = -cur[i - 1];
          c3[2] = N;
          sink.addClause(c3, 3);
        }
      }
    }
    cur = next;
    layers++;
  }
  const outputs = Array.from({ length: cap }, (_, j) => (j < cur.length ? cur[j] : 0));
  return { outputs, maxSum, layers };
}

/** The unit for "sum ≤ B": [¬o_{B+1}]; [] when B ≥ maxSum. Throws RangeError when B ≥ cap (not representable). */
export function unaryAssumptions(r: UnaryResult, B: number): number[] {
  if (B >= r.maxSum) return [];
  if (B >= r.outputs.length) throw new RangeError(`encode: bound ${B} needs costCap > ${B} (cost-unary-1 built with costCap=${r.outputs.length})`);
  const o = r.outputs[B];
  return o === 0 ? [] : [-o];
}

/**
 * cost-prune-1 on cost-unary-1: the literal of lb is o_k, k = min(lb, cap) (0 when the counter
 * never reaches k); first the implication chain from high to low outputs [−o_{j+1}, o_j] for
 * j = 1..kmax−1 over the outputs that exist, so that the assumption −o_{B+1} propagates −o_k for
 * every k > B. null when cap = 0.
 */
export function unaryAtLeast(cnf: { addClause(lits: ArrayLike<number>): void }, outputs: readonly number[], lbs: readonly number[]): number[] | null {
  const cap = outputs.length;
  if (cap === 0) return null;
  const ks = lbs.map((lb) => Math.min(lb, cap));
  let kmax = 0;
  for (const k of ks) if (k > kmax) kmax = k;
  for (let j = 1; j < kmax; j++) if (outputs[j] !== 0) cnf.addClause([-outputs[j], outputs[j - 1]]);
  return ks.map((k) => outputs[k - 1]);
}
