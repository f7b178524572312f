// LRAT hints collected during the backward check, one segment per checked lemma (plus one for
// the final conflict), in a single growable Int32Array. An entry is a clause, the unit of a
// top-level variable, or the start of a RAT candidate's group; the LRAT writer resolves them to
// clause numbers once the backward pass is over.

export const HINT_CLAUSE = 0;
export const HINT_UNIT = 1;
export const HINT_CANDIDATE = 2;

export class HintLog {
  buf = new Int32Array(1 << 16);
  used = 0;
  /** Per proof step: where its segment starts and how long it is (−1: none). */
  readonly segStart: Int32Array;
  readonly segLen: Int32Array;
  /** The segment of the final conflict (the empty clause). */
  finalStart = -1;
  finalLen = 0;
  private open = -2;
  private openAt = 0;

  constructor(steps: number) {
    this.segStart = new Int32Array(steps).fill(-1);
    this.segLen = new Int32Array(steps);
  }

  /** Starts the segment of proof step `t` (−1: the final conflict). */
  begin(t: number): void {
    this.open = t;
    this.openAt = this.used;
  }

  end(): void {
    if (this.open === -1) {
      this.finalStart = this.openAt;
      this.finalLen = this.used - this.openAt;
    } else if (this.open >= 0) {
      this.segStart[this.open] = this.openAt;
      this.segLen[this.open] = this.used - this.openAt;
    }
    this.open = -2;
  }

  private push(x: number): void {
    if (this.used === this.buf.length) {
      const b = new Int32Array(this.buf.length * 2);
      b.set(this.buf);
      this.buf = b;
    }
    this.buf[this.used++] = x;
  }

  clause(id: number): void {
    this.push((id << 2) | HINT_CLAUSE);
  }

  unit(v: number): void {
    this.push((v << 2) | HINT_UNIT);
  }

  candidate(id: number): void {
    this.push((id << 2) | HINT_CANDIDATE);
  }
}
