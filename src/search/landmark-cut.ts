// Landmark-cut (Helmert & Domshlak 2009): repeatedly find a cut of the h-max justification
// graph (a disjunctive action landmark), charge it its cheapest action's remaining cost.
import type { Landmark } from "./types.js";
import type { StateHeuristic } from "./heuristic.js";
import { MAX, RelaxedExplorer, type RelaxedTask } from "./relaxed.js";
import { poll } from "../util/limits.js";

/**
 * Landmark-cut on the relaxed task. Remaining costs are kept per ACTION, not per relaxed
 * operator: when an action has conditional effects, its operators share one budget, so the
 * landmarks found respect the cost partition "for each action, the sum of the costs of the
 * landmarks containing it ≤ its cost" — the condition under which the sum is admissible.
 * Without conditional effects this is exactly the published method and the sum dominates
 * h-max; with them the value returned is max(sum, h-max), still admissible.
 */
export class LandmarkCutHeuristic implements StateHeuristic {
  readonly name = "landmark-cut";
  readonly admissible = true;
  private readonly rt: RelaxedTask;
  private readonly ex: RelaxedExplorer;
  private readonly remaining: Float64Array;
  private readonly zone: Uint8Array; // 1 = goal zone, 2 = reached from the state
  private readonly stack: Int32Array;
  private readonly opInCut: Int32Array;
  private readonly actInCut: Int32Array;
  private readonly cutActs: Int32Array;
  private stamp = 0;
  /** Set to collect the landmarks of the next evaluation. */
  record: Landmark[] | null = null;
  /** Cut rounds performed in total (for statistics). */
  rounds = 0;
  /** Sum of the landmark costs of the last evaluation (before the h-max floor). */
  lastLandmarkSum = 0;
  /**
   * Stop cutting once the landmarks found sum to this much (the value returned is then that sum,
   * still admissible): a search record needs only enough landmarks to reach its bound.
   */
  stopAt = Infinity;

  constructor(
    rt: RelaxedTask,
    private readonly words: number,
  ) {
    this.rt = rt;
    this.ex = new RelaxedExplorer(rt);
    this.remaining = new Float64Array(rt.numActions);
    this.zone = new Uint8Array(rt.numFacts);
    this.stack = new Int32Array(rt.numFacts + 1);
    this.opInCut = new Int32Array(rt.numOps);
    this.actInCut = new Int32Array(rt.numActions);
    this.cutActs = new Int32Array(rt.numActions);
  }

  evaluate(s: Uint32Array, off: number): number {
    const rt = this.rt;
    const ex = this.ex;
    const rem = this.remaining;
    rem.set(rt.actionCost);
    const sup = ex.opSupporter;
    const zone = this.zone;
    const stack = this.stack;
    const achievers = rt.factAchievers;
    const preOps = rt.factPreOps;
    const opAdd = rt.opAdd;
    const opAction = rt.opAction;
    let total = 0;
    let hmax0 = -1;
    let hmax = ex.explore(s, off, this.words, rem, MAX, false);
    for (;;) {
      poll("landmark-cut");
      if (hmax === Infinity) return Infinity;
      if (hmax0 < 0) hmax0 = hmax;
      if (hmax === 0) {
        this.lastLandmarkSum = total;
        // With conditional effects the shared per-action budget can leave the sum below
        // h-max (dominance is proven for STRIPS only); both are admissible, take the larger.
        return total > hmax0 ? total : hmax0;
      }
      this.rounds++;
      zone.fill(0);
      // goal zone: facts from which the goal is reached through zero-cost justification edges
      let sp = 0;
      zone[rt.goal] = 1;
      stack[sp++] = rt.goal;
      while (sp > 0) {
        const f = stack[--sp];
        for (let k = achievers.start[f]; k < achievers.start[f + 1]; k++) {
          const o = achievers.data[k];
          const p = sup[o];
          if (p < 0 || zone[p] !== 0) continue;
          const a = opAction[o];
          if (a >= 0 && rem[a] !== 0) continue;
          zone[p] = 1;
          stack[sp++] = p;
        }
      }
      // forward from the state without entering the goal zone; edges into it form the cut
      const stamp = ++this.stamp;
      let ncut = 0;
      let m = Infinity;
      const nsf = ex.stateFactCount;
      for (let i = 0; i < nsf; i++) {
        const f = ex.stateFacts[i];
        if (zone[f] === 0) {
          zone[f] = 2;
          stack[sp++] = f;
        }
      }
      if (zone[rt.top] === 0) {
        zone[rt.top] = 2;
        stack[sp++] = rt.top;
      }
      while (sp > 0) {
        const f = stack[--sp];
        for (let k = preOps.start[f]; k < preOps.start[f + 1]; k++) {
          const o = preOps.data[k];
          if (sup[o] !== f) continue;
          for (let j = opAdd.start[o]; j < opAdd.start[o + 1]; j++) {
            const e = opAdd.data[j];
            const z = zone[e];
            if (z === 1) {
              if (this.opInCut[o] !== stamp) {
                this.opInCut[o] = stamp;
                const a = opAction[o];
                // a < 0 cannot happen: the goal operator's effect is the goal fact, whose
                // supporter is in the zone whenever the goal operator is zero-cost (always)
                if (this.actInCut[a] !== stamp) {
                  this.actInCut[a] = stamp;
                  this.cutActs[ncut++] = a;
                  if (rem[a] < m) m = rem[a];
                }
              }
            } else if (z === 0) {
              zone[e] = 2;
              stack[sp++] = e;
            }
          }
        }
      }
      if (ncut === 0 || !(m > 0)) {
        // cannot happen for a correct cut (every cut operator has positive remaining cost)
        throw new Error(`landmark-cut: empty or zero-cost cut (size ${ncut}, cost ${m})`);
      }
      for (let i = 0; i < ncut; i++) rem[this.cutActs[i]] -= m;
      total += m;
      if (this.record) {
        const acts = Array.from(this.cutActs.subarray(0, ncut)).sort((x, y) => x - y);
        this.record.push({ actions: acts, cost: m });
      }
      if (total >= this.stopAt) {
        this.lastLandmarkSum = total;
        return total;
      }
      hmax = ex.decreaseMax(this.cutActs, ncut, rem);
    }
  }
}
