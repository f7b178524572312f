// How a run ends: the outcome the CLI prints and, for a proven claim, the material a
// certificate is written from (shared by the threshold route and the suffix route).
import * as fs from "node:fs";
import * as path from "node:path";
import type { HorizonReport } from "../horizon/index.js";
import { formulaId, type Formula } from "./formula.js";
import type { Run } from "./run.js";
import { checkProofFile, type ProofFile } from "./sat-session.js";
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
  proofCheckSeconds?: number;
}

export type SelfCheck = { ok: true; seconds: number | undefined } | { ok: false; outcome: OptimizeOutcome };

/**
 * Before a claim rests on the built-in solver's DRAT proof, the independent checker (passed in
 * by the CLI as `proofChecker`; this stage may not import it) checks it within the run's limits.
 * External proofs were checked when they arrived (sat-session.ts). Rejected: no claim, a note
 * asking for a bug report. Not finished within the limit: no claim either (`feasible`; the plan
 * stays), since the claim would rest on the solver alone.
 */
export function selfCheck(run: Run, formula: Formula, units: number[], proof: ProofFile): SelfCheck {
  const checker = run.opts.proofChecker;
  if (proof.engine !== "builtin" || !checker) return { ok: true, seconds: undefined };
  run.progress.state.phase = "checking the proof";
  run.progress.say(`checking the solver's proof (${(proof.bytes / 1e6).toFixed(1)} MB) with the independent checker`);
  const t0 = performance.now();
  const status = run.best === null ? "unknown" : "feasible";
  const checked = checkProofFile(checker, formula, units, proof.file, run.budget);
  if (checked === "stopped") {
    fs.rmSync(proof.file, { force: true });
    run.notes.push("the refutation finished, but its proof could not be checked within the limits, so no claim is made on it (a longer --time-limit lets the check finish)");
    return { ok: false, outcome: finish(run, status, null, run.budget.stop() ?? "time") };
  }
  const seconds = (performance.now() - t0) / 1000;
  if (checked === "invalid") {
    fs.rmSync(proof.file, { force: true });
    run.notes.push("the independent checker rejected the built-in solver's proof, so no claim is made on it; this is a bug in plumbline's solver — please report it with the model files");
    return { ok: false, outcome: finish(run, status, null, "no-proof") };
  }
  run.event("proof-checked", `the solver's proof was checked by the independent checker in ${seconds.toFixed(1)} s`);
  return { ok: true, seconds };
}

/** What people are told when the best plan is certified optimal without SAT (`Run.claimWithoutSat`). */
function withoutSatWords(run: Run, route: "state-space" | "landmark-search"): { note: string; event: string; provedBy: string } {
  if (route === "state-space") {
    const n = run.stateSpace!.states;
    return {
      note: `the exhaustive search of all ${n} reachable states, which the audit repeats`,
      event: `exhaustive search of ${n} reachable states`,
      provedBy: `exhaustive search of all ${n} reachable states (re-derived by the audit's own plain search; no SAT proof)`,
    };
  }
  const rec = run.searchRecord!;
  const n = rec.entries.length;
  return {
    note: `a recorded A* search with landmark-cut bounds (${n} states, ${rec.entries.filter((e) => e.expanded).length} expanded), which the audit checks state by state`,
    event: `recorded A* search with landmark bounds: ${n} states`,
    provedBy: `A* search with landmark-cut bounds, recorded (${n} states) and checked state by state by the audit; no SAT proof`,
  };
}

export function finish(run: Run, status: OptimizeOutcome["status"], how: ProofHow | null, stopReason: OptimizeOutcome["stopReason"], extra: FinishExtra = {}): OptimizeOutcome {
  if (stopReason) run.event("stop", stopReason);
  // no SAT refutation in time, but a certificate without SAT is in hand (state-space or landmark-search)
  const withoutSat = status === "feasible" ? run.claimWithoutSat() : null;
  if (withoutSat !== null) {
    const what = withoutSatWords(run, withoutSat);
    run.notes.push(`the SAT refutation did not finish (${stopReason ?? "no proof"}); optimality rests on ${what.note}`);
    run.lower = run.best!.cost;
    run.event("proof", what.event);
    status = "optimal";
    how = withoutSat;
    stopReason = null;
    extra = { ...extra, provedBy: what.provedBy };
  } else if (status === "feasible" && run.incumbentOptimal)
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
    proofCheckSeconds: extra.proofCheckSeconds ?? null,
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
  const units = formula.boundUnits(bound);
  const checked = selfCheck(run, formula, units, proof);
  if (!checked.ok) return checked.outcome;
  const proofCheckSeconds = checked.seconds;
  run.lower = run.best!.cost;
  const h = formula.spec.steps;
  const engine = proof.engine === "builtin" ? "built-in solver" : "external solver";
  if (how === "horizon-unsat") {
    run.event("proof", `no plan of cost ≤ ${bound} within horizon ${h}`);
    return finish(run, "optimal", how, null, { horizon: rep ?? undefined, formula, units, bound, proof, proofCheckSeconds, provedBy: `SAT (${engine}, unsatisfiable at horizon ${h}, DRAT proof)` });
  }
  run.event("proof", `no plan of cost ≤ ${bound} at all: unsatisfiable with ${h} real steps and a relaxed suffix`);
  const avoided = rep ? `; the completeness threshold would have been ${rep.horizonText}` : "";
  return finish(run, "optimal", how, null, {
    horizon: rep ?? undefined,
    formula,
    units,
    bound,
    proof,
    proofCheckSeconds,
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
