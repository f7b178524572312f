// Every command that writes a plan writes plumbline's plan-file layout: the same header (cost,
// actions, status, proof) from solve --plan, solve's output, the certificate's plan.txt and search --plan.
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { afterAll, describe, expect, it } from "vitest";
import { parsePlan, PLAN_FILE_MARK } from "../../src/plan/index.js";
import { cli } from "../support/cli.js";

const DIR = join(import.meta.dirname, "../../benchmarks/domains/harbour");
const domain = join(DIR, "domain.pddl");
const problem = join(DIR, "problem-01.pddl");
// source: benchmarks/domains/harbour/instances.json (Dijkstra over the scenario's PDDL-free model)
const OPTIMUM = 20;

const tmp = mkdtempSync(join(tmpdir(), "plumbline-plan-files-"));
afterAll(() => rmSync(tmp, { recursive: true, force: true }));

/** The header lines as key → value, and the steps after them. */
function read(text: string): { head: Record<string, string>; steps: string[] } {
  const lines = text.trimEnd().split("\n");
  expect(lines[0]).toBe(PLAN_FILE_MARK);
  const head: Record<string, string> = {};
  for (const l of lines.slice(1)) {
    const m = /^; (cost|actions|status|proof): (.*)$/.exec(l);
    if (m) head[m[1]] = m[2];
  }
  const steps = lines.filter((l) => l.startsWith("("));
  // the header comes first: no comment line after the first step
  const first = lines.findIndex((l) => l.startsWith("("));
  expect(lines.slice(first).every((l) => l.startsWith("("))).toBe(true);
  return { head, steps };
}

describe("plan files", () => {
  it("solve --plan, solve's output and the certificate's plan.txt: one layout, stating cost, actions, status and proof", async () => {
    const plan = join(tmp, "solve.plan");
    const cert = join(tmp, "cert");
    const r = await cli(["solve", domain, problem, "--plan", plan, "--certificate", cert]);
    expect(r.code).toBe(0);
    const file = read(readFileSync(plan, "utf8"));
    expect(file.head).toEqual({ cost: String(OPTIMUM), actions: String(file.steps.length), status: "optimal", proof: expect.stringMatching(/^(horizon-unsat|suffix-unsat|lower-bound)$/) });
    expect(readFileSync(join(cert, "plan.txt"), "utf8")).toBe(readFileSync(plan, "utf8"));
    // the output shows the same text
    expect(r.stdout).toContain(readFileSync(plan, "utf8").trimEnd());
    expect(parsePlan(readFileSync(plan, "utf8"), plan).length).toBe(file.steps.length);
  });

  it("search --plan: the same layout, A* optimal by exhaustive-search, greedy feasible without a proof", async () => {
    const astar = join(tmp, "astar.plan");
    expect((await cli(["search", domain, problem, "--plan", astar])).code).toBe(0);
    const a = read(readFileSync(astar, "utf8"));
    expect(a.head).toEqual({ cost: String(OPTIMUM), actions: String(a.steps.length), status: "optimal", proof: "exhaustive-search" });
    const greedy = join(tmp, "greedy.plan");
    expect((await cli(["search", domain, problem, "--greedy", "--plan", greedy])).code).toBe(0);
    const g = read(readFileSync(greedy, "utf8"));
    expect(g.head.status).toBe("feasible");
    expect(g.head.proof).toBe("none (optimality not proven)");
    expect(Number(g.head.cost)).toBeGreaterThanOrEqual(OPTIMUM);
    expect(Number(g.head.actions)).toBe(g.steps.length);
  });

  it("replay reads the new layout, the older trailer and the timestamped form alike", async () => {
    const astar = join(tmp, "astar.plan");
    const steps = read(readFileSync(astar, "utf8")).steps;
    const variants = {
      layout: readFileSync(astar, "utf8"),
      trailer: `${steps.join("\n")}\n; cost = ${OPTIMUM} (optimal)\n`,
      timestamped: steps.map((s, i) => `${i}: ${s} [1]`).join("\n") + "\n",
    };
    for (const [name, text] of Object.entries(variants)) {
      const f = join(tmp, `${name}.plan`);
      writeFileSync(f, text);
      const r = await cli(["replay", domain, problem, f, "--json"]);
      expect(r.code, name).toBe(0);
      expect(r.json()).toMatchObject({ valid: true, cost: OPTIMUM, length: steps.length });
    }
  });

  it("a model without action costs, or without :metric, is minimised with a note saying what is minimised", async () => {
    const G = join(import.meta.dirname, "../fixtures/pddl/gripper");
    const unit = await cli(["solve", join(G, "domain.pddl"), join(G, "problem-2.pddl"), "--json"]);
    expect(unit.code).toBe(0);
    expect(unit.json().notes.join("\n")).toMatch(/no action costs: every action counts 1, so plumbline minimises the number of actions/);
    const plan = join(tmp, "unit.plan");
    await cli(["solve", join(G, "domain.pddl"), join(G, "problem-2.pddl"), "--plan", plan]);
    expect(readFileSync(plan, "utf8")).toMatch(/^; cost: \d+ \(the model has no action costs: every action counts 1\)$/m);
    const noMetric = join(tmp, "no-metric.pddl");
    writeFileSync(noMetric, readFileSync(problem, "utf8").replace(/\(:metric minimize \(total-cost\)\)/, ""));
    const r = await cli(["solve", domain, noMetric, "--json"]);
    expect(r.json().cost).toBe(OPTIMUM);
    expect(r.json().notes.join("\n")).toMatch(/no \(:metric minimize \(total-cost\)\): plumbline minimises total-cost/);
    const s = await cli(["search", domain, noMetric]);
    expect(s.stderr).toMatch(/note: the problem has no \(:metric/);
    expect((await cli(["solve", domain, problem, "--json"])).json().notes.join("\n")).not.toMatch(/metric|no action costs/);
  });
});
