// Proven optima against outside facts (Towers of Hanoi, gripper) and against the reference
// Dijkstra on scenario instances and random tasks — every proof audited by the certificate checker.
import * as fs from "node:fs";
import { tmpdir } from "node:os";
import * as path from "node:path";
import fc from "fast-check";
import { afterAll, describe, expect, it } from "vitest";
import { scenarios, generateProblem } from "../../benchmarks/domains/index.js";
import { auditCertificate, writeCertificate } from "../../src/certify/index.js";
import { ground } from "../../src/ground/index.js";
import { disposeOutcome, optimize, optimizeFiles, OPTIMIZE_GROUNDING, type OptimizeOptions, type OptimizeOutcome } from "../../src/optimize/index.js";
import { modelFromTexts } from "../../src/pddl/index.js";
import { factoredSpecArb, taskFromSpec } from "../support/random-task.js";
import { optimalCost } from "../support/reference.js";
import { taskToPddl } from "./support/task-pddl.js";

const root = path.resolve(import.meta.dirname, "../..");
const fixture = (p: string) => path.join(root, "test/fixtures/pddl", p);
const scenarioFile = (sc: string, f: string) => path.join(root, "benchmarks/domains", sc, f);
const work = fs.mkdtempSync(path.join(tmpdir(), "plumbline-opt-test-"));
afterAll(() => fs.rmSync(work, { recursive: true, force: true }));
let certs = 0;

/** Writes the outcome's certificate, audits it, and returns the audit's verdict. */
async function certifyAndAudit(out: OptimizeOutcome): Promise<boolean> {
  expect(out.certificate).not.toBeNull();
  const dir = path.join(work, `cert-${++certs}`);
  await writeCertificate(dir, out.certificate!);
  disposeOutcome(out);
  const a = auditCertificate(dir);
  if (!a.valid) throw new Error(`audit rejected: ${a.checks.filter((c) => !c.ok).map((c) => `${c.name}: ${c.detail}`).join("; ")}`);
  fs.rmSync(dir, { recursive: true, force: true });
  return a.valid;
}

async function solveText(domain: string, problem: string, opts: OptimizeOptions = {}): Promise<{ out: OptimizeOutcome; reference: number | null }> {
  const model = modelFromTexts(domain, "domain.pddl", problem, "problem.pddl");
  const task = ground(model, OPTIMIZE_GROUNDING);
  const ref = optimalCost(ground(model));
  const out = await optimize(model, task, OPTIMIZE_GROUNDING, opts);
  return { out, reference: ref ? ref.cost : null };
}

describe("classic puzzles (proven by SAT at a completeness threshold, audited)", () => {
  for (const n of [3, 4]) {
    it(`Towers of Hanoi, ${n} discs: 2^n − 1 = ${2 ** n - 1}`, async () => {
      const out = await optimizeFiles(fixture("hanoi/domain.pddl"), fixture(`hanoi/problem-${n}.pddl`));
      expect(out.status).toBe("optimal");
      // source: standard result, the Towers of Hanoi need 2^n − 1 moves (Lucas 1883)
      expect(out.cost).toBe(2 ** n - 1);
      expect(out.plan!.length).toBe(2 ** n - 1);
      expect(await certifyAndAudit(out)).toBe(true);
    });
  }

  it("gripper with 4 balls and two hands: 11 (seq-1 encoding)", async () => {
    const out = await optimizeFiles(fixture("gripper/domain.pddl"), fixture("gripper/problem-4.pddl"), { encoding: "seq-1" });
    expect(out.status).toBe("optimal");
    // source: from memory (the 4-ball gripper task needs 11 actions; derivation in test/fixtures/pddl/README.md)
    expect(out.cost).toBe(11);
    expect(["horizon-unsat", "suffix-unsat"]).toContain(out.how);
    expect(await certifyAndAudit(out)).toBe(true);
  });

  it.skipIf(!process.env.PLUMBLINE_SLOW)("gripper with 4 balls: 11 with the forall-1 encoding too (slow)", async () => {
    const out = await optimizeFiles(fixture("gripper/domain.pddl"), fixture("gripper/problem-4.pddl"), { encoding: "forall-1" });
    // source: from memory, as above
    expect(out.cost).toBe(11);
    expect(out.status).toBe("optimal");
    expect(await certifyAndAudit(out)).toBe(true);
  }, 300_000);
});

describe("scenario instances: the proven optimum is the one the reference Dijkstra finds", () => {
  for (const [sc, prob] of [
    ["harbour", "problem-01"],
    ["workshop", "problem-01"],
    ["workshop", "problem-02"],
    ["warehouse", "problem-01"],
  ] as const) {
    it(`${sc}/${prob} (committed instance)`, async () => {
      const record = JSON.parse(fs.readFileSync(scenarioFile(sc, "instances.json"), "utf8"))[prob];
      const { out, reference } = await solveText(fs.readFileSync(scenarioFile(sc, "domain.pddl"), "utf8"), fs.readFileSync(scenarioFile(sc, `${prob}.pddl`), "utf8"));
      expect(out.status).toBe("optimal");
      // source: the reference Dijkstra (test/support/reference.ts) on the grounded task, and the
      // scenario's recorded figure (found by Dijkstra over its PDDL-free model)
      expect(out.cost).toBe(reference);
      expect(out.cost).toBe(record.optimalCost);
      expect(await certifyAndAudit(out)).toBe(true);
    });
  }

  it("harbour/problem-01: the cheapest plan is longer than the shortest one", async () => {
    const record = JSON.parse(fs.readFileSync(scenarioFile("harbour", "instances.json"), "utf8"))["problem-01"];
    expect(record.cheapestLongerThanShortest).toBe(true);
    const out = await optimizeFiles(scenarioFile("harbour", "domain.pddl"), scenarioFile("harbour", "problem-01.pddl"), { encoding: "seq-1" });
    disposeOutcome(out);
    // source: the instance record (Dijkstra and breadth-first search over the scenario model)
    expect(out.cost).toBe(record.optimalCost);
    expect(out.plan!.length).toBeGreaterThan(record.shortestLength);
  });

  it.skipIf(!process.env.PLUMBLINE_SLOW)("harbour/problem-02 (small; the cheapest plan is longer than the shortest): 22, audited (slow)", async () => {
    const record = JSON.parse(fs.readFileSync(scenarioFile("harbour", "instances.json"), "utf8"))["problem-02"];
    const out = await optimizeFiles(scenarioFile("harbour", "domain.pddl"), scenarioFile("harbour", "problem-02.pddl"));
    expect(out.status).toBe("optimal");
    // source: the instance record (Dijkstra over the scenario model, re-checked by test/scenarios)
    expect(out.cost).toBe(record.optimalCost);
    expect(await certifyAndAudit(out)).toBe(true);
  }, 900_000);

  it("random tiny scenario instances (generator seeds): solve's optimum = reference Dijkstra, both encodings", async () => {
    const how: Record<string, number> = {};
    await fc.assert(
      fc.asyncProperty(fc.constantFrom(...scenarios), fc.integer({ min: 1, max: 500 }), fc.constantFrom("forall-1" as const, "seq-1" as const), fc.boolean(), async (sc, seed, encoding, suffix) => {
        const domain = fs.readFileSync(scenarioFile(sc.name, "domain.pddl"), "utf8");
        const { out, reference } = await solveText(domain, generateProblem(sc, "tiny", seed), { encoding, suffix });
        // source: the reference Dijkstra on the same grounded task
        expect(out.status).toBe(reference === null ? "unsolvable" : "optimal");
        expect(out.cost).toBe(reference);
        how[String(out.how)] = (how[String(out.how)] ?? 0) + 1;
        if (out.certificate) expect(await certifyAndAudit(out)).toBe(true);
      }),
      { numRuns: 15, seed: 20261202 },
    );
    // the SAT proof paths must be exercised, not only matching lower bounds
    expect(how["horizon-unsat"], JSON.stringify(how)).toBeGreaterThan(0);
    expect(how["suffix-unsat"], JSON.stringify(how)).toBeGreaterThan(0);
  }, 120_000);
});

describe("random small tasks through PDDL: optimal cost = reference Dijkstra", () => {
  it("both encodings, zero-cost actions included; unsolvable ones proven unsolvable", async () => {
    const how: Record<string, number> = {};
    await fc.assert(
      fc.asyncProperty(factoredSpecArb({ maxVars: 4, maxActions: 7, maxCost: 3, zeroCostShare: 0.35 }), fc.constantFrom("forall-1" as const, "seq-1" as const), fc.boolean(), async (spec, encoding, suffix) => {
        const { domain, problem } = taskToPddl(taskFromSpec(spec));
        const { out, reference } = await solveText(domain, problem, { encoding, suffix });
        // source: the reference Dijkstra (test/support/reference.ts)
        expect(out.cost).toBe(reference);
        expect(out.status).toBe(reference === null ? "unsolvable" : "optimal");
        expect(out.how).not.toBeNull();
        how[`${out.status}/${out.how}`] = (how[`${out.status}/${out.how}`] ?? 0) + 1;
        expect(await certifyAndAudit(out)).toBe(true);
      }),
      { numRuns: 60, seed: 7 },
    );
    // every kind of claim must have been exercised
    for (const k of ["optimal/horizon-unsat", "optimal/lower-bound", "unsolvable/relaxed-unreachable", "unsolvable/horizon-unsat"]) expect(how[k] ?? 0, JSON.stringify(how)).toBeGreaterThan(0);
  }, 120_000);
});
