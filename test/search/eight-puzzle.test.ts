// The 8-puzzle built in code: the published maximal distance 31 (confirmed by breadth-first
// search here), A* finding cost-31 plans for it, and easy boards with hand-checked costs.
import { beforeAll, describe, expect, it } from "vitest";
import { astar, gbfs, type AdmissibleHeuristicName } from "../../src/search/index.js";
import { isGoal, replayGround } from "../support/reference.js";
import { bfsDistances, eightPuzzleTask, GOAL, type Board } from "./eight-puzzle.js";

const SLOW = !!process.env.PLUMBLINE_SLOW;

function solvedWith(board: Board, heuristic: AdmissibleHeuristicName): number {
  const task = eightPuzzleTask(board);
  const r = astar(task, { heuristic });
  expect(r.status).toBe("solved");
  const rep = replayGround(task, r.plan!);
  expect(rep.ok && isGoal(task, rep.state)).toBe(true);
  return r.cost!;
}

describe("8-puzzle", () => {
  let dist: Map<Board, number>;
  let farthest: Board[];
  beforeAll(() => {
    dist = bfsDistances(GOAL);
    let max = 0;
    for (const d of dist.values()) max = Math.max(max, d);
    farthest = [...dist].filter(([, d]) => d === max).map(([b]) => b).sort();
  });

  it("has 9!/2 reachable boards, the farthest 31 moves from the goal", () => {
    expect(dist.size).toBe(181440); // source: Johnson & Story 1879 (half of the 9! arrangements are solvable)
    expect(dist.get(farthest[0])).toBe(31); // source: Reinefeld 1993 (maximal distance 31)
    // source: Reinefeld 1993, from memory: exactly two boards at distance 31 for this goal
    expect(farthest).toEqual(["647850321", "867254301"]);
  });

  it("easy boards: hand-checked costs 0, 1 and 2 (Manhattan distance is a matching lower bound)", () => {
    expect(solvedWith("123456780", "landmark-cut")).toBe(0);
    expect(solvedWith("123456708", "landmark-cut")).toBe(1); // tile 8 slides left
    expect(solvedWith("123406758", "landmark-cut")).toBe(2); // 5 slides up, then 8 slides left
    expect(solvedWith("123456078", "max")).toBe(2); // 7 left, then 8 left
  });

  it("A* with landmark-cut matches breadth-first distances on boards 10–20 moves out", () => {
    for (const d of [10, 14, 18, 20]) {
      const board = [...dist].find(([, x]) => x === d)![0];
      expect(solvedWith(board, "landmark-cut")).toBe(d);
    }
  });

  it("A* (blind) solves a board at the maximal distance with cost 31", () => {
    expect(solvedWith(farthest[0], "blind")).toBe(31); // source: Reinefeld 1993
  });

  it.runIf(SLOW)("A* with landmark-cut and with h-max solves both distance-31 boards with cost 31", () => {
    for (const b of farthest) {
      expect(solvedWith(b, "landmark-cut")).toBe(31); // source: Reinefeld 1993
      expect(solvedWith(b, "max")).toBe(31); // source: Reinefeld 1993
    }
  });

  it("GBFS returns a valid plan of odd length for a distance-31 board (parity)", () => {
    const task = eightPuzzleTask(farthest[1]);
    const r = gbfs(task);
    expect(r.status).toBe("solved");
    const rep = replayGround(task, r.plan!);
    expect(rep.ok && isGoal(task, rep.state)).toBe(true);
    // every move changes the blank's square colour, so plan lengths share the parity of 31 (mathematical fact)
    expect(r.plan!.length % 2).toBe(1);
    expect(r.cost!).toBeGreaterThanOrEqual(31);
  });
});
