// The proof checker's public surface: check a DRAT proof (binary or text, gzip or not) against
// a CNF, optionally writing an LRAT proof, and check LRAT proofs with a separate simple checker.
// Stand-alone by design: it imports nothing from src/sat, so it shares no bugs with it.
import { closeSync, openSync, renameSync, rmSync, writeSync } from "node:fs";
import { PlumblineError } from "../util/errors.js";
import { readBytes, tempNameFor } from "../util/files.js";
import { checkSteps, type DratOptions, type DratResult } from "./checker.js";
import { readCnfForChecker, type CheckerCnf } from "./cnf-reader.js";
import { BROKEN_GZIP, gunzipOrNull, readProof } from "./proof-reader.js";

export type { DratOptions, DratResult, DratStats, FailedLemma, CheckMode } from "./checker.js";
export type { LratSink } from "./lrat-writer.js";
export { checkLrat, type LratResult } from "./lrat-checker.js";
export { readCnfForChecker, type CheckerCnf } from "./cnf-reader.js";
export { isBinaryProof, maybeGunzip } from "./proof-reader.js";

/**
 * Checks a DRAT proof of unsatisfiability of `cnf`. The proof format (binary or text) is
 * detected; gzip-compressed proofs are accepted. Valid means: the proof's lemmas needed for the
 * refutation are RUP or RAT, and unit propagation over formula plus lemmas reaches a conflict.
 */
export function checkDrat(cnf: CheckerCnf, proof: Uint8Array, opts?: DratOptions): DratResult {
  const bytes = gunzipOrNull(proof);
  if (bytes === null) return checkSteps(cnf, { ...readProof(new Uint8Array(0)), error: BROKEN_GZIP }, opts);
  return checkSteps(cnf, readProof(bytes), opts);
}

export interface DratFileOptions extends Omit<DratOptions, "lrat"> {
  /** Write an LRAT proof here when the DRAT proof is valid (via a temporary name; nothing on rejection). */
  lratFile?: string;
}

/** Reads a CNF file and a proof file and checks them (read errors are PlumblineErrors). */
export function checkDratFiles(cnfPath: string, proofPath: string, opts: DratFileOptions = {}): DratResult & { warnings: string[] } {
  const cnf = readCnfForChecker(readBytes(cnfPath), cnfPath);
  const proof = readBytes(proofPath);
  const { lratFile, ...rest } = opts;
  if (lratFile === undefined) return { ...checkDrat(cnf, proof, rest), warnings: cnf.warnings };
  const tmp = tempNameFor(lratFile);
  let fd = -1;
  try {
    const r = checkDrat(cnf, proof, {
      ...rest,
      lrat: (chunk) => {
        if (fd < 0) fd = openSync(tmp, "w");
        writeSync(fd, chunk, null, "latin1");
      },
    });
    if (fd >= 0) {
      closeSync(fd);
      fd = -1;
      renameSync(tmp, lratFile);
    }
    return { ...r, warnings: cnf.warnings };
  } catch (e) {
    if (fd >= 0) closeSync(fd);
    rmSync(tmp, { force: true });
    if (e instanceof PlumblineError || !(e instanceof Error) || !("code" in e)) throw e;
    throw new PlumblineError("io", `cannot write ${lratFile}: ${e.message}`);
  }
}
