// Grounded scenario instances (benchmarks/domains, our own invented scenarios) through every
// encoding: the proven optimum at its plan length, and "cheapest within the shortest length"
// where a cheaper plan needs more steps — figures from each scenario's instances.json.
import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { findVariables, pairReachability } from "../../src/analyse/index.js";
import { encodePlanning, extractPlan, STEP_ENCODINGS } from "../../src/encode/index.js";
import { groundFiles } from "../../src/ground/index.js";
import { replayGround } from "../support/reference.js";
import { Oracle } from "./oracle.js";

interface Figures {
  optimalCost: number;
  optimalLength: number;
  shortestLength: number;
  cheapestAtShortestLength: number | null;
}

const tiny: Array<[string, string]> = [
  ["harbour", "problem-01"],
  ["warehouse", "problem-01"],
  ["workshop", "problem-01"],
  ["workshop", "problem-02"],
];

describe("scenario instances", () => {
  for (const [scenario, name] of tiny) {
    it(`${scenario}/${name}: every encoding finds the optimum and no cheaper plan`, () => {
      const dir = `benchmarks/domains/${scenario}`;
      // source: benchmarks/domains/<scenario>/instances.json — Dijkstra on a PDDL-free model of the scenario
      const fig = (JSON.parse(readFileSync(`${dir}/instances.json`, "utf8")) as Record<string, Figures>)[name];
      const { task } = groundFiles(`${dir}/domain.pddl`, `${dir}/${name}.pddl`);
      const groups = findVariables(task, pairReachability(task))
        .variables.map((v) => v.facts)
        .filter((g) => g.length > 1);
      const queries: Array<[number, number | null]> = [[fig.optimalLength, fig.optimalCost]];
      if (fig.cheapestAtShortestLength !== null && fig.shortestLength < fig.optimalLength) queries.push([fig.shortestLength, fig.cheapestAtShortestLength]);
      for (const id of STEP_ENCODINGS) {
        for (const [T, best] of queries) {
          const enc = encodePlanning(task, { encoding: id, steps: T, mutexGroups: id === "forall-1" ? [] : groups });
          const oracle = new Oracle(enc.toCnf());
          // a plan of cost `best` fits in T steps ...
          const model = oracle.solve(enc.boundAssumptions(best!));
          expect(model, `${id} T=${T}`).not.toBeNull();
          const plan = extractPlan(task, enc, model!);
          expect(replayGround(task, plan.plan).ok).toBe(true);
          expect(plan.cost).toBeLessThanOrEqual(best!);
          expect(plan.cost).toBeGreaterThanOrEqual(fig.optimalCost);
          // ... and nothing cheaper: seq-1 is pinned to "cheapest within T actions"; a ∀-step
          // encoding may fit a longer plan into T steps, but never one below the optimum
          const below = id === "seq-1" ? best! - 1 : fig.optimalCost - 1;
          expect(oracle.solve(enc.boundAssumptions(below)), `${id} T=${T} at ${below}`).toBeNull();
        }
      }
    });
  }
});
