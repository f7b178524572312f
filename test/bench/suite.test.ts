// Suite parsing: the JSON forms (file pairs, generator entries, included folders) and the
// directory form (domain.pddl folders and domain-NN/problem-NN pairs), and errors that name
// the suite file with line:col.
import { existsSync, readFileSync, writeFileSync } from "node:fs";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { loadSuite, parseSuite, planBench } from "../../src/bench/index.js";
import { errorOf, ROOT, tempDir, writeTree } from "./support.js";

const KNOWN = ["sat-forall", "sat-seq", "astar-landmark-cut", "astar-blind"];

describe("directory suites", () => {
  it("takes every other .pddl of a folder holding domain.pddl, and pairs per-problem domains", () => {
    const dir = tempDir("suite-dir");
    writeTree(dir, {
      "alpha/domain.pddl": "d",
      "alpha/p01.pddl": "p",
      "alpha/p02.pddl": "p",
      "alpha/notes.txt": "ignored",
      "alpha/deeper/domain.pddl": "d",
      "alpha/deeper/x.pddl": "p",
      "beta/domain-01.pddl": "d",
      "beta/problem-01.pddl": "p",
      "beta/domain-02.pddl": "d",
      "beta/problem-02.pddl": "p",
      "beta/problem-03.pddl": "p (no domain)",
      "gamma/readme.md": "no pddl here",
    });
    const s = loadSuite(dir, KNOWN);
    expect(s.kind).toBe("directory");
    expect(s.instances.map((i) => [i.instance, i.domain, i.domainFile.slice(dir.length + 1), i.problemFile.slice(dir.length + 1)])).toEqual([
      ["alpha/p01", "alpha", "alpha/domain.pddl", "alpha/p01.pddl"],
      ["alpha/p02", "alpha", "alpha/domain.pddl", "alpha/p02.pddl"],
      ["alpha/deeper/x", "alpha/deeper", "alpha/deeper/domain.pddl", "alpha/deeper/x.pddl"],
      ["beta/problem-01", "beta", "beta/domain-01.pddl", "beta/problem-01.pddl"],
      ["beta/problem-02", "beta", "beta/domain-02.pddl", "beta/problem-02.pddl"],
    ]);
    expect(s.warnings).toHaveLength(1);
    expect(s.warnings[0]).toContain("problem-03.pddl: skipped, no matching domain file");
  });

  it("reads the committed scenario folders as a suite", () => {
    const s = loadSuite(join(ROOT, "benchmarks/domains/harbour"), KNOWN);
    // the scenario folder commits problem-01..05 beside domain.pddl (benchmarks/domains/harbour/instances.json)
    const committed = Object.keys(JSON.parse(readFileSync(join(ROOT, "benchmarks/domains/harbour/instances.json"), "utf8")));
    expect(s.instances.map((i) => i.instance)).toEqual(committed.map((p) => `harbour/${p}`));
  });

  it("refuses an empty tree", () => {
    const dir = tempDir("suite-empty");
    writeTree(dir, { "a/readme.txt": "x" });
    expect(errorOf(() => loadSuite(dir, KNOWN)).message).toContain("no problems found");
  });
});

describe("JSON suites", () => {
  it("reads file pairs, generator entries and included folders", () => {
    const dir = tempDir("suite-json");
    writeTree(dir, { "m/domain.pddl": "d", "m/one.pddl": "p", "tree/k/domain.pddl": "d", "tree/k/q.pddl": "p" });
    const text = JSON.stringify({
      name: "mine",
      configurations: ["astar-landmark-cut"],
      timeLimit: 7,
      entries: [
        { domain: "m/domain.pddl", problem: "m/one.pddl", configuration: "astar-blind" },
        { scenario: "harbour", size: "tiny", seeds: [1, 2], params: { trucks: 2 } },
        { scenario: "workshop", size: "tiny", seed: 3, configurations: ["sat-forall", "astar-landmark-cut"] },
        { directory: "tree" },
      ],
    });
    const s = parseSuite(text, join(dir, "mine.json"), KNOWN);
    expect(s.name).toBe("mine");
    expect(s.timeLimit).toBe(7);
    expect(s.memoryLimit).toBeNull();
    expect(s.instances.map((i) => [i.instance, i.domain, i.configurations])).toEqual([
      ["m/one", "m", ["astar-blind"]],
      ["harbour/tiny-s1-trucks2", "harbour", null],
      ["harbour/tiny-s2-trucks2", "harbour", null],
      ["workshop/tiny-s3", "workshop", ["sat-forall", "astar-landmark-cut"]],
      ["k/q", "k", null],
    ]);
    expect(s.instances[0].problemFile).toBe(join(dir, "m/one.pddl"));
    expect(s.instances[1].generator).toMatchObject({ scenario: "harbour", size: "tiny", seed: 1, params: { trucks: 2 } });
  });

  it("generates scenario instances into the bench folder, same bytes as the generator", () => {
    const out = tempDir("suite-gen");
    const suiteFile = join(out, "s.json");
    writeFileSync(suiteFile, JSON.stringify({ entries: [{ scenario: "harbour", size: "tiny", seed: 6 }] }));
    const plan = planBench({ suite: suiteFile, configs: ["astar-landmark-cut"] }, join(out, "instances"));
    expect(plan.runs).toHaveLength(1);
    const r = plan.runs[0];
    expect(r.problemFile).toBe(join(out, "instances/harbour/tiny-s6.pddl"));
    // source: the committed harbour/problem-01.pddl is the generator's output for tiny, seed 6 (benchmarks/domains/harbour/instances.json)
    expect(readFileSync(r.problemFile, "utf8")).toBe(readFileSync(join(ROOT, "benchmarks/domains/harbour/problem-01.pddl"), "utf8"));
    expect(readFileSync(r.domainFile, "utf8")).toBe(readFileSync(join(ROOT, "benchmarks/domains/harbour/domain.pddl"), "utf8"));
  });

  it("selects configurations: --config replaces the suite's defaults and filters an entry's own", () => {
    const dir = tempDir("suite-select");
    writeTree(dir, { "m/domain.pddl": "d", "m/a.pddl": "p", "m/b.pddl": "p" });
    const suiteFile = join(dir, "s.json");
    writeFileSync(suiteFile, JSON.stringify({ configurations: ["sat-forall", "astar-landmark-cut"], entries: [{ domain: "m/domain.pddl", problem: "m/a.pddl" }, { domain: "m/domain.pddl", problem: "m/b.pddl", configuration: "sat-seq" }] }));
    const all = planBench({ suite: suiteFile }, join(dir, "inst")).runs.map((r) => `${r.instance}@${r.configuration}`);
    expect(all).toEqual(["m/a@sat-forall", "m/a@astar-landmark-cut", "m/b@sat-seq"]);
    const only = planBench({ suite: suiteFile, configs: ["astar-landmark-cut", "sat-seq"] }, join(dir, "inst")).runs.map((r) => `${r.instance}@${r.configuration}`);
    expect(only).toEqual(["m/a@astar-landmark-cut", "m/a@sat-seq", "m/b@sat-seq"]);
    const blind = planBench({ suite: suiteFile, configs: ["astar-blind"] }, join(dir, "inst")).runs.map((r) => `${r.instance}@${r.configuration}`);
    expect(blind).toEqual(["m/a@astar-blind"]);
  });

  it("names file, line and column of every mistake", () => {
    const dir = tempDir("suite-errors");
    writeTree(dir, { "m/domain.pddl": "d", "m/a.pddl": "p" });
    const file = join(dir, "bad.json");
    const cases: Array<[string, number, number, RegExp]> = [
      ['{\n  "entries": [\n    { "scenario": "harbour" },\n  ]\n}', 4, 3, /invalid JSON: expected a JSON value, found '\]'/],
      ['{ "entries": [\n  { "scenario": "harbor", "seed": 1 }\n] }', 2, 17, /unknown scenario "harbor" \(known: harbour, warehouse, workshop\)/],
      ['{ "entries": [\n  { "domain": "m/domain.pddl", "problem": "m/zz.pddl" }\n] }', 2, 43, /problem file m\/zz.pddl not found/],
      ['{ "entries": [\n  { "domain": "m/domain.pddl", "problem": "m/a.pddl", "configuration": "sat-fast" }\n] }', 2, 72, /unknown configuration "sat-fast" \(known: sat-forall/],
      ['{ "entries": [\n  { "scenario": "harbour", "seed": -1 }\n] }', 2, 36, /"seed" to be a non-negative integer/],
      ['{ "entries": [\n  { "scenario": "harbour", "sise": "tiny" }\n] }', 2, 28, /unknown key "sise"/],
      ['{ "entries": [\n  { "scenario": "harbour", "size": "huge" }\n] }', 2, 36, /size must be one of tiny, small, medium, large/],
      ['{ "entries": [], "timeLimit": 0 }', 1, 31, /"timeLimit" to be a positive number/],
      ['{ "entries": [] }', 0, 0, /the suite has no entries/],
      ['{ "entries": [ { "domain": "m/domain.pddl" } ] }', 1, 16, /"problem" to be a non-empty string/],
    ];
    for (const [text, line, col, re] of cases) {
      writeFileSync(file, text);
      const e = errorOf(() => loadSuite(file, KNOWN));
      expect(e.message, text).toMatch(re);
      if (line > 0) {
        expect(e.pos, text).toEqual({ file, line, col });
        expect(e.message.startsWith(`${file}:${line}:${col}: `), e.message).toBe(true);
      } else expect(e.message).toContain(file);
    }
    expect(errorOf(() => loadSuite(join(dir, "missing.json"), KNOWN)).message).toContain("missing.json: no such file");
  });
});

describe("committed suites", () => {
  it("small, medium and large parse and name only generator entries", () => {
    for (const name of ["small", "medium", "large"]) {
      const file = join(ROOT, "benchmarks/suites", `${name}.json`);
      expect(existsSync(file)).toBe(true);
      const s = loadSuite(file, KNOWN);
      expect(s.instances.length).toBeGreaterThanOrEqual(15);
      expect(s.instances.every((i) => i.generator !== undefined)).toBe(true);
      expect(new Set(s.instances.map((i) => i.domain))).toEqual(new Set(["harbour", "workshop", "warehouse"]));
    }
  });
});
