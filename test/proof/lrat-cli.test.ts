// `check-proof --lrat-proof OUT` and `check-proof --proof-format lrat` end to end (in-process): exit codes,
// JSON keys, the LRAT file written only for a valid DRAT proof, and usage errors.
import { existsSync, mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { afterAll, describe, expect, it } from "vitest";
import { writeDimacs } from "../../src/sat/index.js";
import { cli } from "../support/cli.js";
import { pigeonhole } from "../sat/support/generators.js";
import { solverProof } from "./support/lrat-text.js";

const dir = mkdtempSync(join(tmpdir(), "plumbline-lrat-cli-"));
afterAll(() => rmSync(dir, { recursive: true, force: true }));
const php = pigeonhole(4); // PHP(5,4): unsatisfiable, source: Haken 1985
const cnfPath = join(dir, "php5.cnf");
writeFileSync(cnfPath, writeDimacs(php));
const dratPath = join(dir, "php5.drat");
writeFileSync(dratPath, solverProof(php.clauses, "text") as Uint8Array);

describe("plumbline check-proof with LRAT", () => {
  it("--lrat-proof writes an LRAT proof that --proof-format lrat accepts (exit 0, JSON valid/format)", async () => {
    const out = join(dir, "php5.lrat");
    const r = await cli(["check-proof", cnfPath, dratPath, "--lrat-proof", out, "--json"]);
    expect(r.code).toBe(0);
    const j = r.json();
    expect(j.valid).toBe(true);
    expect(j.format).toBe("drat");
    expect(j.lratProof).toBe(out);
    expect(j.stats.lratLines).toBeGreaterThan(0);
    expect(readFileSync(out, "latin1").trim().split("\n").length).toBe(j.stats.lratLines);
    const c = await cli(["check-proof", cnfPath, out, "--proof-format", "lrat", "--json"]);
    expect(c.code).toBe(0);
    const k = c.json();
    expect(k.valid).toBe(true);
    expect(k.format).toBe("lrat");
    expect(k.stats.additions).toBeGreaterThan(0);
    const plain = await cli(["check-proof", cnfPath, out, "--proof-format", "lrat"]);
    expect(plain.stdout).toMatch(/^LRAT proof valid: \d+ lemmas/);
  });

  it("a rejected LRAT proof is exit 1 with the line in the JSON", async () => {
    const out = join(dir, "ok.lrat");
    expect((await cli(["check-proof", cnfPath, dratPath, "--lrat-proof", out, "--quiet"])).code).toBe(0);
    const lines = readFileSync(out, "latin1").trim().split("\n");
    const bad = join(dir, "cut.lrat");
    writeFileSync(bad, lines.slice(0, -1).join("\n") + "\n"); // the empty clause removed
    const r = await cli(["check-proof", cnfPath, bad, "--proof-format", "lrat", "--json"]);
    expect(r.code).toBe(1);
    const j = r.json();
    expect(j.valid).toBe(false);
    expect(j.format).toBe("lrat");
    expect(j.reason).toMatch(/ends without deriving the empty clause/);
    expect(j.line).toBe(lines.length - 1);
    const junk = join(dir, "junk.lrat");
    writeFileSync(junk, "c header\n1 2 x 0\n");
    const k = await cli(["check-proof", cnfPath, junk, "--proof-format", "lrat"]);
    expect(k.code).toBe(1);
    expect(k.stdout).toMatch(/LRAT proof rejected: line 2: expected a literal, found 'x'/);
  });

  it("no LRAT file is left when the DRAT proof is rejected", async () => {
    const wrong = join(dir, "wrong.drat");
    writeFileSync(wrong, "1 0\n0\n");
    const out = join(dir, "never.lrat");
    const before = readdirSync(dir).length;
    const r = await cli(["check-proof", cnfPath, wrong, "--lrat-proof", out, "--json"]);
    expect(r.code).toBe(1);
    expect(r.json().valid).toBe(false);
    expect(existsSync(out)).toBe(false);
    expect(readdirSync(dir).length).toBe(before); // no temporary file either
  });

  it("usage errors are exit 2: --lrat-proof with --lemmas all, --lrat-proof with --proof-format lrat, bad files", async () => {
    const out = join(dir, "x.lrat");
    const f = await cli(["check-proof", cnfPath, dratPath, "--lrat-proof", out, "--lemmas", "all"]);
    expect(f.code).toBe(2);
    expect(f.stderr).toMatch(/--lrat-proof needs --lemmas needed/);
    expect(f.stderr).not.toMatch(/\n\s+at /);
    expect(existsSync(out)).toBe(false);
    const same = await cli(["check-proof", cnfPath, dratPath, "--lrat-proof", dratPath]);
    expect(same.code).toBe(2);
    expect(same.stderr).toMatch(/is an input of this command/);
    expect(readFileSync(dratPath, "latin1")).not.toMatch(/ 0 .* 0\n/); // still the DRAT proof, not LRAT
    const g = await cli(["check-proof", cnfPath, dratPath, "--proof-format", "lrat", "--lrat-proof", out]);
    expect(g.code).toBe(2);
    expect(existsSync(out)).toBe(false);
    expect((await cli(["check-proof", cnfPath, join(dir, "missing.lrat"), "--proof-format", "lrat"])).code).toBe(2);
    const badCnf = join(dir, "bad.cnf");
    writeFileSync(badCnf, "p cnf 2 1\n1 5 0\n");
    const b = await cli(["check-proof", badCnf, dratPath, "--proof-format", "lrat"]);
    expect(b.code).toBe(2);
    expect(b.stderr).toContain(`${badCnf}:2:3`);
    expect((await cli(["check-proof", cnfPath, dratPath, "--proof-format", "xyz"])).code).toBe(2);
  });

  it("--help explains the LRAT options", async () => {
    const r = await cli(["check-proof", "--help"]);
    expect(r.code).toBe(0);
    expect(r.stdout).toMatch(/--lrat-proof <file>.*LRAT/s);
    expect(r.stdout).toMatch(/--proof-format <format>.*lrat/s);
  });
});
