// The encode stage's public surface: planning CNFs for a horizon (seq-1, forall-1, forall-2
// with cost-adder-1), the CNF store and DIMACS writer, and model decoding.
export { encodePlanning, COST_ENCODING, type Encoding, type EncodeOptions, type EncodingParams, type EncodingStats } from "./encoding.js";
export { STEP_ENCODINGS, type StepEncodingId } from "./step-rules.js";
export { CnfBuilder, type ClauseSink, type CompactClauses, type PlainCnf } from "./cnf.js";
export { toDimacs, writeDimacsChunks } from "./dimacs.js";
export { linearise, extractPlan, type ExtractedPlan } from "./decode.js";
export { buildAdder, type CostGroup, type AdderResult } from "./adder.js";
export { emitComparator, comparatorAssumptions, type Comparator } from "./comparator.js";
