// Writes the report files of a bench directory — report.html, the summary charts as .svg
// and the text tables as summary.txt — each atomically, and returns the text summary.
import { join } from "node:path";
import { writeFileAtomic } from "../util/files.js";
import type { BenchMeta, RunRecord } from "./record.js";
import { benchCharts, benchReportHtml } from "./bench-report.js";
import { standaloneSvg } from "./svg.js";
import { textSummary } from "./tables.js";
import type { AgreementResult } from "./agreement.js";

export interface WrittenReport {
  html: string;
  text: string;
  agreement: AgreementResult;
}

export function writeBenchReport(dir: string, records: readonly RunRecord[], meta: BenchMeta): WrittenReport {
  const { text, agreement } = textSummary(records, meta.configurations);
  const charts = benchCharts(records, meta);
  writeFileAtomic(join(dir, "coverage.svg"), standaloneSvg(charts.cactus));
  writeFileAtomic(join(dir, "tightness.svg"), standaloneSvg(charts.tightness));
  writeFileAtomic(join(dir, "summary.txt"), text + "\n");
  const html = join(dir, "report.html");
  writeFileAtomic(html, benchReportHtml(records, meta));
  return { html, text, agreement };
}
