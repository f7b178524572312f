// The thread of the two-solver portfolio (portfolio.ts): a fresh built-in solver on the clauses of
// the open formula in reverse order, plus the bound units as unit clauses, with its own DRAT proof.
import { parentPort, workerData } from "node:worker_threads";
import { FileProofWriter, Solver } from "../sat/index.js";

export interface PortfolioInput {
  numVars: number;
  /** Every clause's literals, one after another; clause i ends at ends[i]. */
  lits: Int32Array;
  ends: Int32Array;
  units: number[];
  proofPath: string;
  deadline?: number;
}

export interface PortfolioAnswer {
  status: "sat" | "unsat" | "unknown";
  /** After sat: 1 where variable v (index v) is true. */
  model: Uint8Array | null;
  /** After unsat: the finished proof (binary DRAT of the clauses and the unit clauses). */
  proof: { file: string; bytes: number } | null;
  conflicts: number;
}

const input = workerData as PortfolioInput;
const writer = new FileProofWriter(input.proofPath, "binary");
const solver = new Solver({ proof: writer });
while (solver.numVars < input.numVars) solver.newVar();
// the same clauses in the opposite order: a different start for the activity order and the watches,
// so the two solvers search differently (a DRAT proof does not depend on the clauses' order)
for (let c = input.ends.length - 1; c >= 0; c--) solver.addClause(input.lits.subarray(c === 0 ? 0 : input.ends[c - 1], input.ends[c]));
for (const u of input.units) solver.addClause([u]);
const status = solver.solve([], { deadline: input.deadline });
let answer: PortfolioAnswer;
if (status === "unsat") {
  writer.close();
  answer = { status, model: null, proof: { file: writer.path, bytes: writer.size }, conflicts: solver.stats().conflicts };
} else {
  writer.abort();
  let model: Uint8Array | null = null;
  if (status === "sat") {
    model = new Uint8Array(input.numVars + 1);
    for (let v = 1; v <= input.numVars; v++) model[v] = solver.value(v) === true ? 1 : 0;
  }
  answer = { status, model, proof: null, conflicts: solver.stats().conflicts };
}
parentPort!.postMessage(answer);
