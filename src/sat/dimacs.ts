// DIMACS CNF reading and writing with errors that name file:line:col (bad header, literal
// out of range, missing terminating 0); a clause-count mismatch is only a warning.
import { PlumblineError } from "../util/errors.js";
import { readBytes } from "../util/files.js";
import type { Cnf, CompactCnf } from "./types.js";
import { poll } from "../util/limits.js";

/** The largest variable count a DIMACS header may declare (the solver sizes per-variable arrays by it). */
export const MAX_DIMACS_VARIABLES = 1 << 25;
/** The largest clause count a DIMACS header may declare. */
export const MAX_DIMACS_CLAUSES = 2 ** 31 - 1;

export interface DimacsWarnings {
  warnings: string[];
}

function posAt(bytes: Uint8Array, file: string, offset: number): { file: string; line: number; col: number } {
  let line = 1;
  let lineStart = 0;
  for (let i = 0; i < offset && i < bytes.length; i++) {
    if (bytes[i] === 10) {
      line++;
      lineStart = i + 1;
    }
  }
  return { file, line, col: offset - lineStart + 1 };
}

function tokenAt(bytes: Uint8Array, offset: number): string {
  let end = offset;
  while (end < bytes.length && end - offset < 40 && !isSpace(bytes[end])) end++;
  return end === offset ? "end of file" : `'${Buffer.from(bytes.subarray(offset, end)).toString("latin1")}'`;
}

function isSpace(b: number): boolean {
  return b === 32 || b === 10 || b === 13 || b === 9 || b === 12 || b === 11;
}

function fail(bytes: Uint8Array, file: string, offset: number, msg: string): never {
  throw new PlumblineError("parse", msg, posAt(bytes, file, offset));
}

/** Parses DIMACS CNF text or bytes into the compact form. */
export function parseDimacsCompact(input: string | Uint8Array, file: string): CompactCnf & DimacsWarnings {
  const bytes = typeof input === "string" ? Buffer.from(input, "latin1") : input;
  const n = bytes.length;
  let i = 0;
  const warnings: string[] = [];

  // skip comments and blank lines up to the header
  const skipSpace = (): void => {
    while (i < n && isSpace(bytes[i])) i++;
  };
  const skipLine = (): void => {
    while (i < n && bytes[i] !== 10) i++;
  };
  const readUint = (what: string): number => {
    skipInline();
    const start = i;
    let x = 0;
    while (i < n && bytes[i] >= 48 && bytes[i] <= 57) {
      x = x * 10 + (bytes[i] - 48);
      i++;
    }
    if (i === start || (i < n && !isSpace(bytes[i]))) fail(bytes, file, start, `expected ${what} (a non-negative integer), found ${tokenAt(bytes, start)}`);
    return x;
  };
  const skipInline = (): void => {
    while (i < n && (bytes[i] === 32 || bytes[i] === 9 || bytes[i] === 13)) i++;
  };

  for (;;) {
    skipSpace();
    if (i < n && bytes[i] === 99 /* c */) {
      skipLine();
      continue;
    }
    break;
  }
  const hdr = i;
  if (!(i + 1 < n && bytes[i] === 112 /* p */ && isSpace(bytes[i + 1]))) {
    fail(bytes, file, hdr, `expected the header 'p cnf VARIABLES CLAUSES', found ${tokenAt(bytes, hdr)}`);
  }
  i++;
  skipInline();
  if (!(bytes[i] === 99 && bytes[i + 1] === 110 && bytes[i + 2] === 102 && (i + 3 >= n || isSpace(bytes[i + 3])))) {
    fail(bytes, file, i, `expected 'cnf' in the header, found ${tokenAt(bytes, i)}`);
  }
  i += 3;
  const varsAt = i;
  const numVars = readUint("the number of variables");
  if (numVars > MAX_DIMACS_VARIABLES) fail(bytes, file, varsAt, `the header declares ${numVars} variables; at most ${MAX_DIMACS_VARIABLES} are supported`);
  const clausesAt = i;
  const numClausesDeclared = readUint("the number of clauses");
  if (numClausesDeclared > MAX_DIMACS_CLAUSES) fail(bytes, file, clausesAt, `the header declares ${numClausesDeclared} clauses; at most ${MAX_DIMACS_CLAUSES} are supported`);
  skipInline();
  if (i < n && bytes[i] !== 10) fail(bytes, file, i, `expected the end of the header line, found ${tokenAt(bytes, i)}`);

  let lits = new Int32Array(Math.max(16, Math.min(numClausesDeclared * 4 + 16, 1 << 26)));
  let m = 0;
  let clauses = 0;
  let open = false;
  let lastLitOffset = -1;
  while (i < n) {
    poll("reading the CNF");
    const b = bytes[i];
    if (isSpace(b)) {
      i++;
      continue;
    }
    if (b === 99 /* c */) {
      skipLine();
      continue;
    }
    if (b === 37 /* % */) break; // some generators end the file with "%"
    const start = i;
    let neg = false;
    if (b === 45) {
      neg = true;
      i++;
    }
    let x = 0;
    const digits = i;
    while (i < n && bytes[i] >= 48 && bytes[i] <= 57) {
      x = x * 10 + (bytes[i] - 48);
      if (x > 0x3fffffff) fail(bytes, file, start, `literal ${tokenAt(bytes, start)} is out of range (the header declares ${numVars} variables)`);
      i++;
    }
    if (i === digits || (i < n && !isSpace(bytes[i]))) fail(bytes, file, start, `expected a literal (a non-zero integer) or 0, found ${tokenAt(bytes, start)}`);
    if (x > numVars) fail(bytes, file, start, `literal ${neg ? "-" : ""}${x} is out of range: the header declares ${numVars} variables`);
    if (neg && x === 0) fail(bytes, file, start, "'-0' is not a literal: 0 ends a clause and takes no sign");
    if (m === lits.length) {
      const g = new Int32Array(lits.length * 2);
      g.set(lits);
      lits = g;
    }
    if (x === 0) {
      lits[m++] = 0;
      clauses++;
      open = false;
    } else {
      lits[m++] = neg ? -x : x;
      open = true;
      lastLitOffset = start;
    }
  }
  if (open) fail(bytes, file, lastLitOffset, "the last clause is missing its terminating 0");
  if (clauses !== numClausesDeclared) {
    warnings.push(`${file}: the header declares ${numClausesDeclared} clauses but the file has ${clauses}`);
  }
  return { numVars, numClauses: clauses, lits: lits.slice(0, m), warnings };
}

/** Parses DIMACS CNF text into one Int32Array per clause. */
export function parseDimacs(text: string | Uint8Array, file: string): Cnf & DimacsWarnings {
  const c = parseDimacsCompact(text, file);
  return { numVars: c.numVars, clauses: splitClauses(c), warnings: c.warnings };
}

/** Reads and parses a DIMACS file (compact form). */
export function readDimacsFile(path: string): CompactCnf & DimacsWarnings {
  return parseDimacsCompact(readBytes(path), path);
}

/** One Int32Array per clause from the compact form. */
export function splitClauses(c: CompactCnf): Int32Array[] {
  const out: Int32Array[] = [];
  let start = 0;
  for (let i = 0; i < c.lits.length; i++) {
    if (c.lits[i] === 0) {
      out.push(c.lits.slice(start, i));
      start = i + 1;
    }
  }
  return out;
}

/** The compact form of a per-clause CNF. */
export function toCompact(cnf: Cnf): CompactCnf {
  let total = 0;
  for (const cl of cnf.clauses) total += cl.length + 1;
  const lits = new Int32Array(total);
  let m = 0;
  for (const cl of cnf.clauses) {
    lits.set(cl, m);
    m += cl.length;
    lits[m++] = 0;
  }
  return { numVars: cnf.numVars, numClauses: cnf.clauses.length, lits };
}

/** DIMACS text of a CNF, with optional comment lines first. */
export function writeDimacs(cnf: Cnf | CompactCnf, comments: string[] = []): string {
  const parts: string[] = [];
  for (const c of comments) parts.push(`c ${c}\n`);
  if ("clauses" in cnf) {
    parts.push(`p cnf ${cnf.numVars} ${cnf.clauses.length}\n`);
    for (const cl of cnf.clauses) parts.push(cl.length === 0 ? "0\n" : `${cl.join(" ")} 0\n`);
  } else {
    parts.push(`p cnf ${cnf.numVars} ${cnf.numClauses}\n`);
    let line: number[] = [];
    for (let i = 0; i < cnf.lits.length; i++) {
      const l = cnf.lits[i];
      line.push(l);
      if (l === 0) {
        parts.push(`${line.join(" ")}\n`);
        line = [];
      }
    }
  }
  return parts.join("");
}
