// Saturating big-integer arithmetic for bounds: products of projection sizes overflow any
// float; values past 10^300 saturate to "infinite", which is always a sound (useless) bound.

/** A non-negative integer, or null when it exceeds LIMIT (treated as +∞). */
export type Big = bigint | null;

export const LIMIT = 10n ** 300n;

export function big(n: number | bigint): Big {
  const b = typeof n === "bigint" ? n : BigInt(n);
  return b > LIMIT ? null : b;
}

export function add(a: Big, b: Big): Big {
  if (a === null || b === null) return null;
  return big(a + b);
}

export function mul(a: Big, b: Big): Big {
  if (a === 0n || b === 0n) return 0n;
  if (a === null || b === null) return null;
  return big(a * b);
}

export function min(a: Big, b: Big): Big {
  if (a === null) return b;
  if (b === null) return a;
  return a < b ? a : b;
}

export function less(a: Big, b: Big): boolean {
  if (a === null) return false;
  if (b === null) return true;
  return a < b;
}

/** As a JS number: exact when at most 2^53 − 1, otherwise +Infinity (never rounded down). */
export function toNumber(a: Big): number {
  if (a === null || a > BigInt(Number.MAX_SAFE_INTEGER)) return Number.POSITIVE_INFINITY;
  return Number(a);
}

/**
 * JSON form: a number when it is a safe integer, else its exact decimal string, or the
 * string "Infinity" when it saturated past 10^300.
 */
export function toJson(a: Big): number | string {
  if (a === null) return "Infinity";
  if (a <= BigInt(Number.MAX_SAFE_INTEGER)) return Number(a);
  return a.toString();
}

/** Exact decimal text ("Infinity" when saturated). */
export function toText(a: Big): string {
  return a === null ? "Infinity" : a.toString();
}
