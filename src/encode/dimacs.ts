// DIMACS CNF text for a CnfBuilder: byte-for-byte deterministic (the certificate hashes it),
// written in chunks so large planning CNFs never need one giant string.
import type { CnfBuilder } from "./cnf.js";

const CHUNK = 1 << 16;

/**
 * Writes the DIMACS text in pieces: `c <comment>` lines, the `p cnf V C` header, then one
 * clause per line (`l1 l2 … 0`). Lines end with "\n"; no trailing spaces.
 */
export function writeDimacsChunks(cnf: CnfBuilder, comments: readonly string[], write: (chunk: string) => void): void {
  let buf = "";
  for (const c of comments) {
    if (c.includes("\n")) throw new Error("DIMACS comment must be one line");
    buf += c.length > 0 ? `c ${c}\n` : "c\n";
  }
  buf += `p cnf ${cnf.numVars} ${cnf.numClauses}\n`;
  const n = cnf.numClauses;
  for (let i = 0; i < n; i++) {
    const cl = cnf.clause(i);
    let line = "";
    for (let j = 0; j < cl.length; j++) line += `${cl[j]} `;
    buf += `${line}0\n`;
    if (buf.length >= CHUNK) {
      write(buf);
      buf = "";
    }
  }
  if (buf.length > 0) write(buf);
}

/** The whole DIMACS text as one string (fine for small and medium CNFs). */
export function toDimacs(cnf: CnfBuilder, comments: readonly string[] = []): string {
  const parts: string[] = [];
  writeDimacsChunks(cnf, comments, (s) => parts.push(s));
  return parts.join("");
}
