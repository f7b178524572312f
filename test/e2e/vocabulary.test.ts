// README "Words plumbline uses" against what plumbline says: the code's own lists of statuses,
// horizon methods, encodings and bench configurations (both ways), every choice a --help offers,
// and the words in the --json output of the main commands; retired words appear nowhere.
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { CONFIGURATIONS } from "../../src/bench/index.js";
import { CHECK_WORDS } from "../../src/certify/index.js";
import { COMMAND_GROUPS } from "../../src/cli/help.js";
import { COST_ENCODINGS, PARTS, STEP_ENCODINGS } from "../../src/encode/index.js";
import { METHODS } from "../../src/horizon/methods.js";
import { RUN_STATUSES } from "../../src/report/index.js";
import { cli } from "../support/cli.js";

const ROOT = join(import.meta.dirname, "../..");
const README = readFileSync(join(ROOT, "README.md"), "utf8");

/** The table's rows: word → kind(s). */
function vocabulary(): Map<string, Set<string>> {
  const start = README.indexOf("## Words plumbline uses");
  expect(start).toBeGreaterThan(0);
  const section = README.slice(start, README.indexOf("\n## ", start + 5));
  const words = new Map<string, Set<string>>();
  for (const line of section.split("\n")) {
    const m = /^\| `?([^`|]+?)`? \| ([a-z ]+) \| .+ \|$/.exec(line);
    if (!m || m[1] === "word") continue;
    if (!words.has(m[1])) words.set(m[1], new Set());
    words.get(m[1])!.add(m[2]);
  }
  return words;
}
const VOCAB = vocabulary();
const ofKind = (kind: string) => [...VOCAB].filter(([, k]) => k.has(kind)).map(([w]) => w).sort();
const known = (word: string, ...kinds: string[]) => expect(kinds.some((k) => VOCAB.get(word)?.has(k)), `'${word}' as ${kinds.join(" or ")} in README "Words plumbline uses"`).toBe(true);

/** Words replaced in this release: they must not come back in help or JSON. */
const RETIRED = [/\bundetermined\b/, /explicit-optimal/, /"single"/, /\bprobing\b/, /\bcostCap\b/, /bound-units/, /\bboundUnits\b/, /bound literals/, /"extensions"/, /\bc_min/, /not finished/, /run extensions/];
const noRetired = (text: string, where: string) => {
  for (const r of RETIRED) expect(text, `${where} says ${r}`).not.toMatch(r);
};

describe("README's vocabulary and the code's own lists", () => {
  it("has one line per word, each with a meaning", () => {
    expect(VOCAB.size).toBeGreaterThan(50);
    for (const kind of ["status", "proof", "verdict", "method", "encoding", "unit"]) expect(ofKind(kind).length, kind).toBeGreaterThan(0);
  });

  it("statuses, horizon methods, encodings and bench configurations are exactly the code's", () => {
    expect(ofKind("status")).toEqual([...RUN_STATUSES].sort());
    expect(ofKind("method")).toEqual(METHODS.map((m) => m.name).sort());
    expect(ofKind("encoding")).toEqual([...STEP_ENCODINGS, ...COST_ENCODINGS, ...PARTS].sort());
    expect(ofKind("configuration")).toEqual(CONFIGURATIONS.map((c) => c.name).sort());
  });
});

describe("--help uses the table's words", () => {
  it("every choice an option offers is in the table, and no retired word appears", async () => {
    let choices = 0;
    for (const name of ["", ...COMMAND_GROUPS.flatMap((g) => g.commands.map(([n]) => n))]) {
      const help = (await cli(name ? [name, "--help"] : ["--help"])).stdout;
      noRetired(help, `${name || "plumbline"} --help`);
      for (const m of help.replace(/\s+/g, " ").matchAll(/\(choices: ([^)]*)\)/g)) {
        for (const w of m[1].split(/, (?=")/).map((x) => x.replace(/"/g, "").replace(/, default:.*$/, ""))) {
          choices++;
          expect(VOCAB.has(w), `${name} --help offers '${w}', not in README "Words plumbline uses"`).toBe(true);
        }
      }
    }
    expect(choices).toBeGreaterThan(8);
  });
});

describe("--json uses the table's words", () => {
  const H = (f: string) => join(ROOT, "benchmarks/domains/harbour", f);
  const tmp = mkdtempSync(join(tmpdir(), "plumbline-vocabulary-"));
  const cert = join(tmp, "cert");
  let solved: any;
  beforeAll(async () => {
    const r = await cli(["solve", H("domain.pddl"), H("problem-01.pddl"), "--certificate", cert, "--json"]);
    expect(r.code).toBe(0);
    solved = r.json();
  });
  afterAll(() => rmSync(tmp, { recursive: true, force: true }));

  it("solve: status, proof, horizon method, encoding and proof format", async () => {
    noRetired(JSON.stringify(solved), "solve --json");
    known(solved.status, "status");
    known(solved.how, "proof");
    if (solved.horizonMethod) known(solved.horizonMethod, "method");
    for (const part of String(solved.encoding).split("+")) known(part, "encoding");
    if (solved.proof?.format) known(solved.proof.format, "proof format");
  });

  it("audit, rejudge, horizon, search, compare: verdicts, claims and methods", async () => {
    const audit = (await cli(["audit", cert, "--json"])).json();
    noRetired(JSON.stringify(audit), "audit --json");
    known(audit[0].verdict, "verdict");
    known(audit[0].claim.status, "status");
    known(audit[0].claim.how, "proof");
    // every check of the audit's checklist has its plain words
    for (const c of audit[0].checks) expect(CHECK_WORDS[c.name], `plain words for the audit check ${c.name}`).toBeDefined();
    const rejudge = (await cli(["rejudge", cert, "--json"])).json();
    noRetired(JSON.stringify(rejudge), "rejudge --json");
    known(rejudge.verdict, "verdict");
    const horizon = (await cli(["horizon", H("domain.pddl"), H("problem-01.pddl"), "--cost-below", "21", "--json"])).json();
    noRetired(JSON.stringify(horizon), "horizon --json");
    known(horizon.winner, "method");
    for (const m of horizon.methods) known(m.method, "method");
    const search = (await cli(["search", H("domain.pddl"), H("problem-01.pddl"), "--json"])).json();
    known(search.status, "status");
    known(search.heuristic, "heuristic");
    const compare = (await cli(["compare", H("domain.pddl"), H("problem-01.pddl"), H("problem-01.plan"), "--json"])).json();
    noRetired(JSON.stringify(compare), "compare --json");
    known(compare.verdict, "verdict", "status");
  });

  it("sat and check-proof: answers, proof formats and lemma choices", async () => {
    // x1 and not x1: unsatisfiable (common practice, no source)
    const cnf = join(tmp, "tiny.cnf");
    writeFileSync(cnf, "p cnf 1 2\n1 0\n-1 0\n");
    const proof = join(tmp, "tiny.drat");
    const sat = (await cli(["sat", cnf, "--proof", proof, "--json"])).json();
    known(sat.status, "answer");
    known(sat.proof.format, "proof format");
    const check = (await cli(["check-proof", cnf, proof, "--json"])).json();
    expect(check.valid).toBe(true);
    known(check.format, "proof format");
    known(check.lemmas, "lemmas");
  });
});
