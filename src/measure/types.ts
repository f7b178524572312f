// The shape of one exact graph measure: its value when computed exactly, otherwise the proven
// lower and upper bounds and a note saying which cap stopped the computation.

export interface Measure {
  exact: boolean;
  /** The exact value (null when only bounds are known). */
  value: number | null;
  lower: number;
  /** null when no useful upper bound is known. */
  upper: number | null;
  note?: string;
}

export function exactMeasure(v: number): Measure {
  return { exact: true, value: v, lower: v, upper: v };
}

export function boundedMeasure(lower: number, upper: number | null, note: string): Measure {
  if (upper !== null && upper === lower) return { exact: true, value: lower, lower, upper, note };
  return { exact: false, value: null, lower, upper, note };
}
