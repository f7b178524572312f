// Writes the LRAT proof found by a backward DRAT check: the core lemmas in proof order, each with
// its hint chain; one unit lemma per top-level literal the chains use (so a chain names a unit
// instead of repeating its derivation); and each clause deleted right after its last use.
import { type ClauseDb, FLAG_CORE, litOf } from "./clause-db.js";
import type { CoreMarker } from "./core-marking.js";
import { HINT_CANDIDATE, HINT_CLAUSE, HINT_UNIT, type HintLog } from "./hint-log.js";
import type { ProofSteps } from "./proof-reader.js";

// copied once (see propagator.ts)
const CORE = FLAG_CORE;
const CANDIDATE = HINT_CANDIDATE;
const UNIT = HINT_UNIT;
const CLAUSE = HINT_CLAUSE;

/** Receives LRAT text in chunks of about 1 MB. */
export type LratSink = (chunk: string) => void;

export interface LratInput {
  db: ClauseDb;
  hints: HintLog;
  cm: CoreMarker;
  proof: ProofSteps;
  /** Per proof step: the clause added or deleted (−1: none). */
  stepClause: Int32Array;
  /** Per proof step: top-level trail length after it. */
  trailAfter: Int32Array;
  /** Top-level trail length after the formula. */
  baseTrail: number;
  /** Step of the refutation's conflict (−1: the formula itself). */
  conflictStep: number;
  /** Formula clauses stored by the checker (ids 0..originals−1, LRAT numbers 1..originals). */
  originals: number;
  /** Clauses in the CNF (LRAT numbers of new clauses start after them). */
  formulaClauses: number;
}

class Out {
  private parts: string[] = [];
  private size = 0;
  lines = 0;
  constructor(private readonly sink: LratSink) {}
  line(s: string): void {
    this.parts.push(s);
    this.size += s.length;
    this.lines++;
    if (this.size >= 1 << 20) this.flush();
  }
  flush(): void {
    if (this.parts.length > 0) this.sink(this.parts.join(""));
    this.parts = [];
    this.size = 0;
  }
}

/** Emits the LRAT proof to `sink`; returns the number of lines. */
export function writeLrat(inp: LratInput, sink: LratSink): number {
  const { db, hints, cm, proof, stepClause, trailAfter, baseTrail, conflictStep } = inp;
  const unitReason = cm.unitReason as Int32Array;
  const unitPos = cm.unitPos as Int32Array;
  const buf = hints.buf;
  const flags = db.flags;
  const finalTime = conflictStep + 2;

  // units: top-level variables the chains use, in trail order, with the step that derived them
  const unitVars: number[] = [];
  for (let v = 0; v < unitReason.length; v++) if (unitReason[v] >= 0) unitVars.push(v);
  unitVars.sort((a, b) => unitPos[a] - unitPos[b]);
  const unitTime = new Int32Array(unitVars.length);
  for (let i = 0, t = 0; i < unitVars.length; i++) {
    const p = unitPos[unitVars[i]];
    if (p < baseTrail) continue; // time 0: derived from the formula
    while (t < conflictStep && trailAfter[t] <= p) t++;
    unitTime[i] = t + 1;
  }
  // a unit whose reason is a unit clause is that clause
  const isAlias = (v: number) => db.len[unitReason[v]] === 1;

  // last use of every clause and unit (time 0: formula, t + 1: proof step t, finalTime: the end)
  const lastClause = new Int32Array(db.count).fill(-1);
  const lastUnit = new Int32Array(unitReason.length).fill(-1);
  const useClause = (id: number, time: number) => {
    if (lastClause[id] < time) lastClause[id] = time;
  };
  const useUnit = (v: number, time: number) => {
    if (isAlias(v)) useClause(unitReason[v], time);
    else if (lastUnit[v] < time) lastUnit[v] = time;
  };
  const scan = (from: number, n: number, visit: (kind: number, x: number) => void) => {
    let skipping = false;
    for (let k = from; k < from + n; k++) {
      const kind = buf[k] & 3;
      const x = buf[k] >> 2;
      if (kind === CANDIDATE) {
        // a candidate clause the LRAT proof never holds (not core) needs no hints
        skipping = (flags[x] & CORE) === 0;
        if (skipping) continue;
      } else if (skipping) continue;
      visit(kind, x);
    }
  };
  const useEntry = (time: number) => (kind: number, x: number) => (kind === UNIT ? useUnit(x, time) : useClause(x, time));
  for (let t = 0; t <= conflictStep; t++) {
    if (!proof.deletion[t] && hints.segStart[t] >= 0) scan(hints.segStart[t], hints.segLen[t], useEntry(t + 1));
  }
  scan(hints.finalStart, hints.finalLen, useEntry(finalTime));
  for (let i = 0; i < unitVars.length; i++) {
    const v = unitVars[i];
    if (isAlias(v)) continue;
    const r = unitReason[v];
    useClause(r, unitTime[i]);
    for (let k = db.start[r]; k < db.start[r] + db.len[r]; k++) if (db.lits[k] >> 1 !== v) useUnit(db.lits[k] >> 1, unitTime[i]);
  }

  // deletions per time (counting sort; units are stored as −1 − v)
  const dueCount = new Int32Array(finalTime + 2);
  for (let id = 0; id < db.count; id++) if (lastClause[id] >= 0 && lastClause[id] < finalTime) dueCount[lastClause[id] + 1]++;
  for (let v = 0; v < lastUnit.length; v++) if (lastUnit[v] >= 0 && lastUnit[v] < finalTime) dueCount[lastUnit[v] + 1]++;
  for (let i = 1; i < dueCount.length; i++) dueCount[i] += dueCount[i - 1];
  const due = new Int32Array(dueCount[dueCount.length - 1]);
  const fill = dueCount.slice();
  for (let id = 0; id < db.count; id++) if (lastClause[id] >= 0 && lastClause[id] < finalTime) due[fill[lastClause[id]]++] = id;
  for (let v = 0; v < lastUnit.length; v++) if (lastUnit[v] >= 0 && lastUnit[v] < finalTime) due[fill[lastUnit[v]]++] = -1 - v;

  // emission
  const out = new Out(sink);
  const clauseNo = new Int32Array(db.count);
  for (let id = 0; id < inp.originals; id++) clauseNo[id] = id + 1;
  const unitNo = new Int32Array(unitReason.length);
  let next = inp.formulaClauses;
  const ref = (id: number): number => {
    const no = clauseNo[id];
    if (no <= 0) throw new Error(`internal error: LRAT hint names clause ${id} before it is written`);
    return no;
  };
  const unitRef = (v: number): number => {
    if (isAlias(v)) return ref(unitReason[v]);
    if (unitNo[v] <= 0) throw new Error(`internal error: LRAT hint names the unit of variable ${v} before it is written`);
    return unitNo[v];
  };
  const deleteLines = (nos: number[]) => {
    for (let i = 0; i < nos.length; i += 1000) out.line(`${next} d ${nos.slice(i, i + 1000).join(" ")} 0\n`);
  };
  // formula clauses no chain uses are deleted first
  const unused: number[] = [];
  for (let id = 0; id < inp.originals; id++) if (lastClause[id] < 0) unused.push(id + 1);
  deleteLines(unused);

  let ui = 0;
  const emitUnits = (time: number) => {
    for (; ui < unitVars.length && unitTime[ui] === time; ui++) {
      const v = unitVars[ui];
      if (isAlias(v)) continue;
      const r = unitReason[v];
      let lit = 0;
      const hs: number[] = [];
      for (let k = db.start[r]; k < db.start[r] + db.len[r]; k++) {
        const x = db.lits[k];
        if (x >> 1 === v) lit = litOf(x);
        else hs.push(unitRef(x >> 1));
      }
      hs.push(ref(r));
      unitNo[v] = ++next;
      out.line(`${next} ${lit} 0 ${hs.join(" ")} 0\n`);
    }
  };
  const emitDeletions = (time: number) => {
    const nos: number[] = [];
    for (let k = dueCount[time]; k < dueCount[time + 1]; k++) {
      const e = due[k];
      nos.push(e >= 0 ? clauseNo[e] : unitNo[-1 - e]);
    }
    deleteLines(nos);
  };
  const hintText = (from: number, n: number): string => {
    const hs: number[] = [];
    scan(from, n, (kind, x) => hs.push(kind === UNIT ? unitRef(x) : kind === CLAUSE ? ref(x) : -ref(x)));
    return hs.join(" ");
  };

  emitUnits(0);
  emitDeletions(0);
  for (let t = 0; t <= conflictStep; t++) {
    const id = stepClause[t];
    if (!proof.deletion[t] && id >= 0 && flags[id] & CORE) {
      const text = hintText(hints.segStart[t], hints.segLen[t]);
      clauseNo[id] = ++next;
      const c = db.dimacs(id);
      out.line(`${next} ${c.length > 0 ? c.join(" ") + " " : ""}0 ${text}${text ? " " : ""}0\n`);
    }
    emitUnits(t + 1);
    emitDeletions(t + 1);
  }
  const text = hintText(hints.finalStart, hints.finalLen);
  out.line(`${++next} 0 ${text}${text ? " " : ""}0\n`);
  out.flush();
  return out.lines;
}
