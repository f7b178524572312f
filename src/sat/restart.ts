// When to restart: alternating "focused" phases (restart when the recent LBD average exceeds
// the long-run one, Audemard and Simon 2012, with exponential moving averages as in Biere and
// Froehlich 2015) and "stable" phases (Luby et al. 1993 restart intervals), cf. Oh 2015.

/** The Luby sequence 1,1,2,1,1,2,4,1,1,2,... (0-based index i). */
export function luby(i: number): number {
  let size = 1;
  let seq = 0;
  while (size < i + 1) {
    seq++;
    size = 2 * size + 1;
  }
  let x = i;
  while (size - 1 !== x) {
    size = (size - 1) >> 1;
    seq--;
    x = x % size;
  }
  return 2 ** seq;
}

export class RestartPolicy {
  stable = false;
  private fast = 0;
  private slow = 0;
  private fastBias = 1;
  private slowBias = 1;
  private sinceRestart = 0;
  private lubyIndex = 0;
  private lubyLimit = 0;
  private phaseLeft = 1000;
  private phaseLength = 1000;

  static readonly FAST_ALPHA = 1 / 32;
  static readonly SLOW_ALPHA = 1 / 4096;
  // focused mode: restart when the recent LBD average is 15 % above the long-run one, at least
  // 10 conflicts apart (was 25 % and 50: on the planning formulas of bench:sat-dir this restarts
  // several times more often and takes about 9 % fewer propagations on the unsat queries)
  static readonly MARGIN = 1.15;
  static readonly MIN_DISTANCE = 10;
  static readonly LUBY_UNIT = 512;

  /** True right after a switch between focused and stable phases (cleared by the caller). */
  switched = false;

  /** Records one conflict with the LBD of its learned clause. */
  onConflict(lbd: number): void {
    this.sinceRestart++;
    // bias-corrected EMAs (start-up values are not dragged towards 0)
    this.fast += RestartPolicy.FAST_ALPHA * (lbd - this.fast);
    this.slow += RestartPolicy.SLOW_ALPHA * (lbd - this.slow);
    this.fastBias *= 1 - RestartPolicy.FAST_ALPHA;
    this.slowBias *= 1 - RestartPolicy.SLOW_ALPHA;
    if (--this.phaseLeft <= 0) {
      this.stable = !this.stable;
      this.switched = true;
      if (!this.stable) this.phaseLength *= 2;
      this.phaseLeft = this.phaseLength;
      this.sinceRestart = 0;
      if (this.stable) this.nextLuby();
    }
  }

  shouldRestart(): boolean {
    if (this.stable) return this.sinceRestart >= this.lubyLimit;
    if (this.sinceRestart < RestartPolicy.MIN_DISTANCE) return false;
    const f = this.fast / (1 - this.fastBias);
    const s = this.slow / (1 - this.slowBias);
    return f > RestartPolicy.MARGIN * s;
  }

  onRestart(): void {
    this.sinceRestart = 0;
    if (this.stable) this.nextLuby();
  }

  private nextLuby(): void {
    this.lubyLimit = luby(this.lubyIndex++) * RestartPolicy.LUBY_UNIT;
  }
}
