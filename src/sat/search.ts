// The CDCL search loop: propagate, learn from conflicts, backjump, restart, reduce, simplify,
// and decide (assumptions first, then the most active variable in its saved or target phase).
import { AnalyzeScratch, analyze, analyzeFinal } from "./analyze.js";
import { propagate } from "./propagate.js";
import { reduceDb } from "./reduce.js";
import { RestartPolicy } from "./restart.js";
import { simplifyAtLevel0 } from "./simplify.js";
import type { SolveStatus } from "./types.js";
import { LBD_SHIFT as LBD_SHIFT_, META_LEARNT as META_LEARNT_, TIER_SHIFT as TIER_SHIFT_, USED_SHIFT as USED_SHIFT_, tierOf, type SolverState } from "./state.js";
import { isAborted } from "../util/limits.js";
// module-local copies: imported bindings can compile to getter calls in hot loops
const LBD_SHIFT = LBD_SHIFT_;
const META_LEARNT = META_LEARNT_;
const TIER_SHIFT = TIER_SHIFT_;
const USED_SHIFT = USED_SHIFT_;

export interface SearchBudget {
  conflictLimit: number; // absolute conflict count at which to stop
  deadline: number;
  signal: AbortSignal | undefined;
}

/** Long-lived search bookkeeping (survives across solve calls). */
export class SearchControl {
  readonly scratch = new AnalyzeScratch();
  readonly restart = new RestartPolicy();
  readonly simplifyScratch = { buf: new Int32Array(16) };
  nextReduce = 500;
  reduceInterval = 500;
  reduceIncrement = 50;
  lastSimplifyTrail = -1;
  lastSimplifyProps = 0;
  failed: number[] = [];
}

/** Logs the empty clause and marks the solver unsat for good. */
export function becomeUnsat(s: SolverState): void {
  if (s.ok && s.proof !== null) s.proof.add(s.trail, 0, 0);
  s.ok = false;
}

/** Runs level-0 simplification when enough has changed since the last time. */
export function maybeSimplify(s: SolverState, ctl: SearchControl, force: boolean): void {
  if (s.decisionLevel !== 0) return;
  if (s.trailSize === ctl.lastSimplifyTrail) return;
  if (!force && s.propagations - ctl.lastSimplifyProps < s.arenaTop) return;
  simplifyAtLevel0(s, ctl.simplifyScratch);
  ctl.lastSimplifyTrail = s.trailSize;
  ctl.lastSimplifyProps = s.propagations;
}

/** Searches under `assumptions` (internal literals) until an answer or the budget runs out. */
export function search(s: SolverState, ctl: SearchControl, assumptions: Int32Array, budget: SearchBudget): SolveStatus {
  const sc = ctl.scratch;
  const rp = ctl.restart;
  const order = s.order;
  let checkTick = 0;
  for (;;) {
    const confl = propagate(s);
    if (confl !== 0) {
      s.conflicts++;
      if (s.decisionLevel === 0) {
        becomeUnsat(s);
        return "unsat";
      }
      if (rp.stable) saveTarget(s);
      analyze(s, confl, sc);
      s.cancelUntil(sc.btLevel);
      learn(s, sc);
      rp.onConflict(sc.lbd);
      if (rp.switched) {
        rp.switched = false;
        s.targetSize = 0;
      }
      order.decayAll();
      if (s.conflicts >= budget.conflictLimit) return "unknown";
      if ((++checkTick & 127) === 0 && outOfTime(budget)) return "unknown";
      continue;
    }
    if (rp.shouldRestart()) {
      rp.onRestart();
      s.restarts++;
      s.cancelUntil(reuseLevel(s, assumptions.length));
      maybeSimplify(s, ctl, false);
      continue;
    }
    if (s.conflicts >= ctl.nextReduce) {
      ctl.reduceInterval += ctl.reduceIncrement;
      ctl.nextReduce = s.conflicts + ctl.reduceInterval;
      reduceDb(s);
    }
    // assumptions first, one level each
    let next = 0;
    while (s.decisionLevel < assumptions.length) {
      const p = assumptions[s.decisionLevel];
      const v = s.vals[p];
      if (v === 1) {
        s.newDecisionLevel();
      } else if (v === -1) {
        ctl.failed = analyzeFinal(s, p);
        return "unsat";
      } else {
        next = p;
        break;
      }
    }
    if (next === 0) {
      // (checked before a variable leaves the heap, so none is lost when we stop here)
      if ((++checkTick & 4095) === 0 && outOfTime(budget)) return "unknown";
      const vals = s.vals;
      while (order.n > 0) {
        const v = order.pop();
        if (vals[v << 1] === 0) {
          next = (v << 1) | (rp.stable ? s.target[v] : s.phase[v]);
          break;
        }
      }
      if (next === 0) return "sat";
      s.decisions++;
    }
    s.newDecisionLevel();
    s.assign(next, 0);
  }
}

/**
 * Remembers the values below the conflict level when that conflict-free prefix is the largest
 * so far: stable-mode decisions follow these target phases (Biere and Fleury 2020).
 */
function saveTarget(s: SolverState): void {
  const size = s.trailLim[s.decisionLevel - 1];
  if (size <= s.targetSize) return;
  const trail = s.trail;
  const target = s.target;
  for (let i = 0; i < size; i++) target[trail[i] >> 1] = trail[i] & 1;
  s.targetSize = size;
}

/**
 * Restart level that keeps the decisions the heuristic would repeat (trail reuse, van der Tak,
 * Ramos and Heule 2011): all levels whose decision is more active than the next candidate.
 */
function reuseLevel(s: SolverState, assumptionLevels: number): number {
  const order = s.order;
  const vals = s.vals;
  while (order.n > 0 && vals[order.heap[0] << 1] !== 0) order.pop();
  if (order.n === 0) return assumptionLevels < s.decisionLevel ? assumptionLevels : s.decisionLevel;
  const next = order.activity[order.heap[0]];
  let lvl = Math.min(assumptionLevels, s.decisionLevel);
  while (lvl < s.decisionLevel && order.activity[s.trail[s.trailLim[lvl]] >> 1] > next) lvl++;
  return lvl;
}

function outOfTime(b: SearchBudget): boolean {
  return isAborted(b.signal) || Date.now() >= b.deadline;
}

/** Stores the clause in `sc.learnt`, logs it, and asserts its first literal. */
function learn(s: SolverState, sc: AnalyzeScratch): void {
  const lits = sc.learnt;
  const n = sc.size;
  if (s.proof !== null) s.proof.add(lits, 0, n);
  if (n === 1) {
    s.learnedUnits++;
    s.assign(lits[0], 0);
  } else if (n === 2) {
    s.numLearnedBinary++;
    s.addBinary(lits[0], lits[1]);
    s.assign(lits[0], -lits[1]);
  } else {
    const lbd = sc.lbd;
    const meta = META_LEARNT | (2 << USED_SHIFT) | (tierOf(lbd) << TIER_SHIFT) | (lbd << LBD_SHIFT);
    const c = s.allocClause(lits, n, meta);
    s.attach(c);
    s.pushLearnt(c);
    s.assign(lits[0], c);
  }
}
