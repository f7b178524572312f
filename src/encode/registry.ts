// One list each of the step encodings, cost encodings and optional parts a planning CNF is made
// of, as records (id, spec, parameters, emission hooks, what a proof may conclude from them).
import type { Task } from "../ground/task.js";
import type { CnfBuilder } from "./cnf.js";
import type { Possible } from "./cost-inputs.js";
import { emitAdderCost, emitUnaryCost, type CostEmitInput, type CostPart } from "./cost-part.js";
import { emitCostPrune } from "./cost-prune.js";
import { emitEagerSteps } from "./eager-steps.js";
import { checkLandmarks, emitLandmarks } from "./landmarks.js";
import { emitEmptyStepsLast } from "./empty-steps-last.js";
import type { CostEncodingId, PartId } from "./ids.js";
import type { Layout } from "./layout.js";
import { emitReachUnits, reachLayers, type ReachLayers, type ReachMode } from "./reach.js";
import { checkPairs, emitRelaxedSuffix, emitStatePair, suffixCostValues, type ExtraCostInput, type SuffixVars } from "./relaxed-suffix.js";
import { stepRules, type StepEncodingId, type StepRules } from "./step-rules.js";
import type { TaskInfo } from "./task-info.js";

/** Parameters of the parts that take any (JSON-safe, recorded in certificates). */
export interface PartParams {
  /** relaxed-suffix-1: state pairs (t, t′) made distinct, in the order they were added. */
  "relaxed-suffix-1"?: { pairs: [number, number][] };
  /** landmarks-1: disjunctive action landmarks (action ids of the formula's task). */
  "landmarks-1"?: { landmarks: number[][] };
}

/** What the emission hooks see and fill in while one formula is built. */
export interface EmitContext {
  readonly task: Task;
  readonly info: TaskInfo;
  readonly L: Layout;
  readonly cnf: CnfBuilder;
  readonly groups: number[][];
  readonly parts: readonly PartId[];
  readonly params: PartParams;
  /** False when a part finishes the plan instead (the goal is not asserted at T). */
  readonly goalAtEnd: boolean;
  readonly reachMode: ReachMode;
  rules: StepRules | null;
  /** reach-1: may action a be taken in step s. */
  possible: Possible | undefined;
  layers: ReachLayers | null;
  /** Literals parts add to the plan's cost (counted by the cost encoding after the steps). */
  costInputs: ExtraCostInput[];
  suffix: SuffixVars | null;
  /** The cost part, once emitted (afterCost and atEnd hooks). */
  cost: CostPart | null;
  stats: Record<string, number>;
  /** Closes a stretch of clauses under a name (clause and variable counts per part). */
  part(name: string): void;
}

export interface StepEncodingRecord {
  id: StepEncodingId;
  summary: string;
  /** The spec under encodings/. */
  spec: string;
  /** False only for seq-1 (one action per step). */
  parallel: boolean;
  rules(task: Task, info: TaskInfo, groups: readonly number[][]): StepRules;
}

export interface CostEncodingRecord {
  id: CostEncodingId;
  summary: string;
  spec: string;
  /** The parameter that sizes the circuit for bounds "cost ≤ B" (recorded in certificates). */
  setting: "costBits" | "costCap";
  /** The setting's value that lets a formula ask "cost ≤ B" for every B < upper (Infinity: no bound). */
  settingFor(upper: number): number;
  emit(input: CostEmitInput, value: number | undefined): CostPart;
}

/**
 * What a refutation of a formula with this part still proves:
 * - "threshold": nothing more than without it — the formula is exact for plans of at most T
 *   actions, so "unsatisfiable" proves no plan of cost ≤ B only at a completeness threshold;
 * - "any-horizon": the part finishes every plan after T steps with a lower bound, so
 *   "unsatisfiable" proves no plan of cost ≤ B at all, whatever T.
 */
export type PartProof = "threshold" | "any-horizon";

export interface PartRecord {
  id: PartId;
  summary: string;
  spec: string;
  proof: PartProof;
  /** True when the part, not core-1's goal units at T, makes the plan reach the goal. */
  replacesGoal?: boolean;
  /** True when the part is sound only with parallel (∀-step) step encodings. */
  parallelOnly?: boolean;
  /** Checks and normalises the part's parameters (throws RangeError); undefined: none taken. */
  params?(raw: unknown, steps: number, task: Task): unknown;
  /** Directly after the initial state (and goal) units. */
  start?(ctx: EmitContext): void;
  /** After the steps and mutex groups, before the cost part. */
  beforeCost?(ctx: EmitContext): void;
  /** After the cost part. */
  afterCost?(ctx: EmitContext): void;
  /** Last, after clause simplification has been switched off (clauses a driver may add later). */
  atEnd?(ctx: EmitContext): void;
}

export const STEP_ENCODING_RECORDS: readonly StepEncodingRecord[] = [
  { id: "seq-1", summary: "at most one action per step, steps may be empty", spec: "seq-1.md", parallel: false, rules: (t, i, g) => stepRules("seq-1", t, i, g) },
  { id: "forall-1", summary: "∀-step parallel steps, every interfering pair excluded pairwise", spec: "forall-1.md", parallel: true, rules: (t, i, g) => stepRules("forall-1", t, i, g) },
  {
    id: "forall-2",
    summary: "the same steps as forall-1, interference by linear chains where smaller, cost summed per same-cost clique",
    spec: "forall-2.md",
    parallel: true,
    rules: (t, i, g) => stepRules("forall-2", t, i, g),
  },
];

/** Number of bound bits needed to ask "cost ≤ B" for every B < upper (at least 1; 0 for no bound). */
export function costBitsFor(upper: number): number {
  if (!Number.isFinite(upper)) return 0;
  let n = 0;
  for (let x = Math.max(1, upper - 1); x > 0; x = Math.floor(x / 2)) n++;
  return n;
}

export const COST_ENCODING_RECORDS: readonly CostEncodingRecord[] = [
  {
    id: "cost-adder-1",
    summary: "binary adder network (column compression) and a comparator against bound bits fixed by assumptions",
    spec: "cost-adder-1.md",
    setting: "costBits",
    settingFor: costBitsFor,
    emit: emitAdderCost,
  },
  {
    id: "cost-unary-1",
    summary: 'saturating unary prefix counter over step-exclusive action groups; "cost ≤ B" is one literal',
    spec: "cost-unary-1.md",
    setting: "costCap",
    settingFor: (upper) => (Number.isFinite(upper) ? upper : 0),
    emit: emitUnaryCost,
  },
];

export const PART_RECORDS: readonly PartRecord[] = [
  {
    id: "reach-1",
    summary: "unit clauses from forward reachability and backward relevance layers; later clauses simplified by them",
    spec: "reach-1.md",
    proof: "threshold",
    start(ctx) {
      const layers = reachLayers(ctx.task, ctx.info, ctx.L.steps, ctx.goalAtEnd);
      const fixed = emitReachUnits(ctx.cnf, ctx.task, ctx.L, layers, ctx.goalAtEnd);
      ctx.layers = layers;
      ctx.possible = (s, a) => layers.possible[s][a] === 1;
      if (ctx.reachMode === "simplify") ctx.cnf.simplifyWith(fixed);
      ctx.stats.reachFixedFacts = layers.fixedFacts;
      ctx.stats.reachFixedActions = layers.fixedActions;
      ctx.part("reach");
    },
  },
  {
    id: "relaxed-suffix-1",
    summary: "after T real steps (no idling, no repeated state before the goal) a delete-relaxed plan with acyclic support reaches the goal; its cost counts",
    spec: "relaxed-suffix-1.md",
    proof: "any-horizon",
    replacesGoal: true,
    params(raw, steps) {
      const r = (raw ?? {}) as { pairs?: unknown };
      if (typeof r !== "object" || Array.isArray(r)) throw new RangeError("encode: relaxed-suffix-1 takes { pairs: [[t, t'], …] }");
      return { pairs: checkPairs(r.pairs as number[][] | undefined, steps) };
    },
    beforeCost(ctx) {
      const s = emitRelaxedSuffix(ctx.cnf, ctx.task, ctx.L);
      ctx.suffix = s.vars;
      ctx.costInputs.push(...s.costInputs);
      ctx.stats.suffixOps = s.stats.suffixOps;
      ctx.stats.suffixSupports = s.stats.suffixSupports;
      ctx.stats.suffixOrderVars = s.stats.fillEdges;
      ctx.stats.suffixOrderClauses = s.stats.clauses;
      ctx.part("relaxed-suffix");
    },
    atEnd(ctx) {
      for (const p of ctx.params["relaxed-suffix-1"]?.pairs ?? []) emitStatePair(ctx.cnf, ctx.L, ctx.suffix!, p, ctx.layers);
      ctx.part("distinct-states");
    },
  },
  {
    id: "landmarks-1",
    summary: "one clause per disjunctive action landmark (given, e.g. landmark-cut's at the initial state): some step, or the relaxed suffix, holds one of its actions",
    spec: "landmarks-1.md",
    proof: "threshold",
    params(raw, _steps, task) {
      const r = (raw ?? {}) as { landmarks?: unknown };
      return { landmarks: checkLandmarks(r.landmarks ?? [], task.actions.length) };
    },
    afterCost(ctx) {
      emitLandmarks(ctx.cnf, ctx.L, ctx.params["landmarks-1"]?.landmarks ?? [], ctx.suffix);
      ctx.part("landmarks");
    },
  },
  {
    id: "cost-prune-1",
    summary: "action a in step t only if cost ≥ lb(a,t), an admissible layered h-max bound through a at t: one clause on the cost encoding's literals per pair with lb above the formula's least cost (sound for every bound B)",
    spec: "cost-prune-1.md",
    proof: "threshold",
    afterCost(ctx) {
      ctx.stats.costPrunePairs = emitCostPrune(ctx.cnf, ctx.task, ctx.info, ctx.L, ctx.cost!, !ctx.goalAtEnd, ctx.possible);
      ctx.part("cost-prune");
    },
  },
  {
    id: "eager-steps-1",
    summary: "every action after the first step depends on an action of the step before (each action as early as it can go; ∀-step encodings only)",
    spec: "eager-steps-1.md",
    proof: "threshold",
    parallelOnly: true,
    afterCost(ctx) {
      emitEagerSteps(ctx.cnf, ctx.task, ctx.info, ctx.L);
      ctx.part("eager-steps");
    },
  },
  {
    id: "empty-steps-last-1",
    summary: "symmetry breaking: “step s is non-empty” variables, non-empty steps first",
    spec: "empty-steps-last-1.md",
    proof: "threshold",
    afterCost(ctx) {
      emitEmptyStepsLast(ctx.cnf, ctx.L);
      ctx.part("empty-steps-last");
    },
  },
];

export function stepEncodingRecord(id: StepEncodingId): StepEncodingRecord {
  const r = STEP_ENCODING_RECORDS.find((x) => x.id === id);
  if (!r) throw new RangeError(`encode: unknown encoding ${String(id)}`);
  return r;
}

export function costEncodingRecord(id: CostEncodingId): CostEncodingRecord {
  const r = COST_ENCODING_RECORDS.find((x) => x.id === id);
  if (!r) throw new RangeError(`encode: unknown cost encoding ${String(id)}`);
  return r;
}

export function partRecord(id: PartId): PartRecord {
  const r = PART_RECORDS.find((x) => x.id === id);
  if (!r) throw new RangeError(`encode: unknown part ${String(id)}`);
  return r;
}

/** True when a refutation of a formula with these parts proves "no plan of cost ≤ B" at any horizon. */
export function provesAtAnyHorizon(parts: readonly PartId[]): boolean {
  return parts.some((p) => partRecord(p).proof === "any-horizon");
}

/** Values of the cost inputs the parts add (for sizing the cost encodings without building them). */
export function partCostValues(task: Task, parts: readonly PartId[]): number[] {
  return parts.includes("relaxed-suffix-1") ? suffixCostValues(task) : [];
}
