// The cost part of a planning CNF: cost-adder-1 (binary sum + comparator on bound bits) or
// cost-unary-1 (saturating prefix counter), behind one interface for bound assumptions.
import type { Task } from "../ground/task.js";
import { bitLength, buildAdder } from "./adder.js";
import type { CnfBuilder } from "./cnf.js";
import { comparatorAssumptions, comparatorAtLeast, emitComparator } from "./comparator.js";
import type { Possible } from "./cost-inputs.js";
import type { Layout } from "./layout.js";
import type { ExtraCostInput } from "./relaxed-suffix.js";
import type { StepRules } from "./step-rules.js";
import { buildUnary, unaryAssumptions, unaryAtLeast, type UnaryInput } from "./unary.js";

export interface CostPart {
  /** Sum bits (cost-adder-1) or outputs "sum ≥ j", j = 1..cap (cost-unary-1); 0 = constant false. */
  outputs: number[];
  maxSum: number;
  /** The largest B that `assumptions` accepts below maxSum. */
  maxRepresentable: number;
  assumptions(B: number): number[];
  /**
   * cost-prune-1: for each bound lb of `lbs` (distinct, ascending, positive integers) a literal
   * that unit propagation from assumptions(B) makes false whenever B < lb, and that the exact
   * model of any assignment of cost ≥ lb may set true (0 = constant false); emits the clauses
   * this needs (spec cost-prune-1, "Cost literals"). null: this part cannot ask any bound.
   */
  atLeast(cnf: CnfBuilder, lbs: readonly number[]): number[] | null;
  /** Third DIMACS comment line. */
  comment: string;
  /** "costBits" or "costCap", with its value, for the first comment line and the params. */
  setting: { name: "costBits" | "costCap"; value: number };
  stats: Record<string, number>;
}

/**
 * cost-unary-1 inputs: for s = 1..T, for each step-exclusive group (rules.unaryGroups(), in
 * order): its members that may be taken in step s, ordered by (cost, id), as literals A(s,a)
 * with values cost(a). Groups with no such member give no input.
 */
export function unaryInputs(task: Task, rules: StepRules, L: Layout, possible?: Possible): UnaryInput[] {
  const groups = rules.unaryGroups().map((g) => [...g].sort((x, y) => task.actions[x].cost - task.actions[y].cost || x - y));
  const out: UnaryInput[] = [];
  for (let s = 1; s <= L.steps; s++) {
    for (const g of groups) {
      const members = possible ? g.filter((a) => possible(s, a)) : g;
      if (members.length === 0) continue;
      out.push({ values: members.map((a) => task.actions[a].cost), lits: members.map((a) => L.action(s, a)) });
    }
  }
  return out;
}

/** What both cost encodings are emitted from. */
export interface CostEmitInput {
  cnf: CnfBuilder;
  task: Task;
  rules: StepRules;
  L: Layout;
  possible: Possible | undefined;
  part: (name: string) => void;
  /** Parts that add cost (relaxed-suffix-1), counted after the step encoding's inputs. */
  extra: readonly ExtraCostInput[];
}

/**
 * cost-unary-1: the step encoding's unary inputs, then one input per extra literal in order;
 * the counter saturates at `costCap` (default: the largest possible sum).
 */
export function emitUnaryCost(x: CostEmitInput, costCap: number | undefined): CostPart {
  const { cnf, task, rules, L, possible, part } = x;
  const inputs = unaryInputs(task, rules, L, possible);
  for (const e of x.extra) inputs.push({ values: [e.cost], lits: [e.lit] });
  const maxSum = inputs.reduce((m, i) => m + i.values[i.values.length - 1], 0);
  const cap = costCap ?? maxSum;
  part("cost-inputs");
  const r = buildUnary(cnf, inputs, cap);
  part("unary");
  return {
    outputs: r.outputs,
    maxSum: r.maxSum,
    maxRepresentable: cap - 1,
    assumptions: (B) => unaryAssumptions(r, B),
    atLeast: (c, lbs) => unaryAtLeast(c, r.outputs, lbs),
    comment: `bound unary outputs=${r.outputs.join(",") || "-"}`,
    setting: { name: "costCap", value: cap },
    stats: { unaryLayers: r.layers, unaryInputs: inputs.length },
  };
}

/**
 * cost-adder-1: the step encoding's groups, then one group per distinct extra cost (ascending)
 * with its literals in order; a comparator on `costBits` bound bits (default: enough for the
 * largest possible sum).
 */
export function emitAdderCost(x: CostEmitInput, costBits: number | undefined): CostPart {
  const { cnf, L, possible, part } = x;
  const costGroups = x.rules.costGroups(cnf, L, possible);
  for (const c of [...new Set(x.extra.map((e) => e.cost))].sort((p, q) => p - q)) costGroups.push({ weight: c, lits: x.extra.filter((e) => e.cost === c).map((e) => e.lit) });
  part("cost-inputs");
  const adder = buildAdder(cnf, costGroups);
  part("adder");
  const m = costBits ?? bitLength(adder.maxSum);
  if (!Number.isInteger(m) || m < 0 || m > 52) throw new RangeError(`encode: costBits must be an integer in 0..52, got ${m}`);
  const cmp = emitComparator(cnf, adder.sum, m);
  part("comparator");
  const maxRepresentable = 2 ** m - 1;
  return {
    outputs: adder.sum,
    maxSum: adder.maxSum,
    maxRepresentable,
    assumptions(B) {
      if (B >= adder.maxSum) return [];
      if (B > maxRepresentable) throw new RangeError(`encode: bound ${B} needs more than costBits=${m} bits`);
      return comparatorAssumptions(cmp, B);
    },
    atLeast: (c, lbs) => comparatorAtLeast(c, cmp, lbs),
    comment: `bound enable=${cmp.enable} bits=${cmp.boundBits.join(",") || "-"}`,
    setting: { name: "costBits", value: m },
    stats: { fullAdders: adder.fullAdders, halfAdders: adder.halfAdders },
  };
}
