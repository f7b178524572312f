// An obviously-correct (and slow) DRAT checker used only as a test oracle: clauses as plain
// arrays, unit propagation recomputed from scratch by sweeping all clauses until nothing changes.

type Clause = number[];

/** Unit propagation over `clauses` starting from `assumed`; true when some clause is falsified. */
export function upConflict(clauses: Clause[], assumed: number[]): boolean {
  const val = new Map<number, boolean>();
  for (const l of assumed) {
    const v = Math.abs(l);
    if (val.has(v) && val.get(v) !== l > 0) return true;
    val.set(v, l > 0);
  }
  for (let changed = true; changed; ) {
    changed = false;
    for (const c of clauses) {
      let unassigned = 0;
      let last = 0;
      let sat = false;
      for (const l of c) {
        const x = val.get(Math.abs(l));
        if (x === undefined) {
          unassigned++;
          last = l;
        } else if (x === l > 0) {
          sat = true;
          break;
        }
      }
      if (sat) continue;
      if (unassigned === 0) return true;
      if (unassigned === 1) {
        val.set(Math.abs(last), last > 0);
        changed = true;
      }
    }
  }
  return false;
}

function isTautology(c: Clause): boolean {
  return c.some((l) => c.includes(-l));
}

function rup(clauses: Clause[], lemma: Clause): boolean {
  if (isTautology(lemma)) return true;
  return upConflict(clauses, lemma.map((l) => -l));
}

function rat(clauses: Clause[], lemma: Clause): boolean {
  if (lemma.length === 0) return false;
  const p = lemma[0];
  for (const d of clauses) {
    if (!d.includes(-p) || isTautology(d)) continue;
    const res = [...lemma, ...d.filter((l) => l !== -p)];
    if (isTautology(res)) continue;
    if (!rup(clauses, res)) return false;
  }
  return true;
}

function sameSet(a: Clause, b: Clause): boolean {
  const sa = new Set(a);
  const sb = new Set(b);
  return sa.size === sb.size && [...sa].every((l) => sb.has(l));
}

export interface NaiveStep {
  del: boolean;
  lits: number[];
}

/**
 * Forward check of every lemma up to the first point where unit propagation refutes the
 * clause set. Deletions of unit clauses are ignored (common practice, no source).
 */
export function naiveCheck(formula: Clause[], steps: NaiveStep[]): boolean {
  const emptyAt = steps.findIndex((s) => !s.del && s.lits.length === 0);
  if (emptyAt >= 0 && emptyAt < steps.length - 1) return false;
  const clauses: Clause[] = formula.map((c) => [...new Set(c)]);
  if (upConflict(clauses, [])) return true;
  for (const s of steps) {
    const lits = [...new Set(s.lits)];
    if (s.del) {
      if (lits.length <= 1) continue;
      for (let i = clauses.length - 1; i >= 0; i--) {
        if (sameSet(clauses[i], lits)) {
          clauses.splice(i, 1);
          break;
        }
      }
      continue;
    }
    if (!rup(clauses, lits) && !rat(clauses, lits)) return false;
    clauses.push(lits);
    if (upConflict(clauses, [])) return true;
  }
  return false;
}

/** Decodes a binary or text DRAT proof into steps (test helper, independent of src/proof). */
export function decodeProof(bytes: Uint8Array): NaiveStep[] {
  const steps: NaiveStep[] = [];
  if (bytes.includes(0)) {
    let i = 0;
    while (i < bytes.length) {
      const del = bytes[i++] === 0x64;
      const lits: number[] = [];
      for (;;) {
        let x = 0;
        let shift = 0;
        let b: number;
        do {
          b = bytes[i++];
          x += (b & 127) * 2 ** shift;
          shift += 7;
        } while (b & 128);
        if (x === 0) break;
        lits.push(x % 2 ? -Math.floor(x / 2) : x / 2); // no 32-bit operators: codes reach 2^32
      }
      steps.push({ del, lits });
    }
    return steps;
  }
  for (const line of Buffer.from(bytes).toString("latin1").split("\n")) {
    const t = line.trim();
    if (t === "" || t.startsWith("c")) continue;
    const del = t.startsWith("d");
    const nums = (del ? t.slice(1) : t).trim().split(/\s+/).map(Number);
    steps.push({ del, lits: nums.slice(0, -1) });
  }
  return steps;
}

/** Encodes steps as a text DRAT proof. */
export function encodeText(steps: NaiveStep[]): Uint8Array {
  return Buffer.from(steps.map((s) => `${s.del ? "d " : ""}${[...s.lits, 0].join(" ")}\n`).join(""), "latin1");
}
