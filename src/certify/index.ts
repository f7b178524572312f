// The certify stage's public API: write a certificate directory for a proven claim, and
// audit one from scratch (re-derive everything, check the proof with src/proof).
export { writeCertificate, sha256, sha256File, type WrittenCertificate } from "./write.js";
export { auditCertificate, auditVerdict, readCertificateJson, firstDifference, type AuditReport, type AuditCheck, type AuditOptions } from "./audit.js";
export { FORMAT_VERSION, AUDITABLE_FORMAT_VERSIONS, FILES, CAUTION, CNF_FORM, COST_SETTING_KEY, costSettingWords, type CertificateJson } from "./format.js";
export { dratChecker, stateSpaceChecker } from "./proof-check.js";
export { auditMany, auditDirs, bulkExitCode, entryOf, stoppedEarly, workEstimate, GRACE_SECONDS, type BulkEntry, type BulkVerdict, type BulkOptions } from "./bulk.js";
export { discoverCertificates, type Discovered } from "./discover.js";
export { rejudge, type RejudgeResult, type RejudgeVerdict, type RejudgeOptions, type PlanFailure, type ReusedPart } from "./rejudge.js";
export { checkWords, CHECK_WORDS } from "./check-words.js";
