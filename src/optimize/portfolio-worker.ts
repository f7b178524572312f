// The thread of the two-solver portfolio (portfolio.ts): a fresh built-in solver on the clauses it
// is given (the open formula's, reversed, plus the bound units), with its own DRAT proof.
import { parentPort, workerData } from "node:worker_threads";
import { FileProofWriter, Solver, type CompactCnf } from "../sat/index.js";

export interface PortfolioInput {
  /** The clauses in reverse order, then the bound units as unit clauses (zero-terminated). */
  cnf: CompactCnf;
  proofPath: string;
  deadline?: number;
}

export interface PortfolioAnswer {
  status: "sat" | "unsat" | "unknown";
  /** After sat: index v holds 1 when variable v is true (the solver's model). */
  model: Int8Array | null;
  /** After unsat: the finished proof (binary DRAT of the clauses and the unit clauses). */
  proof: { file: string; bytes: number } | null;
  conflicts: number;
}

const input = workerData as PortfolioInput;
const writer = new FileProofWriter(input.proofPath, "binary");
const solver = new Solver({ proof: writer });
solver.addCnf(input.cnf);
const status = solver.solve([], { deadline: input.deadline });
if (status === "unsat") writer.close();
else writer.abort();
const answer: PortfolioAnswer = {
  status,
  model: status === "sat" ? solver.model() : null,
  proof: status === "unsat" ? { file: writer.path, bytes: writer.size } : null,
  conflicts: solver.stats().conflicts,
};
parentPort!.postMessage(answer);
