// Which cost encoding a formula should use: both cost parts are built on their own (on a scratch
// CNF) and compared by size; callers record the choice, so a CNF never depends on this rule.
import type { Task } from "../ground/task.js";
import { CnfBuilder } from "./cnf.js";
import { emitCostPart } from "./cost-part.js";
import type { EncodeOptions } from "./encoding.js";
import { checkParts, COST_ENCODINGS, type CostEncodingId } from "./ids.js";
import { Layout } from "./layout.js";
import { reachLayers } from "./reach.js";
import { stepRules } from "./step-rules.js";
import { taskInfo } from "./task-info.js";

export interface CostPartSize {
  vars: number;
  clauses: number;
}

/**
 * Variables and clauses of each cost encoding's part (inputs and circuit) for the formula `opts`
 * describes; `opts.cost` is ignored. Mutex groups are used as given (normalise them first).
 */
export function costPartSizes(task: Task, opts: EncodeOptions): Record<CostEncodingId, CostPartSize> {
  const info = taskInfo(task);
  const T = opts.steps;
  const L = new Layout(info.nF, info.nA, T);
  const groups = (opts.mutexGroups ?? []).map((g) => [...g]);
  const rules = stepRules(opts.encoding, task, info, groups);
  const parts = checkParts(opts.parts);
  let possible: ((s: number, a: number) => boolean) | undefined;
  if (parts.includes("reach-1")) {
    const r = reachLayers(task, info, T);
    possible = (s, a) => r.possible[s][a] === 1;
  }
  const out = {} as Record<CostEncodingId, CostPartSize>;
  for (const id of COST_ENCODINGS) {
    const cnf = new CnfBuilder();
    cnf.newVars(L.auxBase - 1, "base");
    const v0 = cnf.numVars;
    emitCostPart(cnf, task, rules, L, { id, costBits: opts.costBits, costCap: opts.costCap }, possible, () => {});
    out[id] = { vars: cnf.numVars - v0, clauses: cnf.numClauses };
  }
  return out;
}

/** cost-unary-1 is chosen while its part has at most this many times the adder part's clauses ... */
export const UNARY_MAX_RATIO = 4;
/** ... or at most this many clauses (small formulas: the ratio does not matter). */
export const UNARY_SMALL = 20_000;

/**
 * cost-unary-1 when its part is small in absolute terms or at most UNARY_MAX_RATIO times the
 * adder part's clauses, else cost-adder-1 (unary grows with the bound, binary with its logarithm).
 */
export function chooseCostEncoding(task: Task, opts: EncodeOptions): { id: CostEncodingId; sizes: Record<CostEncodingId, CostPartSize> } {
  const sizes = costPartSizes(task, opts);
  const u = sizes["cost-unary-1"].clauses;
  const id: CostEncodingId = u <= UNARY_SMALL || u <= UNARY_MAX_RATIO * sizes["cost-adder-1"].clauses ? "cost-unary-1" : "cost-adder-1";
  return { id, sizes };
}
