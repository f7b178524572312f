// The optimizer: lower bound, first plan, then SAT queries "is there a plan cheaper than the
// best?" at a completeness threshold until one is unsatisfiable (with its DRAT proof).
import * as fs from "node:fs";
import * as path from "node:path";
import { prepareTask, type PreparedTask } from "../analyse/index.js";
import { extractPlan } from "../encode/index.js";
import type { GroundOptions, Task } from "../ground/index.js";
import { computeHorizon, type HorizonReport } from "../horizon/index.js";
import type { Model } from "../pddl/index.js";
import { checkLandmarkCertificate, gbfs, landmarkCutAtInit, type LandmarkRecord } from "../search/index.js";
import { PlumblineError } from "../util/errors.js";
import { isLimitReached, withLimits } from "../util/limits.js";
import { Budget, deadlineOf, type StopReason } from "./budget.js";
import { estimateFormula } from "./estimate.js";
import { resolveEncoding, specFor, type EncodingChoice } from "./encoding-choice.js";
import { boundSettings, buildFormula, formulaId, type Formula, type FormulaSpec } from "./formula.js";
import { incumbentIds } from "./incumbent.js";
import { checkPlan, dropRedundant, InternalError, toGroundIds, type CheckedPlan } from "./plan-check.js";
import { Progress } from "./progress.js";
import { stoppedOutcome } from "./stopped.js";
import { builtinSession, externalSession, makeWorkDir, type SatSession } from "./sat-session.js";
import type { OptimizeOptions, OptimizeOutcome, ProofHow, TimelineEvent } from "./types.js";

/** Re-encode at a smaller horizon once it is at most this fraction of the current one. */
const REENCODE_FRACTION = 0.8;
/** Conflicts a probe at a short horizon may spend per query. */
const PROBE_CONFLICTS = 20_000;
/** Conflicts an anytime query (no proof possible) may spend before the horizon grows. */
const ANYTIME_CONFLICTS = 200_000;

/** The driver's state for one run. */
class Run {
  readonly budget: Budget;
  readonly progress: Progress;
  readonly timeline: TimelineEvent[] = [];
  readonly notes: string[] = [];
  readonly prepared: PreparedTask;
  readonly encoding: EncodingChoice;
  readonly engine: string;
  readonly workDir: string;
  best: CheckedPlan | null = null;
  lower = 0;
  landmarks: LandmarkRecord | null = null;
  satCalls = 0;
  conflicts = 0;
  timeToFirstPlan: number | null = null;
  lastFormula: Formula | null = null;
  private session: SatSession | null = null;
  private sessionConflicts0 = 0;

  constructor(
    readonly model: Model,
    readonly task: Task,
    readonly groundOptions: GroundOptions,
    readonly opts: OptimizeOptions,
  ) {
    this.budget = new Budget(opts);
    this.progress = new Progress(opts.onProgress, this.budget, opts.progressIntervalMs ?? 2000);
    this.prepared = prepareTask(task);
    this.encoding = resolveEncoding(opts.encoding);
    this.engine = opts.sat ?? "builtin";
    if (this.engine !== "builtin" && !this.engine.startsWith("external:")) throw new PlumblineError("usage", `--sat expects builtin or external:CMD, found '${this.engine}'`);
    this.workDir = makeWorkDir(opts.tmpDir);
  }

  event(kind: string, detail?: string): void {
    this.timeline.push({ seconds: this.budget.elapsed(), kind, upper: this.best?.cost ?? null, lower: this.lower, detail });
  }

  /** Records a new best plan (ids of the prepared task, or of the ground task with `ground`), validated on the lifted model. */
  improve(workIds: readonly number[], origin: string, ground = false): void {
    const plan = checkPlan(this.model, this.task, dropRedundant(this.task, ground ? workIds : toGroundIds(this.prepared, workIds)), origin);
    if (this.best !== null && plan.cost >= this.best.cost) throw new InternalError(`${origin} returned a plan of cost ${plan.cost}, not cheaper than ${this.best.cost}`);
    if (plan.cost < this.lower) throw new InternalError(`${origin} returned a plan of cost ${plan.cost} below the proven lower bound ${this.lower}`);
    this.best = plan;
    this.opts.onPlan?.(plan);
    if (this.timeToFirstPlan === null) this.timeToFirstPlan = this.budget.elapsed();
    this.event("plan", origin);
    this.progress.say(`plan of cost ${plan.cost} (${plan.length} actions) from ${origin}`);
  }

  spec(steps: number, upper: number): FormulaSpec {
    const groups = this.prepared.variables.variables.filter((v) => v.facts.length > 1).map((v) => [...v.facts]);
    return specFor(this.prepared.task, this.encoding, { steps, ...boundSettings(upper), mutexGroups: groups });
  }

  /** Can a formula of `spec` be built and solved within the limits? */
  fits(spec: FormulaSpec): { ok: boolean; why: string } {
    const est = estimateFormula(this.prepared.task, spec);
    const maxClauses = this.opts.maxClauses ?? 30_000_000;
    if (est.clauses > maxClauses) return { ok: false, why: `about ${est.clauses.toLocaleString("en")} clauses at horizon ${spec.steps} (limit ${maxClauses.toLocaleString("en")})` };
    if (est.bytes > this.budget.memoryLeft()) return { ok: false, why: `about ${Math.round(est.bytes / 1048576)} MB needed at horizon ${spec.steps}, ${Math.round(this.budget.memoryLeft() / 1048576)} MB left under the memory limit` };
    return { ok: true, why: "" };
  }

  open(spec: FormulaSpec, withProof: boolean): SatSession {
    this.close();
    const formula = buildFormula(this.prepared.task, spec);
    this.lastFormula = formula;
    const proofPath = withProof ? path.join(this.workDir, `proof-${this.timeline.length}.drat`) : null;
    const s = this.engine === "builtin" ? builtinSession(formula, proofPath) : externalSession(formula, this.engine.slice("external:".length), this.workDir, this.opts.proofChecker ?? null);
    this.session = s;
    this.sessionConflicts0 = s.stats().conflicts;
    const st = this.progress.state;
    st.horizon = spec.steps;
    st.vars = formula.numVars;
    st.clauses = formula.numClauses;
    st.conflicts = () => this.totalConflicts();
    this.event("encode", `${formulaId(spec)} at horizon ${spec.steps}: ${formula.numVars} variables, ${formula.numClauses} clauses`);
    return s;
  }

  /** Conflicts of every session so far, the open one included. */
  totalConflicts(): number {
    return this.conflicts + (this.session ? this.session.stats().conflicts - this.sessionConflicts0 : 0);
  }

  close(): void {
    if (!this.session) return;
    this.conflicts += this.session.stats().conflicts - this.sessionConflicts0;
    this.session.dispose();
    this.session = null;
  }

  /** One query "cost ≤ bound" (Infinity: any plan) on the open session. */
  async ask(s: SatSession, bound: number, conflicts?: number): Promise<ReturnType<SatSession["query"]>> {
    this.satCalls++;
    this.progress.state.bound = Number.isFinite(bound) ? bound : null;
    const units = s.formula.boundUnits(bound);
    return s.query(units, this.budget, { conflicts, tick: () => this.progress.tick() });
  }

  /** Decodes, linearises and validates a model of the open formula. */
  planFrom(s: SatSession, value: (v: number) => boolean, origin: string): void {
    let ex;
    try {
      ex = extractPlan(this.prepared.task, s.formula.encoding, value);
    } catch (e) {
      throw new InternalError(`decoding a model of the ${origin} formula failed: ${(e as Error).message}`);
    }
    this.improve(ex.plan, origin);
  }

  horizonFor(upper: number): HorizonReport {
    const r = computeHorizon(this.task, upper);
    this.event("horizon", `horizon ${r.horizonText} for cost < ${Number.isFinite(upper) ? upper : "∞"} (${r.winner})`);
    return r;
  }
}

function horizonValue(r: HorizonReport): number | string {
  return Number.isFinite(r.horizon) ? r.horizon : r.horizonText;
}

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
  try {
    return await drive(run);
  } catch (e) {
    // a limit stopped a synchronous phase: report the best plan so far
    if (isLimitReached(e)) return finish(run, run.best ? "feasible" : "unknown", null, e.reason);
    throw e;
  } finally {
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
  return proveBest(run);
}

/** Without a plan: SAT at growing horizons; UNSAT at the reachability threshold proves unsolvability. */
async function findFirstPlan(run: Run, exhausted: boolean): Promise<OptimizeOutcome | null> {
  const rep = run.horizonFor(Infinity);
  const Hinf = rep.horizon;
  let T = 4;
  for (;;) {
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
      return finish(run, "unknown", null, run.budget.stop() ?? "time");
    }
    if (last) {
      const proof = s.finishProof();
      if (proof === null) {
        run.close();
        run.notes.push("the reachability query was unsatisfiable, but no checked proof was produced");
        return finish(run, "unknown", null, "no-proof");
      }
      run.lower = Infinity;
      run.event("proof", `no plan within the reachability threshold ${steps}`);
      return finish(run, "unsolvable", "horizon-unsat", null, { horizon: rep, formula: s.formula, units: [], bound: null, proof, provedBy: "SAT (unsatisfiable at the reachability threshold, DRAT proof)" });
    }
    run.close();
    T = Math.min(T * 2, Number.isFinite(Hinf) ? Hinf : T * 2);
  }
  // no formula fits: only exhaustive search could have settled it
  if (exhausted) {
    // sound, but nothing audit could re-check: `unsolvable` is claimed only with a certificate
    run.notes.push("GBFS exhausted the reachable states without reaching the goal, so no plan exists; that search leaves no certificate, so the status stays unknown");
    return finish(run, "unknown", null, "no-proof", { horizon: rep });
  }
  return finish(run, "unknown", null, "horizon-too-large", { horizon: rep });
}

/** With a plan: tighten until a query at a completeness threshold is unsatisfiable. */
async function proveBest(run: Run): Promise<OptimizeOutcome> {
  let probed = false;
  for (;;) {
    const best = run.best!;
    if (best.cost === run.lower) {
      run.event("proof", "plan cost equals the landmark-cut lower bound");
      return finish(run, "optimal", "lower-bound", null, { provedBy: "landmark-cut lower bound equals the plan's cost" });
    }
    const stop = run.budget.stop();
    if (stop) return finish(run, "feasible", null, stop);
    const rep = run.horizonFor(best.cost);
    const H = rep.horizon;
    const spec = Number.isFinite(H) ? run.spec(H, best.cost) : null;
    const fit = spec ? run.fits(spec) : { ok: false, why: `horizon ${rep.horizonText}` };
    if (!spec || !fit.ok) {
      run.notes.push(`no proof attempted: ${fit.why}`);
      run.progress.say(`the proof would need horizon ${rep.horizonText}: ${fit.why}; improving the plan at growing horizons instead`);
      return anytime(run, rep);
    }
    if (!probed && run.opts.probes !== false) {
      probed = true;
      const improved = await probe(run, H);
      if (improved === "stop") return finish(run, "feasible", null, run.budget.stop() ?? "time");
      if (improved) continue; // the threshold shrinks with the cost
    }
    const s = run.open(spec, true);
    run.progress.state.phase = "proving";
    run.progress.say(`proof formula at horizon ${H} (${rep.winner}): ${s.formula.numVars.toLocaleString("en")} vars, ${s.formula.numClauses.toLocaleString("en")} clauses`);
    for (;;) {
      const C = run.best!.cost;
      const q = await run.ask(s, C - 1);
      if (q.status === "unknown") return finish(run, "feasible", null, run.budget.stop() ?? "time", { horizon: rep });
      if (q.status === "unsat") {
        const proof = s.finishProof();
        if (proof === null) {
          // an external solver without a usable proof: redo the final query with ours
          run.notes.push("the external solver gave no checkable proof; re-running the final query with the built-in solver");
          const own = builtinSession(s.formula, path.join(run.workDir, "proof-final.drat"));
          const r = await own.query(s.formula.boundUnits(C - 1), run.budget, { tick: () => run.progress.tick() });
          run.satCalls++;
          const p = r.status === "unsat" ? own.finishProof() : null;
          run.conflicts += own.stats().conflicts;
          own.dispose();
          if (r.status === "sat") throw new InternalError("the built-in solver found a model the external solver called impossible");
          if (p === null) return finish(run, "feasible", null, run.budget.stop() ?? "no-proof");
          return proven(run, rep, s.formula, C - 1, p);
        }
        return proven(run, rep, s.formula, C - 1, proof);
      }
      run.planFrom(s, q.value!, `SAT at horizon ${H}`);
      if (run.best!.cost === run.lower) break;
      const smaller = computeHorizon(run.task, run.best!.cost).horizon;
      if (smaller <= REENCODE_FRACTION * H) {
        run.progress.say(`horizon for cost < ${run.best!.cost} is ${smaller}: re-encoding`);
        break;
      }
    }
    run.close();
  }
}

function proven(run: Run, rep: HorizonReport, formula: Formula, bound: number, proof: NonNullable<ReturnType<SatSession["finishProof"]>>): OptimizeOutcome {
  run.lower = run.best!.cost;
  run.event("proof", `no plan of cost ≤ ${bound} within horizon ${formula.spec.steps}`);
  return finish(run, "optimal", "horizon-unsat", null, {
    horizon: rep,
    formula,
    units: formula.boundUnits(bound),
    bound,
    proof,
    provedBy: `SAT (${proof.engine === "builtin" ? "built-in solver" : "external solver"}, unsatisfiable at horizon ${formula.spec.steps}, DRAT proof)`,
  });
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
    run.progress.state.phase = "probing";
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
    if (run.best!.cost === run.lower) {
      run.event("proof", "plan cost equals the landmark-cut lower bound");
      return finish(run, "optimal", "lower-bound", null, { provedBy: "landmark-cut lower bound equals the plan's cost" });
    }
    const stop = run.budget.stop();
    if (stop) return finish(run, "feasible", null, stop, { horizon: rep });
    const spec = run.spec(T, run.best!.cost);
    if (!run.fits(spec).ok) return finish(run, "feasible", null, "horizon-too-large", { horizon: rep });
    const s = run.open(spec, false);
    run.progress.state.phase = "improving (no proof possible)";
    for (;;) {
      const q = await run.ask(s, run.best!.cost - 1, ANYTIME_CONFLICTS);
      const stopped = run.budget.stop();
      if (q.status === "unknown" && stopped) return finish(run, "feasible", null, stopped, { horizon: rep });
      if (q.status !== "sat") break; // unsat, or undecided within its conflicts: try a longer horizon
      run.planFrom(s, q.value!, `SAT at horizon ${T}`);
      if (run.best!.cost === run.lower) break;
    }
    run.close();
    T *= 2;
  }
}

interface FinishExtra {
  horizon?: HorizonReport;
  formula?: Formula;
  units?: number[];
  bound?: number | null;
  proof?: NonNullable<ReturnType<SatSession["finishProof"]>>;
  provedBy?: string;
}

function finish(run: Run, status: OptimizeOutcome["status"], how: ProofHow | null, stopReason: OptimizeOutcome["stopReason"], extra: FinishExtra = {}): OptimizeOutcome {
  if (stopReason) run.event("stop", stopReason);
  const formula = extra.formula ?? null;
  const claimable = (status === "optimal" || status === "unsolvable") && how !== null;
  const horizon = extra.horizon ?? null;
  const lastSpec = formula?.spec ?? run.lastFormula?.spec ?? null;
  const out: OptimizeOutcome = {
    status,
    stopReason,
    cost: run.best?.cost ?? null,
    lowerBound: run.lower,
    plan: run.best,
    how,
    provedBy: extra.provedBy ?? null,
    horizon: formula ? formula.spec.steps : horizon ? horizonValue(horizon) : null,
    horizonWinner: horizon?.winner ?? null,
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
      horizon: how === "horizon-unsat" ? horizon : null,
      formula: how === "horizon-unsat" ? formula : null,
      units: extra.units ?? [],
      bound: extra.bound ?? null,
      proof: extra.proof ?? null,
      landmarks: how === "lower-bound" ? run.landmarks : null,
      timeline: run.timeline,
    };
  }
  return out;
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

export type { StopReason };
