// Seeded pseudo-random numbers for the scenario generators: the same seed must give the
// same problem file on every machine, so we never touch Math.random.

/** mulberry32: a small 32-bit generator (common practice, no source); fine for test data. */
export class Rng {
  private state: number;

  constructor(seed: number) {
    if (!Number.isInteger(seed)) throw new Error(`seed must be an integer, got ${seed}`);
    this.state = seed >>> 0;
  }

  /** Uniform in [0, 1). */
  next(): number {
    this.state = (this.state + 0x6d2b79f5) >>> 0;
    let t = this.state;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  }

  /** Uniform integer in [lo, hi] (both included). */
  int(lo: number, hi: number): number {
    if (hi < lo) throw new Error(`empty range [${lo}, ${hi}]`);
    return lo + Math.floor(this.next() * (hi - lo + 1));
  }

  /** True with probability p. */
  chance(p: number): boolean {
    return this.next() < p;
  }

  pick<T>(xs: readonly T[]): T {
    if (xs.length === 0) throw new Error("pick from an empty list");
    return xs[this.int(0, xs.length - 1)];
  }

  /** A shuffled copy (Fisher–Yates). */
  shuffle<T>(xs: readonly T[]): T[] {
    const a = [...xs];
    for (let i = a.length - 1; i > 0; i--) {
      const j = this.int(0, i);
      [a[i], a[j]] = [a[j], a[i]];
    }
    return a;
  }

  /** k distinct elements, in random order. */
  sample<T>(xs: readonly T[], k: number): T[] {
    return this.shuffle(xs).slice(0, k);
  }
}
