// The limits every search honours (deadline, abort signal, expansions, stored states),
// checked cheaply: the clock is read only every few hundred expansions.
import type { SearchOptions, StopReason } from "./types.js";

/** Default cap on stored states: about 1.5 GB of packed states and per-state data. */
export function defaultMaxStates(words: number): number {
  return Math.floor(1.5e9 / (words * 4 + 48));
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

  /** Call once per expansion; returns why to stop, or null to go on. */
  check(expanded: number, states: number): StopReason | null {
    if (expanded >= this.maxExpansions) return "expansions";
    if (states >= this.maxStates) return "memory";
    if ((++this.tick & 127) !== 0) return null;
    if (this.signal?.aborted) return "aborted";
    if (Date.now() >= this.deadline) return "deadline";
    return null;
  }

  /** A check that always reads the clock (used before the first expansion). */
  checkNow(): StopReason | null {
    if (this.signal?.aborted) return "aborted";
    if (Date.now() >= this.deadline) return "deadline";
    return null;
  }
}
