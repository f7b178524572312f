// A CNF given as a stream of clauses (no copy of the formula, no single huge string) and its
// DIMACS file written in 1 MiB chunks: how an external solver gets formulas of any size.
import * as fs from "node:fs";
import { poll } from "../util/limits.js";
import type { CompactCnf, Cnf } from "./types.js";

/** A formula that can hand out its clauses one by one, as often as asked. */
export interface StreamedCnf {
  numVars: number;
  numClauses: number;
  /** Calls `sink.addClause` once per clause, in order. */
  streamTo(sink: { addClause(lits: ArrayLike<number>): unknown }): void;
}

/** Any CNF as a clause stream. */
export function asStream(cnf: Cnf | CompactCnf | StreamedCnf): StreamedCnf {
  if ("streamTo" in cnf) return cnf;
  if ("clauses" in cnf) return { numVars: cnf.numVars, numClauses: cnf.clauses.length, streamTo: (sink) => cnf.clauses.forEach((c) => sink.addClause(c)) };
  return {
    numVars: cnf.numVars,
    numClauses: cnf.numClauses,
    streamTo(sink) {
      let start = 0;
      for (let i = 0; i < cnf.lits.length; i++) {
        if (cnf.lits[i] === 0) {
          sink.addClause(cnf.lits.subarray(start, i));
          start = i + 1;
        }
      }
    },
  };
}

const CHUNK = 1 << 20;

/** Writes `cnf` as DIMACS to `file` (created or truncated), never holding more than about 1 MiB of text. */
export function writeDimacsFile(file: string, cnf: StreamedCnf): void {
  const fd = fs.openSync(file, "w");
  try {
    let buf = `p cnf ${cnf.numVars} ${cnf.numClauses}\n`;
    cnf.streamTo({
      addClause(lits) {
        poll("writing the CNF");
        let line = "";
        for (let i = 0; i < lits.length; i++) line += `${lits[i]} `;
        buf += line + "0\n";
        if (buf.length >= CHUNK) {
          fs.writeSync(fd, buf);
          buf = "";
        }
      },
    });
    fs.writeSync(fd, buf);
  } finally {
    fs.closeSync(fd);
  }
}

/** The index of the first clause `model` (1 true, −1 false per variable) falsifies, or −1. */
export function firstFalsifiedClause(cnf: StreamedCnf, model: Int8Array): number {
  let idx = 0;
  let bad = -1;
  cnf.streamTo({
    addClause(lits) {
      if (bad < 0) {
        let ok = false;
        for (let i = 0; i < lits.length && !ok; i++) {
          const l = lits[i];
          ok = l > 0 ? model[l] === 1 : model[-l] === -1;
        }
        if (!ok) bad = idx;
      }
      idx++;
    },
  });
  return bad;
}
