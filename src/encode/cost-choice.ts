// Which cost encoding a formula should use: both cost parts are sized on their own (the adder on
// a scratch CNF, the unary counter counted without storing it) and compared; callers record the choice.
import type { Task } from "../ground/task.js";
import { CnfBuilder } from "./cnf.js";
import type { Possible } from "./cost-inputs.js";
import { unaryInputs } from "./cost-part.js";
import type { EncodeOptions } from "./encoding.js";
import { checkParts, COST_ENCODINGS, type CostEncodingId } from "./ids.js";
import { Layout } from "./layout.js";
import { reachLayers } from "./reach.js";
import { costEncodingRecord, partCostValues, partRecord } from "./registry.js";
import { stepRules, type StepRules } from "./step-rules.js";
import { taskInfo } from "./task-info.js";
import { buildUnary } from "./unary.js";

export interface CostPartSize {
  vars: number;
  clauses: number;
  /** Counting stopped once `clauses` passed the limit that decides the choice: the part is larger. */
  atLeast?: boolean;
}

interface Setting {
  task: Task;
  rules: StepRules;
  L: Layout;
  possible: Possible | undefined;
  /** Costs of the inputs the parts add (relaxed-suffix-1's actions). */
  extraCosts: number[];
}

/** The step rules, layout and reach-1 layers of the formula `opts` describes (mutex groups as given). */
function setting(task: Task, opts: EncodeOptions): Setting {
  const info = taskInfo(task);
  const T = opts.steps;
  const L = new Layout(info.nF, info.nA, T);
  const rules = stepRules(opts.encoding, task, info, (opts.mutexGroups ?? []).map((g) => [...g]));
  const parts = checkParts(opts.parts);
  const goalAtEnd = !parts.some((p) => partRecord(p).replacesGoal);
  let possible: Possible | undefined;
  if (parts.includes("reach-1")) {
    const r = reachLayers(task, info, T, goalAtEnd);
    possible = (s, a) => r.possible[s][a] === 1;
  }
  return { task, rules, L, possible, extraCosts: partCostValues(task, parts) };
}

/** A cost part built on a scratch CNF (inputs and circuit): its variables and clauses. */
function builtSize(st: Setting, id: CostEncodingId, opts: EncodeOptions): CostPartSize {
  const cnf = new CnfBuilder();
  cnf.newVars(st.L.auxBase - 1, "base");
  const extra = st.extraCosts.map((cost) => ({ lit: cnf.newVar("suffix-action"), cost }));
  const v0 = cnf.numVars;
  const rec = costEncodingRecord(id);
  rec.emit({ cnf, task: st.task, rules: st.rules, L: st.L, possible: st.possible, part: () => {}, extra }, rec.setting === "costBits" ? opts.costBits : opts.costCap);
  return { vars: cnf.numVars - v0, clauses: cnf.numClauses };
}

const TOO_MANY = Symbol("too many clauses");

/**
 * cost-unary-1's part counted without storing a clause (its size grows with costCap times the
 * inputs, which can be far too large to build just to compare); stops past `limit` clauses.
 */
function unarySize(st: Setting, opts: EncodeOptions, limit: number): CostPartSize {
  const inputs = unaryInputs(st.task, st.rules, st.L, st.possible);
  for (const cost of st.extraCosts) inputs.push({ values: [cost], lits: [0] });
  const cap = opts.costCap ?? inputs.reduce((m, x) => m + x.values[x.values.length - 1], 0);
  const n = { vars: 0, clauses: 0 };
  const sink = {
    newVar: () => ++n.vars,
    addClause: () => {
      if (++n.clauses > limit) throw TOO_MANY;
    },
  };
  try {
    buildUnary(sink, inputs, cap);
  } catch (e) {
    if (e !== TOO_MANY) throw e;
    return { ...n, atLeast: true };
  }
  return n;
}

/**
 * Variables and clauses of each cost encoding's part (inputs and circuit) for the formula `opts`
 * describes; `opts.cost` is ignored. Mutex groups are used as given (normalise them first).
 */
export function costPartSizes(task: Task, opts: EncodeOptions): Record<CostEncodingId, CostPartSize> {
  const st = setting(task, opts);
  const out = {} as Record<CostEncodingId, CostPartSize>;
  for (const id of COST_ENCODINGS) out[id] = id === "cost-unary-1" ? unarySize(st, opts, Infinity) : builtSize(st, id, opts);
  return out;
}

/** cost-unary-1 is chosen while its part has at most this many times the adder part's clauses ... */
export const UNARY_MAX_RATIO = 4;
/** ... or at most this many clauses (small formulas: the ratio does not matter). */
export const UNARY_SMALL = 20_000;

/**
 * cost-unary-1 when its part is small in absolute terms or at most UNARY_MAX_RATIO times the
 * adder part's clauses, else cost-adder-1 (unary grows with the bound, binary with its logarithm).
 * The unary part is counted only up to that limit (`atLeast` in its size when it is larger).
 */
export function chooseCostEncoding(task: Task, opts: EncodeOptions): { id: CostEncodingId; sizes: Record<CostEncodingId, CostPartSize> } {
  const st = setting(task, opts);
  const adder = builtSize(st, "cost-adder-1", opts);
  const unary = unarySize(st, opts, Math.max(UNARY_SMALL, UNARY_MAX_RATIO * adder.clauses));
  return { id: unary.atLeast ? "cost-adder-1" : "cost-unary-1", sizes: { "cost-adder-1": adder, "cost-unary-1": unary } };
}
