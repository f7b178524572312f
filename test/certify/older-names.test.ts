// Certificates that record the older horizon words (methods "explicit-optimal" and "explicit",
// keys c_min and c_min_positive) are read in today's words and keep auditing; a tampered number
// under an older key is still caught, and a certificate in today's words passes through unchanged.
import * as fs from "node:fs";
import { tmpdir } from "node:os";
import * as path from "node:path";
import { afterAll, describe, expect, it } from "vitest";
import { auditCertificate, readCertificateJson } from "../../src/certify/index.js";
import { inTodaysWords, OLDER_METHOD_NAMES } from "../../src/certify/older-names.js";
import { METHODS } from "../../src/horizon/methods.js";

// a format-1 certificate written after the exact method existed (its derivation is compared in full)
const legacy = path.resolve(import.meta.dirname, "../../benchmarks/regression/harbour-02/certificate");
const work = fs.mkdtempSync(path.join(tmpdir(), "plumbline-older-names-"));
afterAll(() => fs.rmSync(work, { recursive: true, force: true }));

describe("older words in certificates", () => {
  it("a format-1 certificate records the older words, is read in today's, and audits valid", () => {
    const raw = fs.readFileSync(path.join(legacy, "certificate.json"), "utf8");
    expect(raw).toContain('"method": "explicit-optimal"');
    expect(raw).toContain('"c_min"');
    const cert = readCertificateJson(legacy);
    const text = JSON.stringify(cert.horizon);
    expect(text).not.toMatch(/explicit-optimal|"method":"explicit"|c_min/);
    const today = new Set(METHODS.map((m) => m.name));
    for (const m of (cert.horizon as { methods: Array<{ method: string }> }).methods) expect(today.has(m.method), m.method).toBe(true);
    expect(Object.values(OLDER_METHOD_NAMES).every((n) => today.has(n))).toBe(true);
    expect(auditCertificate(legacy).valid).toBe(true);
  });

  it("a number changed under an older key is still rejected", () => {
    const dir = path.join(work, "tampered");
    fs.cpSync(legacy, dir, { recursive: true });
    const json = JSON.parse(fs.readFileSync(path.join(dir, "certificate.json"), "utf8"));
    const cost = json.horizon.methods.find((m: { method: string }) => m.method === "cost");
    cost.derivation.c_min += 1;
    fs.writeFileSync(path.join(dir, "certificate.json"), JSON.stringify(json, null, 2));
    const r = auditCertificate(dir);
    expect(r.valid).toBe(false);
    expect(r.checks.filter((c) => !c.ok && !c.skipped).map((c) => c.name)).toContain("horizon-derivation");
  });

  it("a certificate in today's words is returned as it is", () => {
    const cert = { formatVersion: 2, horizon: { winner: "optimal-length", methods: [{ method: "cost", value: 3, derivation: { minCost: 2, formula: "x" } }] } };
    expect(inTodaysWords(cert)).toEqual(cert);
  });
});
