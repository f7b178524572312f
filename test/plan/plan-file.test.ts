// Plan files (read, write, errors with plan-file positions), replay input errors (unknown
// action, arity, unknown object, wrong type), and mapping plan steps to ground actions.
import { describe, expect, it } from "vitest";
import { ground } from "../../src/ground/index.js";
import { actionNamesToIndices, formatPlan, parsePlan, planFileText, PLAN_FILE_MARK, readPlanFileHeader, replayPlan, resolveSteps } from "../../src/plan/index.js";
import { replayGround } from "../support/reference.js";
import { fixture, fixtureModel } from "../fixtures/frontend/problems.js";
import { expectPlumblineError, marked } from "../pddl/marker.js";

const quay = () => fixtureModel("quay/domain.pddl", "quay/yard.pddl");

describe("plan files", () => {
  it("reads one step per line, ignores comments and case, keeps positions", () => {
    const steps = parsePlan("; a plan\n(Load C1 truck1 main-quay)   ; first\n\n  (drive truck1 main-quay depot1)\n; cost = 5 (found by hand)\n", "p.txt");
    expect(steps.map((s) => [s.name, s.args])).toEqual([
      ["load", ["c1", "truck1", "main-quay"]],
      ["drive", ["truck1", "main-quay", "depot1"]],
    ]);
    expect(steps[1]).toMatchObject({ line: 4, col: 3, namePos: { line: 4, col: 4 } });
    expect(steps[0].argPos![2]).toEqual({ line: 2, col: 17 });
  });

  it("formatPlan writes what parsePlan reads: one lower-case step per line", () => {
    const text = formatPlan([{ name: "Pick", args: ["Ball1", "room-a", "left"] }, "(move room-a room-b)"]);
    expect(text).toBe("(pick ball1 room-a left)\n(move room-a room-b)\n");
    expect(parsePlan(text, "p").map((s) => s.name)).toEqual(["pick", "move"]);
  });

  it("planFileText: a header of '; key: value' lines (cost, actions, status, proof), then the steps; read back unchanged", () => {
    const steps = [
      { name: "Pick", args: ["Ball1", "room-a", "left"] },
      { name: "move", args: ["room-a", "room-b"] },
    ];
    const text = planFileText(steps, { cost: 2, status: "optimal", proof: "horizon-unsat", notes: ["from a test"] });
    expect(text).toBe(
      `${PLAN_FILE_MARK}\n; cost: 2\n; actions: 2\n; status: optimal\n; proof: horizon-unsat\n; from a test\n(pick ball1 room-a left)\n(move room-a room-b)\n`,
    );
    expect(parsePlan(text, "p").map((s) => [s.name, s.args])).toEqual([
      ["pick", ["ball1", "room-a", "left"]],
      ["move", ["room-a", "room-b"]],
    ]);
    const feasible = planFileText(["(move a b)"], { cost: 3, status: "feasible", proof: null, costModel: "unit" });
    expect(feasible).toContain("; status: feasible\n; proof: none (optimality not proven)\n");
    expect(feasible).toContain("; cost: 3 (the model has no action costs: every action counts 1)\n");
    expect(readPlanFileHeader(text)).toEqual({ cost: 2, actions: 2, status: "optimal", proof: "horizon-unsat" });
    expect(readPlanFileHeader(feasible)).toEqual({ cost: 3, actions: 1, status: "feasible", proof: "none" });
    // the empty plan: a header and no step
    expect(parsePlan(planFileText([], { cost: 0, status: "optimal", proof: "lower-bound" }), "p")).toEqual([]);
  });

  it("reads plan files written by older plumbline versions (a cost line at the end) as before", () => {
    const steps = parsePlan("(drive t1 a b)\n(load c1 t1 b)\n; cost = 5 (action costs)\n", "old.plan");
    expect(steps.map((s) => s.name)).toEqual(["drive", "load"]);
    expect(readPlanFileHeader("(drive t1 a b)\n; cost = 5 (action costs)\n")).toEqual({ cost: 5, actions: null, status: null, proof: null });
    expect(readPlanFileHeader("(drive t1 a b)\n")).toEqual({ cost: null, actions: null, status: null, proof: null });
  });

  it("reads the common timestamped form '0: (drive t1 a b) [1]', with positions in the original columns", () => {
    const text = "; timestamped\n0: (drive t1 a b) [1]\n1.000: (Load c1 t1 b)  [2] ; comment\n2:(unload c1 t1 c)\n";
    const steps = parsePlan(text, "t.plan");
    expect(steps.map((s) => [s.name, s.args])).toEqual([
      ["drive", ["t1", "a", "b"]],
      ["load", ["c1", "t1", "b"]],
      ["unload", ["c1", "t1", "c"]],
    ]);
    expect(steps[0]).toMatchObject({ line: 2, col: 4, namePos: { line: 2, col: 5 } });
    expect(steps[1]).toMatchObject({ line: 3, col: 8 });
    expect(steps[2]).toMatchObject({ line: 4, col: 3 });
    // a mistake inside a timestamped step is still reported at its own column
    expectPlumblineError(() => parsePlan("0: (drive ?t a b) [1]\n", "t.plan"), { code: "parse", message: /expected an object name, found '\?t'/, file: "t.plan", line: 1, col: 11 });
  });

  const SYNTAX: Array<[string, string, RegExp]> = [
    ["a bare word", "(pick a b c)\n«pick", /expected a plan step '\(action object …\)', found 'pick'/],
    ["an empty step", "«()", /expected an action name in '\(\)'/],
    ["a nested list", "(pick «(a) b)", /expected an object name, found '\('/],
    ["a number as action", "(«12 a)", /expected an action name, found '12'/],
    ["a variable argument", "(pick «?x)", /expected an object name, found '\?x'/],
    ["a step number prefix without a step", "«0: pick a", /unexpected character ':' in '0:'/],
    ["an unclosed step", "(pick a\n«", /expected '\)' to close the '\(' opened at 1:1, found end of file/],
  ];
  for (const [label, src, message] of SYNTAX) {
    it(`syntax error: ${label}`, () => {
      const m = marked(src);
      expectPlumblineError(() => parsePlan(m.text, "bad.plan"), { code: "parse", message, file: "bad.plan", line: m.line, col: m.col });
    });
  }
});

describe("steps that name no action of the model: invalid plans, with the plan file's line:col", () => {
  const CASES: Array<[string, string, RegExp]> = [
    ["unknown action", "(load c1 truck1 main-quay)\n(«lift c1 truck1)", /unknown action 'lift' in plan step \(lift c1 truck1\)/],
    ["wrong arity", "«(drive truck1 depot1)", /action 'drive' takes 3 arguments, found 2 in \(drive truck1 depot1\)/],
    ["unknown object", "(drive truck1 main-quay «depot9)", /unknown object 'depot9' in plan step/],
    ["wrong type", "(drive «barge1 main-quay depot1)", /object 'barge1' is not of type truck \(parameter \?t of 'drive'\)/],
    ["wrong type with either", "(load c1 truck1 main-quay)\n(load c1 «c2 main-quay)", /object 'c2' is not of type \(either truck barge\) \(parameter \?v of 'load'\)/],
  ];
  for (const [label, src, message] of CASES) {
    it(label, () => {
      const m = marked(src);
      const steps = parsePlan(m.text, "yard.plan");
      expectPlumblineError(() => resolveSteps(quay(), steps, "yard.plan"), { code: "semantic", message, file: "yard.plan", line: m.line, col: m.col });
      // replay: a verdict (invalid at that step), not an error
      const r = replayPlan(quay(), steps, "yard.plan");
      expect(r.valid).toBe(false);
      expect(r.error).toMatchObject({ kind: "name", step: m.line });
      expect(r.error!.message).toMatch(message);
      expect(r.error!.message).toContain(`yard.plan:${m.line}:${m.col}:`);
    });
  }

  it("names are checked for the whole plan before any step is replayed", () => {
    const m = marked("(inspect depot1)\n(«fly c1)");
    const r = replayPlan(quay(), parsePlan(m.text, "yard.plan"), "yard.plan");
    expect(r.error).toMatchObject({ kind: "name", step: 2 });
    expect(r.error!.message).toMatch(/yard\.plan:2:2: unknown action 'fly'/);
  });
});

describe("actionNamesToIndices", () => {
  it("maps a valid plan to ground actions whose replay on the Task agrees with the lifted replay", () => {
    const model = quay();
    const task = ground(model);
    const steps = parsePlan(fixture("quay/yard.plan"), "yard.plan");
    const ids = actionNamesToIndices(task, steps, { appendGoalAction: true });
    expect(ids.length).toBe(steps.length + 1);
    expect(task.actions[ids[ids.length - 1]].synthetic).toBe(true);
    const g = replayGround(task, ids);
    expect(g.ok).toBe(true);
    if (g.ok) {
      expect(g.cost).toBe(replayPlan(model, steps).cost);
      expect(task.goal.every((f) => g.state.has(f))).toBe(true);
    }
  });

  it("picks the applicable one of several ground actions with the same name", () => {
    const model = quay();
    const task = ground(model);
    const steps = parsePlan("(drive truck1 main-quay depot1)\n(seal c2 depot1)\n(load c2 truck1 depot1)", "p");
    const ids = actionNamesToIndices(task, steps);
    const load = task.actions[ids[2]];
    expect(load.pre.map((f) => task.facts[f])).toContain("(sealed c2)");
    expect(replayGround(task, ids).ok).toBe(true);
  });

  it("a step with no ground action is an error at the step's position", () => {
    const model = fixtureModel("gripper/domain.pddl", "gripper/four-balls.pddl");
    const task = ground(model, { relevance: true });
    // picking with a "gripper" that is a room has no reachable ground action
    const m = marked("(pick ball1 room-a left)\n«(pick ball2 room-a room-b)");
    expectPlumblineError(() => actionNamesToIndices(task, parsePlan(m.text, "g.plan"), { planFile: "g.plan" }), {
      code: "semantic",
      message: /plan step 2 \(pick ball2 room-a room-b\) has no ground action in the task/,
      file: "g.plan",
      line: m.line,
      col: m.col,
    });
  });
});
