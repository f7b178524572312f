// The public CDCL solver: clauses in, sat/unsat/unknown out, with models, failed-assumption
// cores, incremental use, limits and an optional DRAT proof stream (see DEVELOPERS.md).
import { PlumblineError } from "../util/errors.js";
import { propagate } from "./propagate.js";
import { SearchControl, becomeUnsat, maybeSimplify, search } from "./search.js";
import { SolverState } from "./state.js";
import type { CompactCnf, Cnf, ProofSink, SolveLimits, SolveStatus, SolverOptions, SolverStats } from "./types.js";
import { isAborted } from "../util/limits.js";

/** Time slice of `solveAsync` between yields to the event loop (milliseconds). */
const SLICE_MS = 100;

export class Solver {
  private readonly s = new SolverState();
  private readonly ctl = new SearchControl();
  private buf = new Int32Array(16);
  private lastModel: Int8Array | null = null;
  private failed: number[] = [];
  private seconds = 0;
  private solves = 0;
  /** Assumptions of a search stopped at a time-slice boundary, kept mid-search to resume. */
  private suspended: Int32Array | null = null;

  constructor(opts: SolverOptions = {}) {
    this.s.proof = opts.proof ?? null;
    if (opts.reduceFirst !== undefined) this.ctl.nextReduce = this.ctl.reduceInterval = Math.max(1, opts.reduceFirst);
    if (opts.reduceIncrement !== undefined) this.ctl.reduceIncrement = Math.max(0, opts.reduceIncrement);
  }

  /** Sends every later lemma and deletion to `sink` (set it before adding clauses). */
  setProof(sink: ProofSink | null): void {
    this.s.proof = sink;
  }

  /** A fresh variable (DIMACS number). */
  newVar(): number {
    this.s.ensureVars(this.s.numVars + 1);
    return this.s.numVars;
  }

  get numVars(): number {
    return this.s.numVars;
  }

  /** False once the clauses are known unsatisfiable (without assumptions). */
  get okay(): boolean {
    return this.s.ok;
  }

  /**
   * Adds a clause of DIMACS literals (variables are created as needed).
   * Returns false when the clause set has become unsatisfiable at the top level.
   */
  addClause(lits: ArrayLike<number>): boolean {
    const s = this.s;
    if (!s.ok) return false;
    s.cancelUntil(0);
    this.suspended = null;
    const n = lits.length;
    if (this.buf.length < n + 1) this.buf = new Int32Array(2 * n + 2);
    const buf = this.buf;
    let maxVar = 0;
    for (let i = 0; i < n; i++) {
      const d = lits[i];
      if (!Number.isInteger(d) || d === 0 || d > 0x3fffffff || d < -0x3fffffff) {
        throw new PlumblineError("usage", `addClause: bad literal ${String(d)} (expected a non-zero integer)`);
      }
      const v = d < 0 ? -d : d;
      if (v > maxVar) maxVar = v;
      buf[i] = d > 0 ? v << 1 : (v << 1) | 1;
    }
    if (maxVar > s.numVars) s.ensureVars(maxVar);
    // sort, drop duplicates, detect tautologies
    if (n <= 16) {
      for (let i = 1; i < n; i++) {
        const x = buf[i];
        let j = i - 1;
        while (j >= 0 && buf[j] > x) {
          buf[j + 1] = buf[j];
          j--;
        }
        buf[j + 1] = x;
      }
    } else buf.subarray(0, n).sort();
    let m = 0;
    let changed = false;
    for (let i = 0; i < n; i++) {
      const l = buf[i];
      if (m > 0 && buf[m - 1] === l) {
        changed = true;
        continue;
      }
      if (m > 0 && buf[m - 1] === (l ^ 1)) return true; // tautology
      buf[m++] = l;
    }
    // level-0 values
    const vals = s.vals;
    let k = 0;
    for (let i = 0; i < m; i++) {
      const v = vals[buf[i]];
      if (v === 1) return true;
      if (v === -1) {
        changed = true;
        continue;
      }
      buf[k++] = buf[i];
    }
    if (changed && k < m && s.proof !== null && k > 0) s.proof.add(buf, 0, k);
    if (k === 0) {
      becomeUnsat(s);
      return false;
    }
    if (k === 1) {
      s.assign(buf[0], 0);
      if (propagate(s) !== 0) {
        becomeUnsat(s);
        return false;
      }
      return true;
    }
    if (k === 2) {
      s.addBinary(buf[0], buf[1]);
      s.numOriginalBinary++;
      return true;
    }
    const c = s.allocClause(buf, k, 0);
    s.attach(c);
    s.numOriginal++;
    return true;
  }

  /** Adds every clause of a CNF; returns false if it is unsatisfiable at the top level. */
  addCnf(cnf: Cnf | CompactCnf): boolean {
    this.s.ensureVars(cnf.numVars);
    if ("clauses" in cnf) {
      for (const c of cnf.clauses) if (!this.addClause(c)) return false;
      return true;
    }
    const lits = cnf.lits;
    if (this.s.numOriginal + this.s.numOriginalBinary === 0) this.preallocateWatches(lits);
    let start = 0;
    for (let i = 0; i < lits.length; i++) {
      if (lits[i] === 0) {
        if (!this.addClause(lits.subarray(start, i))) return false;
        start = i + 1;
      }
    }
    return true;
  }

  /** Sizes the watch and binary lists from literal occurrence counts before a bulk load. */
  private preallocateWatches(lits: Int32Array): void {
    const s = this.s;
    const numLists = 2 * (s.numVars + 1);
    const count = new Int32Array(numLists);
    for (let i = 0; i < lits.length; i++) {
      const d = lits[i];
      if (d !== 0) count[d > 0 ? d << 1 : ((-d) << 1) | 1]++;
    }
    s.bins.preallocate(count, numLists);
    for (let l = 0; l < numLists; l++) count[l] *= 2; // watch entries are pairs
    s.watches.preallocate(count, numLists);
  }

  /**
   * Solves under the given assumptions (DIMACS literals). "unknown" means a limit was hit.
   * A signal aborted while this synchronous call runs can only be seen by `solveAsync`.
   */
  solve(assumptions: ArrayLike<number> = [], limits: SolveLimits = {}): SolveStatus {
    this.solves++;
    return this.solveOnce(assumptions, limits, true, false);
  }

  /** Like `solve`, but yields to the event loop every 100 ms so an AbortSignal can stop it. */
  async solveAsync(assumptions: ArrayLike<number> = [], limits: SolveLimits = {}): Promise<SolveStatus> {
    this.solves++;
    const startConflicts = this.s.conflicts;
    const deadline = limits.deadline ?? Infinity;
    for (;;) {
      const left = limits.conflicts === undefined ? undefined : limits.conflicts - (this.s.conflicts - startConflicts);
      if ((left !== undefined && left <= 0) || isAborted(limits.signal) || Date.now() >= deadline) return this.unknown();
      const slice = Math.min(deadline, Date.now() + SLICE_MS);
      const r = this.solveOnce(assumptions, { conflicts: left, deadline: slice, signal: limits.signal }, false, true);
      if (r !== "unknown") return r;
      await new Promise((res) => setImmediate(res));
    }
  }

  private unknown(): SolveStatus {
    this.lastModel = null;
    this.failed = [];
    return "unknown";
  }

  private solveOnce(assumptions: ArrayLike<number>, limits: SolveLimits, checkSignalFirst: boolean, resumable: boolean): SolveStatus {
    const t0 = performance.now();
    const s = this.s;
    this.lastModel = null;
    this.failed = [];
    try {
      if (!s.ok) return "unsat";
      if (checkSignalFirst && isAborted(limits.signal)) return "unknown";
      const assume = new Int32Array(assumptions.length);
      let maxVar = 0;
      for (let i = 0; i < assumptions.length; i++) {
        const d = assumptions[i];
        if (!Number.isInteger(d) || d === 0) throw new PlumblineError("usage", `solve: bad assumption ${String(d)}`);
        const v = Math.abs(d);
        if (v > maxVar) maxVar = v;
        assume[i] = d > 0 ? v << 1 : (v << 1) | 1;
      }
      if (maxVar > s.numVars) s.ensureVars(maxVar);
      const resume = this.suspended !== null && sameLits(this.suspended, assume);
      this.suspended = null;
      if (!resume) {
        s.cancelUntil(0);
        if (propagate(s) !== 0) {
          becomeUnsat(s);
          return "unsat";
        }
        maybeSimplify(s, this.ctl, true);
      }
      const status = search(s, this.ctl, assume, {
        conflictLimit: limits.conflicts === undefined ? Infinity : s.conflicts + limits.conflicts,
        deadline: limits.deadline ?? Infinity,
        signal: limits.signal,
      });
      if (status === "sat") {
        const m = new Int8Array(s.numVars + 1);
        for (let v = 1; v <= s.numVars; v++) m[v] = s.vals[v << 1];
        this.lastModel = m;
      } else if (status === "unsat" && s.ok) {
        // unsat under assumptions: log the clause negating the failed ones
        this.failed = this.ctl.failed;
        if (s.proof !== null) {
          const neg = new Int32Array(this.failed.length);
          for (let i = 0; i < neg.length; i++) {
            const d = this.failed[i];
            neg[i] = d > 0 ? (d << 1) | 1 : (-d) << 1;
          }
          s.proof.add(neg, 0, neg.length);
        }
      }
      if (status === "unknown" && resumable && s.ok) this.suspended = assume;
      else s.cancelUntil(0);
      return status;
    } finally {
      this.seconds += (performance.now() - t0) / 1000;
    }
  }

  /** Value of variable `v` in the last model (undefined without a model or for unknown vars). */
  value(v: number): boolean | undefined {
    const m = this.lastModel;
    if (m === null || v < 1 || v >= m.length) return undefined;
    return m[v] === 1;
  }

  /** The last model: index v holds 1 (true) or −1 (false); index 0 unused. Empty without a model. */
  model(): Int8Array {
    return this.lastModel ?? new Int8Array(0);
  }

  /** After unsat under assumptions: a subset of the assumptions that is already contradictory. */
  failedAssumptions(): number[] {
    return this.failed.slice();
  }

  stats(): SolverStats {
    const s = this.s;
    const secs = this.seconds;
    return {
      vars: s.numVars,
      originalClauses: s.numOriginal + s.numOriginalBinary,
      learnedClauses: s.numLearnts,
      learnedBinary: s.numLearnedBinary,
      learnedUnits: s.learnedUnits,
      conflicts: s.conflicts,
      decisions: s.decisions,
      propagations: s.propagations,
      restarts: s.restarts,
      reductions: s.reductions,
      deletedClauses: s.deleted,
      minimisedLiterals: s.minimised,
      solves: this.solves,
      seconds: secs,
      propagationsPerSecond: secs > 0 ? Math.round(s.propagations / secs) : 0,
      conflictsPerSecond: secs > 0 ? Math.round(s.conflicts / secs) : 0,
    };
  }
}

function sameLits(a: Int32Array, b: Int32Array): boolean {
  if (a.length !== b.length) return false;
  for (let i = 0; i < a.length; i++) if (a[i] !== b[i]) return false;
  return true;
}
