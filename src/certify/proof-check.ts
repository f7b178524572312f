// The independent DRAT checker (src/proof) packaged for the optimizer, which may not import it
// itself: external solvers' proofs are checked with this before any claim rests on them.
import type { ProofChecker } from "../optimize/index.js";
import { checkDrat } from "../proof/index.js";

export const dratChecker: ProofChecker = (cnf, proof, limits) => checkDrat(cnf, proof, { deadline: limits.deadline, signal: limits.signal }).valid;
