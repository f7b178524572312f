// The ids a planning CNF is named by besides its step encoding: the cost encoding and the
// optional parts. Each id is one spec in encodings/; certificates record them to rebuild the CNF.

export type CostEncodingId = "cost-adder-1" | "cost-unary-1";
export const COST_ENCODINGS: readonly CostEncodingId[] = ["cost-adder-1", "cost-unary-1"];

/** Optional parts of a planning CNF, listed in their canonical (emission) order. */
export type PartId = "reach-1" | "relaxed-suffix-1" | "landmarks-1" | "cost-prune-1" | "eager-steps-1" | "empty-steps-last-1";
export const PARTS: readonly PartId[] = ["reach-1", "relaxed-suffix-1", "landmarks-1", "cost-prune-1", "eager-steps-1", "empty-steps-last-1"];

/** Checks a parts list: known ids, no repeats, canonical order. Returns a copy. */
export function checkParts(parts: readonly string[] | undefined): PartId[] {
  const out: PartId[] = [];
  let last = -1;
  for (const p of parts ?? []) {
    const i = PARTS.indexOf(p as PartId);
    if (i < 0) throw new RangeError(`encode: unknown part ${JSON.stringify(p)} (known: ${PARTS.join(", ")})`);
    if (i <= last) throw new RangeError(`encode: parts must be distinct and in the order ${PARTS.join(", ")}; got ${JSON.stringify(parts)}`);
    last = i;
    out.push(p as PartId);
  }
  return out;
}
