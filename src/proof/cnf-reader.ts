// The proof checker's own DIMACS reader (it shares no code with the solver it checks):
// one pass over the characters, with errors that name file:line:col.
import { PlumblineError } from "../util/errors.js";

/** The largest variable count a header may declare (per-variable arrays are sized by it). */
const MAX_VARIABLES = 1 << 25;

export interface CheckerCnf {
  numVars: number;
  clauses: ArrayLike<number>[];
}

/** Line and column (1-based) of character offset `at`. */
function where(text: string, file: string, at: number): { file: string; line: number; col: number } {
  let line = 1;
  let lineStart = 0;
  for (let i = text.indexOf("\n"); i >= 0 && i < at; i = text.indexOf("\n", i + 1)) {
    line++;
    lineStart = i + 1;
  }
  return { file, line, col: at - lineStart + 1 };
}

/** Reads DIMACS CNF text (or bytes) for the checker. Clause-count mismatches are tolerated. */
export function readCnfForChecker(input: string | Uint8Array, file: string): CheckerCnf & { warnings: string[] } {
  const text = typeof input === "string" ? input : Buffer.from(input.buffer, input.byteOffset, input.byteLength).toString("latin1");
  const n = text.length;
  const clauses: Int32Array[] = [];
  const warnings: string[] = [];
  let numVars = -1;
  let declared = -1;
  let current: number[] = [];
  let lastLit = 0;
  let i = 0;
  const fail = (at: number, msg: string): never => {
    throw new PlumblineError("parse", msg, where(text, file, at));
  };
  const word = (at: number) => {
    let e = at;
    while (e < n && e - at < 40 && text.charCodeAt(e) > 32) e++;
    return text.slice(at, e);
  };
  while (i < n) {
    const c = text.charCodeAt(i);
    if (c <= 32) {
      i++;
      continue;
    }
    if (c === 99 /* c */ || c === 112 /* p */ || c === 37 /* % */) {
      let e = text.indexOf("\n", i);
      if (e < 0) e = n;
      if (c === 37) break;
      if (c === 112) {
        const m = /^p\s+cnf\s+(\d+)\s+(\d+)\s*$/.exec(text.slice(i, e));
        if (numVars >= 0) fail(i, "a second header line");
        if (!m) fail(i, `expected 'p cnf VARIABLES CLAUSES', found '${text.slice(i, Math.min(e, i + 40)).trim()}'`);
        numVars = Number((m as RegExpExecArray)[1]);
        declared = Number((m as RegExpExecArray)[2]);
        // the checker sizes per-variable arrays by the header: an absurd count is bad input, not a crash
        if (numVars > MAX_VARIABLES) fail(i, `the header declares ${(m as RegExpExecArray)[1]} variables; at most ${MAX_VARIABLES} are supported`);
      }
      i = e;
      continue;
    }
    if (numVars < 0) fail(i, `expected the header 'p cnf VARIABLES CLAUSES' before clauses, found '${word(i)}'`);
    const at = i;
    const neg = c === 45;
    if (neg) i++;
    let x = 0;
    const digits = i;
    while (i < n) {
      const d = text.charCodeAt(i) - 48;
      if (d < 0 || d > 9) break;
      x = x * 10 + d;
      i++;
    }
    if (i === digits || (i < n && text.charCodeAt(i) > 32)) fail(at, `expected a literal or 0, found '${word(at)}'`);
    if (x > numVars) fail(at, `literal ${neg ? "-" : ""}${x} is out of range: the header declares ${numVars} variables`);
    if (neg && x === 0) fail(at, "'-0' is not a literal: 0 ends a clause and takes no sign");
    if (x === 0) {
      clauses.push(Int32Array.from(current));
      current = [];
    } else {
      current.push(neg ? -x : x);
      lastLit = at;
    }
  }
  if (numVars < 0) throw new PlumblineError("parse", "no 'p cnf VARIABLES CLAUSES' header found", { file, line: 1, col: 1 });
  if (current.length > 0) fail(lastLit, "the last clause is missing its terminating 0");
  if (declared !== clauses.length) warnings.push(`${file}: the header declares ${declared} clauses but the file has ${clauses.length}`);
  return { numVars, clauses, warnings };
}
