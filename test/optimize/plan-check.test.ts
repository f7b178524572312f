// Plan post-processing and validation: redundant actions are dropped without losing validity
// or raising the cost, and a plan that fails on the lifted model is an internal error.
import * as path from "node:path";
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { groundFiles, planCost } from "../../src/ground/index.js";
import { checkPlan, dropRedundant, InternalError } from "../../src/optimize/index.js";
import { actionNamesToIndices, parsePlan } from "../../src/plan/index.js";
import { replayGround } from "../support/reference.js";

const root = path.resolve(import.meta.dirname, "../..");
const H = (f: string) => path.join(root, "benchmarks/domains/harbour", f);

describe("dropRedundant", () => {
  const { model, task } = groundFiles(H("domain.pddl"), H("problem-01.pddl"));
  // a valid plan of cost 20 with two idle load/unload pairs (a SAT model of horizon 11 had them)
  const padded = parsePlan(
    [
      "(drive t1 quay1 yard1)",
      "(drive t1 yard1 depot1)",
      "(load crane3 c1 t1 depot1)",
      "(unload crane3 c1 t1 depot1)",
      "(load crane3 c1 t1 depot1)",
      "(unload crane3 c1 t1 depot1)",
      "(load crane3 c1 t1 depot1)",
      "(drive t1 depot1 yard1)",
      "(drive t1 yard1 quay1)",
      "(unload crane1 c1 t1 quay1)",
    ].join("\n"),
    "padded",
  );
  const ids = actionNamesToIndices(task, padded);

  it("removes idle pairs: the harbour plan shrinks to the 6 actions of the recorded optimum", () => {
    const out = dropRedundant(task, ids);
    // source: benchmarks/domains/harbour/instances.json (optimal length 6, cost 20)
    expect(out).toHaveLength(6);
    expect(planCost(task, out)).toBe(20);
    expect(checkPlan(model, task, out, "test").cost).toBe(20);
  });

  it("keeps the plan valid with no higher cost whatever idle pairs are inserted", () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 4 }), (extra) => {
        // insert `extra` idle unload/load pairs after the first load
        const pair = actionNamesToIndices(task, parsePlan("(unload crane3 c1 t1 depot1)\n(load crane3 c1 t1 depot1)", "p"), {});
        const plan = [...ids.slice(0, 3), ...Array.from({ length: extra }, () => pair).flat(), ...ids.slice(3)];
        const out = dropRedundant(task, plan);
        const r = replayGround(task, out);
        expect(r.ok).toBe(true);
        expect(planCost(task, out)).toBeLessThanOrEqual(planCost(task, plan));
      }),
    );
  });

  it("a plan that does not reach the goal is an internal error, never a result", () => {
    expect(() => checkPlan(model, task, ids.slice(0, 3), "test")).toThrow(InternalError);
  });
});
