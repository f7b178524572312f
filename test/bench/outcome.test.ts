// How a finished child becomes a result: the command's JSON and exit code (per the CLI
// contract in DESIGN.md: 0 answer, 1 negative verdict, 2 bad input, 3 limit), kills by the
// runner, heap exhaustion, crashes; and the audit verdicts.
import { describe, expect, it } from "vitest";
import { interpretAudit, jsonOf, parseOutcome, type ChildOutcome } from "../../src/bench/index.js";
import { normaliseTimeline } from "../../src/report/index.js";

const child = (p: Partial<ChildOutcome>): ChildOutcome => ({ exitCode: 0, signal: null, stdout: "", stderr: "", seconds: 1, peakMb: 40, killed: null, spawnError: null, ...p });
const limits = { timeLimit: 10, memoryLimit: 500 };

describe("parseOutcome", () => {
  it("takes status, cost, bounds, horizon and plan length from the command's JSON", () => {
    const stdout = JSON.stringify({ status: "optimal", cost: 22, lowerBound: 22, horizon: { horizon: 40, winner: "cost" }, plan: ["(a)", "(b)", "(c)"], seconds: 0.5, peakMemoryBytes: 104857600, proof: { file: "p", bytes: 999 } }, null, 2);
    const p = parseOutcome(child({ stdout }), limits);
    expect(p).toMatchObject({ status: "optimal", reason: null, cost: 22, lowerBound: 22, horizon: 40, planLength: 3, toolSeconds: 0.5, toolPeakMb: 100, proofBytes: 999 });
  });

  it("exit 3 keeps the best plan and says a limit was reached", () => {
    const p = parseOutcome(child({ exitCode: 3, stdout: JSON.stringify({ status: "feasible", cost: 30, lowerBound: 25, stopReason: "time" }) }), limits);
    expect(p).toMatchObject({ status: "feasible", cost: 30, lowerBound: 25, reason: "limit reached (time)" });
  });

  it("kills, heap exhaustion, bad input and crashes", () => {
    expect(parseOutcome(child({ killed: "time", exitCode: null, signal: "SIGKILL", seconds: 12.5 }), limits)).toMatchObject({ status: "unknown", reason: "killed: still running 12.5 s after start (time limit 10 s)" });
    expect(parseOutcome(child({ killed: "memory", exitCode: null }), limits)).toMatchObject({ status: "unknown", reason: "killed: resident memory above the limit of 500 MB" });
    expect(parseOutcome(child({ exitCode: 134, stderr: "<--- JS stacktrace --->\nFATAL ERROR: Reached heap limit Allocation failed - JavaScript heap out of memory" }), limits)).toMatchObject({ status: "unknown", reason: "memory limit: JavaScript heap exhausted (limit 500 MB)" });
    expect(parseOutcome(child({ exitCode: 2, stdout: JSON.stringify({ error: "p.pddl:3:4: expected ')'", code: "parse" }) }), limits)).toMatchObject({ status: "error", reason: "exit 2: p.pddl:3:4: expected ')'" });
    expect(parseOutcome(child({ exitCode: null, signal: "SIGSEGV", stderr: "" }), limits)).toMatchObject({ status: "error", reason: "killed by SIGSEGV" });
    expect(parseOutcome(child({ spawnError: "ENOENT" }), limits)).toMatchObject({ status: "error", reason: "could not start: ENOENT" });
  });

  it("finds the JSON object after stray lines", () => {
    expect(jsonOf('warming up\n{\n  "status": "optimal"\n}\n')).toEqual({ status: "optimal" });
    expect(jsonOf("no json here")).toBeNull();
  });

  it("normalises timelines in either spelling, sorted by time", () => {
    expect(normaliseTimeline([{ t: 2, cost: 5, bound: 5 }, [1, 9, null], { seconds: 0.5, upperBound: null, lowerBound: 1 }, { nope: 1 }])).toEqual([
      { seconds: 0.5, upper: null, lower: 1 },
      { seconds: 1, upper: 9, lower: null },
      { seconds: 2, upper: 5, lower: 5 },
    ]);
  });
});

describe("interpretAudit", () => {
  it("valid, rejected with the failing check, and audits that did not finish", () => {
    expect(interpretAudit(child({ stdout: JSON.stringify({ valid: true, checks: [] }) }))).toMatchObject({ audit: "valid", reason: null });
    const bad = interpretAudit(child({ exitCode: 1, stdout: JSON.stringify({ valid: false, checks: [{ name: "inputs", ok: true }, { name: "proof", ok: false, message: "lemma 17 is not RUP" }] }) }));
    expect(bad).toMatchObject({ audit: "rejected", reason: "check proof failed: lemma 17 is not RUP" });
    expect(interpretAudit(child({ exitCode: 1, stdout: JSON.stringify({ valid: false, checks: { hash: { ok: false } } }) })).reason).toBe("check hash failed");
    expect(interpretAudit(child({ killed: "time" }))).toMatchObject({ audit: "unfinished", reason: "audit killed (time limit)" });
    expect(interpretAudit(child({ exitCode: 4, stdout: "" }))).toMatchObject({ audit: "unfinished", reason: "audit failed to run (exit 4)" });
  });
});
