// The SAT optimizer as the `compare` command's optimum prover, with exhaustive A* as the
// fallback when SAT cannot settle it (horizon too large, limit); the result says which proved it.
import type { GroundOptions } from "../ground/index.js";
import type { Model } from "../pddl/index.js";
import { astarProver, type OptimumProof, type OptimumProver } from "../search/index.js";
import { disposeOutcome, optimize } from "./driver.js";
import type { OptimizeOptions } from "./types.js";

export interface SatProverOptions extends Omit<OptimizeOptions, "deadline" | "signal"> {
  /** Share of the remaining time the SAT optimizer gets before A* takes over (default 0.5). */
  satShare?: number;
  /** Seconds for SAT when there is no deadline (default 60). */
  satSecondsWithoutDeadline?: number;
}

/**
 * A prover for `comparePlan`: the SAT optimizer first (its claim is a DRAT-proven horizon
 * query or a matching landmark bound), then exhaustive A* with landmark-cut for what is left.
 */
export function satProver(model: Model, groundOptions: GroundOptions, o: SatProverOptions = {}): OptimumProver {
  return async (task, opts) => {
    const now = Date.now();
    const deadline = opts.deadline ?? Infinity;
    const satDeadline = Number.isFinite(deadline) ? now + (deadline - now) * (o.satShare ?? 0.5) : now + (o.satSecondsWithoutDeadline ?? 60) * 1000;
    const out = await optimize(model, task, groundOptions, { ...o, deadline: satDeadline, signal: opts.signal });
    disposeOutcome(out);
    const stats = { prover: "sat", satSeconds: out.seconds, satCalls: out.satCalls, conflicts: out.conflicts, horizon: out.horizon, satStatus: out.status, satStopReason: out.stopReason };
    if (out.status === "optimal") {
      return { status: "optimal", cost: out.cost, plan: out.plan!.groundIds, lowerBound: out.cost!, upperBound: out.cost, method: `SAT optimizer: ${out.provedBy}`, stats } satisfies OptimumProof;
    }
    if (out.status === "unsolvable" && out.how !== null) {
      return { status: "unsolvable", cost: null, plan: null, lowerBound: Infinity, upperBound: null, method: `SAT optimizer: ${out.provedBy}`, stats };
    }
    if (opts.signal?.aborted || Date.now() >= deadline) {
      return { status: "unknown", cost: null, plan: out.plan?.groundIds ?? null, lowerBound: out.lowerBound, upperBound: out.cost, method: "SAT optimizer", stats };
    }
    const upper = Math.min(opts.upperBound ?? Infinity, out.cost ?? Infinity);
    const a = await astarProver(task, { ...opts, upperBound: Number.isFinite(upper) ? upper : undefined });
    const why = out.stopReason ? ` (SAT stopped: ${out.stopReason})` : "";
    return {
      ...a,
      lowerBound: Math.max(a.lowerBound, out.lowerBound === Infinity ? 0 : out.lowerBound),
      upperBound: a.upperBound ?? out.cost,
      plan: a.plan ?? out.plan?.groundIds ?? null,
      method: `${a.method}${why}`,
      stats: { ...stats, ...a.stats, prover: "astar" },
    };
  };
}
