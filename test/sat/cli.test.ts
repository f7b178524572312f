// The `sat` and `check-proof` commands end to end (in-process): answers, JSON, proof files,
// and the exit codes of DESIGN.md (0 answer / valid, 1 rejected, 2 bad input, 3 limit).
import { mkdtempSync, readFileSync, rmSync, writeFileSync, existsSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { afterAll, describe, expect, it } from "vitest";
import { writeDimacs } from "../../src/sat/index.js";
import { cli } from "../support/cli.js";
import { pigeonhole, queens } from "./support/generators.js";

const dir = mkdtempSync(join(tmpdir(), "plumbline-sat-cli-"));
afterAll(() => rmSync(dir, { recursive: true, force: true }));
const php = join(dir, "php5.cnf");
writeFileSync(php, writeDimacs(pigeonhole(5)));
const q6 = join(dir, "q6.cnf");
writeFileSync(q6, writeDimacs(queens(6)));

describe("plumbline sat / check-proof", () => {
  it("sat: an unsat formula with a proof that check-proof accepts (binary and text)", async () => {
    for (const fmt of ["drat-binary", "drat-text"]) {
      const proof = join(dir, `php5.${fmt.slice(5)}`);
      const r = await cli(["sat", php, "--proof", proof, "--proof-format", fmt, "--json"]);
      expect(r.code).toBe(0);
      const j = r.json();
      expect(j.status).toBe("unsat"); // source: Haken 1985
      expect(j.proof.file).toBe(proof);
      expect(j.stats.conflicts).toBeGreaterThan(0);
      const c = await cli(["check-proof", php, proof, "--json"]);
      expect(c.code).toBe(0);
      expect(c.json().valid).toBe(true);
    }
  });

  it("sat: a satisfiable formula prints s and v lines; no proof file is left", async () => {
    const proof = join(dir, "q6.drat");
    const r = await cli(["sat", q6, "--proof", proof]);
    expect(r.code).toBe(0);
    expect(r.stdout).toMatch(/^s SATISFIABLE\nv /);
    expect(r.stdout.trim().endsWith(" 0")).toBe(true);
    expect(existsSync(proof)).toBe(false);
    const j = (await cli(["sat", q6, "--json", "--model"])).json();
    expect(j.model.filter((l: number) => l > 0).length).toBe(6);
  });

  it("check-proof rejects a corrupted proof with exit 1 and names the lemma", async () => {
    const proof = join(dir, "php5.text");
    const lines = readFileSync(proof, "latin1").split("\n");
    const bad = join(dir, "bad.text");
    writeFileSync(bad, lines.slice(0, Math.floor(lines.length / 2)).join("\n") + "\n");
    const r = await cli(["check-proof", php, bad, "--json"]);
    expect(r.code).toBe(1);
    expect(r.json().valid).toBe(false);
    const wrong = join(dir, "wrong.text");
    writeFileSync(wrong, "1 0\n0\n");
    const w = await cli(["check-proof", php, wrong]);
    expect(w.code).toBe(1);
    expect(w.stdout).toMatch(/proof rejected: lemma \d+ \[/);
  });

  it("bad input is exit 2 with file:line:col; a limit is exit 3", async () => {
    const badCnf = join(dir, "bad.cnf");
    writeFileSync(badCnf, "p cnf 2 1\n1 5 0\n");
    const r = await cli(["sat", badCnf]);
    expect(r.code).toBe(2);
    expect(r.stderr).toContain(`${badCnf}:2:3: literal 5 is out of range`);
    expect(r.stderr).not.toMatch(/\n\s+at /);
    expect((await cli(["check-proof", badCnf, join(dir, "none")])).code).toBe(2);
    expect((await cli(["check-proof", php, join(dir, "missing.drat")])).code).toBe(2);
    const big = join(dir, "php9.cnf");
    writeFileSync(big, writeDimacs(pigeonhole(9)));
    const lim = await cli(["sat", big, "--conflicts", "50", "--json"]);
    expect(lim.code).toBe(3);
    expect(lim.json().status).toBe("unknown");
    expect((await cli(["sat", php, "--conflicts", "x"])).code).toBe(2);
  });

  it("--help explains the options", async () => {
    const r = await cli(["sat", "--help"]);
    expect(r.code).toBe(0);
    expect(r.stdout).toContain("--proof-format");
    expect(r.stdout).toContain("external:CMD");
    expect((await cli(["check-proof", "--help"])).stdout).toContain("--lemmas");
  });
});
