// The certificate fields no claim rests on (sizes, counts, the plan file's cost comment, timing):
// each is either compared with what the audit recomputed, or named as not verified, so an edited
// field is caught or at least never presented as checked.
import type { Task } from "../ground/index.js";
import { readPlanFileHeader } from "../plan/index.js";
import type { CertificateJson } from "./format.js";

/** What the audit recomputed along the way (absent when that part did not run). */
export interface Recomputed {
  task?: Task;
  /** The rebuilt CNF: variables, and clauses with the bound units. */
  cnf?: { variables: number; clauses: number };
  /** Size of proof.drat.gz as read. */
  proofBytes?: number;
  /** Size of the plan as replayed, and the plan file's text. */
  planText?: string;
  planCost?: number;
  /** The horizon the formula was rebuilt with. */
  acceptedHorizon?: number;
}

export interface InformationalResult {
  checked: string[];
  mismatches: string[];
  /** Recorded but not re-derived: informational only. */
  unverified: string[];
}

/** Fields listed as informational only (what they say is not checked by any audit check). */
export const UNVERIFIED_FIELDS = ["toolVersion", "created", "timeline", "reduction", "proof.uncompressedBytes", "proof.engine"] as const;

/** The cost a plan file states (the `; cost: 12` line of our header, or an older plumbline file's cost line), or null when it states none. */
export function statedCost(planText: string): number | null {
  return readPlanFileHeader(planText).cost;
}

export function checkInformational(cert: CertificateJson, r: Recomputed): InformationalResult {
  const out: InformationalResult = { checked: [], mismatches: [], unverified: [...UNVERIFIED_FIELDS] };
  // a suffix proof's note on the threshold it made unnecessary: for people, no claim rests on it
  if ((cert as { thresholdAvoided?: unknown }).thresholdAvoided !== undefined) out.unverified.push("thresholdAvoided");
  const compare = (field: string, recorded: unknown, actual: number | undefined) => {
    if (actual === undefined) {
      out.unverified.push(field);
      return;
    }
    out.checked.push(field);
    if (recorded !== actual) out.mismatches.push(`${field} records ${JSON.stringify(recorded)}, recomputed ${actual}`);
  };
  if (cert.grounding) {
    compare("grounding.facts", cert.grounding.facts, r.task?.facts.length);
    compare("grounding.actions", cert.grounding.actions, r.task?.actions.length);
  }
  if (cert.cnf) {
    compare("cnf.variables", cert.cnf.variables, r.cnf?.variables);
    compare("cnf.clauses", cert.cnf.clauses, r.cnf?.clauses);
  }
  if (cert.proof) compare("proof.bytes", cert.proof.bytes, r.proofBytes);
  if (r.planText !== undefined) {
    const stated = statedCost(r.planText);
    if (stated !== null) compare("plan.txt stated cost", stated, r.planCost);
  }
  return out;
}
