// The search and compare commands end to end (in-process): JSON fields, exit codes,
// plan files, side-by-side output and usage errors.
import { existsSync, mkdtempSync, readFileSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { afterAll, describe, expect, it } from "vitest";
import { cli } from "../support/cli.js";

const DIR = join(__dirname, "../fixtures/search/canal");
const D = join(DIR, "domain.pddl");
const P1 = join(DIR, "p1.pddl");
const P2 = join(DIR, "p2.pddl");
const plan = (n: string) => join(DIR, `${n}.plan`);
const tmp = mkdtempSync(join(tmpdir(), "plumbline-search-cli-"));
afterAll(() => rmSync(tmp, { recursive: true, force: true }));

describe("plumbline search", () => {
  it("A* with each admissible heuristic: optimal cost 11 on p2 (hand-checked), exit 0", async () => {
    for (const h of ["landmark-cut", "max", "blind"]) {
      const r = await cli(["search", D, P2, "--heuristic", h, "--json"]);
      expect(r.code).toBe(0);
      const j = r.json();
      expect(j).toMatchObject({ status: "optimal", cost: 11, heuristic: h, algorithm: "astar", length: 9 });
      for (const k of ["expanded", "generated", "seconds", "peakMemoryBytes"]) expect(typeof j[k]).toBe("number");
    }
  });

  it("--greedy reports feasible and writes a plan file that replays with the same cost", async () => {
    const out = join(tmp, "greedy.plan");
    const r = await cli(["search", D, P2, "--greedy", "--plan", out, "--json"]);
    expect(r.code).toBe(0);
    expect(r.json()).toMatchObject({ status: "feasible", algorithm: "gbfs", heuristic: "ff", planFile: out });
    const rep = await cli(["replay", D, P2, out, "--json"]);
    expect(rep.code).toBe(0);
    expect(rep.json().cost).toBe(r.json().cost);
  });

  it("human output lists the plan and its proof method", async () => {
    const r = await cli(["search", D, P1]);
    expect(r.code).toBe(0);
    expect(r.stdout).toContain("optimal by exhaustive A*");
    expect(r.stdout).toContain("(steam east dock)");
    expect(r.stdout).toContain("only as good as the model");
  });

  it("a time limit reached gives status unknown, exit 3 and no plan file", async () => {
    const out = join(tmp, "none.plan");
    const r = await cli(["search", D, P2, "--time-limit", "0.000001", "--plan", out, "--json"]);
    expect(r.code).toBe(3);
    expect(r.json()).toMatchObject({ status: "unknown", plan: null, stopReason: "deadline" });
    expect(existsSync(out)).toBe(false);
  });

  it("usage errors exit 2: inadmissible heuristic for A*, bad time limit, unknown heuristic", async () => {
    expect((await cli(["search", D, P1, "--heuristic", "ff"])).code).toBe(2);
    const bad = await cli(["search", D, P1, "--time-limit", "soon"]);
    expect(bad.code).toBe(2);
    expect(bad.stderr).toContain("--time-limit");
    expect((await cli(["search", D, P1, "--heuristic", "magic"])).code).toBe(2);
  });
});

describe("plumbline compare", () => {
  it("optimal → exit 0", async () => {
    const r = await cli(["compare", D, P1, plan("p1-optimal"), "--json"]);
    expect(r.code).toBe(0);
    expect(r.json()).toMatchObject({ verdict: "optimal", plan: { cost: 5 }, optimum: { cost: 5 } });
  });

  it("suboptimal → exit 1, by 1, both plans side by side with the divergence marked", async () => {
    const j = await cli(["compare", D, P1, plan("p1-bypass"), "--json"]);
    expect(j.code).toBe(1);
    expect(j.json()).toMatchObject({ verdict: "suboptimal", excess: 1, optimum: { cost: 5, method: expect.stringMatching(/^SAT optimizer/) } });
    const h = await cli(["compare", D, P1, plan("p1-bypass")]);
    expect(h.stdout).toContain("optimal by SAT optimizer");
    const marked = h.stdout.split("\n").filter((l) => l.startsWith(">>"));
    expect(marked).toHaveLength(1);
    expect(marked[0]).toMatch(/^>> 2\s+\(steam west east\)\s+\(steam west mid\)$/);
    // aligned columns: the right-hand plan starts at the same column on every step row
    const rows = h.stdout.split("\n").filter((l) => /^(>>| {3})\d/.test(l) && l.includes("(steam"));
    const cols = new Set(rows.filter((l) => (l.match(/\(/g) ?? []).length === 2).map((l) => l.lastIndexOf("(")));
    expect(cols.size).toBe(1);
  });

  it("invalid → exit 1 with the failing step and literal", async () => {
    const r = await cli(["compare", D, P1, plan("p1-wrong-basin"), "--json"]);
    expect(r.code).toBe(1);
    expect(r.json()).toMatchObject({ verdict: "invalid", plan: { error: { step: 1, literal: "(tug-at mid)" } } });
    const h = await cli(["compare", D, P1, plan("p1-wrong-basin")]);
    expect(h.stdout).toMatch(/\(hitch b1 mid\)\s+<- fails: \(tug-at mid\)/);
  });

  it("unknown → exit 3 with both bounds", async () => {
    const r = await cli(["compare", D, P1, plan("p1-bypass"), "--time-limit", "0.000001", "--json"]);
    expect(r.code).toBe(3);
    const j = r.json();
    expect(j.verdict).toBe("unknown");
    expect(j.optimum.upperBound).toBe(6);
    expect(j.optimum.lowerBound).toBeLessThanOrEqual(5);
  });

  it("a plan naming an unknown object is invalid (exit 1, file:line:col)", async () => {
    const bad = join(tmp, "bad.plan");
    const { writeFileSync } = await import("node:fs");
    writeFileSync(bad, "(hitch b9 west)\n");
    const r = await cli(["compare", D, P1, bad]);
    expect(r.code).toBe(1);
    expect(r.stdout).toMatch(/verdict: invalid — .*bad\.plan:1:\d+/);
    expect(readFileSync(bad, "utf8")).toContain("b9");
  });
});
