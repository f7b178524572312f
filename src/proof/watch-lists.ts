// Per-literal watch lists for the checker's unit propagation: one growable Int32Array of
// pairs per literal code, created on first use. The propagator keeps four of these
// (core / other clauses × binary / longer) so that it can propagate core clauses first.

export class WatchLists {
  readonly lists: (Int32Array | null)[];
  /** Number of ints in use per list (two per entry). */
  readonly n: Int32Array;

  constructor(codes: number) {
    this.lists = new Array<Int32Array | null>(codes).fill(null);
    this.n = new Int32Array(codes);
  }

  /** Appends the pair (a, b) to the list of literal code x. */
  push(x: number, a: number, b: number): void {
    const k = this.n[x];
    let ws = this.lists[x];
    if (ws === null || k + 2 > ws.length) {
      const grown = new Int32Array(k < 4 ? 4 : k * 2);
      if (ws !== null) grown.set(ws.subarray(0, k));
      this.lists[x] = ws = grown;
    }
    ws[k] = a;
    ws[k + 1] = b;
    this.n[x] = k + 2;
  }
}
