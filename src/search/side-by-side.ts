// Human-readable plan comparison: two plans in aligned columns with the first step where
// they differ marked, so a reader sees at a glance where the other plan went its own way.

export interface Column {
  title: string;
  steps: readonly string[];
  /** 1-based step to flag in this column (e.g. the failing step of an invalid plan). */
  flag?: { step: number; note: string };
}

/** First 0-based index where the two step lists differ, or -1 if they are equal. */
export function firstDivergence(a: readonly string[], b: readonly string[]): number {
  const n = Math.max(a.length, b.length);
  for (let i = 0; i < n; i++) if (a[i] !== b[i]) return i;
  return -1;
}

/**
 * Renders one or two columns with step numbers. With two columns, the row of the first
 * divergence is marked with ">>" in the margin.
 */
export function sideBySide(left: Column, right?: Column): string {
  const rows = Math.max(left.steps.length, right?.steps.length ?? 0);
  const numW = Math.max(4, String(rows).length + 1);
  const leftW = Math.max(left.title.length, ...left.steps.map((s) => s.length), 8);
  const div = right ? firstDivergence(left.steps, right.steps) : -1;
  const lines: string[] = [];
  const pad = (s: string, w: number) => s + " ".repeat(Math.max(0, w - s.length));
  const head = `   ${pad("step", numW)} ${pad(left.title, leftW)}${right ? `   ${right.title}` : ""}`;
  lines.push(head.trimEnd());
  lines.push(`   ${"-".repeat(numW)} ${"-".repeat(leftW)}${right ? `   ${"-".repeat(Math.max(right.title.length, 8))}` : ""}`);
  for (let i = 0; i < rows; i++) {
    const mark = i === div ? ">> " : "   ";
    const l = left.steps[i] ?? "";
    const r = right?.steps[i] ?? "";
    let line = `${mark}${pad(String(i + 1), numW)} ${pad(l, leftW)}${right ? `   ${r}` : ""}`;
    if (left.flag && left.flag.step === i + 1) line += `   <- ${left.flag.note}`;
    lines.push(line.trimEnd());
  }
  if (left.flag && left.flag.step > rows) lines.push(`   ${pad("end", numW)} ${left.flag.note}`);
  if (right && div >= 0) lines.push(`(>> marks the first action where the plans differ: action ${div + 1})`);
  if (right && div < 0) lines.push("(the plans are identical)");
  return lines.join("\n");
}
