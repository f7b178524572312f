// encodePlanning: a Task unrolled to T steps as CNF (core-1 + a step encoding + a cost encoding
// + optional parts), with the variable map, bound assumptions and model decoding the optimizer needs.
import type { Task } from "../ground/task.js";
import { atMostOne } from "./amo.js";
import { CnfBuilder, type ClauseSink, type CompactClauses, type PlainCnf } from "./cnf.js";
import { coreTemplates, emitInitAndGoal, emitStepCore } from "./core.js";
import { toDimacs, writeDimacsChunks } from "./dimacs.js";
import { checkParts, type CostEncodingId, type PartId } from "./ids.js";
import { Layout } from "./layout.js";
import type { ReachMode } from "./reach.js";
import { costEncodingRecord, partRecord, stepEncodingRecord, type EmitContext, type PartParams } from "./registry.js";
import { emitStatePair, type SuffixVars } from "./relaxed-suffix.js";
import type { StepEncodingId } from "./step-rules.js";
import { taskInfo } from "./task-info.js";

/** The cost encoding of every CNF built before cost-unary-1 existed, and still the default. */
export const COST_ENCODING = "cost-adder-1";

export interface EncodeOptions {
  encoding: StepEncodingId;
  /** Horizon T ≥ 0: fact time points 0..T, action steps 1..T. */
  steps: number;
  /** Cost encoding (default cost-adder-1). */
  cost?: CostEncodingId;
  /** cost-adder-1: bound bits m; default just enough for the largest possible sum (bitLength(maxSum)). */
  costBits?: number;
  /** cost-unary-1: outputs "cost ≥ j" for j = 1..costCap, the last saturating; default the largest possible sum. */
  costCap?: number;
  /** Fact-id groups known to be mutually exclusive in every reachable state (redundant AMOs). */
  mutexGroups?: readonly (readonly number[])[];
  /** Optional parts, distinct and in canonical order (PARTS): reach-1, relaxed-suffix-1, empty-steps-last-1. */
  parts?: readonly PartId[];
  /** Parameters of parts that take them (relaxed-suffix-1: state pairs made distinct). */
  partParams?: PartParams;
  /** For measurements only: reach-1 without simplifying the other clauses (not a spec'd id). */
  reachMode?: ReachMode;
}

/** Everything needed to rebuild the identical CNF from the same Task (JSON-safe). */
export interface EncodingParams {
  encoding: StepEncodingId;
  cost: CostEncodingId;
  steps: number;
  /** cost-adder-1 only. */
  costBits?: number;
  /** cost-unary-1 only. */
  costCap?: number;
  /** Normalised: each group sorted ascending, groups of fewer than 2 facts dropped. */
  mutexGroups: number[][];
  /** Present only when non-empty. */
  parts?: PartId[];
  /** Present only for parts that take parameters. */
  partParams?: PartParams;
}

/** Variable and clause counts, per part of the encoding. */
export interface EncodingStats {
  vars: number;
  clauses: number;
  literals: number;
  factVars: number;
  actionVars: number;
  clausesByPart: Record<string, number>;
  varsByPart: Record<string, number>;
  fullAdders: number;
  halfAdders: number;
  [k: string]: unknown;
}

export interface Encoding {
  readonly params: EncodingParams;
  readonly cnf: CnfBuilder;
  /** Current counts (they grow when state pairs are added). */
  readonly numVars: number;
  readonly numClauses: number;
  readonly stats: EncodingStats;
  /** Variable of "action a in step s" (s ∈ 1..T). */
  actionVar(step: number, action: number): number;
  /** Variable of "fact f at time t" (t ∈ 0..T). */
  factVar(time: number, fact: number): number;
  /**
   * The cost circuit's outputs, for inspection: sum bits (cost-adder-1) or "cost ≥ j" literals,
   * j = 1..costCap (cost-unary-1); 0 = constant false.
   */
  readonly costSum: readonly number[];
  /** The largest cost any assignment can have (Σ over the cost inputs of their largest value). */
  readonly maxSum: number;
  /** The largest B boundAssumptions accepts below maxSum: 2^costBits − 1, or costCap − 1. */
  readonly maxRepresentableCost: number;
  /**
   * Literals to assume for "plan cost ≤ B": the comparator's enable literal and B's bits
   * (cost-adder-1) or the one literal ¬o_{B+1} (cost-unary-1); [] when B ≥ maxSum (no
   * constraint needed). Throws RangeError for B < 0 or B not representable.
   */
  boundAssumptions(B: number): number[];
  /** Actions per step (ascending ids) from a model; step 1 first. */
  decode(model: (v: number) => boolean): number[][];
  /** What variable v means: fact/action coordinates or the label of its auxiliary range. */
  describeVar(v: number): string;
  /** `{ numVars, clauses }` (views into the store) — the SAT module's `Cnf` shape. */
  toCnf(): PlainCnf;
  /** Zero-terminated single array — the SAT module's `CompactCnf` shape. */
  toCompact(): CompactClauses;
  streamTo(sink: ClauseSink): void;
  /** Deterministic DIMACS text (header comments name the parameters). */
  toDimacs(): string;
  writeDimacs(write: (chunk: string) => void): void;
  /** relaxed-suffix-1's variables (null without the part). */
  readonly suffix: SuffixVars | null;
  /**
   * relaxed-suffix-1: appends the clauses of state pair (t, t′) at the end of the CNF, exactly as
   * a rebuild with the pair appended to the parameters would; returns the index of its first clause.
   */
  addStatePair(t: number, u: number): number;
}

function normaliseGroups(groups: readonly (readonly number[])[] | undefined, task: Task): number[][] {
  const out: number[][] = [];
  const init = new Set(task.init);
  for (const g of groups ?? []) {
    const sorted = [...new Set(g)].sort((x, y) => x - y);
    for (const f of sorted) if (!Number.isInteger(f) || f < 0 || f >= task.facts.length) throw new RangeError(`encode: mutex group names fact ${f}`);
    if (sorted.length < 2) continue;
    if (sorted.filter((f) => init.has(f)).length > 1) throw new RangeError(`encode: mutex group [${sorted.join(",")}] has two facts true initially`);
    out.push(sorted);
  }
  return out;
}

export function encodePlanning(task: Task, opts: EncodeOptions): Encoding {
  const stepRec = stepEncodingRecord(opts.encoding);
  const costId = opts.cost ?? COST_ENCODING;
  const costRec = costEncodingRecord(costId);
  const parts = checkParts(opts.parts);
  const T = opts.steps;
  if (!Number.isInteger(T) || T < 0) throw new RangeError(`encode: steps must be a non-negative integer, got ${T}`);
  const partRecs = parts.map(partRecord);
  for (const r of partRecs) if (r.parallelOnly && !stepRec.parallel) throw new RangeError(`encode: the part ${r.id} needs a parallel (∀-step) step encoding, not ${stepRec.id}`);
  const partParams: PartParams = {};
  for (const r of partRecs) if (r.params) (partParams as Record<string, unknown>)[r.id] = r.params((opts.partParams as Record<string, unknown> | undefined)?.[r.id], T, task);
  for (const k of Object.keys(opts.partParams ?? {})) if (!parts.includes(k as PartId) || !partRecord(k as PartId).params) throw new RangeError(`encode: parameters given for ${k}, which is not a part of this formula taking any`);
  const groups = normaliseGroups(opts.mutexGroups, task);
  const info = taskInfo(task);
  const L = new Layout(info.nF, info.nA, T);
  const cnf = new CnfBuilder();
  cnf.newVars((T + 1) * info.nF, "fact");
  cnf.newVars(T * info.nA, "action");
  const clausesByPart: Record<string, number> = {};
  const varsByPart: Record<string, number> = {};
  let mark = { c: 0, v: cnf.numVars };
  const part = (name: string) => {
    clausesByPart[name] = (clausesByPart[name] ?? 0) + cnf.numClauses - mark.c;
    varsByPart[name] = (varsByPart[name] ?? 0) + cnf.numVars - mark.v;
    mark = { c: cnf.numClauses, v: cnf.numVars };
  };
  const goalAtEnd = !partRecs.some((r) => r.replacesGoal);
  const ctx: EmitContext = {
    task,
    info,
    L,
    cnf,
    groups,
    parts,
    params: partParams,
    goalAtEnd,
    reachMode: opts.reachMode ?? "simplify",
    rules: null,
    possible: undefined,
    layers: null,
    costInputs: [],
    suffix: null,
    cost: null,
    stats: {},
    part,
  };

  emitInitAndGoal(cnf, task, L, goalAtEnd);
  part("init+goal");
  for (const r of partRecs) r.start?.(ctx);
  const tpl = coreTemplates(task, info);
  const rules = stepRec.rules(task, info, groups);
  ctx.rules = rules;
  for (let s = 1; s <= T; s++) {
    emitStepCore(cnf, task, info, tpl, L, s);
    part("steps-core");
    rules.emitStep(cnf, L, s, ctx.possible);
    part("step-rules");
  }
  const lits: number[] = [];
  for (let t = 1; t <= T; t++) {
    for (const g of groups) {
      lits.length = 0;
      for (const f of g) lits.push(L.fact(t, f));
      atMostOne(cnf, lits, "mutex-amo");
    }
  }
  part("mutex");
  for (const r of partRecs) r.beforeCost?.(ctx);
  const costValue = costRec.setting === "costBits" ? opts.costBits : opts.costCap;
  const cost = costRec.emit({ cnf, task, rules, L, possible: ctx.possible, part, extra: ctx.costInputs }, costValue);
  ctx.cost = cost;
  for (const r of partRecs) r.afterCost?.(ctx);
  cnf.simplifyWith(null);
  for (const r of partRecs) r.atEnd?.(ctx);

  const params: EncodingParams = { encoding: opts.encoding, cost: costId, steps: T, [cost.setting.name]: cost.setting.value, mutexGroups: groups };
  if (parts.length > 0) params.parts = parts;
  if (Object.keys(partParams).length > 0) params.partParams = partParams;
  const stats: EncodingStats = {
    vars: cnf.numVars,
    clauses: cnf.numClauses,
    literals: cnf.numLiterals,
    factVars: (T + 1) * info.nF,
    actionVars: T * info.nA,
    clausesByPart,
    varsByPart,
    fullAdders: 0,
    halfAdders: 0,
    ...cost.stats,
    ...ctx.stats,
    ...rules.stats,
  };
  const id = [opts.encoding, costId, ...parts].join("+");
  const pairsText = () => (partParams["relaxed-suffix-1"] ? ` statePairs=${partParams["relaxed-suffix-1"].pairs.length}` : "");
  const comments = () => [
    `plumbline ${id} steps=${T} ${cost.setting.name}=${cost.setting.value} mutexGroups=${groups.length}${pairsText()}`,
    `facts=${info.nF} actions=${info.nA} fact-vars=1..${L.actBase - 1} action-vars=${L.actBase}..${L.auxBase - 1}`,
    cost.comment,
  ];
  return {
    params,
    cnf,
    get numVars() {
      return cnf.numVars;
    },
    get numClauses() {
      return cnf.numClauses;
    },
    stats,
    costSum: cost.outputs,
    maxSum: cost.maxSum,
    maxRepresentableCost: cost.maxRepresentable,
    suffix: ctx.suffix,
    actionVar: (s, a) => {
      if (!(s >= 1 && s <= T && a >= 0 && a < info.nA)) throw new RangeError(`encode: no action variable for step ${s}, action ${a}`);
      return L.action(s, a);
    },
    factVar: (t, f) => {
      if (!(t >= 0 && t <= T && f >= 0 && f < info.nF)) throw new RangeError(`encode: no fact variable for time ${t}, fact ${f}`);
      return L.fact(t, f);
    },
    boundAssumptions(B: number): number[] {
      if (!Number.isSafeInteger(B) || B < 0) throw new RangeError(`encode: cost bound must be a non-negative integer, got ${B}`);
      return cost.assumptions(B);
    },
    decode(model) {
      const out: number[][] = [];
      for (let s = 1; s <= T; s++) {
        const step: number[] = [];
        for (let a = 0; a < info.nA; a++) if (model(L.action(s, a))) step.push(a);
        out.push(step);
      }
      return out;
    },
    describeVar(v) {
      const d = L.describe(v);
      if (d?.kind === "fact") return `fact ${task.facts[d.fact]} @${d.time}`;
      if (d?.kind === "action") return `action ${task.actions[d.action].name} @step ${d.step}`;
      const r = cnf.labelOf(v);
      return r ? `${r.label}#${v - r.start}` : `unknown variable ${v}`;
    },
    toCnf: () => cnf.toCnf(),
    toCompact: () => cnf.toCompact(),
    streamTo: (sink) => cnf.streamTo(sink),
    toDimacs: () => toDimacs(cnf, comments()),
    writeDimacs: (write) => writeDimacsChunks(cnf, comments(), write),
    addStatePair(t, u) {
      const sp = partParams["relaxed-suffix-1"];
      if (!sp || !ctx.suffix) throw new RangeError("encode: state pairs need the part relaxed-suffix-1");
      const [pair] = checkPairsAgainst(sp.pairs, t, u, T);
      const first = cnf.numClauses;
      emitStatePair(cnf, L, ctx.suffix, pair, ctx.layers);
      sp.pairs.push(pair);
      clausesByPart["distinct-states"] = (clausesByPart["distinct-states"] ?? 0) + cnf.numClauses - first;
      stats.vars = cnf.numVars;
      stats.clauses = cnf.numClauses;
      stats.literals = cnf.numLiterals;
      return first;
    },
  };
}

/** (t, u) as a new pair for horizon T, not among `pairs` (RangeError otherwise). */
function checkPairsAgainst(pairs: readonly (readonly [number, number])[], t: number, u: number, T: number): [[number, number]] {
  if (!Number.isInteger(t) || !Number.isInteger(u) || t < 0 || u <= t || u > T) throw new RangeError(`encode: state pair [${t}, ${u}] is not 0 ≤ t < t' ≤ ${T}`);
  if (pairs.some(([a, b]) => a === t && b === u)) throw new RangeError(`encode: state pair [${t}, ${u}] is already there`);
  return [[t, u]];
}
