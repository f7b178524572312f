// Result records for report tests: a compact constructor with sensible defaults, and a
// fast-check generator of random records (awkward names included) for the chart tests.
import fc from "fast-check";
import type { BenchMeta, RunRecord, RunStatus } from "../../src/report/record.js";

export function rec(p: Partial<RunRecord> & { instance: string; configuration: string }): RunRecord {
  return {
    id: `${p.instance}@${p.configuration}`,
    domain: p.instance.split("/")[0],
    domainFile: "d.pddl",
    problemFile: "p.pddl",
    status: "optimal",
    reason: null,
    cost: 10,
    lowerBound: null,
    horizon: null,
    planLength: null,
    seconds: 1,
    toolSeconds: null,
    memory: 50,
    proofBytes: null,
    audit: "none",
    auditSeconds: null,
    auditReason: null,
    exitCode: 0,
    timeLimit: 60,
    memoryLimit: 1024,
    timeline: [],
    startedAt: "2026-01-01T00:00:00.000Z",
    runDir: "runs/x",
    ...p,
  };
}

const nameArb = fc.stringMatching(/^[a-z<>&"' ]{1,6}\/[a-z0-9<&-]{1,6}$/);
const statusArb = fc.constantFrom<RunStatus>("optimal", "feasible", "unsolvable", "unknown", "error");
const costArb = fc.option(fc.integer({ min: 0, max: 10_000 }), { nil: null });

export const recordsArb = fc
  .array(
    fc.record({
      instance: nameArb,
      configuration: fc.constantFrom("sat-forall", "astar-landmark-cut", "c<&>\""),
      status: statusArb,
      cost: costArb,
      lowerBound: costArb,
      horizon: fc.option(fc.integer({ min: 0, max: 1e9 }), { nil: null }),
      planLength: fc.option(fc.integer({ min: 0, max: 500 }), { nil: null }),
      seconds: fc.double({ min: 0, max: 1e4, noNaN: true }),
      timeline: fc.array(fc.record({ seconds: fc.double({ min: 0, max: 1e4, noNaN: true }), upper: costArb, lower: costArb }), { maxLength: 6 }),
    }),
    { maxLength: 25 },
  )
  .map((xs) => {
    const seen = new Set<string>();
    return xs.filter((x) => !seen.has(`${x.instance}@${x.configuration}`) && !!seen.add(`${x.instance}@${x.configuration}`)).map((x) => rec(x));
  });

export const META: BenchMeta = { suite: "demo", suiteFile: "/x/demo.json", configurations: ["sat-forall", "astar-landmark-cut"], timeLimit: 60, memoryLimit: 2048, jobs: 2, createdAt: "2026-01-01T00:00:00.000Z", toolVersion: "0.1.0", node: "v20", host: "box", cpus: 2, runs: 4 };
