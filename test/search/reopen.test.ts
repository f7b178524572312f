// A* with an admissible but inconsistent heuristic must re-open a closed state when a
// cheaper path to it appears; without re-opening this hand-built task yields cost 6, not 5.
import { describe, expect, it } from "vitest";
import type { Task } from "../../src/ground/task.js";
import { astarWith, compileTask, SuccessorTree, type StateHeuristic } from "../../src/search/index.js";

// facts: 0 at-s, 1 at-a, 2 at-b, 3 at-g
const act = (name: string, from: number, to: number, cost: number) => ({
  name: `(${name})`, schema: name, args: [], pre: [from], preNeg: [], add: [to], del: [from], cond: [], cost,
});
const task: Task = {
  domainName: "reopen", problemName: "reopen", facts: ["(at-s)", "(at-a)", "(at-b)", "(at-g)"],
  init: [0], goal: [3], goalNeg: [],
  actions: [act("s-a", 0, 1, 1), act("s-b", 0, 2, 3), act("a-b", 1, 2, 1), act("b-g", 2, 3, 3)],
  costModel: "action-costs",
};

/** h(a) = 3 ≤ h*(a) = 4 (admissible) but h(a) > c(a-b) + h(b) = 1 (inconsistent). */
class Inconsistent implements StateHeuristic {
  readonly name = "test-inconsistent";
  readonly admissible = true;
  evaluate(s: Uint32Array, off: number): number {
    return (s[off] & 0b10) !== 0 ? 3 : 0;
  }
}

describe("A* re-opening", () => {
  it("re-opens b and returns the optimal cost 5", () => {
    const ct = compileTask(task);
    const r = astarWith(ct, new SuccessorTree(task), new Inconsistent(), {});
    // hand-checked: s-a, a-b, b-g costs 1 + 1 + 3 = 5; the only other plan s-b, b-g costs 6
    expect(r.cost).toBe(5);
    expect(r.plan).toEqual([0, 2, 3]);
    expect(r.reopened).toBe(1);
  });
});
