// How many positive-cost actions a plan cheaper than C can contain: the cost budget divided by
// the cheapest positive cost, after taking off what every plan must pay beyond that minimum.
import type { Task } from "../ground/task.js";
import { checkLandmarkCertificate, landmarkCutAtInit } from "../search/index.js";
import type { PatternExcess } from "./patterns.js";

/**
 * Proof. Let u > 0 be at most every positive action cost and write each cost as
 * cost(a) = u·[cost(a) > 0] + e(a) with e(a) = cost(a) − u ≥ 0 for positive actions and
 * e(a) = 0 for zero-cost ones. A plan π with n positive actions costs
 * cost(π) = n·u + e(π). Landmark-cut run with the costs e (and re-checked by the independent
 * landmark checker: every landmark is a set of actions every plan uses, and the charges respect
 * the cost partition) gives h with e(π) ≥ h for every plan; so does the cheapest e-cost path to
 * the goal in a projection (patterns.ts); the larger of them is used. So a plan of cost ≤ C − 1 has
 * n ≤ floor((C − 1 − h) / u). The same holds for every plan derived from it that is no dearer,
 * which is what the horizon methods use. With no plan of cost < C the bound is vacuous; it is
 * then reported as 0.
 * Zero-cost actions: e = 0 for them (and for actions costing exactly u), so a landmark or a
 * projected path made of them adds nothing to h; they are not counted in n either, which is why
 * the zero-cost method bounds them separately. Negative conditions and conditional effects:
 * landmark-cut works on the delete relaxation with negative conditions dropped and every
 * conditional effect allowed to fire (search/relaxed.ts) — a relaxation of every real plan.
 */
export interface PositiveCount {
  /** floor((C − 1 − h) / u), at least 0. */
  k: bigint;
  /** floor((C − 1) / u): the count without the excess bound. */
  kPlain: bigint;
  /** The unit u (the smallest positive cost). */
  unit: number;
  /** h: lower bound on the excess e(π) of every plan. */
  excessBound: number;
  /** The landmark part: its bound, number of landmarks and their costs (action sets are recomputed by an auditor). */
  landmarkBound: number;
  landmarks: number;
  landmarkCosts: number[];
  /** The projection part. */
  patterns: PatternExcess[];
  note?: string;
}

export interface ExcessBound {
  /** Landmark-cut bound (0 when not certified). */
  h: number;
  costs: number[];
  note?: string;
  /** Bounds from projections (filled in by the caller, which has the projections). */
  patterns?: PatternExcess[];
}

/** k for cost bound C, from the excess bound of `excessLowerBound(task, unit)`. */
export function positiveActionBound(upperCost: number, unit: number, ex: ExcessBound): PositiveCount {
  const budget = BigInt(upperCost) - 1n;
  const kPlain = budget < 0n ? 0n : budget / BigInt(unit);
  const patterns = ex.patterns ?? [];
  let h = ex.h;
  for (const p of patterns) if (p.excess !== null && p.excess > h) h = p.excess;
  const rest = budget - BigInt(h);
  const k = rest < 0n ? 0n : rest / BigInt(unit);
  const out: PositiveCount = { k, kPlain, unit, excessBound: h, landmarkBound: ex.h, landmarks: ex.costs.length, landmarkCosts: ex.costs, patterns };
  if (ex.note) out.note = ex.note;
  return out;
}

/** The certified lower bound h on e(π) for every plan π (see above); independent of C. */
export function excessLowerBound(task: Task, unit: number): ExcessBound {
  let r: ExcessBound;
  if (!task.actions.some((a) => a.cost > unit)) r = { h: 0, costs: [], note: "every positive action costs the unit: no excess" };
  else {
    const excess: Task = { ...task, actions: task.actions.map((a) => ({ ...a, cost: a.cost > 0 ? a.cost - unit : 0 })) };
    const rec = landmarkCutAtInit(excess);
    if (rec === null) r = { h: 0, costs: [], note: "goal relaxed-unreachable: no plan exists, excess bound not used" };
    else if (!checkLandmarkCertificate(excess, rec).valid) r = { h: 0, costs: [], note: "the landmark record did not pass its check: excess bound 0 used" };
    else {
      const costs = rec.landmarks.map((l) => l.cost).filter((c) => c > 0);
      // with integer costs every charge is an integer, exact in floating point; floor only rounds down
      r = { h: Math.floor(rec.bound), costs };
      if (!Number.isSafeInteger(r.h) || r.h < 0) r = { h: 0, costs: [], note: "landmark bound out of range: excess bound 0 used" };
    }
  }
  return r;
}
