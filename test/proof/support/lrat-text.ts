// Test helpers for LRAT proofs: a plain parse into lines (for mutating proofs in tests) and back,
// and a solver proof of a CNF (the solver is used only here, never from src/proof).
import { MemoryProofWriter, Solver } from "../../../src/sat/index.js";

/** One LRAT line: an addition (id, literals, hints) or a deletion (id, deleted clause numbers). */
export type LratLine = { kind: "add"; id: number; lits: number[]; hints: number[] } | { kind: "del"; id: number; ids: number[] };

/** Parses well-formed LRAT text (the test's own reading, independent of src/proof). */
export function parseLrat(text: string | Uint8Array): LratLine[] {
  const s = typeof text === "string" ? text : Buffer.from(text).toString("latin1");
  const out: LratLine[] = [];
  for (const raw of s.split("\n")) {
    const t = raw.trim();
    if (t === "" || t.startsWith("c")) continue;
    const parts = t.split(/\s+/);
    const id = Number(parts[0]);
    if (parts[1] === "d") {
      out.push({ kind: "del", id, ids: parts.slice(2, -1).map(Number) });
      continue;
    }
    const nums = parts.slice(1).map(Number);
    const z = nums.indexOf(0);
    out.push({ kind: "add", id, lits: nums.slice(0, z), hints: nums.slice(z + 1, -1) });
  }
  return out;
}

export function printLrat(lines: LratLine[]): string {
  return lines.map((l) => (l.kind === "del" ? `${l.id} d ${[...l.ids, 0].join(" ")}\n` : `${l.id} ${[...l.lits, 0, ...l.hints, 0].join(" ")}\n`)).join("");
}

/** A deep copy, for mutating. */
export function copyLines(lines: LratLine[]): LratLine[] {
  return lines.map((l) => (l.kind === "del" ? { ...l, ids: [...l.ids] } : { ...l, lits: [...l.lits], hints: [...l.hints] }));
}

/** Solves `clauses` with a DRAT proof; the proof, or null when the formula is satisfiable. */
export function solverProof(clauses: ArrayLike<number>[], format: "binary" | "text" = "binary", opts: { reduceFirst?: number; reduceIncrement?: number } = {}): Uint8Array | null {
  const mem = new MemoryProofWriter(format);
  const s = new Solver({ proof: mem, ...opts });
  for (const c of clauses) s.addClause(c);
  if (s.solve() !== "unsat") return null;
  return mem.bytes().slice();
}
