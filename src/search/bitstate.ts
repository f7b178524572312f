// Packed bit states: a state is `words` 32-bit words, fact f at bit f&31 of word f>>5.
// Small helpers shared by the successor generator, the state table and the heuristics.

export function wordsFor(numFacts: number): number {
  return Math.max(1, (numFacts + 31) >>> 5);
}

export function packFacts(facts: readonly number[], words: number): Uint32Array {
  const s = new Uint32Array(words);
  for (const f of facts) s[f >>> 5] |= 1 << (f & 31);
  return s;
}

export function hasFact(s: Uint32Array, off: number, f: number): boolean {
  return (s[off + (f >>> 5)] & (1 << (f & 31))) !== 0;
}

/** Fact ids true in the packed state at `off` (ascending). */
export function unpackFacts(s: Uint32Array, off: number, words: number): number[] {
  const out: number[] = [];
  for (let w = 0; w < words; w++) {
    let bits = s[off + w];
    while (bits !== 0) {
      const low = bits & -bits;
      out.push((w << 5) + 31 - Math.clz32(low));
      bits ^= low;
    }
  }
  return out;
}

/** 32-bit hash of `words` words at `off` (multiply–rotate per word, murmur-style finaliser). */
export function hashWords(s: Uint32Array, off: number, words: number): number {
  let h = 0x9747b28c ^ words;
  for (let i = 0; i < words; i++) {
    let k = Math.imul(s[off + i], 0xcc9e2d51);
    k = (k << 15) | (k >>> 17);
    k = Math.imul(k, 0x1b873593);
    h ^= k;
    h = (h << 13) | (h >>> 19);
    h = (Math.imul(h, 5) + 0xe6546b64) | 0;
  }
  h ^= h >>> 16;
  h = Math.imul(h, 0x85ebca6b);
  h ^= h >>> 13;
  h = Math.imul(h, 0xc2b2ae35);
  h ^= h >>> 16;
  return h >>> 0;
}
