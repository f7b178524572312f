// The optimizer: lower bound, first plan, then SAT queries "is there a plan cheaper than the
// best?" — with a relaxed suffix at short horizons, or at a completeness threshold — until one is
// unsatisfiable (with its DRAT proof).
import * as fs from "node:fs";
import { costModelNote, type GroundOptions, type Task } from "../ground/index.js";
import type { HorizonReport } from "../horizon/index.js";
import type { Model } from "../pddl/index.js";
import { checkLandmarkCertificate, gbfs, landmarkCutAtInit } from "../search/index.js";
import { isLimitReached, withLimits } from "../util/limits.js";
import { deadlineOf, type StopReason } from "./budget.js";
import { incumbentIds } from "./incumbent.js";
import { byLandmarks, finish, proven, selfCheck } from "./outcome.js";
import { InternalError } from "./plan-check.js";
import { Run } from "./run.js";
import { stoppedOutcome } from "./stopped.js";
import { suffixRoute } from "./suffix-route.js";
import type { OptimizeOptions, OptimizeOutcome } from "./types.js";

/** Re-encode at a smaller horizon once it is at most this fraction of the current one. */
const REENCODE_FRACTION = 0.8;
/** Conflicts a probe at a short horizon may spend per query. */
const PROBE_CONFLICTS = 20_000;
/** Conflicts an anytime query (no proof possible) may spend before the horizon grows. */
const ANYTIME_CONFLICTS = 200_000;

/**
 * Finds a cost-optimal plan of `task` (grounded from `model` with `groundOptions`) and proves
 * it, within the limits of `opts`. Never claims `optimal` or `unsolvable` without a proof the
 * certificate can carry (DRAT, landmark record, or relaxed unreachability).
 */
export async function optimize(model: Model, task: Task, groundOptions: GroundOptions, opts: OptimizeOptions = {}): Promise<OptimizeOutcome> {
  // every phase (analysis, heuristics, search, horizon, encoding) polls these limits
  return withLimits({ deadline: deadlineOf(opts), memoryLimitMb: opts.memoryLimitMb, signal: opts.signal }, () => optimizeWithin(model, task, groundOptions, opts));
}

async function optimizeWithin(model: Model, task: Task, groundOptions: GroundOptions, opts: OptimizeOptions): Promise<OptimizeOutcome> {
  const t0 = performance.now();
  let run: Run;
  try {
    run = new Run(model, task, groundOptions, opts); // analyses the task (can be long)
  } catch (e) {
    if (isLimitReached(e)) return stoppedOutcome(e.reason, (performance.now() - t0) / 1000, "analysing the task");
    throw e;
  }
  // say what is minimised when the model does not (no action costs, or no :metric)
  const costNote = costModelNote(model);
  if (costNote) run.notes.push(costNote);
  try {
    return await drive(run);
  } catch (e) {
    // a limit stopped a synchronous phase: report the best plan so far
    if (isLimitReached(e)) return finish(run, run.best ? "feasible" : "unknown", null, e.reason);
    throw e;
  } finally {
    run.stopHelper();
    run.close();
    // the work directory holds only temporary files; a proof that is kept was handed over
    // inside it, so remove the directory only when it is empty
    try {
      fs.rmdirSync(run.workDir);
    } catch {
      /* a kept proof is still inside; disposeOutcome removes it */
    }
  }
}

async function drive(run: Run): Promise<OptimizeOutcome> {
  const { task } = run;
  // 1. lower bound (landmark-cut, re-checked by the independent checker)
  const lm = landmarkCutAtInit(task);
  if (lm === null) {
    run.lower = Infinity;
    run.event("proof", "goal unreachable even ignoring deletes");
    return finish(run, "unsolvable", "relaxed-unreachable", null, { provedBy: "relaxed reachability (h-max infinite)" });
  }
  if (checkLandmarkCertificate(task, lm).valid) {
    run.lower = lm.bound;
    run.landmarks = lm;
  } else run.notes.push("the landmark-cut record did not pass its own check; lower bound 0 used");
  run.event("lower-bound", `landmark-cut ${run.lower}`);
  run.progress.say(`lower bound ${run.lower} (landmark-cut); ${run.prepared.task.facts.length} facts, ${run.prepared.task.actions.length} actions after pruning`);
  run.startHelper();

  // 2. first plan: the caller's incumbent when it is a plan of this task, else GBFS
  const incumbent = run.opts.incumbent ? incumbentIds(task, run.opts.incumbent) : null;
  if (run.opts.incumbent && !incumbent) run.notes.push("the given incumbent is not a plan of this task; GBFS looks for a first plan instead");
  let exhausted = false;
  if (incumbent) run.improve(incumbent, "incumbent", true);
  else {
    const firstBudget = (run.opts.firstPlanSeconds ?? Math.min(30, run.budget.left() / 10)) * 1000;
    const g = gbfs(run.prepared.task, { deadline: Math.min(run.budget.deadline, Date.now() + firstBudget), signal: run.budget.signal });
    if (g.status === "solved") run.improve(g.plan!, "GBFS");
    else if (g.status === "unsolvable") exhausted = true;
    else run.progress.say(`GBFS found no plan within its budget (${g.stopReason ?? "limit"}); trying SAT at growing horizons`);
  }

  // 3. no plan yet: reachability at growing horizons, up to the plain-reachability threshold
  if (run.best === null) {
    const r = await findFirstPlan(run, exhausted);
    if (r) return r;
  }
  // 4. prove: the suffix route (short horizons, handing over at a threshold), or thresholds only
  return run.opts.suffix === false ? thresholdRoute(run) : suffixRoute(run, thresholdRoute);
}

/** Without a plan: SAT at growing horizons; UNSAT at the reachability threshold proves unsolvability. */
async function findFirstPlan(run: Run, exhausted: boolean): Promise<OptimizeOutcome | null> {
  const rep = run.horizonFor(Infinity);
  const Hinf = rep.horizon;
  let T = 4;
  for (;;) {
    // a plan from the exact explicit search (horizonFor) or the A* helper ends this phase
    run.pollHelper();
    if (run.best !== null) return null;
    const stop = run.budget.stop();
    if (stop) return finish(run, "unknown", null, stop);
    const last = !(T < Hinf);
    const steps = last ? Hinf : T;
    if (!Number.isFinite(steps)) break;
    const spec = run.spec(steps, Infinity);
    const fit = run.fits(spec);
    if (!fit.ok) {
      run.notes.push(`reachability formula too large: ${fit.why}`);
      break;
    }
    const s = run.open(spec, last);
    run.progress.state.phase = last ? "unsolvability proof" : "looking for a first plan";
    const q = await run.ask(s, Infinity);
    if (q.status === "sat") {
      run.planFrom(s, q.value!, `SAT at horizon ${steps}`);
      run.close();
      return null;
    }
    if (q.status === "unknown") {
      run.close();
      if (q.interrupted) continue;
      return finish(run, "unknown", null, run.budget.stop() ?? "time");
    }
    if (last) {
      const proof = run.finishProof(s);
      if (proof === null) {
        run.close();
        run.notes.push("the reachability query was unsatisfiable, but no checked proof was produced");
        return finish(run, "unknown", null, "no-proof");
      }
      const checked = selfCheck(run, s.formula, [], proof);
      if (!checked.ok) return checked.outcome;
      run.lower = Infinity;
      run.event("proof", `no plan within the reachability threshold ${steps}`);
      return finish(run, "unsolvable", "horizon-unsat", null, { horizon: rep, formula: s.formula, units: [], bound: null, proof, proofCheckSeconds: checked.seconds, provedBy: "SAT (unsatisfiable at the reachability threshold, DRAT proof)" });
    }
    run.close();
    T = Math.min(T * 2, Number.isFinite(Hinf) ? Hinf : T * 2);
  }
  // no formula fits: the helper's A* may still find a plan (and prove it)
  await run.awaitHelper();
  if (run.best !== null) return null;
  if (exhausted) {
    // sound, but nothing audit could re-check: `unsolvable` is claimed only with a certificate
    run.notes.push("GBFS exhausted the reachable states without reaching the goal, so no plan exists; that search leaves no certificate, so the status stays unknown");
    return finish(run, "unknown", null, "no-proof", { horizon: rep });
  }
  return finish(run, "unknown", null, "horizon-too-large", { horizon: rep });
}

/**
 * With a plan: tighten until a query at a completeness threshold is unsatisfiable. `known`: the
 * threshold report for the current cost when the caller already has it.
 */
export async function thresholdRoute(run: Run, known?: HorizonReport): Promise<OptimizeOutcome> {
  let probed = false;
  let rep0 = known ?? null;
  for (;;) {
    run.pollHelper();
    const best = run.best!;
    const lb = byLandmarks(run);
    if (lb) return lb;
    const stop = run.budget.stop() ?? (run.certifiedWindowOver() ? "certified" : null);
    if (stop) return finish(run, "feasible", null, stop);
    const rep = rep0 !== null && rep0.upperCost === best.cost ? rep0 : run.horizonFor(best.cost);
    rep0 = null;
    const H = rep.horizon;
    const spec = Number.isFinite(H) ? run.spec(H, best.cost) : null;
    const fit = spec ? run.fits(spec) : { ok: false, why: `horizon ${rep.horizonText}` };
    if (!spec || !fit.ok) {
      run.notes.push(`no proof attempted: ${fit.why}`);
      run.progress.say(`the proof would need horizon ${rep.horizonText}: ${fit.why}; improving the plan at growing horizons instead`);
      return anytime(run, rep);
    }
    if (!probed && run.opts.probes !== false && !run.incumbentOptimal) {
      probed = true;
      const improved = await probe(run, H);
      if (improved === "stop") return finish(run, "feasible", null, run.budget.stop() ?? "time");
      if (improved) continue; // the threshold shrinks with the cost
    }
    const s = run.open(spec, true);
    run.progress.state.phase = "proof at the completeness threshold";
    run.progress.say(`proof formula at horizon ${H} (${rep.winner}): ${s.formula.numVars.toLocaleString("en")} vars, ${s.formula.numClauses.toLocaleString("en")} clauses`);
    for (;;) {
      const C = run.best!.cost;
      const q = await run.ask(s, C - 1);
      if (q.interrupted && run.certifiedWindowOver()) return finish(run, "feasible", null, "certified", { horizon: rep });
      if (q.interrupted) break; // a better plan arrived from the helper: ask again with its cost
      if (q.status === "unknown") return finish(run, "feasible", null, run.budget.stop() ?? "time", { horizon: rep });
      if (q.status === "unsat") {
        const proof = run.finishProof(s) ?? (await run.reproveBuiltin(s.formula, C - 1));
        if (proof === "sat") throw new InternalError("the built-in solver found a model the external solver called impossible");
        if (proof === null) return finish(run, "feasible", null, run.budget.stop() ?? "no-proof");
        return proven(run, rep, s.formula, C - 1, proof, "horizon-unsat");
      }
      run.planFrom(s, q.value!, `SAT at horizon ${H}`);
      if (run.best!.cost === run.lower) break;
      const smaller = run.pipeline.horizon(run.best!.cost, run.opts.horizonLimits).horizon;
      if (smaller <= REENCODE_FRACTION * H) {
        run.progress.say(`horizon for cost < ${run.best!.cost} is ${smaller}: re-encoding`);
        break;
      }
    }
    run.close();
  }
}

/**
 * Quick queries at short horizons (no proof), a conflict budget each: cheap plans that need
 * few steps are found before the large proof formula is built. Returns true when the plan
 * improved, "stop" when a limit was reached.
 */
async function probe(run: Run, H: number): Promise<boolean | "stop"> {
  let improved = false;
  let T = Math.max(2, Math.ceil(run.best!.length / 2));
  while (T < 0.6 * H) {
    const spec = run.spec(T, run.best!.cost);
    if (!run.fits(spec).ok) break;
    const s = run.open(spec, false);
    run.progress.state.phase = "cheaper plan at a short horizon (no proof)";
    for (;;) {
      const q = await run.ask(s, run.best!.cost - 1, PROBE_CONFLICTS);
      if (q.status !== "sat") break;
      run.planFrom(s, q.value!, `SAT at horizon ${T}`);
      improved = true;
      if (run.best!.cost === run.lower) break;
    }
    run.close();
    if (run.budget.stop()) return "stop";
    if (run.best!.cost === run.lower) break;
    T = Math.ceil(T * 1.5);
  }
  return improved;
}

/** Horizon too large for a proof: improve the plan at growing horizons, claim nothing more. */
async function anytime(run: Run, rep: HorizonReport): Promise<OptimizeOutcome> {
  let T = Math.max(2, Math.ceil(run.best!.length / 2));
  for (;;) {
    run.pollHelper();
    const lb = byLandmarks(run);
    if (lb) return lb;
    const stop = run.budget.stop() ?? (run.certifiedWindowOver() ? "certified" : null);
    if (stop) return finish(run, "feasible", null, stop, { horizon: rep });
    const spec = run.spec(T, run.best!.cost);
    if (!run.fits(spec).ok) {
      await run.awaitHelper();
      return finish(run, "feasible", null, run.budget.stop() ?? "horizon-too-large", { horizon: rep });
    }
    const s = run.open(spec, false);
    run.progress.state.phase = "improving (no proof possible)";
    for (;;) {
      const q = await run.ask(s, run.best!.cost - 1, ANYTIME_CONFLICTS);
      const stopped = run.budget.stop();
      if (q.status === "unknown" && stopped) return finish(run, "feasible", null, stopped, { horizon: rep });
      if (q.interrupted) break;
      if (q.status !== "sat") break; // unsat, or undecided within its conflicts: try a longer horizon
      run.planFrom(s, q.value!, `SAT at horizon ${T}`);
      if (run.best!.cost === run.lower) break;
    }
    run.close();
    T *= 2;
  }
}

export { disposeOutcome } from "./outcome.js";
export type { StopReason };
