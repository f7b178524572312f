// The warehouse mechanics written directly (no PDDL): the oracle the committed instances'
// optimal costs come from, cross-checked in tests against Dijkstra on the grounded PDDL.
import type { ExplicitModel, Successor } from "../lib/explicit.js";
import type { WarehouseInstance } from "./generate.js";

/** robot cells, then parcel places (cell index, or cells + robot index when carried). */
type State = number[];

export function warehouseModel(w: WarehouseInstance): ExplicitModel<State> {
  const nC = w.cells.length;
  const nR = w.robots.length;
  const C = (i: number) => w.cells[i].name;
  const nbr: number[][] = w.cells.map(() => []);
  for (const [a, b] of w.adjacent) nbr[a].push(b), nbr[b].push(a);
  const beltOut: number[][] = w.cells.map(() => []);
  for (const [a, b] of w.belts) beltOut[a].push(b);
  return {
    init: [...w.robots.map((r) => r.start), ...w.parcels.map((p) => p.start)],
    key: (s) => s.join(","),
    isGoal: (s) => w.parcels.every((p, i) => s[nR + i] === p.goal) && w.robots.every((r, i) => r.goal === null || s[i] === r.goal),
    successors(s) {
      const succ: Successor<State>[] = [];
      const occupied = new Set(s.slice(0, nR));
      const set = (i: number, v: number) => {
        const n = [...s];
        n[i] = v;
        return n;
      };
      for (let r = 0; r < nR; r++) {
        const at = s[r];
        const R = w.robots[r].name;
        for (const to of nbr[at]) if (!occupied.has(to)) succ.push({ action: `(move ${R} ${C(at)} ${C(to)})`, cost: 1, next: set(r, to) });
        const loaded = w.parcels.some((_, p) => s[nR + p] === nC + r);
        for (let p = 0; p < w.parcels.length; p++) {
          const where = s[nR + p];
          if (where === at && !loaded) succ.push({ action: `(pick ${R} ${w.parcels[p].name} ${C(at)})`, cost: 0, next: set(nR + p, nC + r) });
          else if (where === nC + r) succ.push({ action: `(drop ${R} ${w.parcels[p].name} ${C(at)})`, cost: 0, next: set(nR + p, at) });
        }
      }
      for (let p = 0; p < w.parcels.length; p++) {
        const where = s[nR + p];
        if (where < nC) for (const to of beltOut[where]) succ.push({ action: `(convey ${w.parcels[p].name} ${C(where)} ${C(to)})`, cost: 0, next: set(nR + p, to) });
      }
      return succ;
    },
  };
}
