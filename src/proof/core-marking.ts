// Conflict analysis for the backward check: marks every clause a RUP derivation used as core
// (reasons of the literals behind the conflict, through the top-level trail), moves newly
// marked clauses to the core watch lists, and, when LRAT output is wanted, records the hints.
import { type ClauseDb, FLAG_CORE } from "./clause-db.js";
import type { HintLog } from "./hint-log.js";
import type { Propagator } from "./propagator.js";

// copied once (see propagator.ts)
const CORE = FLAG_CORE;

export class CoreMarker {
  private readonly db: ClauseDb;
  private readonly pr: Propagator;
  private readonly seen: Uint8Array;
  /** Top-level variables whose chain of reasons is marked (or being marked). */
  private readonly chainMarked: Uint8Array;
  private readonly touched: Int32Array;
  private readonly stack: Int32Array;
  private readonly topStack: Int32Array;
  /** LRAT: the hint log, and per top-level variable used by a hint, its reason and trail position. */
  readonly hints: HintLog | null;
  readonly unitReason: Int32Array | null;
  readonly unitPos: Int32Array | null;
  private readonly rupPos: Int32Array | null;

  constructor(db: ClauseDb, pr: Propagator, maxVar: number, hints: HintLog | null) {
    this.db = db;
    this.pr = pr;
    this.seen = new Uint8Array(maxVar + 1);
    this.chainMarked = new Uint8Array(maxVar + 1);
    this.touched = new Int32Array(maxVar + 1);
    this.stack = new Int32Array(maxVar + 1);
    this.topStack = new Int32Array(maxVar + 1);
    this.hints = hints;
    this.unitReason = hints ? new Int32Array(maxVar + 1).fill(-1) : null;
    this.unitPos = hints ? new Int32Array(maxVar + 1) : null;
    this.rupPos = hints ? new Int32Array(maxVar + 1) : null;
  }

  /** A top-level variable is being unassigned (backward pass): its chain may change later. */
  unassigned(v: number): void {
    this.chainMarked[v] = 0;
  }

  private mark(c: number): void {
    const flags = this.db.flags;
    if (flags[c] & CORE) return;
    flags[c] |= CORE;
    this.pr.promote(c);
  }

  /**
   * Marks the derivation of conflict `c` (or, with c = −1, of the assignment of variable
   * `trueVar`) as core. Variables on the first `topLen` trail entries are top-level: their
   * chains are marked once. With a hint log, appends the LRAT hints of the derivation: units
   * of the top-level variables it uses, then the reasons in trail order, then `c`.
   */
  analyze(c: number, trueVar: number, topLen: number): void {
    const db = this.db;
    const pr = this.pr;
    const lits = db.lits;
    const reason = pr.reason;
    const tpos = pr.tpos;
    const hints = this.hints;
    let nt = 0;
    let ns = 0;
    let nTop = 0;
    let nRup = 0;
    const seen = this.seen;
    const touched = this.touched;
    const stack = this.stack;
    const topStack = this.topStack;
    const chainMarked = this.chainMarked;
    // variables reached directly from the conflict or the derivation above the top level
    const direct = (v: number): void => {
      if (seen[v]) return;
      seen[v] = 1;
      touched[nt++] = v;
      if (tpos[v] < topLen) {
        if (hints) hints.unit(v);
        if (!chainMarked[v]) {
          chainMarked[v] = 1;
          topStack[nTop++] = v;
        }
      } else stack[ns++] = v;
    };
    if (c >= 0) {
      this.mark(c);
      const s = db.start[c];
      const e = s + db.len[c];
      for (let k = s; k < e; k++) direct(lits[k] >> 1);
    } else direct(trueVar);
    while (ns > 0) {
      const v = stack[--ns];
      const r = reason[v];
      if (r < 0) continue; // assumed (a literal of the negated clause)
      this.mark(r);
      if (this.rupPos) this.rupPos[nRup++] = tpos[v];
      const s = db.start[r];
      const e = s + db.len[r];
      for (let k = s; k < e; k++) direct(lits[k] >> 1);
    }
    // chains of the top-level variables (all on the top-level trail themselves)
    while (nTop > 0) {
      const v = topStack[--nTop];
      const r = reason[v];
      this.mark(r);
      if (this.unitReason && this.unitPos) {
        this.unitReason[v] = r;
        this.unitPos[v] = tpos[v];
      }
      const s = db.start[r];
      const e = s + db.len[r];
      for (let k = s; k < e; k++) {
        const u = lits[k] >> 1;
        if (!chainMarked[u]) {
          chainMarked[u] = 1;
          topStack[nTop++] = u;
        }
      }
    }
    for (let i = 0; i < nt; i++) seen[touched[i]] = 0;
    if (hints && this.rupPos) {
      const order = this.rupPos.subarray(0, nRup).sort();
      for (let i = 0; i < nRup; i++) hints.clause(reason[pr.trail[order[i]] >> 1]);
      if (c >= 0) hints.clause(c);
    }
  }
}
