// Parsing of the numeric options several commands share (--time-limit, --memory-limit, state
// caps): one place for the rules and the usage-error wording.
import { PlumblineError } from "../util/errors.js";
import { tightenLimits } from "../util/limits.js";

/** A positive number (or whole number with `integer`); undefined when the option is absent. */
export function positiveNumber(flag: string, text: string | undefined, integer = false): number | undefined {
  if (text === undefined) return undefined;
  const n = Number(text);
  if (!Number.isFinite(n) || n <= 0 || (integer && !Number.isSafeInteger(n))) {
    throw new PlumblineError("usage", `${flag} expects a positive ${integer ? "whole number" : "number"}, found '${text}'`);
  }
  return n;
}

/** A positive whole number, or `fallback` when the option is absent. */
export function positiveOption(flag: string, text: string | undefined, fallback: number): number {
  return positiveNumber(flag, text, true) ?? fallback;
}

/**
 * Parses --time-limit (seconds, > 0) into an absolute deadline in epoch milliseconds, and makes it
 * the deadline of the whole command: every long loop polls it (src/util/limits.ts), so reading and
 * grounding spend the limit too.
 */
export function deadlineFrom(timeLimit: string | undefined): number | undefined {
  const s = positiveNumber("--time-limit", timeLimit);
  const deadline = s === undefined ? undefined : Date.now() + s * 1000;
  tightenLimits({ deadline });
  return deadline;
}

/** A state cap: a whole number ≥ 0 (0 turns the capped method off), or `fallback` when absent. */
export function capOption(flag: string, text: string | undefined, fallback: number): number {
  if (text === undefined) return fallback;
  const n = Number(text);
  if (!Number.isSafeInteger(n) || n < 0) throw new PlumblineError("usage", `${flag} expects a whole number ≥ 0 (0 turns the method off), found '${text}'`);
  return n;
}
