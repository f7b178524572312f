// The external-solver adapter, exercised with a fake solver script written for these tests
// (never a real product): answers, checked models, proof paths, and clear errors.
import { existsSync, mkdtempSync, readFileSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join, resolve } from "node:path";
import { afterAll, describe, expect, it } from "vitest";
import { checkDrat } from "../../src/proof/index.js";
import { parseSolverOutput, solveExternal, splitCommand } from "../../src/sat/index.js";
import { PlumblineError } from "../../src/util/errors.js";
import { queens } from "./support/generators.js";

const FAKE = resolve(__dirname, "fixtures/fake-solver.mjs");
const CMD = `node ${FAKE}`;
const dir = mkdtempSync(join(tmpdir(), "plumbline-ext-test-"));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe("external SAT solvers", () => {
  it("reads a model and checks it against the clauses", async () => {
    const cnf = queens(4); // source: OEIS A000170 (4-queens has 2 solutions, so it is satisfiable)
    const r = await solveExternal(CMD, cnf);
    expect(r.status).toBe("sat");
    expect(r.model).toBeDefined();
    expect(r.exitCode).toBe(10);
  });

  it("passes a proof path and returns it on unsat", async () => {
    const cnf = { numVars: 2, clauses: [Int32Array.of(1), Int32Array.of(-1, 2), Int32Array.of(-2)] };
    const proofPath = join(dir, "p.drat");
    const r = await solveExternal(CMD, cnf, { proofPath });
    expect(r.status).toBe("unsat");
    expect(r.proofPath).toBe(proofPath);
    expect(checkDrat(cnf, new Uint8Array(readFileSync(proofPath))).valid).toBe(true);
    // placeholders put the paths where the command wants them
    const r2 = await solveExternal(`node ${FAKE} {cnf} {proof}`, cnf, { proofPath: join(dir, "q.drat") });
    expect(r2.command.slice(-1)[0]).toBe(join(dir, "q.drat"));
    expect(existsSync(join(dir, "q.drat"))).toBe(true);
  });

  it("a missing command is a clear 'external' error", async () => {
    const e = await solveExternal("no-such-solver-plumbline-test", queens(4)).catch((x) => x);
    expect(e).toBeInstanceOf(PlumblineError);
    expect(e.code).toBe("external");
    expect(e.message).toMatch(/'no-such-solver-plumbline-test' not found/);
  });

  it("rejects a wrong model and a missing status line", async () => {
    process.env.FAKE_SOLVER_MODE = "bad-model";
    try {
      await expect(solveExternal(CMD, queens(4))).rejects.toThrow(/falsifies clause/);
      process.env.FAKE_SOLVER_MODE = "silent";
      await expect(solveExternal(CMD, queens(4))).rejects.toThrow(/printed no 's' line/);
    } finally {
      delete process.env.FAKE_SOLVER_MODE;
    }
  });

  it("a timeout stops the solver and answers unknown", async () => {
    process.env.FAKE_SOLVER_MODE = "sleep";
    try {
      const r = await solveExternal(CMD, queens(4), { timeoutMs: 200 });
      expect(r.status).toBe("unknown");
    } finally {
      delete process.env.FAKE_SOLVER_MODE;
    }
  });

  it("parses output lines and command words", () => {
    const p = parseSolverOutput("c x\ns SATISFIABLE\nv 1 -2\nv 3 0\n", 3);
    expect(p.status).toBe("sat");
    expect(Array.from(p.model)).toEqual([0, 1, -1, 1]);
    expect(parseSolverOutput("s UNSATISFIABLE\n", 1).status).toBe("unsat");
    expect(splitCommand(`my-solver --x "a b" 'c d'`)).toEqual(["my-solver", "--x", "a b", "c d"]);
  });
});
