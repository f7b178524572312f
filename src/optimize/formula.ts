// The CNF a proof refutes: the encoder's planning formula plus the optimizer's own clause
// families (extensions), rebuilt identically by the auditor, with its canonical DIMACS hash.
import { createHash } from "node:crypto";
import { encodePlanning, type Encoding, type EncodingParams, type StepEncodingId } from "../encode/index.js";
import type { Task } from "../ground/task.js";

/** Clause families the optimizer adds to the encoder's formula (ids are part of certificates). */
export type ExtensionId = "empty-steps-last-1";
export const EXTENSIONS: readonly ExtensionId[] = ["empty-steps-last-1"];

/** Everything needed to rebuild the identical formula from the same (prepared) Task. */
export interface FormulaSpec {
  encoding: StepEncodingId;
  steps: number;
  costBits: number;
  mutexGroups: number[][];
  extensions: ExtensionId[];
}

/** A clause sink (the SAT solver, a hash, a DIMACS writer, a checker's clause list). */
export interface Sink {
  addClause(lits: ArrayLike<number>): unknown;
}

export interface Formula {
  readonly spec: FormulaSpec;
  readonly encoding: Encoding;
  /** The encoder's parameters (what `encodePlanning` reports). */
  readonly params: EncodingParams;
  readonly numVars: number;
  readonly numClauses: number;
  /** Sends every clause, encoder's first, then the extensions', in a fixed order. */
  streamTo(sink: Sink): void;
  /** Unit literals for "plan cost ≤ B" ([] when B is Infinity: plain reachability). */
  boundUnits(B: number): number[];
}

/**
 * empty-steps-last-1: one variable n_s per step s = 1..T (numbered after the encoder's
 * variables, n_s = V + s), meaning "step s holds an action":
 *   (¬a@s ∨ n_s) for every action a;  (¬n_s ∨ a_1@s ∨ … ∨ a_k@s);  (¬n_s ∨ n_{s−1}) for s ≥ 2.
 * So the non-empty steps come first. Sound for completeness thresholds: a plan of m ≤ T
 * actions, one action per step in steps 1..m and the rest empty, satisfies it (a single action
 * is a valid step in every step encoding, and an empty step changes nothing). It removes the
 * many placements of the same plan among empty steps, which otherwise every refutation has
 * to cover.
 */
function emptyStepsLast(enc: Encoding, nActions: number, sink: Sink): void {
  const T = enc.params.steps;
  const V = enc.numVars;
  const big: number[] = [];
  for (let s = 1; s <= T; s++) {
    const n = V + s;
    big.length = 0;
    big.push(-n);
    for (let a = 0; a < nActions; a++) {
      const x = enc.actionVar(s, a);
      sink.addClause([-x, n]);
      big.push(x);
    }
    sink.addClause(big);
    if (s >= 2) sink.addClause([-n, n - 1]);
  }
}

function extensionSize(id: ExtensionId, T: number, nActions: number): { vars: number; clauses: number } {
  switch (id) {
    case "empty-steps-last-1":
      return { vars: T, clauses: T * (nActions + 1) + Math.max(0, T - 1) };
  }
}

/** Builds the formula of `spec` for `task` (deterministic: same task and spec, same clauses). */
export function buildFormula(task: Task, spec: FormulaSpec): Formula {
  for (const x of spec.extensions) if (!EXTENSIONS.includes(x)) throw new RangeError(`optimize: unknown formula extension ${String(x)}`);
  const encoding = encodePlanning(task, { encoding: spec.encoding, steps: spec.steps, costBits: spec.costBits, mutexGroups: spec.mutexGroups });
  const nA = task.actions.length;
  let vars = encoding.numVars;
  let clauses = encoding.numClauses;
  for (const x of spec.extensions) {
    const s = extensionSize(x, spec.steps, nA);
    vars += s.vars;
    clauses += s.clauses;
  }
  return {
    spec,
    encoding,
    params: encoding.params,
    numVars: vars,
    numClauses: clauses,
    streamTo(sink) {
      encoding.streamTo(sink);
      for (const x of spec.extensions) {
        if (x === "empty-steps-last-1") emptyStepsLast(encoding, nA, sink);
      }
    },
    boundUnits(B) {
      if (B === Number.POSITIVE_INFINITY) return [];
      return encoding.boundAssumptions(B);
    },
  };
}

/** Number of bound bits needed to ask "cost ≤ B" for every B < upper (at least 1). */
export function costBitsFor(upper: number): number {
  if (!Number.isFinite(upper)) return 0;
  let n = 0;
  for (let x = Math.max(1, upper - 1); x > 0; x = Math.floor(x / 2)) n++;
  return n;
}

/**
 * Canonical DIMACS of formula + unit clauses: "p cnf V C\n", then one clause per line
 * ("l1 l2 … 0\n"), the formula's clauses in stream order followed by the units; no comments.
 * Written in chunks to `write`.
 */
export function writeCanonicalDimacs(f: Formula, units: readonly number[], write: (chunk: string) => void): void {
  let buf = `p cnf ${f.numVars} ${f.numClauses + units.length}\n`;
  const line = (lits: ArrayLike<number>) => {
    let s = "";
    for (let i = 0; i < lits.length; i++) s += `${lits[i]} `;
    buf += `${s}0\n`;
    if (buf.length >= 1 << 16) {
      write(buf);
      buf = "";
    }
  };
  f.streamTo({ addClause: line });
  for (const u of units) line([u]);
  if (buf.length > 0) write(buf);
}

/** SHA-256 (hex) of the canonical DIMACS of formula + units. */
export function canonicalCnfSha256(f: Formula, units: readonly number[]): string {
  const h = createHash("sha256");
  writeCanonicalDimacs(f, units, (s) => h.update(s));
  return h.digest("hex");
}

/** Formula + units as the `{ numVars, clauses }` shape the proof checker reads (copies). */
export function checkerCnf(f: Formula, units: readonly number[]): { numVars: number; clauses: Int32Array[] } {
  const clauses: Int32Array[] = [];
  f.streamTo({ addClause: (l) => clauses.push(Int32Array.from(l)) });
  for (const u of units) clauses.push(Int32Array.of(u));
  return { numVars: f.numVars, clauses };
}

/** The id a certificate records for the formula: step encoding + cost encoding (+ extensions). */
export function formulaId(spec: FormulaSpec): string {
  return [spec.encoding, "cost-adder-1", ...spec.extensions].join("+");
}
