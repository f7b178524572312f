// The grounder against the lifted semantics: along random walks, the ground Task must have
// exactly the applicable actions, successors, costs and goal verdicts that evaluating the
// PDDL syntax tree directly gives (brute force over all typed argument tuples).
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { ground } from "../../src/ground/index.js";
import type { Model } from "../../src/pddl/index.js";
import { holds, initialState } from "../../src/plan/index.js";
import { applicable, successor } from "../support/reference.js";
import { blocksProblem, fixtureModel, hanoiProblem } from "../fixtures/frontend/problems.js";
import { liftedMoves } from "./lifted-oracle.js";

const MODELS: Array<[string, () => Model]> = [
  ["gripper", () => fixtureModel("gripper/domain.pddl", "gripper/four-balls.pddl")],
  ["quay (ADL, costs)", () => fixtureModel("quay/domain.pddl", "quay/yard.pddl")],
  ["workshop (forall/when)", () => fixtureModel("workshop/domain.pddl", "workshop/shift.pddl")],
  ["hanoi 3", () => fixtureModel("hanoi/domain.pddl", hanoiProblem(3))],
  ["blocks 3", () => fixtureModel("blocks/domain.pddl", blocksProblem(3))],
];

describe("ground Task agrees with the lifted model", () => {
  for (const [label, make] of MODELS) {
    for (const relevance of label.startsWith("gripper") ? [false] : [false, true]) {
      it(`${label}${relevance ? " (relevance pruning)" : ""}: same applicable actions, successors, costs, goal`, () => {
        const model = make();
        const task = ground(model, { relevance });
        const synthetic = task.actions.filter((a) => a.synthetic);
        const userFacts = task.facts.map((f, i) => [f, i] as const).filter(([f]) => !f.startsWith("(*"));
        fc.assert(
          fc.property(fc.array(fc.nat(), { maxLength: 14 }), (choices) => {
            let ls = initialState(model);
            let gs = new Set(task.init);
            for (let k = 0; k <= choices.length; k++) {
              // the Task's facts mean what the lifted state says
              for (const [name, id] of userFacts) expect(gs.has(id)).toBe(ls.has(name));
              const goalLifted = holds(model, model.problem.goal, new Map(), ls);
              const goalGround = synthetic.length
                ? synthetic.some((a) => applicable(a, gs))
                : task.goal.every((f) => gs.has(f)) && task.goalNeg.every((f) => !gs.has(f));
              expect(goalGround).toBe(goalLifted);
              const moves = liftedMoves(model, ls);
              const groundApp = task.actions.filter((a) => !a.synthetic && applicable(a, gs));
              if (!relevance) {
                expect(new Set(groundApp.map((a) => a.name))).toEqual(new Set(moves.map((m) => m.name)));
              } else {
                // pruning keeps a subset of the applicable actions
                const liftedNames = new Set(moves.map((m) => m.name));
                for (const a of groundApp) expect(liftedNames.has(a.name)).toBe(true);
              }
              if (k === choices.length) break;
              const pool = relevance ? moves.filter((m) => groundApp.some((a) => a.name === m.name)) : moves;
              if (pool.length === 0) break;
              const m = pool[choices[k] % pool.length];
              // every ground disjunct of that name that applies gives the same successor and cost
              const same = groundApp.filter((a) => a.name === m.name);
              expect(same.length).toBeGreaterThan(0);
              const nexts = same.map((a) => successor(a, gs));
              for (const a of same) expect(a.cost).toBe(m.cost);
              for (const n of nexts) expect([...n].sort((x, y) => x - y)).toEqual([...nexts[0]].sort((x, y) => x - y));
              ls = m.next;
              gs = nexts[0];
            }
          }),
          { numRuns: 25 },
        );
      });
    }
  }
});
