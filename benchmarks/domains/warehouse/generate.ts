// Seeded generator of warehouse problems (a grid with racks, robots, parcels, a conveyor to
// the packing station). Usage: npx tsx benchmarks/domains/warehouse/generate.ts --help
import { fileURLToPath } from "node:url";
import * as path from "node:path";
import { isMain, runGenerator } from "../lib/cli.js";
import { formatProblem, problemName } from "../lib/pddl-text.js";
import { Rng } from "../lib/rng.js";
import type { Params, Scenario } from "../lib/scenario.js";
import { warehouseModel } from "./model.js";

export interface WarehouseInstance {
  params: Params;
  name: string;
  /** Open floor cells (racks are left out). */
  cells: Array<{ name: string; x: number; y: number }>;
  /** Undirected neighbour pairs [a, b] with a < b; the problem lists both directions. */
  adjacent: Array<[number, number]>;
  /** Directed conveyor segments, in track order, ending at the station. */
  belts: Array<[number, number]>;
  station: number;
  robots: Array<{ name: string; start: number; goal: number | null }>;
  parcels: Array<{ name: string; start: number; goal: number }>;
}

/** The full conveyor track: along the top row to the right-hand edge, then down to the station (last). */
function trackCells(w: number, h: number): Array<[number, number]> {
  const track: Array<[number, number]> = [];
  for (let x = 0; x < w; x++) track.push([x, 0]);
  for (let y = 1; y < h; y++) track.push([w - 1, y]);
  return track;
}

export function makeWarehouse(p: Params): WarehouseInstance {
  const { width: W, height: H } = p;
  if (p.belt > W + H - 2) throw new Error(`warehouse: --belt ${p.belt} exceeds the track length ${W + H - 2}`);
  const rng = new Rng(p.seed * 15485863 + 3);
  const id = (x: number, y: number) => y * W + x;
  const full = trackCells(W, H);
  // the last `belt` segments of the full track: belt + 1 cells, the station last
  const track = p.belt > 0 ? full.slice(full.length - 1 - p.belt) : [];
  const stationXY: [number, number] = [W - 1, H - 1];
  const keep = new Set([...track.map(([x, y]) => id(x, y)), id(...stationXY)]);

  // racks block interior cells as long as the open floor stays connected
  const open = new Set<number>([...Array(W * H).keys()]);
  const neighbours = (c: number) => {
    const x = c % W;
    const y = Math.floor(c / W);
    return [[x + 1, y], [x - 1, y], [x, y + 1], [x, y - 1]].filter(([a, b]) => a >= 0 && a < W && b >= 0 && b < H).map(([a, b]) => id(a, b));
  };
  const connected = () => {
    const start = [...open][0];
    const seen = new Set([start]);
    const q = [start];
    while (q.length > 0) for (const n of neighbours(q.pop()!)) if (open.has(n) && !seen.has(n)) seen.add(n), q.push(n);
    return seen.size === open.size;
  };
  for (const c of rng.shuffle([...Array(W * H).keys()])) {
    if (W * H - open.size >= p.racks) break;
    if (keep.has(c)) continue;
    open.delete(c);
    if (!connected()) open.add(c);
  }
  const openList = [...open].sort((a, b) => a - b);
  const index = new Map(openList.map((c, i) => [c, i]));
  const cells = openList.map((c) => ({ name: `x${c % W}y${Math.floor(c / W)}`, x: c % W, y: Math.floor(c / W) }));
  const adjacent: Array<[number, number]> = [];
  for (const c of openList) for (const n of neighbours(c)) if (n > c && open.has(n)) adjacent.push([index.get(c)!, index.get(n)!]);
  const station = index.get(id(...stationXY))!;
  const belts: Array<[number, number]> = [];
  const trackIds = track.map(([x, y]) => id(x, y));
  for (let i = 0; i + 1 < trackIds.length; i++) belts.push([index.get(trackIds[i])!, index.get(trackIds[i + 1])!]);

  if (p.robots > cells.length) throw new Error(`warehouse: ${p.robots} robots do not fit on ${cells.length} open cells`);
  const robotStarts = rng.sample([...cells.keys()], p.robots);
  const robots = robotStarts.map((start, i) => ({ name: `robot${i + 1}`, start, goal: i < p.home ? start : null }));
  const nonStation = [...cells.keys()].filter((c) => c !== station);
  const parcels = Array.from({ length: p.parcels }, (_, i) => {
    const start = rng.pick(nonStation);
    // most parcels go to the packing station; some go back to a returns shelf
    let goal = station;
    if (rng.chance(0.25)) goal = rng.pick(nonStation.filter((c) => c !== start));
    return { name: `parcel${i + 1}`, start, goal };
  });
  const name = problemName("warehouse", p, [["width", "w"], ["height", "h"], ["racks", "k"], ["robots", "r"], ["parcels", "p"], ["belt", "b"], ["home", "o"]]);
  return { params: p, name, cells, adjacent, belts, station, robots, parcels };
}

export function warehousePddl(w: WarehouseInstance): string {
  const C = (i: number) => w.cells[i].name;
  const init: string[] = [];
  for (const [a, b] of w.adjacent) init.push(`(adjacent ${C(a)} ${C(b)}) (adjacent ${C(b)} ${C(a)})`);
  for (const [a, b] of w.belts) init.push(`(belt ${C(a)} ${C(b)})`);
  for (const r of w.robots) init.push(`(robot-at ${r.name} ${C(r.start)}) (occupied ${C(r.start)})`);
  for (const p of w.parcels) init.push(`(parcel-at ${p.name} ${C(p.start)})`);
  const goal = [
    ...w.parcels.map((p) => `(parcel-at ${p.name} ${C(p.goal)})`),
    ...w.robots.filter((r) => r.goal !== null).map((r) => `(robot-at ${r.name} ${C(r.goal!)})`),
  ];
  // a picture of the floor for people reading the file
  const { width: W, height: H } = w.params;
  const at = new Map(w.cells.map((c, i) => [`${c.x},${c.y}`, i]));
  const belted = new Set(w.belts.map(([a]) => a));
  const picture: string[] = [];
  for (let y = 0; y < H; y++) {
    let row = "";
    for (let x = 0; x < W; x++) {
      const i = at.get(`${x},${y}`);
      row += i === undefined ? "#" : i === w.station ? "S" : belted.has(i) ? ">" : ".";
    }
    picture.push(`floor: ${row}`);
  }
  return formatProblem({
    scenario: "warehouse",
    domain: "warehouse",
    name: w.name,
    params: w.params,
    notes: [...picture, "(# rack, > conveyor track, S packing station; cell xAyB is column A, row B)"],
    objects: [
      ["cell", w.cells.map((c) => c.name)],
      ["robot", w.robots.map((r) => r.name)],
      ["parcel", w.parcels.map((p) => p.name)],
    ],
    init,
    goal,
    costs: true,
  });
}

export const warehouse: Scenario<WarehouseInstance> = {
  name: "warehouse",
  summary: "Warehouse robots on a grid: moves cost 1; pick, drop and the conveyor are free.",
  dir: path.dirname(fileURLToPath(import.meta.url)),
  params: [
    { name: "width", help: "grid columns", min: 2, max: 20 },
    { name: "height", help: "grid rows", min: 2, max: 20 },
    { name: "racks", help: "cells blocked by storage racks (fewer if the floor would split)", min: 0, max: 200 },
    { name: "robots", help: "number of robots", min: 1, max: 10 },
    { name: "parcels", help: "number of parcels", min: 1, max: 20 },
    { name: "belt", help: "conveyor segments before the station (0 = no conveyor)", min: 0, max: 38 },
    { name: "home", help: "how many robots must end where they started", min: 0, max: 10 },
  ],
  sizes: {
    tiny: { width: 3, height: 2, racks: 0, robots: 1, parcels: 1, belt: 2, home: 0 },
    small: { width: 4, height: 3, racks: 2, robots: 2, parcels: 2, belt: 3, home: 1 },
    medium: { width: 5, height: 4, racks: 3, robots: 2, parcels: 3, belt: 5, home: 1 },
    large: { width: 8, height: 6, racks: 8, robots: 4, parcels: 6, belt: 8, home: 2 },
  },
  makeInstance(p) {
    if (p.home > p.robots) throw new Error(`warehouse: --home ${p.home} exceeds --robots ${p.robots}`);
    return makeWarehouse(p);
  },
  toPddl: warehousePddl,
  model: warehouseModel,
};

if (isMain(import.meta.url)) runGenerator(warehouse as Scenario, process.argv.slice(2));
