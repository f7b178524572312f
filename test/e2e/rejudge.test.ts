// `plumbline rejudge`: model edits that hit each verdict (recomment, reorder, a cost raised on an
// unused and on a used road, a road added, a road closed, an action removed, the goal changed, a
// crane given a cost), the JSON keys the contract fixes, exit codes, and the new certificates.
import * as fs from "node:fs";
import { tmpdir } from "node:os";
import * as path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { auditCertificate, writeCertificate } from "../../src/certify/index.js";
import { ground } from "../../src/ground/index.js";
import { disposeOutcome, optimizeFiles } from "../../src/optimize/index.js";
import { loadModel } from "../../src/pddl/index.js";
import { parsePlan, replayPlan } from "../../src/plan/index.js";
import { cli } from "../support/cli.js";
import { optimalCost } from "../support/reference.js";

const root = path.resolve(import.meta.dirname, "../..");
const H = (f: string) => path.join(root, "benchmarks/domains/harbour", f);
const domainText = fs.readFileSync(H("domain.pddl"), "utf8");
const problemText = fs.readFileSync(H("problem-02.pddl"), "utf8");
const work = fs.mkdtempSync(path.join(tmpdir(), "plumbline-rejudge-"));
afterAll(() => fs.rmSync(work, { recursive: true, force: true }));
const cert = path.join(work, "cert");
let files = 0;

/** Writes `text` to a fresh file and returns its path. */
function file(text: string, name = "problem.pddl"): string {
  const dir = path.join(work, `edit-${++files}`);
  fs.mkdirSync(dir);
  fs.writeFileSync(path.join(dir, name), text);
  return path.join(dir, name);
}

/** `text` with `from` replaced by `to` (which must occur). */
function edit(text: string, from: string, to: string): string {
  expect(text).toContain(from);
  return text.split(from).join(to);
}

/** The optimum of the edited model by the reference Dijkstra (test/support/reference.ts). */
function reference(domain: string, problem: string): number | null {
  return optimalCost(ground(loadModel(domain, problem)))?.cost ?? null;
}

const KEYS = ["verdict", "modelChanged", "planValid", "failure", "recordedCost", "newCost", "optimal", "cheaperPlan", "certificate"];

async function rejudge(args: string[]): Promise<{ code: number; j: any; stdout: string }> {
  const r = await cli(["rejudge", cert, ...args, "--json"]);
  const j = r.json();
  for (const k of KEYS) expect(j, k).toHaveProperty(k);
  return { code: r.code, j, stdout: r.stdout };
}

beforeAll(async () => {
  // the certificate records the committed optimal plan (the expectations below name its steps):
  // solving with it as the incumbent leaves only the proof, so no other optimal plan replaces it
  const committed = fs
    .readFileSync(H("problem-02.plan"), "utf8")
    .split("\n")
    .filter((l) => l.startsWith("("));
  const out = await optimizeFiles(H("domain.pddl"), H("problem-02.pddl"), { incumbent: committed });
  // source: benchmarks/domains/harbour/instances.json (problem-02: optimal cost 22)
  expect(out.cost).toBe(22);
  expect(out.plan!.names).toEqual(committed);
  await writeCertificate(cert, out.certificate!);
  disposeOutcome(out);
}, 60_000);

describe("plumbline rejudge", () => {
  it("recommented, re-spaced and upper-cased files: unchanged, the certificate re-audited (exit 0), and --certificate copies it with the new texts", async () => {
    const p = file("; edited by hand\n" + edit(problemText, "(truck-at t1 depot1)\n    (truck-at t2 yard1)", "(TRUCK-AT t1   depot1) ; t1 starts here\n\n\t(truck-at T2 yard1)"));
    const out = path.join(work, "unchanged-copy");
    const { code, j } = await rejudge(["--problem", p, "--certificate", out]);
    expect(code).toBe(0);
    expect(j).toMatchObject({ verdict: "unchanged", modelChanged: false, planValid: true, failure: null, recordedCost: 22, newCost: 22, optimal: true, cheaperPlan: null, certificate: out });
    expect(j.audit.valid).toBe(true);
    expect(j.reuse).toEqual([expect.objectContaining({ part: "certificate", reused: true })]);
    expect(fs.readFileSync(path.join(out, "problem.pddl"), "utf8")).toBe(fs.readFileSync(p, "utf8"));
    expect(auditCertificate(out).valid).toBe(true);
  }, 60_000);

  it("reordered init facts: the same ground task (change 'none'), proven optimal again from the recorded plan (exit 0)", async () => {
    const p = file(edit(problemText, "(crane-at crane1 quay1)\n    (crane-at crane2 yard1)", "(crane-at crane2 yard1)\n    (crane-at crane1 quay1)"));
    const { code, j } = await rejudge(["--problem", p]);
    expect(code).toBe(0);
    expect(j).toMatchObject({ verdict: "still-optimal", modelChanged: true, planValid: true, newCost: 22, optimal: true, cheaperPlan: null, certificate: null });
    expect(j.change.kind).toBe("none");
  }, 60_000);

  it("a longer road the plan does not use: still optimal, proven again with the recorded plan as incumbent; the new certificate audits", async () => {
    const p = file(edit(problemText, "(= (road-length quay1 depot1) 22)", "(= (road-length quay1 depot1) 25)"));
    const out = path.join(work, "still-optimal");
    const { code, j } = await rejudge(["--problem", p, "--certificate", out]);
    // source: the reference Dijkstra on the edited model
    expect(reference(H("domain.pddl"), p)).toBe(22);
    expect(code).toBe(0);
    expect(j).toMatchObject({ verdict: "still-optimal", modelChanged: true, planValid: true, failure: null, recordedCost: 22, newCost: 22, optimal: true, cheaperPlan: null, certificate: out });
    expect(j.change).toMatchObject({ kind: "costs", costsChanged: [{ action: "(drive t1 quay1 depot1)", from: 22, to: 25 }, { action: "(drive t2 quay1 depot1)", from: 22, to: 25 }] });
    expect(j.reuse.find((u: any) => u.part === "incumbent")).toMatchObject({ reused: true });
    expect(j.reuse.find((u: any) => u.part === "horizon")).toMatchObject({ reused: false });
    const a = auditCertificate(out);
    expect(a.valid).toBe(true);
    expect(a.cost).toBe(22);
  }, 60_000);

  it("a longer road the plan uses: cost changed (exit 1), still optimal at the new cost", async () => {
    const p = file(edit(problemText, "(= (road-length yard2 quay1) 2)", "(= (road-length yard2 quay1) 3)"));
    const { code, j } = await rejudge(["--problem", p]);
    const ref = reference(H("domain.pddl"), p);
    // source: the reference Dijkstra; the plan drives yard2 → quay1 once, so 22 + 1
    expect(ref).toBe(23);
    expect(code).toBe(1);
    expect(j).toMatchObject({ verdict: "cost-changed", planValid: true, recordedCost: 22, newCost: 23, optimal: true, cheaperPlan: null });
  }, 60_000);

  it("a crane gets a cost (domain: loading costs 1): cost changed, the optimum as the reference finds it", async () => {
    const d = file(edit(domainText, "(in ?c ?t) (laden ?t)))", "(in ?c ?t) (laden ?t) (increase (total-cost) 1)))"), "domain.pddl");
    const { code, j } = await rejudge(["--domain", d]);
    const ref = reference(d, H("problem-02.pddl"));
    expect(code).toBe(1);
    expect(j).toMatchObject({ verdict: "cost-changed", planValid: true, newCost: 24 }); // two loads
    // source: the reference Dijkstra on the edited model
    if (ref === 24) expect(j.optimal).toBe(true);
    else expect(j).toMatchObject({ optimal: false, cheaperPlan: { cost: ref } });
  }, 60_000);

  it("a road added: a cheaper plan (exit 1), proven optimal, as cheap as the reference says, valid on the new model", async () => {
    const p = file(edit(problemText, "(crane-at crane1 quay1)", "(road yard1 quay1) (= (road-length yard1 quay1) 1)\n    (road quay1 yard1) (= (road-length quay1 yard1) 1)\n    (crane-at crane1 quay1)"));
    const out = path.join(work, "cheaper");
    const { code, j } = await rejudge(["--problem", p, "--certificate", out]);
    const ref = reference(H("domain.pddl"), p);
    expect(ref).toBeLessThan(22);
    expect(code).toBe(1);
    expect(j).toMatchObject({ verdict: "cheaper-plan", planValid: true, newCost: 22, optimal: false, cheaperPlan: { cost: ref, proven: true }, certificate: out });
    expect(j.change.kind).toBe("actions-added");
    const replay = replayPlan(loadModel(H("domain.pddl"), p), parsePlan(j.cheaperPlan.plan.join("\n"), "cheaper"));
    expect(replay).toMatchObject({ valid: true, cost: ref });
    expect(auditCertificate(out)).toMatchObject({ valid: true, cost: ref });
  }, 60_000);

  it("a road the plan uses closed: plan no longer valid (exit 1), the failing step and the unmet precondition", async () => {
    const p = file(edit(problemText, "(road yard2 quay1) (= (road-length yard2 quay1) 2)", ""));
    const out = path.join(work, "never");
    const { code, j } = await rejudge(["--problem", p, "--certificate", out]);
    expect(code).toBe(1);
    expect(j).toMatchObject({
      verdict: "plan-invalid",
      planValid: false,
      failure: { step: 3, action: "(drive t1 yard2 quay1)", kind: "precondition", condition: "(road yard2 quay1)" },
      newCost: null,
      optimal: null,
      cheaperPlan: null,
      certificate: null,
    });
    expect(j.change.kind).toBe("actions-removed");
    expect(fs.existsSync(out)).toBe(false);
  }, 60_000);

  it("an action removed from the domain (no more unloading): plan no longer valid at the first unload", async () => {
    const start = domainText.indexOf("  ; the site's crane lifts a container off a truck");
    const d = file(domainText.slice(0, start) + ")\n", "domain.pddl");
    const { code, j } = await rejudge(["--domain", d]);
    expect(code).toBe(1);
    expect(j).toMatchObject({ verdict: "plan-invalid", planValid: false, failure: { step: 4, action: "(unload crane1 c2 t1 quay1)", kind: "unknown-step" } });
    expect(j.failure.condition).toMatch(/unknown action 'unload'/);
  }, 60_000);

  it("a changed goal: plan no longer valid, the goal condition that fails after the last step", async () => {
    const p = file(edit(problemText, "(in c1 depot1)", "(in c1 yard1)"));
    const { code, j } = await rejudge(["--problem", p]);
    expect(code).toBe(1);
    expect(j).toMatchObject({ verdict: "plan-invalid", failure: { step: 9, action: null, kind: "goal", condition: "(in c1 yard1)" } });
    expect(j.change.goalChanged).toBe(true);
  }, 60_000);

  it("a limit before the proof: undecided, exit 3", async () => {
    const p = file(edit(problemText, "(= (road-length quay1 depot1) 22)", "(= (road-length quay1 depot1) 24)"));
    const r = await cli(["rejudge", cert, "--problem", p, "--time-limit", "0.001", "--json"]);
    expect(r.code).toBe(3);
    // the limit may strike while the files are read (a limit error) or once the plan replayed (a verdict)
    const j = r.json();
    if ("verdict" in j) expect(j).toMatchObject({ verdict: "undecided", planValid: true, newCost: 22, optimal: null, stopReason: "time" });
    else expect(j).toMatchObject({ code: "limit" });
  }, 60_000);

  it("bad input: exit 2 naming the file, line and column; a certificate without a plan is refused", async () => {
    const p = file(edit(problemText, "(:goal (and", "(:goal (and )) ("));
    const r = await cli(["rejudge", cert, "--problem", p]);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(new RegExp(`${p.replace(/[.*+?^${}()|[\]\\]/g, "\\$&")}:\\d+:\\d+`));
    expect((await cli(["rejudge", path.join(work, "nowhere")])).code).toBe(2);
    // the new certificate may not replace the one being judged (an input)
    const same = await cli(["rejudge", cert, "--certificate", cert]);
    expect(same.code).toBe(2);
    expect(same.stderr).toMatch(/--certificate/);
    const unsolvable = path.resolve(import.meta.dirname, "../certify/fixtures/legacy/one-shot-unsolvable");
    const u = await cli(["rejudge", unsolvable]);
    expect(u.code).toBe(2);
    expect(u.stderr).toMatch(/needs a certificate of an optimal plan/);
  }, 60_000);
});
