// One formula, many bound queries: the built-in incremental solver with a DRAT stream to a
// temporary file, or an external DIMACS solver run once per query (its proof checked here).
import * as fs from "node:fs";
import { tmpdir } from "node:os";
import * as path from "node:path";
import { FileProofWriter, Solver, solveExternal } from "../sat/index.js";
import type { Budget } from "./budget.js";
import { checkerCnf, type Formula } from "./formula.js";

/** Milliseconds of one time slice of the built-in solver (between ticks, interrupts and pauses). */
export const SLICE_MS = 500;

export type QueryStatus = "sat" | "unsat" | "unknown";

export interface ProofFile {
  /** Temporary file holding the DRAT proof (the caller moves or deletes it). */
  file: string;
  bytes: number;
  format: "binary" | "text";
  engine: "builtin" | "external";
}

export interface QueryResult {
  status: QueryStatus;
  /** After sat: value of variable v. */
  value?: (v: number) => boolean;
  /** After unsat: true when a DRAT proof of formula + these units exists (see `finishProof`). */
  proved?: boolean;
  /** Unknown because `interrupt` asked to give up, not because of a limit. */
  interrupted?: boolean;
}

export interface QueryOptions {
  /** Conflicts the query may spend (unknown after that). */
  conflicts?: number;
  /** Called between time slices (progress, limits). */
  tick?: () => void;
  /** Asked between time slices: true gives up the query (status unknown, `interrupted`), e.g. when a better plan arrived. */
  interrupt?: () => boolean;
  /**
   * Asked between time slices of the built-in solver: milliseconds to wait before the next one
   * (0: go on at once), so that a search on another thread can have the core (turn-taking).
   */
  pause?: () => number;
}

export interface SessionStats {
  conflicts: number;
  calls: number;
}

export interface SatSession {
  readonly formula: Formula;
  /** Solves formula ∧ units. `tick` is called between time slices (progress, limits). */
  query(units: number[], budget: Budget, opts?: QueryOptions): Promise<QueryResult>;
  stats(): SessionStats;
  /** After an unsat query that was proved: the proof file (ownership passes to the caller). */
  finishProof(): ProofFile | null;
  /** Drops the solver and removes any temporary proof. */
  dispose(): void;
  /** The formula grew (state pairs): hands its clauses from index `first` on to the solver. */
  extend(first: number): void;
}

/** A fresh temporary directory for proofs and external-solver files. */
export function makeWorkDir(base?: string): string {
  return fs.mkdtempSync(path.join(base ?? tmpdir(), "plumbline-solve-"));
}

/** The built-in solver; with `proofPath` every learned clause goes to a binary DRAT file. */
export function builtinSession(formula: Formula, proofPath: string | null): SatSession {
  const writer = proofPath ? new FileProofWriter(proofPath, "binary") : null;
  const solver = new Solver({ proof: writer });
  formula.streamTo(solver);
  let calls = 0;
  let lastUnsat = false;
  let disposed = false;
  return {
    formula,
    async query(units, budget, opts = {}) {
      calls++;
      lastUnsat = false;
      const start = solver.stats().conflicts;
      for (;;) {
        const left = opts.conflicts === undefined ? undefined : opts.conflicts - (solver.stats().conflicts - start);
        if (left !== undefined && left <= 0) return { status: "unknown" };
        if (budget.stop() !== null) return { status: "unknown" };
        const slice = Math.min(budget.deadline, Date.now() + SLICE_MS);
        const r = await solver.solveAsync(units, { deadline: slice, conflicts: left, signal: budget.signal });
        opts.tick?.();
        if (r !== "sat" && r !== "unsat") {
          if (opts.interrupt?.()) return { status: "unknown", interrupted: true };
          const wait = opts.pause?.() ?? 0;
          if (wait > 0) await budget.sleep(wait);
          continue;
        }
        if (r === "sat") return { status: "sat", value: (v: number) => solver.value(v) === true };
        lastUnsat = true;
        return { status: "unsat", proved: writer !== null };
      }
    },
    stats: () => ({ conflicts: solver.stats().conflicts, calls }),
    extend(first) {
      formula.streamFrom(first, solver);
    },
    finishProof() {
      if (!writer || !lastUnsat || disposed) return null;
      writer.close();
      disposed = true;
      return { file: writer.path, bytes: writer.size, format: "binary", engine: "builtin" };
    },
    dispose() {
      if (!disposed && writer) writer.abort();
      disposed = true;
    },
  };
}

/**
 * An external DIMACS solver: each query is the whole formula plus the units as unit clauses.
 * A proof the solver writes counts only after `checker` (src/proof, passed in by the caller)
 * accepts it; an unsat answer without a checked proof is reported as `proved: false`.
 */
/** Checks a DRAT proof of `cnf` (the optimizer stage may not import the checker; callers pass it). */
export type ProofChecker = (cnf: { numVars: number; clauses: Int32Array[] }, proof: Uint8Array, limits: { deadline?: number; signal?: AbortSignal }) => boolean;

/**
 * Checks the DRAT proof in `file` of formula ∧ units with `checker` within the budget's deadline
 * and abort signal: "valid", "invalid", or "stopped" when a limit ended the check first.
 */
export function checkProofFile(checker: ProofChecker, formula: Formula, units: readonly number[], file: string, budget: Budget): "valid" | "invalid" | "stopped" {
  try {
    const bytes = fs.readFileSync(file);
    return checker(checkerCnf(formula, units), bytes, { deadline: budget.deadline === Infinity ? undefined : budget.deadline, signal: budget.signal }) ? "valid" : "invalid";
  } catch {
    return "stopped";
  }
}

export function externalSession(formula: Formula, command: string, workDir: string, checker: ProofChecker | null): SatSession {
  let calls = 0;
  let proof: ProofFile | null = null;
  let seq = 0;
  const clear = () => {
    if (proof) fs.rmSync(proof.file, { force: true });
    proof = null;
  };
  return {
    formula,
    async query(units, budget) {
      calls++;
      clear();
      if (budget.stop() !== null) return { status: "unknown" };
      // the formula streams its clauses straight into the solver's input file: no copy per query
      const cnf = {
        numVars: formula.numVars,
        numClauses: formula.numClauses + units.length,
        streamTo(sink: { addClause(lits: ArrayLike<number>): unknown }) {
          formula.streamTo(sink);
          for (const u of units) sink.addClause([u]);
        },
      };
      const proofPath = path.join(workDir, `external-${++seq}.drat`);
      const left = budget.left();
      const r = await solveExternal(command, cnf, {
        proofPath,
        signal: budget.signal,
        timeoutMs: left === Infinity ? undefined : Math.max(1, Math.floor(left * 1000)),
        tmpDir: workDir,
      });
      if (r.status === "sat") {
        const m = r.model!;
        fs.rmSync(proofPath, { force: true });
        return { status: "sat", value: (v: number) => m[v] === 1 };
      }
      if (r.status === "unsat") {
        if (!checker || !r.proofPath || !fs.existsSync(r.proofPath) || fs.statSync(r.proofPath).size === 0) {
          if (r.proofPath) fs.rmSync(r.proofPath, { force: true });
          return { status: "unsat", proved: false };
        }
        const checked = checkProofFile(checker, formula, units, r.proofPath, budget);
        if (checked !== "valid") {
          fs.rmSync(r.proofPath, { force: true });
          return checked === "stopped" ? { status: "unknown" } : { status: "unsat", proved: false };
        }
        const bytes = fs.readFileSync(r.proofPath);
        proof = { file: r.proofPath, bytes: bytes.length, format: bytes.includes(0) ? "binary" : "text", engine: "external" };
        return { status: "unsat", proved: true };
      }
      fs.rmSync(proofPath, { force: true });
      return { status: "unknown" };
    },
    stats: () => ({ conflicts: 0, calls }),
    extend() {
      // every query sends the whole formula, added clauses included
    },
    finishProof() {
      const p = proof;
      proof = null;
      return p;
    },
    dispose: clear,
  };
}
