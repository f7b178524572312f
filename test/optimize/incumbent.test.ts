// OptimizeOptions.incumbent: the optimizer starts from a given plan instead of GBFS's first plan,
// proves it optimal or improves on it, and falls back to GBFS when the plan is not a plan.
import * as fs from "node:fs";
import { tmpdir } from "node:os";
import * as path from "node:path";
import { afterAll, describe, expect, it } from "vitest";
import { auditCertificate, writeCertificate } from "../../src/certify/index.js";
import { ground } from "../../src/ground/index.js";
import { disposeOutcome, optimize, OPTIMIZE_GROUNDING, type OptimizeOutcome } from "../../src/optimize/index.js";
import { modelFromTexts } from "../../src/pddl/index.js";
import { optimalCost } from "../support/reference.js";

const root = path.resolve(import.meta.dirname, "../..");
const harbour = (f: string) => fs.readFileSync(path.join(root, "benchmarks/domains/harbour", f), "utf8");
const planLines = (text: string) => text.split("\n").filter((l) => l.startsWith("("));
const work = fs.mkdtempSync(path.join(tmpdir(), "plumbline-incumbent-"));
afterAll(() => fs.rmSync(work, { recursive: true, force: true }));

async function run(problem: string, incumbent: string[]): Promise<{ out: OptimizeOutcome; reference: number }> {
  const model = modelFromTexts(harbour("domain.pddl"), "domain.pddl", harbour(problem), "problem.pddl");
  const out = await optimize(model, ground(model, OPTIMIZE_GROUNDING), OPTIMIZE_GROUNDING, { incumbent, probes: false });
  return { out, reference: optimalCost(ground(model))!.cost };
}

const firstPlanEvent = (o: OptimizeOutcome) => o.timeline.find((e) => e.kind === "plan")!;

describe("optimize() with an incumbent", () => {
  it("an optimal incumbent is proven optimal without GBFS, and the certificate audits", async () => {
    const { out, reference } = await run("problem-02.pddl", planLines(harbour("problem-02.plan")));
    // source: benchmarks/domains/harbour/instances.json (problem-02 optimal cost 22) and the reference Dijkstra
    expect(reference).toBe(22);
    expect(out.status).toBe("optimal");
    expect(out.cost).toBe(22);
    expect(firstPlanEvent(out)).toMatchObject({ detail: "incumbent", upper: 22 });
    expect(out.timeline.some((e) => e.kind === "plan" && e.detail === "GBFS")).toBe(false);
    expect(out.plan!.names).toEqual(planLines(harbour("problem-02.plan")));
    const dir = path.join(work, "p02");
    await writeCertificate(dir, out.certificate!);
    disposeOutcome(out);
    expect(auditCertificate(dir).valid).toBe(true);
  });

  it("a costlier incumbent (the direct road both ways, 22 + 22) is improved to the optimum", async () => {
    const detour = ["(drive t1 quay1 depot1)", "(load crane3 c1 t1 depot1)", "(drive t1 depot1 quay1)", "(unload crane1 c1 t1 quay1)"];
    const { out, reference } = await run("problem-01.pddl", detour);
    // source: the reference Dijkstra; benchmarks/domains/harbour/instances.json (problem-01 optimal cost 20)
    expect(reference).toBe(20);
    expect(firstPlanEvent(out)).toMatchObject({ detail: "incumbent", upper: 44 });
    expect(out.status).toBe("optimal");
    expect(out.cost).toBe(reference);
    disposeOutcome(out);
  });

  it("an incumbent that is not a plan (goal not reached, unknown action) falls back to GBFS with a note", async () => {
    for (const bad of [["(drive t1 quay1 yard1)"], ["(fly t1 quay1 depot1)"], ["(drive t1"]]) {
      const { out, reference } = await run("problem-01.pddl", bad);
      expect(out.notes.join(" ")).toMatch(/incumbent is not a plan/);
      expect(firstPlanEvent(out).detail).toBe("GBFS");
      expect(out.cost).toBe(reference);
      disposeOutcome(out);
    }
  });
});
