// The common parts of every chart: plot area, grid lines, axis ticks and titles, and a
// legend row, so each chart only maps its data to points.
import { el, esc, num, text } from "./svg.js";
import { tickLabel, type Scale } from "./scale.js";

export interface Frame {
  width: number;
  height: number;
  left: number;
  right: number;
  top: number;
  bottom: number;
}

export function frame(width: number, height: number, opts: Partial<Omit<Frame, "width" | "height">> = {}): Frame {
  return { width, height, left: opts.left ?? 60, right: opts.right ?? 18, top: opts.top ?? 36, bottom: opts.bottom ?? 46 };
}

export const plotX0 = (f: Frame) => f.left;
export const plotX1 = (f: Frame) => f.width - f.right;
export const plotY0 = (f: Frame) => f.height - f.bottom; // bottom (value axis origin)
export const plotY1 = (f: Frame) => f.top;

/** Grid lines, ticks and labels for both axes, and the axis titles. */
export function axes(f: Frame, x: Scale, y: Scale, xTitle: string, yTitle: string, opts: { xTicks?: boolean } = {}): string {
  const parts: string[] = [];
  const x0 = plotX0(f), x1 = plotX1(f), y0 = plotY0(f), y1 = plotY1(f);
  parts.push(el("rect", { x: x0, y: y1, width: x1 - x0, height: y0 - y1, class: "plot-bg" }));
  for (const t of y.ticks) {
    const py = y(t);
    parts.push(el("line", { x1: x0, x2: x1, y1: py, y2: py, class: "grid" }));
    parts.push(el("text", { x: x0 - 6, y: py + 4, class: "tick", "text-anchor": "end" }, text(tickLabel(t))));
  }
  if (opts.xTicks !== false) {
    for (const t of x.ticks) {
      const px = x(t);
      parts.push(el("line", { x1: px, x2: px, y1: y1, y2: y0, class: "grid" }));
      parts.push(el("text", { x: px, y: y0 + 16, class: "tick", "text-anchor": "middle" }, text(tickLabel(t))));
    }
  }
  parts.push(el("line", { x1: x0, x2: x1, y1: y0, y2: y0, class: "axis" }));
  parts.push(el("line", { x1: x0, x2: x0, y1: y1, y2: y0, class: "axis" }));
  parts.push(el("text", { x: (x0 + x1) / 2, y: f.height - 8, class: "axis-title", "text-anchor": "middle" }, text(xTitle)));
  parts.push(el("text", { x: 14, y: (y0 + y1) / 2, class: "axis-title", "text-anchor": "middle", transform: `rotate(-90 14 ${num((y0 + y1) / 2)})` }, text(yTitle)));
  return parts.join("");
}

export interface LegendItem {
  label: string;
  colour: string;
  dash?: string;
  marker?: boolean;
}

/** One row of legend entries along the top edge. */
export function legend(f: Frame, items: readonly LegendItem[]): string {
  const parts: string[] = [];
  let x = f.left;
  const y = 16;
  for (const it of items) {
    if (it.marker) parts.push(el("circle", { cx: x + 9, cy: y - 4, r: 4, fill: it.colour }));
    else parts.push(el("line", { x1: x, x2: x + 18, y1: y - 4, y2: y - 4, stroke: it.colour, "stroke-width": 2.5, "stroke-dasharray": it.dash }));
    parts.push(el("text", { x: x + 24, y, class: "legend" }, esc(it.label)));
    x += 34 + it.label.length * 6.6;
  }
  return parts.join("");
}
