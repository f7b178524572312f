// The committed scenario instances under benchmarks/domains: each plan replays as valid on
// the lifted model, and the ground Task (via actionNamesToIndices) gives the same verdict and
// cost for the plan and for the plan without its last step.
import { existsSync, readdirSync, readFileSync } from "node:fs";
import { join, resolve } from "node:path";
import { describe, expect, it } from "vitest";
import { ground } from "../../src/ground/index.js";
import { loadModel } from "../../src/pddl/index.js";
import { actionNamesToIndices, parsePlan, replayPlan } from "../../src/plan/index.js";
import { replayGround } from "../support/reference.js";

const ROOT = resolve(__dirname, "../../benchmarks/domains");
const cases: Array<{ name: string; domain: string; problem: string; plan: string }> = [];
for (const d of existsSync(ROOT) ? readdirSync(ROOT).sort() : []) {
  const dir = join(ROOT, d);
  if (!existsSync(join(dir, "domain.pddl"))) continue;
  for (const f of readdirSync(dir).sort()) {
    if (f.endsWith(".plan") && existsSync(join(dir, f.replace(/\.plan$/, ".pddl")))) {
      cases.push({ name: `${d}/${f}`, domain: join(dir, "domain.pddl"), problem: join(dir, f.replace(/\.plan$/, ".pddl")), plan: join(dir, f) });
    }
  }
}

describe("scenario plans", () => {
  it("there are committed scenario instances with plans", () => {
    expect(new Set(cases.map((c) => c.name.split("/")[0])).size).toBeGreaterThanOrEqual(3);
  });

  for (const c of cases) {
    it(`${c.name}: valid on the lifted model; the ground Task agrees`, () => {
      const model = loadModel(c.domain, c.problem);
      const text = readFileSync(c.plan, "utf8");
      const steps = parsePlan(text, c.plan);
      const lifted = replayPlan(model, steps, c.plan);
      expect(lifted.error).toBeNull();
      expect(lifted.valid).toBe(true);
      // source: the cost the scenario's own explicit-state model (benchmarks/domains/*/model.ts) wrote beside the plan
      const stated = /;\s*cost\s*=\s*(\d+)/.exec(text);
      if (stated) expect(lifted.cost).toBe(Number(stated[1]));
      const task = ground(model);
      const verdict = (n: number) => {
        const ids = actionNamesToIndices(task, steps.slice(0, n), { appendGoalAction: true });
        const g = replayGround(task, ids);
        if (!g.ok) return { valid: false, cost: null };
        const goal = task.goal.every((f) => g.state.has(f)) && task.goalNeg.every((f) => !g.state.has(f));
        return { valid: goal, cost: g.cost };
      };
      expect(verdict(steps.length)).toEqual({ valid: true, cost: lifted.cost });
      const shorter = replayPlan(model, steps.slice(0, -1), c.plan);
      expect(verdict(steps.length - 1).valid).toBe(shorter.valid);
      if (!shorter.valid) expect(shorter.error).toMatchObject({ kind: "goal", step: steps.length });
    });
  }
});
