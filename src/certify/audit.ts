// The auditor: trusts nothing in a certificate directory but the input files. Re-parses,
// re-grounds, replays the plan, recomputes the horizon and the CNF, and checks the proof.
import * as fs from "node:fs";
import * as path from "node:path";
import { gunzipSync } from "node:zlib";
import { checkParts, COST_ENCODINGS, provesAtAnyHorizon, STEP_ENCODINGS, type CostEncodingId, type PartId, type PartParams, type StepEncodingId } from "../encode/index.js";
import { ground, type Task } from "../ground/index.js";
import { horizonReportJson } from "../horizon/index.js";
import { boundSettings, canonicalCnfSha256, checkerCnf, costSetting, formulaId, planningPipeline, type FormulaSpec, type PlanningPipeline } from "../optimize/index.js";
import { modelFromTexts, type Model } from "../pddl/index.js";
import { parsePlan, replayPlan } from "../plan/index.js";
import { checkDrat } from "../proof/index.js";
import { checkLandmarkCertificate, relaxedReachableWithout, type LandmarkRecord } from "../search/index.js";
import { PlumblineError } from "../util/errors.js";
import { isLimitReached, withLimits, type LimitReached } from "../util/limits.js";
import { AUDITABLE_FORMAT_VERSIONS, COST_SETTING_KEY, costSettingWords, FILES, FORMAT_VERSION, type CertificateJson } from "./format.js";
import { checkInformational, type Recomputed } from "./informational.js";
import { inTodaysWords } from "./older-names.js";
import { exactSearchOnce, REDERIVE_WORK, rederive } from "./rederive.js";
import { checkSearchRecord } from "./search-check.js";
import { sha256 } from "./write.js";

export interface AuditCheck {
  /** Stable name (tests and reports rely on it). */
  name: string;
  ok: boolean;
  detail: string;
  /** True when the check could not run because an earlier one failed. */
  skipped?: boolean;
  /** True when a limit (time, memory, interrupt) stopped the audit at this check: neither passed nor failed. */
  stopped?: boolean;
}

export interface AuditReport {
  valid: boolean;
  /** False when a limit stopped the audit before any check failed and before every check ran: verdict "not finished", never "rejected". */
  finished: boolean;
  dir: string;
  claim: { status: string; how: string } | null;
  cost: number | null;
  checks: AuditCheck[];
  seconds: number;
}

export interface AuditOptions {
  /** Absolute deadline for the proof check (Date.now() ms). */
  deadline?: number;
  signal?: AbortSignal;
}

class Checks {
  readonly list: AuditCheck[] = [];
  pass(name: string, detail: string): void {
    this.list.push({ name, ok: true, detail });
  }
  fail(name: string, detail: string): void {
    this.list.push({ name, ok: false, detail });
  }
  skip(name: string, why: string): void {
    this.list.push({ name, ok: false, detail: `not checked: ${why}`, skipped: true });
  }
  stop(name: string, e: LimitReached): void {
    this.list.push({ name, ok: false, detail: `not finished: ${e.message}`, stopped: true });
  }
  check(name: string, ok: boolean, good: string, bad: string): boolean {
    if (ok) this.pass(name, good);
    else this.fail(name, bad);
    return ok;
  }
}

const isObj = (v: unknown): v is Record<string, unknown> => v !== null && typeof v === "object" && !Array.isArray(v);

/** The first path where two JSON values differ, or null when they are equal. */
export function firstDifference(a: unknown, b: unknown, at = "$"): string | null {
  if (Array.isArray(a) || Array.isArray(b)) {
    if (!Array.isArray(a) || !Array.isArray(b)) return `${at}: expected ${JSON.stringify(a)?.slice(0, 80)}, found ${JSON.stringify(b)?.slice(0, 80)}`;
    if (a.length !== b.length) return `${at}: expected ${a.length} entries, found ${b.length}`;
    for (let i = 0; i < a.length; i++) {
      const d = firstDifference(a[i], b[i], `${at}[${i}]`);
      if (d) return d;
    }
    return null;
  }
  if (isObj(a) || isObj(b)) {
    if (!isObj(a) || !isObj(b)) return `${at}: expected ${JSON.stringify(a)?.slice(0, 80)}, found ${JSON.stringify(b)?.slice(0, 80)}`;
    const keys = new Set([...Object.keys(a), ...Object.keys(b)]);
    for (const k of [...keys].sort()) {
      if (!(k in a)) return `${at}.${k}: not expected, found ${JSON.stringify(b[k])?.slice(0, 80)}`;
      if (!(k in b)) return `${at}.${k}: missing (expected ${JSON.stringify(a[k])?.slice(0, 80)})`;
      const d = firstDifference(a[k], b[k], `${at}.${k}`);
      if (d) return d;
    }
    return null;
  }
  return Object.is(a, b) ? null : `${at}: expected ${JSON.stringify(a)}, found ${JSON.stringify(b)}`;
}

function readIn(dir: string, name: string): Buffer | null {
  try {
    return fs.readFileSync(path.join(dir, path.basename(name)));
  } catch {
    return null;
  }
}

/** Reads certificate.json; a missing directory or unreadable JSON is a PlumblineError (exit 2). */
export function readCertificateJson(dir: string): CertificateJson {
  if (!fs.existsSync(dir) || !fs.statSync(dir).isDirectory()) throw new PlumblineError("io", `${dir}: no such certificate directory`);
  const file = path.join(dir, FILES.certificate);
  let text: string;
  try {
    text = fs.readFileSync(file, "utf8");
  } catch {
    throw new PlumblineError("io", `${file}: missing (not a certificate directory?)`);
  }
  let v: unknown;
  try {
    v = JSON.parse(text);
  } catch (e) {
    throw new PlumblineError("parse", `${file}: not valid JSON: ${(e as Error).message}`);
  }
  if (!isObj(v)) throw new PlumblineError("parse", `${file}: expected one JSON object`);
  // older certificates name some things in older words: read them in today's (older-names.ts)
  return inTodaysWords(v as unknown as CertificateJson);
}

const CLAIMS: Record<string, string[]> = { optimal: ["horizon-unsat", "suffix-unsat", "lower-bound", "state-space", "landmark-search"], unsolvable: ["horizon-unsat", "relaxed-unreachable"] };
/** Claims a format version can hold (suffix-unsat, state-space and landmark-search came with version 2). */
const CLAIMS_SINCE: Record<string, number> = { "suffix-unsat": 2, "state-space": 2, "landmark-search": 2 };

/** A limit stops a check by throwing; checks that catch errors must let it through. */
function passLimit(e: unknown): void {
  if (isLimitReached(e)) throw e;
}

/**
 * Audits the certificate in `dir`. Throws PlumblineError only when the directory or its JSON is
 * unreadable. `opts.deadline` and `opts.signal` bound the whole audit (the horizon recomputation
 * and the encoding included): when one stops it, the report says not finished (`finished: false`).
 */
export function auditCertificate(dir: string, opts: AuditOptions = {}): AuditReport {
  const t0 = performance.now();
  const c = new Checks();
  try {
    return withLimits({ deadline: opts.deadline, signal: opts.signal }, () => auditWith(c, t0, dir, opts));
  } catch (e) {
    if (!isLimitReached(e)) throw e;
    c.stop("finished", e);
    const cert = readCertificateJson(dir);
    return reportOf(c, t0, dir, cert);
  }
}

/** Valid: every check passed. Finished: no limit stopped a check, or a check failed (rejected whatever the time). */
export function auditVerdict(checks: readonly AuditCheck[]): { valid: boolean; finished: boolean } {
  const finished = !checks.some((x) => x.stopped) || checks.some((x) => !x.ok && !x.skipped && !x.stopped);
  return { valid: finished && checks.length > 0 && checks.every((x) => x.ok), finished };
}

function reportOf(c: Checks, t0: number, dir: string, cert: CertificateJson): AuditReport {
  return {
    ...auditVerdict(c.list),
    dir,
    claim: isObj(cert.claim) ? { status: String(cert.claim.status), how: String(cert.claim.how) } : null,
    cost: isObj(cert.plan) && typeof cert.plan.cost === "number" ? cert.plan.cost : null,
    checks: c.list,
    seconds: (performance.now() - t0) / 1000,
  };
}

function auditWith(c: Checks, t0: number, dir: string, opts: AuditOptions): AuditReport {
  const cert = readCertificateJson(dir);
  const report = (): AuditReport => reportOf(c, t0, dir, cert);

  // --- the record itself -------------------------------------------------------------------
  const versionOk = AUDITABLE_FORMAT_VERSIONS.includes(cert.formatVersion);
  const claimOk =
    versionOk &&
    isObj(cert.claim) &&
    CLAIMS[cert.claim.status]?.includes(cert.claim.how) === true &&
    (CLAIMS_SINCE[cert.claim.how] ?? 1) <= cert.formatVersion &&
    (cert.claim.status === "optimal") === isObj(cert.plan);
  c.check(
    "format",
    claimOk,
    `format version ${cert.formatVersion}${cert.formatVersion === FORMAT_VERSION ? "" : ` (an earlier version; current ${FORMAT_VERSION})`}, claim ${cert.claim?.status} by ${cert.claim?.how}`,
    !versionOk
      ? `format version ${JSON.stringify(cert.formatVersion)} is not one this version reads (${AUDITABLE_FORMAT_VERSIONS.join(", ")})`
      : `the claim ${JSON.stringify(cert.claim)} is not one of: optimal by horizon-unsat, suffix-unsat (format 2 on) or lower-bound (with a plan), unsolvable by horizon-unsat or relaxed-unreachable (without one)`,
  );
  if (!claimOk) return report();
  const how = cert.claim.how;

  // --- inputs ------------------------------------------------------------------------------
  const domainBytes = readIn(dir, FILES.domain);
  const problemBytes = readIn(dir, FILES.problem);
  if (!domainBytes || !problemBytes) {
    c.fail("input-files", `missing ${!domainBytes ? FILES.domain : FILES.problem}`);
    return report();
  }
  const dh = sha256(domainBytes);
  const ph = sha256(problemBytes);
  c.check(
    "input-hashes",
    dh === cert.inputs?.domain?.sha256 && ph === cert.inputs?.problem?.sha256,
    "domain and problem files match their recorded SHA-256",
    dh !== cert.inputs?.domain?.sha256 ? `${FILES.domain} has SHA-256 ${dh}, the certificate records ${cert.inputs?.domain?.sha256}` : `${FILES.problem} has SHA-256 ${ph}, the certificate records ${cert.inputs?.problem?.sha256}`,
  );
  let model: Model;
  let task: Task;
  try {
    model = modelFromTexts(domainBytes.toString("utf8"), path.join(dir, FILES.domain), problemBytes.toString("utf8"), path.join(dir, FILES.problem));
    task = ground(model, { relevance: cert.grounding?.relevance === true });
    c.pass("ground", `${task.facts.length} facts, ${task.actions.length} actions (relevance pruning ${cert.grounding?.relevance === true ? "on" : "off"})`);
  } catch (e) {
    passLimit(e);
    c.fail("ground", `the inputs do not parse or ground: ${(e as Error).message}`);
    return report();
  }

  // --- the plan ----------------------------------------------------------------------------
  const seen: Recomputed = { task };
  if (cert.claim.status === "optimal") auditPlan(c, dir, cert, model, seen);

  // --- the proof of the claim --------------------------------------------------------------
  if (how === "relaxed-unreachable") {
    c.check("relaxed-unreachable", !relaxedReachableWithout(task, new Set()), "the goal is unreachable even ignoring deletes", "the goal is reachable ignoring deletes: the claim is not proven this way");
  } else if (how === "lower-bound") {
    auditLowerBound(c, dir, cert, task);
  } else if (how === "suffix-unsat") {
    auditSuffixUnsat(c, dir, cert, task, opts, seen);
  } else if (how === "landmark-search") {
    auditSearch(c, dir, cert, task);
  } else if (how === "state-space") {
    const ex = exactSearchOnce(task);
    const cost = cert.plan!.cost;
    c.check(
      "state-space",
      ex !== null && ex.optimum !== null && ex.optimum.cost === cost,
      `a plain search of all ${ex?.states} reachable states finds the optimum ${ex?.optimum?.cost}, the plan's cost`,
      ex === null
        ? `the task is too large for the plain search (more than ${REDERIVE_WORK.toLocaleString("en")} state × action steps): the claim cannot be re-derived`
        : ex.optimum === null
          ? "the plain search finds no plan at all"
          : `the plain search finds the optimum ${ex.optimum.cost}, the certificate claims ${cost}`,
    );
  } else {
    auditHorizonUnsat(c, dir, cert, task, opts, seen);
  }
  // a second derivation sharing no code with the horizon methods (arithmetic, exact search on small tasks)
  const again = rederive(task, isObj(cert.horizon) ? cert.horizon : null, seen.acceptedHorizon ?? null, cert.claim.status === "optimal" && isObj(cert.plan) ? cert.plan.cost : null);
  c.check(
    "second-derivation",
    again.problems.length === 0,
    `${again.checked.join("; ") || "nothing to re-derive"}${again.skipped.length ? `; not re-derived: ${again.skipped.join("; ")}` : ""}`,
    again.problems.join("; "),
  );
  // the fields no claim rests on: compared with what was recomputed, or named as not verified
  const info = checkInformational(cert, seen);
  c.check("informational", info.mismatches.length === 0, `${info.checked.length ? `checked ${info.checked.join(", ")}; ` : ""}not verified (informational only): ${info.unverified.join(", ")}`, `edited or wrong: ${info.mismatches.join("; ")}`);
  return report();
}

function auditPlan(c: Checks, dir: string, cert: CertificateJson, model: Model, seen: Recomputed): void {
  const plan = cert.plan!;
  const bytes = readIn(dir, FILES.plan);
  if (!bytes) {
    c.fail("plan-replay", `missing ${FILES.plan}`);
    return;
  }
  const h = sha256(bytes);
  c.check("plan-hash", h === plan.sha256, `${FILES.plan} matches its recorded SHA-256`, `${FILES.plan} has SHA-256 ${h}, the certificate records ${plan.sha256}`);
  let r;
  try {
    r = replayPlan(model, parsePlan(bytes.toString("utf8"), FILES.plan), FILES.plan);
  } catch (e) {
    passLimit(e);
    c.fail("plan-replay", `${FILES.plan} cannot be read as a plan: ${(e as Error).message}`);
    return;
  }
  if (!c.check("plan-replay", r.valid, `the plan replays on the lifted model and reaches the goal (${r.length} actions)`, `the plan fails: ${r.error?.message ?? "invalid"}`)) {
    c.skip("plan-cost", "the plan does not replay");
    return;
  }
  seen.planText = bytes.toString("utf8");
  seen.planCost = r.cost;
  c.check(
    "plan-cost",
    r.cost === plan.cost && r.length === plan.length,
    `replayed cost ${r.cost} and length ${r.length} equal the claim`,
    `the replayed plan costs ${r.cost} with ${r.length} actions; the certificate claims cost ${plan.cost} with ${plan.length} actions`,
  );
}

/** The planning pipeline of the re-grounded task (its analysis), or null with check `check` failed. */
function pipelineOr(c: Checks, task: Task, check: string): PlanningPipeline | null {
  try {
    return planningPipeline(task);
  } catch (e) {
    passLimit(e);
    c.fail(check, `analysis failed: ${(e as Error).message}`);
    return null;
  }
}

/** A file the certificate records with its SHA-256: read, hash compared (check `hashCheck`); null when missing (check `failCheck` fails). */
function recordedFile(c: Checks, dir: string, rec: unknown, file: string, what: string, hashCheck: string, failCheck: string): Buffer | null {
  const bytes = readIn(dir, file);
  if (!isObj(rec) || !bytes) {
    c.fail(failCheck, `missing ${!bytes ? file : what}`);
    return null;
  }
  const h = sha256(bytes);
  c.check(hashCheck, h === rec.sha256, `${file} matches its recorded SHA-256`, `${file} has SHA-256 ${h}, the certificate records ${String(rec.sha256)}`);
  return bytes;
}

function auditLowerBound(c: Checks, dir: string, cert: CertificateJson, task: Task): void {
  const lb = cert.lowerBound;
  const bytes = recordedFile(c, dir, lb, FILES.landmarks, "the lowerBound record", "landmarks-hash", "landmark-check");
  if (!bytes || !isObj(lb)) return;
  let rec: LandmarkRecord;
  try {
    rec = JSON.parse(bytes.toString("utf8")) as LandmarkRecord;
    if (!isObj(rec) || typeof rec.bound !== "number" || !Array.isArray(rec.landmarks)) throw new Error("expected { bound, landmarks }");
  } catch (e) {
    passLimit(e);
    c.fail("landmark-check", `${FILES.landmarks} is not a landmark record: ${(e as Error).message}`);
    return;
  }
  let v;
  try {
    v = checkLandmarkCertificate(task, rec);
  } catch (e) {
    passLimit(e);
    v = { valid: false, reason: (e as Error).message };
  }
  c.check("landmark-check", v.valid, `${rec.landmarks.length} landmarks re-checked: every plan costs at least ${rec.bound}`, `the landmark record is not valid: ${v.reason ?? "rejected"}`);
  const cost = cert.plan!.cost;
  c.check(
    "lower-bound-equals-cost",
    rec.bound === cost && lb.bound === cost,
    `the lower bound ${rec.bound} equals the plan's cost`,
    `the lower bound ${rec.bound} (recorded ${lb.bound}) does not equal the plan's cost ${cost}`,
  );
}

/**
 * The number of steps the formula is rebuilt with, or null (check failed). The recorded
 * derivation must equal the recomputed one — or, for a certificate written by a version whose
 * thresholds were looser, record a horizon strictly greater than the recomputed one: every plan of
 * at most H actions is a model of every encoding at any horizon ≥ H (steps may stay empty, see
 * encodings/*.md), so a refutation at the recorded horizon covers the recomputed threshold. The
 * recorded derivation itself is then not used. An equal horizon with a different derivation, or a
 * smaller one, is rejected.
 */
function acceptedHorizon(c: Checks, H: number, winner: string, recordedRaw: unknown, diff: string | null): number | null {
  if (diff === null) {
    c.pass("horizon-derivation", `recomputed: horizon ${H} (${winner}), every number of every method equal`);
    return H;
  }
  if (typeof recordedRaw === "number" && Number.isSafeInteger(recordedRaw) && recordedRaw > H) {
    c.pass(
      "horizon-derivation",
      `recorded horizon ${recordedRaw} (a derivation this version does not reproduce, first difference at ${diff}) is above the recomputed threshold ${H} (${winner}): ` +
        `every plan of at most ${H} actions fits in ${recordedRaw} steps, so the formula is rebuilt with ${recordedRaw} steps`,
    );
    return recordedRaw;
  }
  c.fail("horizon-derivation", `the recorded derivation differs from the recomputed one at ${diff}, and the recorded horizon ${JSON.stringify(recordedRaw)} is not above the recomputed ${H}`);
  return null;
}

function auditHorizonUnsat(c: Checks, dir: string, cert: CertificateJson, task: Task, opts: AuditOptions, seen: Recomputed): void {
  const optimal = cert.claim.status === "optimal";
  const cost = optimal ? cert.plan!.cost : null;
  const hz = cert.horizon;
  const enc = cert.encoding;
  if (!isObj(hz) || !isObj(enc)) {
    c.fail("horizon-derivation", "the certificate has no horizon or encoding record");
    return;
  }
  // the upper cost the horizon was computed for: ≥ the claimed cost (thresholds are monotone in C)
  const upperRaw = hz.upperCost;
  const upper = upperRaw === "Infinity" ? Infinity : typeof upperRaw === "number" ? upperRaw : NaN;
  const upperOk = optimal ? Number.isSafeInteger(upper) && upper >= cost! : upper === Infinity;
  c.check(
    "horizon-upper-cost",
    upperOk,
    optimal ? `the horizon was computed for cost < ${upper}, and ${upper} ≥ the claimed cost ${cost}` : "the horizon bounds plans of any cost (plain reachability)",
    optimal ? `the horizon's upper cost ${JSON.stringify(upperRaw)} is not an integer ≥ the claimed cost ${cost}` : `an unsolvability claim needs the horizon for any cost ("Infinity"), found ${JSON.stringify(upperRaw)}`,
  );
  if (!upperOk) {
    c.skip("horizon-derivation", "no valid upper cost");
    return;
  }
  const pipe = pipelineOr(c, task, "horizon-derivation");
  if (!pipe) return;
  const limits = horizonLimitsOf(cert);
  if (typeof limits === "string") {
    c.fail("horizon-derivation", limits);
    return;
  }
  const recomputed = pipe.horizon(upper, limits);
  const fresh = horizonReportJson(recomputed);
  const diff = firstDifference(fresh, hz);
  if (!Number.isSafeInteger(recomputed.horizon)) {
    c.fail("horizon-derivation", `the recomputed horizon ${recomputed.horizonText} cannot be unrolled`);
    return;
  }
  const H = acceptedHorizon(c, recomputed.horizon, recomputed.winner, hz.horizon, diff);
  if (H === null) return;
  seen.acceptedHorizon = H;

  // the formula, from trusted values only: recomputed horizon and mutex groups, bound cost − 1
  auditFormula(c, dir, cert, pipe, { steps: H, upper, settingFrom: "upper-cost", bound: optimal ? cost! - 1 : null }, opts, seen);
}

/** The recorded horizon limits (format 2 on), checked; a string says what is wrong. */
function horizonLimitsOf(cert: CertificateJson): { maxOptimalStates?: number; maxExplicitStates?: number; maxProjectionStates?: number } | string {
  const raw = (cert as { horizonLimits?: unknown }).horizonLimits;
  if (raw === undefined) return {};
  if (!isObj(raw) || cert.formatVersion < 2) return `horizonLimits ${JSON.stringify(raw)?.slice(0, 80)} is not a limits record of format 2`;
  const out: Record<string, number> = {};
  const caps: Record<string, [number, number]> = { maxOptimalStates: [0, 10_000_000], maxExplicitStates: [1, 10_000_000], maxProjectionStates: [1, 10_000_000] };
  for (const [k, v] of Object.entries(raw)) {
    const cap = caps[k];
    if (!cap) return `horizonLimits: unknown limit ${k}`;
    if (typeof v !== "number" || !Number.isSafeInteger(v) || v < cap[0] || v > cap[1]) return `horizonLimits.${k} ${JSON.stringify(v)} is not a whole number in ${cap[0]}..${cap[1]}`;
    out[k] = v;
  }
  return out;
}

interface FormulaTerms {
  steps: number;
  /** The upper cost the bound setting is recomputed from (threshold claims). */
  upper: number;
  /** "upper-cost": the setting must equal the one for `upper`; "recorded": any value under which "cost ≤ bound" is expressible. */
  settingFrom: "upper-cost" | "recorded";
  bound: number | null;
}

/** Rebuilds the recorded formula from trusted values, compares its hash, checks the proof. */
function auditFormula(c: Checks, dir: string, cert: CertificateJson, pipe: PlanningPipeline, terms: FormulaTerms, opts: AuditOptions, seen: Recomputed): void {
  const enc = cert.encoding!;
  const H = terms.steps;
  const upper = terms.upper;
  const groups = pipe.mutexGroups.map((g) => [...g]);
  const step = enc.step as StepEncodingId;
  const costId = enc.cost as CostEncodingId;
  let parts: PartId[] | null = null;
  try {
    parts = checkParts(Array.isArray(enc.parts) ? (enc.parts as string[]) : undefined);
  } catch {
    parts = null;
  }
  const stepOk = STEP_ENCODINGS.includes(step) && COST_ENCODINGS.includes(costId);
  const partsOk = parts !== null && Array.isArray(enc.parts);
  const params: Record<string, unknown> = isObj(enc.params) ? enc.params : {};
  const recorded = (name: "costBits" | "costCap") => params[COST_SETTING_KEY[name]];
  const recordedSetting = (name: "costBits" | "costCap") => {
    const v = recorded(name);
    return typeof v === "number" && Number.isSafeInteger(v) && v >= 0 ? v : -1;
  };
  const settings = terms.settingFrom === "upper-cost" ? boundSettings(upper) : { costBits: recordedSetting("costBits"), costCap: recordedSetting("costCap") };
  const partParams = isObj(enc.partParams) ? (enc.partParams as PartParams) : undefined;
  const spec: FormulaSpec = { encoding: step, cost: costId, steps: H, ...settings, mutexGroups: groups, parts: parts ?? [], ...(partParams ? { partParams } : {}) };
  const bound = terms.bound;
  const problems: string[] = [];
  if (!stepOk) problems.push(`unknown step or cost encoding ${JSON.stringify(enc.step)} / ${JSON.stringify(enc.cost)}`);
  if (!partsOk) problems.push(`unknown, repeated or misordered parts ${JSON.stringify(enc.parts)}`);
  if (stepOk && partsOk && enc.id !== formulaId(spec)) problems.push(`id ${JSON.stringify(enc.id)} is not ${formulaId(spec)}`);
  // the bound setting of the recorded cost encoding, recomputed from the upper cost (or as recorded)
  const { name: setting, value: settingValue } = costSetting(spec);
  if (params.steps !== H) problems.push(`steps ${JSON.stringify(params.steps)} is not the accepted horizon ${H}`);
  const settingKey = COST_SETTING_KEY[setting];
  if (params[settingKey] !== settingValue) problems.push(`${settingKey} ${JSON.stringify(params[settingKey])} is not ${settingValue}`);
  const extra = Object.keys(params).filter((k) => !["steps", settingKey, "mutexGroups"].includes(k));
  if (extra.length > 0) problems.push(`unexpected parameters ${extra.join(", ")} for ${JSON.stringify(enc.cost)}`);
  const gd = firstDifference(groups, params.mutexGroups, "mutexGroups");
  if (gd) problems.push(`mutex groups differ from the recomputed ones (${gd})`);
  if (enc.bound !== bound) problems.push(`the final query's bound ${JSON.stringify(enc.bound)} is not ${bound === null ? "null (any plan)" : `the claimed cost − 1 = ${bound}`}`);
  if (!c.check("encoding", problems.length === 0, `${formulaId(spec)}, ${H} steps, ${costSettingWords(setting, settingValue)}, ${groups.length} mutex groups, query ${bound === null ? "any plan" : `cost ≤ ${bound}`}`, problems.join("; "))) {
    if (!stepOk || !partsOk) {
      c.skip("cnf-hash", "unknown encoding");
      c.skip("proof-check", "unknown encoding");
      return;
    }
  }

  // landmarks-1: every recorded landmark must be one (without its actions the goal is relaxed-unreachable)
  const lms = spec.partParams?.["landmarks-1"]?.landmarks;
  if (spec.parts.includes("landmarks-1")) {
    const bad = Array.isArray(lms) ? lms.findIndex((l) => !Array.isArray(l) || relaxedReachableWithout(pipe.prepared.task, new Set(l as number[]))) : -2;
    c.check(
      "landmarks-part",
      bad === -1,
      `${lms!.length} landmarks re-checked: without the actions of any one of them the goal is unreachable even ignoring deletes`,
      bad === -2 ? "the part landmarks-1 has no landmark list" : `landmark ${bad} is not a landmark: the goal is reachable without its actions`,
    );
  }

  let formula;
  let units: number[];
  try {
    formula = pipe.formula(spec);
    units = formula.boundUnits(bound ?? Infinity);
  } catch (e) {
    passLimit(e);
    c.fail("cnf-hash", `the formula cannot be rebuilt: ${(e as Error).message}`);
    return;
  }
  const ud = firstDifference(units, enc.costBoundClauses, "costBoundClauses");
  c.check(
    "cost-bound-clauses",
    ud === null,
    `${units.length} unit clause${units.length === 1 ? "" : "s"} saying ${bound === null ? "nothing about cost (any plan)" : `cost ≤ ${bound}`}, as recorded`,
    `the recorded clauses that say cost ≤ ${bound} differ from the rebuilt ones: ${ud}`,
  );
  seen.cnf = { variables: formula.numVars, clauses: formula.numClauses + units.length };
  const hash = canonicalCnfSha256(formula, units);
  c.check("cnf-hash", hash === cert.cnf?.sha256, `rebuilt CNF (${formula.numVars} variables, ${formula.numClauses + units.length} clauses) has the recorded SHA-256`, `the rebuilt CNF has SHA-256 ${hash}, the certificate records ${cert.cnf?.sha256}`);

  // the proof: its bytes as recorded, then checked against the rebuilt CNF by src/proof
  const pr = cert.proof;
  const proofBytes = readIn(dir, FILES.proof);
  if (!isObj(pr) || !proofBytes) {
    c.fail("proof-hash", `missing ${!proofBytes ? FILES.proof : "the proof record"}`);
    c.skip("proof-check", "no proof");
    return;
  }
  seen.proofBytes = proofBytes.length;
  seen.proofBytes = proofBytes.length;
  const phash = sha256(proofBytes);
  c.check("proof-hash", phash === pr.sha256, `${FILES.proof} matches its recorded SHA-256 (${proofBytes.length} bytes)`, `${FILES.proof} has SHA-256 ${phash}, the certificate records ${pr.sha256}`);
  const result = checkDrat(checkerCnf(formula, units), proofBytes, { deadline: opts.deadline, signal: opts.signal });
  if (!result.valid && (result.reason ?? "").startsWith("stopped")) {
    c.list.push({ name: "proof-check", ok: false, detail: "not finished: a limit stopped the proof check before it ended", stopped: true });
    return;
  }
  const why = result.failedLemma ? `lemma ${result.failedLemma.index} fails` : (result.reason ?? "rejected");
  const scope = provesAtAnyHorizon(spec.parts) ? `with ${H} real steps and a relaxed suffix, so at any length` : `within ${H} steps`;
  c.check("proof-check", result.valid, `DRAT proof valid: the CNF is unsatisfiable (${bound === null ? "no plan at all" : `no plan of cost ≤ ${bound}`} ${scope})`, `the DRAT proof is rejected: ${why}${result.reason && result.failedLemma ? ` (${result.reason})` : ""}`);
}

/** Largest number of real steps a suffix-unsat certificate may ask the auditor to unroll. */
const MAX_SUFFIX_STEPS = 100_000;

/**
 * suffix-unsat: no horizon to recompute — the refutation of "h real steps, then a relaxed
 * suffix, cost ≤ cost − 1" proves "no plan of cost ≤ cost − 1" at any h (encodings/
 * relaxed-suffix-1.md, the lemma), and so do its state pairs. The formula must contain the part.
 */
function auditSuffixUnsat(c: Checks, dir: string, cert: CertificateJson, task: Task, opts: AuditOptions, seen: Recomputed): void {
  const enc = cert.encoding;
  const cost = cert.plan!.cost;
  const stepsRaw = isObj(enc) && isObj(enc.params) ? enc.params.steps : undefined;
  const parts = isObj(enc) && Array.isArray(enc.parts) ? (enc.parts as string[]) : [];
  const partOk = parts.includes("relaxed-suffix-1");
  const stepsOk = typeof stepsRaw === "number" && Number.isSafeInteger(stepsRaw) && stepsRaw >= 0 && stepsRaw <= MAX_SUFFIX_STEPS;
  if (
    !c.check(
      "suffix-terms",
      isObj(enc) && partOk && stepsOk,
      `the formula has ${stepsRaw} real steps and the part relaxed-suffix-1: its refutation holds at any plan length, no completeness threshold needed`,
      !isObj(enc) ? "the certificate has no encoding record" : !partOk ? `a suffix-unsat claim needs the part relaxed-suffix-1; the formula's parts are ${JSON.stringify(parts)}` : `steps ${JSON.stringify(stepsRaw)} is not a whole number in 0..${MAX_SUFFIX_STEPS}`,
    )
  )
    return;
  const pipe = pipelineOr(c, task, "encoding");
  if (!pipe) return;
  auditFormula(c, dir, cert, pipe, { steps: stepsRaw as number, upper: Infinity, settingFrom: "recorded", bound: cost - 1 }, opts, seen);
}

/** landmark-search: the recorded A* search over the analysed task, checked state by state (search-check.ts). */
function auditSearch(c: Checks, dir: string, cert: CertificateJson, task: Task): void {
  const bytes = recordedFile(c, dir, cert.search, FILES.search, "the search record", "search-hash", "search-check");
  if (!bytes) return;
  let entries: unknown;
  try {
    entries = JSON.parse(gunzipSync(bytes).toString("utf8"));
  } catch (e) {
    passLimit(e);
    c.fail("search-check", `${FILES.search} is not a gzip-compressed JSON record: ${(e as Error).message}`);
    return;
  }
  const pipe = pipelineOr(c, task, "search-check");
  if (!pipe) return;
  const cost = cert.plan!.cost;
  const r = checkSearchRecord(pipe.prepared.task, cost, entries);
  c.check(
    "search-check",
    r.valid,
    `the recorded search (${r.states} states, ${r.expanded} expanded) shows no plan costs less than ${cost}: every expanded state's successors are recorded, every other state's landmarks (re-checked by relaxed reachability) bound what is left`,
    `the recorded search does not prove the claim: ${r.reason}`,
  );
}
