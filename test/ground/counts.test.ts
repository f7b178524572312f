// Grounding sizes that can be derived by hand (Towers of Hanoi, gripper, blocks world),
// and task-level facts known from outside: optimal Hanoi cost 2^n − 1, gripper's 11 steps,
// and the number of blocks-world states (OEIS A000262).
import { describe, expect, it } from "vitest";
import { ground } from "../../src/ground/index.js";
import { optimalCost, reachableStates } from "../support/reference.js";
import { blocksProblem, fixtureModel, hanoiProblem } from "../fixtures/frontend/problems.js";

describe("Towers of Hanoi, n discs on 3 pegs", () => {
  for (const n of [1, 2, 3, 4, 5]) {
    it(`n = ${n}: facts and actions as derived by hand`, () => {
      const task = ground(fixtureModel("hanoi/domain.pddl", hanoiProblem(n)));
      // Derivation (by hand): disc d_i (1 = smallest) can sit on the 3 pegs and on the n − i larger
      // discs, so there are Σ_i (3 + n − i) = 3n + n(n−1)/2 facts (on d_i x). (clear x) exists for the
      // 3 pegs and the n discs, but (clear d1) is true initially and nothing can ever be put on the
      // smallest disc, so it is constant and folded away: n + 3 − 1 clear facts. `smaller` is static.
      const facts = 3 * n + (n * (n - 1)) / 2 + (n - 1) + 3;
      // (move d_i from to) needs from ≠ to, both among the 3 + n − i places d_i may sit on, and all
      // such moves are relaxed-reachable: Σ_{k=0}^{n−1} (k + 3)(k + 2) ground actions.
      let actions = 0;
      for (let k = 0; k < n; k++) actions += (k + 3) * (k + 2);
      expect(task.facts.length).toBe(facts);
      expect(task.actions.length).toBe(actions);
      expect(task.costModel).toBe("unit");
      expect(task.actions.every((a) => a.cost === 1)).toBe(true);
      expect(task.facts.some((f) => f.startsWith("(smaller"))).toBe(false);
      expect(task.facts).not.toContain("(clear d1)");
      // source: standard result — the optimal solution has 2^n − 1 moves
      if (n <= 4) expect(optimalCost(task)?.cost).toBe(2 ** n - 1);
      // source: standard result — every placement of n discs on 3 pegs (smaller on larger) is reachable: 3^n states
      if (n <= 4) expect(reachableStates(task)?.length).toBe(3 ** n);
    });
  }
});

describe("gripper: 2 grippers, 4 balls, 2 rooms", () => {
  it("20 facts, 36 actions, optimal plan 11 steps", () => {
    const task = ground(fixtureModel("gripper/domain.pddl", "gripper/four-balls.pddl"));
    // Derivation (by hand): (at-robby r) 2 + (at b r) 4·2 + (free g) 2 + (carry b g) 4·2 = 20 facts;
    // the type predicates room/ball/gripper are static and fold away.
    expect(task.facts.length).toBe(20);
    // (move from to) 2·2 (from = to is allowed by this domain) + (pick b r g) 4·2·2 + (drop b r g) 4·2·2 = 36.
    expect(task.actions.length).toBe(36);
    // source: classic benchmark fact, from memory — 4 balls need 11 steps with two grippers
    expect(optimalCost(task)).toEqual({ cost: 11, length: 11 });
  });
});

describe("blocks world without an arm", () => {
  for (const [n, states] of [
    [3, 13],
    [4, 73],
  ] as const) {
    it(`${n} blocks: counts by hand, ${states} reachable states`, () => {
      const task = ground(fixtureModel("blocks/domain.pddl", blocksProblem(n)));
      // Derivation (by hand): (on x y) for x ≠ y: n(n−1); (on-table x): n; (clear x): n.
      expect(task.facts.length).toBe(n * (n - 1) + 2 * n);
      // (block-to-block x from to): x ≠ from (no (on x x) is ever added), x ≠ to (equality), from = to
      // is relaxed-reachable: n(n−1)²; (table-to-block x to): n(n−1); (block-to-table x from): n(n−1).
      expect(task.actions.length).toBe(n * (n - 1) ** 2 + 2 * n * (n - 1));
      // source: OEIS A000262 (sets of lists: every arrangement of n labelled blocks into towers)
      expect(reachableStates(task)?.length).toBe(states);
      // source: common practice, no source — building a tower of n blocks from the table takes n − 1 moves
      expect(optimalCost(task)?.cost).toBe(n - 1);
    });
  }
});
