// The solve / audit / encode commands end to end (in-process CLI): JSON contract, plan and
// certificate files, exit codes, time limit and interrupt paths, and the DIMACS output.
import * as fs from "node:fs";
import { tmpdir } from "node:os";
import * as path from "node:path";
import { afterAll, describe, expect, it } from "vitest";
import { generateProblem, scenarios } from "../../benchmarks/domains/index.js";
import { parseDimacs, Solver } from "../../src/sat/index.js";
import { parsePlan } from "../../src/plan/index.js";
import { cli } from "../support/cli.js";

const root = path.resolve(import.meta.dirname, "../..");
const H = (f: string) => path.join(root, "benchmarks/domains/harbour", f);
const work = fs.mkdtempSync(path.join(tmpdir(), "plumbline-e2e-solve-"));
afterAll(() => fs.rmSync(work, { recursive: true, force: true }));

describe("plumbline solve + audit", () => {
  it("proves harbour/problem-01 optimal, writes plan and certificate; audit accepts it", async () => {
    const out = path.join(work, "ok");
    fs.mkdirSync(out);
    const plan = path.join(out, "plan.txt");
    const cert = path.join(out, "cert");
    const r = await cli(["solve", H("domain.pddl"), H("problem-01.pddl"), "--json", "--plan", plan, "--certificate", cert]);
    expect(r.code).toBe(0);
    const j = r.json();
    // source: benchmarks/domains/harbour/instances.json (Dijkstra over the scenario model)
    expect(j).toMatchObject({ status: "optimal", cost: 20, lowerBound: 20, how: expect.stringMatching(/^(horizon|suffix)-unsat$/), proof: { kind: "drat" } });
    for (const k of ["plan", "horizon", "proof", "seconds", "timeline", "satCalls", "variables", "clauses"]) expect(j).toHaveProperty(k);
    expect(j.plan).toEqual(parsePlan(fs.readFileSync(plan, "utf8"), "plan").map((s) => `(${[s.name, ...s.args].join(" ")})`));
    expect(j.timeline.length).toBeGreaterThan(0);
    expect(fs.readdirSync(cert).sort()).toEqual(["certificate.json", "domain.pddl", "plan.txt", "problem.pddl", "proof.drat.gz"]);

    const a = await cli(["audit", cert, "--json"]);
    expect(a.code).toBe(0);
    expect(a.json()).toHaveLength(1);
    expect(a.json()[0]).toMatchObject({ valid: true, verdict: "valid", claim: { status: "optimal", how: j.how }, cost: 20 });
    const human = await cli(["audit", cert]);
    expect(human.stdout).toMatch(/^valid/);

    // tampered → exit 1 naming the check; missing directory → exit 2
    const json = JSON.parse(fs.readFileSync(path.join(cert, "certificate.json"), "utf8"));
    json.plan.cost = 19;
    fs.writeFileSync(path.join(cert, "certificate.json"), JSON.stringify(json));
    const bad = await cli(["audit", cert, "--json"]);
    expect(bad.code).toBe(1);
    expect(bad.json()[0].checks.find((c: { name: string }) => c.name === "plan-cost").ok).toBe(false);
    expect((await cli(["audit", path.join(work, "nowhere")])).code).toBe(2);
  });

  it("human output: status, cost, plan, how it was proven, and the caution about the model", async () => {
    const r = await cli(["solve", H("domain.pddl"), H("problem-01.pddl"), "--encoding", "seq-1"]);
    expect(r.code).toBe(0);
    expect(r.stdout).toMatch(/status: optimal — cost 20/);
    expect(r.stdout).toContain("proven by SAT");
    expect(r.stdout).toContain("(drive ");
    expect(r.stdout).toContain("only as good as the model");
  });

  it("a time limit stops with the best plan written, status feasible, the gap, exit 3, no partial files", async () => {
    const out = path.join(work, "limit");
    fs.mkdirSync(out);
    const plan = path.join(out, "plan.txt");
    // the large harbour task: a first plan within a second or two (more under a loaded test run),
    // no proof of any kind for far longer (A* alone needs over 20 s)
    const problem = path.join(work, "harbour-large-1-limit.pddl");
    fs.writeFileSync(problem, generateProblem(scenarios.find((s) => s.name === "harbour")!, "large", 1));
    const r = await cli(["solve", H("domain.pddl"), problem, "--json", "--time-limit", "8", "--plan", plan, "--certificate", path.join(out, "cert")]);
    expect(r.code).toBe(3);
    const j = r.json();
    expect(j.status).toBe("feasible");
    expect(j.stopReason).toBe("time");
    expect(j.cost).toBeGreaterThanOrEqual(j.lowerBound);
    expect(j.gap).toBe(j.cost - j.lowerBound);
    expect(fs.readdirSync(out)).toEqual(["plan.txt"]);
    expect(parsePlan(fs.readFileSync(plan, "utf8"), "plan")).toHaveLength(j.length);
    const rep = await cli(["replay", H("domain.pddl"), problem, plan, "--json"]);
    expect(rep.json()).toMatchObject({ valid: true, cost: j.cost });
  });

  it("an interrupt (abort signal) stops the same way", async () => {
    const out = path.join(work, "sigint");
    fs.mkdirSync(out);
    // a generated large harbour task: a first plan within a second, no proof of any kind for
    // far longer (A* alone needs over 20 s). In-process, the signal is seen when the run's
    // thread next turns the event loop (between queries), not inside a synchronous phase.
    const problem = path.join(work, "harbour-large-1.pddl");
    fs.writeFileSync(problem, generateProblem(scenarios.find((s) => s.name === "harbour")!, "large", 1));
    const ac = new AbortController();
    setTimeout(() => ac.abort(), 1500);
    const r = await cli(["solve", H("domain.pddl"), problem, "--json", "--plan", path.join(out, "plan.txt")], ac.signal);
    expect(r.code).toBe(3);
    expect(r.json()).toMatchObject({ status: "feasible", stopReason: "interrupted" });
    expect(fs.readdirSync(out)).toEqual(["plan.txt"]);
  });

  it("interrupted before any plan: status unknown, no plan file", async () => {
    const out = path.join(work, "early");
    fs.mkdirSync(out);
    const ac = new AbortController();
    ac.abort();
    const r = await cli(["solve", H("domain.pddl"), H("problem-04.pddl"), "--json", "--plan", path.join(out, "plan.txt")], ac.signal);
    expect(r.code).toBe(3);
    expect(r.json()).toMatchObject({ status: "unknown", cost: null, plan: null });
    expect(fs.readdirSync(out)).toEqual([]);
  });

  it("bad usage exits 2", async () => {
    expect((await cli(["solve", H("domain.pddl"), H("problem-01.pddl"), "--time-limit", "soon"])).code).toBe(2);
    expect((await cli(["solve", H("domain.pddl"), H("problem-01.pddl"), "--sat", "magic"])).code).toBe(2);
    expect((await cli(["solve", H("domain.pddl"), path.join(work, "missing.pddl")])).code).toBe(2);
  });
});

describe("plumbline encode", () => {
  it("writes DIMACS whose satisfiability matches the optimum: cost ≤ 19 impossible, cost ≤ 20 possible within 11 steps", async () => {
    const solve = (text: string) => {
      const cnf = parseDimacs(text, "x.cnf");
      const s = new Solver();
      for (const c of cnf.clauses) s.addClause(c);
      return s.solve();
    };
    const below20 = path.join(work, "below20.cnf");
    const r = await cli(["encode", H("domain.pddl"), H("problem-01.pddl"), "--steps", "11", "--cost-below", "20", "-o", below20]);
    expect(r.code).toBe(0);
    // source: benchmarks/domains/harbour/instances.json — optimum 20 in 6 actions (≤ 11 steps)
    expect(solve(fs.readFileSync(below20, "utf8"))).toBe("unsat");
    const stdout = await cli(["encode", H("domain.pddl"), H("problem-01.pddl"), "--steps", "11", "--cost-below", "21", "--encoding", "seq-1"]);
    expect(stdout.code).toBe(0);
    expect(stdout.stdout.startsWith("c plumbline seq-1")).toBe(true);
    expect(solve(stdout.stdout)).toBe("sat");
    expect((await cli(["encode", H("domain.pddl"), H("problem-01.pddl")])).code).toBe(2);
  });
});

describe("plumbline compare uses the SAT optimizer as its prover", () => {
  it("the committed optimal plan is optimal, proven by the SAT optimizer", async () => {
    const r = await cli(["compare", H("domain.pddl"), H("problem-01.pddl"), H("problem-01.plan"), "--json"]);
    expect(r.code).toBe(0);
    expect(r.json()).toMatchObject({ verdict: "optimal", optimum: { cost: 20 } });
    expect(r.json().optimum.method).toMatch(/SAT optimizer|landmark-cut/);
  });
});

describe("plumbline solve --sat external:CMD", () => {
  const own = `external:${process.execPath} --import tsx ${path.join(root, "test/e2e/fixtures/own-solver.ts")}`;
  it("uses the external solver's DRAT proof once the checker accepts it; the certificate audits", async () => {
    const cert = path.join(work, "ext-cert");
    const r = await cli(["solve", H("domain.pddl"), H("problem-01.pddl"), "--json", "--sat", own, "--certificate", cert]);
    expect(r.code).toBe(0);
    expect(r.json()).toMatchObject({ status: "optimal", cost: 20, proof: { kind: "drat", engine: "external" } });
    expect((await cli(["audit", cert, "--json"])).json()[0].valid).toBe(true);
  }, 60_000);

  for (const mode of ["no-proof", "bad-proof"]) {
    it(`without a usable proof (${mode}) the final query is re-proved by the built-in solver`, async () => {
      process.env.OWN_SOLVER_MODE = mode;
      try {
        const r = await cli(["solve", H("domain.pddl"), H("problem-01.pddl"), "--json", "--sat", own]);
        expect(r.code).toBe(0);
        expect(r.json()).toMatchObject({ status: "optimal", cost: 20, proof: { engine: "builtin" } });
        expect(r.json().notes.join(" ")).toContain("re-running the final query with the built-in solver");
      } finally {
        delete process.env.OWN_SOLVER_MODE;
      }
    }, 60_000);
  }
});
