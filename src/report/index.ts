// The report stage's public API: result records, agreement checks, text tables, SVG charts
// and the two HTML pages (bench run, certificate).
export type { RunRecord, RunStatus, AuditStatus, TimelinePoint, BenchMeta } from "./record.js";
export { auditStatusOf } from "./record.js";
export { RUN_STATUSES } from "./record.js";
export { checkAgreement, findingsBanner, type Finding, type FindingKind, type AgreementResult, type InstanceAgreement } from "./agreement.js";
export { coverage, breakdown, tightness, geometricMean, median, type Coverage, type Tightness } from "./summary.js";
export { textSummary, coverageTable, breakdownTable, agreementTable } from "./tables.js";
export { formatTable, formatSeconds, formatBytes } from "./text-table.js";
export { cactusChart, boundsChart, tightnessChart, planTimelineChart } from "./charts.js";
export { standaloneSvg, esc } from "./svg.js";
export { benchReportHtml, benchCharts } from "./bench-report.js";
export { writeBenchReport, type WrittenReport } from "./write-bench.js";
export { certificateReportHtml, flatten } from "./certificate-report.js";
export { readCertificateView, auditViewOf, singleAuditJson, findField, type CertificateView, type AuditView, type AuditCheck, type PlanStepView } from "./certificate-view.js";
export { normaliseTimeline } from "./timeline.js";
export { detectReportDir, type ReportDirKind } from "./detect.js";
export { page, MODEL_CAVEAT } from "./html.js";
export { junitXml, xmlText, type JunitOptions } from "./junit.js";
