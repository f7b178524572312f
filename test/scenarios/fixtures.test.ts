// The classic puzzle fixtures under test/fixtures/pddl: every plan replays on the lifted model
// with the expected cost, and the grounded tasks have the optimum and the number of reachable
// states that published or hand-derived facts predict (sources beside each number).
import { readFileSync } from "node:fs";
import { join, resolve } from "node:path";
import { describe, expect, it } from "vitest";
import { distances, GOAL } from "../fixtures/pddl/eight-puzzle/bfs.js";
import { hanoiPlanText, hanoiProblem } from "../fixtures/pddl/hanoi/generate.js";
import { groundFiles, type Task } from "../../src/ground/index.js";
import { parsePlan, replayPlan } from "../../src/plan/index.js";
import { optimalCost, reachableStates } from "../support/reference.js";

const SLOW = Boolean(process.env.PLUMBLINE_SLOW);
const FIX = resolve(__dirname, "../fixtures/pddl");

function load(puzzle: string, problem: string): { task: Task; replay: { valid: boolean; cost: number; length: number } } {
  const dir = join(FIX, puzzle);
  const problemPath = join(dir, `${problem}.pddl`);
  const planPath = join(dir, `${problem}.plan`);
  const { model, task } = groundFiles(join(dir, "domain.pddl"), problemPath);
  const replay = replayPlan(model, parsePlan(readFileSync(planPath, "utf8"), planPath), planPath);
  return { task, replay };
}

/** Checks a fixture whose optimum the reference Dijkstra can afford: replay, optimum, states. */
function checkSmall(puzzle: string, problem: string, optimum: number, states: number): void {
  const { task, replay } = load(puzzle, problem);
  expect(task.costModel).toBe("unit");
  expect(replay.valid).toBe(true);
  expect(replay.cost).toBe(optimum);
  expect(replay.length).toBe(optimum);
  expect(optimalCost(task)?.cost).toBe(optimum);
  expect(reachableStates(task)?.length).toBe(states);
}

describe("Towers of Hanoi fixtures", () => {
  for (let n = 1; n <= 5; n++) {
    it(`${n} disc(s): the committed files are the generator's; 2^n - 1 moves, optimal; 3^n states`, () => {
      expect(readFileSync(join(FIX, "hanoi", `problem-${n}.pddl`), "utf8")).toBe(hanoiProblem(n));
      expect(readFileSync(join(FIX, "hanoi", `problem-${n}.plan`), "utf8")).toBe(hanoiPlanText(n));
      // source: standard result (the minimum number of moves is 2^n - 1; every placement of the
      // n discs on 3 pegs, smaller above larger, is reachable: 3^n states)
      checkSmall("hanoi", `problem-${n}`, 2 ** n - 1, 3 ** n);
    });
  }
});

describe("two-hands gripper fixtures", () => {
  // reachable states: 2 robot rooms x (both hands empty: 2^n ball rooms; one hand holding one
  // of n balls: 2 * n * 2^(n-1); both holding distinct balls: n(n-1) * 2^(n-2)) — by counting
  const states = (n: number) => 2 * (2 ** n + 2 * n * 2 ** (n - 1) + n * (n - 1) * 2 ** (n - 2));
  it("4 balls: the 11-step plan is valid and optimal", () => {
    // source: classic benchmark fact, from memory (4 balls, two grippers, two rooms: 11 steps)
    checkSmall("gripper", "problem-4", 11, states(4));
  });
  it("2 and 6 balls: 5 and 17 steps (3n - 1), valid and optimal", () => {
    // source: hand derivation (test/fixtures/pddl/README.md): each ball needs a grab and a
    // release (2n), the robot must cross n - 1 times at least (n/2 loaded trips, n/2 - 1 back)
    checkSmall("gripper", "problem-2", 5, states(2));
    checkSmall("gripper", "problem-6", 17, states(6));
  });
});

describe("block stacking fixtures", () => {
  // reachable states with a one-block hand: towers of n labelled blocks (OEIS A000262:
  // 1, 1, 3, 13, 73, 501) plus one block in the hand over towers of the other n - 1
  const A000262 = [1, 1, 3, 13, 73, 501]; // source: OEIS A000262
  const states = (n: number) => A000262[n] + n * A000262[n - 1];
  // source: hand derivation, test/fixtures/pddl/README.md (every block that must move costs at
  // least a pick-up and a put-down; the plans meet that bound)
  const cases: Array<[string, number, number]> = [
    ["problem-1", 1, 0],
    ["problem-2", 2, 4],
    ["problem-3", 3, 6],
    ["problem-4", 4, 6],
    ["problem-5", 5, 8],
    ["problem-5-table", 5, 8],
  ];
  for (const [problem, n, optimum] of cases) {
    it(`${problem} (${n} blocks): optimum ${optimum}`, () => checkSmall("blocks", problem, optimum, states(n)));
  }
});

describe("sliding-tile (8-puzzle) fixtures", () => {
  it("the puzzle's own breadth-first search: 181,440 configurations, the farthest at 31 slides, two of them", () => {
    const dist = distances();
    // source: Johnson & Story 1879 (half of the 9! configurations are reachable)
    expect(dist.size).toBe(181_440);
    let max = 0;
    for (const d of dist.values()) max = Math.max(max, d);
    const farthest = [...dist].filter(([, d]) => d === max).map(([s]) => s).sort();
    // source: Reinefeld 1993 (8-puzzle, blank in a corner: maximal distance 31, two configurations)
    expect(max).toBe(31);
    expect(farthest.length).toBe(2);
    // from memory: the two are 647/85_/321 and 867/254/3_1
    expect(farthest).toEqual(["647850321", "867254301"]);
    // the committed 31-slide fixture starts at the first of them
    const text = readFileSync(join(FIX, "eight-puzzle", "problem-31.pddl"), "utf8");
    expect(text).toContain("start 647 / 85_ / 321");
    expect(GOAL).toBe("123456780");
  });

  it("2 and 3 slides: valid and optimal", () => {
    // source: hand check — the plan length equals the Manhattan-distance lower bound
    // (123/456/_78: tiles 7 and 8 one square off each; 123/_46/758: tiles 4, 5, 8 one off each)
    for (const [problem, optimum] of [["problem-2", 2], ["problem-3", 3]] as const) {
      const { task, replay } = load("eight-puzzle", problem);
      expect(replay.valid).toBe(true);
      expect(replay.cost).toBe(optimum);
      expect(optimalCost(task)?.cost).toBe(optimum);
    }
  });

  it("12 and 31 slides: the committed plans replay as valid with that cost", () => {
    for (const [problem, cost] of [["problem-12", 12], ["problem-31", 31]] as const) {
      const { replay } = load("eight-puzzle", problem);
      expect(replay.valid).toBe(true);
      expect(replay.cost).toBe(cost);
    }
  });

  it.runIf(SLOW)("12 and 31 slides are optimal on the grounded task; it has 181,440 reachable states", () => {
    const { task } = load("eight-puzzle", "problem-31");
    // source: Johnson & Story 1879 (9!/2 reachable configurations)
    expect(reachableStates(task)?.length).toBe(181_440);
    // source: Reinefeld 1993 (maximal distance 31)
    expect(optimalCost(task)?.cost).toBe(31);
    // source: breadth-first search in test/fixtures/pddl/eight-puzzle/bfs.ts
    expect(optimalCost(load("eight-puzzle", "problem-12").task)?.cost).toBe(12);
  });
});
