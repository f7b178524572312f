// The optimize stage's public API: find a cost-optimal plan and prove it (SAT at a
// completeness threshold, or a matching lower bound), and the formula a certificate names.
import { groundFiles, type GroundOptions } from "../ground/index.js";
import { isLimitReached, withLimits } from "../util/limits.js";
import { stoppedOutcome } from "./stopped.js";
import { deadlineOf } from "./budget.js";
import { optimize } from "./driver.js";
import type { OptimizeOptions, OptimizeOutcome } from "./types.js";

export { optimize, disposeOutcome } from "./driver.js";
export { Budget, type StopReason } from "./budget.js";
export {
  boundSettings,
  buildFormula,
  canonicalCnfSha256,
  checkerCnf,
  costBitsFor,
  costSetting,
  encodeOptionsOf,
  formulaId,
  parseFormulaId,
  writeCanonicalDimacs,
  type Formula,
  type FormulaSpec,
} from "./formula.js";
export { DEFAULT_ENCODING, DEFAULT_PARTS, resolveEncoding, specFor, type EncodingChoice } from "./encoding-choice.js";
export { estimateFormula, type SizeEstimate } from "./estimate.js";
export { planningPipeline, type PlanningPipeline } from "./pipeline.js";
export { nextSuffixHorizon } from "./suffix-route.js";
export { checkPlan, dropRedundant, planFile, toGroundIds, InternalError, type CheckedPlan } from "./plan-check.js";
export { satProver } from "./prover.js";
export type { ProofFile, ProofChecker } from "./sat-session.js";
export type { OptimizeOptions, OptimizeOutcome, OutcomeStatus, ProofHow, TimelineEvent, CertificateMaterial } from "./types.js";

/** The grounding options the optimizer uses (recorded in certificates, reused by audits). */
export const OPTIMIZE_GROUNDING: Required<GroundOptions> = { relevance: true };

/** Parses, grounds (goal-relevance pruning on) and optimizes two PDDL files. */
export async function optimizeFiles(domainPath: string, problemPath: string, opts: OptimizeOptions = {}): Promise<OptimizeOutcome> {
  // the time limit counts from here: parsing and grounding spend it too
  const deadline = deadlineOf(opts);
  const t0 = performance.now();
  return withLimits({ deadline, memoryLimitMb: opts.memoryLimitMb, signal: opts.signal }, async () => {
    let grounded;
    try {
      grounded = groundFiles(domainPath, problemPath, OPTIMIZE_GROUNDING);
    } catch (e) {
      if (isLimitReached(e)) return stoppedOutcome(e.reason, (performance.now() - t0) / 1000, "reading and grounding");
      throw e;
    }
    return optimize(grounded.model, grounded.task, OPTIMIZE_GROUNDING, { ...opts, timeLimit: undefined, deadline });
  });
}
