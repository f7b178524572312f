// Bound timelines as commands report them — objects with a few spellings of (seconds,
// upper, lower), or [seconds, upper, lower] triples — turned into one sorted shape.
import type { TimelinePoint } from "./record.js";

export const numOrNull = (v: unknown): number | null => (typeof v === "number" && Number.isFinite(v) ? v : null);

function pick(o: Record<string, unknown>, keys: readonly string[]): unknown {
  for (const k of keys) if (k in o) return o[k];
  return undefined;
}

/** Accepts [{seconds, upper, lower}] with a few spellings, or [[seconds, upper, lower]]. */
export function normaliseTimeline(v: unknown): TimelinePoint[] {
  if (!Array.isArray(v)) return [];
  const out: TimelinePoint[] = [];
  for (const e of v) {
    let t: unknown, u: unknown, l: unknown;
    if (Array.isArray(e)) [t, u, l] = e;
    else if (e !== null && typeof e === "object") {
      const o = e as Record<string, unknown>;
      t = pick(o, ["seconds", "t", "time", "elapsed"]);
      u = pick(o, ["upper", "upperBound", "cost", "best"]);
      l = pick(o, ["lower", "lowerBound", "bound"]);
    }
    const seconds = numOrNull(t);
    if (seconds === null) continue;
    out.push({ seconds, upper: numOrNull(u), lower: numOrNull(l) });
  }
  return out.sort((a, b) => a.seconds - b.seconds);
}
