// Heuristic values at every reachable state of random tasks: h-max and h-add equal their
// textbook fixpoint definitions; h-max ≤ landmark-cut ≤ h* (dominance and admissibility).
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import type { Task } from "../../src/ground/task.js";
import { compileTask, evaluateState, LandmarkCutHeuristic, packFacts, RelaxedTask, type Landmark } from "../../src/search/index.js";
import { optimalCost, reachableStates } from "../support/reference.js";
import { factoredTaskArb } from "../support/random-task.js";
import { nonTrivial, richTaskArb, shiftFacts, withInit, withRandomCosts } from "./rich-task.js";

/**
 * h-max / h-add by their defining fixpoint (Bonet & Geffner 2001), over the relaxation that
 * drops negative conditions and lets each conditional effect fire as its own operator at the
 * action's full cost: repeat "cost(f) = min over achievers of c(a) + combine(pre costs)".
 */
function fixpointH(task: Task, state: ReadonlySet<number>, combine: "max" | "sum"): number {
  const cost = new Map<number, number>();
  for (const f of state) cost.set(f, 0);
  const c = (f: number) => cost.get(f) ?? Infinity;
  const ops: Array<{ pre: number[]; add: number[]; cost: number }> = [];
  for (const a of task.actions) {
    ops.push({ pre: a.pre, add: a.add, cost: a.cost });
    for (const ce of a.cond) ops.push({ pre: [...new Set([...a.pre, ...ce.cond])], add: ce.add, cost: a.cost });
  }
  const value = (pre: number[]) => pre.reduce((acc, f) => (combine === "max" ? Math.max(acc, c(f)) : acc + c(f)), 0);
  for (let changed = true; changed; ) {
    changed = false;
    for (const o of ops) {
      const v = value(o.pre) + o.cost;
      for (const f of o.add) {
        if (v < c(f)) {
          cost.set(f, v);
          changed = true;
        }
      }
    }
  }
  return value(task.goal);
}

function checkAllStates(task: Task, dominance: boolean): void {
  const states = reachableStates(task, 2000);
  if (states === null) return;
  const ct = compileTask(task);
  const lmRaw = new LandmarkCutHeuristic(new RelaxedTask(task), ct.words);
  for (const s of states) {
    const facts = [...s].sort((x, y) => x - y);
    const hmax = evaluateState(task, "max", facts);
    const hadd = evaluateState(task, "add", facts);
    const hLandmarkCut = evaluateState(task, "landmark-cut", facts);
    const hff = evaluateState(task, "ff", facts);
    const blind = evaluateState(task, "blind", facts);
    const opt = optimalCost(withInit(task, facts));
    const hstar = opt === null ? Infinity : opt.cost;
    // definitions (source: Bonet & Geffner 2001, h-max and h-add)
    expect(hmax).toBe(fixpointH(task, s, "max"));
    expect(hadd).toBe(fixpointH(task, s, "sum"));
    // admissibility of h-max and landmark-cut (source: Helmert & Domshlak 2009)
    expect(hmax).toBeLessThanOrEqual(hstar);
    expect(hLandmarkCut).toBeLessThanOrEqual(hstar);
    expect(blind).toBeLessThanOrEqual(hstar);
    expect(hLandmarkCut).toBeGreaterThanOrEqual(hmax); // by construction: max(landmark sum, h-max)
    // the landmark sum alone: admissible always; dominates h-max on STRIPS with negative
    // preconditions dropped (source: Helmert & Domshlak 2009)
    const raw = lmRaw.evaluate(packFacts(facts, ct.words), 0);
    const sum = Number.isFinite(raw) ? lmRaw.lastLandmarkSum : Infinity;
    expect(sum).toBeLessThanOrEqual(hstar);
    if (dominance) expect(sum).toBeGreaterThanOrEqual(hmax);
    // cut short at a target (as a search record does): the same first landmarks, enough of them
    if (Number.isFinite(raw) && sum > 0) {
      const full: Landmark[] = [];
      lmRaw.record = full;
      lmRaw.evaluate(packFacts(facts, ct.words), 0);
      for (const target of [1, Math.ceil(sum / 2), sum]) {
        const part: Landmark[] = [];
        lmRaw.record = part;
        lmRaw.stopAt = target;
        const v = lmRaw.evaluate(packFacts(facts, ct.words), 0);
        lmRaw.stopAt = Infinity;
        const got = part.reduce((a, l) => a + l.cost, 0);
        expect(got).toBeGreaterThanOrEqual(target);
        expect(v).toBe(got);
        expect(part).toEqual(full.slice(0, part.length));
      }
      lmRaw.record = null;
    }
    // a dead end for one relaxation heuristic is a dead end for all (same relaxed reachability)
    expect(Number.isFinite(hff)).toBe(Number.isFinite(hmax));
    expect(Number.isFinite(hLandmarkCut)).toBe(Number.isFinite(hmax));
    // h-add ≥ h-max: a sum of non-negative terms is at least their maximum (mathematical fact)
    expect(hadd).toBeGreaterThanOrEqual(hmax);
  }
}

describe("heuristics at every reachable state", () => {
  it("factored tasks with zero-cost actions: h-max ≤ landmark-cut ≤ h*", () => {
    fc.assert(fc.property(nonTrivial(withRandomCosts(factoredTaskArb({ maxActions: 10 }))), (t) => checkAllStates(t, true)), { numRuns: 120 });
  });
  it("tasks with negative preconditions and goals: h-max ≤ landmark-cut ≤ h*", () => {
    fc.assert(fc.property(nonTrivial(richTaskArb({ cond: false })), (t) => checkAllStates(t, true)), { numRuns: 150 });
  });
  it("tasks with conditional effects: landmark-cut and h-max ≤ h*", () => {
    // facts shifted onto bit 31 and across word boundaries of the packed states
    const shifted = fc.tuple(nonTrivial(richTaskArb()), fc.constantFrom(0, 29, 31)).map(([t, k]) => shiftFacts(t, k));
    fc.assert(fc.property(shifted, (t) => checkAllStates(t, false)), { numRuns: 150 });
  });
});
