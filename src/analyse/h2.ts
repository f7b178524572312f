// Pair reachability by the h² relaxation (Haslum & Geffner 2000): which facts, and which
// pairs of facts, may hold together in a reachable state; pairs that cannot are mutexes.
import type { Action, Task } from "../ground/task.js";
import { poll } from "../util/limits.js";

/**
 * The result of the pair analysis. Soundness: every pair of facts true together in some
 * reachable state is marked (so an unmarked pair is a true mutex). Negative conditions are
 * ignored (dropping a condition only enlarges the relaxation); a conditional effect counts
 * when its positive condition can hold with the precondition; a fact survives an action
 * unless it is deleted unconditionally and not added unconditionally (a conditional re-add
 * is covered by the pairs among possible adds).
 */
export interface PairReachability {
  readonly facts: number;
  /** "h2": computed; "none": skipped (every pair assumed possible), see `note`. */
  readonly method: "h2" | "none";
  readonly note: string;
  reachable(f: number): boolean;
  /** May f and g be true in the same reachable state? (f === g: may f be true?) */
  together(f: number, g: number): boolean;
  /** Bit g of row(f) is together(f, g); null when the analysis was skipped. Read-only. */
  row(f: number): Uint32Array | null;
}

class TrivialPairs implements PairReachability {
  readonly method = "none" as const;
  constructor(
    readonly facts: number,
    readonly note: string,
  ) {}
  reachable(): boolean {
    return true;
  }
  together(): boolean {
    return true;
  }
  row(): null {
    return null;
  }
}

class H2Pairs implements PairReachability {
  readonly method = "h2" as const;
  readonly note: string;
  constructor(
    readonly facts: number,
    private readonly words: number,
    private readonly rows: Uint32Array,
    rounds: number,
  ) {
    this.note = `fixpoint after ${rounds} rounds`;
  }
  reachable(f: number): boolean {
    return (this.rows[f * this.words + (f >>> 5)] & (1 << (f & 31))) !== 0;
  }
  together(f: number, g: number): boolean {
    return (this.rows[f * this.words + (g >>> 5)] & (1 << (g & 31))) !== 0;
  }
  row(f: number): Uint32Array {
    return this.rows.subarray(f * this.words, (f + 1) * this.words);
  }
}

export interface H2Options {
  /** Skip the analysis (all pairs possible) above this many facts; default 16384. */
  maxFacts?: number;
  /** Give up (all pairs possible) when the word operations exceed this; default 1e9. */
  maxWork?: number;
}

/** Pair reachability of `task` from its initial state (see PairReachability). */
export function pairReachability(task: Task, opts: H2Options = {}): PairReachability {
  const F = task.facts.length;
  const maxFacts = opts.maxFacts ?? 16384;
  const maxWork = opts.maxWork ?? 1e9;
  if (F > maxFacts) return new TrivialPairs(F, `h2 skipped: ${F} facts exceed the limit of ${maxFacts}`);
  const W = Math.max(1, Math.ceil(F / 32));
  const rows = new Uint32Array(F * W);
  const reach = new Uint32Array(W);
  let changed = new Uint8Array(F);
  let reachChanged = false;
  let any = false;

  const set = (f: number, g: number): void => {
    const i = f * W + (g >>> 5);
    const b = 1 << (g & 31);
    if ((rows[i] & b) !== 0) return;
    rows[i] |= b;
    rows[g * W + (f >>> 5)] |= 1 << (f & 31);
    changed[f] = 1;
    changed[g] = 1;
    any = true;
    if (f === g) {
      reach[f >>> 5] |= b;
      reachChanged = true;
    }
  };
  const bit = (f: number, g: number): boolean => (rows[f * W + (g >>> 5)] & (1 << (g & 31))) !== 0;
  const pairwise = (xs: readonly number[], ys: readonly number[]): boolean => {
    for (const x of xs) for (const y of ys) if (!bit(x, y)) return false;
    return true;
  };

  for (const f of task.init) {
    poll("analysis: h2");
    for (const g of task.init) set(f, g);
  }

  const certainDel: Uint32Array[] = task.actions.map((a) => {
    poll("analysis: h2");
    return certainDeletes(a, W);
  });
  const tmp = new Uint32Array(W);
  let processed = new Uint8Array(task.actions.length);
  let prevChanged = changed;
  let prevReachChanged = true;
  let rounds = 0;
  let work = 0;
  for (;;) {
    rounds++;
    changed = new Uint8Array(F);
    reachChanged = false;
    any = false;
    for (let ai = 0; ai < task.actions.length; ai++) {
      poll("analysis: h2");
      const a = task.actions[ai];
      if (processed[ai] && !triggered(a, prevChanged, a.pre.length === 0 && prevReachChanged)) continue;
      if (!pairwise(a.pre, a.pre)) continue;
      processed[ai] = 1;
      const adds: number[] = [...a.add];
      for (const ce of a.cond) if (pairwise(ce.cond, ce.cond) && pairwise(ce.cond, a.pre)) adds.push(...ce.add);
      // Q: facts that may hold with the whole precondition and survive the action
      if (a.pre.length === 0) tmp.set(reach);
      else {
        tmp.set(rows.subarray(a.pre[0] * W, a.pre[0] * W + W));
        for (let k = 1; k < a.pre.length; k++) {
          const base = a.pre[k] * W;
          for (let w = 0; w < W; w++) tmp[w] &= rows[base + w];
        }
      }
      const cd = certainDel[ai];
      for (let w = 0; w < W; w++) tmp[w] &= ~cd[w];
      work += W * (a.pre.length + 1 + adds.length);
      for (const p of adds) for (const q of adds) set(p, q);
      for (const p of adds) {
        poll("analysis: h2");
        const base = p * W;
        for (let w = 0; w < W; w++) {
          let fresh = tmp[w] & ~rows[base + w];
          while (fresh !== 0) {
            const low = fresh & -fresh;
            set(p, w * 32 + (31 - Math.clz32(low)));
            fresh ^= low;
          }
        }
      }
    }
    if (work > maxWork) return new TrivialPairs(F, `h2 abandoned after ${rounds} rounds: work limit ${maxWork} exceeded`);
    if (!any) break;
    prevChanged = changed;
    prevReachChanged = reachChanged;
  }
  return new H2Pairs(F, W, rows, rounds);
}

function triggered(a: Action, changed: Uint8Array, reachChanged: boolean): boolean {
  if (reachChanged) return true;
  for (const f of a.pre) if (changed[f]) return true;
  for (const ce of a.cond) for (const f of ce.cond) if (changed[f]) return true;
  return false;
}

/** Facts an action surely makes false: unconditional deletes it does not add unconditionally. */
function certainDeletes(a: Action, W: number): Uint32Array {
  const out = new Uint32Array(W);
  const added = new Set(a.add);
  for (const f of a.del) if (!added.has(f)) out[f >>> 5] |= 1 << (f & 31);
  return out;
}
