// `plumbline audit PATH...` on a folder of certificates: the summary table, the --json array, the
// exit codes, and the --junit file — parsed by a general-purpose XML library and checked against
// the element structure of the published JUnit XML schema.
import * as fs from "node:fs";
import { tmpdir } from "node:os";
import * as path from "node:path";
import { DOMParser, onWarningStopParsing, type Element } from "@xmldom/xmldom";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { cli } from "../support/cli.js";

const legacy = path.resolve(import.meta.dirname, "../certify/fixtures/legacy");
const work = fs.mkdtempSync(path.join(tmpdir(), "plumbline-audit-bulk-"));
afterAll(() => fs.rmSync(work, { recursive: true, force: true }));
const certs = path.join(work, "certs");

beforeAll(() => {
  for (const name of fs.readdirSync(legacy)) fs.cpSync(path.join(legacy, name), path.join(certs, "good", name), { recursive: true });
  // two rejected copies: a changed cost (plan-cost), and a changed cost plus a changed recorded horizon
  fs.cpSync(path.join(legacy, "harbour-01-seq-1"), path.join(certs, "bad", "cost<19>&"), { recursive: true });
  fs.cpSync(path.join(legacy, "harbour-01-forall-1"), path.join(certs, "bad", "two-checks"), { recursive: true });
  const edit = (dir: string, f: (j: any) => void) => {
    const file = path.join(certs, "bad", dir, "certificate.json");
    const j = JSON.parse(fs.readFileSync(file, "utf8"));
    f(j);
    fs.writeFileSync(file, JSON.stringify(j));
  };
  edit("cost<19>&", (j) => (j.plan.cost = 19));
  edit("two-checks", (j) => {
    j.plan.cost = 19;
    j.horizon.horizon = 1;
  });
});

/** Parses strictly: any warning or error of the XML parser fails the test. */
function parseXml(text: string): Element {
  // @xmldom/xmldom (npm registry): a general-purpose W3C DOM parser
  const doc = new DOMParser({ onError: onWarningStopParsing }).parseFromString(text, "text/xml");
  return doc.documentElement!;
}

const children = (e: Element): Element[] => Array.from(e.childNodes).filter((n): n is Element => n.nodeType === 1);

/**
 * The JUnit XML shape: testsuites > testsuite > (properties?, testcase*, system-out?, system-err?),
 * testcase > at most one of failure | error, with the attributes the schemas require.
 */
function checkJunitShape(root: Element): void {
  // source: the JUnit XML schema junit-4.xsd of the Jenkins JUnit model (elements testsuites,
  // testsuite, testcase, failure, error; testsuite requires name and tests, testcase name) and the
  // Apache Ant JUnit schema (testsuite also needs failures, errors, time, timestamp without a time
  // zone, hostname, and package and id inside testsuites; testcase name, classname, time; a
  // testcase holds at most one error or failure) — from memory of both schemas
  expect(root.tagName).toBe("testsuites");
  const suites = children(root);
  expect(suites.length).toBeGreaterThan(0);
  for (const s of suites) {
    expect(s.tagName).toBe("testsuite");
    for (const a of ["name", "tests", "failures", "errors", "time", "timestamp", "hostname", "package", "id"]) expect(s.hasAttribute(a), `testsuite@${a}`).toBe(true);
    expect(s.getAttribute("timestamp")).toMatch(/^\d{4}-\d\d-\d\dT\d\d:\d\d:\d\d$/);
    const order = ["properties", "testcase", "system-out", "system-err"];
    const tags = children(s).map((c) => c.tagName);
    for (const t of tags) expect(order).toContain(t);
    expect([...tags].sort((a, b) => order.indexOf(a) - order.indexOf(b))).toEqual(tags); // schema sequence order
    for (const p of children(s).filter((c) => c.tagName === "properties")) for (const q of children(p)) expect([q.tagName, q.hasAttribute("name"), q.hasAttribute("value")]).toEqual(["property", true, true]);
    const cases = children(s).filter((c) => c.tagName === "testcase");
    expect(Number(s.getAttribute("tests"))).toBe(cases.length);
    let failures = 0;
    let errors = 0;
    for (const c of cases) {
      for (const a of ["name", "classname", "time"]) expect(c.hasAttribute(a), `testcase@${a}`).toBe(true);
      expect(Number.isFinite(Number(c.getAttribute("time")))).toBe(true);
      const inner = children(c);
      expect(inner.length).toBeLessThanOrEqual(1);
      for (const i of inner) {
        expect(["failure", "error"]).toContain(i.tagName);
        if (i.tagName === "failure") failures++;
        else errors++;
      }
    }
    expect(Number(s.getAttribute("failures"))).toBe(failures);
    expect(Number(s.getAttribute("errors"))).toBe(errors);
  }
}

describe("plumbline audit on a folder of certificates", () => {
  it("--jobs 2 --junit --json: an array, a table, exit 1 for the rejected ones, and a JUnit file naming every failed check", async () => {
    const junit = path.join(work, "audit.xml");
    const r = await cli(["audit", certs, "--jobs", "2", "--junit", junit, "--json"]);
    expect(r.code).toBe(1);
    const arr = r.json<any[]>();
    expect(Array.isArray(arr)).toBe(true);
    expect(arr.map((e) => [path.relative(certs, e.dir), e.verdict])).toEqual([
      ["bad/cost<19>&", "rejected"],
      ["bad/two-checks", "rejected"],
      ["good/harbour-01-forall-1", "valid"],
      ["good/harbour-01-forall-2-plain", "valid"],
      ["good/harbour-01-seq-1", "valid"],
      ["good/one-shot-unsolvable", "valid"],
    ]);
    for (const e of arr) for (const k of ["dir", "verdict", "valid", "claim", "cost", "seconds", "failed", "reason", "checks"]) expect(e).toHaveProperty(k);
    const twoChecks = arr[1].failed as string[];
    expect(twoChecks).toEqual(expect.arrayContaining(["plan-cost", "horizon-derivation"]));

    const root = parseXml(fs.readFileSync(junit, "utf8"));
    checkJunitShape(root);
    const cases = children(children(root)[0]).filter((c) => c.tagName === "testcase");
    expect(cases.map((c) => path.relative(certs, c.getAttribute("name")!))).toEqual(arr.map((e) => path.relative(certs, e.dir)));
    const failure = (i: number) => children(cases[i]).find((c) => c.tagName === "failure")!;
    // every failed check is named, in the message and in the text
    for (const name of twoChecks) {
      expect(failure(1).getAttribute("message")).toContain(name);
      expect(failure(1).textContent).toContain(`${name}: `);
    }
    expect(arr[0].failed).toContain("plan-cost");
    expect(failure(0).getAttribute("message")).toBe(`rejected: ${arr[0].failed.join(", ")}`);
    expect(children(cases[2])).toEqual([]);
  }, 60_000);

  it("human output: the overall verdict first, then the table with folder, claim, cost, verdict and seconds", async () => {
    const r = await cli(["audit", path.join(certs, "good"), "--jobs", "2"]);
    expect(r.code).toBe(0);
    expect(r.stdout).toMatch(/^valid — all 4 certificates/);
    expect(r.stdout).toMatch(/folder\s+claim\s+cost\s+verdict\s+seconds/);
    expect(r.stdout).toMatch(/harbour-01-seq-1\s+optimal \(horizon-unsat\)\s+20\s+valid\s+\d+\.\d\d/);
    expect(r.stdout).toMatch(/plans are only as good as the model/);
  }, 60_000);

  it("exit 2 for a path with no certificate (the others are still audited; an <error> in the JUnit file)", async () => {
    const junit = path.join(work, "unreadable.xml");
    const r = await cli(["audit", path.join(certs, "good", "one-shot-unsolvable"), path.join(work, "nowhere"), "--junit", junit, "--json"]);
    expect(r.code).toBe(2);
    expect(r.json<any[]>().map((e) => e.verdict)).toEqual(["unreadable", "valid"]);
    const root = parseXml(fs.readFileSync(junit, "utf8"));
    checkJunitShape(root);
    expect(children(children(root)[0]).flatMap((c) => children(c)).filter((c) => c.tagName === "error").map((c) => c.getAttribute("type"))).toEqual(["unreadable"]);
    // a usage mistake writes nothing
    const bad = await cli(["audit", certs, "--jobs", "0", "--junit", path.join(work, "never.xml")]);
    expect(bad.code).toBe(2);
    expect(fs.existsSync(path.join(work, "never.xml"))).toBe(false);
    // the JUnit file may not go into a certificate folder given as a path, but may go into a searched folder
    const into = await cli(["audit", path.join(certs, "good", "one-shot-unsolvable"), "--junit", path.join(certs, "good", "one-shot-unsolvable", "a.xml")]);
    expect(into.code).toBe(2);
    expect(into.stderr).toMatch(/--junit/);
    expect((await cli(["audit", path.join(certs, "good"), "--junit", path.join(certs, "good", "audit.xml")])).code).toBe(0);
  }, 60_000);
});
