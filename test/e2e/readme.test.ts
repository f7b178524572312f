// README's commands run as typed: the main-job lines run in order in a fresh folder holding the
// repository's benchmarks (each ends with an answer — exit 0 or a negative verdict, 1 — never a
// usage error), and every other `npx plumbline` line names a command and options that exist.
import { spawnSync } from "node:child_process";
import { cpSync, existsSync, mkdtempSync, readFileSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { afterAll, describe, expect, it } from "vitest";
import { plumblineCommand } from "../bench/support.js";
import { cli } from "../support/cli.js";

const ROOT = join(import.meta.dirname, "../..");
const README = readFileSync(join(ROOT, "README.md"), "utf8");
const blocks = [...README.matchAll(/```sh\n([\s\S]*?)```/g)].map((m) => m[1].split("\n").filter((l) => l.trim()));
const commandLines = blocks.flat().filter((l) => l.startsWith("npx plumbline "));
const mainJob = blocks.find((b) => b.some((l) => l.startsWith("npx plumbline solve ")))!;

/** A README line as argv: the comment dropped, $VARS expanded, split at spaces. */
function argvOf(line: string, vars: Record<string, string>): string[] {
  const code = line.replace(/\s+#.*$/, "").trim();
  return code.split(/\s+/).map((t) => t.replace(/\$([A-Z]+)/g, (_, v: string) => vars[v] ?? `$${v}`));
}

const work = mkdtempSync(join(tmpdir(), "plumbline-readme-"));
afterAll(() => rmSync(work, { recursive: true, force: true }));

describe("README commands", () => {
  it("the main-job lines run as typed, in order, in a fresh folder with the repository's benchmarks", () => {
    expect(mainJob.length).toBeGreaterThan(4);
    for (const d of ["domains", "regression"]) cpSync(join(ROOT, "benchmarks", d), join(work, "benchmarks", d), { recursive: true });
    const vars: Record<string, string> = {};
    // what `npx plumbline` runs: the built CLI (npm ci builds it), or the sources when unbuilt
    const [node, ...start] = plumblineCommand();
    for (const line of mainJob) {
      const assign = /^([A-Z]+)=(\S+)/.exec(line);
      if (assign) {
        vars[assign[1]] = assign[2];
        continue;
      }
      expect(line.startsWith("npx plumbline "), line).toBe(true);
      const argv = argvOf(line, vars).slice(2);
      const r = spawnSync(node, [...start, ...argv], { cwd: work, encoding: "utf8", timeout: 240_000 });
      expect([0, 1], `${line}\n${r.stderr}`).toContain(r.status);
      expect(r.stderr, line).not.toMatch(/deprecated|internal error/);
    }
    for (const out of ["plan.txt", "cert/certificate.json", "audit.xml", "f.cnf"]) expect(existsSync(join(work, out)), out).toBe(true);
  });

  it("every other line names a command and options that exist (new spellings only)", async () => {
    expect(commandLines.length).toBeGreaterThan(10);
    const helps = new Map<string, string>();
    for (const line of commandLines) {
      const argv = argvOf(line, {}).slice(2);
      const command = argv[0];
      if (!helps.has(command)) {
        const h = await cli([command, "--help"]);
        expect(h.code, `${line}: no command '${command}'`).toBe(0);
        helps.set(command, h.stdout);
      }
      for (const flag of argv.filter((t) => /^\[?--[a-z]/.test(t)).map((t) => t.replace(/^\[/, "").replace(/[\]=].*$/, ""))) {
        expect(helps.get(command), `${line}: ${command} has no option ${flag}`).toMatch(new RegExp(`(^|[ ,])${flag}[ ,=<\\n]`, "m"));
      }
    }
  });
});
