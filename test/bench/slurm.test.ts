// Scale-out round trip: export a suite as a job array, run the generated sbatch script once
// per array index with bash (as the scheduler would, minus the scheduler), merge the per-task
// result files, and compare with the same suite run locally.
import { spawnSync } from "node:child_process";
import { existsSync, readFileSync, readdirSync, writeFileSync } from "node:fs";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { exportSlurm, mergeTasks, readResults, readTasks, sbatchScript } from "../../src/bench/index.js";
import { cli } from "../support/cli.js";
import { plumblineCommand, ROOT, tempDir } from "./support.js";

const domains = join(ROOT, "benchmarks/domains");

describe("slurm export and merge", () => {
  it("writes a job-array script whose tasks, run one by one, merge into one report", async () => {
    const dir = tempDir("slurm");
    const suite = join(dir, "s.json");
    writeFileSync(
      suite,
      JSON.stringify({
        name: "tiny",
        configurations: ["astar-blind"],
        timeLimit: 60,
        memoryLimit: 1024,
        entries: [{ domain: join(domains, "harbour/domain.pddl"), problem: join(domains, "harbour/problem-01.pddl") }, { scenario: "workshop", size: "tiny", seed: 1, configuration: "astar-landmark-cut" }],
      }),
    );
    const exp = join(dir, "export");
    const e = exportSlurm({ suite, jobs: 4 }, exp);
    expect(e.tasks).toBe(2);
    const tasks = readTasks(e.taskList);
    expect(tasks.map((t) => [t.index, t.id, t.domainFile, t.problemFile])).toEqual([
      [0, "harbour/problem-01@astar-blind", "instances/harbour/problem-01/domain.pddl", "instances/harbour/problem-01/problem.pddl"],
      [1, "workshop/tiny-s1@astar-landmark-cut", "instances/workshop/domain.pddl", "instances/workshop/tiny-s1.pddl"],
    ]);
    // the export is self-contained: inputs are copied in
    expect(readFileSync(join(exp, tasks[0].problemFile), "utf8")).toBe(readFileSync(join(domains, "harbour/problem-01.pddl"), "utf8"));
    const script = readFileSync(e.script, "utf8");
    expect(script).toContain("#SBATCH --array=0-1%4\n");
    expect(script).toContain("#SBATCH --mem=1536M\n");
    expect(script).toContain("#SBATCH --time=00:02:06\n"); // 60 s + 6 s grace + 60 s margin, no audit
    expect(existsSync(join(exp, "logs"))).toBe(true);

    // merging before any task ran: everything missing
    expect(mergeTasks(exp).missing).toEqual([0, 1]);

    // run the script as the scheduler would: once per array index, from the export folder
    const plumbline = plumblineCommand().join(" "); // the script word-splits $PLUMBLINE, as a user would set it
    for (let i = 0; i < tasks.length; i++) {
      const r = spawnSync("bash", [e.script], { cwd: exp, env: { ...process.env, SLURM_ARRAY_TASK_ID: String(i), PLUMBLINE: plumbline }, encoding: "utf8" });
      expect(r.status, r.stderr).toBe(0);
    }
    expect(readdirSync(join(exp, "results")).sort()).toEqual(["task-0.jsonl", "task-1.jsonl"]);

    const m = await cli(["bench", "--merge", exp, "--json"]);
    expect(m.code, m.stderr).toBe(0);
    expect(m.json()).toMatchObject({ runs: 2, missing: [], findings: [] });
    const merged = readResults(join(exp, "results.jsonl"));
    expect(merged.map((r) => r.id)).toEqual(tasks.map((t) => t.id));
    // source: benchmarks/domains/harbour/instances.json (problem-01 optimal cost, Dijkstra on the PDDL-free model)
    const optimal = JSON.parse(readFileSync(join(domains, "harbour/instances.json"), "utf8"))["problem-01"].optimalCost;
    expect(merged[0]).toMatchObject({ status: "optimal", cost: optimal, problemFile: tasks[0].problemFile });
    expect(merged[1].status).toBe("optimal");
    expect(readFileSync(join(exp, "report.html"), "utf8")).toContain("plumbline bench: tiny");

    // the same suite run locally gives the same statuses and costs
    const local = await cli(["bench", suite, "--output-dir", join(dir, "local"), "--json", "--quiet"]);
    expect(local.code, local.stderr).toBe(0);
    const localRecs = readResults(join(dir, "local", "results.jsonl"));
    expect(localRecs.map((r) => [r.id, r.status, r.cost])).toEqual(merged.map((r) => [r.id, r.status, r.cost]));
  });

  it("exit code 1 and a loud banner when merged results disagree on a proven optimum", async () => {
    const dir = tempDir("slurm-bad");
    const suite = join(dir, "s.json");
    writeFileSync(suite, JSON.stringify({ configurations: ["astar-blind", "astar-landmark-cut"], entries: [{ domain: join(domains, "harbour/domain.pddl"), problem: join(domains, "harbour/problem-01.pddl") }] }));
    const exp = join(dir, "export");
    exportSlurm({ suite }, exp);
    const base = { instance: "harbour/problem-01", domain: "harbour", domainFile: "d", problemFile: "p", status: "optimal", reason: null, lowerBound: null, horizon: null, planLength: 6, seconds: 1, toolSeconds: 1, memory: 1, proofBytes: null, audit: "none", auditSeconds: null, auditReason: null, exitCode: 0, timeLimit: 60, memoryLimit: 1024, timeline: [], startedAt: "", runDir: "r" };
    // planted: two "proven optima" that differ
    writeFileSync(join(exp, "results", "task-0.jsonl"), JSON.stringify({ ...base, id: "harbour/problem-01@astar-blind", configuration: "astar-blind", cost: 20 }) + "\n");
    writeFileSync(join(exp, "results", "task-1.jsonl"), JSON.stringify({ ...base, id: "harbour/problem-01@astar-landmark-cut", configuration: "astar-landmark-cut", cost: 19 }) + "\n");
    const m = await cli(["bench", "--merge", exp]);
    expect(m.code).toBe(1);
    expect(m.stdout).toContain("!!  1 DISAGREEMENT BETWEEN CONFIGURATIONS — THIS MEANS A BUG IN PLUMBLINE");
    expect(m.stdout).toContain("astar-blind = 20, astar-landmark-cut = 19");
  });

  it("scales the requested wall time for audited configurations", () => {
    // two limits (run, then audit) plus grace each, plus a minute
    expect(sbatchScript("s", 3, 100, 2000, 0, true)).toContain("#SBATCH --time=00:04:40\n#SBATCH --mem=2512M\n");
    expect(sbatchScript("s", 3, 100, 2000, 0, true)).toContain("#SBATCH --array=0-2\n");
  });
});
