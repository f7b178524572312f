// reach-1's layers (src/encode/reach.ts) against the reference semantics: the forward layers hold
// every state reachable in t actions, and the soundness argument of encodings/reach-1.md —
// drop the actions not possible at their step, close the gaps — always yields a plan that fits.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { reachLayers } from "../../src/encode/index.js";
import { taskInfo } from "../../src/encode/task-info.js";
import type { Task } from "../../src/ground/task.js";
import { factoredTaskArb } from "../support/random-task.js";
import { applicable, initialState, isGoal, replayGround, stateKey, successor, type RefState } from "../support/reference.js";
import { richTaskArb, runs, withCosts } from "./rich-task.js";

const tasks = fc.oneof(richTaskArb({ maxFacts: 5, maxActions: 6 }), withCosts(factoredTaskArb({ maxVars: 3, maxActions: 6 }), 4));

describe("reach-1 layers", () => {
  it("forward: every state reachable in exactly t actions lies within mayTrue(t) / mayFalse(t)", () => {
    let states = 0;
    fc.assert(
      fc.property(tasks, fc.integer({ min: 1, max: 5 }), (task, T) => {
        const r = reachLayers(task, taskInfo(task), T);
        // source: reference semantics (test/support/reference.ts), breadth-first by depth
        let layer = new Map<string, RefState>([[stateKey(initialState(task)), initialState(task)]]);
        for (let t = 0; t <= T; t++) {
          for (const s of layer.values()) {
            states++;
            for (let f = 0; f < task.facts.length; f++) expect(s.has(f) ? r.mayTrue[t][f] : r.mayFalse[t][f], `t=${t} fact ${f}`).toBe(1);
          }
          const next = new Map<string, RefState>();
          for (const s of layer.values())
            for (const a of task.actions)
              if (applicable(a, s)) {
                const n = successor(a, s);
                next.set(stateKey(n), n);
              }
          layer = next;
        }
      }),
      { numRuns: runs(60) },
    );
    // not vacuous: on average more than two states per generated case (a run with no applicable
    // action contributes one); typical totals are 250–600 for 60 cases
    expect(states).toBeGreaterThan(2 * runs(60));
  });

  it("relevance: a plan with its impossible actions dropped and gaps closed is a plan, no dearer, every action possible at its new step", () => {
    let dropped = 0;
    fc.assert(
      fc.property(tasks, fc.array(fc.nat(), { minLength: 1, maxLength: 5 }), fc.integer({ min: 0, max: 3 }), (task, choices, extra) => {
        // a random walk, its end state made the goal (as in fits.test.ts)
        let s = initialState(task);
        const plan: number[] = [];
        for (const c of choices) {
          const app = task.actions.map((a, i) => (applicable(a, s) ? i : -1)).filter((i) => i >= 0);
          if (app.length === 0) break;
          plan.push(app[c % app.length]);
          s = successor(task.actions[plan[plan.length - 1]], s);
        }
        const goalTask: Task = { ...task, goal: [...s].sort((x, y) => x - y), goalNeg: task.facts.map((_, f) => f).filter((f) => !s.has(f)).slice(0, 2) };
        const T = plan.length + extra;
        const r = reachLayers(goalTask, taskInfo(goalTask), T);
        // every action of the walk is forward-reachable at its step
        expect(r.possible.length).toBe(T + 1);
        const kept = plan.filter((a, i) => r.possible[i + 1][a] === 1);
        dropped += plan.length - kept.length;
        // source: reference semantics replays the pruned plan
        const replay = replayGround(goalTask, kept);
        expect(replay.ok).toBe(true);
        if (!replay.ok) return;
        expect(isGoal(goalTask, replay.state)).toBe(true);
        const cost = plan.reduce((c, a) => c + task.actions[a].cost, 0);
        expect(replay.cost).toBeLessThanOrEqual(cost);
        kept.forEach((a, k) => expect(r.possible[k + 1][a], `action ${a} moved to step ${k + 1}`).toBe(1));
      }),
      { numRuns: runs(150) },
    );
    expect(dropped).toBeGreaterThan(5); // the pruning did remove actions
  });
});
