// The suffix route end to end: with the explicit-state horizon methods kept out, optimize()
// proves optima with relaxed-suffix formulas far below the threshold; every claim equals the
// reference Dijkstra's optimum and its certificate audits; tampering with one is rejected.
import * as fs from "node:fs";
import { tmpdir } from "node:os";
import * as path from "node:path";
import fc from "fast-check";
import { afterAll, describe, expect, it } from "vitest";
import { generateProblem, scenarios } from "../../benchmarks/domains/index.js";
import { auditCertificate, writeCertificate } from "../../src/certify/index.js";
import { ground } from "../../src/ground/index.js";
import { disposeOutcome, nextSuffixHorizon, optimize, OPTIMIZE_GROUNDING, planningPipeline, type OptimizeOptions, type OptimizeOutcome } from "../../src/optimize/index.js";
import { relaxedReachableWithout } from "../../src/search/index.js";
import { modelFromTexts } from "../../src/pddl/index.js";
import { factoredSpecArb, taskFromSpec } from "../support/random-task.js";
import { optimalCost } from "../support/reference.js";
import { taskToPddl } from "./support/task-pddl.js";

const root = path.resolve(import.meta.dirname, "../..");
const work = fs.mkdtempSync(path.join(tmpdir(), "plumbline-suffix-test-"));
afterAll(() => fs.rmSync(work, { recursive: true, force: true }));
let certs = 0;

/** No explicit-state horizon method: thresholds come from the general bounds only. */
const GENERAL_ONLY: OptimizeOptions = { horizonLimits: { maxOptimalStates: 0, maxExplicitStates: 1 } };

async function solveText(domain: string, problem: string, opts: OptimizeOptions): Promise<{ out: OptimizeOutcome; reference: number | null }> {
  const model = modelFromTexts(domain, "domain.pddl", problem, "problem.pddl");
  const out = await optimize(model, ground(model, OPTIMIZE_GROUNDING), OPTIMIZE_GROUNDING, opts);
  const ref = optimalCost(ground(model)); // source: exhaustive search (test/support/reference.ts)
  return { out, reference: ref ? ref.cost : null };
}

async function certify(out: OptimizeOutcome): Promise<string> {
  const dir = path.join(work, `cert-${++certs}`);
  await writeCertificate(dir, out.certificate!);
  disposeOutcome(out);
  return dir;
}

function failed(dir: string): string[] {
  return auditCertificate(dir)
    .checks.filter((c) => !c.ok)
    .map((c) => c.name);
}

describe("the suffix route", () => {
  it("grows the horizon by one up to 10, then by about a fifth", () => {
    const hs = [1];
    while (hs.length < 14) hs.push(nextSuffixHorizon(hs[hs.length - 1]));
    expect(hs).toEqual([1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 12, 15, 18, 22]);
  });

  it("random tiny scenario instances: the reference optimum, proven with a relaxed suffix below the general threshold, audited", async () => {
    const how: Record<string, number> = {};
    let below = 0;
    await fc.assert(
      fc.asyncProperty(fc.constantFrom(...scenarios), fc.integer({ min: 1, max: 500 }), fc.constantFrom("forall-1", "seq-1", "forall-2"), async (sc, seed, encoding) => {
        const domain = fs.readFileSync(path.join(root, "benchmarks/domains", sc.name, "domain.pddl"), "utf8");
        const { out, reference } = await solveText(domain, generateProblem(sc, "tiny", seed), { ...GENERAL_ONLY, encoding });
        expect(out.cost).toBe(reference);
        expect(out.status).toBe(reference === null ? "unsolvable" : "optimal");
        how[String(out.how)] = (how[String(out.how)] ?? 0) + 1;
        if (out.how === "suffix-unsat") {
          expect(out.encoding).toContain("relaxed-suffix-1");
          if (typeof out.thresholdAvoided === "number" && (out.horizon as number) < out.thresholdAvoided) below++;
        }
        if (out.certificate) {
          const dir = await certify(out);
          expect(failed(dir)).toEqual([]);
        } else disposeOutcome(out);
      }),
      { numRuns: 25, seed: 20261204 },
    );
    expect(how["suffix-unsat"] ?? 0, JSON.stringify(how)).toBeGreaterThan(5);
    expect(below).toBeGreaterThan(0);
  }, 300_000);

  it("random small tasks with zero-cost actions: never a claim below or above the reference optimum", async () => {
    await fc.assert(
      fc.asyncProperty(factoredSpecArb({ maxVars: 4, maxActions: 7, maxCost: 3, zeroCostShare: 0.5 }), fc.constantFrom("forall-1", "seq-1"), async (spec, encoding) => {
        const { domain, problem } = taskToPddl(taskFromSpec(spec));
        const { out, reference } = await solveText(domain, problem, { ...GENERAL_ONLY, encoding });
        expect(out.cost).toBe(reference);
        if (out.lowerBound !== Infinity && reference !== null) expect(out.lowerBound).toBeLessThanOrEqual(reference);
        if (out.certificate) expect(failed(await certify(out))).toEqual([]);
        else disposeOutcome(out);
      }),
      { numRuns: 40, seed: 11 },
    );
  }, 300_000);

  it("the audit rejects a suffix-unsat certificate whose steps, pairs, part list or bound were changed", async () => {
    // the first tiny warehouse instance (by seed) that the suffix route proves
    const sc = scenarios.find((x) => x.name === "warehouse")!;
    const domain = fs.readFileSync(path.join(root, "benchmarks/domains/warehouse/domain.pddl"), "utf8");
    let out: OptimizeOutcome | null = null;
    for (let seed = 1; seed <= 40 && out === null; seed++) {
      const r = await solveText(domain, generateProblem(sc, "tiny", seed), GENERAL_ONLY);
      if (r.out.how === "suffix-unsat" && (r.out.horizon as number) >= 2) out = r.out;
      else disposeOutcome(r.out);
    }
    expect(out).not.toBeNull();
    const dir = await certify(out!);
    expect(failed(dir)).toEqual([]);
    const edit = (f: (j: Record<string, any>) => void): string[] => {
      const copy = path.join(work, `tamper-${++certs}`);
      fs.cpSync(dir, copy, { recursive: true });
      const file = path.join(copy, "certificate.json");
      const j = JSON.parse(fs.readFileSync(file, "utf8"));
      f(j);
      fs.writeFileSync(file, JSON.stringify(j));
      return failed(copy);
    };
    expect(edit((j) => (j.encoding.params.steps += 1))).toContain("cnf-hash");
    expect(edit((j) => (j.encoding.params.steps = 10 ** 9))).toContain("suffix-terms");
    // one more state pair (any pair is sound, but the CNF is no longer the proof's)
    expect(edit((j) => j.encoding.partParams["relaxed-suffix-1"].pairs.push([0, j.encoding.params.steps]))).toContain("cnf-hash");
    expect(edit((j) => (j.encoding.partParams["relaxed-suffix-1"].pairs = [[1, 1]]))).toContain("cnf-hash");
    expect(edit((j) => (j.encoding.parts = j.encoding.parts.filter((p: string) => p !== "relaxed-suffix-1")))).toContain("suffix-terms");
    expect(edit((j) => (j.encoding.bound -= 1))).toContain("encoding");
    expect(edit((j) => (j.plan.cost -= 1))).toContain("plan-cost");
    expect(edit((j) => (j.formatVersion = 1))).toContain("format");
  }, 120_000);

  it.skipIf(!process.env.PLUMBLINE_SLOW)("harbour/problem-02 without explicit-state horizons: 22, proven with a relaxed suffix far below the general threshold, audited (slow)", async () => {
    const domain = fs.readFileSync(path.join(root, "benchmarks/domains/harbour/domain.pddl"), "utf8");
    const problem = fs.readFileSync(path.join(root, "benchmarks/domains/harbour/problem-02.pddl"), "utf8");
    const { out, reference } = await solveText(domain, problem, GENERAL_ONLY);
    // source: benchmarks/domains/harbour/instances.json (optimal cost 22) and the reference Dijkstra
    expect(reference).toBe(22);
    expect(out.cost).toBe(22);
    expect(out.how).toBe("suffix-unsat");
    expect(out.horizon as number).toBeLessThan(out.thresholdAvoided as number);
    expect(failed(await certify(out))).toEqual([]);
  }, 600_000);
});

describe("the exhaustive route (state-space)", () => {
  it("when no SAT formula fits, a known optimum re-derived by the audit's plain search is claimed as state-space and audits; never a dearer plan", async () => {
    const { stateSpaceChecker } = await import("../../src/certify/index.js");
    let claims = 0;
    await fc.assert(
      fc.asyncProperty(fc.constantFrom(...scenarios), fc.integer({ min: 1, max: 500 }), async (sc, seed) => {
        const domain = fs.readFileSync(path.join(root, "benchmarks/domains", sc.name, "domain.pddl"), "utf8");
        const { out, reference } = await solveText(domain, generateProblem(sc, "tiny", seed), { maxClauses: 1, stateSpaceCheck: stateSpaceChecker, searchHelper: false });
        expect(out.cost).toBe(reference); // the exact explicit search's plan replaces a dearer first plan
        if (reference !== null) expect(out.status).toBe("optimal");
        if (out.how === "state-space") {
          claims++;
          expect(out.provedBy).toMatch(/exhaustive search/);
          const dir = await certify(out);
          expect(failed(dir)).toEqual([]);
          // a dearer claimed cost (plan and hash left alone) is rejected
          const file = path.join(dir, "certificate.json");
          const j = JSON.parse(fs.readFileSync(file, "utf8"));
          j.plan.cost += 1;
          fs.writeFileSync(file, JSON.stringify(j));
          expect(failed(dir)).toEqual(expect.arrayContaining(["plan-cost", "state-space"]));
        } else disposeOutcome(out);
      }),
      { numRuns: 15, seed: 5 },
    );
    expect(claims).toBeGreaterThan(3);
  }, 300_000);
});

describe("landmark clauses in proofs (landmarks-1)", () => {
  it("a proof with landmark clauses audits; a certificate whose landmark list was altered is rejected", async () => {
    const sc = scenarios.find((x) => x.name === "harbour")!;
    const domain = fs.readFileSync(path.join(root, "benchmarks/domains/harbour/domain.pddl"), "utf8");
    let out: OptimizeOutcome | null = null;
    for (let seed = 1; seed <= 40 && out === null; seed++) {
      const r = await solveText(domain, generateProblem(sc, "tiny", seed), { ...GENERAL_ONLY, encoding: "forall-1+reach-1+landmarks-1+empty-steps-last-1", searchHelper: false });
      const lms = r.out.certificate?.formula?.spec.partParams?.["landmarks-1"]?.landmarks ?? [];
      if ((r.out.how === "suffix-unsat" || r.out.how === "horizon-unsat") && lms.length > 0) out = r.out;
      else disposeOutcome(r.out);
    }
    expect(out).not.toBeNull();
    const dir = await certify(out!);
    expect(failed(dir)).toEqual([]);
    const copy = path.join(work, `landmarks-${++certs}`);
    fs.cpSync(dir, copy, { recursive: true });
    const file = path.join(copy, "certificate.json");
    const j = JSON.parse(fs.readFileSync(file, "utf8"));
    // a "landmark" of one action some relaxed plan does without
    const model = modelFromTexts(fs.readFileSync(path.join(dir, "domain.pddl"), "utf8"), "d", fs.readFileSync(path.join(dir, "problem.pddl"), "utf8"), "p");
    const prepared = planningPipeline(ground(model, OPTIMIZE_GROUNDING)).prepared.task;
    const spare = prepared.actions.findIndex((_, a) => relaxedReachableWithout(prepared, new Set([a])));
    expect(spare).toBeGreaterThanOrEqual(0);
    const lms: number[][] = j.encoding.partParams["landmarks-1"].landmarks;
    j.encoding.partParams["landmarks-1"].landmarks = [...lms.slice(0, -1), [spare]];
    fs.writeFileSync(file, JSON.stringify(j));
    expect(failed(copy)).toEqual(expect.arrayContaining(["landmarks-part"]));
  }, 300_000);
});

describe("cost-bounded pruning in proofs (cost-prune-1)", () => {
  it("proofs with the part find the reference optimum and audit; a certificate that drops the part from its id is rejected", async () => {
    let proofs = 0;
    let tampered = false;
    await fc.assert(
      fc.asyncProperty(fc.constantFrom(...scenarios), fc.integer({ min: 1, max: 500 }), fc.constantFrom("cost-unary-1", "cost-adder-1"), async (sc, seed, cost) => {
        const domain = fs.readFileSync(path.join(root, "benchmarks/domains", sc.name, "domain.pddl"), "utf8");
        const encoding = `forall-1+${cost}+reach-1+cost-prune-1+empty-steps-last-1`;
        const { out, reference } = await solveText(domain, generateProblem(sc, "tiny", seed), { ...GENERAL_ONLY, encoding, searchHelper: false });
        expect(out.cost).toBe(reference); // source: exhaustive search (test/support/reference.ts)
        if (!out.certificate?.formula) return disposeOutcome(out);
        expect(out.encoding).toContain("cost-prune-1");
        proofs++;
        const dir = await certify(out);
        expect(failed(dir)).toEqual([]);
        if (tampered) return;
        const file = path.join(dir, "certificate.json");
        const j = JSON.parse(fs.readFileSync(file, "utf8"));
        j.encoding.parts = j.encoding.parts.filter((p: string) => p !== "cost-prune-1");
        j.encoding.id = j.encoding.id.replace("+cost-prune-1", "");
        fs.writeFileSync(file, JSON.stringify(j));
        // the part is a function of task, horizon and encoding: the rebuilt CNF differs
        expect(failed(dir)).toEqual(expect.arrayContaining(["cnf-hash"]));
        tampered = true;
      }),
      { numRuns: 40, seed: 20261205 },
    );
    expect(proofs).toBeGreaterThan(5);
    expect(tampered).toBe(true);
  }, 300_000);
});

describe("the recorded search route (landmark-search)", () => {
  it("when no SAT formula fits, the helper's A* optimum with its search record is claimed as landmark-search and audits (own core or taking turns)", async () => {
    let claims = 0;
    await fc.assert(
      fc.asyncProperty(fc.constantFrom(...scenarios), fc.integer({ min: 1, max: 500 }), fc.constantFrom(1, 2), async (sc, seed, threads) => {
        const domain = fs.readFileSync(path.join(root, "benchmarks/domains", sc.name, "domain.pddl"), "utf8");
        const lines: string[] = [];
        const { out, reference } = await solveText(domain, generateProblem(sc, "tiny", seed), { maxClauses: 1, timeLimit: 60, threads, onProgress: (l) => lines.push(l) });
        expect(out.cost).toBe(reference);
        expect(lines.some((l) => /A\* with landmark-cut started on a second thread, taking turns/.test(l))).toBe(threads === 1);
        if (out.how === "landmark-search") {
          claims++;
          const dir = await certify(out);
          expect(failed(dir)).toEqual([]);
          // the record edited: one state fewer (its hash updated) is rejected by the check itself
          const { gunzipSync, gzipSync } = await import("node:zlib");
          const { createHash } = await import("node:crypto");
          const file = path.join(dir, "search.json.gz");
          const entries = JSON.parse(gunzipSync(fs.readFileSync(file)).toString("utf8")) as unknown[];
          const bytes = gzipSync(JSON.stringify(entries.slice(0, -1)));
          fs.writeFileSync(file, bytes);
          const cj = path.join(dir, "certificate.json");
          const j = JSON.parse(fs.readFileSync(cj, "utf8"));
          j.search.sha256 = createHash("sha256").update(bytes).digest("hex");
          fs.writeFileSync(cj, JSON.stringify(j));
          expect(failed(dir)).toEqual(expect.arrayContaining(["search-check"]));
        } else disposeOutcome(out);
      }),
      { numRuns: 24, seed: 8 },
    );
    expect(claims).toBeGreaterThan(3);
  }, 300_000);
});
