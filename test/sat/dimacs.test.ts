// DIMACS reading and writing: round trips, and errors that name file:line:col for a bad
// header, a literal out of range, a missing terminating 0; a clause-count mismatch only warns.
import { describe, expect, it } from "vitest";
import { PlumblineError } from "../../src/util/errors.js";
import { parseDimacs, parseDimacsCompact, toCompact, writeDimacs } from "../../src/sat/index.js";
import { randomKSat } from "./support/generators.js";

function errorOf(f: () => unknown): PlumblineError {
  try {
    f();
  } catch (e) {
    if (e instanceof PlumblineError) return e;
    throw e;
  }
  throw new Error("no error thrown");
}

describe("DIMACS", () => {
  it("round-trips clauses, comments and both in-memory forms", () => {
    const cnf = randomKSat(30, 100, 3, 5);
    const text = writeDimacs(cnf, ["made by a test"]);
    expect(text.startsWith("c made by a test\np cnf 30 100\n")).toBe(true);
    const back = parseDimacs(text, "t.cnf");
    expect(back.numVars).toBe(30);
    expect(back.clauses.map((c) => Array.from(c))).toEqual(cnf.clauses.map((c) => Array.from(c)));
    expect(back.warnings).toEqual([]);
    const compact = parseDimacsCompact(Buffer.from(text), "t.cnf");
    expect(Array.from(compact.lits)).toEqual(Array.from(toCompact(cnf).lits));
    expect(writeDimacs(compact)).toBe(writeDimacs(cnf));
  });

  it("accepts clauses spread over lines, several per line, tabs, CRLF and comments between clauses", () => {
    const r = parseDimacs("c hi\r\np cnf 3 3\r\n1 -2\r\n 3 0 -1 0\n\tc mid\n2 3 -3 0\n", "x.cnf");
    expect(r.clauses.map((c) => Array.from(c))).toEqual([[1, -2, 3], [-1], [2, 3, -3]]);
  });

  it("names the place of a bad header", () => {
    const e = errorOf(() => parseDimacs("c x\n1 2 0\n", "a.cnf"));
    expect(e.code).toBe("parse");
    expect(e.message).toBe("a.cnf:2:1: expected the header 'p cnf VARIABLES CLAUSES', found '1'");
    expect(errorOf(() => parseDimacs("p dnf 2 1\n", "a.cnf")).message).toBe("a.cnf:1:3: expected 'cnf' in the header, found 'dnf'");
    expect(errorOf(() => parseDimacs("p cnf x 1\n", "a.cnf")).message).toMatch(/^a\.cnf:1:7: expected the number of variables/);
  });

  it("names the place of a literal out of range and of a non-number", () => {
    expect(errorOf(() => parseDimacs("p cnf 3 1\n1 -4 0\n", "b.cnf")).message).toBe("b.cnf:2:3: literal -4 is out of range: the header declares 3 variables");
    expect(errorOf(() => parseDimacs("p cnf 3 1\n1 x 0\n", "b.cnf")).message).toBe("b.cnf:2:3: expected a literal (a non-zero integer) or 0, found 'x'");
  });

  it("names the place of a missing terminating 0", () => {
    expect(errorOf(() => parseDimacs("p cnf 3 2\n1 2 0\n3 -1\n", "c.cnf")).message).toBe("c.cnf:3:3: the last clause is missing its terminating 0");
  });

  it("only warns about a clause-count mismatch", () => {
    const r = parseDimacs("p cnf 2 5\n1 2 0\n", "d.cnf");
    expect(r.clauses.length).toBe(1);
    expect(r.warnings).toEqual(["d.cnf: the header declares 5 clauses but the file has 1"]);
  });
});
