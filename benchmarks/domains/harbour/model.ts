// The harbour mechanics written directly (no PDDL): the oracle the committed instances'
// optimal costs come from, cross-checked in tests against Dijkstra on the grounded PDDL.
import type { ExplicitModel, Successor } from "../lib/explicit.js";
import type { HarbourInstance } from "./generate.js";

/** truck positions (site index), then container places (site index, or sites + truck index). */
type State = number[];

export function harbourModel(h: HarbourInstance): ExplicitModel<State> {
  const nS = h.sites.length;
  const nT = h.trucks.length;
  const S = (i: number) => h.sites[i].name;
  const out: Array<Array<[number, number]>> = h.sites.map(() => []);
  for (const [a, b, len] of h.roads) {
    out[a].push([b, len]);
    out[b].push([a, len]);
  }
  const craneAt: string[][] = h.sites.map(() => []);
  for (const k of h.cranes) craneAt[k.site].push(k.name);
  return {
    init: [...h.trucks.map((t) => t.start), ...h.containers.map((c) => c.start)],
    key: (s) => s.join(","),
    isGoal: (s) =>
      h.containers.every((c, i) => s[nT + i] === c.goal) && h.trucks.every((t, i) => t.goal === null || s[i] === t.goal),
    successors(s) {
      const succ: Successor<State>[] = [];
      for (let t = 0; t < nT; t++) {
        const at = s[t];
        for (const [to, len] of out[at]) {
          const next = [...s];
          next[t] = to;
          succ.push({ action: `(drive ${h.trucks[t].name} ${S(at)} ${S(to)})`, cost: len, next });
        }
        const laden = h.containers.some((_, c) => s[nT + c] === nS + t);
        for (const k of craneAt[at]) {
          for (let c = 0; c < h.containers.length; c++) {
            const where = s[nT + c];
            if (where === at && !laden) {
              const next = [...s];
              next[nT + c] = nS + t;
              succ.push({ action: `(load ${k} ${h.containers[c].name} ${h.trucks[t].name} ${S(at)})`, cost: 0, next });
            } else if (where === nS + t) {
              const next = [...s];
              next[nT + c] = at;
              succ.push({ action: `(unload ${k} ${h.containers[c].name} ${h.trucks[t].name} ${S(at)})`, cost: 0, next });
            }
          }
        }
      }
      return succ;
    },
  };
}
