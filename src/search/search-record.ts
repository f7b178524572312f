// A record of a whole A* search that proves "no plan costs less than C": every state it stored,
// with its cost from the start, whether it was expanded, and for the others landmarks bounding
// what is left — so a plain checker can confirm the search without trusting it.
import type { Task } from "../ground/task.js";
import { astarWith } from "./astar.js";
import { unpackFacts } from "./bitstate.js";
import { compileTask, type CompiledTask } from "./compiled.js";
import { LandmarkCutHeuristic } from "./landmark-cut.js";
import { RelaxedTask } from "./relaxed.js";
import type { SearchSpace } from "./search-space.js";
import { SuccessorTree } from "./successor-tree.js";
import type { AstarOptions, Landmark, SearchResult } from "./types.js";

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
 * A* with landmark-cut for an optimal plan, whose search itself becomes the record when it
 * solves the task: the goal was popped at f = C, so every state it stored is either expanded at
 * its cost from the start or still open with g + h ≥ C — the record proving "nothing costs less
 * than C" needs no second search. `record()` builds it (null over `maxRecordStates` states, or
 * when a state's landmarks cannot justify it); call it after using the result.
 */
export function astarRecorded(task: Task, opts: Omit<AstarOptions, "heuristic" | "keepSpace">, maxRecordStates: number): { result: SearchResult; record: () => SearchRecord | null } {
  const ct = compileTask(task);
  const rt = new RelaxedTask(task);
  let kept: SearchSpace | null = null;
  const result = astarWith(ct, new SuccessorTree(task), new LandmarkCutHeuristic(rt, ct.words), { ...opts, keepSpace: (s) => (kept = s) });
  const record = (): SearchRecord | null => {
    const space = kept as SearchSpace | null;
    kept = null;
    if (result.status !== "solved" || result.cost === null || space === null || space.table.size > maxRecordStates) return null;
    return recordOf(ct, rt, space, result.cost);
  };
  return { result, record };
}

/**
 * The record of a kept search space at `bound`: expanded states as they are, the others with the
 * dearest landmarks that just reach bound − g (null when a state's landmarks cannot: landmark-cut
 * may take h-max when it is larger, with conditional effects).
 */
function recordOf(ct: CompiledTask, rt: RelaxedTask, space: SearchSpace, bound: number): SearchRecord | null {
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
    const need = bound - g;
    if (need <= 0) {
      entries.push({ facts, g, expanded: false, landmarks: [] });
      continue;
    }
    const lms: Landmark[] = [];
    recorder.record = lms;
    recorder.stopAt = need; // enough landmarks to reach the bound: no full evaluation needed
    const h = recorder.evaluate(space.table.arena, off);
    recorder.record = null;
    if (h === Infinity) {
      entries.push({ facts, g, expanded: false, landmarks: "dead" });
      continue;
    }
    // the dearest landmarks first, as few as reach the bound
    lms.sort((x, y) => y.cost - x.cost);
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
