// Outside checks on public instances (test/fixtures/public, origin line in each file): solve
// proves the published optimal cost, and the certificate audits.
import * as fs from "node:fs";
import { tmpdir } from "node:os";
import * as path from "node:path";
import { afterAll, describe, expect, it } from "vitest";
import { auditCertificate, writeCertificate } from "../../src/certify/index.js";
import { disposeOutcome, optimizeFiles } from "../../src/optimize/index.js";

const dir = path.resolve(import.meta.dirname, "../fixtures/public");
const work = fs.mkdtempSync(path.join(tmpdir(), "plumbline-public-"));
afterAll(() => fs.rmSync(work, { recursive: true, force: true }));

async function proveAndAudit(domain: string, problem: string, timeLimit: number): Promise<{ cost: number | null; how: string | null; failed: string[] }> {
  const out = await optimizeFiles(path.join(dir, domain), path.join(dir, problem), { timeLimit });
  const cert = path.join(work, problem.replace(/\.pddl$/, ""));
  if (!out.certificate) {
    disposeOutcome(out);
    return { cost: out.status === "optimal" ? out.cost : null, how: out.how, failed: ["no certificate"] };
  }
  await writeCertificate(cert, out.certificate);
  disposeOutcome(out);
  const a = auditCertificate(cert);
  return { cost: out.cost, how: out.how, failed: a.checks.filter((c) => !c.ok).map((c) => c.name) };
}

describe("published optimal costs (IPC 2008, sequential-optimal track)", () => {
  it("woodworking p01: 170 (all costs positive), proven and audited", async () => {
    const r = await proveAndAudit("woodworking-domain.pddl", "woodworking-problem-01.pddl", 240);
    expect(r.cost).toBe(170); // from memory: IPC 2008 optimal-track result for woodworking p01
    expect(r.failed).toEqual([]);
  }, 300_000);

  it("parc-printer p01: 169009 (one zero-cost action), proven and audited", async () => {
    const r = await proveAndAudit("parc-printer-domain-01.pddl", "parc-printer-problem-01.pddl", 240);
    expect(r.cost).toBe(169009); // from memory: IPC 2008 optimal-track result for parc-printer p01
    expect(r.failed).toEqual([]);
  }, 300_000);

  it.skipIf(!process.env.PLUMBLINE_SLOW)("elevator p01: 42 (mostly zero-cost actions), proven and audited (slow)", async () => {
    const r = await proveAndAudit("elevator-domain.pddl", "elevator-problem-01.pddl", 1500);
    expect(r.cost).toBe(42); // from memory: IPC 2008 optimal-track result for elevator p01
    expect(r.failed).toEqual([]);
  }, 1_800_000);
});
