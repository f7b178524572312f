// A deliberately simple LRAT checker: a second verification path that needs no search. Every
// hint must name a clause that is unit (or falsified) under the negated lemma plus the units
// so far, so one pass over the hints decides each lemma. Shares only the DIMACS reader.
import type { CheckerCnf } from "./cnf-reader.js";
import { BROKEN_GZIP, gunzipOrNull } from "./proof-reader.js";

export interface LratResult {
  valid: boolean;
  /** Why the proof was rejected (absent when valid). */
  reason?: string;
  /** 1-based line of the rejected step. */
  line?: number;
  stats: { additions: number; ratAdditions: number; deletions: number; hints: number; seconds: number };
}

class Reject extends Error {}

/** Bounds that keep a malformed proof from exhausting memory (clause numbers index an array). */
const MAX_ID_JUMP = 1 << 24;
const MIN_VAR_LIMIT = 1 << 24;

/** Checks a text LRAT proof that `cnf` is unsatisfiable (gzip-compressed input accepted). */
export function checkLrat(cnf: CheckerCnf, proof: Uint8Array | string): LratResult {
  const t0 = performance.now();
  const stats = { additions: 0, ratAdditions: 0, deletions: 0, hints: 0, seconds: 0 };
  const bytes = typeof proof === "string" ? Buffer.from(proof, "latin1") : gunzipOrNull(proof);
  if (bytes === null) return { valid: false, reason: BROKEN_GZIP, line: 0, stats };
  // clause number → literals (DIMACS); null once deleted or never added
  const clauses: (Int32Array | null)[] = [null];
  let maxVar = cnf.numVars;
  for (const c of cnf.clauses) {
    const lits = Int32Array.from(new Set(Array.from(c)));
    for (const l of lits) maxVar = Math.max(maxVar, Math.abs(l));
    clauses.push(lits);
  }
  let lastId = cnf.clauses.length;
  const varLimit = Math.max(2 * maxVar, MIN_VAR_LIMIT);
  // assignment: value[v] = +1 / −1 for the variables set while checking one lemma
  let value = new Int8Array(maxVar + 1);
  const set: number[] = [];
  const truth = (l: number) => (l > 0 ? value[l] : -value[-l]); // 1 true, −1 false, 0 unassigned
  const assign = (l: number) => {
    const v = Math.abs(l);
    if (v >= value.length) {
      const b = new Int8Array(2 * v + 1);
      b.set(value);
      value = b;
    }
    value[v] = l > 0 ? 1 : -1;
    set.push(v);
  };
  const undoTo = (n: number) => {
    while (set.length > n) value[set.pop() as number] = 0;
  };
  /** Runs unit hints; true at a falsified clause, throws if a hint is neither unit nor falsified. */
  const units = (hs: number[], from: number, to: number): boolean => {
    for (let k = from; k < to; k++) {
      const c = clauses[hs[k]];
      if (!c) throw new Reject(`hint ${hs[k]} names no clause`);
      stats.hints++;
      let free = 0;
      let unit = 0;
      for (const l of c) {
        const t = truth(l);
        if (t === 1) throw new Reject(`hint ${hs[k]} is satisfied, not unit`);
        if (t === 0) {
          free++;
          unit = l;
        }
      }
      if (free === 0) return true;
      if (free > 1) throw new Reject(`hint ${hs[k]} is not unit (${free} unassigned literals)`);
      assign(unit);
    }
    return false;
  };

  let line = 0;
  let pos = 0;
  const n = bytes.length;
  const skipBlanks = () => {
    while (pos < n && (bytes[pos] === 32 || bytes[pos] === 9 || bytes[pos] === 13)) pos++;
  };
  const atLineEnd = () => pos >= n || bytes[pos] === 10;
  const found = () => {
    if (atLineEnd()) return "the end of the line";
    let e = pos;
    while (e < n && bytes[e] > 32 && e - pos < 20) e++;
    return `'${Buffer.from(bytes.subarray(pos, e)).toString("latin1")}'`;
  };
  /** The next integer on the current line. */
  const int = (what: string): number => {
    skipBlanks();
    const s0 = pos;
    const neg = pos < n && bytes[pos] === 45;
    if (neg) pos++;
    let x = 0;
    const d0 = pos;
    while (pos < n && bytes[pos] >= 48 && bytes[pos] <= 57 && pos - d0 < 12) x = x * 10 + (bytes[pos++] - 48);
    if (pos === d0 || (pos < n && bytes[pos] > 32)) {
      pos = s0;
      throw new Reject(`expected ${what}, found ${found()}`);
    }
    return neg ? -x : x;
  };
  const upToZero = (what: string): number[] => {
    const out: number[] = [];
    for (let x = int(what); x !== 0; x = int(what)) out.push(x);
    return out;
  };

  try {
    while (pos < n) {
      line++;
      skipBlanks();
      if (atLineEnd() || bytes[pos] === 99 /* c: comment */) {
        while (pos < n && bytes[pos] !== 10) pos++;
        pos++;
        continue;
      }
      const id = int("a clause number");
      skipBlanks();
      if (pos < n && bytes[pos] === 100 /* d */) {
        pos++;
        for (const k of upToZero("a clause number")) {
          if (!clauses[k]) throw new Reject(`deletion of clause ${k}, which is not present`);
          clauses[k] = null;
        }
        stats.deletions++;
      } else {
        const lits = upToZero("a literal");
        const hs = upToZero("a hint");
        if (id <= lastId) throw new Reject(`clause number ${id} is not above the previous one (${lastId})`);
        if (id - lastId > MAX_ID_JUMP) throw new Reject(`clause number ${id} jumps more than ${MAX_ID_JUMP} above the previous one (${lastId})`);
        for (const l of lits) if (Math.abs(l) > varLimit) throw new Reject(`literal ${l}: variable above ${varLimit}, the largest this checker allows for this formula`);
        checkLemma(lits, hs);
        lastId = id;
        while (clauses.length < id) clauses.push(null);
        clauses[id] = Int32Array.from(new Set(lits));
        stats.additions++;
        if (lits.length === 0) {
          stats.seconds = (performance.now() - t0) / 1000;
          return { valid: true, stats };
        }
      }
      skipBlanks();
      if (!atLineEnd()) throw new Reject(`unexpected ${found()} after the closing 0`);
      pos++;
    }
    throw new Reject("the proof ends without deriving the empty clause");
  } catch (e) {
    if (!(e instanceof Reject)) throw e;
    stats.seconds = (performance.now() - t0) / 1000;
    return { valid: false, reason: `line ${line}: ${e.message}`, line, stats };
  }

  function checkLemma(lits: number[], hs: number[]): void {
    undoTo(0);
    for (const l of lits) {
      if (truth(l) === 1) return; // tautology: holds trivially
      if (truth(l) === 0) assign(-l);
    }
    let k = 0;
    while (k < hs.length && hs[k] > 0) k++;
    if (units(hs, 0, k)) return; // RUP
    if (lits.length === 0) throw new Reject("the empty clause: the hints end without a falsified clause");
    // RAT on the first literal: every clause holding its negation must be satisfied already or
    // come with a group "−number, unit hints…" whose hints end at a falsified clause
    const pivot = lits[0];
    const groups = new Map<number, [number, number]>();
    while (k < hs.length) {
      const d = -hs[k];
      if (d <= 0) throw new Reject(`hint ${hs[k]} outside a RAT group`);
      let e = k + 1;
      while (e < hs.length && hs[e] > 0) e++;
      if (!clauses[d]?.includes(-pivot)) throw new Reject(`RAT group for clause ${d}, which does not hold ${-pivot}`);
      groups.set(d, [k + 1, e]);
      k = e;
    }
    stats.ratAdditions++;
    const base = set.length;
    for (let d = 1; d < clauses.length; d++) {
      const c = clauses[d];
      if (!c || !c.includes(-pivot)) continue;
      if (c.some((l) => l !== -pivot && truth(l) === 1)) continue; // resolvent satisfied
      const g = groups.get(d);
      if (!g) throw new Reject(`not RUP, and no RAT group for clause ${d}, which holds ${-pivot}`);
      for (const l of c) if (l !== -pivot && truth(l) === 0) assign(-l);
      if (!units(hs, g[0], g[1])) throw new Reject(`the hints of the RAT group for clause ${d} end without a falsified clause`);
      undoTo(base);
    }
  }
}
