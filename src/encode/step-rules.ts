// What distinguishes the step encodings (specs seq-1, forall-1, forall-2): which actions may
// share a step, and which literals feed the cost adder (per-step cost words or action groups).
import type { Task } from "../ground/task.js";
import type { CostGroup } from "./adder.js";
import { atMostOne } from "./amo.js";
import { chainPlan, emitChain, type ChainPlan } from "./chains.js";
import type { CnfBuilder } from "./cnf.js";
import { bitWordGroups, costClassGroups, forallCliques, unaryForallGroups, type Possible } from "./cost-inputs.js";
import { familyPairCount, familyPairs, interferenceFamilies } from "./interference.js";
import type { Layout } from "./layout.js";
import type { TaskInfo } from "./task-info.js";

export type StepEncodingId = "seq-1" | "forall-1" | "forall-2";
export const STEP_ENCODINGS: readonly StepEncodingId[] = ["seq-1", "forall-1", "forall-2"];

export interface StepRules {
  /**
   * Clauses restricting which actions share step s (emitted after the core clauses of s).
   * `possible` (part reach-1) leaves impossible actions out of seq-1's at-most-one.
   */
  emitStep(cnf: CnfBuilder, L: Layout, s: number, possible?: Possible): void;
  /** Emits any helper variables/clauses and returns the adder's input groups (impossible actions left out). */
  costGroups(cnf: CnfBuilder, L: Layout, possible?: Possible): CostGroup[];
  /** cost-unary-1: groups of positive-cost actions of which at most one is taken per step. */
  unaryGroups(): number[][];
  /** Figures for reports: interference pairs and chain families per step. */
  stats: Record<string, number>;
}

/** seq-1: at most one action per step; the step's cost is an OR-word of its action's cost bits. */
function seqRules(task: Task, info: TaskInfo): StepRules {
  const acts: number[] = [];
  return {
    stats: {},
    emitStep(cnf, L, s, possible) {
      acts.length = 0;
      for (let a = 0; a < info.nA; a++) if (!possible || possible(s, a)) acts.push(L.action(s, a));
      atMostOne(cnf, acts, "amo");
    },
    costGroups(cnf, L, possible) {
      const all = [...Array(info.nA).keys()].filter((a) => task.actions[a].cost > 0);
      return bitWordGroups(task, cnf, L, all, possible);
    },
    unaryGroups: () => [[...Array(info.nA).keys()].filter((a) => task.actions[a].cost > 0)],
  };
}

/** forall-1: every interfering pair gets (¬a ∨ ¬b) at every step. */
function forallPairRules(task: Task, info: TaskInfo, groups: readonly number[][]): StepRules {
  const pairs = familyPairs(interferenceFamilies(task, info), info.nA);
  return {
    stats: { interferencePairs: pairs.length },
    emitStep(cnf, L, s) {
      for (const [a, b] of pairs) cnf.add2(-L.action(s, a), -L.action(s, b));
    },
    costGroups: (cnf, L, possible) => costClassGroups(task, cnf, L, [], possible),
    unaryGroups: () => unaryForallGroups(task, info, interferenceFamilies(task, info), groups),
  };
}

/** A family whose pair count exceeds this many times its chain's clauses is chained unexamined. */
const CHAIN_AT_ONCE = 8;

/**
 * forall-2: families by descending pair count (ties: family order). A family's pairs not yet
 * forbidden (by earlier chains or pairs) become pair clauses when there are no more of them
 * than its chain has clauses; otherwise the family becomes a chain. A family with more than
 * 8× its chain's clauses in pairs becomes a chain without looking at its pairs.
 */
function forallChainRules(task: Task, info: TaskInfo, groups: readonly number[][]): StepRules {
  const families = interferenceFamilies(task, info);
  const nA = info.nA;
  const order = families.map((f, i) => ({ f, i, n: familyPairCount(f) })).sort((x, y) => y.n - x.n || x.i - y.i);
  const covered = new Set<number>();
  const chosenPairs: number[] = [];
  const chains: { plan: ChainPlan; i: number }[] = [];
  for (const { f, i, n } of order) {
    const plan = chainPlan(f);
    if (n > CHAIN_AT_ONCE * plan.clauses) {
      chains.push({ plan, i });
      continue;
    }
    const keys = familyPairs([f], nA).map(([a, b]) => a * nA + b);
    const fresh = keys.filter((k) => !covered.has(k));
    if (fresh.length <= plan.clauses) chosenPairs.push(...fresh);
    else chains.push({ plan, i });
    for (const k of keys) covered.add(k);
  }
  chains.sort((x, y) => x.i - y.i);
  const pairs = [...new Set(chosenPairs)].sort((x, y) => x - y).map((k) => [Math.floor(k / nA), k % nA] as const);
  const cliques = forallCliques(task, info, families, groups);
  return {
    stats: { interferencePairs: pairs.length, chainFamilies: chains.length, families: families.length, costCliques: cliques.length },
    emitStep(cnf, L, s) {
      for (const [a, b] of pairs) cnf.add2(-L.action(s, a), -L.action(s, b));
      for (const { plan } of chains) emitChain(cnf, plan, (u) => L.action(s, u));
    },
    costGroups: (cnf, L, possible) => costClassGroups(task, cnf, L, cliques, possible),
    unaryGroups: () => unaryForallGroups(task, info, families, groups),
  };
}

export function stepRules(id: StepEncodingId, task: Task, info: TaskInfo, groups: readonly number[][]): StepRules {
  switch (id) {
    case "seq-1":
      return seqRules(task, info);
    case "forall-1":
      return forallPairRules(task, info, groups);
    case "forall-2":
      return forallChainRules(task, info, groups);
  }
}
