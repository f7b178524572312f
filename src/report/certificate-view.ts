// Reads a certificate directory for the report: certificate.json, the copied domain and
// problem, and plan.txt replayed on the lifted model for each step's cost. Reads fields
// tolerantly (the report shows what is there); checking the certificate is audit's job.
import { existsSync, readdirSync, readFileSync } from "node:fs";
import { basename, join } from "node:path";
import { inTodaysWords } from "../certify/older-names.js";
import { loadModel } from "../pddl/index.js";
import { parsePlan, replayPlan } from "../plan/index.js";
import { PlumblineError } from "../util/errors.js";
import { readText } from "../util/files.js";
import type { AuditStatus, TimelinePoint } from "./record.js";

export interface PlanStepView {
  name: string;
  args: string[];
  cost: number;
}

export interface AuditCheck {
  name: string;
  ok: boolean | null;
  detail: string;
}

export interface AuditView {
  status: AuditStatus;
  /** "run": audited just now; "recorded": read from an earlier audit; "none": not audited. */
  source: "run" | "recorded" | "none";
  seconds: number | null;
  checks: AuditCheck[];
  note: string | null;
}

export interface CertificateView {
  dir: string;
  certificate: Record<string, unknown>;
  domainFile: string | null;
  problemFile: string | null;
  problemName: string;
  plan: PlanStepView[] | null;
  planCost: number | null;
  /** Why the plan could not be shown (missing file, replay failure). */
  planNote: string | null;
  timeline: TimelinePoint[];
}

export const isObj = (v: unknown): v is Record<string, unknown> => v !== null && typeof v === "object" && !Array.isArray(v);

/** The first value found under any of `keys`, looking into the top level and one level down. */
export function findField(obj: Record<string, unknown>, keys: readonly string[]): unknown {
  for (const k of keys) if (k in obj) return obj[k];
  for (const v of Object.values(obj)) if (isObj(v)) for (const k of keys) if (k in v) return v[k];
  return undefined;
}

function fileNamed(dir: string, cert: Record<string, unknown>, keys: string[], fallbacks: string[]): string | null {
  const v = findField(cert, keys);
  const names: string[] = [];
  if (typeof v === "string") names.push(v);
  else if (isObj(v)) for (const k of ["file", "name", "path"]) if (typeof v[k] === "string") names.push(v[k] as string);
  names.push(...fallbacks);
  for (const n of names) {
    const p = join(dir, basename(n));
    if (existsSync(p)) return p;
  }
  return null;
}

/** The PDDL files of the folder: the one that defines a domain, and the other one. */
function guessPddl(dir: string): { domain: string | null; problem: string | null } {
  const pddl = readdirSync(dir).filter((n) => n.toLowerCase().endsWith(".pddl"));
  let domain: string | null = null;
  let problem: string | null = null;
  for (const n of pddl) {
    const head = readFileSync(join(dir, n), "utf8").slice(0, 4000).toLowerCase();
    if (/\(\s*define\s*\(\s*domain\b/.test(head)) domain ??= join(dir, n);
    else if (/\(\s*define\s*\(\s*problem\b/.test(head)) problem ??= join(dir, n);
  }
  return { domain, problem };
}

export function readCertificateView(dir: string, timelineOf: (cert: Record<string, unknown>) => TimelinePoint[]): CertificateView {
  const file = join(dir, "certificate.json");
  let cert: Record<string, unknown>;
  try {
    const v = JSON.parse(readText(file)) as unknown;
    if (!isObj(v)) throw new Error("not an object");
    // an older certificate's horizon shown in today's words (method names, derivation keys)
    cert = inTodaysWords(v);
  } catch (e) {
    if (e instanceof PlumblineError) throw e;
    throw new PlumblineError("parse", `${file}: not a certificate (expected one JSON object): ${(e as Error).message}`);
  }
  const guess = guessPddl(dir);
  const domainFile = fileNamed(dir, cert, ["domainFile", "domain"], ["domain.pddl"]) ?? guess.domain;
  const problemFile = fileNamed(dir, cert, ["problemFile", "problem"], ["problem.pddl"]) ?? guess.problem;
  const planFile = fileNamed(dir, cert, ["planFile", "plan"], ["plan.txt"]);
  const view: CertificateView = { dir, certificate: cert, domainFile, problemFile, problemName: basename(dir), plan: null, planCost: null, planNote: null, timeline: timelineOf(cert) };
  if (!domainFile || !problemFile) {
    view.planNote = "the domain or problem file is missing from the certificate folder";
    return view;
  }
  if (!planFile) {
    view.planNote = "no plan.txt in the certificate folder";
    return view;
  }
  try {
    const model = loadModel(domainFile, problemFile);
    view.problemName = model.problem.name;
    const steps = parsePlan(readText(planFile), planFile);
    const r = replayPlan(model, steps, planFile, { trace: true });
    view.plan = steps.map((s, i) => ({ name: s.name, args: s.args, cost: r.trace?.[i]?.cost ?? 0 }));
    view.planCost = r.cost;
    if (!r.valid) view.planNote = `the plan does not replay on the model: ${r.error?.message ?? "invalid"}`;
  } catch (e) {
    view.planNote = `cannot show the plan: ${(e as Error).message}`;
  }
  return view;
}

/**
 * The one certificate's object in `plumbline audit --json` output: the array's only element, or
 * the object earlier versions printed; null for anything else (several certificates, not JSON).
 */
export function singleAuditJson(text: string): Record<string, unknown> | null {
  const t = text.trim();
  let v: unknown;
  try {
    v = JSON.parse(t);
  } catch {
    return null;
  }
  if (Array.isArray(v)) v = v.length === 1 ? v[0] : null;
  return isObj(v) ? v : null;
}

/** Audit JSON (from `plumbline audit --json`) → status and a list of named checks. */
export function auditViewOf(json: Record<string, unknown> | null, source: AuditView["source"], seconds: number | null, note: string | null = null): AuditView {
  if (!json || typeof json.valid !== "boolean") return { status: source === "none" ? "none" : "unfinished", source, seconds, checks: [], note };
  const raw = json.checks;
  const checks: AuditCheck[] = [];
  const detailOf = (c: unknown) => (isObj(c) ? `${c.skipped === true ? "skipped: " : ""}${String(c.detail ?? c.message ?? c.reason ?? "")}` : "");
  const okOf = (c: unknown): boolean | null => (typeof c === "boolean" ? c : isObj(c) && c.skipped === true ? null : isObj(c) ? (typeof c.ok === "boolean" ? c.ok : typeof c.valid === "boolean" ? c.valid : typeof c.passed === "boolean" ? c.passed : null) : null);
  if (Array.isArray(raw)) raw.forEach((c, i) => checks.push({ name: isObj(c) && typeof c.name === "string" ? c.name : `check ${i + 1}`, ok: okOf(c), detail: detailOf(c) }));
  else if (isObj(raw)) for (const [name, c] of Object.entries(raw)) checks.push({ name, ok: okOf(c), detail: detailOf(c) });
  // an audit a limit stopped has no verdict (older audit.json files have no `finished`: they finished)
  return { status: json.valid ? "valid" : json.finished === false ? "unfinished" : "rejected", source, seconds, checks, note };
}
