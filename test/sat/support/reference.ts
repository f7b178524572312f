// logic-solver (MiniSat compiled to JavaScript, from npm) as an outside reference for answers:
// a thin wrapper taking DIMACS-style clauses.
import { createRequire } from "node:module";
import type { Cnf } from "../../../src/sat/index.js";

const require = createRequire(import.meta.url);
// eslint-disable-next-line @typescript-eslint/no-explicit-any
const Logic: any = require("logic-solver");

const name = (l: number) => (l > 0 ? `x${l}` : `-x${-l}`);

/** "sat" or "unsat" according to logic-solver. */
export function referenceAnswer(cnf: Cnf): "sat" | "unsat" {
  const s = new Logic.Solver();
  for (const c of cnf.clauses) s.require(Logic.or(Array.from(c, name)));
  return s.solve() ? "sat" : "unsat";
}
