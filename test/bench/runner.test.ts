// The parallel runner: runs in child processes N at a time, appends results as they finish,
// skips finished runs when resumed, kills runs that pass their time or memory limit and
// records why, and runs the real `search` command end to end.
import { readFileSync, writeFileSync } from "node:fs";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { readResults, runBench } from "../../src/bench/index.js";
import { fakeConfig, hangScript, hogScript, quickScript, ROOT, tempDir, writeTree } from "./support.js";

function fileSuite(dir: string, problems: number, config: string): string {
  const files: Record<string, string> = { "d/domain.pddl": "(define (domain d))" };
  for (let i = 0; i < problems; i++) files[`d/p${i}.pddl`] = "x".repeat(10 + i);
  writeTree(dir, files);
  const suite = join(dir, "suite.json");
  writeFileSync(suite, JSON.stringify({ configurations: [config], entries: Array.from({ length: problems }, (_, i) => ({ domain: "d/domain.pddl", problem: `d/p${i}.pddl` })) }));
  return suite;
}

describe("bench runner", () => {
  it("runs N at a time, records every run, and resumes without redoing finished runs", async () => {
    const dir = tempDir("runner");
    const suite = fileSuite(dir, 6, "quick");
    const out = join(dir, "out");
    const extraConfigs = [fakeConfig("quick", quickScript(300))];
    const lines: string[] = [];
    const progress = { write: (s: string) => void lines.push(s), isTTY: false };
    const r = await runBench({ suite, outDir: out, jobs: 3, extraConfigs, timeLimit: 20, memoryLimit: 512, progress });
    expect(r.ran).toBe(6);
    expect(r.skipped).toBe(0);
    const recs = readResults(join(out, "results.jsonl"));
    expect(recs).toHaveLength(6);
    for (const rec of recs) {
      const n = Number(/p(\d+)$/.exec(rec.instance)![1]);
      expect(rec.status).toBe("optimal");
      expect(rec.cost).toBe((10 + n) % 50); // what the fake prints: file length mod 50
      expect(rec.planLength).toBe(2);
      expect(rec.timeline).toEqual([{ seconds: 0.001, upper: rec.cost! + 5, lower: 0 }, { seconds: 0.002, upper: rec.cost, lower: rec.cost }]);
      expect(rec.memory).toBeGreaterThan(0);
      expect(rec.audit).toBe("none");
    }
    // with 3 workers, runs overlapped in time (each span is [start, end] written by the fake itself)
    const spans = recs.map((rec) => JSON.parse(readFileSync(join(out, rec.runDir, "span.json"), "utf8")) as [number, number]);
    const overlapping = spans.some((a, i) => spans.some((b, j) => i !== j && a[0] < b[1] && b[0] < a[1]));
    expect(overlapping).toBe(true);
    expect(lines.join("")).toMatch(/\[bench\] 6\/6 done, 0 running/);

    // resume: nothing left to do
    const again = await runBench({ suite, outDir: out, jobs: 3, extraConfigs, timeLimit: 20, memoryLimit: 512 });
    expect(again.ran).toBe(0);
    expect(again.skipped).toBe(6);
    expect(again.records).toHaveLength(6);

    // a crash mid-write left half a line and lost one run: the half line is dropped, that run redone
    const kept = readFileSync(join(out, "results.jsonl"), "utf8").trim().split("\n");
    writeFileSync(join(out, "results.jsonl"), kept.slice(0, 5).join("\n") + "\n" + kept[5].slice(0, 40));
    const third = await runBench({ suite, outDir: out, jobs: 2, extraConfigs, timeLimit: 20, memoryLimit: 512 });
    expect(third.ran).toBe(1);
    expect(third.skipped).toBe(5);
    expect(readResults(join(out, "results.jsonl")).map((x) => x.id).sort()).toEqual(recs.map((x) => x.id).sort());
  });

  it("kills a run that overruns its time limit and records why", async () => {
    const dir = tempDir("runner-time");
    const suite = fileSuite(dir, 1, "hang");
    const out = join(dir, "out");
    const r = await runBench({ suite, outDir: out, extraConfigs: [fakeConfig("hang", hangScript)], timeLimit: 0.3, graceSeconds: 0.2, memoryLimit: 512 });
    const [rec] = r.records;
    expect(rec.status).toBe("unknown");
    expect(rec.reason).toMatch(/^killed: still running .* \(time limit 0\.3 s\)$/);
    expect(rec.cost).toBeNull();
    expect(rec.seconds).toBeGreaterThanOrEqual(0.5);
  });

  it("kills a run whose resident memory passes the limit", async () => {
    const dir = tempDir("runner-mem");
    const suite = fileSuite(dir, 1, "hog");
    const out = join(dir, "out");
    const r = await runBench({ suite, outDir: out, extraConfigs: [fakeConfig("hog", hogScript)], timeLimit: 30, graceSeconds: 1, memoryLimit: 150 });
    const [rec] = r.records;
    expect(rec.status).toBe("unknown");
    expect(rec.reason).toBe("killed: resident memory above the limit of 150 MB");
    expect(rec.memory).toBeGreaterThan(150);
  });

  it("records crashes as errors with the last line of stderr", async () => {
    const dir = tempDir("runner-crash");
    const suite = fileSuite(dir, 1, "crash");
    const r = await runBench({ suite, outDir: join(dir, "out"), extraConfigs: [fakeConfig("crash", `console.error("boom: cannot go on"); process.exit(4);`)], timeLimit: 10, memoryLimit: 512 });
    expect(r.records[0]).toMatchObject({ status: "error", reason: "exit 4: boom: cannot go on", exitCode: 4 });
  });

  it("runs the real search command and finds the published optimal costs", async () => {
    const dir = tempDir("runner-search");
    const suite = join(dir, "s.json");
    const domains = join(ROOT, "benchmarks/domains");
    writeFileSync(
      suite,
      JSON.stringify({
        entries: [
          { domain: join(domains, "harbour/domain.pddl"), problem: join(domains, "harbour/problem-01.pddl"), configurations: ["astar-landmark-cut", "astar-blind"] },
          { domain: join(domains, "workshop/domain.pddl"), problem: join(domains, "workshop/problem-01.pddl"), configuration: "astar-landmark-cut" },
        ],
      }),
    );
    const r = await runBench({ suite, outDir: join(dir, "out"), jobs: 2, timeLimit: 60, memoryLimit: 1024 });
    const figures = (s: string) => JSON.parse(readFileSync(join(domains, s, "instances.json"), "utf8"))["problem-01"];
    const byId = new Map(r.records.map((x) => [x.id, x]));
    // source: benchmarks/domains/*/instances.json (Dijkstra on each scenario's PDDL-free model)
    for (const id of ["harbour/problem-01@astar-landmark-cut", "harbour/problem-01@astar-blind"]) {
      expect(byId.get(id)).toMatchObject({ status: "optimal", cost: figures("harbour").optimalCost, lowerBound: figures("harbour").optimalCost });
    }
    expect(byId.get("workshop/problem-01@astar-landmark-cut")).toMatchObject({ status: "optimal", cost: figures("workshop").optimalCost });
    expect(r.agreement.findings).toEqual([]);
    const html = readFileSync(r.html, "utf8");
    expect(html).toContain("harbour/problem-01");
    const planFile = join(dir, "out", byId.get("harbour/problem-01@astar-landmark-cut")!.runDir, "plan.txt");
    expect(readFileSync(planFile, "utf8").trim().split("\n").filter((l) => l.startsWith("(")).length).toBe(figures("harbour").optimalLength);
  });

  it("runs the SAT optimizer with both encodings, audits its certificates, and agrees with A*", async () => {
    const dir = tempDir("runner-sat");
    const suite = join(dir, "s.json");
    const h = join(ROOT, "benchmarks/domains/harbour");
    writeFileSync(suite, JSON.stringify({ configurations: ["sat-forall", "sat-seq", "astar-landmark-cut"], entries: [{ domain: join(h, "domain.pddl"), problem: join(h, "problem-01.pddl") }] }));
    const r = await runBench({ suite, outDir: join(dir, "out"), jobs: 2, timeLimit: 120, memoryLimit: 2048 });
    // source: benchmarks/domains/harbour/instances.json (problem-01: optimal cost 20, Dijkstra on the PDDL-free model)
    const optimal = JSON.parse(readFileSync(join(h, "instances.json"), "utf8"))["problem-01"].optimalCost;
    for (const c of ["sat-forall", "sat-seq"]) {
      const rec = r.records.find((x) => x.configuration === c)!;
      expect(rec, c).toMatchObject({ status: "optimal", cost: optimal, lowerBound: optimal, audit: "valid" });
      expect(rec.proofBytes! > 0 || rec.horizon === null).toBe(true); // a DRAT proof unless proven by a lower bound
      expect(rec.auditSeconds).toBeGreaterThan(0);
      expect(rec.timeline.length).toBeGreaterThanOrEqual(2);
      expect(rec.timeline[rec.timeline.length - 1]).toMatchObject({ upper: optimal, lower: optimal });
      expect(readFileSync(join(dir, "out", rec.runDir, "audit.json"), "utf8")).toContain('"valid": true');
    }
    expect(r.records.find((x) => x.configuration === "astar-landmark-cut")).toMatchObject({ status: "optimal", cost: optimal });
    expect(r.agreement.findings).toEqual([]);
    expect(r.agreement.instances[0].verdict).toBe("agree");
  });
});
