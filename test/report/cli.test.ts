// `plumbline report DIR` on a bench folder (tables, exit 1 on a planted disagreement) and on
// a certificate folder (plan replayed from the copied inputs, recorded audit shown), plus
// the errors for folders it cannot report on.
import { copyFileSync, existsSync, mkdirSync, readFileSync, writeFileSync } from "node:fs";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { cli } from "../support/cli.js";
import { ROOT, tempDir } from "../bench/support.js";
import { META, rec } from "./records.js";

function benchDir(records: ReturnType<typeof rec>[]): string {
  const dir = tempDir("report-cli");
  writeFileSync(join(dir, "results.jsonl"), records.map((r) => JSON.stringify(r) + "\n").join(""));
  writeFileSync(join(dir, "bench.json"), JSON.stringify(META));
  return dir;
}

describe("plumbline report", () => {
  it("rewrites a bench folder's report and prints its tables", async () => {
    const dir = benchDir([rec({ instance: "h/a", configuration: "sat-forall", cost: 7 }), rec({ instance: "h/a", configuration: "astar-landmark-cut", cost: 7 })]);
    const r = await cli(["report", dir]);
    expect(r.code, r.stderr).toBe(0);
    expect(r.stdout).toMatch(/sat-forall\s+1\s+1/);
    expect(r.stdout).toContain(`report: ${join(dir, "report.html")}`);
    for (const f of ["report.html", "coverage.svg", "tightness.svg", "summary.txt"]) expect(existsSync(join(dir, f))).toBe(true);
  });

  it("exits 1 when a planted disagreement is in the results", async () => {
    const dir = benchDir([rec({ instance: "h/a", configuration: "sat-forall", cost: 7 }), rec({ instance: "h/a", configuration: "astar-landmark-cut", cost: 8 })]);
    const r = await cli(["report", dir, "--json"]);
    expect(r.code).toBe(1);
    expect(r.json().findings[0]).toMatchObject({ kind: "optimum-disagreement", instance: "h/a" });
    expect(readFileSync(join(dir, "report.html"), "utf8")).toContain('class="alarm"');
  });

  it("reports a certificate folder: plan replayed from its own inputs, recorded audit shown", async () => {
    const runDir = tempDir("report-cert");
    const cert = join(runDir, "certificate");
    mkdirSync(cert);
    const h = join(ROOT, "benchmarks/domains/harbour");
    copyFileSync(join(h, "domain.pddl"), join(cert, "domain.pddl"));
    copyFileSync(join(h, "problem-01.pddl"), join(cert, "problem.pddl"));
    copyFileSync(join(h, "problem-01.plan"), join(cert, "plan.txt"));
    writeFileSync(join(cert, "certificate.json"), JSON.stringify({ cost: 20, planLength: 6, claim: { status: "optimal", method: "lower-bound" } }));
    writeFileSync(join(runDir, "audit.json"), JSON.stringify({ valid: true, checks: { replay: { ok: true }, "landmark-bound": { ok: true } } }));
    const r = await cli(["report", cert, "--no-audit", "--json"]);
    expect(r.code, r.stderr).toBe(0);
    const out = r.json();
    expect(out).toMatchObject({ kind: "certificate", audit: "valid", planNote: null });
    // source: benchmarks/domains/harbour/instances.json (problem-01: optimal length 6, cost 20)
    expect(out.plan).toBe(6);
    const html = readFileSync(out.report, "utf8");
    expect(out.report).toBe(`${cert}.report.html`);
    expect(html).toContain("total 20.");
    expect(html).toContain("recorded by an earlier audit");
    expect(html).toContain("landmark-bound");
  });

  it("refuses folders it cannot report on, naming them", async () => {
    const empty = tempDir("report-empty");
    const r = await cli(["report", empty]);
    expect(r.code).toBe(2);
    expect(r.stderr).toContain(`${empty}: neither a bench results folder (results.jsonl) nor a certificate (certificate.json)`);
    writeFileSync(join(empty, "tasks.jsonl"), "");
    expect((await cli(["report", empty])).stderr).toMatch(/run (npx )?plumbline bench --merge/);
    expect((await cli(["report", join(empty, "nope")])).code).toBe(2);
  });

  it("audits a real certificate, and a tampered one is reported as rejected with exit 1", async () => {
    const dir = tempDir("report-real-cert");
    const h = join(ROOT, "benchmarks/domains/harbour");
    const cert = join(dir, "certificate");
    const solved = await cli(["solve", join(h, "domain.pddl"), join(h, "problem-01.pddl"), "--certificate", cert, "--json", "--quiet"]);
    expect(solved.code, solved.stderr).toBe(0);
    const ok = await cli(["report", cert, "--json"]);
    expect(ok.code, ok.stderr).toBe(0);
    expect(ok.json()).toMatchObject({ audit: "valid", planNote: null });
    const html = readFileSync(ok.json().report, "utf8");
    expect(html).toContain("audited just now");
    expect(html).toContain("<h2>Horizon derivation</h2>");
    // tamper: claim a cheaper cost in the plan's recorded figures
    const cj = JSON.parse(readFileSync(join(cert, "certificate.json"), "utf8"));
    cj.plan.cost -= 1;
    writeFileSync(join(cert, "certificate.json"), JSON.stringify(cj));
    const bad = await cli(["report", cert, "--json", "--output", join(dir, "bad.html")]);
    expect(bad.code).toBe(1);
    expect(bad.json().audit).toBe("rejected");
    expect(bad.json().checks.some((c: { ok: boolean }) => !c.ok)).toBe(true);
    expect(readFileSync(join(dir, "bad.html"), "utf8")).toContain("The audit rejected this certificate");
  });
});
