// The SAT engine's public surface: solver, DIMACS I/O, proof sinks and the external-solver
// adapter. Stand-alone: imports nothing from planning code (only src/util).
export { Solver } from "./solver.js";
export type { SolveLimits, SolveStatus, SolverOptions, SolverStats, ProofSink, Cnf, CompactCnf } from "./types.js";
export { encodeLit, decodeLit } from "./types.js";
export { parseDimacs, parseDimacsCompact, readDimacsFile, writeDimacs, splitClauses, toCompact, type DimacsWarnings } from "./dimacs.js";
export { FileProofWriter, MemoryProofWriter, type ProofFormat } from "./proof-writer.js";
export { solveExternal, parseSolverOutput, splitCommand, type ExternalOptions, type ExternalResult } from "./external.js";
