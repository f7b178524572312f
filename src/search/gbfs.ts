// Greedy best-first search for first plans: eager evaluation (every generated state gets
// its h at once), h-FF by default, helpful actions in a second queue, goal test on generation.
import type { Task } from "../ground/task.js";
import { applyAction, compileTask, isGoalState, maxCondEffects } from "./compiled.js";
import { KeyHeap } from "./heap.js";
import { LimitChecker, limitStop } from "./limits.js";
import { makeHeuristic } from "./make-heuristic.js";
import { SearchSpace } from "./search-space.js";
import { GrowI32 } from "./state-table.js";
import { SuccessorTree } from "./successor-tree.js";
import type { GbfsOptions, SearchResult, StopReason } from "./types.js";

/** Expansions the preferred queue gets in a row after the heuristic improves. */
const BOOST = 1000;

/**
 * Eager GBFS: states are ordered by h (then by generation order); no re-opening — plans are
 * valid but not necessarily cheap. Helpful actions (those a relaxed plan applies in the
 * state, h-FF only) put their successors into a preferred queue that alternates with the
 * main queue and is favoured for a while whenever h reaches a new minimum.
 */
export function gbfs(task: Task, opts: GbfsOptions = {}): SearchResult {
  const t0 = performance.now();
  const ct = compileTask(task);
  const tree = new SuccessorTree(task);
  const heur = makeHeuristic(opts.heuristic ?? "ff", ct);
  const helpful = opts.preferred === false ? undefined : heur.helpful;
  const limits = new LimitChecker(opts, ct.words);
  const space = new SearchSpace(ct);
  const open = new KeyHeap(1024);
  const pref = new KeyHeap(1024);
  // helpful actions of each evaluated state: helpPool[helpStart[id] .. helpStart[id] + helpLen[id])
  const helpStart = new GrowI32(1024, 0);
  const helpLen = new GrowI32(1024, 0);
  let helpPool = new Int32Array(1024);
  let helpUsed = 0;
  const helpMark = new Int32Array(Math.max(1, ct.numActions));
  const buf = new Uint32Array(ct.words);
  const appl = new Int32Array(Math.max(1, ct.numActions));
  const fired = new Int32Array(maxCondEffects(ct));
  let expanded = 0;
  let generated = 0;
  let counter = 0;

  const done = (status: SearchResult["status"], goalId: number, stopReason?: StopReason): SearchResult =>
    space.result(status, goalId, { expanded, generated, t0, heuristic: heur.name, extraBytes: open.bytes + pref.bytes + helpPool.byteLength }, stopReason);

  /** Evaluates state id; stores its helpful actions among `applicable` ones if any. */
  const evaluate = (id: number): number => {
    const hv = heur.evaluate(space.table.arena, space.table.offset(id));
    space.h.a[id] = hv;
    if (helpful && hv !== Infinity) {
      helpStart.ensure(id);
      helpLen.ensure(id);
      helpStart.a[id] = helpUsed;
      let n = 0;
      const k = tree.applicable(space.table.arena, space.table.offset(id), appl);
      for (let i = 0; i < k; i++) {
        if (!helpful.has(appl[i])) continue;
        if (helpUsed === helpPool.length) {
          const p = new Int32Array(helpPool.length * 2);
          p.set(helpPool);
          helpPool = p;
        }
        helpPool[helpUsed++] = appl[i];
        n++;
      }
      helpLen.a[id] = n;
    }
    return hv;
  };

  buf.set(ct.init);
  const root = space.intern(buf);
  space.g.a[root] = 0;
  if (isGoalState(ct, space.table.arena, 0)) return done("solved", root);
  const h0 = evaluate(root);
  if (h0 === Infinity) return done("unsolvable", -1);
  open.push(h0, counter++, root);
  const early = limits.checkNow();
  if (early) return done("limit", -1, early);
  let bestH = h0;
  let boost = 0;
  let turn = 0;

  try {
    while (open.size > 0 || pref.size > 0) {
      const stop = limits.check(expanded, space.table.size);
      if (stop) return done("limit", -1, stop);
      const usePref = pref.size > 0 && (boost > 0 || (turn++ & 1) === 1 || open.size === 0);
      if (boost > 0) boost--;
      const s = usePref ? pref.pop() : open.pop();
      if (space.closed.a[s] !== 0) continue;
      space.closed.a[s] = 1;
      expanded++;
      const soff = space.table.offset(s);
      const gs = space.g.a[s];
      const stamp = s + 1;
      if (helpful) for (let i = 0; i < helpLen.a[s]; i++) helpMark[helpPool[helpStart.a[s] + i]] = stamp;
      const n = tree.applicable(space.table.arena, soff, appl);
      // copy: evaluate() reuses `appl`
      const succ = appl.slice(0, n);
      for (let i = 0; i < n; i++) {
        const a = succ[i];
        const inner = limits.check(expanded, space.table.size); // heuristic evaluations can be slow: check between them too
        if (inner) return done("limit", -1, inner);
        applyAction(ct, a, space.table.arena, soff, buf, 0, fired);
        generated++;
        const t = space.intern(buf);
        if (!space.table.isNew) continue;
        space.g.a[t] = gs + ct.cost[a];
        space.parent.a[t] = s;
        space.via.a[t] = a;
        if (isGoalState(ct, space.table.arena, space.table.offset(t))) return done("solved", t);
        const ht = evaluate(t);
        if (ht === Infinity) continue;
        open.push(ht, counter, t);
        if (helpful && helpMark[a] === stamp) pref.push(ht, counter, t);
        counter++;
        if (ht < bestH) {
          bestH = ht;
          if (helpful) boost = BOOST;
        }
      }
    }
  } catch (e) {
    // a heuristic evaluation polls the run's limits too and throws when one is reached
    return done("limit", -1, limitStop(e));
  }
  return done("unsolvable", -1);
}
