// Where the fact and action variables of a horizon-T encoding live (spec core-1,
// "Variables"): fixed arithmetic positions, so numbering never depends on clause order.

export class Layout {
  readonly nF: number;
  readonly nA: number;
  readonly steps: number;
  /** First action variable: 1 + (T+1)·nF. */
  readonly actBase: number;
  /** First auxiliary variable: 1 + (T+1)·nF + T·nA. */
  readonly auxBase: number;

  constructor(nF: number, nA: number, steps: number) {
    this.nF = nF;
    this.nA = nA;
    this.steps = steps;
    this.actBase = 1 + (steps + 1) * nF;
    this.auxBase = this.actBase + steps * nA;
  }

  /** Variable "fact f holds at time point t", t ∈ 0..T. */
  fact(t: number, f: number): number {
    return 1 + t * this.nF + f;
  }

  /** Variable "action a is taken in step s", s ∈ 1..T (step s leads from time s−1 to s). */
  action(s: number, a: number): number {
    return this.actBase + (s - 1) * this.nA + a;
  }

  /** What a fact or action variable means, or null for an auxiliary variable. */
  describe(v: number): { kind: "fact"; time: number; fact: number } | { kind: "action"; step: number; action: number } | null {
    if (v >= 1 && v < this.actBase && this.nF > 0) {
      const i = v - 1;
      return { kind: "fact", time: Math.floor(i / this.nF), fact: i % this.nF };
    }
    if (v >= this.actBase && v < this.auxBase && this.nA > 0) {
      const i = v - this.actBase;
      return { kind: "action", step: 1 + Math.floor(i / this.nA), action: i % this.nA };
    }
    return null;
  }
}
