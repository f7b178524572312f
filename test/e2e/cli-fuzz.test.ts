// Mutation fuzzing of every input kind through the CLI: PDDL, plan files, DIMACS, DRAT and LRAT
// proofs, certificate folders. The only allowed outcomes are a documented exit code (0, 1, 2, 3)
// with a message — never 4 (a crash), never a stack trace, never a change to an input, never a hang
// (every command runs under a time limit; the test has a timeout). A few hundred cases here,
// 20,000 with PLUMBLINE_SLOW=1.
import fc from "fast-check";
import * as fs from "node:fs";
import { tmpdir } from "node:os";
import * as path from "node:path";
import { gunzipSync, gzipSync } from "node:zlib";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { fixture, fixturePath } from "../fixtures/frontend/problems.js";
import { cli } from "../support/cli.js";

const SLOW = process.env.PLUMBLINE_SLOW === "1";
const RUNS = SLOW ? 20_000 : 200;

let work: string;
const base: Record<string, Buffer> = {};
let certDir: string;

const TOKENS = ["(", ")", "0", "-0", "-1", "1", "2147483648", "99999999999", "p", "cnf", "c", "d", "a", "%", "\n", " ", "-", ";", "(drive", ":goal", "and", "not", "?x", "\u0000", "\u00ff", "é"];

type Mutation = { kind: "delete" | "duplicate" | "replace" | "insert" | "truncate" | "flip" | "swap"; at: number; len: number; token: string; bit: number };
const mutationArb: fc.Arbitrary<Mutation> = fc.record({
  kind: fc.constantFrom("delete", "duplicate", "replace", "insert", "truncate", "flip", "swap"),
  at: fc.nat(),
  len: fc.integer({ min: 1, max: 40 }),
  token: fc.constantFrom(...TOKENS),
  bit: fc.integer({ min: 0, max: 7 }),
});

/** Byte-level mutations (text files are bytes too: a token is inserted as its UTF-8 bytes). */
function mutate(buf: Buffer, ms: Mutation[]): Buffer {
  let b = Buffer.from(buf);
  for (const m of ms) {
    if (b.length === 0) b = Buffer.from(m.token);
    const i = m.at % b.length;
    const j = Math.min(b.length, i + m.len);
    const tok = Buffer.from(m.token);
    if (m.kind === "delete") b = Buffer.concat([b.subarray(0, i), b.subarray(j)]);
    else if (m.kind === "duplicate") b = Buffer.concat([b.subarray(0, j), b.subarray(i, j), b.subarray(j)]);
    else if (m.kind === "replace") b = Buffer.concat([b.subarray(0, i), tok, b.subarray(j)]);
    else if (m.kind === "insert") b = Buffer.concat([b.subarray(0, i), tok, b.subarray(i)]);
    else if (m.kind === "truncate") b = b.subarray(0, i);
    else if (m.kind === "flip") b[i] ^= 1 << m.bit;
    else {
      const k = (m.at * 7 + m.len) % b.length;
      [b[i], b[k]] = [b[k], b[i]];
    }
  }
  return b;
}

type Target = "domain" | "problem" | "plan" | "cnf" | "drat" | "drat-gz" | "lrat" | "cert-json" | "cert-plan" | "cert-proof" | "cert-problem";
const TARGETS: Target[] = ["domain", "problem", "plan", "cnf", "drat", "drat-gz", "lrat", "cert-json", "cert-plan", "cert-proof", "cert-problem"];

beforeAll(async () => {
  work = fs.mkdtempSync(path.join(tmpdir(), "plumbline-cli-fuzz-"));
  const D = path.join(work, "domain.pddl");
  const P = path.join(work, "problem.pddl");
  fs.copyFileSync(fixturePath("quay/domain.pddl"), D);
  fs.copyFileSync(fixturePath("quay/yard.pddl"), P);
  base.domain = fs.readFileSync(D);
  base.problem = fs.readFileSync(P);
  base.plan = Buffer.from(fixture("quay/yard.plan"));
  certDir = path.join(work, "cert");
  const s = await cli(["solve", D, P, "--certificate", certDir, "--json"]);
  expect(s.code).toBe(0);
  const cost = s.json().cost as number;
  // an unsatisfiable query (cheaper than the optimum) and its proofs
  const cnf = path.join(work, "f.cnf");
  expect((await cli(["encode", D, P, "--steps", "4", "--cost-below", String(cost), "-o", cnf])).code).toBe(0);
  base.cnf = fs.readFileSync(cnf);
  const drat = path.join(work, "f.drat");
  expect((await cli(["sat", cnf, "--proof", drat, "--proof-format", "drat-text"])).code).toBe(0);
  base.drat = fs.readFileSync(drat);
  base["drat-gz"] = gzipSync(base.drat);
  const lrat = path.join(work, "f.lrat");
  expect((await cli(["check-proof", cnf, drat, "--lrat-proof", lrat])).code).toBe(0);
  base.lrat = fs.readFileSync(lrat);
  for (const f of ["certificate.json", "plan.txt", "proof.drat.gz", "problem.pddl"]) base[`cert:${f}`] = fs.readFileSync(path.join(certDir, f));
  expect(gunzipSync(base["cert:proof.drat.gz"]).length).toBeGreaterThan(0);
}, 120_000);

afterAll(() => fs.rmSync(work, { recursive: true, force: true }));

let n = 0;

/** Writes the case's inputs (one of them mutated) to a fresh folder and returns the command line. */
function setUp(target: Target, ms: Mutation[], pick: number): { argv: string[]; inputs: string[] } {
  const dir = path.join(work, `case-${++n}`);
  fs.mkdirSync(dir);
  const put = (name: string, bytes: Buffer) => {
    const p = path.join(dir, name);
    fs.writeFileSync(p, bytes);
    return p;
  };
  const m = (key: string) => mutate(base[key], ms);
  const D = put("domain.pddl", target === "domain" ? m("domain") : base.domain);
  const P = put("problem.pddl", target === "problem" ? m("problem") : base.problem);
  const PLAN = put("plan.txt", target === "plan" ? m("plan") : base.plan);
  const CNF = put("f.cnf", target === "cnf" ? m("cnf") : base.cnf);
  const limit = ["--time-limit", "3"];
  switch (target) {
    case "domain":
    case "problem": {
      const cmds = [["ground", D, P], ["replay", D, P, PLAN], ["search", D, P, ...limit], ["horizon", D, P, ...limit], ["solve", D, P, ...limit], ["encode", D, P, "--steps", "3", "-o", path.join(dir, "out.cnf")]];
      return { argv: cmds[pick % cmds.length], inputs: [D, P, PLAN] };
    }
    case "plan":
      return { argv: pick % 5 === 0 ? ["compare", D, P, PLAN, ...limit] : ["replay", D, P, PLAN], inputs: [D, P, PLAN] };
    case "cnf": {
      const DR = put("f.drat", base.drat);
      return { argv: pick % 2 === 0 ? ["sat", CNF, ...limit] : ["check-proof", CNF, DR, ...limit], inputs: [CNF, DR] };
    }
    case "drat":
    case "drat-gz": {
      const DR = put(target === "drat" ? "f.drat" : "f.drat.gz", m(target));
      return { argv: ["check-proof", CNF, DR, ...limit, ...(pick % 3 === 0 ? ["--lemmas", "all"] : [])], inputs: [CNF, DR] };
    }
    case "lrat": {
      const LR = put("f.lrat", m("lrat"));
      return { argv: ["check-proof", CNF, LR, "--proof-format", "lrat"], inputs: [CNF, LR] };
    }
    default: {
      const cert = path.join(dir, "cert");
      fs.cpSync(certDir, cert, { recursive: true });
      const file = { "cert-json": "certificate.json", "cert-plan": "plan.txt", "cert-proof": "proof.drat.gz", "cert-problem": "problem.pddl" }[target];
      fs.writeFileSync(path.join(cert, file), m(`cert:${file}`));
      return { argv: ["audit", cert, "--time-limit-per-certificate", "5"], inputs: [path.join(cert, file)] };
    }
  }
}

describe("CLI mutation fuzzing", () => {
  it(`${RUNS} mutated inputs: a documented exit code with a message, never a crash, never a changed input`, async () => {
    const codes = new Map<string, number>();
    await fc.assert(
      fc.asyncProperty(fc.constantFrom(...TARGETS), fc.array(mutationArb, { minLength: 1, maxLength: 4 }), fc.nat(), async (target, ms, pick) => {
        const { argv, inputs } = setUp(target, ms, pick);
        const before = inputs.map((p) => fs.readFileSync(p));
        const r = await cli(argv);
        const where = `${argv.join(" ")}\nstderr: ${r.stderr.slice(0, 400)}`;
        expect([0, 1, 2, 3], where).toContain(r.code);
        expect(r.stderr, where).not.toMatch(/internal error|\n\s+at .+:\d+:\d+/);
        if (r.code === 2) expect(r.stderr + r.stdout, where).toMatch(/plumbline: error: \S|unreadable — \S/);
        if (r.code === 1 || r.code === 3) expect(r.stdout.length + r.stderr.length, where).toBeGreaterThan(0);
        inputs.forEach((p, i) => expect(fs.readFileSync(p).equals(before[i]), `${p} changed`).toBe(true));
        const k = `${argv[0]} ${r.code}`;
        codes.set(k, (codes.get(k) ?? 0) + 1);
        fs.rmSync(path.dirname(inputs[0]).replace(/\/cert$/, ""), { recursive: true, force: true });
      }),
      { numRuns: RUNS, seed: SLOW ? undefined : 140014 },
    );
    // the fuzzer reaches both verdicts and refusals (it is not only producing one kind of failure)
    const total = (code: number) => [...codes].filter(([k]) => k.endsWith(` ${code}`)).reduce((s, [, v]) => s + v, 0);
    expect(total(2)).toBeGreaterThan(RUNS / 20);
    expect(total(0) + total(1)).toBeGreaterThan(RUNS / 20);
  }, SLOW ? 3_600_000 : 600_000);
});
