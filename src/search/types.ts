// Shared types of the search stage: options, results and landmark records as fixed in
// the cross-helper contract, plus the optional extras (lower bounds, stop reasons).

/** Limits every search honours. */
export interface SearchOptions {
  /** Absolute wall-clock deadline, `Date.now()` milliseconds. */
  deadline?: number;
  signal?: AbortSignal;
  maxExpansions?: number;
  /** Stop (status "limit", stopReason "memory") once this many states are stored. */
  maxStates?: number;
}

export type StopReason = "deadline" | "aborted" | "expansions" | "memory" | "cost-bound";

export interface SearchResult {
  /** "unsolvable" only when the whole reachable space was exhausted without pruning. */
  status: "solved" | "unsolvable" | "limit";
  /** Action ids in order (synthetic actions included; drop them when writing a plan file). */
  plan: number[] | null;
  cost: number | null;
  expanded: number;
  generated: number;
  seconds: number;
  /** Heuristic used ("landmark-cut", "max", "blind", "ff", "add"). */
  heuristic?: string;
  /** Heuristic value of the initial state. */
  initialH?: number;
  /**
   * A*: a proven lower bound on the optimal cost (equal to `cost` when solved; the largest
   * f-value popped so far when a limit stopped the search; Infinity when unsolvable).
   */
  lowerBound?: number;
  stopReason?: StopReason;
  /** Distinct states stored. */
  states?: number;
  /** Bytes held by the search's own typed arrays at the end (state table and per-state data). */
  searchBytes?: number;
  /** Times a closed state was re-opened because a cheaper path to it was found (A*). */
  reopened?: number;
}

/** Admissible heuristics A* accepts. */
export type AdmissibleHeuristicName = "landmark-cut" | "max" | "blind";
/** Every heuristic the stage offers. */
export type HeuristicName = AdmissibleHeuristicName | "add" | "ff";

export interface AstarOptions extends SearchOptions {
  heuristic?: AdmissibleHeuristicName;
  /**
   * Prune every node whose f-value exceeds this cost. A plan of cost ≤ costBound is still found
   * if one exists; when the space is exhausted after pruning, the result is a "limit" with
   * stopReason "cost-bound" and a lowerBound above costBound.
   */
  costBound?: number;
  /** Called once with the search space when the search ends (for records of the whole search). */
  keepSpace?: (space: import("./search-space.js").SearchSpace) => void;
}

export interface GbfsOptions extends SearchOptions {
  /** Default "ff" (h-FF). */
  heuristic?: HeuristicName;
  /** Use the relaxed plan's helpful actions in a second, preferred queue (default true for ff). */
  preferred?: boolean;
}

/** One disjunctive action landmark with the part of the cost partition assigned to it. */
export interface Landmark {
  /** Action ids (sorted, distinct): every plan contains at least one of them. */
  actions: number[];
  cost: number;
}

/** Landmark-cut's record at the initial state: bound = sum of the landmark costs. */
export interface LandmarkRecord {
  bound: number;
  landmarks: Landmark[];
}
