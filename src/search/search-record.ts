// A record of a whole A* search that proves "no plan costs less than C": every state it stored,
// with its cost from the start, whether it was expanded, and for the others landmarks bounding
// what is left — so a plain checker can confirm the search without trusting it.
import type { Task } from "../ground/task.js";
import { astarWith } from "./astar.js";
import { unpackFacts } from "./bitstate.js";
import { compileTask } from "./compiled.js";
import { LandmarkCutHeuristic } from "./landmark-cut.js";
import { RelaxedTask } from "./relaxed.js";
import type { SearchSpace } from "./search-space.js";
import { SuccessorTree } from "./successor-tree.js";
import type { Landmark, SearchOptions } from "./types.js";

export interface SearchRecordEntry {
  /** The state: its true facts, ascending. */
  facts: number[];
  /** Cost of the cheapest path to it the search found. */
  g: number;
  /** Expanded at that cost: every successor is recorded too, at most g + cost(a) away. */
  expanded: boolean;
  /**
   * Not expanded: landmarks from this state (costs a partition of the action costs) whose costs
   * sum to at least bound − g, or "dead" when the goal is unreachable from it even ignoring deletes.
   */
  landmarks?: Landmark[] | "dead";
}

export interface SearchRecord {
  /** No plan costs less than this. */
  bound: number;
  entries: SearchRecordEntry[];
}

/**
 * A* with landmark-cut pruned at cost ≤ bound − 1, recorded; null when it finds a plan cheaper
 * than `bound`, stops at a limit, stores more than `maxStates` states, or a state it pruned
 * cannot be justified by landmarks alone (landmark-cut may take h-max when it is larger, with
 * conditional effects). The landmarks kept per pruned state are the dearest ones, just enough.
 */
export function searchRecord(task: Task, bound: number, opts: SearchOptions = {}): SearchRecord | null {
  const ct = compileTask(task);
  const rt = new RelaxedTask(task);
  const heur = new LandmarkCutHeuristic(rt, ct.words);
  let kept: SearchSpace | null = null;
  const r = astarWith(ct, new SuccessorTree(task), heur, { ...opts, costBound: bound - 1, keepSpace: (s) => (kept = s) });
  if (r.status === "solved" || kept === null) return null;
  if (r.status === "limit" && r.stopReason !== "cost-bound") return null;
  const space = kept as SearchSpace;
  const recorder = new LandmarkCutHeuristic(rt, ct.words);
  const entries: SearchRecordEntry[] = [];
  for (let id = 0; id < space.table.size; id++) {
    const off = space.table.offset(id);
    const g = space.g.a[id];
    const facts = unpackFacts(space.table.arena, off, ct.words);
    if (space.closed.a[id] !== 0) {
      entries.push({ facts, g, expanded: true });
      continue;
    }
    const lms: Landmark[] = [];
    recorder.record = lms;
    const h = recorder.evaluate(space.table.arena, off);
    recorder.record = null;
    if (h === Infinity) {
      entries.push({ facts, g, expanded: false, landmarks: "dead" });
      continue;
    }
    // the dearest landmarks first, as few as reach the bound
    lms.sort((x, y) => y.cost - x.cost);
    const need = bound - g;
    const keep: Landmark[] = [];
    let sum = 0;
    for (const l of lms) {
      if (sum >= need) break;
      keep.push({ actions: [...l.actions].sort((x, y) => x - y), cost: l.cost });
      sum += l.cost;
    }
    if (sum < need) return null;
    entries.push({ facts, g, expanded: false, landmarks: keep });
  }
  return { bound, entries };
}
