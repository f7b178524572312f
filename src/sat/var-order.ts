// The decision order: exponential VSIDS activities (Moskewicz et al. 2001; Een and Sorensson
// 2003) in a binary max-heap over typed arrays, so picking the next decision variable is O(log n).

export class VarOrder {
  activity: Float64Array;
  /** heap[i] = variable; pos[v] = index in heap or -1. */
  heap: Int32Array;
  pos: Int32Array;
  n = 0;
  inc = 1;
  decay = 0.95;

  constructor(capacity: number) {
    this.activity = new Float64Array(capacity + 1);
    this.heap = new Int32Array(capacity + 1);
    this.pos = new Int32Array(capacity + 1).fill(-1);
  }

  grow(capacity: number): void {
    const a = new Float64Array(capacity + 1);
    a.set(this.activity);
    this.activity = a;
    const h = new Int32Array(capacity + 1);
    h.set(this.heap);
    this.heap = h;
    const p = new Int32Array(capacity + 1).fill(-1);
    p.set(this.pos);
    this.pos = p;
  }

  contains(v: number): boolean {
    return this.pos[v] >= 0;
  }

  insert(v: number): void {
    if (this.pos[v] >= 0) return;
    const i = this.n++;
    this.heap[i] = v;
    this.pos[v] = i;
    this.up(i);
  }

  /** Removes and returns the most active variable (heap must be non-empty). */
  pop(): number {
    const heap = this.heap;
    const top = heap[0];
    const last = heap[--this.n];
    this.pos[top] = -1;
    if (this.n > 0) {
      heap[0] = last;
      this.pos[last] = 0;
      this.down(0);
    }
    return top;
  }

  bump(v: number): void {
    const act = this.activity;
    if ((act[v] += this.inc) > 1e100) {
      for (let i = 1; i < act.length; i++) act[i] *= 1e-100;
      this.inc *= 1e-100;
    }
    const p = this.pos[v];
    if (p >= 0) this.up(p);
  }

  /** Applies the decay by raising the increment (equivalent to scaling all activities down). */
  decayAll(): void {
    this.inc /= this.decay;
  }

  private up(i: number): void {
    const heap = this.heap;
    const pos = this.pos;
    const act = this.activity;
    const v = heap[i];
    const a = act[v];
    while (i > 0) {
      const parent = (i - 1) >> 1;
      const pv = heap[parent];
      if (act[pv] >= a) break;
      heap[i] = pv;
      pos[pv] = i;
      i = parent;
    }
    heap[i] = v;
    pos[v] = i;
  }

  private down(i: number): void {
    const heap = this.heap;
    const pos = this.pos;
    const act = this.activity;
    const n = this.n;
    const v = heap[i];
    const a = act[v];
    for (;;) {
      let child = 2 * i + 1;
      if (child >= n) break;
      const right = child + 1;
      if (right < n && act[heap[right]] > act[heap[child]]) child = right;
      const cv = heap[child];
      if (act[cv] <= a) break;
      heap[i] = cv;
      pos[cv] = i;
      i = child;
    }
    heap[i] = v;
    pos[v] = i;
  }
}
