// The bench charts: proven-optimal coverage over time per configuration (cactus / step
// style), upper and lower bounds over time per instance, and horizon tightness.
import type { RunRecord, TimelinePoint } from "./record.js";
import { colourOf, el, pathOf, svgDoc, text, title } from "./svg.js";
import { linearScale, logScale } from "./scale.js";
import { axes, frame, legend, plotX0, plotX1, plotY0, plotY1 } from "./frame.js";
import type { Tightness } from "./summary.js";

/** Number of instances proven optimal within t seconds, per configuration, as a step line. */
export function cactusChart(records: readonly RunRecord[], configurations: readonly string[], timeLimit: number): string {
  const f = frame(720, 320);
  const total = new Set(records.map((r) => r.instance)).size;
  const solvedTimes = records.filter((r) => r.status === "optimal").map((r) => Math.max(r.seconds, 1e-3));
  const tMax = Math.max(timeLimit, ...solvedTimes, 1);
  const tMin = Math.min(0.1, ...solvedTimes);
  const x = logScale(tMin, tMax, plotX0(f), plotX1(f));
  const y = linearScale(0, Math.max(total, 1), plotY0(f), plotY1(f), Math.min(8, Math.max(total, 1)));
  const parts = [axes(f, x, y, "time (seconds, log scale)", "instances proven optimal")];
  const items = configurations.map((c, i) => {
    const times = records.filter((r) => r.configuration === c && r.status === "optimal").map((r) => Math.max(r.seconds, 1e-3)).sort((a, b) => a - b);
    const pts: Array<[number, number]> = [[x(x.domain[0]), y(0)]];
    times.forEach((t, k) => {
      pts.push([x(t), y(k)], [x(t), y(k + 1)]);
    });
    pts.push([x(tMax), y(times.length)]);
    parts.push(el("path", { d: pathOf(pts), class: "series", stroke: colourOf(i) }, title(`${c}: ${times.length} proven optimal`)));
    return { label: `${c} (${times.length})`, colour: colourOf(i) };
  });
  parts.push(el("line", { x1: x(timeLimit), x2: x(timeLimit), y1: plotY1(f), y2: plotY0(f), class: "limit" }, title(`time limit ${timeLimit} s`)));
  parts.push(legend(f, items));
  return svgDoc(f.width, f.height, `proven-optimal coverage over time: ${items.map((i) => i.label).join(", ")} of ${total} instances`, ...parts);
}

interface Series {
  configuration: string;
  colour: string;
  timeline: TimelinePoint[];
  end: number;
}

/** Steps of one bound: the value holds from its event until the next one (nulls skipped). */
function boundSteps(points: readonly TimelinePoint[], key: "upper" | "lower", end: number): Array<[number, number]> {
  const out: Array<[number, number]> = [];
  let last: number | null = null;
  for (const p of points) {
    const v = p[key];
    if (v === null || !Number.isFinite(v)) continue;
    if (last !== null) out.push([p.seconds, last]);
    out.push([p.seconds, v]);
    last = v;
  }
  if (last !== null) out.push([Math.max(end, out[out.length - 1][0]), last]);
  return out;
}

/** Upper (solid) and lower (dashed) bounds over time for one instance, one colour per run. */
export function boundsChart(instance: string, series: ReadonlyArray<{ configuration: string; timeline: TimelinePoint[]; end: number; colour?: string }>, optimum: number | null, size: { width: number; height: number } = { width: 460, height: 240 }): string {
  const f = frame(size.width, size.height, { left: 52, top: 34 });
  const all: Series[] = series.map((s, i) => ({ ...s, colour: s.colour ?? colourOf(i) }));
  const values = all.flatMap((s) => s.timeline.flatMap((p) => [p.upper, p.lower])).filter((v): v is number => v !== null && Number.isFinite(v));
  if (optimum !== null) values.push(optimum);
  const tEnd = Math.max(0.001, ...all.map((s) => s.end), ...all.flatMap((s) => s.timeline.map((p) => p.seconds)));
  const x = linearScale(0, tEnd, plotX0(f), plotX1(f), 5);
  const y = linearScale(Math.min(0, ...values), Math.max(1, ...values), plotY0(f), plotY1(f), 5);
  const parts = [axes(f, x, y, "time (seconds)", "plan cost")];
  if (optimum !== null) parts.push(el("line", { x1: plotX0(f), x2: plotX1(f), y1: y(optimum), y2: y(optimum), class: "optimum" }, title(`proven optimum ${optimum}`)));
  const items: Array<{ label: string; colour: string; dash?: string }> = [];
  for (const s of all) {
    const up = boundSteps(s.timeline, "upper", s.end).map(([t, v]) => [x(t), y(v)] as [number, number]);
    const lo = boundSteps(s.timeline, "lower", s.end).map(([t, v]) => [x(t), y(v)] as [number, number]);
    if (up.length) parts.push(el("path", { d: pathOf(up), class: "series", stroke: s.colour }, title(`${s.configuration}: best plan cost`)));
    if (lo.length) parts.push(el("path", { d: pathOf(lo), class: "series dashed", stroke: s.colour }, title(`${s.configuration}: proven lower bound`)));
    // a dot where a better plan appeared (a lone final answer, as A* gives, gets a larger one)
    let prev: number | null = null;
    const lone = s.timeline.filter((p) => p.upper !== null).length === 1;
    for (const p of s.timeline) {
      if (p.upper === null || !Number.isFinite(p.upper) || p.upper === prev) continue;
      prev = p.upper;
      parts.push(el("circle", { cx: x(p.seconds), cy: y(p.upper), r: lone ? 4.5 : 3, fill: s.colour, stroke: "#fff", "stroke-width": 1 }, title(`${s.configuration} at ${p.seconds.toFixed(2)} s: plan of cost ${p.upper}`)));
    }
    items.push({ label: s.configuration, colour: s.colour });
  }
  items.push({ label: "lower bound", colour: "#666", dash: "5 3" });
  if (optimum !== null) items.push({ label: "optimum", colour: "#999", dash: "2 3" });
  parts.push(legend(f, items));
  return svgDoc(f.width, f.height, `bounds over time for ${instance}`, ...parts);
}

/** Horizon / plan length per run (log scale), sorted, one colour per configuration. */
export function tightnessChart(rows: readonly Tightness[], configurations: readonly string[]): string {
  const f = frame(720, 300, { bottom: 56 });
  const sorted = [...rows].sort((a, b) => a.ratio - b.ratio || a.instance.localeCompare(b.instance));
  const ratios = sorted.map((r) => r.ratio);
  const y = logScale(Math.min(1, ...ratios), Math.max(1, ...ratios), plotY0(f), plotY1(f));
  const n = Math.max(sorted.length, 1);
  const step = (plotX1(f) - plotX0(f)) / n;
  const px = (i: number) => plotX0(f) + step * (i + 0.5);
  const x = Object.assign((v: number) => v, { ticks: [] as number[], domain: [0, n] as [number, number], log: false });
  const parts = [axes(f, x, y, "runs, sorted by ratio", "horizon / plan length (log)", { xTicks: false })];
  parts.push(el("line", { x1: plotX0(f), x2: plotX1(f), y1: y(1), y2: y(1), class: "optimum" }, title("ratio 1: the horizon equals the plan length")));
  sorted.forEach((r, i) => {
    const c = colourOf(Math.max(0, configurations.indexOf(r.configuration)));
    parts.push(el("circle", { cx: px(i), cy: y(r.ratio), r: 4, fill: c }, title(`${r.instance} (${r.configuration}): horizon ${r.horizon}, plan length ${r.planLength}, ratio ${r.ratio.toFixed(2)}`)));
  });
  if (sorted.length === 0) parts.push(el("text", { x: (plotX0(f) + plotX1(f)) / 2, y: (plotY0(f) + plotY1(f)) / 2, class: "empty", "text-anchor": "middle" }, text("no run reported both a horizon and a plan")));
  const used = configurations.filter((c) => sorted.some((r) => r.configuration === c));
  parts.push(legend(f, used.map((c) => ({ label: c, colour: colourOf(configurations.indexOf(c)), marker: true }))));
  return svgDoc(f.width, f.height, `horizon tightness of ${sorted.length} runs`, ...parts);
}

/** The plan as a timeline: one lane per first argument (the actor), one block per step. */
export function planTimelineChart(steps: ReadonlyArray<{ name: string; args: string[]; cost: number }>): string {
  const lanes = [...new Set(steps.map((s) => s.args[0] ?? "(none)"))];
  const schemas = [...new Set(steps.map((s) => s.name))];
  const laneH = 26;
  const left = Math.min(160, 16 + 7 * Math.max(4, ...lanes.map((l) => l.length)));
  const n = Math.max(steps.length, 1);
  const width = Math.max(520, Math.min(1100, left + 24 + n * 26));
  const f = frame(width, 36 + lanes.length * laneH + 60, { left, top: 36, bottom: 44 });
  const x = linearScale(0, n, plotX0(f), plotX1(f), Math.min(10, n));
  const parts: string[] = [];
  parts.push(el("rect", { x: plotX0(f), y: plotY1(f), width: plotX1(f) - plotX0(f), height: plotY0(f) - plotY1(f), class: "plot-bg" }));
  lanes.forEach((l, i) => {
    const ly = plotY1(f) + i * laneH;
    if (i % 2 === 1) parts.push(el("rect", { x: plotX0(f), y: ly, width: plotX1(f) - plotX0(f), height: laneH, class: "lane-alt" }));
    parts.push(el("text", { x: plotX0(f) - 8, y: ly + laneH / 2 + 4, class: "tick", "text-anchor": "end" }, text(l)));
  });
  let cum = 0;
  steps.forEach((s, i) => {
    cum += s.cost;
    const lane = lanes.indexOf(s.args[0] ?? "(none)");
    const bx = x(i);
    const bw = Math.max(2, x(i + 1) - x(i) - 2);
    parts.push(
      el(
        "rect",
        { x: bx + 1, y: plotY1(f) + lane * laneH + 4, width: bw, height: laneH - 8, rx: 3, fill: colourOf(schemas.indexOf(s.name)), class: s.cost === 0 ? "step zero" : "step" },
        title(`action ${i + 1}: (${[s.name, ...s.args].join(" ")}), cost ${s.cost}, total so far ${cum}`),
      ),
    );
  });
  for (const t of x.ticks) {
    if (t > n) continue;
    parts.push(el("text", { x: x(t), y: plotY0(f) + 16, class: "tick", "text-anchor": "middle" }, text(t)));
  }
  parts.push(el("line", { x1: plotX0(f), x2: plotX1(f), y1: plotY0(f), y2: plotY0(f), class: "axis" }));
  parts.push(el("text", { x: (plotX0(f) + plotX1(f)) / 2, y: f.height - 8, class: "axis-title", "text-anchor": "middle" }, text("action number (pale blocks cost nothing)")));
  parts.push(legend(f, schemas.map((s, i) => ({ label: s, colour: colourOf(i), marker: true }))));
  return svgDoc(f.width, f.height, `plan of ${steps.length} steps as a timeline, lanes by first argument`, ...parts);
}

