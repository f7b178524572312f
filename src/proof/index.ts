// The proof checker's public surface: check a DRAT proof (binary or text, gzip or not) against
// a CNF. Stand-alone by design: it imports nothing from src/sat, so it shares no bugs with it.
import { readBytes } from "../util/files.js";
import { checkSteps, type DratOptions, type DratResult } from "./checker.js";
import { readCnfForChecker, type CheckerCnf } from "./cnf-reader.js";
import { maybeGunzip, readProof } from "./proof-reader.js";

export type { DratOptions, DratResult, DratStats, FailedLemma, CheckMode } from "./checker.js";
export { readCnfForChecker, type CheckerCnf } from "./cnf-reader.js";
export { isBinaryProof, maybeGunzip } from "./proof-reader.js";

/**
 * Checks a DRAT proof of unsatisfiability of `cnf`. The proof format (binary or text) is
 * detected; gzip-compressed proofs are accepted. Valid means: the proof's lemmas needed for the
 * refutation are RUP or RAT, and unit propagation over formula plus lemmas reaches a conflict.
 */
export function checkDrat(cnf: CheckerCnf, proof: Uint8Array, opts?: DratOptions): DratResult {
  return checkSteps(cnf, readProof(maybeGunzip(proof)), opts);
}

/** Reads a CNF file and a proof file and checks them (read errors are PlumblineErrors). */
export function checkDratFiles(cnfPath: string, proofPath: string, opts?: DratOptions): DratResult & { warnings: string[] } {
  const cnf = readCnfForChecker(readBytes(cnfPath), cnfPath);
  const proof = readBytes(proofPath);
  return { ...checkDrat(cnf, proof, opts), warnings: cnf.warnings };
}
