// A binary min-heap of integer ids under a caller-given order, shared by the SCC ordering
// and the measures' Dijkstra (ids only, so no per-entry objects).

export class IdHeap {
  private readonly items: number[] = [];
  constructor(private readonly less: (a: number, b: number) => boolean) {}

  get size(): number {
    return this.items.length;
  }

  push(x: number): void {
    const h = this.items;
    h.push(x);
    let i = h.length - 1;
    while (i > 0) {
      const p = (i - 1) >> 1;
      if (!this.less(h[i], h[p])) break;
      [h[p], h[i]] = [h[i], h[p]];
      i = p;
    }
  }

  pop(): number {
    const h = this.items;
    const top = h[0];
    const last = h.pop()!;
    if (h.length > 0) {
      h[0] = last;
      let i = 0;
      for (;;) {
        const l = 2 * i + 1;
        const r = l + 1;
        let m = i;
        if (l < h.length && this.less(h[l], h[m])) m = l;
        if (r < h.length && this.less(h[r], h[m])) m = r;
        if (m === i) break;
        [h[m], h[i]] = [h[i], h[m]];
        i = m;
      }
    }
    return top;
  }
}
