// The independent DRAT checker (src/proof) packaged for the optimizer, which may not import it
// itself: external solvers' proofs are checked with this before any claim rests on them; and the
// audit's plain state-space search, for the exhaustive route.
import type { Task } from "../ground/index.js";
import type { ProofChecker } from "../optimize/index.js";
import { checkDrat } from "../proof/index.js";
import { exactSearchOnce } from "./rederive.js";

export const dratChecker: ProofChecker = (cnf, proof, limits) => checkDrat(cnf, proof, { deadline: limits.deadline, signal: limits.signal }).valid;

/**
 * The audit's own plain search over every reachable state, packaged for the optimizer: when it
 * re-derives the optimum, a run without a SAT refutation may claim it (state-space), and the
 * audit repeats exactly this search.
 */
export const stateSpaceChecker = (task: Task): { cost: number | null; states: number } | null => {
  const r = exactSearchOnce(task);
  return r === null ? null : { cost: r.optimum?.cost ?? null, states: r.states };
};
