// Re-judges a certificate's recorded plan against a changed model: unchanged (re-audit), plan no
// longer valid, valid at another cost, still optimal (proven again from the plan), or a cheaper plan.
import * as fs from "node:fs";
import * as path from "node:path";
import { diffTasks, ground, pruneIrrelevant, type Task, type TaskDiff } from "../ground/index.js";
import { disposeOutcome, optimize, OPTIMIZE_GROUNDING, planFile, type OptimizeOutcome } from "../optimize/index.js";
import { modelFromTexts, tokenSignature, type Model } from "../pddl/index.js";
import { parsePlan, replayPlan, stepText } from "../plan/index.js";
import { isPlumblineError, PlumblineError } from "../util/errors.js";
import { readBytes, writeDirAtomic } from "../util/files.js";
import { isLimitReached, withLimits } from "../util/limits.js";
import { auditCertificate, readCertificateJson, type AuditReport } from "./audit.js";
import { entryOf } from "./bulk.js";
import { FILES, type CertificateJson } from "./format.js";
import { dratChecker, stateSpaceChecker } from "./proof-check.js";
import { sha256, writeCertificate } from "./write.js";

/** Our words for the outcomes (JSON `verdict`). */
export type RejudgeVerdict =
  /** Same tokens as the certificate's inputs: the verdict is the certificate's audit. */
  | "unchanged"
  /** The recorded plan fails on the new model. */
  | "plan-invalid"
  /** The recorded plan is valid but costs something else now (whether or not it is still optimal). */
  | "cost-changed"
  /** Same cost, and proven optimal again in the new model. */
  | "still-optimal"
  /** The new model has a cheaper plan than the recorded one. */
  | "cheaper-plan"
  /** Same cost, but a limit stopped the proof before optimality was settled. */
  | "undecided";

export interface PlanFailure {
  /** 1-based step; length + 1 when the goal is not reached. */
  step: number;
  /** The step as written, or null for the goal. */
  action: string | null;
  kind: "precondition" | "goal" | "unknown-step";
  /** The unmet condition (or what about the step is unknown). */
  condition: string;
  message: string;
}

export interface ReusedPart {
  part: "certificate" | "incumbent" | "horizon" | "proof";
  reused: boolean;
  /** Why it was (sound) or was not (unsound or impossible) reused. */
  why: string;
}

export interface RejudgeOptions {
  /** New domain file (default: the certificate's own copy). */
  domain?: string;
  /** New problem file (default: the certificate's own copy). */
  problem?: string;
  /** Where to write the new certificate (when optimality is proven). */
  certificateOut?: string;
  timeLimit?: number;
  /** Absolute deadline (Date.now() ms); the earlier of this and timeLimit counts. */
  deadline?: number;
  memoryLimitMb?: number;
  signal?: AbortSignal;
  onProgress?: (line: string) => void;
}

export interface RejudgeResult {
  verdict: RejudgeVerdict;
  modelChanged: boolean;
  planValid: boolean;
  failure: PlanFailure | null;
  recordedCost: number;
  /** The recorded plan's cost in the new model (null when it is not valid there). */
  newCost: number | null;
  /** True: the recorded plan is proven optimal in the new model; false: a cheaper plan exists; null: undecided. */
  optimal: boolean | null;
  /** The cheaper plan: its steps, cost, whether it is proven optimal, and its plan file (plumbline's layout). */
  cheaperPlan: { plan: string[]; cost: number; proven: boolean; text: string } | null;
  /** The new certificate's folder, or null. */
  certificate: string | null;
  /** Evidence: the re-audit (unchanged model), what changed in the ground task, what was reused. */
  audit: AuditReport | null;
  change: TaskDiff | null;
  reuse: ReusedPart[];
  provedBy: string | null;
  stopReason: string | null;
  domain: string;
  problem: string;
  seconds: number;
  notes: string[];
  exitCode: number;
}

const EXIT: Record<Exclude<RejudgeVerdict, "unchanged">, number> = { "plan-invalid": 1, "cost-changed": 1, "cheaper-plan": 1, "still-optimal": 0, undecided: 3 };

/** Replays the recorded plan on `model`; unknown actions, objects or types are a failure at their step, not an input error. */
function replayRecorded(model: Model, planText: string, planFile: string): { valid: boolean; cost: number | null; failure: PlanFailure | null } {
  const steps = parsePlan(planText, planFile);
  let r;
  try {
    r = replayPlan(model, steps, planFile);
  } catch (e) {
    if (!isPlumblineError(e) || !e.pos) throw e;
    const k = steps.findIndex((s) => s.line === e.pos!.line);
    const step = k >= 0 ? k + 1 : 1;
    return { valid: false, cost: null, failure: { step, action: k >= 0 ? stepText(steps[k]) : null, kind: "unknown-step", condition: e.detail, message: `action ${step}: ${e.detail}` } };
  }
  if (r.valid) return { valid: true, cost: r.cost, failure: null };
  const er = r.error!;
  if (er.kind === "name") {
    // a step naming no action or object of the model (replay reports it as an invalid plan)
    const detail = er.message.replace(/^.*?:\d+:\d+: /, "");
    return { valid: false, cost: null, failure: { step: er.step, action: er.action, kind: "unknown-step", condition: detail, message: `action ${er.step}: ${detail}` } };
  }
  return { valid: false, cost: null, failure: { step: er.step, action: er.action, kind: er.kind, condition: er.literal, message: er.message } };
}

/** The unchanged certificate under `to`, with the given (same-token) input texts and their hashes. */
async function copyWithInputs(from: string, to: string, cert: CertificateJson, domain: Buffer, problem: Buffer): Promise<void> {
  await writeDirAtomic(to, (tmp) => {
    for (const f of fs.readdirSync(from)) if (fs.statSync(path.join(from, f)).isFile()) fs.copyFileSync(path.join(from, f), path.join(tmp, f));
    fs.writeFileSync(path.join(tmp, FILES.domain), domain);
    fs.writeFileSync(path.join(tmp, FILES.problem), problem);
    const json = { ...cert, inputs: { domain: { ...cert.inputs.domain, sha256: sha256(domain) }, problem: { ...cert.inputs.problem, sha256: sha256(problem) } } };
    fs.writeFileSync(path.join(tmp, FILES.certificate), JSON.stringify(json, null, 2) + "\n");
  });
}

const HORIZON_WHY: Record<TaskDiff["kind"], string> = {
  none: "recomputed: the task is the same up to order, but the formula's variable numbers follow the order, so the old formula and proof do not fit; the horizon is cheap next to the refutation",
  costs: "recomputed for the new costs: a completeness threshold depends on them (smallest positive cost, excess bound, length of the cheapest plans), so the recorded one need not be a threshold for the new model",
  "actions-added": "recomputed: added actions can make cheaper plans longer than the recorded threshold allows",
  "actions-removed": "recomputed: the recorded threshold may rest on a short cheap plan that used a removed action",
  other: "recomputed: the model changed beyond costs and whole actions",
};

/**
 * Re-judges the certificate in `certDir` against the new domain and/or problem, within the time
 * and memory limits (every phase polls them: src/util/limits.ts).
 */
export function rejudge(certDir: string, opts: RejudgeOptions = {}): Promise<RejudgeResult> {
  const deadline = Math.min(opts.deadline ?? Infinity, opts.timeLimit === undefined ? Infinity : Date.now() + opts.timeLimit * 1000);
  const limited = { ...opts, deadline: Number.isFinite(deadline) ? deadline : undefined };
  return withLimits({ deadline: limited.deadline, memoryLimitMb: opts.memoryLimitMb, signal: opts.signal }, () => rejudgeWithin(certDir, limited));
}

async function rejudgeWithin(certDir: string, opts: RejudgeOptions): Promise<RejudgeResult> {
  const t0 = performance.now();
  const deadline = opts.deadline;
  const cert = readCertificateJson(certDir);
  if (cert.claim?.status !== "optimal" || !cert.plan || typeof cert.plan.cost !== "number") {
    throw new PlumblineError("usage", `${certDir}: re-judging needs a certificate of an optimal plan; this one claims ${JSON.stringify(cert.claim?.status)} (use solve on the new model)`);
  }
  const recordedCost = cert.plan.cost;
  const oldDomainPath = path.join(certDir, FILES.domain);
  const oldProblemPath = path.join(certDir, FILES.problem);
  const planPath = path.join(certDir, FILES.plan);
  const oldDomain = readBytes(oldDomainPath);
  const oldProblem = readBytes(oldProblemPath);
  const domainPath = opts.domain ?? oldDomainPath;
  const problemPath = opts.problem ?? oldProblemPath;
  const domain = Buffer.from(opts.domain ? readBytes(opts.domain) : oldDomain);
  const problem = Buffer.from(opts.problem ? readBytes(opts.problem) : oldProblem);
  const planBytes = readBytes(planPath);
  if (sha256(planBytes) !== cert.plan.sha256) throw new PlumblineError("semantic", `${planPath} does not match the SHA-256 its certificate records (check the certificate with: plumbline audit ${certDir})`);
  const planText = Buffer.from(planBytes).toString("utf8");
  const text = (b: Uint8Array) => Buffer.from(b).toString("utf8");

  const base = { recordedCost, domain: domainPath, problem: problemPath, notes: [] as string[] };
  const done = (r: Omit<RejudgeResult, "seconds" | keyof typeof base>): RejudgeResult => ({ ...base, ...r, seconds: (performance.now() - t0) / 1000 });

  // 1. the same tokens: the same model — the certificate's own audit is the verdict
  const unchanged =
    tokenSignature(text(oldDomain), oldDomainPath) === tokenSignature(text(domain), domainPath) && tokenSignature(text(oldProblem), oldProblemPath) === tokenSignature(text(problem), problemPath);
  const model = modelFromTexts(text(domain), domainPath, text(problem), problemPath);
  const replay = replayRecorded(model, planText, planPath);
  if (unchanged) {
    const audit = auditCertificate(certDir, { deadline, signal: opts.signal });
    const verdict = entryOf(audit).verdict;
    let certificate: string | null = null;
    if (verdict === "valid" && opts.certificateOut) {
      await copyWithInputs(certDir, opts.certificateOut, cert, domain, problem);
      certificate = opts.certificateOut;
    }
    return done({
      verdict: "unchanged",
      modelChanged: false,
      planValid: replay.valid,
      failure: replay.failure,
      newCost: replay.cost,
      optimal: verdict === "valid" ? true : null,
      cheaperPlan: null,
      certificate,
      audit,
      change: null,
      reuse: [
        {
          part: "certificate",
          reused: true,
          why: "the domain and problem have the same tokens as the certificate's copies (only whitespace, comments or letter case differ), and the parser reads nothing else: the same model, so the certificate was re-audited instead of solving again",
        },
      ],
      provedBy: verdict === "valid" ? "the recorded certificate, re-audited" : null,
      stopReason: verdict === "unfinished" ? "time" : null,
      exitCode: verdict === "valid" ? 0 : verdict === "unfinished" ? 3 : 1,
    });
  }

  // 2. what changed, as ground tasks (no pruning, so every action counts)
  let change: TaskDiff | null = null;
  let full: Task | null = null; // the new model's ground task without pruning (pruned below for the optimizer: same as grounding with it)
  try {
    full = ground(model);
    change = diffTasks(ground(modelFromTexts(text(oldDomain), oldDomainPath, text(oldProblem), oldProblemPath)), full);
  } catch (e) {
    base.notes.push(isLimitReached(e) ? `a limit stopped the comparison of the ground tasks (${e.message})` : `the recorded model could not be ground for comparison: ${(e as Error).message}`);
  }
  const notReused = (part: ReusedPart["part"], why: string): ReusedPart => ({ part, reused: false, why });
  const proofWhy = "the recorded proof refutes the old model's formula; a claim about the new model needs a proof of its own (a new certificate carries it)";
  if (!replay.valid) {
    return done({
      verdict: "plan-invalid",
      modelChanged: true,
      planValid: false,
      failure: replay.failure,
      newCost: null,
      optimal: null,
      cheaperPlan: null,
      certificate: null,
      audit: null,
      change,
      reuse: [notReused("incumbent", `the recorded plan fails at step ${replay.failure!.step} in the new model`), notReused("proof", proofWhy)],
      provedBy: null,
      stopReason: null,
      exitCode: 1,
    });
  }

  // 3. the recorded plan is valid at cost newCost: start the optimizer from it
  const newCost = replay.cost!;
  const planLines = planText.split("\n").filter((l) => l.trim().startsWith("("));
  const reuseHorizon = notReused("horizon", HORIZON_WHY[change?.kind ?? "other"]);
  let task;
  try {
    task = full && OPTIMIZE_GROUNDING.relevance ? pruneIrrelevant(full) : ground(model, OPTIMIZE_GROUNDING);
  } catch (e) {
    if (!isLimitReached(e)) throw e;
    const verdict: RejudgeVerdict = newCost !== recordedCost ? "cost-changed" : "undecided";
    const r = { verdict, modelChanged: true, planValid: true, failure: null, newCost, optimal: null, cheaperPlan: null, certificate: null, audit: null, change };
    return done({ ...r, reuse: [notReused("incumbent", `a limit stopped the run before the optimizer started (${e.message})`), reuseHorizon], provedBy: null, stopReason: e.reason, exitCode: EXIT[verdict] });
  }
  const o: OptimizeOutcome = await optimize(model, task, OPTIMIZE_GROUNDING, {
    incumbent: planLines,
    probes: false,
    timeLimit: opts.timeLimit,
    deadline,
    memoryLimitMb: opts.memoryLimitMb,
    signal: opts.signal,
    onProgress: opts.onProgress,
    proofChecker: dratChecker,
    stateSpaceCheck: stateSpaceChecker,
  });
  try {
    base.notes.push(...o.notes);
    const fromIncumbent = o.timeline.find((e) => e.kind === "plan")?.detail === "incumbent";
    const cheaper = o.cost !== null && o.cost < newCost;
    const proven = o.status === "optimal";
    const verdict: RejudgeVerdict = cheaper ? "cheaper-plan" : newCost !== recordedCost ? "cost-changed" : proven ? "still-optimal" : "undecided";
    let certificate: string | null = null;
    if (opts.certificateOut) {
      if (o.certificate) {
        await writeCertificate(opts.certificateOut, o.certificate);
        certificate = opts.certificateOut;
      } else base.notes.push(`no certificate written: optimality in the new model was not proven (${o.stopReason ?? o.status})`);
    }
    return done({
      verdict,
      modelChanged: true,
      planValid: true,
      failure: null,
      newCost,
      optimal: cheaper ? false : proven && o.cost === newCost ? true : null,
      cheaperPlan: cheaper ? { plan: o.plan!.names, cost: o.cost!, proven, text: planFile(o.plan!, proven ? o.how : null) } : null,
      certificate,
      audit: null,
      change,
      reuse: [
        fromIncumbent
          ? {
              part: "incumbent",
              reused: true,
              why:
                `the recorded plan replays on the new model at cost ${newCost}; a valid plan is only an upper bound, so starting from it cannot make a claim wrong ` +
                `(optimality still rests on the new proof); it replaces the first-plan search, and when the plan is still optimal only the final refutation is left`,
            }
          : notReused("incumbent", "the optimizer did not accept the recorded plan as a plan of its ground task (see the notes)"),
        reuseHorizon,
        notReused("proof", proofWhy),
      ],
      provedBy: o.provedBy,
      stopReason: o.stopReason,
      exitCode: EXIT[verdict],
    });
  } finally {
    disposeOutcome(o);
  }
}
