// Progress lines for a person watching a long solve: what bound is being tried at which
// horizon, formula size, conflicts and elapsed time — at most one line per interval.
import type { Budget } from "./budget.js";

export interface ProgressState {
  phase: string;
  bound: number | null;
  horizon: number | null;
  vars: number | null;
  clauses: number | null;
  conflicts: () => number;
}

export class Progress {
  private last = -Infinity;
  state: ProgressState = { phase: "start", bound: null, horizon: null, vars: null, clauses: null, conflicts: () => 0 };

  constructor(
    private readonly sink: ((line: string) => void) | undefined,
    private readonly budget: Budget,
    private readonly intervalMs = 2000,
  ) {}

  /** Prints a line at once (phase changes). */
  say(text: string): void {
    this.sink?.(`[${this.budget.elapsed().toFixed(1)} s] ${text}`);
    this.last = performance.now();
  }

  /** Prints the state if the interval has passed. */
  tick(): void {
    if (!this.sink || performance.now() - this.last < this.intervalMs) return;
    const s = this.state;
    const parts = [s.phase];
    if (s.bound !== null) parts.push(`cost ≤ ${s.bound}?`);
    if (s.horizon !== null) parts.push(`horizon ${s.horizon}`);
    if (s.vars !== null && s.clauses !== null) parts.push(`${s.vars.toLocaleString("en")} vars, ${s.clauses.toLocaleString("en")} clauses`);
    parts.push(`${s.conflicts().toLocaleString("en")} conflicts`);
    this.say(parts.join(" | "));
  }
}
