// The 8-puzzle as a ground Task built in code (tiles 1–8 on a 3×3 board, 0 = blank):
// facts "(at tI pJ)" and "(blank pJ)", one unit-cost action per tile move.
import type { Action, Task } from "../../src/ground/task.js";

/** Board as 9 digits row by row, 0 = blank, e.g. "123456780". */
export type Board = string;

export const GOAL: Board = "123456780";

function neighbours(p: number): number[] {
  const r = Math.floor(p / 3);
  const c = p % 3;
  const out: number[] = [];
  if (r > 0) out.push(p - 3);
  if (r < 2) out.push(p + 3);
  if (c > 0) out.push(p - 1);
  if (c < 2) out.push(p + 1);
  return out;
}

export function eightPuzzleTask(start: Board, goal: Board = GOAL): Task {
  const at = (t: number, p: number) => (t - 1) * 9 + p; // facts 0..71
  const blank = (p: number) => 72 + p; // facts 72..80
  const facts: string[] = [];
  for (let t = 1; t <= 8; t++) for (let p = 0; p < 9; p++) facts.push(`(at t${t} p${p})`);
  for (let p = 0; p < 9; p++) facts.push(`(blank p${p})`);
  const state = (b: Board) =>
    [...b].map((ch, p) => (ch === "0" ? blank(p) : at(Number(ch), p))).sort((x, y) => x - y);
  const actions: Action[] = [];
  for (let t = 1; t <= 8; t++) {
    for (let from = 0; from < 9; from++) {
      for (const to of neighbours(from)) {
        actions.push({
          name: `(move t${t} p${from} p${to})`,
          schema: "move",
          args: [`t${t}`, `p${from}`, `p${to}`],
          pre: [at(t, from), blank(to)].sort((x, y) => x - y),
          preNeg: [],
          add: [at(t, to), blank(from)].sort((x, y) => x - y),
          del: [at(t, from), blank(to)].sort((x, y) => x - y),
          cond: [],
          cost: 1,
        });
      }
    }
  }
  return { domainName: "eight-puzzle", problemName: start, facts, init: state(start), goal: state(goal), goalNeg: [], actions, costModel: "unit" };
}

/** Breadth-first distances of every board from `goal` (moves are reversible). */
export function bfsDistances(goal: Board = GOAL): Map<Board, number> {
  const dist = new Map<Board, number>([[goal, 0]]);
  const queue: Board[] = [goal];
  for (let i = 0; i < queue.length; i++) {
    const b = queue[i];
    const z = b.indexOf("0");
    for (const n of neighbours(z)) {
      const arr = [...b];
      arr[z] = arr[n];
      arr[n] = "0";
      const nb = arr.join("");
      if (!dist.has(nb)) {
        dist.set(nb, dist.get(b)! + 1);
        queue.push(nb);
      }
    }
  }
  return dist;
}
