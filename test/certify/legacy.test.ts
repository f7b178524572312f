// Certificates written by an earlier version (test/certify/fixtures/legacy) keep auditing with
// the current code, and tampered copies of them are still rejected with the failing check named.
import * as fs from "node:fs";
import { tmpdir } from "node:os";
import * as path from "node:path";
import { gunzipSync, gzipSync } from "node:zlib";
import { afterAll, describe, expect, it } from "vitest";
import { AUDITABLE_FORMAT_VERSIONS, auditCertificate, FORMAT_VERSION, sha256 } from "../../src/certify/index.js";
import { computeHorizon } from "../../src/horizon/index.js";
import { groundFiles } from "../../src/ground/index.js";
import { optimalCost } from "../support/reference.js";

// The fixtures are the exact output of `plumbline solve … --certificate` at commit da6494f (before
// tighter horizons and before the encoder knew parts): harbour problem-01 with forall-1 and seq-1
// (both with the then-optimizer extension empty-steps-last-1), with forall-2 and no extension, and a
// 2-action task proven unsolvable ("one-shot": both actions consume the only f0, the goal needs
// both). Re-running that commit's CLI reproduced their CNF and proof hashes byte for byte.
const legacy = path.resolve(import.meta.dirname, "fixtures/legacy");
const fixtures = fs.readdirSync(legacy).sort();
const work = fs.mkdtempSync(path.join(tmpdir(), "plumbline-legacy-"));
afterAll(() => fs.rmSync(work, { recursive: true, force: true }));
let copies = 0;

const readCert = (dir: string) => JSON.parse(fs.readFileSync(path.join(dir, "certificate.json"), "utf8"));

/** Audits a copy of fixture `name` changed by `edit`; returns the names of the failed checks. */
function tampered(name: string, edit: (dir: string, json: any) => void): { valid: boolean; failed: string[] } {
  const dir = path.join(work, `copy-${++copies}`);
  fs.cpSync(path.join(legacy, name), dir, { recursive: true });
  const json = readCert(dir);
  edit(dir, json);
  fs.writeFileSync(path.join(dir, "certificate.json"), JSON.stringify(json, null, 2));
  const r = auditCertificate(dir);
  fs.rmSync(dir, { recursive: true, force: true });
  return { valid: r.valid, failed: r.checks.filter((c) => !c.ok && !c.skipped).map((c) => c.name) };
}

/** Keeps the first half of the proof's lemmas (binary DRAT, gzip), with its recorded hash updated. */
function truncateProof(dir: string, json: any): void {
  const file = path.join(dir, "proof.drat.gz");
  const raw = gunzipSync(fs.readFileSync(file));
  const ends: number[] = [];
  for (let i = 0; i < raw.length; i++) if (raw[i] === 0 && (i + 1 === raw.length || raw[i + 1] === 0x61 || raw[i + 1] === 0x64)) ends.push(i + 1);
  const cut = ends.length > 1 ? ends[Math.floor(ends.length / 2) - 1] : 0;
  const gz = gzipSync(raw.subarray(0, cut));
  fs.writeFileSync(file, gz);
  json.proof.sha256 = sha256(gz);
  json.proof.bytes = gz.length;
  json.proof.uncompressedBytes = cut;
}

describe("certificates of an earlier version", () => {
  it("are the four expected fixtures, small", () => {
    expect(fixtures).toEqual(["harbour-01-forall-1", "harbour-01-forall-2-plain", "harbour-01-seq-1", "one-shot-unsolvable"]);
    for (const f of fixtures) for (const file of fs.readdirSync(path.join(legacy, f))) expect(fs.statSync(path.join(legacy, f, file)).size).toBeLessThan(20_000);
  });

  it("every format version the audit reads is kept: the current one is written, each earlier one has a fixture", () => {
    expect(AUDITABLE_FORMAT_VERSIONS).toContain(FORMAT_VERSION);
    const kept = new Set(fixtures.map((f) => readCert(path.join(legacy, f)).formatVersion));
    for (const v of AUDITABLE_FORMAT_VERSIONS) if (v !== FORMAT_VERSION) expect(kept.has(v), `a fixture of format version ${v}`).toBe(true);
    for (const v of kept) expect(AUDITABLE_FORMAT_VERSIONS).toContain(v);
  });

  for (const name of fixtures) {
    it(`${name} audits valid with the current code`, () => {
      const dir = path.join(legacy, name);
      const r = auditCertificate(dir);
      expect(r.checks.filter((c) => !c.ok)).toEqual([]);
      expect(r.valid).toBe(true);
      expect(r.checks.map((c) => c.name)).toContain("proof-check");
      const cert = readCert(dir);
      const { task } = groundFiles(path.join(dir, "domain.pddl"), path.join(dir, "problem.pddl"));
      // source: the reference Dijkstra (test/support/reference.ts) on the grounded task; for harbour
      // problem-01 also benchmarks/domains/harbour/instances.json (optimal cost 20)
      const ref = optimalCost(task);
      if (name === "one-shot-unsolvable") {
        expect(r.claim?.status).toBe("unsolvable");
        expect(ref).toBeNull();
      } else {
        expect(r.claim?.status).toBe("optimal");
        expect(r.cost).toBe(20);
        expect(ref?.cost).toBe(20);
      }
      // these were written with looser thresholds: the recorded horizon is above today's
      const now = computeHorizon(task, cert.horizon.upperCost === "Infinity" ? Infinity : cert.horizon.upperCost).horizon;
      expect(cert.encoding.params.steps).toBeGreaterThan(now);
      expect(r.checks.find((c) => c.name === "horizon-derivation")!.detail).toContain(`above the recomputed threshold ${now}`);
    });
  }

  it("a truncated proof is rejected (each harbour fixture)", () => {
    // (one-shot-unsolvable's CNF is refuted by unit propagation alone — its goal facts are in one
    // mutex group — so any prefix of its proof, even the empty one, is a valid refutation)
    for (const name of fixtures.filter((f) => f.startsWith("harbour"))) {
      const r = tampered(name, truncateProof);
      expect(r.valid, name).toBe(false);
      expect(r.failed, name).toContain("proof-check");
    }
  });

  it("changed proof bytes without a new hash are rejected", () => {
    const r = tampered("harbour-01-seq-1", (dir) => fs.appendFileSync(path.join(dir, "proof.drat.gz"), Buffer.from([0])));
    expect(r.failed).toContain("proof-hash");
  });

  it("a changed plan is rejected (hash, and replay with the hash updated)", () => {
    expect(tampered("harbour-01-forall-1", (dir) => fs.appendFileSync(path.join(dir, "plan.txt"), "(drive t1 quay1 yard1)\n")).failed).toContain("plan-hash");
    const r = tampered("harbour-01-forall-1", (dir, json) => {
      const text = fs.readFileSync(path.join(dir, "plan.txt"), "utf8").replace("(drive t1 yard1 depot1)\n", "");
      fs.writeFileSync(path.join(dir, "plan.txt"), text);
      json.plan.sha256 = sha256(text);
    });
    expect(r.valid).toBe(false);
    expect(r.failed).toContain("plan-replay");
  });

  it("a recorded horizon at or below the recomputed threshold, or a horizon not matching the CNF, is rejected", () => {
    for (const name of ["harbour-01-forall-2-plain", "one-shot-unsolvable"]) {
      const dir = path.join(legacy, name);
      const cert = readCert(dir);
      const { task } = groundFiles(path.join(dir, "domain.pddl"), path.join(dir, "problem.pddl"));
      const now = computeHorizon(task, cert.horizon.upperCost === "Infinity" ? Infinity : cert.horizon.upperCost).horizon;
      expect(tampered(name, (_d, j) => (j.horizon.horizon = now)).failed).toContain("horizon-derivation");
      expect(tampered(name, (_d, j) => (j.horizon.horizon = now - 1)).failed).toContain("horizon-derivation");
      // recorded horizon and steps raised together: the CNF (and so its hash) is another one
      const r = tampered(name, (_d, j) => {
        j.horizon.horizon += 1;
        j.encoding.params.steps += 1;
      });
      expect(r.valid).toBe(false);
      expect(r.failed).toContain("cnf-hash");
      // steps raised alone: no longer the recorded horizon
      expect(tampered(name, (_d, j) => (j.encoding.params.steps += 1)).failed).toContain("encoding");
    }
  });

  it("one-shot-unsolvable: changed mutex groups or a claim of optimality are rejected", () => {
    expect(tampered("one-shot-unsolvable", (_d, j) => (j.encoding.params.mutexGroups = [])).failed).toContain("encoding");
    expect(tampered("one-shot-unsolvable", (_d, j) => (j.claim.status = "optimal")).valid).toBe(false);
  });

  it("a changed part list or claimed cost is rejected", () => {
    expect(tampered("harbour-01-seq-1", (_d, j) => (j.encoding.extensions = []))).toMatchObject({ valid: false });
    expect(tampered("harbour-01-seq-1", (_d, j) => (j.encoding.extensions = ["empty-steps-last-1", "reach-1"])).failed).toContain("encoding");
    expect(tampered("harbour-01-forall-1", (_d, j) => (j.plan.cost -= 1)).failed).toContain("plan-cost");
  });
});
