// Binary min-heap over parallel typed arrays: two numeric keys compared lexicographically
// and an integer payload (plus one number carried along); used for open lists and relaxations.

export class KeyHeap {
  private k1: Float64Array;
  private k2: Float64Array;
  private val: Int32Array;
  private aux: Float64Array;
  private n = 0;
  /** Payload and keys of the last pop. */
  topKey1 = 0;
  topKey2 = 0;
  topAux = 0;

  constructor(capacity = 1024) {
    this.k1 = new Float64Array(capacity);
    this.k2 = new Float64Array(capacity);
    this.val = new Int32Array(capacity);
    this.aux = new Float64Array(capacity);
  }

  get size(): number {
    return this.n;
  }

  get bytes(): number {
    return this.k1.byteLength * 3 + this.val.byteLength;
  }

  clear(): void {
    this.n = 0;
  }

  /** Smallest first key without popping (heap must be non-empty). */
  peekKey1(): number {
    return this.k1[0];
  }

  push(key1: number, key2: number, value: number, aux = 0): void {
    if (this.n === this.val.length) this.grow();
    const k1 = this.k1;
    const k2 = this.k2;
    const val = this.val;
    const ax = this.aux;
    let i = this.n++;
    while (i > 0) {
      const p = (i - 1) >> 1;
      if (k1[p] < key1 || (k1[p] === key1 && k2[p] <= key2)) break;
      k1[i] = k1[p];
      k2[i] = k2[p];
      val[i] = val[p];
      ax[i] = ax[p];
      i = p;
    }
    k1[i] = key1;
    k2[i] = key2;
    val[i] = value;
    ax[i] = aux;
  }

  /** Removes the smallest entry and returns its payload (keys in topKey1/topKey2/topAux). */
  pop(): number {
    const k1 = this.k1;
    const k2 = this.k2;
    const val = this.val;
    const ax = this.aux;
    const result = val[0];
    this.topKey1 = k1[0];
    this.topKey2 = k2[0];
    this.topAux = ax[0];
    const n = --this.n;
    if (n > 0) {
      const key1 = k1[n];
      const key2 = k2[n];
      const v = val[n];
      const a = ax[n];
      let i = 0;
      for (;;) {
        let c = 2 * i + 1;
        if (c >= n) break;
        const r = c + 1;
        if (r < n && (k1[r] < k1[c] || (k1[r] === k1[c] && k2[r] < k2[c]))) c = r;
        if (key1 < k1[c] || (key1 === k1[c] && key2 <= k2[c])) break;
        k1[i] = k1[c];
        k2[i] = k2[c];
        val[i] = val[c];
        ax[i] = ax[c];
        i = c;
      }
      k1[i] = key1;
      k2[i] = key2;
      val[i] = v;
      ax[i] = a;
    }
    return result;
  }

  private grow(): void {
    const cap = this.val.length * 2;
    const g = <T extends Float64Array | Int32Array>(x: T, mk: (n: number) => T): T => {
      const y = mk(cap);
      y.set(x);
      return y;
    };
    this.k1 = g(this.k1, (n) => new Float64Array(n));
    this.k2 = g(this.k2, (n) => new Float64Array(n));
    this.aux = g(this.aux, (n) => new Float64Array(n));
    this.val = g(this.val, (n) => new Int32Array(n));
  }
}
