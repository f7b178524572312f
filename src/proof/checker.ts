// The DRAT checker proper: a forward pass that replays formula and proof with unit propagation
// until the refutation's conflict, then a backward pass that checks only the lemmas the
// refutation needs (core marking), by reverse unit propagation (RUP) or, failing that, RAT.
import type { CheckerCnf } from "./cnf-reader.js";
import { ClauseStore, FLAG_ACTIVE, FLAG_CORE, FLAG_TAUT } from "./clause-store.js";
import type { ProofSteps } from "./proof-reader.js";

export type CheckMode = "backward" | "forward";

export interface DratOptions {
  /** "backward" (default): check only lemmas the refutation uses. "forward": check every lemma before the refutation point. */
  mode?: CheckMode;
  /** Also return the numbers of the lemmas in the core (backward mode). */
  wantCore?: boolean;
  deadline?: number;
  signal?: AbortSignal;
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
  seconds: number;
}

export interface DratResult {
  valid: boolean;
  /** Why the proof was rejected (absent when valid). */
  reason?: string;
  failedLemma?: FailedLemma;
  coreLemmas?: number[];
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
  if (proof.error !== null) return finish({ valid: false, reason: `unreadable proof: ${proof.error}` });
  // an explicit empty clause must be the last step
  for (let t = 0; t < proof.count; t++) {
    if (!proof.deletion[t] && proof.length[t] === 0 && t < proof.count - 1) {
      return finish({ valid: false, reason: `the proof continues after the empty clause (step ${t + 1} of ${proof.count})` });
    }
  }

  let maxVar = Math.max(cnf.numVars, proof.maxVar);
  for (const c of cnf.clauses) for (let i = 0; i < c.length; i++) maxVar = Math.max(maxVar, Math.abs(c[i]));
  const db = new ClauseStore(maxVar, cnf.clauses.length + stats.lemmas);
  const stepClause = new Int32Array(proof.count).fill(-1);
  const trailAfter = new Int32Array(proof.count);
  const lemmaNumber = new Int32Array(proof.count);
  let tick = 0;
  const poll = (): void => {
    if ((++tick & 1023) !== 0) return;
    if (opts.signal?.aborted || (opts.deadline !== undefined && Date.now() >= opts.deadline)) throw new Stopped();
  };

  try {
    // forward: the formula
    let conflictStep = -2; // -2 none yet, -1 in the formula itself, else the step index
    for (let i = 0; i < cnf.clauses.length && conflictStep === -2; i++) {
      const id = db.store(cnf.clauses[i], 0, cnf.clauses[i].length);
      db.hashInsert(id);
      if (db.attachAndPropagate(id) >= 0) conflictStep = -1;
    }
    const baseTrail = db.tlen;
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
        else if (db.len[id] <= 1 || db.isReason(id)) stats.ignoredDeletions++;
        else {
          db.flags[id] &= ~FLAG_ACTIVE;
          stepClause[t] = id;
        }
      } else {
        lemmaNumber[t] = ++lemmaNo;
        const id = db.store(proof.lits, s, n);
        stepClause[t] = id;
        if (mode === "forward") {
          stats.checkedLemmas++;
          const why = checkLemma(db, id, false, stats);
          if (why !== null) return finish(failure(proof, t, lemmaNo, why));
        }
        db.hashInsert(id);
        if (db.attachAndPropagate(id) >= 0) conflictStep = t;
      }
      trailAfter[t] = db.tlen;
    }
    if (conflictStep === -2) {
      return finish({ valid: false, reason: `no refutation: after all ${stats.lemmas} lemmas, unit propagation finds no conflict (is the proof incomplete or truncated?)` });
    }
    if (mode === "forward") return finish({ valid: true });

    // backward: check the lemmas the conflict depends on, newest first
    db.markConflict(db.lastConflict);
    for (let t = conflictStep; t >= 0; t--) {
      poll();
      const id = stepClause[t];
      if (proof.deletion[t]) {
        if (id >= 0) {
          db.flags[id] |= FLAG_ACTIVE;
          db.reattach(id);
        }
        continue;
      }
      db.flags[id] &= ~FLAG_ACTIVE;
      db.backtrack(t > 0 ? trailAfter[t - 1] : baseTrail);
      if ((db.flags[id] & FLAG_CORE) === 0) continue;
      stats.checkedLemmas++;
      const why = checkLemma(db, id, true, stats);
      if (why !== null) return finish(failure(proof, t, lemmaNumber[t], why));
    }
    const core: number[] = [];
    for (let t = 0; t <= conflictStep; t++) {
      if (!proof.deletion[t] && db.flags[stepClause[t]] & FLAG_CORE) {
        stats.coreLemmas++;
        if (opts.wantCore) core.push(lemmaNumber[t]);
      }
    }
    return finish(opts.wantCore ? { valid: true, coreLemmas: core } : { valid: true });
  } catch (e) {
    if (e instanceof Stopped) return finish({ valid: false, reason: "stopped: time limit or abort before the check finished" });
    throw e;
  }
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

/** null when the lemma `id` is RUP or RAT in the current clause set, else why not. */
function checkLemma(db: ClauseStore, id: number, markCore: boolean, stats: DratStats): string | null {
  const s = db.start[id];
  const n = db.len[id];
  if (db.flags[id] & FLAG_TAUT) return null;
  if (db.rup(db.lits, s, n, markCore)) return null;
  if (n === 0) return "is the empty clause, but unit propagation finds no conflict";
  const pivot = db.pivot[id];
  const bad = db.ratCounterexample(id, pivot, markCore);
  if (bad === null) {
    stats.ratLemmas++;
    return null;
  }
  return `is not implied: unit propagation on its negation finds no conflict (not RUP), and it is not RAT on its first literal ${pivot}: the resolvent with clause [${bad.join(" ")}] is not RUP`;
}
