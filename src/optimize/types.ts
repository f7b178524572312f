// What the optimizer takes and returns: options (limits, encoding, SAT engine), the outcome
// the CLI prints, and the material a certificate is written from.
import type { PreparedTask } from "../analyse/index.js";
import type { GroundOptions, Task } from "../ground/index.js";
import type { HorizonReport } from "../horizon/index.js";
import type { Model } from "../pddl/index.js";
import type { LandmarkRecord, SearchRecord } from "../search/index.js";
import type { StopReason } from "./budget.js";
import type { Formula } from "./formula.js";
import type { CheckedPlan } from "./plan-check.js";
import type { ProofChecker, ProofFile } from "./sat-session.js";

export type OutcomeStatus = "optimal" | "feasible" | "unsolvable" | "unknown";
export type ProofHow = "horizon-unsat" | "suffix-unsat" | "lower-bound" | "relaxed-unreachable" | "state-space" | "landmark-search";

export interface OptimizeOptions {
  /**
   * The formulas' encoding: a step encoding ("seq-1", "forall-1", "forall-2": default cost
   * choice and parts) or a full formula id ("forall-1+cost-unary-1+reach-1+empty-steps-last-1").
   * Default: DEFAULT_ENCODING with the cost encoding chosen by size and DEFAULT_PARTS.
   */
  encoding?: string;
  /** "builtin" (default) or "external:CMD". */
  sat?: string;
  /** Seconds for the whole run. */
  timeLimit?: number;
  /** Absolute deadline (Date.now() ms); the earlier of this and timeLimit counts. */
  deadline?: number;
  /** Resident-memory ceiling in MB (polled; also used to refuse formulas that would not fit). */
  memoryLimitMb?: number;
  signal?: AbortSignal;
  /** Progress lines for a person watching (bound, horizon, size, conflicts, elapsed). */
  onProgress?: (line: string) => void;
  /** Called with each new best plan as soon as it is validated (solve writes --plan here, so no plan is lost to a crash or a kill). */
  onPlan?: (plan: CheckedPlan) => void;
  /** Minimum milliseconds between progress lines (default 2000). */
  progressIntervalMs?: number;
  /** Largest proof formula the optimizer builds, in clauses (default 30 million). */
  maxClauses?: number;
  /** Seconds GBFS may take for the first plan (default min(30, a tenth of the time limit)). */
  firstPlanSeconds?: number;
  /** Directory for temporary proof files (default: the system temp directory). */
  tmpDir?: string;
  /**
   * Checks an external solver's DRAT proof (src/proof's checker, passed in by the CLI; this
   * stage may not import it). Without one, an external "unsat" is re-proved by the built-in solver.
   */
  proofChecker?: ProofChecker;
  /** Quick SAT queries at short horizons before the proof formula (default true). */
  probes?: boolean;
  /**
   * A known plan (plan-file lines "(drive t1 a b)") to start from instead of GBFS's first plan,
   * e.g. a recorded plan re-judged against a changed model. Used only when it is a plan of the
   * task (steps pruned as irrelevant left out; validated on the lifted model like every plan);
   * otherwise a note says so and GBFS runs.
   */
  incumbent?: readonly string[];
  /**
   * Proofs with a relaxed suffix (part relaxed-suffix-1) at short horizons, before a completeness
   * threshold is reached (default true). False: threshold proofs only.
   */
  suffix?: boolean;
  /**
   * Limits of the horizon methods (src/horizon); e.g. `{ maxOptimalStates: 0, maxExplicitStates: 1 }`
   * keeps the explicit-state methods out (benchmarks of the general bounds). Certificates record
   * them and the audit recomputes the horizon with the same limits (every limit is sound: it
   * only bounds how much is explored).
   */
  horizonLimits?: { maxOptimalStates?: number; maxExplicitStates?: number; maxProjectionStates?: number };
  /**
   * A* with landmark-cut on a second thread beside the SAT queries (default true); an optimal
   * plan it finds becomes the incumbent. How it shares the CPU depends on `threads`.
   */
  searchHelper?: boolean;
  /**
   * Cores the run may keep busy (default: the machine's, at most 2). With 2 or more the A*
   * helper has a core of its own; with 1 the two take turns: while A* runs, a SAT query that
   * has not finished in a time slice waits five slices before its next one (SAT gets a sixth
   * of the core, A* the rest), and once A* has ended the SAT side runs unhindered.
   */
  threads?: number;
  /**
   * With 2 threads or more: a proving SAT query (no conflict limit) still open after 2 s while
   * the A* helper is not searching gets a second solver on the free core — a fresh built-in
   * solver on the same clauses in reverse order, with its own DRAT proof — and the first answer
   * wins (default true).
   */
  portfolio?: boolean;
  /** Milliseconds a proving query runs alone before the second solver joins (tests; default 2000). */
  portfolioAfterMs?: number;
  /**
   * The audit's plain search over every reachable state of the ground task (src/certify, passed in
   * by the CLI; this stage may not import it): the optimal cost (null: no plan) and the number of
   * reachable states, or null when the task is too large for it. With it, a run whose optimum is
   * known (exact explicit search, or the A* helper) but whose SAT refutation cannot finish claims
   * `optimal` by the exhaustive route (`state-space`), which the audit re-derives the same way.
   */
  stateSpaceCheck?: (task: Task) => { cost: number | null; states: number } | null;
}

export interface TimelineEvent {
  seconds: number;
  /** "lower-bound", "plan", "horizon", "encode", "proof", "stop", … */
  kind: string;
  /** Best plan cost so far (null without a plan). */
  upper: number | null;
  /** Proven lower bound so far. */
  lower: number;
  detail?: string;
}

/** Everything a certificate is written from (kept in memory until written or disposed). */
export interface CertificateMaterial {
  model: Model;
  groundOptions: GroundOptions;
  task: Task;
  prepared: PreparedTask;
  claim: { status: "optimal" | "unsolvable"; how: ProofHow };
  plan: CheckedPlan | null;
  /**
   * horizon-unsat: the horizon report for the upper cost the formula was built for;
   * suffix-unsat: the threshold for the claimed cost that the proof made unnecessary (for people).
   */
  horizon: HorizonReport | null;
  formula: Formula | null;
  /** The unit clauses of the final query (bound literals). */
  units: number[];
  /** The bound B of the final query "cost ≤ B" (null for plain reachability). */
  bound: number | null;
  proof: ProofFile | null;
  landmarks: LandmarkRecord | null;
  /** state-space: the optimum and reachable states the plain search found. */
  stateSpace: { cost: number; states: number } | null;
  /** landmark-search: the record of an A* search (on the analysed task) proving no plan is cheaper. */
  searchRecord: SearchRecord | null;
  timeline: TimelineEvent[];
  /** The horizon methods' limits when not the defaults (recorded so the audit uses the same). */
  horizonLimits: OptimizeOptions["horizonLimits"] | null;
}

export interface OptimizeOutcome {
  status: OutcomeStatus;
  /** Why the run stopped early (limits), or why no proof was attempted. */
  stopReason: StopReason | "horizon-too-large" | "no-proof" | "certified" | null;
  cost: number | null;
  /** Proven lower bound (Infinity when unsolvable). */
  lowerBound: number;
  plan: CheckedPlan | null;
  how: ProofHow | null;
  /** Who established the claim, for people ("SAT (built-in solver, DRAT proof)", …). */
  provedBy: string | null;
  /** The horizon of the proof formula, or the one a proof would need (string when huge). */
  horizon: number | string | null;
  horizonWinner: string | null;
  /** suffix-unsat: the completeness threshold the proof did without (for people). */
  thresholdAvoided: number | string | null;
  encoding: string | null;
  proof: ProofFile | null;
  /**
   * The built-in solver's DRAT proof was checked by the independent checker (src/proof, passed in
   * as `proofChecker`) before the claim was made: its seconds; null when no such check ran.
   */
  proofCheckSeconds: number | null;
  seconds: number;
  timeToFirstPlan: number | null;
  timeToProof: number | null;
  timeline: TimelineEvent[];
  satCalls: number;
  conflicts: number;
  variables: number | null;
  clauses: number | null;
  peakRssBytes: number;
  notes: string[];
  certificate: CertificateMaterial | null;
}
