// Test helper: the npm package logic-solver (MiniSat compiled to JavaScript) as an independent
// SAT oracle for our CNFs — a solver written outside this project, so it shares no bugs with it.
import { createRequire } from "node:module";
import type { PlainCnf } from "../../src/encode/index.js";

const require = createRequire(import.meta.url);
// eslint-disable-next-line @typescript-eslint/no-explicit-any
const Logic: any = require("logic-solver");

export type Model = (v: number) => boolean;

export class Oracle {
  // eslint-disable-next-line @typescript-eslint/no-explicit-any
  private readonly solver: any;
  private readonly num: Int32Array; // our variable → logic-solver variable number
  private readonly numVars: number;

  constructor(cnf: PlainCnf) {
    this.solver = new Logic.Solver();
    this.numVars = cnf.numVars;
    this.num = new Int32Array(cnf.numVars + 1);
    for (let v = 1; v <= cnf.numVars; v++) this.num[v] = this.solver.getVarNum(`v${v}`);
    // Clauses go in through the package's clause-level entry point (its formula layer is far
    // slower and adds nothing for plain clauses); type checks off while loading.
    Logic.disablingAssertions(() => {
      for (const cl of cnf.clauses) this.addClause(cl);
    });
  }

  /** Adds one more clause (e.g. to block a model already seen). */
  addClause(lits: ArrayLike<number>): void {
    this.solver._addClause(new Logic.Clause(Array.from(lits, (l) => this.map(l))));
  }

  private map(l: number): number {
    return l > 0 ? this.num[l] : -this.num[-l];
  }

  /** A model under the assumption literals, or null when unsatisfiable. */
  solve(assumptions: readonly number[] = []): Model | null {
    const sol = assumptions.length === 0 ? this.solver.solve() : this.solver.solveAssuming(Logic.and(...assumptions.map((l) => this.map(l))));
    if (!sol) return null;
    const truth = new Uint8Array(this.numVars + 1);
    for (const name of sol.getTrueVars() as string[]) if (name.startsWith("v")) truth[Number(name.slice(1))] = 1;
    return (v: number) => truth[v] === 1;
  }
}
