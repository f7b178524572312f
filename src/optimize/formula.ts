// The CNF a proof refutes: the encoder's planning formula for a recorded spec (step encoding,
// cost encoding, parts, bound settings), rebuilt identically by the auditor, with its canonical hash.
import { createHash } from "node:crypto";
import {
  checkParts,
  COST_ENCODINGS,
  costBitsFor,
  costEncodingRecord,
  encodePlanning,
  PARTS,
  STEP_ENCODINGS,
  type CostEncodingId,
  type EncodeOptions,
  type Encoding,
  type EncodingParams,
  type PartId,
  type PartParams,
  type StepEncodingId,
} from "../encode/index.js";
import type { Task } from "../ground/task.js";

/** Everything needed to rebuild the identical formula from the same (prepared) Task. */
export interface FormulaSpec {
  encoding: StepEncodingId;
  cost: CostEncodingId;
  steps: number;
  /** cost-adder-1's bound bits (ignored by cost-unary-1). */
  costBits: number;
  /** cost-unary-1's saturation point (ignored by cost-adder-1). */
  costCap: number;
  mutexGroups: number[][];
  /** The encoding's optional parts (src/encode PARTS), in canonical order. */
  parts: PartId[];
  /** Parameters of parts that take them (relaxed-suffix-1: the state pairs made distinct). */
  partParams?: PartParams;
}

/** A clause sink (the SAT solver, a hash, a DIMACS writer, a checker's clause list). */
export interface Sink {
  addClause(lits: ArrayLike<number>): unknown;
}

export interface Formula {
  /** The spec; with relaxed-suffix-1 its state pairs grow as `addStatePair` is called. */
  readonly spec: FormulaSpec;
  readonly encoding: Encoding;
  /** The encoder's parameters (what `encodePlanning` reports). */
  readonly params: EncodingParams;
  /** Current counts (they grow with state pairs). */
  readonly numVars: number;
  readonly numClauses: number;
  /** Sends every clause, in the encoder's order. */
  streamTo(sink: Sink): void;
  /** Sends the clauses from index `first` on (those added since a count was taken). */
  streamFrom(first: number, sink: Sink): void;
  /** Unit literals for "plan cost ≤ B" ([] when B is Infinity: plain reachability). */
  boundUnits(B: number): number[];
  /**
   * relaxed-suffix-1: forbids equal states at time points t < t′ (unless the goal holds at t) by
   * clauses appended at the end; the spec records the pair, so a rebuild gives the same CNF.
   * Returns the index of the first new clause.
   */
  addStatePair(t: number, u: number): number;
}

/** The bound setting a spec's cost encoding uses (its registry record names it). */
export function costSetting(spec: Pick<FormulaSpec, "cost" | "costBits" | "costCap">): { name: "costBits" | "costCap"; value: number } {
  const name = costEncodingRecord(spec.cost).setting;
  return { name, value: spec[name] };
}

/** The encoder options of a spec: its cost encoding's bound setting only (see costSetting). */
export function encodeOptionsOf(spec: FormulaSpec): EncodeOptions {
  const setting = costSetting(spec);
  return {
    encoding: spec.encoding,
    steps: spec.steps,
    cost: spec.cost,
    [setting.name]: setting.value,
    mutexGroups: spec.mutexGroups,
    parts: spec.parts,
    ...(spec.partParams && Object.keys(spec.partParams).length > 0 ? { partParams: spec.partParams } : {}),
  };
}

/**
 * Builds the formula of `spec` for `task` (deterministic: same task and spec, same clauses).
 * Everything is the encoder's (src/encode): certificates made when empty-steps-last-1 was an
 * optimizer extension name the same clauses as the encoder's part of that id, in the same place.
 */
export function buildFormula(task: Task, spec: FormulaSpec): Formula {
  const encoding = encodePlanning(task, encodeOptionsOf(spec));
  // the spec follows the encoder's normalised parameters (state pairs are copied, then grow)
  const own: FormulaSpec = { ...spec, parts: [...spec.parts] };
  if (encoding.params.partParams) own.partParams = encoding.params.partParams;
  else delete own.partParams;
  return {
    spec: own,
    encoding,
    params: encoding.params,
    get numVars() {
      return encoding.numVars;
    },
    get numClauses() {
      return encoding.numClauses;
    },
    streamTo: (sink) => encoding.streamTo(sink),
    streamFrom(first, sink) {
      for (let i = first; i < encoding.cnf.numClauses; i++) sink.addClause(encoding.cnf.clause(i));
    },
    boundUnits(B) {
      if (B === Number.POSITIVE_INFINITY) return [];
      return encoding.boundAssumptions(B);
    },
    addStatePair: (t, u) => encoding.addStatePair(t, u),
  };
}

/** The bound settings for formulas asked "cost ≤ B" for every B < upper (Infinity: no bound). */
export function boundSettings(upper: number): { costBits: number; costCap: number } {
  return { costBits: costEncodingRecord("cost-adder-1").settingFor(upper), costCap: costEncodingRecord("cost-unary-1").settingFor(upper) };
}

export { costBitsFor };

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

/** The id a certificate records for the formula: step encoding + cost encoding (+ parts). */
export function formulaId(spec: Pick<FormulaSpec, "encoding" | "cost" | "parts">): string {
  return [spec.encoding, spec.cost, ...spec.parts].join("+");
}

/**
 * Reads a formula id ("forall-1+cost-unary-1+reach-1+empty-steps-last-1"), a step encoding with
 * parts but no cost encoding ("forall-1+reach-1+eager-steps-1": the cost encoding is left to the
 * caller's choice by size), or a bare step encoding ("forall-1": cost and parts left to the
 * caller). Throws RangeError naming what is unknown.
 */
export function parseFormulaId(id: string): { encoding: StepEncodingId; cost: CostEncodingId | null; parts: PartId[] | null } {
  const [step, ...rest] = id.split("+");
  if (!STEP_ENCODINGS.includes(step as StepEncodingId)) throw new RangeError(`unknown step encoding '${step}' (known: ${STEP_ENCODINGS.join(", ")})`);
  if (rest.length === 0) return { encoding: step as StepEncodingId, cost: null, parts: null };
  const cost = rest[0];
  if (COST_ENCODINGS.includes(cost as CostEncodingId)) return { encoding: step as StepEncodingId, cost: cost as CostEncodingId, parts: checkParts(rest.slice(1)) };
  if (PARTS.includes(cost as PartId)) return { encoding: step as StepEncodingId, cost: null, parts: checkParts(rest) };
  throw new RangeError(`unknown cost encoding or part '${cost}' (cost encodings: ${COST_ENCODINGS.join(", ")}; parts: ${PARTS.join(", ")})`);
}
