// Two solvers on one proving query when a core is free: the open incremental session goes on, and
// a fresh solver on another thread (portfolio-worker.ts) races it; the first answer wins, with its proof.
import * as fs from "node:fs";
import * as path from "node:path";
import type { Worker } from "node:worker_threads";
import type { CompactCnf } from "../sat/index.js";
import { startThread } from "../util/thread.js";
import type { Formula } from "./formula.js";
import type { PortfolioAnswer, PortfolioInput } from "./portfolio-worker.js";

export class PortfolioRun {
  private readonly worker: Worker;
  private answer: PortfolioAnswer | null = null;
  private ended = false;
  readonly proofPath: string;

  constructor(formula: Formula, units: readonly number[], proofPath: string, deadline: number) {
    this.proofPath = proofPath;
    const input: PortfolioInput = { cnf: reversedWithUnits(formula, units), proofPath, deadline: Number.isFinite(deadline) ? deadline : undefined };
    this.worker = startThread(import.meta.url, "portfolio-worker", input);
    this.worker.on("message", (m: PortfolioAnswer) => {
      if (!this.ended) this.answer = m;
    });
    this.worker.on("error", () => {
      this.answer = { status: "unknown", model: null, proof: null, conflicts: 0 };
    });
    this.worker.unref();
  }

  /** The second solver's answer once it is sat or unsat (null before, and after an unknown). */
  get decided(): PortfolioAnswer | null {
    return this.answer !== null && this.answer.status !== "unknown" ? this.answer : null;
  }

  /**
   * Stops the thread and removes its proof unless `keep` (the caller then owns the finished proof
   * file); also the partial proof a stopped thread leaves behind.
   */
  stop(keep = false): Promise<void> {
    if (this.ended) return this.stopped;
    this.ended = true;
    this.stopped = this.worker.terminate().then(() => this.sweep(keep));
    return this.stopped;
  }

  private stopped: Promise<void> = Promise.resolve();

  private sweep(keep: boolean): void {
    const dir = path.dirname(this.proofPath);
    const base = path.basename(this.proofPath);
    try {
      for (const f of fs.readdirSync(dir)) if (f.startsWith(`.${base}.tmp-`) || (!keep && f === base)) fs.rmSync(path.join(dir, f), { force: true });
    } catch {
      /* the work directory is gone already */
    }
  }
}

/**
 * The formula's clauses in reverse order, then `units` as unit clauses, zero-terminated: the same
 * clauses (a DRAT proof does not depend on their order) but a different start for the second
 * solver's activities and watches, so the two search differently.
 */
function reversedWithUnits(formula: Formula, units: readonly number[]): CompactCnf {
  let n = 0;
  formula.streamTo({ addClause: (l) => (n += l.length) });
  const fwd = new Int32Array(n);
  const ends = new Int32Array(formula.numClauses);
  let at = 0;
  let c = 0;
  formula.streamTo({
    addClause: (l) => {
      for (let i = 0; i < l.length; i++) fwd[at++] = l[i];
      ends[c++] = at;
    },
  });
  const lits = new Int32Array(n + c + 2 * units.length);
  let out = 0;
  for (let k = c - 1; k >= 0; k--) {
    for (let i = k === 0 ? 0 : ends[k - 1]; i < ends[k]; i++) lits[out++] = fwd[i];
    lits[out++] = 0;
  }
  for (const u of units) {
    lits[out++] = u;
    lits[out++] = 0;
  }
  return { numVars: formula.numVars, numClauses: c + units.length, lits };
}
