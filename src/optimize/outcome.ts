// How a run ends: the outcome the CLI prints and, for a proven claim, the material a
// certificate is written from (shared by the threshold route and the suffix route).
import * as fs from "node:fs";
import * as path from "node:path";
import type { HorizonReport } from "../horizon/index.js";
import { formulaId, type Formula } from "./formula.js";
import type { Run } from "./run.js";
import type { ProofFile } from "./sat-session.js";
import type { OptimizeOutcome, ProofHow } from "./types.js";

export function horizonValue(r: HorizonReport): number | string {
  return Number.isFinite(r.horizon) ? r.horizon : r.horizonText;
}

export interface FinishExtra {
  /** horizon-unsat: the threshold the formula was built at; suffix-unsat: the one it made unnecessary. */
  horizon?: HorizonReport;
  formula?: Formula;
  units?: number[];
  bound?: number | null;
  proof?: ProofFile;
  provedBy?: string;
}

export function finish(run: Run, status: OptimizeOutcome["status"], how: ProofHow | null, stopReason: OptimizeOutcome["stopReason"], extra: FinishExtra = {}): OptimizeOutcome {
  if (stopReason) run.event("stop", stopReason);
  // no SAT refutation in time, but the optimum was re-derived by the audit's own exhaustive search
  if (status === "feasible" && run.best !== null && run.stateSpace?.cost === run.best.cost) {
    run.notes.push(`the SAT refutation did not finish (${stopReason ?? "no proof"}); optimality rests on the exhaustive search of all ${run.stateSpace.states} reachable states, which the audit repeats`);
    run.lower = run.best.cost;
    run.event("proof", `exhaustive search of ${run.stateSpace.states} reachable states`);
    status = "optimal";
    how = "state-space";
    stopReason = null;
    extra = { ...extra, provedBy: `exhaustive search of all ${run.stateSpace.states} reachable states (re-derived by the audit's own plain search; no SAT proof)` };
  } else if (status === "feasible" && run.best !== null && run.searchRecord?.bound === run.best.cost) {
    const rec = run.searchRecord;
    const expanded = rec.entries.filter((e) => e.expanded).length;
    run.notes.push(`the SAT refutation did not finish (${stopReason ?? "no proof"}); optimality rests on a recorded A* search with landmark-cut bounds (${rec.entries.length} states, ${expanded} expanded), which the audit checks state by state`);
    run.lower = run.best.cost;
    run.event("proof", `recorded A* search with landmark bounds: ${rec.entries.length} states`);
    status = "optimal";
    how = "landmark-search";
    stopReason = null;
    extra = { ...extra, provedBy: `A* search with landmark-cut bounds, recorded (${rec.entries.length} states) and checked state by state by the audit; no SAT proof` };
  }
  else if (status === "feasible" && run.incumbentOptimal)
    run.notes.push(`A* with landmark-cut searched exhaustively: no plan is cheaper than ${run.best!.cost}; that search leaves no certificate, so the status stays feasible`);
  const formula = extra.formula ?? null;
  const claimable = (status === "optimal" || status === "unsolvable") && how !== null;
  const horizon = extra.horizon ?? null;
  const lastSpec = formula?.spec ?? run.lastFormula?.spec ?? null;
  const bySat = how === "horizon-unsat" || how === "suffix-unsat";
  const out: OptimizeOutcome = {
    status,
    stopReason,
    cost: run.best?.cost ?? null,
    lowerBound: run.lower,
    plan: run.best,
    how,
    provedBy: extra.provedBy ?? null,
    horizon: formula ? formula.spec.steps : horizon ? horizonValue(horizon) : null,
    horizonWinner: how === "suffix-unsat" ? null : (horizon?.winner ?? null),
    thresholdAvoided: how === "suffix-unsat" && horizon ? horizonValue(horizon) : null,
    encoding: lastSpec ? formulaId(lastSpec) : null,
    proof: extra.proof ?? null,
    seconds: run.budget.elapsed(),
    timeToFirstPlan: run.timeToFirstPlan,
    timeToProof: claimable ? run.budget.elapsed() : null,
    timeline: run.timeline,
    satCalls: run.satCalls,
    conflicts: run.totalConflicts(),
    variables: formula?.numVars ?? run.lastFormula?.numVars ?? null,
    clauses: formula?.numClauses ?? run.lastFormula?.numClauses ?? null,
    peakRssBytes: Math.max(run.budget.peakRss, run.budget.rss()),
    notes: run.notes,
    certificate: null,
  };
  if (claimable) {
    out.certificate = {
      model: run.model,
      groundOptions: run.groundOptions,
      task: run.task,
      prepared: run.prepared,
      claim: { status: status as "optimal" | "unsolvable", how: how! },
      plan: run.best,
      horizon: bySat ? horizon : null,
      formula: bySat ? formula : null,
      units: extra.units ?? [],
      bound: extra.bound ?? null,
      proof: extra.proof ?? null,
      landmarks: how === "lower-bound" ? run.landmarks : null,
      stateSpace: how === "state-space" ? run.stateSpace : null,
      searchRecord: how === "landmark-search" ? run.searchRecord : null,
      timeline: run.timeline,
      horizonLimits: run.opts.horizonLimits && Object.keys(run.opts.horizonLimits).length > 0 ? { ...run.opts.horizonLimits } : null,
    };
  }
  return out;
}

/** The plan is optimal: the landmark-cut lower bound (its record re-checked) equals its cost. */
export function byLandmarks(run: Run): OptimizeOutcome | null {
  if (run.best === null || run.landmarks === null || run.best.cost !== run.landmarks.bound) return null;
  run.event("proof", "plan cost equals the landmark-cut lower bound");
  return finish(run, "optimal", "lower-bound", null, { provedBy: "landmark-cut lower bound equals the plan's cost" });
}

/** An unsatisfiable "cost ≤ bound" query with its proof: the best plan is optimal. */
export function proven(run: Run, rep: HorizonReport | null, formula: Formula, bound: number, proof: ProofFile, how: "horizon-unsat" | "suffix-unsat"): OptimizeOutcome {
  run.lower = run.best!.cost;
  const h = formula.spec.steps;
  const engine = proof.engine === "builtin" ? "built-in solver" : "external solver";
  if (how === "horizon-unsat") {
    run.event("proof", `no plan of cost ≤ ${bound} within horizon ${h}`);
    return finish(run, "optimal", how, null, { horizon: rep ?? undefined, formula, units: formula.boundUnits(bound), bound, proof, provedBy: `SAT (${engine}, unsatisfiable at horizon ${h}, DRAT proof)` });
  }
  run.event("proof", `no plan of cost ≤ ${bound} at all: unsatisfiable with ${h} real steps and a relaxed suffix`);
  const avoided = rep ? `; the completeness threshold would have been ${rep.horizonText}` : "";
  return finish(run, "optimal", how, null, {
    horizon: rep ?? undefined,
    formula,
    units: formula.boundUnits(bound),
    bound,
    proof,
    provedBy: `SAT (${engine}, unsatisfiable with ${h} real steps and a relaxed suffix, DRAT proof${avoided})`,
  });
}

/** Removes the temporary proof an outcome still holds (call after writing a certificate). */
export function disposeOutcome(o: OptimizeOutcome): void {
  if (o.proof) {
    fs.rmSync(o.proof.file, { force: true });
    try {
      fs.rmdirSync(path.dirname(o.proof.file));
    } catch {
      /* not empty or already gone */
    }
  }
}
