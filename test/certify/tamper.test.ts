// Every tampering with a certificate is rejected with the failing check named: plan, cost,
// horizon and each number of its derivation, encoding, CNF hash, proof bytes, inputs.
import * as fs from "node:fs";
import { tmpdir } from "node:os";
import * as path from "node:path";
import { gunzipSync, gzipSync } from "node:zlib";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { auditCertificate, sha256, writeCertificate } from "../../src/certify/index.js";
import { groundFiles } from "../../src/ground/index.js";
import { disposeOutcome, optimizeFiles } from "../../src/optimize/index.js";
import { formatPlan } from "../../src/plan/index.js";
import { gbfs, planSteps } from "../../src/search/index.js";

const root = path.resolve(import.meta.dirname, "../..");
const harbour = (f: string) => path.join(root, "benchmarks/domains/harbour", f);
const work = fs.mkdtempSync(path.join(tmpdir(), "plumbline-tamper-"));
const original = path.join(work, "original");
let copies = 0;

beforeAll(async () => {
  // threshold proofs only: this file tampers with the horizon derivation such a certificate carries
  const out = await optimizeFiles(harbour("domain.pddl"), harbour("problem-01.pddl"), { suffix: false });
  expect(out.how).toBe("horizon-unsat");
  await writeCertificate(original, out.certificate!);
  disposeOutcome(out);
}, 60_000);
afterAll(() => fs.rmSync(work, { recursive: true, force: true }));

/** A copy of the certificate changed by `edit`, audited; returns the names of failed checks. */
function tampered(edit: (dir: string, json: any) => void): { failed: string[]; valid: boolean } {
  const dir = path.join(work, `copy-${++copies}`);
  fs.cpSync(original, dir, { recursive: true });
  const file = path.join(dir, "certificate.json");
  const json = JSON.parse(fs.readFileSync(file, "utf8"));
  edit(dir, json);
  fs.writeFileSync(file, JSON.stringify(json, null, 2));
  const r = auditCertificate(dir);
  fs.rmSync(dir, { recursive: true, force: true });
  return { valid: r.valid, failed: r.checks.filter((c) => !c.ok && !c.skipped).map((c) => c.name) };
}

/** Every numeric leaf of a JSON value, as a path of keys. */
function numericLeaves(v: unknown, at: (string | number)[] = []): (string | number)[][] {
  if (typeof v === "number") return [at];
  if (Array.isArray(v)) return v.flatMap((x, i) => numericLeaves(x, [...at, i]));
  if (v !== null && typeof v === "object") return Object.entries(v).flatMap(([k, x]) => numericLeaves(x, [...at, k]));
  return [];
}
const setAt = (obj: any, p: (string | number)[], f: (x: number) => number) => {
  let o = obj;
  for (const k of p.slice(0, -1)) o = o[k];
  o[p[p.length - 1]] = f(o[p[p.length - 1]]);
};

describe("audit of a horizon-unsat certificate", () => {
  it("passes untouched, with every check run", () => {
    const r = auditCertificate(original);
    expect(r.checks.filter((c) => !c.ok)).toEqual([]);
    expect(r.valid).toBe(true);
    expect(r.checks.map((c) => c.name)).toEqual([
      "format",
      "input-hashes",
      "ground",
      "plan-hash",
      "plan-replay",
      "plan-cost",
      "horizon-upper-cost",
      "horizon-derivation",
      "encoding",
      "cost-bound-clauses",
      "cnf-hash",
      "proof-hash",
      "proof-check",
      "second-derivation",
      "informational",
    ]);
  });

  it("rejects a changed plan file (hash), and a valid but dearer plan with its hash updated (cost)", () => {
    expect(tampered((dir) => fs.appendFileSync(path.join(dir, "plan.txt"), "(drive truck1 quay1 yard1)\n")).failed).toContain("plan-hash");
    // GBFS's first plan for this instance is valid but dearer than the optimum
    const { task } = groundFiles(harbour("domain.pddl"), harbour("problem-01.pddl"));
    const g = gbfs(task);
    const text = formatPlan(planSteps(task, g.plan!));
    expect(g.cost).toBeGreaterThan(JSON.parse(fs.readFileSync(path.join(original, "certificate.json"), "utf8")).plan.cost);
    const r = tampered((dir, json) => {
      fs.writeFileSync(path.join(dir, "plan.txt"), text);
      json.plan.sha256 = sha256(text);
    });
    expect(r.failed).toEqual(["plan-cost"]);
  });

  it("rejects a changed cost or length", () => {
    expect(tampered((_d, j) => (j.plan.cost -= 1)).failed).toContain("plan-cost");
    expect(tampered((_d, j) => (j.plan.length += 1)).failed).toContain("plan-cost");
  });

  it("rejects a changed horizon and every changed number of every derivation", () => {
    expect(tampered((_d, j) => (j.horizon.horizon -= 1)).failed).toContain("horizon-derivation");
    const leaves = numericLeaves(JSON.parse(fs.readFileSync(path.join(original, "certificate.json"), "utf8")).horizon.methods);
    expect(leaves.length).toBeGreaterThan(5);
    for (const p of leaves) {
      const r = tampered((_d, j) => setAt(j.horizon.methods, p, (x) => x + 1));
      expect(r.failed, `methods.${p.join(".")}`).toContain("horizon-derivation");
    }
  });

  it("rejects an upper cost below the claimed cost", () => {
    expect(tampered((_d, j) => (j.horizon.upperCost = j.plan.cost - 1)).failed).toContain("horizon-upper-cost");
  });

  it("rejects a changed encoding id, step count, step encoding or bound", () => {
    expect(tampered((_d, j) => (j.encoding.id = "seq-1+cost-adder-1+empty-steps-last-1")).failed).toContain("encoding");
    expect(tampered((_d, j) => (j.encoding.params.steps += 1)).failed).toContain("encoding");
    expect(tampered((_d, j) => (j.encoding.bound += 1)).failed).toContain("encoding");
    // a different (known) step encoding builds a different CNF, which the recorded hash does not match
    const r = tampered((_d, j) => {
      j.encoding.step = "seq-1";
      j.encoding.id = "seq-1+cost-adder-1+empty-steps-last-1";
    });
    expect(r.failed).toContain("cnf-hash");
    expect(tampered((_d, j) => (j.encoding.costBoundClauses[1] = -j.encoding.costBoundClauses[1])).failed).toContain("cost-bound-clauses");
  });

  it("rejects a changed CNF hash", () => {
    expect(tampered((_d, j) => (j.cnf.sha256 = "0".repeat(64))).failed).toEqual(["cnf-hash"]);
  });

  it("rejects changed proof bytes, a corrupted lemma and a truncated proof", () => {
    const proof = (d: string) => path.join(d, "proof.drat.gz");
    expect(tampered((d) => fs.writeFileSync(proof(d), Buffer.concat([fs.readFileSync(proof(d)), Buffer.from([0])]))).failed).toContain("proof-hash");
    // a lemma literal changed (hash updated): the checker must find the proof wrong
    const corrupt = tampered((d, j) => {
      const raw = gunzipSync(fs.readFileSync(proof(d)));
      // binary DRAT: 'a' lit… 0; flip the sign bit of the first literal of every 3rd added lemma
      let count = 0;
      for (let i = 0; i < raw.length; i++) {
        if (raw[i] === 0x61 && (i === 0 || raw[i - 1] === 0)) {
          if (count++ % 3 === 0 && raw[i + 1] !== 0) raw[i + 1] ^= 1;
        }
      }
      const gz = gzipSync(raw);
      fs.writeFileSync(proof(d), gz);
      j.proof.sha256 = sha256(gz);
    });
    expect(corrupt.failed).toEqual(["proof-check", "informational"]); // the recompressed proof's size differs from proof.bytes too
    const truncated = tampered((d, j) => {
      const raw = gunzipSync(fs.readFileSync(proof(d)));
      const gz = gzipSync(raw.subarray(0, Math.floor(raw.length / 3)));
      fs.writeFileSync(proof(d), gz);
      j.proof.sha256 = sha256(gz);
    });
    expect(truncated.failed).toEqual(["proof-check", "informational"]);
    expect(tampered((d) => fs.rmSync(proof(d))).failed).toContain("proof-hash");
  });

  it("checks the informational fields it can recompute and names the others as not verified", () => {
    for (const [field, edit] of [
      ["cnf.variables", (j: any) => (j.cnf.variables += 1)],
      ["cnf.clauses", (j: any) => (j.cnf.clauses -= 1)],
      ["proof.bytes", (j: any) => (j.proof.bytes += 7)],
      ["grounding.facts", (j: any) => (j.grounding.facts += 1)],
      ["grounding.actions", (j: any) => (j.grounding.actions = 0)],
    ] as const) {
      const r = tampered((_d, j) => edit(j));
      expect(r.failed, field).toEqual(["informational"]);
    }
    // fields no check can recompute: the certificate stays valid, and the audit says they are unverified
    const dir = path.join(work, "informational");
    fs.cpSync(original, dir, { recursive: true });
    const file = path.join(dir, "certificate.json");
    const j = JSON.parse(fs.readFileSync(file, "utf8"));
    j.toolVersion = "9.9.9";
    j.timeline = [];
    fs.writeFileSync(file, JSON.stringify(j));
    const r = auditCertificate(dir);
    expect(r.valid).toBe(true);
    const info = r.checks.find((c) => c.name === "informational")!;
    expect(info.detail).toMatch(/checked grounding\.facts, grounding\.actions, cnf\.variables, cnf\.clauses, proof\.bytes/);
    expect(info.detail).toMatch(/not verified \(informational only\): toolVersion, created, timeline/);
  });

  it("rejects a swapped problem file, and a changed domain file", () => {
    expect(tampered((d) => fs.copyFileSync(harbour("problem-02.pddl"), path.join(d, "problem.pddl"))).failed).toContain("input-hashes");
    expect(tampered((d) => fs.appendFileSync(path.join(d, "domain.pddl"), "\n; comment\n")).failed).toContain("input-hashes");
    // a swapped problem with its hash updated is still caught: the plan or the formula no longer fits
    const r = tampered((d, j) => {
      fs.copyFileSync(harbour("problem-02.pddl"), path.join(d, "problem.pddl"));
      j.inputs.problem.sha256 = sha256(fs.readFileSync(path.join(d, "problem.pddl")));
    });
    expect(r.valid).toBe(false);
    expect(r.failed.length).toBeGreaterThan(0);
  });

  it("rejects a changed claim and format version", () => {
    expect(tampered((_d, j) => (j.claim.how = "relaxed-unreachable")).failed).toContain("format");
    expect(tampered((_d, j) => (j.formatVersion = 99)).failed).toContain("format");
    expect(tampered((_d, j) => (j.claim.how = "lower-bound")).failed).toContain("landmark-check");
  });
});
