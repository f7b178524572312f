// Verified symmetries of a Task from swapping two objects' names: each is checked to map
// every action onto an action, so it is an automorphism of the state graph; used to compute
// exact eccentricities once per orbit instead of once per state.
import type { Action, Task } from "../ground/task.js";
import { poll } from "../util/limits.js";

export interface Symmetry {
  /** Fact permutation: fact f ↦ perm[f]. */
  perm: Int32Array;
  description: string;
}

function tokens(name: string): string[] {
  return name.replace(/[()]/g, " ").trim().split(/\s+/);
}

function key(xs: readonly number[]): string {
  return [...xs].sort((a, b) => a - b).join(",");
}

function actionKey(a: Action, map: (f: number) => number): string {
  const m = (xs: readonly number[]) => key(xs.map(map));
  const conds = a.cond.map((ce) => `${m(ce.cond)}|${m(ce.condNeg)}|${m(ce.add)}|${m(ce.del)}`).sort();
  return `${a.cost}#${m(a.pre)}#${m(a.preNeg)}#${m(a.add)}#${m(a.del)}#${conds.join(";")}`;
}

/**
 * All swaps of two object names (arguments of facts and actions, with the same role profile)
 * under which the set of ground actions is invariant — same conditions, effects and cost after
 * renaming. The initial state and goal need not be invariant.
 */
export function objectSwaps(task: Task, maxPairs = 5000): Symmetry[] {
  const factTokens = task.facts.map(tokens);
  const actionTokens = task.actions.map((a) => tokens(a.name));
  const factIndex = new Map<string, number>();
  task.facts.forEach((f, i) => factIndex.set(factTokens[i].join(" "), i));
  const actionIndex = new Map<string, number>();
  task.actions.forEach((a, i) => actionIndex.set(actionTokens[i].join(" "), i));
  // role profile of each object: how often it appears at each (predicate, position)
  const roles = new Map<string, Map<string, number>>();
  const note = (toks: string[], kind: string) => {
    for (let p = 1; p < toks.length; p++) {
      let r = roles.get(toks[p]);
      if (!r) roles.set(toks[p], (r = new Map()));
      const k = `${kind}:${toks[0]}/${p}`;
      r.set(k, (r.get(k) ?? 0) + 1);
    }
  };
  factTokens.forEach((t) => note(t, "f"));
  actionTokens.forEach((t) => note(t, "a"));
  const profile = new Map<string, string>();
  for (const [o, r] of roles) profile.set(o, [...r.entries()].sort().map(([k, n]) => `${k}=${n}`).join(" "));
  const objects = [...roles.keys()].sort();
  const out: Symmetry[] = [];
  let tried = 0;
  for (let i = 0; i < objects.length; i++) {
    for (let j = i + 1; j < objects.length; j++) {
      poll("finding symmetries");
      const a = objects[i];
      const b = objects[j];
      if (profile.get(a) !== profile.get(b)) continue;
      if (++tried > maxPairs) return out;
      const swap = (t: string) => (t === a ? b : t === b ? a : t);
      const rename = (toks: string[]) => [toks[0], ...toks.slice(1).map(swap)].join(" ");
      const perm = new Int32Array(task.facts.length);
      let ok = true;
      for (let f = 0; f < task.facts.length && ok; f++) {
        poll("finding symmetries");
        const g = factIndex.get(rename(factTokens[f]));
        if (g === undefined) ok = false;
        else perm[f] = g;
      }
      for (let x = 0; x < task.actions.length && ok; x++) {
        poll("finding symmetries");
        const y = actionIndex.get(rename(actionTokens[x]));
        if (y === undefined || actionKey(task.actions[x], (f) => perm[f]) !== actionKey(task.actions[y], (f) => f)) ok = false;
      }
      if (ok) out.push({ perm, description: `swap ${a} and ${b}` });
    }
  }
  return out;
}

/** Applies a fact permutation to a packed state. */
export function permuteState(perm: Int32Array, s: Uint32Array, out: Uint32Array): Uint32Array {
  out.fill(0);
  for (let w = 0; w < s.length; w++) {
    let x = s[w];
    while (x !== 0) {
      const low = x & -x;
      const g = perm[w * 32 + (31 - Math.clz32(low))];
      out[g >>> 5] |= 1 << (g & 31);
      x ^= low;
    }
  }
  return out;
}

/** Composition: (p ∘ q)(f) = p[q[f]]. */
export function compose(p: Int32Array, q: Int32Array): Int32Array {
  return q.map((f) => p[f]);
}
