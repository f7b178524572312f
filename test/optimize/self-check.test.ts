// solve checks its own proof: a claim resting on the built-in solver's DRAT proof is made only
// after the independent checker accepts it; a rejecting or unfinished check leaves no claim.
import * as fs from "node:fs";
import * as path from "node:path";
import { describe, expect, it } from "vitest";
import { dratChecker } from "../../src/certify/index.js";
import { ground } from "../../src/ground/index.js";
import { disposeOutcome, optimize, OPTIMIZE_GROUNDING, type OptimizeOptions, type ProofChecker } from "../../src/optimize/index.js";
import { modelFromTexts } from "../../src/pddl/index.js";
import { optimalCost } from "../support/reference.js";

const root = path.resolve(import.meta.dirname, "../..");
const dir = path.join(root, "benchmarks/domains/harbour");
const domain = fs.readFileSync(path.join(dir, "domain.pddl"), "utf8");
const problem = fs.readFileSync(path.join(dir, "problem-01.pddl"), "utf8");
// the explicit-state horizon methods off and no A* helper, so the claim must come from SAT
const SAT_ONLY: OptimizeOptions = { horizonLimits: { maxOptimalStates: 0, maxExplicitStates: 1 }, searchHelper: false };

async function run(checker: ProofChecker | undefined) {
  const model = modelFromTexts(domain, "domain.pddl", problem, "problem.pddl");
  const out = await optimize(model, ground(model, OPTIMIZE_GROUNDING), OPTIMIZE_GROUNDING, { ...SAT_ONLY, proofChecker: checker });
  disposeOutcome(out);
  return { out, reference: optimalCost(ground(model))!.cost }; // source: exhaustive search (test/support/reference.ts)
}

describe("solve checks its own proof", () => {
  it("with the independent checker: optimal, the reference optimum, and the check's time recorded", async () => {
    const calls: number[] = [];
    const counting: ProofChecker = (cnf, proof, limits) => {
      calls.push(proof.length);
      return dratChecker(cnf, proof, limits);
    };
    const { out, reference } = await run(counting);
    expect(out.status).toBe("optimal");
    expect(out.cost).toBe(reference);
    expect(["horizon-unsat", "suffix-unsat"]).toContain(out.how);
    expect(calls.length).toBe(1);
    expect(calls[0]).toBeGreaterThan(0);
    expect(out.proofCheckSeconds).not.toBeNull();
    expect(out.timeline.some((e) => e.kind === "proof-checked")).toBe(true);
  });

  it("a checker that rejects the proof: no optimal claim, the plan kept, a note asking for a bug report", async () => {
    const { out } = await run(() => false);
    expect(out.status).toBe("feasible");
    expect(out.plan).not.toBeNull();
    expect(out.certificate).toBeNull();
    expect(out.notes.join("\n")).toMatch(/rejected the built-in solver's proof/);
  });

  it("a check stopped by the limits: no claim, a note saying why", async () => {
    const { out } = await run(() => {
      throw new Error("stopped");
    });
    expect(out.status).toBe("feasible");
    expect(out.certificate).toBeNull();
    expect(out.notes.join("\n")).toMatch(/could not be checked within the limits/);
  });
});
