// A few lines of SVG/XML writing (escaping, elements, rounded numbers) so charts are built
// by our own code with no plotting library, and always come out well-formed.

/** Escapes text for XML/HTML content and attribute values. */
export function esc(s: string | number): string {
  return String(s).replace(/[&<>"']/g, (c) => ({ "&": "&amp;", "<": "&lt;", ">": "&gt;", '"': "&quot;", "'": "&#39;" })[c] as string);
}

/** A number with at most two decimals (keeps SVG small and stable). */
export function num(x: number): string {
  if (!Number.isFinite(x)) throw new Error(`non-finite coordinate ${x}`);
  const r = Math.round(x * 100) / 100;
  return Object.is(r, -0) ? "0" : String(r);
}

export type Attrs = Record<string, string | number | undefined | null>;

function attrText(attrs: Attrs): string {
  let s = "";
  for (const [k, v] of Object.entries(attrs)) {
    if (v === undefined || v === null) continue;
    s += ` ${k}="${esc(typeof v === "number" ? num(v) : v)}"`;
  }
  return s;
}

/** An element; `children` is already-escaped markup (use `text()` for plain text). */
export function el(tag: string, attrs: Attrs = {}, ...children: string[]): string {
  const inner = children.join("");
  return inner === "" ? `<${tag}${attrText(attrs)}/>` : `<${tag}${attrText(attrs)}>${inner}</${tag}>`;
}

export const text = (s: string | number): string => esc(s);

/** A tooltip (shown on hover by browsers). */
export const title = (s: string): string => `<title>${esc(s)}</title>`;

/** A polyline path "M x y L x y ..." from points. */
export function pathOf(points: ReadonlyArray<readonly [number, number]>): string {
  return points.map(([x, y], i) => `${i === 0 ? "M" : "L"}${num(x)} ${num(y)}`).join(" ");
}

/**
 * Outer <svg> with a viewBox, a label for screen readers and responsive width. Inline SVG in
 * HTML needs no namespace attribute, so charts carry none; `standalone` adds it for .svg files.
 */
export function svgDoc(width: number, height: number, label: string, ...children: string[]): string {
  return el(
    "svg",
    { viewBox: `0 0 ${num(width)} ${num(height)}`, width: num(width), height: num(height), role: "img", "aria-label": label, class: "chart" },
    title(label),
    ...children,
  );
}

/** Colour-blind-safe palette (Okabe & Ito 2008), then greys. */
export const PALETTE = ["#0072B2", "#D55E00", "#009E73", "#CC79A7", "#E69F00", "#56B4E9", "#000000", "#999999"];

export function colourOf(index: number): string {
  return PALETTE[index % PALETTE.length];
}

/** Chart styles, shared by the HTML page and stand-alone .svg files. */
export const CHART_CSS = `
svg.chart { max-width:100%; height:auto; display:block; font-family:system-ui,-apple-system,"Segoe UI",Roboto,"DejaVu Sans",sans-serif; }
svg .plot-bg { fill:#fbfcfe; stroke:none; } svg .lane-alt { fill:#f1f4f8; }
svg .grid { stroke:#e3e7ee; stroke-width:1; } svg .axis { stroke:#8a93a3; stroke-width:1; }
svg .tick { fill:#5b6475; font-size:11px; } svg .axis-title { fill:#3b4354; font-size:12px; } svg .legend { fill:#1d2330; font-size:12px; }
svg .series { fill:none; stroke-width:2.2; stroke-linejoin:round; } svg .dashed { stroke-dasharray:5 3; stroke-width:1.8; }
svg .optimum { stroke:#999; stroke-dasharray:2 3; stroke-width:1.2; } svg .limit { stroke:#b3261e; stroke-dasharray:4 4; stroke-width:1; }
svg .step { stroke:#fff; stroke-width:.5; } svg .step.zero { opacity:.35; stroke:#333; stroke-dasharray:2 2; }
svg .empty { fill:#8a93a3; font-size:13px; }
`;

/** A chart as a stand-alone .svg file: XML declaration, the SVG namespace and its styles. */
export function standaloneSvg(svg: string): string {
  const withNs = svg.replace(/^<svg /, '<svg xmlns="http://www.w3.org/2000/svg" ');
  const styled = withNs.replace(/^(<svg[^>]*>)/, `$1<style>${CHART_CSS.replace(/&/g, "&amp;").replace(/</g, "&lt;")}</style>`);
  return `<?xml version="1.0" encoding="UTF-8"?>\n${styled}\n`;
}
