// Plain-text tables for the terminal (bench and report print them): columns padded to
// their widest cell, numbers right-aligned, so a person can read results without a browser.

export type Align = "left" | "right";

export interface TextTable {
  headers: string[];
  rows: string[][];
  /** Per column; default: left for the first column, right for the others. */
  align?: Align[];
}

export function formatTable(t: TextTable): string {
  const cols = t.headers.length;
  const width = t.headers.map((h, c) => Math.max(h.length, ...t.rows.map((r) => (r[c] ?? "").length)));
  const align = (c: number): Align => t.align?.[c] ?? (c === 0 ? "left" : "right");
  const line = (cells: string[]) =>
    cells
      .slice(0, cols)
      .map((s, c) => (align(c) === "left" ? s.padEnd(width[c]) : s.padStart(width[c])))
      .join("  ")
      .trimEnd();
  const rule = width.map((w) => "-".repeat(w)).join("  ");
  return [line(t.headers), rule, ...t.rows.map((r) => line(r.map((x) => x ?? "")))].join("\n");
}

/** Seconds as a short human string: 0.42 s, 12.3 s, 4 min 05 s. */
export function formatSeconds(s: number | null): string {
  if (s === null || !Number.isFinite(s)) return "–";
  if (s < 10) return `${s.toFixed(2)} s`;
  if (s < 120) return `${s.toFixed(1)} s`;
  const m = Math.floor(s / 60);
  return `${m} min ${String(Math.round(s - m * 60)).padStart(2, "0")} s`;
}

/** Bytes as B / kB / MB with one decimal. */
export function formatBytes(b: number | null): string {
  if (b === null || !Number.isFinite(b)) return "–";
  if (b < 1024) return `${b} B`;
  if (b < 1024 * 1024) return `${(b / 1024).toFixed(1)} kB`;
  return `${(b / 1048576).toFixed(1)} MB`;
}

export const dash = (v: number | null | undefined): string => (v === null || v === undefined ? "–" : String(v));
