// results.jsonl: one JSON object per finished run, appended as each run ends, so a bench
// that stops half-way keeps what it finished and a re-run skips those runs.
import { appendFileSync, existsSync, readFileSync } from "node:fs";
import { auditStatusOf, type RunRecord } from "../report/record.js";
import { PlumblineError } from "../util/errors.js";
import { writeFileAtomic } from "../util/files.js";

/**
 * Reads a results file. A last line cut off by a crash is dropped (and the file repaired
 * when `repair` is set); any other bad line is an error naming file:line.
 */
export function readResults(file: string, repair = false): RunRecord[] {
  if (!existsSync(file)) return [];
  const text = readFileSync(file, "utf8");
  const lines = text.split("\n");
  const records: RunRecord[] = [];
  let cut = false;
  for (let i = 0; i < lines.length; i++) {
    const line = lines[i];
    if (!line.trim()) continue;
    try {
      const r = JSON.parse(line) as RunRecord;
      // results written before this release used "invalid" and "unknown" for audits
      if (typeof r.audit === "string") r.audit = auditStatusOf(r.audit);
      records.push(r);
    } catch {
      const isLast = i === lines.length - 1 && !text.endsWith("\n");
      if (isLast) {
        cut = true;
        continue;
      }
      throw new PlumblineError("parse", "expected one JSON result object per line", { file, line: i + 1, col: 1 });
    }
  }
  if (cut && repair) writeResults(file, records);
  return records;
}

/** Latest record per run id (a re-run of one id replaces the earlier line's meaning). */
export function latestById(records: readonly RunRecord[]): RunRecord[] {
  const m = new Map<string, RunRecord>();
  for (const r of records) m.set(r.id, r);
  return [...m.values()];
}

export function appendResult(file: string, r: RunRecord): void {
  // one write of one whole line: concurrent appends of small lines do not interleave
  appendFileSync(file, JSON.stringify(r) + "\n");
}

export function writeResults(file: string, records: readonly RunRecord[]): void {
  writeFileAtomic(file, records.map((r) => JSON.stringify(r) + "\n").join(""));
}
