// Bulk audit: discovery of certificate folders, verdicts of many audits run N at a time in child
// processes (valid, rejected, unreadable, unfinished, interrupted), and the exit code they add up to.
import * as fs from "node:fs";
import { tmpdir } from "node:os";
import * as path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { auditCertificate, auditVerdict, auditMany, bulkExitCode, discoverCertificates, entryOf, stoppedEarly, workEstimate, type AuditReport, type BulkEntry } from "../../src/certify/index.js";

const legacy = path.resolve(import.meta.dirname, "fixtures/legacy");
const work = fs.mkdtempSync(path.join(tmpdir(), "plumbline-bulk-"));
afterAll(() => fs.rmSync(work, { recursive: true, force: true }));

/** A tree: team-a/{harbour-01-forall-1, nested/harbour-01-seq-1}, team-b/{one-shot, tampered, broken}, team-b/.tmp-x (hidden), empty/. */
const tree = path.join(work, "tree");
beforeAll(() => {
  const copy = (name: string, to: string) => fs.cpSync(path.join(legacy, name), path.join(tree, to), { recursive: true });
  copy("harbour-01-forall-1", "team-a/harbour-01-forall-1");
  copy("harbour-01-seq-1", "team-a/nested/harbour-01-seq-1");
  copy("one-shot-unsolvable", "team-b/one-shot");
  copy("harbour-01-forall-2-plain", "team-b/tampered");
  const j = JSON.parse(fs.readFileSync(path.join(tree, "team-b/tampered/certificate.json"), "utf8"));
  j.plan.cost = 19;
  fs.writeFileSync(path.join(tree, "team-b/tampered/certificate.json"), JSON.stringify(j));
  fs.mkdirSync(path.join(tree, "team-b/broken"), { recursive: true });
  fs.writeFileSync(path.join(tree, "team-b/broken/certificate.json"), "{ not json");
  copy("harbour-01-seq-1", "team-b/.tmp-x"); // a hidden folder (e.g. an unfinished atomic write) is not searched
  fs.mkdirSync(path.join(tree, "empty"));
  fs.symlinkSync("..", path.join(tree, "team-a/nested/up")); // a link back up the tree must not loop
});

const rel = (dirs: readonly string[]) => dirs.map((d) => path.relative(tree, d));
const byDir = (es: readonly BulkEntry[]) => Object.fromEntries(es.map((e) => [path.relative(tree, e.dir), e]));

describe("discoverCertificates", () => {
  it("finds certificate folders recursively, in name order, each once; hidden folders and links back up are skipped", () => {
    const d = discoverCertificates([tree, path.join(tree, "team-a")]);
    expect(rel(d.dirs)).toEqual(["team-a/harbour-01-forall-1", "team-a/nested/harbour-01-seq-1", "team-b/broken", "team-b/one-shot", "team-b/tampered"]);
    expect(d.problems).toEqual([]);
  });

  it("a certificate folder given directly is itself; missing paths, files and folders without certificates are problems", () => {
    const file = path.join(tree, "team-b/one-shot/certificate.json");
    const d = discoverCertificates([path.join(tree, "team-b/one-shot"), path.join(tree, "nowhere"), file, path.join(tree, "empty")]);
    expect(rel(d.dirs)).toEqual(["team-b/one-shot"]);
    expect(d.problems.map((p) => [path.relative(tree, p.path), p.reason])).toEqual([
      ["nowhere", "no such file or folder"],
      ["team-b/one-shot/certificate.json", expect.stringContaining("not a folder")],
      ["empty", expect.stringContaining("no certificate")],
    ]);
  });
});

describe("auditMany", () => {
  it("gives each certificate its verdict, the same with 2 jobs as with 1 and as the single audit", async () => {
    const two = await auditMany([tree], { jobs: 2 });
    const one = await auditMany([tree], { jobs: 1 });
    const strip = (es: BulkEntry[]) => es.map((e) => ({ ...e, seconds: 0, checks: e.checks.map((c) => c.name) }));
    expect(strip(two)).toEqual(strip(one));
    const v = byDir(two);
    expect(Object.fromEntries(Object.entries(v).map(([k, e]) => [k, e.verdict]))).toEqual({
      "team-a/harbour-01-forall-1": "valid",
      "team-a/nested/harbour-01-seq-1": "valid",
      "team-b/broken": "unreadable",
      "team-b/one-shot": "valid",
      "team-b/tampered": "rejected",
    });
    expect(v["team-b/tampered"].failed).toContain("plan-cost");
    expect(v["team-b/broken"].reason).toMatch(/not valid JSON/);
    expect(v["team-a/harbour-01-forall-1"]).toMatchObject({ claim: { status: "optimal", how: "horizon-unsat" }, cost: 20 });
    // the child's report is the in-process audit's
    const here = auditCertificate(path.join(tree, "team-b/tampered"));
    expect(v["team-b/tampered"].checks).toEqual(here.checks);
    // rejected outranks unreadable in the exit code
    expect(bulkExitCode(two)).toBe(1);
  }, 60_000);

  it("starts the largest audits first (by proof and CNF size); results stay in discovery order", async () => {
    const dirs = discoverCertificates([tree]).dirs.filter((d) => !d.endsWith("broken"));
    const est = Object.fromEntries(dirs.map((d) => [path.relative(tree, d), workEstimate(d)]));
    expect(est["team-b/one-shot"]).toBeLessThan(est["team-a/harbour-01-forall-1"]);
    expect(workEstimate(path.join(tree, "team-b/broken"))).toBe(0);
    const seen: string[] = [];
    const es = await auditMany(dirs, { jobs: 1, onEntry: (e) => seen.push(path.relative(tree, e.dir)) });
    expect(seen).toEqual([...seen].sort((a, b) => est[b] - est[a]));
    expect(es.map((e) => e.dir)).toEqual(dirs);
  }, 60_000);

  it("calls onEntry once per certificate with a running count", async () => {
    const seen: Array<[number, number]> = [];
    await auditMany([path.join(tree, "team-a"), path.join(tree, "empty")], { jobs: 2, onEntry: (_e, done, total) => seen.push([done, total]) });
    expect(seen).toEqual([
      [1, 3],
      [2, 3],
      [3, 3],
    ]);
  }, 30_000);

  it("a certificate past its time limit is stopped and counted unfinished (exit 3), the others go on", async () => {
    // grace 0: the child is killed the moment the (tiny) limit passes, long before its audit ends
    const es = await auditMany([path.join(tree, "team-a")], { jobs: 2, timeLimit: 0.001, graceSeconds: 0 });
    expect(es.map((e) => e.verdict)).toEqual(["unfinished", "unfinished"]);
    expect(es[0].reason).toMatch(/not finished within the time limit of 0.001 s/);
    expect(bulkExitCode(es)).toBe(3);
  }, 30_000);

  it("an abort stops every audit: all unfinished", async () => {
    const ac = new AbortController();
    const p = auditMany([tree], { jobs: 2, signal: ac.signal });
    setTimeout(() => ac.abort(), 50);
    const es = await p;
    const unfinished = es.filter((e) => e.verdict === "unfinished");
    expect(unfinished.length).toBeGreaterThan(0);
    for (const e of unfinished) expect(e.reason).toMatch(/interrupted/);
  }, 30_000);

  it("one certificate is audited in this process", async () => {
    const [e] = await auditMany([path.join(tree, "team-b/one-shot")]);
    expect(e).toMatchObject({ verdict: "valid", claim: { status: "unsolvable" } });
  });
});

describe("verdicts and exit codes", () => {
  const report = (checks: AuditReport["checks"]): AuditReport => ({ ...auditVerdict(checks), dir: "d", claim: null, cost: null, checks, seconds: 1 });
  it("a check cut short by the limit is unfinished, unless another check failed", () => {
    const stopped = { name: "proof-check", ok: false, detail: "not finished: a limit stopped the proof check before it ended", stopped: true };
    expect(stoppedEarly(report([{ name: "format", ok: true, detail: "" }, stopped]))).toBe(true);
    expect(entryOf(report([stopped])).verdict).toBe("unfinished");
    expect(entryOf(report([{ name: "plan-cost", ok: false, detail: "x" }, stopped])).verdict).toBe("rejected");
    expect(entryOf(report([{ name: "proof-check", ok: false, detail: "lemma 3 fails" }])).verdict).toBe("rejected");
  });

  it("precedence: error 4, rejected 1, unreadable 2, unfinished 3, all valid 0, nothing at all 2", () => {
    const e = (verdict: BulkEntry["verdict"]): BulkEntry => ({ dir: "d", verdict, claim: null, cost: null, seconds: 0, checks: [], failed: [], reason: null });
    expect(bulkExitCode([e("valid"), e("unfinished"), e("unreadable"), e("rejected"), e("error")])).toBe(4);
    expect(bulkExitCode([e("valid"), e("unfinished"), e("unreadable"), e("rejected")])).toBe(1);
    expect(bulkExitCode([e("valid"), e("unfinished"), e("unreadable")])).toBe(2);
    expect(bulkExitCode([e("valid"), e("unfinished")])).toBe(3);
    expect(bulkExitCode([e("valid")])).toBe(0);
    expect(bulkExitCode([])).toBe(2);
  });
});
