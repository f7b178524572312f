// The verdict on another planner's plan: replay it on the lifted model, then compare its
// cost with a proven optimum (landmark-cut bound first, then the prover strategy).
import type { Task } from "../ground/task.js";
import type { Model } from "../pddl/index.js";
import { replayPlan, stepText, type PlanStep, type ReplayError } from "../plan/index.js";
import { checkLandmarkCertificate } from "./landmark-check.js";
import { landmarkCutAtInit } from "./landmark-record.js";
import { planNames } from "./plan-steps.js";
import { astarProver, type OptimumProver } from "./prover.js";
import type { SearchOptions } from "./types.js";

export type Verdict = "invalid" | "optimal" | "suboptimal" | "unknown";

export interface CompareOptions extends SearchOptions {
  /** Proves the optimum; default exhaustive A* with landmark-cut. */
  prover?: OptimumProver;
  planFile?: string;
}

export interface CompareResult {
  verdict: Verdict;
  /** The plan under test as replayed on the lifted model. */
  theirs: { steps: string[]; valid: boolean; cost: number | null; length: number; error: ReplayError | null };
  /** Our side: the optimum (or bounds) and our best plan, synthetic actions dropped. */
  ours: {
    cost: number | null;
    plan: string[] | null;
    lowerBound: number;
    upperBound: number | null;
    /** How optimality was proven ("exhaustive A*", "landmark-cut lower bound"), or null. */
    method: string | null;
    landmarkBound: number | null;
    stats: Record<string, unknown>;
  };
  /** Their cost minus the optimum, for "suboptimal". */
  excess: number | null;
  seconds: number;
}

/** An inconsistency between the lifted replay and our ground search: a bug, never a verdict. */
function internal(msg: string): never {
  throw new Error(`compare: ${msg} (this contradicts the plan replay; please report it)`);
}

export async function comparePlan(model: Model, task: Task, steps: PlanStep[], opts: CompareOptions = {}): Promise<CompareResult> {
  const t0 = performance.now();
  const replay = replayPlan(model, steps, opts.planFile);
  const theirSteps = steps.map((s) => stepText(s));
  const theirs = { steps: theirSteps, valid: replay.valid, cost: replay.valid ? replay.cost : null, length: replay.length, error: replay.error };
  const seconds = () => (performance.now() - t0) / 1000;
  const ours: CompareResult["ours"] = { cost: null, plan: null, lowerBound: 0, upperBound: null, method: null, landmarkBound: null, stats: {} };
  if (!replay.valid) return { verdict: "invalid", theirs, ours, excess: null, seconds: seconds() };
  const theirCost = replay.cost;

  // 1. the certified landmark-cut bound: if it already reaches their cost, that is a proof
  const rec = landmarkCutAtInit(task);
  if (rec === null) internal("the goal is relaxed-unreachable in the ground task, yet the plan reaches it");
  const check = checkLandmarkCertificate(task, rec);
  if (check.valid) {
    ours.landmarkBound = rec.bound;
    ours.lowerBound = rec.bound;
    if (rec.bound > theirCost) internal(`landmark lower bound ${rec.bound} exceeds the plan's cost ${theirCost}`);
    if (rec.bound === theirCost) {
      ours.cost = theirCost;
      ours.upperBound = theirCost;
      ours.method = "landmark-cut lower bound";
      return { verdict: "optimal", theirs, ours, excess: 0, seconds: seconds() };
    }
  }

  // 2. the prover, told that a plan of their cost exists
  const prover = opts.prover ?? astarProver;
  const proof = await prover(task, { deadline: opts.deadline, signal: opts.signal, maxExpansions: opts.maxExpansions, maxStates: opts.maxStates, upperBound: theirCost });
  ours.stats = proof.stats;
  ours.lowerBound = Math.max(ours.lowerBound, proof.lowerBound);
  ours.upperBound = proof.upperBound;
  if (proof.plan) ours.plan = planNames(task, proof.plan);
  if (proof.status === "unsolvable") internal("the prover found no plan at all");
  if (proof.status === "optimal") {
    const opt = proof.cost!;
    if (opt > theirCost) internal(`the proven optimum ${opt} exceeds the plan's cost ${theirCost}`);
    ours.cost = opt;
    ours.method = proof.method;
    ours.lowerBound = opt;
    if (opt === theirCost) return { verdict: "optimal", theirs, ours, excess: 0, seconds: seconds() };
    return { verdict: "suboptimal", theirs, ours, excess: theirCost - opt, seconds: seconds() };
  }
  if (ours.lowerBound >= theirCost) {
    ours.cost = theirCost;
    ours.method = `${proof.method} lower bound`;
    return { verdict: "optimal", theirs, ours, excess: 0, seconds: seconds() };
  }
  ours.upperBound = Math.min(theirCost, proof.upperBound ?? Infinity);
  return { verdict: "unknown", theirs, ours, excess: null, seconds: seconds() };
}
