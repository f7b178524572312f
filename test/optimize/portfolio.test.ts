// The second solver of the portfolio (a fresh solver on another thread, the clauses in reverse
// order): its answers agree with the reference optimum, its models decode to plans no dearer than
// the bound, and its proofs pass the independent checker; a stopped run leaves no file behind; a
// run that races every proving query still claims the reference optimum and its certificate audits.
import * as fs from "node:fs";
import { tmpdir } from "node:os";
import * as path from "node:path";
import fc from "fast-check";
import { afterAll, describe, expect, it } from "vitest";
import { generateProblem, scenarios } from "../../benchmarks/domains/index.js";
import { auditCertificate, dratChecker, writeCertificate } from "../../src/certify/index.js";
import { extractPlan } from "../../src/encode/index.js";
import { ground } from "../../src/ground/index.js";
import { disposeOutcome, optimize, OPTIMIZE_GROUNDING, planningPipeline, resolveEncoding } from "../../src/optimize/index.js";
import { checkerCnf } from "../../src/optimize/formula.js";
import { PortfolioRun } from "../../src/optimize/portfolio.js";
import { modelFromTexts } from "../../src/pddl/index.js";
import { optimalCost } from "../support/reference.js";

const root = path.resolve(import.meta.dirname, "../..");
const work = fs.mkdtempSync(path.join(tmpdir(), "plumbline-portfolio-"));
afterAll(() => fs.rmSync(work, { recursive: true, force: true }));
let runs = 0;

async function answer(r: PortfolioRun): Promise<NonNullable<PortfolioRun["decided"]>> {
  for (let i = 0; i < 600 && r.decided === null; i++) await new Promise((res) => setTimeout(res, 50));
  expect(r.decided).not.toBeNull();
  return r.decided!;
}

describe("the portfolio's second solver", () => {
  it("cost ≤ C is satisfiable with a plan no dearer than C, cost ≤ C − 1 is refuted with a checked proof (C the reference optimum)", async () => {
    await fc.assert(
      fc.asyncProperty(fc.constantFrom(...scenarios), fc.integer({ min: 1, max: 300 }), async (sc, seed) => {
        const domain = fs.readFileSync(path.join(root, "benchmarks/domains", sc.name, "domain.pddl"), "utf8");
        const model = modelFromTexts(domain, "domain.pddl", generateProblem(sc, "tiny", seed), "problem.pddl");
        const task = ground(model, OPTIMIZE_GROUNDING);
        const opt = optimalCost(ground(model)); // source: exhaustive search (test/support/reference.ts)
        if (opt === null || opt.cost === 0) return;
        const pipe = planningPipeline(task);
        // enough steps for a cheapest plan (one action per step at worst), so cost ≤ C is satisfiable
        const formula = pipe.formula(pipe.spec(resolveEncoding(undefined), opt.length, opt.cost + 1));
        const sat = new PortfolioRun(formula, formula.boundUnits(opt.cost), path.join(work, `p-${++runs}.drat`), Date.now() + 60_000);
        const a = await answer(sat);
        await sat.stop();
        expect(a.status).toBe("sat");
        const plan = extractPlan(pipe.prepared.task, formula.encoding, (v) => a.model![v] === 1).plan;
        expect(plan.reduce((c, id) => c + pipe.prepared.task.actions[id].cost, 0)).toBeLessThanOrEqual(opt.cost);
        const units = formula.boundUnits(opt.cost - 1);
        const proofPath = path.join(work, `p-${++runs}.drat`);
        const unsat = new PortfolioRun(formula, units, proofPath, Date.now() + 60_000);
        const b = await answer(unsat);
        await unsat.stop(true);
        expect(b.status).toBe("unsat");
        expect(b.proof!.file).toBe(proofPath);
        expect(dratChecker(checkerCnf(formula, units), fs.readFileSync(proofPath), {})).toBe(true);
        // the same proof does not refute the satisfiable query (the checker is not blind)
        expect(dratChecker(checkerCnf(formula, formula.boundUnits(opt.cost)), fs.readFileSync(proofPath), {})).toBe(false);
        fs.rmSync(proofPath);
      }),
      { numRuns: 12, seed: 5 },
    );
  }, 120_000);

  it("stopped: its proof file, partial or not, is removed", async () => {
    const sc = scenarios[0];
    const domain = fs.readFileSync(path.join(root, "benchmarks/domains", sc.name, "domain.pddl"), "utf8");
    const model = modelFromTexts(domain, "domain.pddl", generateProblem(sc, "tiny", 1), "problem.pddl");
    const pipe = planningPipeline(ground(model, OPTIMIZE_GROUNDING));
    const formula = pipe.formula(pipe.spec(resolveEncoding(undefined), 6, 1000));
    const dir = fs.mkdtempSync(path.join(work, "stop-"));
    const r = new PortfolioRun(formula, formula.boundUnits(0), path.join(dir, "proof.drat"), Date.now() + 60_000);
    for (let i = 0; i < 200 && fs.readdirSync(dir).length === 0; i++) await new Promise((res) => setTimeout(res, 25));
    expect(fs.readdirSync(dir).length).toBe(1); // its proof file (partial or finished) exists
    await r.stop();
    expect(fs.readdirSync(dir)).toEqual([]);
  });
});

describe("a run with the portfolio", () => {
  it("races its proving queries from the start (portfolioAfterMs 0) and still claims the reference optimum, with a certificate that audits", async () => {
    const sc = scenarios.find((s) => s.name === "warehouse")!;
    const domain = fs.readFileSync(path.join(root, "benchmarks/domains", sc.name, "domain.pddl"), "utf8");
    const model = modelFromTexts(domain, "domain.pddl", generateProblem(sc, "small", 1), "problem.pddl");
    const out = await optimize(model, ground(model, OPTIMIZE_GROUNDING), OPTIMIZE_GROUNDING, { threads: 2, portfolioAfterMs: 0, searchHelper: false, horizonLimits: { maxOptimalStates: 0, maxExplicitStates: 1 }, timeLimit: 120 });
    expect(out.cost).toBe(optimalCost(ground(model))!.cost); // source: exhaustive search (test/support/reference.ts)
    expect(out.status).toBe("optimal");
    expect(out.timeline.some((e) => e.kind === "portfolio")).toBe(true);
    const dir = path.join(work, "cert");
    await writeCertificate(dir, out.certificate!);
    disposeOutcome(out);
    const a = auditCertificate(dir);
    expect(a.checks.filter((c) => !c.ok).map((c) => c.name)).toEqual([]);
  }, 180_000);
});
