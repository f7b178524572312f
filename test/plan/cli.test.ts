// The `ground` and `replay` commands end to end (in-process): exit codes 0/1/2, the JSON
// keys of the contract, the human table, and errors with file:line:col and no stack trace.
import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { cli } from "../support/cli.js";
import { fixturePath } from "../fixtures/frontend/problems.js";

const G = [fixturePath("gripper/domain.pddl"), fixturePath("gripper/four-balls.pddl")];
const Q = [fixturePath("quay/domain.pddl"), fixturePath("quay/yard.pddl")];
const tmp = mkdtempSync(join(tmpdir(), "plumbline-frontend-"));
const write = (name: string, text: string) => {
  const p = join(tmp, name);
  writeFileSync(p, text);
  return p;
};
const noStack = (s: string) => expect(s).not.toMatch(/\n\s+at .*\(.*:\d+:\d+\)/);

describe("plumbline ground", () => {
  it("--json prints the statistics under the contract's keys", async () => {
    const r = await cli(["ground", ...G, "--json", "--no-relevance"]);
    expect(r.code).toBe(0);
    const j = r.json();
    expect(j).toMatchObject({ facts: 20, actions: 36, zeroCostActions: 0, conditionalEffects: 0, costModel: "unit", relevance: false });
    expect(typeof j.seconds).toBe("number");
  });

  it("prints an aligned table by default", async () => {
    const r = await cli(["ground", ...Q]);
    expect(r.code).toBe(0);
    const lines = r.stdout.trim().split("\n");
    expect(lines.map((l) => l.split(/\s{2,}/)[0])).toEqual(["domain", "problem", "cost model", "facts", "actions", "zero-cost actions", "conditional effects", "seconds"]);
    const col = lines.map((l) => l.search(/\S+$/));
    expect(new Set(col.slice(0, -1)).size).toBe(1);
  });

  it("prunes by goal relevance by default, as solve does; --no-relevance keeps everything (quay: fewer actions)", async () => {
    const a = (await cli(["ground", ...Q, "--json", "--no-relevance"])).json();
    const b = (await cli(["ground", ...Q, "--json"])).json();
    expect(a.relevance).toBe(false);
    expect(b.relevance).toBe(true);
    expect(b.actions).toBeLessThan(a.actions);
    // the old switch still works (pruning is the default now)
    expect((await cli(["ground", ...Q, "--json", "--relevance"])).json()).toMatchObject({ relevance: true, actions: b.actions });
  });

  it("a missing file is exit 2 with the file named", async () => {
    const r = await cli(["ground", join(tmp, "nope.pddl"), G[1]]);
    expect(r.code).toBe(2);
    expect(r.stderr).toContain(`cannot read ${join(tmp, "nope.pddl")}: no such file`);
    noStack(r.stderr);
  });

  it("an unsupported feature is refused by name with file:line:col, exit 2", async () => {
    const d = write("durative.pddl", "(define (domain d)\n  (:requirements :strips)\n  (:durative-action a))");
    const r = await cli(["ground", d, G[1], "--json"]);
    expect(r.code).toBe(2);
    expect(r.stderr).toContain(`${d}:3:4: durative actions (:durative-action) are not supported`);
    expect(r.json()).toMatchObject({ code: "unsupported", pos: { file: d, line: 3, col: 4 } });
    noStack(r.stderr);
  });
});

describe("plumbline replay", () => {
  it("a valid plan: exit 0, cost and length", async () => {
    const r = await cli(["replay", ...Q, fixturePath("quay/yard.plan")]);
    expect(r.code).toBe(0);
    expect(r.stdout).toContain("plan valid: 6 actions, cost 10");
    expect(r.stdout).toContain("only as good as the model");
    const j = (await cli(["replay", ...Q, fixturePath("quay/yard.plan"), "--json"])).json();
    expect(j).toMatchObject({ valid: true, cost: 10, length: 6, error: null });
  });

  it("an invalid plan: exit 1, the step, action and failing literal", async () => {
    const p = write("bad.plan", "(toggle-busy truck1)\n(drive truck1 main-quay depot1)\n");
    const r = await cli(["replay", ...Q, p, "--json"]);
    expect(r.code).toBe(1);
    expect(r.json()).toMatchObject({
      valid: false,
      length: 2,
      cost: 1,
      error: { step: 2, action: "(drive truck1 main-quay depot1)", kind: "precondition", literal: "(not (busy truck1))" },
    });
    const h = await cli(["replay", ...Q, p]);
    expect(h.code).toBe(1);
    expect(h.stdout).toContain("action 2 (drive truck1 main-quay depot1): precondition (not (busy truck1)) does not hold");
  });

  it("a plan naming an unknown object: invalid, exit 1, with the plan file's line:col", async () => {
    const p = write("unknown.plan", "(load c1 truck1 main-quay)\n(drive truck1 main-quay atlantis)\n");
    const r = await cli(["replay", ...Q, p]);
    expect(r.code).toBe(1);
    expect(r.stdout).toContain(`${p}:2:25: unknown object 'atlantis'`);
    noStack(r.stderr);
  });

  it("--trace lists every step with its cost", async () => {
    const r = await cli(["replay", ...Q, fixturePath("quay/yard.plan"), "--trace"]);
    expect(r.stdout).toContain("(drive truck1 main-quay depot1)  cost 4");
  });
});
