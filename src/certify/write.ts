// Writes a certificate directory from the optimizer's material: inputs, plan, claim, horizon
// derivation, formula parameters and CNF hash, gzipped DRAT proof or landmark record — atomically.
import { createHash } from "node:crypto";
import * as fs from "node:fs";
import * as path from "node:path";
import { pipeline } from "node:stream/promises";
import { createGzip, gzipSync } from "node:zlib";
import { horizonReportJson } from "../horizon/index.js";
import { canonicalCnfSha256, costSetting, formulaId, planFile, type CertificateMaterial } from "../optimize/index.js";
import { PlumblineError } from "../util/errors.js";
import { writeDirAtomic } from "../util/files.js";
import { VERSION } from "../util/version.js";
import { CAUTION, CERTIFICATE_KIND, CNF_FORM, COST_SETTING_KEY, FILES, FORMAT_VERSION, type CertificateJson } from "./format.js";

export function sha256(data: string | Uint8Array): string {
  return createHash("sha256").update(data).digest("hex");
}

export function sha256File(file: string): string {
  const h = createHash("sha256");
  const fd = fs.openSync(file, "r");
  try {
    const buf = Buffer.allocUnsafe(1 << 20);
    for (;;) {
      const n = fs.readSync(fd, buf, 0, buf.length, null);
      if (n === 0) break;
      h.update(buf.subarray(0, n));
    }
  } finally {
    fs.closeSync(fd);
  }
  return h.digest("hex");
}

/** JSON numbers for finite values, "Infinity" otherwise (certificate.json stays plain JSON). */
const jsonNum = (x: number): number | string => (Number.isFinite(x) ? x : "Infinity");

export interface WrittenCertificate {
  dir: string;
  json: CertificateJson;
}

/**
 * Writes the certificate for `m` into `dir` (replacing an existing directory only once the
 * new one is complete). Only `optimal` and `unsolvable` claims have certificates.
 */
export async function writeCertificate(dir: string, m: CertificateMaterial): Promise<WrittenCertificate> {
  const { model, task, prepared, claim } = m;
  if (claim.status === "optimal" && m.plan === null) throw new Error("certify: an optimality certificate needs a plan");
  if (claim.how === "horizon-unsat" && (!m.formula || !m.proof || !m.horizon)) throw new Error("certify: a horizon-unsat certificate needs a formula, a horizon and a proof");
  if (claim.how === "suffix-unsat" && (!m.formula || !m.proof)) throw new Error("certify: a suffix-unsat certificate needs a formula and a proof");
  // plan.txt in plumbline's plan-file layout, its header naming the claim and how it is proven
  const planText = m.plan ? planFile(m.plan, claim.how) : null;
  const json: CertificateJson = {
    formatVersion: FORMAT_VERSION,
    kind: CERTIFICATE_KIND,
    toolVersion: VERSION,
    created: new Date().toISOString(),
    inputs: {
      domain: { file: FILES.domain, sha256: sha256(model.domainText), name: model.domain.name },
      problem: { file: FILES.problem, sha256: sha256(model.problemText), name: model.problem.name },
    },
    claim,
    plan: m.plan && planText !== null ? { file: FILES.plan, sha256: sha256(planText), cost: m.plan.cost, length: m.plan.length } : null,
    grounding: { relevance: m.groundOptions.relevance ?? false, facts: task.facts.length, actions: task.actions.length },
    reduction: { facts: prepared.task.facts.length, actions: prepared.task.actions.length, variables: prepared.variables.variables.length },
    horizon: null,
    encoding: null,
    cnf: null,
    proof: null,
    lowerBound: null,
    timeline: m.timeline.map((e) => ({ ...e, lower: jsonNum(e.lower) })),
    caution: CAUTION,
  };
  let landmarksText: string | null = null;
  let searchBytes: Buffer | null = null;
  if (claim.how === "horizon-unsat" || claim.how === "suffix-unsat") {
    const f = m.formula!;
    const setting = costSetting(f.spec);
    if (claim.how === "horizon-unsat") {
      json.horizon = horizonReportJson(m.horizon!);
      if (m.horizonLimits) json.horizonLimits = { ...m.horizonLimits };
    }
    else json.thresholdAvoided = m.horizon ? { upperCost: m.horizon.upperCost, horizon: Number.isFinite(m.horizon.horizon) ? m.horizon.horizon : m.horizon.horizonText, method: m.horizon.winner } : null;
    json.encoding = {
      id: formulaId(f.spec),
      step: f.spec.encoding,
      cost: f.params.cost,
      parts: [...f.spec.parts],
      params: { steps: f.spec.steps, [COST_SETTING_KEY[setting.name]]: setting.value, mutexGroups: f.params.mutexGroups },
      ...(f.params.partParams ? { partParams: JSON.parse(JSON.stringify(f.params.partParams)) as Record<string, unknown> } : {}),
      bound: m.bound,
      costBoundClauses: [...m.units],
    };
    json.cnf = { sha256: canonicalCnfSha256(f, m.units), variables: f.numVars, clauses: f.numClauses + m.units.length, form: CNF_FORM };
  } else if (claim.how === "state-space") {
    if (!m.stateSpace) throw new Error("certify: a state-space certificate needs the search's figures");
    json.stateSpace = { states: m.stateSpace.states, cost: m.stateSpace.cost, method: "Dijkstra over every reachable state of the ground task" };
  } else if (claim.how === "landmark-search") {
    const rec = m.searchRecord;
    if (!rec) throw new Error("certify: a landmark-search certificate needs the search record");
    searchBytes = gzipSync(JSON.stringify(rec.entries));
    json.search = { file: FILES.search, sha256: sha256(searchBytes), bound: rec.bound, states: rec.entries.length, expanded: rec.entries.filter((e) => e.expanded).length, task: "the analysed task (goal relevance, h² and simplification of the ground task), as the audit rebuilds it" };
  } else if (claim.how === "lower-bound") {
    const rec = m.landmarks ?? { bound: 0, landmarks: [] };
    landmarksText = JSON.stringify(rec, null, 1) + "\n";
    json.lowerBound = { file: FILES.landmarks, sha256: sha256(landmarksText), method: "landmark-cut", bound: rec.bound };
  }

  await writeDirAtomic(dir, async (tmp) => {
    fs.writeFileSync(path.join(tmp, FILES.domain), model.domainText);
    fs.writeFileSync(path.join(tmp, FILES.problem), model.problemText);
    if (planText !== null) fs.writeFileSync(path.join(tmp, FILES.plan), planText);
    if (landmarksText !== null) fs.writeFileSync(path.join(tmp, FILES.landmarks), landmarksText);
    if (searchBytes !== null) fs.writeFileSync(path.join(tmp, FILES.search), searchBytes);
    if (m.proof) {
      const target = path.join(tmp, FILES.proof);
      try {
        await pipeline(fs.createReadStream(m.proof.file), createGzip({ level: 6 }), fs.createWriteStream(target));
      } catch (e) {
        throw new PlumblineError("io", `cannot write the proof into ${dir}: ${(e as Error).message}`);
      }
      json.proof = {
        file: FILES.proof,
        sha256: sha256File(target),
        format: m.proof.format === "binary" ? "drat-binary" : "drat-text",
        compression: "gzip",
        bytes: fs.statSync(target).size,
        uncompressedBytes: m.proof.bytes,
        engine: m.proof.engine,
      };
    }
    fs.writeFileSync(path.join(tmp, FILES.certificate), JSON.stringify(json, null, 2) + "\n");
  });
  return { dir, json };
}
