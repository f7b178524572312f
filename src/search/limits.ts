// The limits every search honours (deadline, abort signal, expansions, stored states, and the
// run's limits from util/limits), checked cheaply: the clock is read every 16 calls.
import { isAborted, isLimitReached, limitReason, type LimitReason } from "../util/limits.js";
import type { SearchOptions, StopReason } from "./types.js";

const REASON: Record<LimitReason, StopReason> = { time: "deadline", interrupted: "aborted", memory: "memory" };

/** Default cap on stored states: about 1.5 GB of packed states and per-state data. */
export function defaultMaxStates(words: number): number {
  return Math.floor(1.5e9 / (words * 4 + 48));
}

/** The stop reason of a LimitReached thrown inside a search (a heuristic polls the run's limits); rethrows anything else. */
export function limitStop(e: unknown): StopReason {
  if (isLimitReached(e)) return REASON[e.reason];
  throw e;
}

export class LimitChecker {
  private readonly deadline: number;
  private readonly signal: AbortSignal | undefined;
  private readonly maxExpansions: number;
  readonly maxStates: number;
  private tick = 0;

  constructor(opts: SearchOptions, words: number) {
    this.deadline = opts.deadline ?? Infinity;
    this.signal = opts.signal;
    this.maxExpansions = opts.maxExpansions ?? Infinity;
    this.maxStates = opts.maxStates ?? defaultMaxStates(words);
  }

  /** Call once per expansion and once per generated state; returns why to stop, or null to go on. */
  check(expanded: number, states: number): StopReason | null {
    if (expanded >= this.maxExpansions) return "expansions";
    if (states >= this.maxStates) return "memory";
    if ((++this.tick & 15) !== 0) return null;
    return this.checkNow();
  }

  /** A check that always reads the clock (used before the first expansion). */
  checkNow(): StopReason | null {
    if (isAborted(this.signal)) return "aborted";
    if (Date.now() >= this.deadline) return "deadline";
    const run = limitReason();
    return run === null ? null : REASON[run];
  }
}
