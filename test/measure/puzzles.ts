// Classic puzzles built programmatically as ground Tasks (our own encodings): sliding
// 8-puzzle, Towers of Hanoi with three pegs, and blocks world with a single "move" operator.
import type { Action, Task } from "../../src/ground/task.js";

class Builder {
  facts: string[] = [];
  private ids = new Map<string, number>();
  actions: Action[] = [];
  fact(name: string): number {
    let id = this.ids.get(name);
    if (id === undefined) {
      id = this.facts.length;
      this.facts.push(name);
      this.ids.set(name, id);
    }
    return id;
  }
  action(name: string, pre: string[], add: string[], del: string[], cost = 1): void {
    const ids = (xs: string[]) => [...new Set(xs.map((x) => this.fact(x)))].sort((a, b) => a - b);
    const toks = name.replace(/[()]/g, "").split(" ");
    this.actions.push({ name, schema: toks[0], args: toks.slice(1), pre: ids(pre), preNeg: [], add: ids(add), del: ids(del), cond: [], cost });
  }
  task(domain: string, init: string[], goal: string[]): Task {
    const ids = (xs: string[]) => [...new Set(xs.map((x) => this.fact(x)))].sort((a, b) => a - b);
    const initIds = ids(init);
    const goalIds = ids(goal);
    return { domainName: domain, problemName: domain, facts: this.facts, init: initIds, goal: goalIds, goalNeg: [], actions: this.actions, costModel: "unit" };
  }
}

/**
 * 3×3 sliding puzzle; cells c0..c8 row by row. `start` lists the tile in each cell (0 = blank).
 * The goal is 1 2 3 / 4 5 6 / 7 8 _.
 */
export function eightPuzzle(start: number[] = [1, 2, 3, 4, 5, 6, 7, 8, 0]): Task {
  const b = new Builder();
  const adj = (c: number) => [c - 3, c + 3, c % 3 > 0 ? c - 1 : -1, c % 3 < 2 ? c + 1 : -1].filter((d) => d >= 0 && d < 9);
  for (let t = 1; t <= 8; t++)
    for (let from = 0; from < 9; from++)
      for (const to of adj(from)) b.action(`(slide t${t} c${from} c${to})`, [`(at t${t} c${from})`, `(blank c${to})`], [`(at t${t} c${to})`, `(blank c${from})`], [`(at t${t} c${from})`, `(blank c${to})`]);
  const cells = (cfg: number[]) => cfg.map((t, c) => (t === 0 ? `(blank c${c})` : `(at t${t} c${c})`));
  return b.task("eight-puzzle", cells(start), cells([1, 2, 3, 4, 5, 6, 7, 8, 0]));
}

/** Towers of Hanoi with n discs (d1 smallest) on pegs p1..p3, all on p1 initially, goal on p3. */
export function hanoi(n: number): Task {
  const b = new Builder();
  const discs = Array.from({ length: n }, (_, i) => `d${i + 1}`);
  const pegs = ["p1", "p2", "p3"];
  // a disc may rest on a peg or on a larger disc
  const places = (i: number) => [...pegs, ...discs.slice(i + 1)];
  discs.forEach((d, i) => {
    for (const from of places(i))
      for (const to of places(i)) {
        if (from === to) continue;
        b.action(`(move ${d} ${from} ${to})`, [`(on ${d} ${from})`, `(clear ${d})`, `(clear ${to})`], [`(on ${d} ${to})`, `(clear ${from})`], [`(on ${d} ${from})`, `(clear ${to})`]);
      }
  });
  const stack = (peg: string) => discs.map((d, i) => `(on ${d} ${i + 1 < n ? discs[i + 1] : peg})`);
  const init = [...stack("p1"), `(clear ${discs[0]})`, "(clear p2)", "(clear p3)"];
  return b.task("hanoi", init, stack("p3"));
}

/** Blocks world with n blocks, no gripper: move a clear block onto the table or another clear block. */
export function blocksWorld(n: number): Task {
  const b = new Builder();
  const blocks = Array.from({ length: n }, (_, i) => `b${i + 1}`);
  for (const x of blocks) {
    for (const y of blocks) {
      if (x === y) continue;
      b.action(`(move-to-table ${x} ${y})`, [`(on ${x} ${y})`, `(clear ${x})`], [`(ontable ${x})`, `(clear ${y})`], [`(on ${x} ${y})`]);
      b.action(`(move-from-table ${x} ${y})`, [`(ontable ${x})`, `(clear ${x})`, `(clear ${y})`], [`(on ${x} ${y})`], [`(ontable ${x})`, `(clear ${y})`]);
      for (const z of blocks) {
        if (z === x || z === y) continue;
        b.action(`(move ${x} ${y} ${z})`, [`(on ${x} ${y})`, `(clear ${x})`, `(clear ${z})`], [`(on ${x} ${z})`, `(clear ${y})`], [`(on ${x} ${y})`, `(clear ${z})`]);
      }
    }
  }
  const init = blocks.flatMap((x) => [`(ontable ${x})`, `(clear ${x})`]);
  // goal: one tower b1 on b2 on … on bn
  const goal = blocks.slice(0, -1).map((x, i) => `(on ${x} ${blocks[i + 1]})`);
  return b.task("blocks", init, goal);
}
