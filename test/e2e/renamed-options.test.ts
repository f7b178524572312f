// Options renamed in this release: the old spellings still work (with a deprecation note on
// stderr naming the new one), the help shows only the new ones, and the rewriting leaves
// everything else alone.
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { afterAll, describe, expect, it } from "vitest";
import { RENAMED_OPTIONS, renameOldOptions } from "../../src/cli/renamed-options.js";
import { writeDimacs } from "../../src/sat/index.js";
import { cli } from "../support/cli.js";

const H = (f: string) => join(import.meta.dirname, "../../benchmarks/domains/harbour", f);
const tmp = mkdtempSync(join(tmpdir(), "plumbline-renamed-"));
afterAll(() => rmSync(tmp, { recursive: true, force: true }));

describe("renameOldOptions", () => {
  it("rewrites old spellings of the command's options (also --old=value), maps renamed values, and notes each once", () => {
    const notes: string[] = [];
    const out = renameOldOptions(["check-proof", "a.cnf", "p.drat", "--mode", "forward", "--format=drat", "--lrat", "x.lrat", "--mode", "forward", "--json"], (t) => notes.push(t));
    expect(out).toEqual(["check-proof", "a.cnf", "p.drat", "--lemmas", "all", "--proof-format=drat", "--lrat-proof", "x.lrat", "--lemmas", "all", "--json"]);
    expect(notes).toHaveLength(3);
    expect(notes[0]).toMatch(/check-proof --mode forward is the old spelling of --lemmas all: it still works in this release and will be removed in the next/);
  });

  it("leaves new spellings, other commands' options, values that were not renamed and everything after -- alone", () => {
    const notes: string[] = [];
    const same = [
      ["solve", "d", "p", "--time-limit", "3"],
      ["sat", "f.cnf", "--proof-format", "drat-text"],
      ["horizon", "d", "p", "--cost-below", "4"],
      ["bench", "s.json", "--", "--out", "x"],
    ];
    for (const argv of same) expect(renameOldOptions(argv, (t) => notes.push(t))).toEqual(argv);
    expect(notes).toEqual([]);
    // a renamed value without a renamed name
    expect(renameOldOptions(["sat", "f.cnf", "--proof-format", "text"], (t) => notes.push(t))).toEqual(["sat", "f.cnf", "--proof-format", "drat-text"]);
    expect(notes).toEqual(["sat --proof-format text is the old spelling of --proof-format drat-text: it still works in this release and will be removed in the next; use --proof-format drat-text"]);
  });

  it("every new spelling is an option of its command, and no old spelling is", async () => {
    for (const r of RENAMED_OPTIONS) {
      const help = (await cli([r.command, "--help"])).stdout;
      expect(help, `${r.command} ${r.now}`).toMatch(new RegExp(`${r.now}[ ,=<]`));
      if (r.old !== r.now) expect(help, `${r.command} ${r.old}`).not.toMatch(new RegExp(`${r.old}[ ,=<]`));
      // renamed values are not among the listed choices (commander quotes them)
      for (const v of Object.keys(r.values ?? {})) expect(help).not.toContain(`"${v}"`);
    }
  });
});

describe("old spellings on the command line", () => {
  it("horizon --upper-bound C works as --cost-below C, with a note on stderr", async () => {
    const old = await cli(["horizon", H("domain.pddl"), H("problem-01.pddl"), "--upper-bound", "21", "--json"]);
    const now = await cli(["horizon", H("domain.pddl"), H("problem-01.pddl"), "--cost-below", "21", "--json"]);
    expect(old.code).toBe(0);
    expect(old.stderr).toContain("plumbline: deprecated: horizon --upper-bound is the old spelling of --cost-below");
    expect(now.stderr).not.toContain("deprecated");
    expect(old.json().horizon).toBe(now.json().horizon);
  });

  it("check-proof --mode forward and --format drat still check a proof (exit 0), sat --proof-format text still writes a text proof", async () => {
    // pigeonhole 3 into 2: unsatisfiable (source: pigeonhole principle)
    const v = (p: number, h: number) => p * 2 + h + 1;
    const clauses: number[][] = [];
    for (let p = 0; p < 3; p++) clauses.push([v(p, 0), v(p, 1)]);
    for (let h = 0; h < 2; h++) for (let a = 0; a < 3; a++) for (let b = a + 1; b < 3; b++) clauses.push([-v(a, h), -v(b, h)]);
    const cnf = join(tmp, "php3.cnf");
    writeFileSync(cnf, writeDimacs({ numVars: 6, clauses: clauses.map((c) => Int32Array.from(c)) }));
    const proof = join(tmp, "php3.drat");
    const s = await cli(["sat", cnf, "--proof", proof, "--proof-format", "text", "--json"]);
    expect(s.code).toBe(0);
    expect(s.json().proof.format).toBe("drat-text");
    expect(s.stderr).toContain("deprecated");
    const c = await cli(["check-proof", cnf, proof, "--mode", "forward", "--format", "drat", "--json"]);
    expect(c.code).toBe(0);
    expect(c.json()).toMatchObject({ valid: true, lemmas: "all" });
    expect(c.stderr.match(/deprecated/g)).toHaveLength(2);
  });
});
