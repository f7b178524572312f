// The help a person reads first: the main job listed first, one aligned line per command, no line
// wider than the help width, and every command's --help ending with its exit codes, 4 included.
import { describe, expect, it } from "vitest";
import { COMMAND_GROUPS } from "../../src/cli/help.js";
import { cli } from "../support/cli.js";

const NAMES = COMMAND_GROUPS.flatMap((g) => g.commands.map(([n]) => n));

describe("plumbline --help", () => {
  it("lists the main job (solve, audit, compare, rejudge) first, in groups, one aligned line per command", async () => {
    const r = await cli(["--help"]);
    expect(r.code).toBe(0);
    const lines = r.stdout.split("\n");
    const first = lines.findIndex((l) => /^ {2}\S/.test(l));
    expect(lines[first - 1]).toBe("The main job:");
    expect(lines.slice(first, first + 8).filter((l) => /^ {2}\S/.test(l)).map((l) => l.trim().split(/\s+/)[0])).toEqual(["solve", "audit", "compare", "rejudge"]);
    // every command once, in the listed order; summaries start in one column
    const items = lines.filter((l) => /^ {2}[a-z]/.test(l) && NAMES.includes(l.trim().split(/\s+/)[0]));
    expect(items.map((l) => l.trim().split(/\s+/)[0])).toEqual(NAMES);
    expect(new Set(items.map((l) => l.search(/(?<=\S {2,})\S/))).size).toBe(1);
    // continuation lines of a summary are indented to that column, never back at the margin
    for (const l of lines) expect(l.length, l).toBeLessThanOrEqual(80);
    expect(r.stdout).toMatch(/4 an internal error \(a bug in plumbline; please report it\)/);
  });

  it("every command's --help ends with its exit codes 0, 2, 3 and 4 (and no line is wider than 80)", async () => {
    for (const name of NAMES) {
      const r = await cli([name, "--help"]);
      expect(r.code, name).toBe(0);
      const tail = r.stdout.slice(r.stdout.lastIndexOf("Exit codes:")).replace(/\s+/g, " ");
      expect(tail, name).toMatch(/^Exit codes: 0 .*; 2 bad input or usage .*; 3 .*; 4 an internal error \(a bug in plumbline; please report it\)\.\s*$/);
      for (const l of r.stdout.split("\n")) expect(l.length, `${name}: ${l}`).toBeLessThanOrEqual(80);
    }
  });
});
