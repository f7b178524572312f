// The DRAT checker proper: a forward pass that replays formula and proof with unit propagation
// until the refutation's conflict, then a backward pass that checks only the lemmas the
// refutation needs (core marking), by reverse unit propagation (RUP) or, failing that, RAT.
import { ClauseDb, FLAG_ACTIVE, FLAG_CORE, FLAG_TAUT, litOf } from "./clause-db.js";
import type { CheckerCnf } from "./cnf-reader.js";
import { CoreMarker } from "./core-marking.js";
import { HintLog } from "./hint-log.js";
import { writeLrat, type LratSink } from "./lrat-writer.js";
import type { ProofSteps } from "./proof-reader.js";
import { NO_CONFLICT, Propagator } from "./propagator.js";
import { isAborted, limitReason } from "../util/limits.js";

// copied once (see propagator.ts)
const ACTIVE = FLAG_ACTIVE;
const CORE = FLAG_CORE;
const TAUT = FLAG_TAUT;

export type CheckMode = "backward" | "forward";

export interface DratOptions {
  /** "backward" (default): check only lemmas the refutation uses. "forward": check every lemma before the refutation point. */
  mode?: CheckMode;
  /** Also return the numbers of the lemmas in the core (backward mode). */
  wantCore?: boolean;
  deadline?: number;
  signal?: AbortSignal;
  /**
   * Backward mode only: also write an LRAT proof of the refutation (text; core lemmas with hint
   * chains). `true` returns it as `DratResult.lrat`; a function receives it in chunks instead.
   * Nothing is written for a proof that is rejected.
   */
  lrat?: boolean | LratSink;
}

export interface FailedLemma {
  /** 1-based number of the lemma among the proof's additions. */
  index: number;
  /** 0-based index among all proof steps (additions and deletions). */
  step: number;
  clause: number[];
  reason: string;
  /** Text proofs: the line of the lemma; binary proofs: its byte offset. */
  line?: number;
  byteOffset?: number;
}

export interface DratStats {
  mode: CheckMode;
  format: "binary" | "text";
  originalClauses: number;
  lemmas: number;
  deletions: number;
  /** Lemmas checked by RUP/RAT. */
  checkedLemmas: number;
  /** Lemmas marked as needed (backward mode). */
  coreLemmas: number;
  ratLemmas: number;
  /** Deletions not applied: unit clauses and reasons of top-level assignments (sound to keep). */
  ignoredDeletions: number;
  /** Deletions of clauses that were not present. */
  missingDeletions: number;
  /** Steps after the point where unit propagation already refutes the formula (not checked). */
  stepsAfterConflict: number;
  /** LRAT output: lines written (additions and deletions); 0 without LRAT. */
  lratLines: number;
  seconds: number;
}

export interface DratResult {
  valid: boolean;
  /** Why the proof was rejected (absent when valid). */
  reason?: string;
  failedLemma?: FailedLemma;
  coreLemmas?: number[];
  /** The LRAT proof (text) when `lrat: true` was asked and the proof is valid. */
  lrat?: Uint8Array;
  stats: DratStats;
}

class Stopped extends Error {}

/** Checks `proof` against `cnf`; never throws on a bad proof (only on a stop request). */
export function checkSteps(cnf: CheckerCnf, proof: ProofSteps, opts: DratOptions = {}): DratResult {
  const t0 = performance.now();
  const mode = opts.mode ?? "backward";
  const stats: DratStats = {
    mode,
    format: proof.format,
    originalClauses: cnf.clauses.length,
    lemmas: 0,
    deletions: 0,
    checkedLemmas: 0,
    coreLemmas: 0,
    ratLemmas: 0,
    ignoredDeletions: 0,
    missingDeletions: 0,
    stepsAfterConflict: 0,
    lratLines: 0,
    seconds: 0,
  };
  for (let t = 0; t < proof.count; t++) {
    if (proof.deletion[t]) stats.deletions++;
    else stats.lemmas++;
  }
  const finish = (r: Omit<DratResult, "stats">): DratResult => {
    stats.seconds = (performance.now() - t0) / 1000;
    return { ...r, stats };
  };
  if (opts.lrat && mode !== "backward") throw new RangeError("LRAT output needs the backward mode");
  if (proof.error !== null) return finish({ valid: false, reason: `unreadable proof: ${proof.error}` });
  // per-variable arrays are sized by the largest variable: refuse absurd ones instead of exhausting memory
  const varLimit = Math.max(2 * cnf.numVars, 1 << 25);
  if (proof.maxVar > varLimit) return finish({ valid: false, reason: `the proof uses variable ${proof.maxVar}, beyond the ${varLimit} this checker supports for a formula of ${cnf.numVars} variables` });
  // an explicit empty clause must be the last step
  for (let t = 0; t < proof.count; t++) {
    if (!proof.deletion[t] && proof.length[t] === 0 && t < proof.count - 1) {
      return finish({ valid: false, reason: `the proof continues after the empty clause (step ${t + 1} of ${proof.count})` });
    }
  }

  let maxVar = Math.max(cnf.numVars, proof.maxVar);
  let cnfLits = 0;
  for (const c of cnf.clauses) {
    cnfLits += c.length;
    for (let i = 0; i < c.length; i++) maxVar = Math.max(maxVar, Math.abs(c[i]));
  }
  const proofLits = proof.count > 0 ? proof.start[proof.count - 1] + proof.length[proof.count - 1] : 0;
  const db = new ClauseDb(maxVar, cnf.clauses.length + stats.lemmas, cnfLits + proofLits);
  const pr = new Propagator(db, maxVar);
  const hints = opts.lrat ? new HintLog(proof.count) : null;
  const cm = new CoreMarker(db, pr, maxVar, hints);
  const lemma = new LemmaCheck(db, pr, cm, hints, stats);
  const stepClause = new Int32Array(proof.count).fill(-1);
  const trailAfter = new Int32Array(proof.count);
  const lemmaNumber = new Int32Array(proof.count);
  let tick = 0;
  const poll = (): void => {
    if ((++tick & 1023) !== 0) return;
    if (isAborted(opts.signal) || (opts.deadline !== undefined && Date.now() >= opts.deadline) || limitReason() !== null) throw new Stopped();
  };

  try {
    // forward: the formula
    let conflictStep = -2; // -2 none yet, -1 in the formula itself, else the step index
    let conflict = NO_CONFLICT;
    for (let i = 0; i < cnf.clauses.length && conflictStep === -2; i++) {
      const id = db.store(cnf.clauses[i], 0, cnf.clauses[i].length);
      conflict = pr.attach(id, true);
      if (conflict === NO_CONFLICT) conflict = pr.propagate();
      if (conflict !== NO_CONFLICT) conflictStep = -1;
    }
    const originals = db.count;
    const baseTrail = pr.tlen;
    // forward: the proof
    let lemmaNo = 0;
    for (let t = 0; t < proof.count; t++) {
      poll();
      if (conflictStep !== -2) {
        stats.stepsAfterConflict = proof.count - t;
        break;
      }
      const s = proof.start[t];
      const n = proof.length[t];
      if (proof.deletion[t]) {
        const id = db.find(proof.lits, s, n);
        if (id < 0) stats.missingDeletions++;
        else if (db.len[id] <= 1 || isReason(db, pr, id)) stats.ignoredDeletions++;
        else {
          db.flags[id] &= ~ACTIVE;
          stepClause[t] = id;
        }
      } else {
        lemmaNumber[t] = ++lemmaNo;
        const id = db.store(proof.lits, s, n);
        stepClause[t] = id;
        if (mode === "forward") {
          stats.checkedLemmas++;
          const why = lemma.check(id, -2);
          if (why !== null) return finish(failure(proof, t, lemmaNo, why));
        }
        conflict = pr.attach(id, true);
        if (conflict === NO_CONFLICT) conflict = pr.propagate();
        if (conflict !== NO_CONFLICT) conflictStep = t;
      }
      trailAfter[t] = pr.tlen;
    }
    if (conflictStep === -2) {
      return finish({ valid: false, reason: `no refutation: after all ${stats.lemmas} lemmas, unit propagation finds no conflict (is the proof incomplete or truncated?)` });
    }
    if (mode === "forward") return finish({ valid: true });

    // backward: check the lemmas the conflict depends on, newest first
    hints?.begin(-1);
    cm.analyze(conflict, -1, pr.tlen);
    hints?.end();
    const unassigned = (v: number): void => cm.unassigned(v);
    for (let t = conflictStep; t >= 0; t--) {
      poll();
      const id = stepClause[t];
      if (proof.deletion[t]) {
        if (id >= 0) {
          db.flags[id] |= ACTIVE;
          pr.attach(id, false);
        }
        continue;
      }
      db.flags[id] &= ~ACTIVE;
      pr.backtrack(t > 0 ? trailAfter[t - 1] : baseTrail, unassigned);
      if ((db.flags[id] & CORE) === 0) continue;
      stats.checkedLemmas++;
      const why = lemma.check(id, t);
      if (why !== null) return finish(failure(proof, t, lemmaNumber[t], why));
    }
    const core: number[] = [];
    for (let t = 0; t <= conflictStep; t++) {
      if (!proof.deletion[t] && db.flags[stepClause[t]] & CORE) {
        stats.coreLemmas++;
        if (opts.wantCore) core.push(lemmaNumber[t]);
      }
    }
    let lratBytes: Uint8Array | undefined;
    if (hints && opts.lrat) {
      const chunks: string[] = [];
      const sink: LratSink = typeof opts.lrat === "function" ? opts.lrat : (chunk) => chunks.push(chunk);
      stats.lratLines = writeLrat({ db, hints, cm, proof, stepClause, trailAfter, baseTrail, conflictStep, originals, formulaClauses: cnf.clauses.length }, sink);
      if (opts.lrat === true) lratBytes = Buffer.from(chunks.join(""), "latin1");
    }
    return finish({ valid: true, ...(opts.wantCore ? { coreLemmas: core } : {}), ...(lratBytes ? { lrat: lratBytes } : {}) });
  } catch (e) {
    if (e instanceof Stopped) return finish({ valid: false, reason: "stopped: time limit or abort before the check finished" });
    throw e;
  }
}

/** Is clause `id` the reason of a current assignment? (Its implied literal is one of its first two.) */
function isReason(db: ClauseDb, pr: Propagator, id: number): boolean {
  const s = db.start[id];
  for (let i = 0; i < 2 && i < db.len[id]; i++) {
    const x = db.lits[s + i];
    if (pr.reason[x >> 1] === id && pr.val[x] === 1) return true;
  }
  return false;
}

function failure(proof: ProofSteps, t: number, lemmaNo: number, why: string): Omit<DratResult, "stats"> {
  const clause = Array.from(proof.lits.subarray(proof.start[t], proof.start[t] + proof.length[t]));
  const where = proof.format === "text" ? { line: proof.where[t] } : { byteOffset: proof.where[t] };
  const shown = clause.length > 12 ? `${clause.slice(0, 12).join(" ")} … (${clause.length} literals)` : clause.join(" ") || "(empty)";
  return {
    valid: false,
    reason: `lemma ${lemmaNo} [${shown}] ${why}`,
    failedLemma: { index: lemmaNo, step: t, clause, reason: why, ...where },
  };
}

/** RUP and RAT tests of one lemma against the active clauses and the current top-level trail. */
class LemmaCheck {
  private scratch = new Int32Array(64);

  constructor(
    private readonly db: ClauseDb,
    private readonly pr: Propagator,
    private readonly cm: CoreMarker,
    private readonly hints: HintLog | null,
    private readonly stats: DratStats,
  ) {}

  /**
   * null when lemma `id` is RUP or RAT, else why not. `step` ≥ 0: backward check of that proof
   * step (marks the clauses used as core, logs hints); −2: forward check (no marking).
   */
  check(id: number, step: number): string | null {
    const db = this.db;
    if (db.flags[id] & TAUT) return null;
    const mark = step >= 0;
    const s = db.start[id];
    const n = db.len[id];
    this.hints?.begin(step);
    try {
      if (this.rup(db.lits, s, n, mark)) return null;
      if (n === 0) return "is the empty clause, but unit propagation finds no conflict";
      const bad = this.ratCounterexample(id, mark);
      if (bad === null) {
        this.stats.ratLemmas++;
        return null;
      }
      const pivot = litOf(db.pivot[id]);
      return `is not implied: unit propagation on its negation finds no conflict (not RUP), and it is not RAT on its first literal ${pivot}: the resolvent with clause [${bad.join(" ")}] is not RUP`;
    } finally {
      this.hints?.end();
    }
  }

  /** Is the clause of codes src[from..from+n) implied by unit propagation? Marks the core when asked. */
  private rup(src: Int32Array, from: number, n: number, mark: boolean): boolean {
    const pr = this.pr;
    const val = pr.val;
    const saved = pr.tlen;
    for (let i = 0; i < n; i++) {
      const x = src[from + i];
      if (val[x] === 1) {
        if (mark) this.cm.analyze(NO_CONFLICT, x >> 1, saved);
        return true;
      }
    }
    for (let i = 0; i < n; i++) {
      const x = src[from + i];
      if (val[x] === 0) pr.assign(x ^ 1, -1);
    }
    pr.queueFrom(saved);
    const c = pr.propagate();
    if (c !== NO_CONFLICT && mark) this.cm.analyze(c, -1, saved);
    pr.backtrack(saved);
    return c !== NO_CONFLICT;
  }

  /** RAT on the lemma's pivot: null if every resolvent is RUP, else the clause that fails. */
  private ratCounterexample(id: number, mark: boolean): number[] | null {
    const db = this.db;
    const s = db.start[id];
    const n = db.len[id];
    const neg = db.pivot[id] ^ 1;
    for (let d = 0; d < db.count; d++) {
      if (d === id || (db.flags[d] & (ACTIVE | TAUT)) !== ACTIVE) continue;
      const ds = db.start[d];
      const dn = db.len[d];
      let has = false;
      for (let i = 0; i < dn; i++) if (db.lits[ds + i] === neg) has = true;
      if (!has) continue;
      if (this.scratch.length < n + dn) this.scratch = new Int32Array(2 * (n + dn));
      const buf = this.scratch;
      let m = 0;
      for (let i = 0; i < n; i++) buf[m++] = db.lits[s + i];
      let taut = false;
      for (let i = 0; i < dn && !taut; i++) {
        const x = db.lits[ds + i];
        if (x === neg) continue;
        for (let k = 0; k < n; k++) if (buf[k] === (x ^ 1)) taut = true;
        buf[m++] = x;
      }
      if (taut) continue;
      this.hints?.candidate(d);
      if (!this.rup(buf, 0, m, mark)) return db.dimacs(d);
    }
    return null;
  }
}
