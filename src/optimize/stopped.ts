// The outcome of a run a limit stopped before the optimizer had anything (while reading, grounding
// or analysing): status unknown, no plan, the reason — the same shape every solve result has.
import type { LimitReason } from "../util/limits.js";
import type { OptimizeOutcome } from "./types.js";

export function stoppedOutcome(reason: LimitReason, seconds: number, phase: string): OptimizeOutcome {
  return {
    status: "unknown",
    stopReason: reason,
    cost: null,
    lowerBound: 0,
    plan: null,
    how: null,
    provedBy: null,
    horizon: null,
    horizonWinner: null,
    thresholdAvoided: null,
    encoding: null,
    proof: null,
    proofCheckSeconds: null,
    seconds,
    timeToFirstPlan: null,
    timeToProof: null,
    timeline: [{ seconds, kind: "stop", upper: null, lower: 0, detail: `${reason} while ${phase}` }],
    satCalls: 0,
    conflicts: 0,
    variables: null,
    clauses: null,
    peakRssBytes: process.memoryUsage.rss(),
    notes: [`stopped while ${phase}, before any plan or bound`],
    certificate: null,
  };
}
