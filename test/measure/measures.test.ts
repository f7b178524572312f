// Exact graph measures checked against independent brute force on tiny tasks, against their
// published ordering on small random tasks, and against known facts about classic puzzles.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import type { Task } from "../../src/ground/task.js";
import { measureTask, optimalPlan, reachableGraph, diameter } from "../../src/measure/index.js";
import { PlumblineError } from "../../src/util/errors.js";
import { applicable, optimalCost, reachableStates, replayGround, stateKey, successor } from "../support/reference.js";
import { richTaskArb, transitionTaskArb } from "../horizon/rich-task.js";
import { blocksWorld, eightPuzzle, hanoi } from "./puzzles.js";

const exhaustive = { combine: false, maxPathNodes: 300_000, sublist: { maxNodes: 300_000 } };

/** Brute-force measures straight from the definitions (reference semantics, tiny tasks only). */
function bruteForce(task: Task) {
  const states = reachableStates(task)!;
  const keys = states.map(stateKey);
  const idx = new Map(keys.map((k, i) => [k, i]));
  const n = states.length;
  const step = (a: number, s: number): number => {
    const st = states[s];
    return applicable(task.actions[a], st) ? idx.get(stateKey(successor(task.actions[a], st)))! : -1;
  };
  const edges: Array<Array<[number, number]>> = states.map((_, s) => task.actions.map((_, a) => [a, step(a, s)] as [number, number]).filter(([, t]) => t >= 0));
  const bfs = (s: number) => {
    const d = new Array(n).fill(Infinity);
    d[s] = 0;
    const q = [s];
    for (let i = 0; i < q.length; i++) for (const [, t] of edges[q[i]]) if (d[t] === Infinity) (d[t] = d[q[i]] + 1), q.push(t);
    return d;
  };
  const dist = states.map((_, s) => bfs(s));
  let diam = 0;
  for (const row of dist) for (const x of row) if (x !== Infinity) diam = Math.max(diam, x);
  // all loop-free runs (action sequences) from every state
  const runs: Array<{ x: number; acts: number[]; path: number[] }> = [];
  const walk = (x: number, acts: number[], path: number[]) => {
    runs.push({ x, acts: [...acts], path: [...path] });
    for (const [a, t] of edges[path[path.length - 1]]) if (!path.includes(t)) walk(x, [...acts, a], [...path, t]);
  };
  for (let x = 0; x < n; x++) walk(x, [], [x]);
  const run = (x: number, acts: number[]) => {
    let s = x;
    for (const a of acts) if ((s = step(a, s)) < 0) return -1;
    return s;
  };
  const subsets = (xs: number[]) => Array.from({ length: 1 << xs.length }, (_, m) => xs.filter((_, i) => m & (1 << i)));
  const perms = (xs: number[]): number[][] => (xs.length <= 1 ? [xs] : xs.flatMap((x, i) => perms([...xs.slice(0, i), ...xs.slice(i + 1)]).map((p) => [x, ...p])));
  let rec = 0;
  let sub = 0;
  let subset = 0;
  for (const { x, acts, path } of runs) {
    rec = Math.max(rec, acts.length);
    const end = path[path.length - 1];
    const subs = subsets(acts);
    sub = Math.max(sub, Math.min(...subs.filter((s) => run(x, s) === end).map((s) => s.length)));
    subset = Math.max(subset, Math.min(...subs.filter((s) => perms(s).some((p) => run(x, p) === end)).map((s) => s.length)));
  }
  // traversal: most distinct states on one walk = heaviest chain of mutually reachable classes
  const reach = (s: number) => new Set(dist[s].flatMap((d, t) => (d === Infinity ? [] : [t])));
  const R = states.map((_, s) => reach(s));
  const memo = new Map<number, number>();
  const most = (s: number): number => {
    if (memo.has(s)) return memo.get(s)!;
    const cls = [...R[s]].filter((t) => R[t].has(s));
    let best = 0;
    for (const t of R[s]) if (!R[t].has(s)) best = Math.max(best, most(t));
    memo.set(s, cls.length + best);
    return cls.length + best;
  };
  let trav = 0;
  for (let s = 0; s < n; s++) trav = Math.max(trav, most(s) - 1);
  return { diam, rec, sub, subset, trav };
}

describe("exact measures", () => {
  it("match brute force from the definitions on tiny tasks", () => {
    let checked = 0;
    fc.assert(
      fc.property(fc.oneof(richTaskArb({ maxFacts: 4, maxActions: 5 }), transitionTaskArb({ maxVars: 2, maxActions: 6 })), (task) => {
        const n = reachableStates(task)!.length;
        fc.pre(n >= 3 && n <= 7);
        const m = measureTask(task, exhaustive);
        const b = bruteForce(task);
        expect(m.diameter.value).toBe(b.diam);
        expect(m.recurrenceDiameter.value).toBe(b.rec);
        expect(m.traversalDiameter.value).toBe(b.trav);
        expect(m.sublistDiameter.value).toBe(b.sub);
        expect(m.subsetDiameter.value).toBe(b.subset);
        const opt = optimalCost(task);
        expect(m.optimal).toEqual({ cost: opt?.cost ?? null, length: opt?.length ?? null });
        checked++;
      }),
      { numRuns: 60, seed: 4301, maxSkipsPerRun: 100 },
    );
    expect(checked).toBe(60);
  });

  it("respect diameter ≤ subset ≤ sublist ≤ recurrence ≤ traversal on small random tasks", () => {
    // source: the published ordering of these measures (Abdulaziz, Norrish & Gretton 2018); proofs also in src/measure
    let strict = 0;
    let exact = 0;
    fc.assert(
      fc.property(fc.oneof(richTaskArb({ maxFacts: 5 }), transitionTaskArb({ maxVars: 3 })), (task) => {
        fc.pre(reachableStates(task)!.length >= 4);
        const m = measureTask(task, exhaustive);
        const all = [m.diameter, m.subsetDiameter, m.sublistDiameter, m.recurrenceDiameter, m.traversalDiameter];
        if (!all.every((x) => x.exact)) return;
        exact++;
        const v = all.map((x) => x.value!);
        for (let i = 1; i < v.length; i++) expect(v[i - 1]).toBeLessThanOrEqual(v[i]);
        if (v[0] < v[2]) strict++;
      }),
      { numRuns: 120, seed: 4302, maxSkipsPerRun: 50 },
    );
    expect(exact).toBeGreaterThan(100);
    expect(strict).toBeGreaterThan(3); // the measures really differ on some tasks
  });

  it("optimal cost and shortest optimal length equal the reference Dijkstra; the plan replays", () => {
    let longer = 0;
    // puzzles with random action costs (zeros included) give long, tie-rich cheapest plans
    const puzzle = fc
      .tuple(fc.constantFrom(hanoi(3), blocksWorld(4)), fc.array(fc.integer({ min: 0, max: 4 }), { minLength: 150, maxLength: 150 }))
      .map(([t, costs]) => ({ ...t, actions: t.actions.map((a, i) => ({ ...a, cost: costs[i % costs.length] })), costModel: "action-costs" as const }));
    fc.assert(
      fc.property(fc.oneof(puzzle, transitionTaskArb({ maxVars: 5, maxActions: 14, zeroShare: 0.4, maxCost: 5 })), (task) => {
        const ref = optimalCost(task);
        const got = optimalPlan(reachableGraph(task));
        expect({ cost: got.cost, length: got.length }).toEqual({ cost: ref?.cost ?? null, length: ref?.length ?? null });
        if (got.plan) {
          const r = replayGround(task, got.plan);
          expect(r.ok && r.cost).toBe(ref!.cost);
          if (got.plan.length > 3) longer++;
        }
      }),
      { numRuns: 80, seed: 4303 },
    );
    expect(longer).toBeGreaterThan(20);
  });

  it("stop with a 'limit' error (exit code 3) past --max-states", () => {
    let err: unknown;
    try {
      reachableGraph(hanoi(4), 50);
    } catch (e) {
      err = e;
    }
    expect(err).toBeInstanceOf(PlumblineError);
    expect((err as PlumblineError).exitCode).toBe(3);
    expect((err as PlumblineError).message).toMatch(/more than 50 reachable states/);
  });

  it("say when a value is only a bound", () => {
    const m = measureTask(hanoi(4), { maxPathNodes: 1000, sublist: { maxNodes: 1000 } });
    expect(m.recurrenceDiameter.exact).toBe(false);
    expect(m.recurrenceDiameter.note).toMatch(/stopped/);
    expect(m.recurrenceDiameter.lower).toBeLessThanOrEqual(m.recurrenceDiameter.upper!);
  });
});

describe("classic puzzles", () => {
  it("Towers of Hanoi, 3 pegs: 3^n states, diameter 2^n − 1", () => {
    for (let n = 1; n <= 4; n++) {
      const g = reachableGraph(hanoi(n));
      expect(g.states.size).toBe(3 ** n); // source: standard result (Hanoi graph)
      const d = diameter(g);
      expect(d.exact).toBe(true);
      expect(d.value).toBe(2 ** n - 1); // source: standard result (Hanoi graph diameter)
      const plain = diameter(g, { symmetry: false });
      expect(plain.value).toBe(2 ** n - 1); // no symmetry reduction: same answer
    }
  });

  it("blocks world reachable states for n = 1..5", () => {
    const counts = [1, 2, 3, 4, 5].map((n) => reachableGraph(blocksWorld(n)).states.size);
    expect(counts).toEqual([1, 3, 13, 73, 501]); // source: OEIS A000262
  });

  it("8-puzzle: 181,440 reachable states, diameter 31", () => {
    const g = reachableGraph(eightPuzzle([0, 1, 2, 3, 4, 5, 6, 7, 8]));
    expect(g.states.size).toBe(181_440); // source: 9!/2, Johnson & Story 1879 (half the permutations are reachable)
    const d = diameter(g);
    expect(d.exact).toBe(true);
    expect(d.value).toBe(31); // source: Reinefeld 1993
    expect(d.orbits).toBeLessThan(100); // the symmetry reduction did the work
  });
});
