// The certificate's layout (DESIGN "Certificates"): file names, the certificate.json shape
// and its version — shared by the writer and the auditor so that they cannot drift apart.

/**
 * The version this code writes. 2: claims "suffix-unsat" (relaxed-suffix-1 formulas) and
 * "state-space" (the exhaustive route, `stateSpace`), "landmark-search" (a recorded A* search
 * with landmark bounds, `search`),
 * `encoding.partParams`, `thresholdAvoided`, `horizonLimits`.
 */
export const FORMAT_VERSION = 2;
/**
 * Every version the audit reads: the current one and every earlier one (DESIGN "Audit and older
 * certificates"). Bumping FORMAT_VERSION means adding it here and keeping a certificate of the
 * previous version under test/certify/fixtures/legacy (test/certify/legacy.test.ts checks both).
 */
export const AUDITABLE_FORMAT_VERSIONS: readonly number[] = [1, 2];
export const CERTIFICATE_KIND = "plumbline-certificate";

export const FILES = {
  certificate: "certificate.json",
  domain: "domain.pddl",
  problem: "problem.pddl",
  plan: "plan.txt",
  proof: "proof.drat.gz",
  landmarks: "landmarks.json",
  search: "search.json.gz",
} as const;

export const CAUTION = "A proof of optimality is about the model as written: a plan is only as good as the model. Review the model before acting on a schedule.";

/** How the certificate's CNF is serialised before hashing (so anyone can reproduce the hash). */
export const CNF_FORM =
  "canonical DIMACS: 'p cnf V C' line, then one clause per line ('l1 l2 ... 0'): the encoder's clauses in order (its parts included), then one unit clause per bound literal; no comments, '\\n' line ends";

/**
 * The certificate's key for the cost encoding's setting: costBits (cost-adder-1: bits of the adder)
 * and costCountedUpTo (cost-unary-1: the counter counts cost up to this value; the encoder calls it costCap).
 */
export const COST_SETTING_KEY: Readonly<Record<"costBits" | "costCap", string>> = { costBits: "costBits", costCap: "costCountedUpTo" };

/** The cost encoding's setting in words, for people. */
export function costSettingWords(name: "costBits" | "costCap", value: number): string {
  return name === "costBits" ? `a ${value}-bit cost adder` : `cost counted up to ${value}`;
}

export interface FileRecord {
  file: string;
  sha256: string;
}

export interface CertificateJson {
  formatVersion: number;
  kind: string;
  toolVersion: string;
  created: string;
  inputs: { domain: FileRecord & { name: string }; problem: FileRecord & { name: string } };
  claim: { status: "optimal" | "unsolvable"; how: "horizon-unsat" | "suffix-unsat" | "lower-bound" | "relaxed-unreachable" | "state-space" | "landmark-search" };
  /**
   * landmark-search only (format 2 on): the recorded A* search (search.json.gz: a JSON array of
   * states over the analysed task's facts, each with its cost, expanded or not, and landmarks).
   */
  search?: (FileRecord & { bound: number; states: number; expanded: number; task: string }) | null;
  /**
   * state-space only (format 2 on): the exhaustive search of every reachable state of the ground
   * task that the audit repeats (informational figures; the audit re-derives the optimum itself).
   */
  stateSpace?: { states: number; cost: number; method: string } | null;
  plan: (FileRecord & { cost: number; length: number }) | null;
  grounding: { relevance: boolean; facts: number; actions: number };
  reduction: { facts: number; actions: number; variables: number };
  /** horizon-unsat only: the horizon report (every method's derivation) for `upperCost`. */
  horizon: Record<string, unknown> | null;
  /**
   * Limits of the horizon methods when the run did not use the defaults (format 2 on; absent
   * otherwise): the audit recomputes the horizon with them.
   */
  horizonLimits?: { maxOptimalStates?: number; maxExplicitStates?: number; maxProjectionStates?: number };
  /**
   * suffix-unsat only, informational (not used by the audit): the completeness threshold for
   * the claimed cost that the relaxed-suffix proof made unnecessary.
   */
  thresholdAvoided?: { upperCost: number; horizon: number | string; method: string } | null;
  /** horizon-unsat and suffix-unsat. */
  encoding: {
    id: string;
    step: string;
    cost: string;
    /** The encoding's optional parts (src/encode PARTS; `extensions` in certificates before this release). */
    parts: string[];
    /** costBits for cost-adder-1, costCountedUpTo for cost-unary-1 (`costCap` before this release): COST_SETTING_KEY. */
    params: { steps: number; costBits?: number; costCountedUpTo?: number; mutexGroups: number[][] };
    /** Parameters of parts that take them (relaxed-suffix-1: { pairs }); absent when none. */
    partParams?: Record<string, unknown>;
    /** The final query: "plan cost ≤ bound" (null: any plan at all). */
    bound: number | null;
    /** The unit clauses (one literal each) that say "plan cost ≤ bound" (`boundUnits` before this release). */
    costBoundClauses: number[];
  } | null;
  cnf: { sha256: string; variables: number; clauses: number; form: string } | null;
  proof: (FileRecord & { format: "drat-binary" | "drat-text"; compression: "gzip"; bytes: number; uncompressedBytes: number; engine: string }) | null;
  /** lower-bound only. */
  lowerBound: (FileRecord & { method: "landmark-cut"; bound: number }) | null;
  timeline: Array<{ seconds: number; kind: string; upper: number | null; lower: number | string; detail?: string }>;
  caution: string;
}
