// Formula size before unrolling: build the formula at 1 and 2 steps and extrapolate
// linearly, so a horizon too large for the limits is refused before memory is spent.
import type { Task } from "../ground/task.js";
import { buildFormula, type FormulaSpec } from "./formula.js";

export interface SizeEstimate {
  vars: number;
  clauses: number;
  literals: number;
  /** Rough resident bytes while solving (builder + solver arrays + learned clauses). */
  bytes: number;
}

function measure(task: Task, spec: FormulaSpec, steps: number): { vars: number; clauses: number; literals: number } {
  const f = buildFormula(task, { ...spec, steps, partParams: undefined });
  let literals = 0;
  f.streamTo({ addClause: (l) => (literals += l.length) });
  return { vars: f.numVars, clauses: f.numClauses, literals };
}

/** Per-step growth is linear in every part of the formula (the adder's inputs grow per step). */
export function estimateFormula(task: Task, spec: FormulaSpec): SizeEstimate {
  const T = spec.steps;
  const a = measure(task, spec, 1);
  const b = measure(task, spec, 2);
  const at = (x: number, y: number) => Math.max(y, x + (T - 1) * (y - x));
  const vars = T <= 1 ? a.vars : at(a.vars, b.vars);
  const clauses = T <= 1 ? a.clauses : at(a.clauses, b.clauses);
  const literals = T <= 1 ? a.literals : at(a.literals, b.literals);
  // a rough model, not a measurement: the solver keeps literals (4 B) plus watch entries
  // (8 B per watched pair), clause headers and per-variable arrays; the encoder keeps its own
  // copy (4 B per literal); learned clauses can double that during search. bench:solve prints
  // the measured peak beside it.
  const bytes = 2 * (12 * literals + 24 * clauses + 64 * vars) + 64 * 1048576;
  return { vars, clauses, literals, bytes };
}
