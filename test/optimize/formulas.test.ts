// optimize() with every full formula id (step encoding × cost encoding × parts) reaches the
// reference Dijkstra optimum, records that exact id, and its certificate audits valid.
import * as fs from "node:fs";
import { tmpdir } from "node:os";
import * as path from "node:path";
import fc from "fast-check";
import { afterAll, describe, expect, it } from "vitest";
import { auditCertificate, writeCertificate } from "../../src/certify/index.js";
import { COST_ENCODINGS, STEP_ENCODINGS } from "../../src/encode/index.js";
import { ground } from "../../src/ground/index.js";
import { disposeOutcome, optimize, OPTIMIZE_GROUNDING, type OptimizeOutcome } from "../../src/optimize/index.js";
import { modelFromTexts } from "../../src/pddl/index.js";
import { generateProblem, scenarios } from "../../benchmarks/domains/index.js";
import { factoredSpecArb, taskFromSpec } from "../support/random-task.js";
import { optimalCost } from "../support/reference.js";
import { taskToPddl } from "./support/task-pddl.js";

const PART_SETS = [[], ["reach-1"], ["empty-steps-last-1"], ["reach-1", "empty-steps-last-1"]];
const IDS = STEP_ENCODINGS.flatMap((s) => COST_ENCODINGS.flatMap((c) => PART_SETS.map((p) => [s, c, ...p].join("+"))));
const root = path.resolve(import.meta.dirname, "../..");
const harbour = (f: string) => fs.readFileSync(path.join(root, "benchmarks/domains/harbour", f), "utf8");
const work = fs.mkdtempSync(path.join(tmpdir(), "plumbline-formulas-"));
afterAll(() => fs.rmSync(work, { recursive: true, force: true }));
let certs = 0;

async function solve(domain: string, problem: string, encoding: string): Promise<{ out: OptimizeOutcome; reference: number | null }> {
  const model = modelFromTexts(domain, "domain.pddl", problem, "problem.pddl");
  // threshold proofs only: these tests are about each formula id at a completeness threshold
  // (the suffix route has its own tests in test/optimize/suffix.test.ts)
  const out = await optimize(model, ground(model, OPTIMIZE_GROUNDING), OPTIMIZE_GROUNDING, { encoding, suffix: false });
  const ref = optimalCost(ground(model));
  return { out, reference: ref ? ref.cost : null };
}

/** Writes and audits the certificate; true when valid. */
async function audited(out: OptimizeOutcome): Promise<boolean> {
  const dir = path.join(work, `cert-${++certs}`);
  await writeCertificate(dir, out.certificate!);
  disposeOutcome(out);
  const a = auditCertificate(dir);
  fs.rmSync(dir, { recursive: true, force: true });
  if (!a.valid) throw new Error(`audit rejected: ${a.checks.filter((c) => !c.ok).map((c) => `${c.name}: ${c.detail}`).join("; ")}`);
  return true;
}

describe("optimize() with every formula id", () => {
  it("lists 24 ids", () => expect(new Set(IDS).size).toBe(24));

  it("random small tasks through PDDL: the optimum of the reference Dijkstra, audited", async () => {
    const how: Record<string, number> = {};
    await fc.assert(
      fc.asyncProperty(factoredSpecArb({ maxVars: 4, maxActions: 7, maxCost: 3, zeroCostShare: 0.35 }), fc.constantFrom(...IDS), async (spec, id) => {
        const { domain, problem } = taskToPddl(taskFromSpec(spec));
        const { out, reference } = await solve(domain, problem, id);
        // source: the reference Dijkstra (test/support/reference.ts) on the grounded task
        expect(out.cost).toBe(reference);
        expect(out.status).toBe(reference === null ? "unsolvable" : "optimal");
        if (out.how === "horizon-unsat") expect(out.encoding).toBe(id);
        how[String(out.how)] = (how[String(out.how)] ?? 0) + 1;
        if (out.certificate) expect(await audited(out)).toBe(true);
        else disposeOutcome(out);
      }),
      { numRuns: process.env.PLUMBLINE_SLOW ? 300 : 30, seed: 20261202 },
    );
    // (most of these are settled by a landmark bound or relaxed unreachability; the SAT path is
    // exercised by the scenario instances below)
    expect(Object.values(how).reduce((a, b) => a + b, 0)).toBe(process.env.PLUMBLINE_SLOW ? 300 : 30);
  }, 300_000);

  it("random tiny scenario instances (generator seeds): the reference Dijkstra's optimum, SAT proofs with many ids, audited", async () => {
    const bySat = new Set<string>();
    await fc.assert(
      fc.asyncProperty(fc.constantFrom(...scenarios), fc.integer({ min: 1, max: 500 }), fc.constantFrom(...IDS), async (sc, seed, id) => {
        const domain = fs.readFileSync(path.join(root, "benchmarks/domains", sc.name, "domain.pddl"), "utf8");
        const { out, reference } = await solve(domain, generateProblem(sc, "tiny", seed), id);
        // source: the reference Dijkstra on the same grounded task
        expect(out.cost).toBe(reference);
        expect(out.status).toBe(reference === null ? "unsolvable" : "optimal");
        if (out.how === "horizon-unsat") {
          expect(out.encoding).toBe(id);
          bySat.add(id);
        }
        if (out.certificate) expect(await audited(out)).toBe(true);
        else disposeOutcome(out);
      }),
      { numRuns: process.env.PLUMBLINE_SLOW ? 150 : 30, seed: 20261203 },
    );
    expect(bySat.size, [...bySat].join(" ")).toBeGreaterThan(process.env.PLUMBLINE_SLOW ? 20 : 5);
  }, 300_000);

  // harbour problem-01: the cheapest plan (20) is longer than the shortest, proven by SAT
  // by default one id per (cost encoding, part set), the step encodings taking turns; all 24 when slow
  const harbourIds = process.env.PLUMBLINE_SLOW
    ? IDS
    : COST_ENCODINGS.flatMap((c, ci) => PART_SETS.map((p, pi) => [STEP_ENCODINGS[(ci * PART_SETS.length + pi) % STEP_ENCODINGS.length], c, ...p].join("+")));
  for (const id of harbourIds) {
    it(`harbour/problem-01 with ${id}: 20, proven by SAT, audited`, async () => {
      const { out, reference } = await solve(harbour("domain.pddl"), harbour("problem-01.pddl"), id);
      // source: the reference Dijkstra and benchmarks/domains/harbour/instances.json (optimal cost 20)
      expect(reference).toBe(20);
      expect(out.cost).toBe(20);
      expect(out.how).toBe("horizon-unsat");
      expect(out.encoding).toBe(id);
      expect(await audited(out)).toBe(true);
    }, 120_000);
  }
});
