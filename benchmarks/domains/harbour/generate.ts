// Seeded generator of harbour problems (trucks, cranes, containers, a road network with
// per-road lengths). Usage: npx tsx benchmarks/domains/harbour/generate.ts --help
import { fileURLToPath } from "node:url";
import * as path from "node:path";
import { isMain, runGenerator } from "../lib/cli.js";
import { formatProblem, problemName } from "../lib/pddl-text.js";
import { Rng } from "../lib/rng.js";
import type { Params, Scenario } from "../lib/scenario.js";
import { harbourModel } from "./model.js";

export type SiteKind = "quay" | "yard" | "depot";

export interface HarbourInstance {
  params: Params;
  name: string;
  sites: Array<{ name: string; kind: SiteKind; x: number; y: number }>;
  /** Undirected roads [a, b, length]; the problem lists both directions. */
  roads: Array<[number, number, number]>;
  cranes: Array<{ name: string; site: number }>;
  trucks: Array<{ name: string; start: number; goal: number | null }>;
  containers: Array<{ name: string; start: number; goal: number }>;
}

const dist = (a: { x: number; y: number }, b: { x: number; y: number }) => Math.hypot(a.x - b.x, a.y - b.y);
/** A road's length in cost units: a third of the map distance, at least 2. */
const roadLength = (a: { x: number; y: number }, b: { x: number; y: number }) => Math.max(2, Math.round(dist(a, b) / 3));

export function makeHarbour(p: Params): HarbourInstance {
  const rng = new Rng(p.seed * 7919 + 1);
  const n = p.sites;
  const nQuay = Math.max(1, Math.round(n * 0.35));
  const nDepot = Math.max(1, Math.round(n * 0.35));
  const kinds: SiteKind[] = [];
  for (let i = 0; i < n; i++) kinds.push(i < nQuay ? "quay" : i < n - nDepot ? "yard" : "depot");
  const counter: Record<SiteKind, number> = { quay: 0, yard: 0, depot: 0 };
  // quays sit on the waterfront (low y), depots inland (high y), yards in between
  const band: Record<SiteKind, [number, number]> = { quay: [0, 8], yard: [8, 20], depot: [18, 30] };
  const sites = kinds.map((kind) => ({
    name: `${kind}${++counter[kind]}`,
    kind,
    x: rng.int(0, 30),
    y: rng.int(band[kind][0], band[kind][1]),
  }));

  // a spanning tree (each site joins its nearest earlier site in a random order), then a few
  // extra roads; some extra roads are congested and cost more than their straight-line length
  const roads: Array<[number, number, number]> = [];
  const has = (a: number, b: number) => roads.some(([x, y]) => (x === a && y === b) || (x === b && y === a));
  const order = rng.shuffle([...Array(n).keys()]);
  for (let i = 1; i < n; i++) {
    const a = order[i];
    let best = order[0];
    for (let j = 0; j < i; j++) if (dist(sites[order[j]], sites[a]) < dist(sites[best], sites[a])) best = order[j];
    roads.push([Math.min(a, best), Math.max(a, best), roadLength(sites[a], sites[best])]);
  }
  const extra = Math.floor(n / 2);
  for (let tries = 0, added = 0; added < extra && tries < 50 * n; tries++) {
    const a = rng.int(0, n - 1);
    const b = rng.int(0, n - 1);
    if (a === b || has(a, b)) continue;
    const d = roadLength(sites[a], sites[b]);
    const len = rng.chance(0.5) ? 2 * d + rng.int(0, 2) : d;
    roads.push([Math.min(a, b), Math.max(a, b), len]);
    added++;
  }
  roads.sort((r, s) => r[0] - s[0] || r[1] - s[1]);

  const quays = sites.flatMap((s, i) => (s.kind === "quay" ? [i] : []));
  const depots = sites.flatMap((s, i) => (s.kind === "depot" ? [i] : []));
  const containers: HarbourInstance["containers"] = [];
  for (let c = 0; c < p.containers; c++) {
    // most containers come off a ship at a quay and go inland; some go the other way
    const inbound = rng.chance(0.7);
    const start = inbound ? rng.pick(quays) : rng.pick(depots);
    let goal = inbound ? rng.pick(depots) : rng.pick(quays);
    if (goal === start) goal = rng.pick([...quays, ...depots].filter((s) => s !== start).concat([start]));
    containers.push({ name: `c${c + 1}`, start, goal });
  }
  // cranes at every quay and yard, and wherever a container starts or must end
  const needCrane = new Set<number>();
  sites.forEach((s, i) => {
    if (s.kind !== "depot") needCrane.add(i);
  });
  for (const c of containers) needCrane.add(c.start).add(c.goal);
  const cranes = [...needCrane].sort((a, b) => a - b).map((site, i) => ({ name: `crane${i + 1}`, site }));

  const trucks: HarbourInstance["trucks"] = [];
  for (let t = 0; t < p.trucks; t++) {
    const start = rng.int(0, n - 1);
    trucks.push({ name: `t${t + 1}`, start, goal: t < p.home ? start : null });
  }
  const name = problemName("harbour", p, [["sites", "s"], ["trucks", "t"], ["containers", "c"], ["home", "h"]]);
  return { params: p, name, sites, roads, cranes, trucks, containers };
}

export function harbourPddl(h: HarbourInstance): string {
  const S = (i: number) => h.sites[i].name;
  const init: string[] = [];
  for (const [a, b, len] of h.roads) {
    init.push(`(road ${S(a)} ${S(b)}) (= (road-length ${S(a)} ${S(b)}) ${len})`);
    init.push(`(road ${S(b)} ${S(a)}) (= (road-length ${S(b)} ${S(a)}) ${len})`);
  }
  for (const k of h.cranes) init.push(`(crane-at ${k.name} ${S(k.site)})`);
  for (const t of h.trucks) init.push(`(truck-at ${t.name} ${S(t.start)})`);
  for (const c of h.containers) init.push(`(in ${c.name} ${S(c.start)})`);
  const goal = [
    ...h.containers.map((c) => `(in ${c.name} ${S(c.goal)})`),
    ...h.trucks.filter((t) => t.goal !== null).map((t) => `(truck-at ${t.name} ${S(t.goal!)})`),
  ];
  const ofKind = (k: SiteKind) => h.sites.filter((s) => s.kind === k).map((s) => s.name);
  return formatProblem({
    scenario: "harbour",
    domain: "harbour",
    name: h.name,
    params: h.params,
    objects: [
      ["quay", ofKind("quay")],
      ["yard", ofKind("yard")],
      ["depot", ofKind("depot")],
      ["crane", h.cranes.map((k) => k.name)],
      ["truck", h.trucks.map((t) => t.name)],
      ["container", h.containers.map((c) => c.name)],
    ],
    init,
    goal,
    costs: true,
  });
}

export const harbour: Scenario<HarbourInstance> = {
  name: "harbour",
  summary: "Harbour logistics: trucks drive roads (cost = road length), cranes load and unload for free.",
  dir: path.dirname(fileURLToPath(import.meta.url)),
  params: [
    { name: "sites", help: "number of sites (quays, yards, depots)", min: 2, max: 60 },
    { name: "trucks", help: "number of trucks", min: 1, max: 20 },
    { name: "containers", help: "number of containers to deliver", min: 1, max: 40 },
    { name: "home", help: "how many trucks must end where they started", min: 0, max: 20 },
  ],
  sizes: {
    tiny: { sites: 3, trucks: 1, containers: 1, home: 0 },
    small: { sites: 6, trucks: 2, containers: 3, home: 1 },
    medium: { sites: 8, trucks: 2, containers: 4, home: 1 },
    large: { sites: 14, trucks: 4, containers: 10, home: 2 },
  },
  makeInstance(p) {
    if (p.home > p.trucks) throw new Error(`harbour: --home ${p.home} exceeds --trucks ${p.trucks}`);
    return makeHarbour(p);
  },
  toPddl: harbourPddl,
  model: harbourModel,
};

if (isMain(import.meta.url)) runGenerator(harbour as Scenario, process.argv.slice(2));
