// One optimizer run's state: limits, progress, the best plan so far, bounds, timeline, and the
// open SAT session — shared by the threshold route (driver.ts) and the suffix route.
import * as fs from "node:fs";
import { extractPlan, PARTS, type PartId, type PartParams } from "../encode/index.js";
import type { GroundOptions, Task } from "../ground/index.js";
import type { HorizonReport } from "../horizon/index.js";
import type { Model } from "../pddl/index.js";
import { landmarkCutAtInit, relaxedReachableWithout, type LandmarkRecord, type SearchRecord } from "../search/index.js";
import { PlumblineError } from "../util/errors.js";
import { Budget } from "./budget.js";
import { resolveEncoding, type EncodingChoice } from "./encoding-choice.js";
import { estimateFormula } from "./estimate.js";
import { formulaId, type Formula, type FormulaSpec } from "./formula.js";
import { planningPipeline, type PlanningPipeline } from "./pipeline.js";
import { checkPlan, dropRedundant, InternalError, toGroundIds, type CheckedPlan } from "./plan-check.js";
import { Progress } from "./progress.js";
import { builtinSession, externalSession, makeWorkDir, SLICE_MS, type ProofFile, type QueryResult, type SatSession } from "./sat-session.js";
import { PortfolioRun } from "./portfolio.js";
import { defaultThreads, SearchHelper } from "./search-helper.js";
import type { OptimizeOptions, TimelineEvent } from "./types.js";

/** How long a proving query runs alone before a second solver joins it (when a core is free). */
const PORTFOLIO_AFTER_MS = 2000;

export class Run {
  readonly budget: Budget;
  readonly progress: Progress;
  readonly timeline: TimelineEvent[] = [];
  readonly notes: string[] = [];
  readonly pipeline: PlanningPipeline;
  readonly encoding: EncodingChoice;
  readonly engine: string;
  readonly workDir: string;
  best: CheckedPlan | null = null;
  /** Proven lower bound on the optimum (landmark-cut, then refutations of the suffix route). */
  lower = 0;
  landmarks: LandmarkRecord | null = null;
  satCalls = 0;
  conflicts = 0;
  timeToFirstPlan: number | null = null;
  lastFormula: Formula | null = null;
  /**
   * The optimum as established by the search helper's exhaustive A* (not certifiable: only a
   * SAT refutation or a landmark bound goes into a certificate), or null while unknown.
   */
  optimumKnown: number | null = null;
  private helper: SearchHelper | null = null;
  /** The optimum re-derived by the audit's own plain search (opts.stateSpaceCheck), once tried. */
  stateSpace: { cost: number; states: number } | null = null;
  private stateSpaceTried = false;
  private session: SatSession | null = null;
  private sessionConflicts0 = 0;
  private proofSeq = 0;

  constructor(
    readonly model: Model,
    readonly task: Task,
    readonly groundOptions: GroundOptions,
    readonly opts: OptimizeOptions,
  ) {
    this.budget = new Budget(opts);
    this.progress = new Progress(opts.onProgress, this.budget, opts.progressIntervalMs ?? 2000);
    this.encoding = resolveEncoding(opts.encoding);
    this.engine = opts.sat ?? "builtin";
    if (this.engine !== "builtin" && !this.engine.startsWith("external:")) throw new PlumblineError("usage", `--sat expects builtin or external:CMD, found '${this.engine}'`);
    this.pipeline = planningPipeline(task);
    this.workDir = makeWorkDir(opts.tmpDir);
  }

  get prepared() {
    return this.pipeline.prepared;
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

  /** Starts A* with landmark-cut on a second thread (unless it is not wanted). */
  startHelper(): void {
    if (this.opts.searchHelper === false || this.helper !== null) return;
    this.helper = new SearchHelper(this.prepared.task, { deadline: this.budget.deadline, memoryLimitBytes: this.budget.memoryLimitBytes });
    this.progress.say(
      this.turnTaking
        ? "A* with landmark-cut started on a second thread, taking turns with the SAT queries on one core (a plan it finds becomes the incumbent)"
        : "A* with landmark-cut started on a second thread (a plan it finds becomes the incumbent)",
    );
  }

  /** One core for two searches: the SAT queries give the A* helper most of the time while it runs. */
  get turnTaking(): boolean {
    return (this.opts.threads ?? defaultThreads()) < 2;
  }

  /**
   * Milliseconds a SAT query waits after an unfinished time slice (of about 500 ms): five
   * slices while the helper's A* is running on the shared core, else none.
   */
  satPause(): number {
    return this.turnTaking && this.helper?.running === true ? 5 * SLICE_MS : 0;
  }

  /** Takes the helper's result if it has arrived: an optimal plan becomes the incumbent. True when something changed. */
  pollHelper(): boolean {
    if (this.helper?.recordSettled && this.helper.record === null && this.optimumKnown !== null) this.tryStateSpace();
    const r = this.helper?.take();
    if (!r) return false;
    if (r.status === "solved" && r.plan && r.cost !== null) {
      if (this.best === null || r.cost < this.best.cost) this.improve(r.plan, "A* with landmark-cut (second thread)");
      this.optimumKnown = r.cost;
      this.event("helper", `A* with landmark-cut: the optimum is ${r.cost} (exhaustive search, ${r.expanded} expansions; not certifiable by itself)`);
      // the record of that search is on its way (claim landmark-search): the plain state-space
      // search, as long as the record again on the main thread, waits until it is known to be missing
      return true;
    }
    this.event("helper", `A* with landmark-cut ended: ${r.status}${r.stopReason ? ` (${r.stopReason})` : ""}${r.lowerBound !== null ? `, its lower bound ${r.lowerBound}` : ""}`);
    if (r.status === "unsolvable") this.notes.push("A* with landmark-cut exhausted the reachable states without reaching the goal (not certifiable by itself)");
    return false;
  }

  /** True while a helper result waits to be taken (a query should give way). */
  helperHasNews(): boolean {
    return this.helper?.pending === true || this.certifiedWindowOver();
  }

  /** When a certificate without SAT became possible (search record or state-space), seconds. */
  private certifiableSince: number | null = null;

  /**
   * A certifiable optimum without SAT (a search record or the plain state-space search) is in
   * hand, and the SAT refutation has had as long again (at least 10 s) since: stop trying, the
   * run ends with that certificate instead of spending the whole time limit.
   */
  certifiedWindowOver(): boolean {
    if (this.claimWithoutSat() === null) return false;
    const now = this.budget.elapsed();
    if (this.certifiableSince === null) this.certifiableSince = now;
    return now >= 2 * this.certifiableSince + 10;
  }

  /**
   * The route by which the best plan can be certified optimal without SAT: the plain state-space
   * search re-derived its cost, or the helper's search record bounds everything cheaper; else null.
   */
  claimWithoutSat(): "state-space" | "landmark-search" | null {
    if (this.best === null) return null;
    if (this.stateSpace?.cost === this.best.cost) return "state-space";
    if (this.searchRecord?.bound === this.best.cost) return "landmark-search";
    return null;
  }

  /** The helper's search record proving its optimum (landmark-search), when it has sent one. */
  get searchRecord(): SearchRecord | null {
    return this.helper?.record ?? this.keptRecord;
  }

  private keptRecord: SearchRecord | null = null;

  /**
   * No SAT formula fits: rather than give up, wait (within the limits) for the helper's A* to end,
   * with its optimal plan and search record.
   */
  async awaitHelper(): Promise<void> {
    const h = this.helper;
    if (!h) return;
    this.progress.say("no SAT formula fits: waiting for A* with landmark-cut on the second thread");
    while (this.budget.stop() === null) {
      const ended = await Promise.race([h.exited.then(() => true), new Promise<boolean>((r) => setTimeout(() => r(false), 100))]);
      if (ended) break;
    }
    this.pollHelper();
  }

  stopHelper(): void {
    this.keptRecord = this.helper?.record ?? this.keptRecord;
    this.helper?.stop();
    this.helper = null;
  }

  /** Is the incumbent known to be optimal (by the helper), so only its proof is missing? */
  get incumbentOptimal(): boolean {
    return this.best !== null && this.optimumKnown === this.best.cost;
  }

  /** Raises the proven lower bound (never lowers it). */
  raiseLower(bound: number, how: string): void {
    if (bound <= this.lower) return;
    if (this.best !== null && bound > this.best.cost) throw new InternalError(`${how} proved a lower bound ${bound} above the cost ${this.best.cost} of a valid plan`);
    this.lower = bound;
    this.event("lower-bound", how);
    this.progress.say(`lower bound ${bound} (${how})`);
  }

  /**
   * The formula spec of the run's encoding choice for `steps` and queries below `upper`: its
   * parts without relaxed-suffix-1 (threshold formulas), or with it and the state pairs given.
   */
  spec(steps: number, upper: number, suffix?: { pairs: [number, number][] }): FormulaSpec {
    const parts = new Set<PartId>(this.encoding.parts);
    if (suffix) parts.add("relaxed-suffix-1");
    else parts.delete("relaxed-suffix-1");
    const choice = { ...this.encoding, parts: PARTS.filter((p) => parts.has(p)) };
    const params: PartParams = {};
    if (suffix) params["relaxed-suffix-1"] = { pairs: suffix.pairs.map(([t, u]) => [t, u]) };
    if (parts.has("landmarks-1")) params["landmarks-1"] = { landmarks: this.formulaLandmarks() };
    return this.pipeline.spec(choice, steps, upper, params);
  }

  private landmarkSets: number[][] | null = null;

  /**
   * Landmark-cut's disjunctive action landmarks at the initial state of the analysed task (the
   * formulas' task), each re-checked: without its actions the goal is relaxed-unreachable.
   */
  formulaLandmarks(): number[][] {
    if (this.landmarkSets === null) {
      const rec = landmarkCutAtInit(this.prepared.task);
      this.landmarkSets = (rec?.landmarks ?? []).map((l) => [...l.actions].sort((x, y) => x - y)).filter((l) => !relaxedReachableWithout(this.prepared.task, new Set(l)));
    }
    return this.landmarkSets;
  }

  /** Can a formula of `spec` be built and solved within the limits? */
  fits(spec: FormulaSpec): { ok: boolean; why: string } {
    const est = estimateFormula(this.prepared.task, spec);
    const maxClauses = this.opts.maxClauses ?? 30_000_000;
    if (est.clauses > maxClauses) return { ok: false, why: `about ${est.clauses.toLocaleString("en")} clauses at horizon ${spec.steps} (limit ${maxClauses.toLocaleString("en")})` };
    if (est.bytes > this.budget.memoryLeft()) return { ok: false, why: `about ${Math.round(est.bytes / 1048576)} MB needed at horizon ${spec.steps}, ${Math.round(this.budget.memoryLeft() / 1048576)} MB left under the memory limit` };
    return { ok: true, why: "" };
  }

  /** Builds the formula of `spec` and opens a session on it (closing the previous one). */
  open(spec: FormulaSpec, withProof: boolean): SatSession {
    this.close();
    const formula = this.pipeline.formula(spec);
    this.lastFormula = formula;
    const proofPath = withProof ? `${this.workDir}/proof-${++this.proofSeq}.drat` : null;
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
    this.dropPortfolioProof();
    if (!this.session) return;
    this.conflicts += this.session.stats().conflicts - this.sessionConflicts0;
    this.session.dispose();
    this.session = null;
  }

  /**
   * One query "cost ≤ bound" (Infinity: any plan) on the open session, plus `extra` unit literals.
   * A proving query (no conflict limit) still open after PORTFOLIO_AFTER_MS gets a second solver
   * on the free core when there is one (portfolio.ts); whichever answers first is the answer.
   */
  async ask(s: SatSession, bound: number, conflicts?: number, extra: readonly number[] = []): Promise<QueryResult> {
    await this.yieldToEventLoop();
    this.satCalls++;
    this.progress.state.bound = Number.isFinite(bound) ? bound : null;
    this.dropPortfolioProof(); // a proof belongs to the query it answered, never to a later one
    const units = [...s.formula.boundUnits(bound), ...extra];
    const t0 = Date.now();
    let race = null as PortfolioRun | null;
    const tick = () => {
      this.progress.tick();
      if (race === null && conflicts === undefined && Date.now() - t0 >= (this.opts.portfolioAfterMs ?? PORTFOLIO_AFTER_MS) && this.portfolioCoreFree()) race = this.startPortfolio(s.formula, units);
    };
    try {
      const q = await s.query(units, this.budget, { conflicts, tick, interrupt: () => this.helperHasNews() || race?.decided != null, pause: () => this.satPause() });
      return race === null ? q : await this.settleRace(race, q);
    } catch (e) {
      await race?.stop();
      throw e;
    }
  }

  /** The answer of a raced query: the second solver's when it decided first (the session gave way), else the session's. */
  private async settleRace(race: PortfolioRun, q: QueryResult): Promise<QueryResult> {
    const won = q.interrupted ? race.decided : null;
    await race.stop(won?.status === "unsat"); // an unsat winner's proof file is kept
    if (won === null) return q;
    this.conflicts += won.conflicts;
    this.event("portfolio", `the second solver answered first: ${won.status} (${won.conflicts} conflicts)`);
    if (won.status === "unsat") {
      this.portfolioProof = { file: won.proof!.file, bytes: won.proof!.bytes, format: "binary", engine: "builtin" };
      return { status: "unsat", proved: true };
    }
    const model = won.model!;
    return { status: "sat", value: (v) => model[v] === 1 };
  }

  private lastYield = Date.now();

  /**
   * A turn of the event loop's timers at most every 100 ms between queries: an AbortSignal fired
   * by a timer or an event of the embedding program is seen even when every query answers within
   * its first time slice (a run in the CLI's worker thread also sees the shared abort flag).
   */
  private async yieldToEventLoop(): Promise<void> {
    if (Date.now() - this.lastYield < 100) return;
    await new Promise<void>((resolve) => setTimeout(resolve, 0));
    this.lastYield = Date.now();
  }

  /** The proof of the last unsat answer: the second solver's when it answered first, else the session's. */
  finishProof(s: SatSession): ProofFile | null {
    const p = this.portfolioProof;
    this.portfolioProof = null;
    return p ?? s.finishProof();
  }

  private portfolioProof: ProofFile | null = null;
  private portfolioSeq = 0;

  private dropPortfolioProof(): void {
    if (this.portfolioProof) fs.rmSync(this.portfolioProof.file, { force: true });
    this.portfolioProof = null;
  }

  /**
   * Is a core free for a second solver? With two threads or more, the built-in solver, the A*
   * helper no longer searching, and room under the memory limit for a second copy of the run.
   */
  private portfolioCoreFree(): boolean {
    if (this.opts.portfolio === false || this.turnTaking || this.engine !== "builtin" || this.helper?.running === true) return false;
    return this.budget.memoryLeft() > this.budget.rss();
  }

  private startPortfolio(formula: Formula, units: readonly number[]): PortfolioRun {
    this.event("portfolio", "a second solver (the clauses in reverse order, a proof of its own) races the proving query on the free core");
    this.progress.say("a second solver races the proving query on the free core");
    return new PortfolioRun(formula, units, `${this.workDir}/proof-second-${++this.portfolioSeq}.drat`, this.budget.deadline);
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

  /**
   * An external solver said "unsat" without a checked proof: the query is re-run with the
   * built-in solver. Returns its proof, null when it could not finish, "sat" on disagreement.
   */
  async reproveBuiltin(formula: Formula, bound: number): Promise<ProofFile | null | "sat"> {
    this.notes.push("the external solver gave no checkable proof; re-running the final query with the built-in solver");
    const own = builtinSession(formula, `${this.workDir}/proof-final.drat`);
    const r = await own.query(formula.boundUnits(bound), this.budget, { tick: () => this.progress.tick() });
    this.satCalls++;
    const p = r.status === "unsat" ? own.finishProof() : null;
    this.conflicts += own.stats().conflicts;
    own.dispose();
    if (r.status === "sat") return "sat";
    return p;
  }

  horizonFor(upper: number): HorizonReport {
    const r = this.pipeline.horizon(upper, this.opts.horizonLimits);
    this.event("horizon", `horizon ${r.horizonText} for cost < ${Number.isFinite(upper) ? upper : "∞"} (${r.winner})`);
    // the horizon's exact explicit search settles the optimum on small tasks: never keep a dearer plan
    const exact = this.pipeline.exactOptimum(this.opts.horizonLimits);
    if (exact && this.optimumKnown === null) {
      if (this.best === null || exact.cost < this.best.cost) this.improve(exact.plan, "exact search of the state space (horizon)");
      this.optimumKnown = exact.cost;
      this.event("exact", `the exact explicit search settled the optimum: ${exact.cost} (${exact.states} states stored)`);
      this.tryStateSpace();
    }
    return r;
  }

  /**
   * The optimum is known: ask the audit's own plain state-space search (passed in by the caller;
   * this stage may not import it) to re-derive it on the ground task, once. When it agrees, a run
   * that cannot finish its SAT refutation can still claim optimality by that exhaustive route.
   */
  tryStateSpace(): void {
    if (this.stateSpaceTried || !this.opts.stateSpaceCheck || this.optimumKnown === null) return;
    this.stateSpaceTried = true;
    const r = this.opts.stateSpaceCheck(this.task);
    if (r === null) {
      this.event("state-space", "too large for the audit's plain state-space search: no certificate by that route");
      return;
    }
    if (r.cost !== this.optimumKnown) throw new InternalError(`the plain state-space search finds the optimum ${r.cost}, the optimizer ${this.optimumKnown}`);
    this.stateSpace = { cost: r.cost, states: r.states };
    this.event("state-space", `the audit's plain search re-derives the optimum ${r.cost} over ${r.states} reachable states`);
  }
}
