// The optimality prover behind `compare`, as a replaceable strategy: today exhaustive A*
// with landmark-cut; the SAT optimizer can later supply its own function of the same type.
import type { Task } from "../ground/task.js";
import { astar } from "./astar.js";
import type { SearchOptions } from "./types.js";

export interface ProverOptions extends SearchOptions {
  /** Cost of a plan known to be valid: the prover may prune anything dearer. */
  upperBound?: number;
}

/** What a prover established about the task's optimal cost. */
export interface OptimumProof {
  /** "optimal": `cost` is the proven optimum and `plan` achieves it. */
  status: "optimal" | "unsolvable" | "unknown";
  cost: number | null;
  /** Action ids of the best plan found (optimal when status is "optimal"). */
  plan: number[] | null;
  /** Proven lower bound on the optimal cost (equals `cost` when optimal). */
  lowerBound: number;
  /** Cost of the best plan the prover found itself, if any. */
  upperBound: number | null;
  /** How the claim was established, for people: "exhaustive A*". */
  method: string;
  /** Prover statistics (expansions, seconds, ...), copied into JSON output. */
  stats: Record<string, unknown>;
}

export type OptimumProver = (task: Task, opts: ProverOptions) => OptimumProof | Promise<OptimumProof>;

/** Exhaustive A* with landmark-cut; prunes above the given upper bound. */
export const astarProver: OptimumProver = (task, opts) => {
  const r = astar(task, { ...opts, heuristic: "landmark-cut", costBound: opts.upperBound });
  const stats = { expanded: r.expanded, generated: r.generated, seconds: r.seconds, states: r.states, stopReason: r.stopReason ?? null };
  const method = "exhaustive A*";
  if (r.status === "solved") return { status: "optimal", cost: r.cost, plan: r.plan, lowerBound: r.cost!, upperBound: r.cost, method, stats };
  if (r.status === "unsolvable") return { status: "unsolvable", cost: null, plan: null, lowerBound: Infinity, upperBound: null, method, stats };
  return { status: "unknown", cost: null, plan: null, lowerBound: r.lowerBound ?? 0, upperBound: null, method, stats };
};
