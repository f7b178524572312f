// forall-1 / forall-2 against exhaustive search: every sequential plan of ≤ T actions fits in
// T steps, every decoded step is a true ∀-step (all orders executable, same result), every
// decoded plan replays with cost ≤ B, and the two interference encodings agree on every query.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { encodePlanning, extractPlan, type Encoding } from "../../src/encode/index.js";
import type { Task } from "../../src/ground/task.js";
import { applicable, cheapestWithin, initialState, isGoal, optimalCost, replayGround, stateKey, successor, type RefState } from "../support/reference.js";
import { forallCliques } from "../../src/encode/cost-inputs.js";
import { interferenceFamilies } from "../../src/encode/interference.js";
import { taskInfo } from "../../src/encode/task-info.js";
import { Oracle } from "./oracle.js";
import { factoredWithGroups, mostlySolvable, movesTaskArb, nonTrivial, richTaskArb, runs } from "./rich-task.js";

const solvable = (t: Task) => optimalCost(t) !== null;
// factored and "move" tasks come with their mutex groups (used by forall-2 for AMOs and cost cliques)
const factoredBase = fc
  .oneof(factoredWithGroups({ maxVars: 3, maxActions: 6 }, 5), movesTaskArb(2))
  .filter(({ task }) => !isGoal(task, initialState(task)));
const factored = fc.oneof({ weight: 3, arbitrary: factoredBase.filter(({ task }) => solvable(task)) }, { weight: 1, arbitrary: factoredBase });
const rich = mostlySolvable(nonTrivial(richTaskArb({ maxFacts: 4, maxActions: 5 })), solvable);
type Tasked = { task: Task; groups: number[][] };
const noGroups = (task: Task): Tasked => ({ task, groups: [] });
// many actions over few facts: interference families big enough for forall-2 to pick chains
const crowded = nonTrivial(richTaskArb({ maxFacts: 4, minActions: 10, maxActions: 14 }));

function permutations(xs: number[]): number[][] {
  if (xs.length <= 1) return [xs];
  return xs.flatMap((x, i) => permutations([...xs.slice(0, i), ...xs.slice(i + 1)]).map((p) => [x, ...p]));
}

/**
 * The ∀-step property straight from its definition (Rintanen, Heljanko & Niemelä 2006):
 * from state s, every ordering of the step's actions is executable and all end in one state.
 */
function checkForallStep(task: Task, s: RefState, step: number[]): Set<number> {
  let result: string | null = null;
  let end: Set<number> | null = null;
  for (const order of permutations(step)) {
    let cur = new Set(s);
    for (const a of order) {
      expect(applicable(task.actions[a], cur), `order ${order} from {${stateKey(s)}}`).toBe(true);
      cur = successor(task.actions[a], cur);
    }
    const k = stateKey(cur);
    if (result === null) {
      result = k;
      end = cur;
    } else expect(k).toBe(result);
  }
  return end ?? new Set(s);
}

function checkDecoded(task: Task, enc: Encoding, model: (v: number) => boolean, B: number): number {
  const got = extractPlan(task, enc, model);
  let s: RefState = initialState(task);
  for (const step of got.steps) s = checkForallStep(task, s, step);
  expect(isGoal(task, s)).toBe(true);
  const replay = replayGround(task, got.plan);
  expect(replay.ok).toBe(true);
  if (replay.ok) {
    expect(replay.cost).toBe(got.cost);
    expect(replay.cost).toBeLessThanOrEqual(B);
  }
  return got.plan.length;
}

/** forall-1 plain, forall-2 with the given mutex groups (none: []). */
function checkForall(task: Task, T: number, extraB: number, groups: number[][] = []): number {
  const encs = [encodePlanning(task, { encoding: "forall-1", steps: T }), encodePlanning(task, { encoding: "forall-2", steps: T, mutexGroups: groups })];
  const oracles = encs.map((e) => new Oracle(e.toCnf()));
  // source: exhaustive layered search (test/support/reference.ts) vs logic-solver (MiniSat)
  const best = cheapestWithin(task, T);
  const bounds = new Set([0, extraB]);
  if (best !== null) for (const d of [-2, -1, 0, 1]) if (best + d >= 0) bounds.add(best + d);
  let sat = 0;
  for (const B of [...bounds].sort((x, y) => x - y)) {
    const answers = encs.map((enc, i) => oracles[i].solve(enc.boundAssumptions(B)));
    // same interference relation, two clause forms: the answers must agree
    expect(answers[0] === null).toBe(answers[1] === null);
    // every sequential plan of ≤ T actions fits into T steps
    if (best !== null && best <= B) expect(answers[0], `T=${T} B=${B} best=${best}`).not.toBeNull();
    answers.forEach((model, i) => {
      if (!model) return;
      sat++;
      const len = checkDecoded(task, encs[i], model, B);
      // a plan of cost ≤ B must be longer than T when no ≤ T-action plan is that cheap
      if (best === null || best > B) expect(len).toBeGreaterThan(T);
    });
  }
  return sat;
}

/**
 * One step from every state: with the initial-state units left out and the time-0 facts
 * assumed instead, the solver enumerates every action set S the encoding accepts (blocking
 * each one found). Accepted sets must be ∀-steps by definition, both encodings must accept
 * the same sets, every single applicable action must be accepted, and the cost circuit must
 * price each accepted S exactly (SAT at "≤ cost(S)", UNSAT at "≤ cost(S) − 1"). With mutex
 * groups (given to forall-2 only) the states are those with exactly one fact per group.
 * Returns the number of accepted sets with ≥ 2 actions.
 */
function checkOneStepExhaustively(task: Task, groups: number[][] = []): number {
  const open = { ...task, goal: [], goalNeg: [] };
  const nF = task.facts.length;
  const nA = task.actions.length;
  const encs = [encodePlanning(open, { encoding: "forall-1", steps: 1 }), encodePlanning(open, { encoding: "forall-2", steps: 1, mutexGroups: groups })];
  const oracles = encs.map((e) => {
    const cnf = e.toCnf();
    return new Oracle({ numVars: cnf.numVars, clauses: cnf.clauses.slice(nF) }); // core-1: init units come first
  });
  let parallel = 0;
  for (let sm = 0; sm < 1 << nF; sm++) {
    const state = new Set<number>();
    for (let f = 0; f < nF; f++) if (sm & (1 << f)) state.add(f);
    if (!groups.every((g) => g.filter((f) => state.has(f)).length === 1)) continue;
    const accepted = encs.map((e, i) => {
      const stateLits: number[] = [];
      for (let f = 0; f < nF; f++) stateLits.push(state.has(f) ? e.factVar(0, f) : -e.factVar(0, f));
      const found: string[] = [];
      for (;;) {
        const m = oracles[i].solve(stateLits);
        if (!m) break;
        const S = [...Array(nA).keys()].filter((a) => m(e.actionVar(1, a)));
        found.push(S.join(","));
        const end = checkForallStep(task, state, S);
        // the model's time-1 facts are the state every ordering reaches
        for (let f = 0; f < nF; f++) expect(m(e.factVar(1, f))).toBe(end.has(f));
        if (i === 0 && S.length >= 2) parallel++;
        const exact = [...Array(nA).keys()].map((a) => (S.includes(a) ? e.actionVar(1, a) : -e.actionVar(1, a)));
        // source: arithmetic — the step's cost is the sum of its actions' costs
        const cost = S.reduce((c, a) => c + task.actions[a].cost, 0);
        expect(oracles[i].solve([...stateLits, ...exact, ...e.boundAssumptions(cost)])).not.toBeNull();
        if (cost > 0) expect(oracles[i].solve([...stateLits, ...exact, ...e.boundAssumptions(cost - 1)]), `S=${S} cost ${cost}`).toBeNull();
        // block this (state, S) pair
        oracles[i].addClause([...stateLits.map((l) => -l), ...exact.map((l) => -l)]);
      }
      return found.sort();
    });
    expect(accepted[1]).toEqual(accepted[0]);
    // the empty step and every single applicable action are always steps
    expect(accepted[0]).toContain("");
    task.actions.forEach((act, a) => {
      if (applicable(act, state)) expect(accepted[0]).toContain(String(a));
    });
  }
  return parallel;
}

describe("forall-1 and forall-2 + cost-adder-1", () => {
  /** forall-2's statistic `key` (costCliques, chainFamilies) is positive for this task. */
  const uses = (key: string) => (t: Tasked) => (encodePlanning(t.task, { encoding: "forall-2", steps: 1, mutexGroups: t.groups }).stats[key] as number) > 0;

  // one step from every state, every accepted set enumerated (checkOneStepExhaustively)
  const oneStepCases: Array<{ what: string; arb: fc.Arbitrary<Tasked>; n: number; minParallel: number; feature?: [(t: Tasked) => boolean, number] }> = [
    { what: "accept only true ∀-steps, from every state, for every action set", arb: richTaskArb({ minFacts: 3, maxFacts: 5, minActions: 2, maxActions: 7, sparse: true }).map(noGroups), n: 12, minParallel: 40 },
    // expected ≈ 9 tasks with cliques and dozens of parallel sets at 15 runs
    { what: "price every accepted step exactly, cost cliques from mutex groups included", arb: movesTaskArb(2), n: 15, minParallel: 1, feature: [uses("costCliques"), 1] },
    { what: "accept the same sets with forall-2 chains as with forall-1 pairs (crowded tasks)", arb: richTaskArb({ minFacts: 3, maxFacts: 4, minActions: 9, maxActions: 12 }).map(noGroups), n: 12, minParallel: -1, feature: [uses("chainFamilies"), 3] },
  ];
  for (const c of oneStepCases) {
    it(c.what, () => {
      let parallel = 0;
      let featured = 0;
      fc.assert(
        fc.property(c.arb, (t) => {
          if (c.feature && c.feature[0](t)) featured++;
          parallel += checkOneStepExhaustively(t.task, t.groups);
        }),
        { numRuns: runs(c.n) },
      );
      expect(parallel).toBeGreaterThan(c.minParallel); // sets of several actions were accepted and checked
      if (c.feature) expect(featured).toBeGreaterThan(c.feature[1]);
    });
  }

  it("cost cliques are step-exclusive by the CNF's own clauses", () => {
    // a clique feeds one OR-word per step to the adder: two of its actions in one step would be
    // undercounted, so the CNF must forbid that (here: time 0 left free, step 2 asked)
    let pairs = 0;
    fc.assert(
      fc.property(fc.oneof(movesTaskArb(2), factoredWithGroups({ maxVars: 3, maxActions: 8 }, 5), richTaskArb({ maxFacts: 4, minActions: 6, maxActions: 10 }).map((task) => ({ task, groups: [] as number[][] }))), ({ task, groups }) => {
        const open = { ...task, goal: [], goalNeg: [] };
        const enc = encodePlanning(open, { encoding: "forall-2", steps: 2, mutexGroups: groups });
        const info = taskInfo(open);
        const cliques = forallCliques(open, info, interferenceFamilies(open, info), enc.params.mutexGroups);
        expect(cliques.length).toBe(enc.stats.costCliques);
        const cnf = enc.toCnf();
        const oracle = new Oracle({ numVars: cnf.numVars, clauses: cnf.clauses.slice(task.facts.length) });
        for (const c of cliques)
          for (let i = 0; i < c.length; i++)
            for (let j = i + 1; j < c.length; j++) {
              pairs++;
              expect(oracle.solve([enc.actionVar(2, c[i]), enc.actionVar(2, c[j])]), `clique ${c}`).toBeNull();
            }
      }),
      { numRuns: runs(60) },
    );
    expect(pairs).toBeGreaterThan(10);
  });

  const agreeCases: Array<{ what: string; arb: fc.Arbitrary<Tasked>; maxT: number; maxB: number; n: number; minSat: number; feature?: [(t: Tasked) => boolean, number] }> = [
    { what: "factored and move tasks (forall-2 with mutex groups and cost cliques)", arb: factored, maxT: 4, maxB: 12, n: 25, minSat: 20, feature: [uses("costCliques"), 2] },
    { what: "tasks with negative conditions and conditional effects", arb: rich.map(noGroups), maxT: 4, maxB: 8, n: 25, minSat: 20 },
    { what: "crowded tasks (forall-2 uses chains)", arb: crowded.map(noGroups), maxT: 3, maxB: 8, n: 20, minSat: 10, feature: [uses("chainFamilies"), 3] },
  ];
  for (const c of agreeCases) {
    it(`agree with exhaustive search on ${c.what}`, () => {
      let sat = 0;
      let featured = 0;
      fc.assert(
        fc.property(c.arb, fc.integer({ min: 0, max: c.maxT }), fc.integer({ min: 0, max: c.maxB }), (t, T, B) => {
          if (c.feature && c.feature[0](t)) featured++;
          sat += checkForall(t.task, T, B, t.groups);
        }),
        { numRuns: runs(c.n) },
      );
      expect(sat).toBeGreaterThan(c.minSat); // not vacuous
      if (c.feature) expect(featured).toBeGreaterThan(c.feature[1]);
    });
  }
});
