// The encode stage's public surface: planning CNFs for a horizon (seq-1, forall-1, forall-2;
// cost-adder-1 or cost-unary-1; parts reach-1, relaxed-suffix-1, empty-steps-last-1; their registry), the CNF store, DIMACS, decoding.
export { encodePlanning, COST_ENCODING, type Encoding, type EncodeOptions, type EncodingParams, type EncodingStats } from "./encoding.js";
export { STEP_ENCODINGS, type StepEncodingId } from "./step-rules.js";
export { COST_ENCODINGS, PARTS, checkParts, type CostEncodingId, type PartId } from "./ids.js";
export { chooseCostEncoding, costPartSizes, UNARY_MAX_RATIO, UNARY_SMALL, type CostPartSize } from "./cost-choice.js";
export { reachLayers, type ReachLayers } from "./reach.js";
export { buildUnary, unaryAssumptions, type UnaryInput, type UnaryResult } from "./unary.js";
export { CnfBuilder, type ClauseSink, type CompactClauses, type PlainCnf } from "./cnf.js";
export { toDimacs, writeDimacsChunks } from "./dimacs.js";
export { linearise, extractPlan, type ExtractedPlan } from "./decode.js";
export { buildAdder, type CostGroup, type AdderResult } from "./adder.js";
export { emitComparator, comparatorAssumptions, type Comparator } from "./comparator.js";
export {
  STEP_ENCODING_RECORDS,
  COST_ENCODING_RECORDS,
  PART_RECORDS,
  stepEncodingRecord,
  costEncodingRecord,
  partRecord,
  provesAtAnyHorizon,
  partCostValues,
  costBitsFor,
  type StepEncodingRecord,
  type CostEncodingRecord,
  type PartRecord,
  type PartProof,
  type PartParams,
  type EmitContext,
} from "./registry.js";
export { relaxedOps, type RelaxedOp } from "./relaxed-ops.js";
export { emitAcyclic, AcyclicTooLarge, type AcyclicSink, type AcyclicStats } from "./acyclic.js";
export { checkPairs, type SuffixVars, type StatePair, type ExtraCostInput } from "./relaxed-suffix.js";
export { readSuffixModel, type SuffixModel } from "./suffix-decode.js";
