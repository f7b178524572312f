// Seeded CNF families for tests and the SAT benchmark: random k-SAT, pigeonhole PHP(n+1, n),
// n-queens. Pure functions of their parameters, so every run sees the same formulas.
import type { Cnf, CompactCnf } from "../../../src/sat/index.js";

/** Small fast deterministic PRNG (mulberry32); returns floats in [0, 1). */
export function rng(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** Uniform random k-SAT: m clauses of k distinct variables with random signs. */
export function randomKSat(n: number, m: number, k: number, seed: number): Cnf {
  const r = rng(seed);
  const clauses: Int32Array[] = [];
  for (let i = 0; i < m; i++) {
    const c = new Int32Array(k);
    for (let j = 0; j < k; j++) {
      let v: number;
      do v = 1 + Math.floor(r() * n);
      while (c.subarray(0, j).some((x) => Math.abs(x) === v));
      c[j] = r() < 0.5 ? -v : v;
    }
    clauses.push(c);
  }
  return { numVars: n, clauses };
}

/** Pigeonhole PHP(n+1, n): n+1 pigeons, n holes; variable p·n + h + 1 = pigeon p in hole h. */
export function pigeonhole(n: number): Cnf {
  const v = (p: number, h: number) => p * n + h + 1;
  const clauses: Int32Array[] = [];
  for (let p = 0; p <= n; p++) clauses.push(Int32Array.from({ length: n }, (_, h) => v(p, h)));
  for (let h = 0; h < n; h++)
    for (let p = 0; p <= n; p++) for (let q = p + 1; q <= n; q++) clauses.push(Int32Array.of(-v(p, h), -v(q, h)));
  return { numVars: (n + 1) * n, clauses };
}

/** n-queens: variable r·n + c + 1 = a queen on row r, column c. */
export function queens(n: number): Cnf {
  const v = (r: number, c: number) => r * n + c + 1;
  const clauses: Int32Array[] = [];
  for (let r = 0; r < n; r++) clauses.push(Int32Array.from({ length: n }, (_, c) => v(r, c)));
  for (let r1 = 0; r1 < n; r1++)
    for (let c1 = 0; c1 < n; c1++)
      for (let r2 = r1; r2 < n; r2++)
        for (let c2 = 0; c2 < n; c2++) {
          if (r2 === r1 && c2 <= c1) continue;
          const attack = r1 === r2 || c1 === c2 || Math.abs(r1 - r2) === Math.abs(c1 - c2);
          if (attack) clauses.push(Int32Array.of(-v(r1, c1), -v(r2, c2)));
        }
  return { numVars: n * n, clauses };
}

/** Does the model (index v: 1 true, −1 false) satisfy every clause? */
export function satisfies(cnf: Cnf, model: Int8Array): boolean {
  return cnf.clauses.every((c) => c.some((l) => (l > 0 ? model[l] === 1 : model[-l] === -1)));
}

/** Random k-SAT straight into the compact form (for millions of clauses). */
export function randomKSatCompact(n: number, m: number, k: number, seed: number): CompactCnf {
  const r = rng(seed);
  const lits = new Int32Array(m * (k + 1));
  let p = 0;
  for (let i = 0; i < m; i++) {
    const first = p;
    for (let j = 0; j < k; j++) {
      let v: number;
      let dup: boolean;
      do {
        v = 1 + Math.floor(r() * n);
        dup = false;
        for (let q = first; q < p; q++) if (Math.abs(lits[q]) === v) dup = true;
      } while (dup);
      lits[p++] = r() < 0.5 ? -v : v;
    }
    lits[p++] = 0;
  }
  return { numVars: n, numClauses: m, lits };
}

/**
 * A random circuit unrolled over `steps` steps (as in bounded model checking): `width` state
 * bits, each next bit the AND, OR or XOR of two possibly negated current bits (Tseitin
 * clauses), and `m` random 3-clauses over the last step. A decision on an early bit implies
 * many literals on its level, so learned clauses hold several literals per level (the case
 * where clause minimisation does most of its work).
 */
export function unrolledCircuit(width: number, steps: number, m: number, seed: number): Cnf {
  const r = rng(seed);
  const x = (t: number, i: number) => t * width + i + 1;
  const clauses: Int32Array[] = [];
  for (let t = 1; t <= steps; t++) {
    for (let i = 0; i < width; i++) {
      const o = x(t, i);
      const a = x(t - 1, Math.floor(r() * width)) * (r() < 0.5 ? -1 : 1);
      let b: number;
      do b = x(t - 1, Math.floor(r() * width)) * (r() < 0.5 ? -1 : 1);
      while (Math.abs(b) === Math.abs(a));
      const kind = r();
      if (kind < 0.4) clauses.push(Int32Array.of(-o, a), Int32Array.of(-o, b), Int32Array.of(o, -a, -b)); // o = a ∧ b
      else if (kind < 0.8) clauses.push(Int32Array.of(o, -a), Int32Array.of(o, -b), Int32Array.of(-o, a, b)); // o = a ∨ b
      else clauses.push(Int32Array.of(-o, a, b), Int32Array.of(-o, -a, -b), Int32Array.of(o, -a, b), Int32Array.of(o, a, -b)); // o = a ⊕ b
    }
  }
  for (let c = 0; c < m; c++) {
    const lits: number[] = [];
    while (lits.length < 3) {
      const v = x(steps, Math.floor(r() * width));
      if (lits.some((l) => Math.abs(l) === v)) continue;
      lits.push(r() < 0.5 ? -v : v);
    }
    clauses.push(Int32Array.from(lits));
  }
  return { numVars: (steps + 1) * width, clauses };
}
