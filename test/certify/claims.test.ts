// Certificates of the other claims: optimal by a matching landmark lower bound, unsolvable by
// relaxed unreachability, unsolvable by SAT at the reachability threshold — written, audited, tampered.
import * as fs from "node:fs";
import { tmpdir } from "node:os";
import * as path from "node:path";
import { afterAll, describe, expect, it } from "vitest";
import { auditCertificate, sha256, writeCertificate } from "../../src/certify/index.js";
import type { Task } from "../../src/ground/task.js";
import { ground } from "../../src/ground/index.js";
import { disposeOutcome, optimize, OPTIMIZE_GROUNDING } from "../../src/optimize/index.js";
import { modelFromTexts } from "../../src/pddl/index.js";
import { optimalCost } from "../support/reference.js";
import { taskToPddl } from "../optimize/support/task-pddl.js";

const work = fs.mkdtempSync(path.join(tmpdir(), "plumbline-claims-"));
afterAll(() => fs.rmSync(work, { recursive: true, force: true }));
let n = 0;

const act = (i: number, pre: number[], add: number[], del: number[], cost: number) => ({ name: `(act${i})`, schema: `act${i}`, args: [], pre, preNeg: [], add, del, cond: [], cost });
const task = (facts: number, init: number[], goal: number[], actions: Task["actions"]): Task => ({
  domainName: "t",
  problemName: "t",
  facts: Array.from({ length: facts }, (_, i) => `(f${i})`),
  init,
  goal,
  goalNeg: [],
  actions,
  costModel: "action-costs",
});

async function certify(t: Task) {
  const { domain, problem } = taskToPddl(t);
  const model = modelFromTexts(domain, "domain.pddl", problem, "problem.pddl");
  const g = ground(model, OPTIMIZE_GROUNDING);
  const out = await optimize(model, g, OPTIMIZE_GROUNDING);
  const dir = path.join(work, `c${++n}`);
  if (out.certificate) await writeCertificate(dir, out.certificate);
  disposeOutcome(out);
  return { out, dir, reference: optimalCost(ground(model)) };
}

function edit(dir: string, f: (dir: string, json: any) => void): string[] {
  const copy = `${dir}-edit-${++n}`;
  fs.cpSync(dir, copy, { recursive: true });
  const file = path.join(copy, "certificate.json");
  const json = JSON.parse(fs.readFileSync(file, "utf8"));
  f(copy, json);
  fs.writeFileSync(file, JSON.stringify(json));
  return auditCertificate(copy).checks.filter((c) => !c.ok && !c.skipped).map((c) => c.name);
}

describe("lower-bound certificates", () => {
  it("a plan meeting the landmark-cut bound is optimal without SAT; the record is re-checked", async () => {
    // two independent goals, each reachable only by one action: every plan pays 3 + 4
    const { out, dir, reference } = await certify(task(3, [0], [1, 2], [act(0, [0], [1], [], 3), act(1, [0], [2], [], 4)]));
    expect(out.status).toBe("optimal");
    expect(out.how).toBe("lower-bound");
    expect(out.satCalls).toBe(0);
    // source: arithmetic (3 + 4), and the reference Dijkstra
    expect(out.cost).toBe(7);
    expect(reference?.cost).toBe(7);
    const a = auditCertificate(dir);
    expect(a.valid).toBe(true);
    expect(a.checks.map((c) => c.name)).toEqual(["format", "input-hashes", "ground", "plan-hash", "plan-replay", "plan-cost", "landmarks-hash", "landmark-check", "lower-bound-equals-cost", "second-derivation", "informational"]);
    expect(edit(dir, (d) => fs.appendFileSync(path.join(d, "landmarks.json"), " "))).toContain("landmarks-hash");
    // a landmark that is not one (its action is not needed), with the hash updated
    expect(
      edit(dir, (d, j) => {
        const rec = JSON.parse(fs.readFileSync(path.join(d, "landmarks.json"), "utf8"));
        rec.landmarks.push({ actions: [rec.landmarks[0].actions[0]], cost: 1 });
        rec.bound += 1;
        const text = JSON.stringify(rec);
        fs.writeFileSync(path.join(d, "landmarks.json"), text);
        j.lowerBound.sha256 = sha256(text);
      }),
    ).toEqual(expect.arrayContaining(["landmark-check"]));
    expect(edit(dir, (_d, j) => (j.lowerBound.bound -= 1))).toContain("lower-bound-equals-cost");
  });
});

describe("unsolvability certificates", () => {
  it("relaxed-unreachable: no action adds a goal fact", async () => {
    const { out, dir, reference } = await certify(task(3, [0], [2], [act(0, [0], [1], [], 1)]));
    expect(reference).toBeNull();
    expect(out.status).toBe("unsolvable");
    expect(out.how).toBe("relaxed-unreachable");
    const a = auditCertificate(dir);
    expect(a.valid).toBe(true);
    expect(a.checks.map((c) => c.name)).toContain("relaxed-unreachable");
    // claiming it for a different, solvable problem fails the re-check
    expect(
      edit(dir, (d, j) => {
        const p = fs.readFileSync(path.join(d, "problem.pddl"), "utf8").replace("(:goal (and (f2)))", "(:goal (and (f1)))");
        fs.writeFileSync(path.join(d, "problem.pddl"), p);
        j.inputs.problem.sha256 = sha256(p);
      }),
    ).toEqual(["relaxed-unreachable", "second-derivation", "informational"]); // the plain search finds a plan; the recorded grounding counts no longer match either
  });

  it("horizon-unsat: relaxed-reachable but unreachable (a one-shot resource), proven by SAT at the reachability threshold", async () => {
    // f0 is consumed by either action; the goal needs both of their products
    const { out, dir, reference } = await certify(task(3, [0], [1, 2], [act(0, [0], [1], [0], 1), act(1, [0], [2], [0], 0)]));
    expect(reference).toBeNull();
    expect(out.status).toBe("unsolvable");
    expect(out.how).toBe("horizon-unsat");
    const a = auditCertificate(dir);
    expect(a.checks.filter((c) => !c.ok)).toEqual([]);
    expect(a.valid).toBe(true);
    expect(edit(dir, (_d, j) => (j.horizon.upperCost = 5))).toContain("horizon-upper-cost");
    expect(edit(dir, (_d, j) => (j.encoding.bound = 0))).toContain("encoding");
  });
});
