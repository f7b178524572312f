// Axis scales for the charts: linear and log-10 mappings from data to pixels with "nice"
// tick values (1-2-5 steps, decades), kept separate from drawing so they can be tested.

export interface Scale {
  (v: number): number;
  ticks: number[];
  domain: [number, number];
  log: boolean;
}

/** A step of 1, 2 or 5 × 10^k giving about `count` intervals over `span`. */
export function niceStep(span: number, count: number): number {
  if (!(span > 0)) return 1;
  const raw = span / Math.max(1, count);
  const p = Math.pow(10, Math.floor(Math.log10(raw)));
  const m = raw / p;
  return (m <= 1 ? 1 : m <= 2 ? 2 : m <= 5 ? 5 : 10) * p;
}

export function linearScale(lo: number, hi: number, px0: number, px1: number, tickCount = 5): Scale {
  if (!(hi > lo)) hi = lo + 1;
  const step = niceStep(hi - lo, tickCount);
  const start = Math.floor(lo / step) * step;
  const end = Math.ceil(hi / step) * step;
  const ticks: number[] = [];
  for (let t = start; t <= end + step / 2; t += step) ticks.push(Math.round(t / step) * step);
  const f = ((v: number) => px0 + ((v - start) / (end - start)) * (px1 - px0)) as Scale;
  f.ticks = ticks;
  f.domain = [start, end];
  f.log = false;
  return f;
}

/** Log-10 scale over whole decades covering [lo, hi] (lo > 0). */
export function logScale(lo: number, hi: number, px0: number, px1: number): Scale {
  const a = Math.floor(Math.log10(Math.max(lo, 1e-12)));
  let b = Math.ceil(Math.log10(Math.max(hi, lo)));
  if (b <= a) b = a + 1;
  const ticks: number[] = [];
  for (let k = a; k <= b; k++) ticks.push(Math.pow(10, k));
  const f = ((v: number) => px0 + ((Math.log10(Math.max(v, Math.pow(10, a))) - a) / (b - a)) * (px1 - px0)) as Scale;
  f.ticks = ticks;
  f.domain = [Math.pow(10, a), Math.pow(10, b)];
  f.log = true;
  return f;
}

/** Tick label: integers plainly, decimals trimmed, big/small powers of ten compactly. */
export function tickLabel(v: number): string {
  if (v === 0) return "0";
  const a = Math.abs(v);
  if (a >= 1e5 || a < 1e-3) {
    const k = Math.round(Math.log10(a));
    if (Math.abs(a - Math.pow(10, k)) < 1e-9 * a) return `${v < 0 ? "-" : ""}1e${k}`;
    return v.toExponential(1);
  }
  return String(Number(v.toPrecision(6)));
}
