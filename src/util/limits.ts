// One deadline, one memory ceiling and one abort flag for a whole run, polled by every long loop
// (grounding, analysis, heuristics, search, horizon methods, encoding, checking) so limits and signals stop any phase.
import { AsyncLocalStorage } from "node:async_hooks";
import { PlumblineError } from "./errors.js";

export type LimitReason = "time" | "memory" | "interrupted";

/**
 * The abort flag lives in shared memory: the CLI runs commands in a worker thread and its main
 * thread, which stays idle, sets the flag when SIGINT or SIGTERM arrives. A busy synchronous loop
 * in the worker cannot receive an event, but it can read this word.
 */
let flagBuffer = new SharedArrayBuffer(4);
let flag = new Int32Array(flagBuffer);

/** The shared buffer holding the abort flag (passed to the worker that runs a command). */
export function abortFlagBuffer(): SharedArrayBuffer {
  return flagBuffer;
}

/** Uses `buf` (from the main thread) as this thread's abort flag. */
export function adoptAbortFlag(buf: SharedArrayBuffer): void {
  flagBuffer = buf;
  flag = new Int32Array(buf);
}

/** Raises the abort flag (a signal handler does this); every poll then stops its loop. */
export function requestAbort(): void {
  Atomics.store(flag, 0, 1);
}

/** Lowers the flag again (tests that interrupt one run and start another in the same thread). */
export function clearAbort(): void {
  Atomics.store(flag, 0, 0);
}

/** True once an abort was requested through the flag or `signal`. */
export function isAborted(signal?: AbortSignal): boolean {
  return Atomics.load(flag, 0) !== 0 || signal?.aborted === true;
}

/** A limit stopped a phase. Exit code 3 when it reaches the CLI; the optimizer catches it and keeps its best plan. */
export class LimitReached extends PlumblineError {
  readonly reason: LimitReason;
  constructor(reason: LimitReason, phase?: string) {
    const what = reason === "time" ? "time limit reached" : reason === "memory" ? "memory limit reached" : "interrupted";
    super("limit", phase ? `${what} while ${phase}` : what, undefined, 3);
    this.name = "LimitReached";
    this.reason = reason;
  }
}

export function isLimitReached(e: unknown): e is LimitReached {
  return e instanceof LimitReached;
}

/** The limits in force for the code running now (an async context: nested runs combine theirs). */
export interface Limits {
  /** Absolute deadline, Date.now() milliseconds (Infinity: none). */
  deadline: number;
  /** Resident set size ceiling in bytes (Infinity: none). */
  memoryBytes: number;
  signals: AbortSignal[];
}

const store = new AsyncLocalStorage<Limits>();

/** The limits in force (none: everything Infinity). */
export function currentLimits(): Limits {
  return store.getStore() ?? { deadline: Infinity, memoryBytes: Infinity, signals: [] };
}

export interface LimitSpec {
  deadline?: number;
  memoryLimitMb?: number;
  signal?: AbortSignal;
}

/** Runs `fn` with `spec` added to the limits in force (the earlier deadline and smaller ceiling win). */
export function withLimits<T>(spec: LimitSpec, fn: () => T): T {
  const outer = currentLimits();
  const inner: Limits = {
    deadline: Math.min(outer.deadline, spec.deadline ?? Infinity),
    memoryBytes: Math.min(outer.memoryBytes, spec.memoryLimitMb !== undefined ? spec.memoryLimitMb * 1048576 : Infinity),
    signals: spec.signal && !outer.signals.includes(spec.signal) ? [...outer.signals, spec.signal] : outer.signals,
  };
  return store.run(inner, fn);
}

/**
 * Tightens the limits of the current context in place (a command that parses --time-limit after
 * the CLI opened the context). Outside any context it does nothing.
 */
export function tightenLimits(spec: LimitSpec): void {
  const cur = store.getStore();
  if (!cur) return;
  if (spec.deadline !== undefined) cur.deadline = Math.min(cur.deadline, spec.deadline);
  if (spec.memoryLimitMb !== undefined) cur.memoryBytes = Math.min(cur.memoryBytes, spec.memoryLimitMb * 1048576);
  if (spec.signal && !cur.signals.includes(spec.signal)) cur.signals = [...cur.signals, spec.signal];
}

let lastMemoryCheck = 0;

/** Why the current context must stop now, or null. Reads the clock; resident memory at most every 100 ms. */
export function limitReason(): LimitReason | null {
  if (Atomics.load(flag, 0) !== 0) return "interrupted";
  const l = store.getStore();
  if (!l) return null;
  for (const s of l.signals) if (s.aborted) return "interrupted";
  const now = Date.now();
  if (now >= l.deadline) return "time";
  if (l.memoryBytes !== Infinity && now - lastMemoryCheck >= 100) {
    lastMemoryCheck = now;
    if (process.memoryUsage.rss() > l.memoryBytes) return "memory";
  }
  return null;
}

/** Throws LimitReached when the current context must stop (`phase` names what was running). */
export function checkLimits(phase?: string): void {
  const r = limitReason();
  if (r !== null) throw new LimitReached(r, phase);
}

// --- the cheap poll for hot loops ------------------------------------------------------------
// One countdown shared by every loop: a decrement per call, a real check (flag, clock, memory)
// every POLL_INTERVAL calls. Loops whose iterations can each take milliseconds poll inside them
// too (the countdown is shared, so inner polls count for the outer loop).

const POLL_INTERVAL = 512;
let countdown = POLL_INTERVAL;

/** Call once per iteration of any loop that can run long; throws LimitReached when a limit is hit. */
export function poll(phase?: string): void {
  if (--countdown > 0) return;
  countdown = POLL_INTERVAL;
  if (traceGaps) recordGap(phase ?? "?");
  checkLimits(phase);
}

// --- measuring the polls (bench:limits): the longest time between two real checks, per phase ---
const traceGaps = process.env.PLUMBLINE_POLL_GAPS === "1";
const gaps = new Map<string, number>();
let lastCheckAt = 0;

function recordGap(phase: string): void {
  const now = performance.now();
  if (lastCheckAt > 0) {
    const g = now - lastCheckAt;
    if (g > (gaps.get(phase) ?? 0)) gaps.set(phase, g);
  }
  lastCheckAt = now;
}

/** With PLUMBLINE_POLL_GAPS=1: the longest gap (ms) before a real check, per phase; otherwise empty. */
export function pollGaps(): Map<string, number> {
  return gaps;
}
