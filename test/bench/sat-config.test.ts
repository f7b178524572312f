// The SAT configurations' wiring, checked against a stand-in CLI that behaves as DESIGN.md's
// contract says `solve --json` and `audit --json` do: the run gets the encoding, certificate
// folder and limits; the certificate is then audited and the verdict and proof size recorded.
// (The real optimizer is exercised by the bench itself and by test:slow.)
import { readFileSync, writeFileSync } from "node:fs";
import { availableParallelism } from "node:os";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { runBench } from "../../src/bench/index.js";
import { tempDir, writeTree } from "./support.js";

// Stand-in for `plumbline`: logs its arguments, and for `solve` writes a certificate folder
// with a 1234-byte proof; `audit` rejects certificates whose problem name contains "bad".
const FAKE_CLI = `
const fs = require("fs"), path = require("path");
const args = process.argv.slice(2);
fs.appendFileSync(process.env.FAKE_LOG, JSON.stringify(args) + "\\n");
const opt = (k) => args[args.indexOf(k) + 1];
if (args[0] === "solve") {
  const cert = opt("--certificate");
  fs.mkdirSync(cert, { recursive: true });
  fs.writeFileSync(path.join(cert, "certificate.json"), JSON.stringify({ problem: args[2] }));
  fs.writeFileSync(path.join(cert, "proof.drat.gz"), Buffer.alloc(1234));
  process.stdout.write(JSON.stringify({ status: "optimal", cost: 12, lowerBound: 12, plan: ["(a)", "(b)", "(c)", "(d)"], horizon: 11, seconds: 0.2,
    timeline: [{ seconds: 0.05, upper: 15, lower: 3 }, { seconds: 0.2, upper: 12, lower: 12 }] }));
} else if (args[0] === "audit") {
  const c = JSON.parse(fs.readFileSync(path.join(args[1], "certificate.json"), "utf8"));
  const ok = !c.problem.includes("bad");
  process.stdout.write(JSON.stringify({ valid: ok, checks: [{ name: "proof", ok, message: ok ? "checked" : "lemma 3 is not RUP" }] }));
  process.exitCode = ok ? 0 : 1;
} else process.exitCode = 2;
`;

describe("SAT configurations", () => {
  it("pass encoding, certificate folder and limits, then audit the certificate", async () => {
    const dir = tempDir("sat-config");
    writeTree(dir, { "d/domain.pddl": "d", "d/good.pddl": "p", "d/bad.pddl": "p", "fake-cli.cjs": FAKE_CLI });
    const suite = join(dir, "s.json");
    writeFileSync(suite, JSON.stringify({ entries: [{ domain: "d/domain.pddl", problem: "d/good.pddl", configurations: ["sat-forall", "sat-seq"] }, { domain: "d/domain.pddl", problem: "d/bad.pddl", configuration: "sat-forall" }] }));
    const log = join(dir, "calls.log");
    process.env.FAKE_LOG = log;
    const out = join(dir, "out");
    const r = await runBench({ suite, outDir: out, timeLimit: 40, memoryLimit: 700, cli: [process.execPath, join(dir, "fake-cli.cjs")] });
    const calls = readFileSync(log, "utf8").trim().split("\n").map((l) => JSON.parse(l) as string[]);
    const solveGood = calls.find((c) => c[0] === "solve" && c[2].endsWith("good.pddl") && c.includes("forall-1"))!;
    const runDir = join(out, "runs/sat-forall/d/good");
    expect(solveGood).toEqual(["solve", join(dir, "d/domain.pddl"), join(dir, "d/good.pddl"), "--json", "--encoding", "forall-1", "--certificate", join(runDir, "certificate"), "--plan", join(runDir, "plan.txt"), "--time-limit", "40", "--memory-limit", "700", "--threads", String(availableParallelism())]); // one run at a time: every core
    expect(calls.some((c) => c[0] === "solve" && c.includes("seq-1"))).toBe(true);
    expect(calls.filter((c) => c[0] === "audit").map((c) => c.slice(1))).toEqual(
      expect.arrayContaining([[join(runDir, "certificate"), "--json", "--time-limit-per-certificate", "40"], [join(out, "runs/sat-seq/d/good/certificate"), "--json", "--time-limit-per-certificate", "40"], [join(out, "runs/sat-forall/d/bad/certificate"), "--json", "--time-limit-per-certificate", "40"]]),
    );
    const byId = new Map(r.records.map((x) => [x.id, x]));
    expect(byId.get("d/good@sat-forall")).toMatchObject({ status: "optimal", cost: 12, horizon: 11, planLength: 4, proofBytes: 1234, audit: "valid", auditReason: null });
    expect(byId.get("d/good@sat-forall")!.auditSeconds).toBeGreaterThan(0);
    expect(byId.get("d/good@sat-forall")!.timeline).toHaveLength(2);
    // our own certificate rejected by our own audit is a bug: recorded and flagged
    expect(byId.get("d/bad@sat-forall")).toMatchObject({ audit: "rejected", auditReason: "check proof failed: lemma 3 is not RUP" });
    expect(r.agreement.findings.map((f) => f.kind)).toEqual(["audit-rejected"]);
    expect(readFileSync(join(out, "runs/sat-forall/d/bad/audit.json"), "utf8")).toContain('"valid":false');
  });
});
