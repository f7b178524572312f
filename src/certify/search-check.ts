// The audit's check of a recorded A* search (claim "landmark-search"): plain successor generation
// and plain relaxed reachability, sharing no code with src/search, confirm "no plan costs less".
import type { Task } from "../ground/index.js";
import { poll } from "../util/limits.js";

export interface SearchCheck {
  valid: boolean;
  /** Why not (the first problem found), when not valid. */
  reason?: string;
  states: number;
  expanded: number;
}

interface Entry {
  facts: number[];
  g: number;
  expanded: boolean;
  landmarks?: { actions: number[]; cost: number }[] | "dead";
}

/** Relaxed operators (positive conditions only): one per action, one per conditional effect. */
interface Relaxed {
  pre: number[][];
  add: number[][];
  action: number[];
  /** Operators per fact in their precondition. */
  users: number[][];
}

function relaxedOf(task: Task): Relaxed {
  const r: Relaxed = { pre: [], add: [], action: [], users: task.facts.map(() => []) };
  task.actions.forEach((a, i) => {
    const ops: [number[], number[]][] = [[[...new Set(a.pre)], a.add]];
    for (const ce of a.cond) ops.push([[...new Set([...a.pre, ...ce.cond])], ce.add]);
    for (const [pre, add] of ops) {
      const k = r.pre.length;
      r.pre.push(pre);
      r.add.push([...add]);
      r.action.push(i);
      for (const f of pre) r.users[f].push(k);
    }
  });
  return r;
}

/** Can the positive goal be reached from `facts`, ignoring deletes and negative conditions, without the actions in `banned`? */
function relaxedReachable(task: Task, r: Relaxed, facts: readonly number[], banned: Uint8Array, missing: Int32Array, have: Uint8Array, queue: Int32Array): boolean {
  have.fill(0);
  for (let k = 0; k < r.pre.length; k++) missing[k] = r.pre[k].length;
  let n = 0;
  const reach = (f: number) => {
    if (!have[f]) {
      have[f] = 1;
      queue[n++] = f;
    }
  };
  for (const f of facts) reach(f);
  const fire = (k: number) => {
    if (banned[r.action[k]]) return;
    for (const f of r.add[k]) reach(f);
  };
  for (let k = 0; k < r.pre.length; k++) if (missing[k] === 0) fire(k);
  for (let i = 0; i < n; i++) {
    for (const k of r.users[queue[i]]) if (--missing[k] === 0) fire(k);
  }
  return task.goal.every((g) => have[g] === 1);
}

const keyOf = (facts: readonly number[]) => facts.join(",");

/**
 * Confirms that no plan of `task` costs less than `bound`, from a record of the search: the
 * initial state is recorded at cost 0; every expanded state is not a goal cheaper than the bound
 * and has every successor recorded at most g + cost(a) away; every other state justifies
 * g + (its landmark costs) ≥ bound — each listed set a landmark from that state (the goal is
 * unreachable even ignoring deletes without its actions), the costs a partition of the action
 * costs — or is a dead end. Walking any plan from the start, its states stay recorded at no more
 * than the cost so far until one is not expanded; there its remaining cost is at least the
 * landmark sum; so the plan costs at least the bound.
 */
export function checkSearchRecord(task: Task, bound: number, raw: unknown): SearchCheck {
  const out: SearchCheck = { valid: false, states: 0, expanded: 0 };
  const fail = (reason: string): SearchCheck => ({ ...out, valid: false, reason });
  if (!Array.isArray(raw)) return fail("the record holds no list of states");
  const nF = task.facts.length;
  const nA = task.actions.length;
  const entries = raw as Entry[];
  const index = new Map<string, number>();
  for (let i = 0; i < entries.length; i++) {
    const e = entries[i];
    if (!e || !Array.isArray(e.facts) || typeof e.g !== "number" || !Number.isFinite(e.g) || e.g < 0 || typeof e.expanded !== "boolean") return fail(`state ${i}: malformed`);
    for (let j = 0; j < e.facts.length; j++) {
      const f = e.facts[j];
      if (!Number.isInteger(f) || f < 0 || f >= nF || (j > 0 && e.facts[j - 1] >= f)) return fail(`state ${i}: facts must be ascending ids 0..${nF - 1}`);
    }
    const k = keyOf(e.facts);
    if (index.has(k)) return fail(`state ${i} is recorded twice`);
    index.set(k, i);
  }
  out.states = entries.length;
  const init = index.get(keyOf([...task.init].sort((x, y) => x - y)));
  if (init === undefined || entries[init].g !== 0) return fail("the initial state is not recorded at cost 0");
  const r = relaxedOf(task);
  const banned = new Uint8Array(nA);
  const missing = new Int32Array(r.pre.length);
  const have = new Uint8Array(nF);
  const queue = new Int32Array(nF);
  const s = new Uint8Array(nF);
  const next = new Uint8Array(nF);
  for (let i = 0; i < entries.length; i++) {
    poll("checking the search record");
    const e = entries[i];
    s.fill(0);
    for (const f of e.facts) s[f] = 1;
    const goal = task.goal.every((f) => s[f] === 1) && task.goalNeg.every((f) => s[f] === 0);
    if (goal && e.g < bound) return fail(`state ${i} satisfies the goal at cost ${e.g} < ${bound}: a cheaper plan exists`);
    if (e.expanded) {
      out.expanded++;
      for (let a = 0; a < nA; a++) {
        const act = task.actions[a];
        if (!act.pre.every((f) => s[f] === 1) || !act.preNeg.every((f) => s[f] === 0)) continue;
        next.set(s);
        const fired = act.cond.filter((ce) => ce.cond.every((f) => s[f] === 1) && ce.condNeg.every((f) => s[f] === 0));
        for (const f of act.del) next[f] = 0;
        for (const ce of fired) for (const f of ce.del) next[f] = 0;
        for (const f of act.add) next[f] = 1;
        for (const ce of fired) for (const f of ce.add) next[f] = 1;
        const facts: number[] = [];
        for (let f = 0; f < nF; f++) if (next[f]) facts.push(f);
        const j = index.get(keyOf(facts));
        if (j === undefined) return fail(`state ${i} is marked expanded, but its successor by ${act.name} is not recorded`);
        if (entries[j].g > e.g + act.cost) return fail(`state ${i}'s successor by ${act.name} is recorded at cost ${entries[j].g} > ${e.g} + ${act.cost}`);
      }
      continue;
    }
    const lms = e.landmarks;
    if (lms === "dead") {
      banned.fill(0);
      if (relaxedReachable(task, r, e.facts, banned, missing, have, queue)) return fail(`state ${i} is recorded as a dead end, but the goal is reachable from it ignoring deletes`);
      continue;
    }
    if (!Array.isArray(lms)) return fail(`state ${i} is neither expanded nor justified by landmarks`);
    const charged = new Float64Array(nA);
    let sum = 0;
    for (let l = 0; l < lms.length; l++) {
      const lm = lms[l];
      if (!lm || !Array.isArray(lm.actions) || typeof lm.cost !== "number" || !(lm.cost >= 0) || !Number.isFinite(lm.cost)) return fail(`state ${i}, landmark ${l}: malformed`);
      banned.fill(0);
      for (const a of lm.actions) {
        if (!Number.isInteger(a) || a < 0 || a >= nA || banned[a]) return fail(`state ${i}, landmark ${l}: bad or repeated action ${String(a)}`);
        banned[a] = 1;
        charged[a] += lm.cost;
      }
      if (relaxedReachable(task, r, e.facts, banned, missing, have, queue)) return fail(`state ${i}, landmark ${l}: the goal is reachable from the state without its actions (not a landmark)`);
      sum += lm.cost;
    }
    for (let a = 0; a < nA; a++) if (charged[a] > task.actions[a].cost) return fail(`state ${i}: its landmarks charge ${task.actions[a].name} ${charged[a]}, more than its cost ${task.actions[a].cost}`);
    if (e.g + sum < bound) return fail(`state ${i}: cost ${e.g} + landmarks ${sum} < ${bound}: a cheaper plan through it is not ruled out`);
  }
  return { ...out, valid: true };
}
