// Shared types of the SAT engine: limits, statistics, the proof sink interface and the
// in-memory CNF forms, kept apart so that every solver file can import them cheaply.

/** Limits for one `solve` call; whichever is hit first stops the search with "unknown". */
export interface SolveLimits {
  /** Maximum number of conflicts in this call. */
  conflicts?: number;
  /** Absolute deadline in `Date.now()` milliseconds. */
  deadline?: number;
  /** Aborts the search (seen between time slices by `solveAsync`, and by `solve` if already aborted). */
  signal?: AbortSignal;
}

export type SolveStatus = "sat" | "unsat" | "unknown";

export interface SolverOptions {
  /** Accepted for API stability but currently unused: the solver makes no random choices, so runs are fully deterministic. */
  seed?: number;
  /** Proof sink receiving every learned and deleted clause (default none). */
  proof?: ProofSink | null;
  /** Conflicts before the first learned-clause reduction (tuning and tests; default 500). */
  reduceFirst?: number;
  /** Growth of the reduction interval per round, in conflicts (default 50). */
  reduceIncrement?: number;
}

export interface SolverStats {
  vars: number;
  originalClauses: number;
  /** Learned clauses currently kept (long ones; learned binaries are counted in `learnedBinary`). */
  learnedClauses: number;
  learnedBinary: number;
  learnedUnits: number;
  conflicts: number;
  decisions: number;
  propagations: number;
  restarts: number;
  reductions: number;
  deletedClauses: number;
  minimisedLiterals: number;
  solves: number;
  /** Seconds spent inside solve calls (all calls together). */
  seconds: number;
  propagationsPerSecond: number;
  conflictsPerSecond: number;
}

/**
 * Receives proof steps. Literals use the binary DRAT encoding: 2·var + (negative ? 1 : 0).
 * `lits[from..to)` is the clause; the sink must copy what it keeps.
 */
export interface ProofSink {
  add(lits: ArrayLike<number>, from: number, to: number): void;
  delete(lits: ArrayLike<number>, from: number, to: number): void;
  /** Writes buffered bytes out (no-op for memory sinks). */
  flush(): void;
}

/** A CNF as one array per clause (DIMACS literals: var ≥ 1, negation −var). */
export interface Cnf {
  numVars: number;
  clauses: Int32Array[];
}

/**
 * A compact CNF: all clauses in one array, each terminated by 0 (as in DIMACS).
 * Much lighter than `Cnf` for millions of clauses.
 */
export interface CompactCnf {
  numVars: number;
  numClauses: number;
  /** DIMACS literals, each clause followed by a 0. */
  lits: Int32Array;
}

/** Converts a DIMACS literal to the internal / binary-DRAT encoding. */
export function encodeLit(dimacs: number): number {
  return dimacs > 0 ? dimacs << 1 : ((-dimacs) << 1) | 1;
}

/** Converts an internal / binary-DRAT literal back to DIMACS. */
export function decodeLit(lit: number): number {
  return lit & 1 ? -(lit >> 1) : lit >> 1;
}
