// A* (Hart, Nilsson & Raphael 1968) for cost-optimal plans: f = g + h with an admissible
// heuristic, ties on lower h, re-opening closed states whenever a cheaper path appears.
import type { Task } from "../ground/task.js";
import { applyAction, compileTask, isGoalState, maxCondEffects, type CompiledTask } from "./compiled.js";
import { KeyHeap } from "./heap.js";
import type { StateHeuristic } from "./heuristic.js";
import { LimitChecker, limitStop } from "./limits.js";
import { ADMISSIBLE_HEURISTICS, makeHeuristic } from "./make-heuristic.js";
import { SearchSpace } from "./search-space.js";
import { SuccessorTree } from "./successor-tree.js";
import type { AstarOptions, SearchResult, StopReason } from "./types.js";

/**
 * Optimal search. Landmark-cut is admissible but not always consistent, and zero-cost
 * actions make equal-f plateaus, so a closed state is re-opened when reached more cheaply:
 * with any admissible heuristic the first goal state popped has optimal cost.
 */
export function astar(task: Task, opts: AstarOptions = {}): SearchResult {
  const t0 = performance.now();
  const name = opts.heuristic ?? "landmark-cut";
  if (!ADMISSIBLE_HEURISTICS.includes(name)) throw new Error(`A* needs an admissible heuristic, not ${name}`);
  const ct = compileTask(task);
  const h = makeHeuristic(name, ct);
  return astarWith(ct, new SuccessorTree(task), h, opts, t0);
}

export function astarWith(ct: CompiledTask, tree: SuccessorTree, heur: StateHeuristic, opts: AstarOptions, t0 = performance.now()): SearchResult {
  if (!heur.admissible) throw new Error(`A* needs an admissible heuristic, not ${heur.name}`);
  const limits = new LimitChecker(opts, ct.words);
  const costBound = opts.costBound ?? Infinity;
  const space = new SearchSpace(ct);
  const open = new KeyHeap(1024);
  const buf = new Uint32Array(ct.words);
  const appl = new Int32Array(Math.max(1, ct.numActions));
  const fired = new Int32Array(maxCondEffects(ct));
  const cost = ct.cost;
  let expanded = 0;
  let generated = 0;
  let reopened = 0;
  let lowerBound = 0;
  let minPrunedF = Infinity;

  const done = (status: SearchResult["status"], goalId: number, stopReason?: StopReason): SearchResult => {
    opts.keepSpace?.(space);
    return {
      ...space.result(status, goalId, { expanded, generated, t0, heuristic: heur.name, extraBytes: open.bytes }, stopReason),
      lowerBound: goalId >= 0 ? space.g.a[goalId] : status === "unsolvable" ? Infinity : stopReason === "cost-bound" ? minPrunedF : lowerBound,
      reopened,
    };
  };

  buf.set(ct.init);
  const root = space.intern(buf);
  space.g.a[root] = 0;
  const h0 = heur.evaluate(space.table.arena, 0);
  space.h.a[root] = h0;
  if (h0 === Infinity) return done("unsolvable", -1);
  if (h0 > costBound) {
    minPrunedF = h0;
    return done("limit", -1, "cost-bound");
  }
  open.push(h0, h0, root, 0);
  const early = limits.checkNow();
  if (early) return done("limit", -1, early);

  try {
    while (open.size > 0) {
      const stop = limits.check(expanded, space.table.size);
      if (stop) return done("limit", -1, stop);
      const s = open.pop();
      const gs = space.g.a[s];
      if (open.topAux > gs) continue; // stale entry: a cheaper path was pushed later
      if (space.closed.a[s] !== 0) continue;
      if (open.topKey1 > lowerBound) lowerBound = open.topKey1;
      const soff = space.table.offset(s);
      if (isGoalState(ct, space.table.arena, soff)) return done("solved", s);
      space.closed.a[s] = 1;
      expanded++;
      const n = tree.applicable(space.table.arena, soff, appl);
      for (let i = 0; i < n; i++) {
        const a = appl[i];
        const inner = limits.check(expanded, space.table.size); // heuristic evaluations can be slow: check between them too
        if (inner) return done("limit", -1, inner);
        applyAction(ct, a, space.table.arena, soff, buf, 0, fired);
        generated++;
        const t = space.intern(buf);
        const ng = gs + cost[a];
        const g = space.g.a;
        let ht: number;
        if (space.table.isNew) {
          g[t] = ng;
          space.parent.a[t] = s;
          space.via.a[t] = a;
          ht = heur.evaluate(space.table.arena, space.table.offset(t));
          space.h.a[t] = ht;
        } else {
          if (ng >= g[t]) continue;
          ht = space.h.a[t];
          g[t] = ng;
          space.parent.a[t] = s;
          space.via.a[t] = a;
          if (space.closed.a[t] !== 0) {
            space.closed.a[t] = 0;
            reopened++;
          }
        }
        if (ht === Infinity) continue; // dead end: the goal is relaxed-unreachable from t
        const f = ng + ht;
        if (f > costBound) {
          if (f < minPrunedF) minPrunedF = f;
          continue;
        }
        open.push(f, ht, t, ng);
      }
    }
  } catch (e) {
    // a heuristic evaluation polls the run's limits too and throws when one is reached
    return done("limit", -1, limitStop(e));
  }
  if (minPrunedF < Infinity) return done("limit", -1, "cost-bound");
  return done("unsolvable", -1);
}
