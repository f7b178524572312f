// Random mutations of DRAT proofs for property tests: a lemma dropped, a literal flipped, the
// proof truncated, or a random binary clause inserted.
import fc from "fast-check";
import type { NaiveStep } from "./naive-checker.js";

export type Mutation = { kind: "drop" | "flip" | "truncate" | "insert"; at: number; lit: number };

export function mutate(steps: NaiveStep[], m: Mutation, numVars: number): NaiveStep[] {
  const out = steps.map((s) => ({ del: s.del, lits: [...s.lits] }));
  const adds = out.map((s, i) => (s.del ? -1 : i)).filter((i) => i >= 0);
  if (adds.length === 0) return out;
  const i = adds[m.at % adds.length];
  switch (m.kind) {
    case "drop":
      out.splice(i, 1);
      break;
    case "flip":
      if (out[i].lits.length > 0) {
        const k = m.lit % out[i].lits.length;
        out[i].lits[k] = -out[i].lits[k];
      }
      break;
    case "truncate":
      out.length = i;
      break;
    case "insert": {
      const v = 1 + (m.lit % numVars);
      const w = 1 + ((m.lit >> 4) % numVars);
      out.splice(i, 0, { del: false, lits: [m.lit & 1 ? v : -v, m.lit & 2 ? w : -w] });
      break;
    }
  }
  return out;
}

/** A random mutation, for fast-check properties. */
export const mutationArb = fc.record({ kind: fc.constantFrom("drop", "flip", "truncate", "insert"), at: fc.nat(), lit: fc.nat() }) as fc.Arbitrary<Mutation>;
