// Lifted plan replay: valid and invalid plans with the failing step and literal, costs per
// the cost convention, conditional effects and negative preconditions, and outside facts
// (Towers of Hanoi 2^n − 1, gripper's 11-step plan).
import { describe, expect, it } from "vitest";
import { formatPlan, parsePlan, replayPlan } from "../../src/plan/index.js";
import { fixture, fixtureModel, hanoiPlan, hanoiProblem } from "../fixtures/frontend/problems.js";

const quay = () => fixtureModel("quay/domain.pddl", "quay/yard.pddl");
const plan = (text: string) => parsePlan(text, "plan.txt");

describe("Towers of Hanoi", () => {
  for (const n of [1, 2, 3, 4, 5, 6]) {
    it(`n = ${n}: the recursive ${2 ** n - 1}-move plan is valid; one move shorter fails on the goal`, () => {
      const model = fixtureModel("hanoi/domain.pddl", hanoiProblem(n));
      const steps = plan(formatPlan(hanoiPlan(n)));
      // source: standard result — the recursive solution has 2^n − 1 moves
      expect(steps.length).toBe(2 ** n - 1);
      const r = replayPlan(model, steps);
      expect(r).toMatchObject({ valid: true, cost: 2 ** n - 1, length: 2 ** n - 1, error: null });
      const short = replayPlan(model, steps.slice(0, -1));
      expect(short.valid).toBe(false);
      expect(short.error).toMatchObject({ step: 2 ** n - 1, action: null, kind: "goal" });
      // the last move puts the smallest disc on its final place
      expect(short.error!.literal).toBe(n === 1 ? "(on d1 p3)" : "(on d1 d2)");
    });
  }
});

describe("gripper", () => {
  it("the 11-step plan for 4 balls and 2 grippers is valid", () => {
    const model = fixtureModel("gripper/domain.pddl", "gripper/four-balls.pddl");
    const r = replayPlan(model, plan(fixture("gripper/four-balls.plan")));
    // source: classic benchmark fact, from memory
    expect(r).toMatchObject({ valid: true, length: 11, cost: 11 });
  });

  it("a pick with a gripper that is already full fails on (free left)", () => {
    const model = fixtureModel("gripper/domain.pddl", "gripper/four-balls.pddl");
    const r = replayPlan(model, plan("(pick ball1 room-a left)\n(pick ball2 room-a left)"));
    expect(r.error).toMatchObject({ step: 2, action: "(pick ball2 room-a left)", kind: "precondition", literal: "(free left)" });
    expect(r.error!.message).toBe("action 2 (pick ball2 room-a left): precondition (free left) does not hold");
    expect(r.cost).toBe(1);
  });
});

describe("quay (ADL, action costs)", () => {
  it("the hand-made plan is valid and costs 1 + 4 + 0 + 2 + 3 + 0 = 10", () => {
    const r = replayPlan(quay(), plan(fixture("quay/yard.plan")), "yard.plan", { trace: true });
    expect(r).toMatchObject({ valid: true, cost: 10, length: 6 });
    expect(r.trace!.map((t) => t.cost)).toEqual([1, 4, 0, 2, 3, 0]);
  });

  it("a negative precondition that fails is reported as (not …)", () => {
    const r = replayPlan(quay(), plan("(toggle-busy truck1)\n(drive truck1 main-quay depot1)"));
    expect(r.error).toMatchObject({ step: 2, kind: "precondition", literal: "(not (busy truck1))" });
  });

  it("conditional effects fire only when their condition holds (toggle twice = not busy)", () => {
    const once = replayPlan(quay(), plan("(toggle-busy truck1)\n(load c1 truck1 main-quay)"));
    expect(once.error?.literal).toBe("(not (busy truck1))");
    const twice = replayPlan(quay(), plan("(toggle-busy truck1)\n(toggle-busy truck1)\n(load c1 truck1 main-quay)"));
    expect(twice.error?.kind).toBe("goal");
    expect(twice.cost).toBe(3);
  });

  it("a forall/when effect: driving shakes only fragile crates on board", () => {
    const text = fixture("quay/yard.pddl").replace(/\(:goal[\s\S]*\)\)\s*\(:metric/, "(:goal (shaken c2)) (:metric");
    const m = fixtureModel("quay/domain.pddl", text);
    const carry = "(drive truck1 main-quay depot1)\n(seal c2 depot1)\n(load c2 truck1 depot1)\n(drive truck1 depot1 depot2)";
    expect(replayPlan(m, plan(carry))).toMatchObject({ valid: true, cost: 4 + 0 + 1 + 3 });
    const without = replayPlan(m, plan("(drive truck1 main-quay depot1)\n(drive truck1 depot1 depot2)"));
    expect(without.error).toMatchObject({ step: 3, kind: "goal", literal: "(shaken c2)" });
  });

  it("a failing disjunction or existential is shown whole, ground", () => {
    const r = replayPlan(quay(), plan("(load c2 truck1 depot1)"));
    expect(r.error?.literal).toBe("(at truck1 depot1)");
    const r2 = replayPlan(quay(), plan("(drive truck1 main-quay depot1)\n(load c2 truck1 depot1)"));
    expect(r2.error?.literal).toBe("(or (sealed c2) (at truck1 main-quay))");
    const r3 = replayPlan(quay(), plan("(load c1 truck1 main-quay)\n(unload c1 truck1 main-quay)\n(seal c2 depot1)"));
    expect(r3.error?.literal).toBe("(exists (?t - truck) (at ?t depot1))");
  });

  it("a universal precondition names the instance that fails", () => {
    const r = replayPlan(quay(), plan("(inspect depot1)"));
    expect(r.error).toMatchObject({ step: 1, literal: "(sealed c2)" });
  });

  it("a goal disjunction that fails is shown whole", () => {
    const r = replayPlan(quay(), plan("(load c1 truck1 main-quay)"));
    expect(r.error).toMatchObject({ step: 2, kind: "goal", literal: "(or (on-ground c1 depot2) (in c1 barge1))" });
  });

  it("an empty plan is checked against the goal only", () => {
    const r = replayPlan(quay(), []);
    expect(r).toMatchObject({ valid: false, cost: 0, length: 0, error: { step: 1, kind: "goal" } });
  });
});

describe("workshop (forall + when, exists inside when)", () => {
  const m = () => fixtureModel("workshop/domain.pddl", "workshop/shift.pddl");
  it("a valid plan: assign j2 to lathe2 (0), power all (3), run lathe2 (2), assign j1 to press1 (0), run press1 (2)", () => {
    const r = replayPlan(m(), plan("(assign j2 lathe2)\n(power-all)\n(run lathe2)\n(assign j1 press1)\n(run press1)"));
    expect(r).toMatchObject({ valid: true, cost: 7, length: 5 });
  });
  it("running a machine while urgent work waits elsewhere raises the alarm, which the goal forbids", () => {
    const r = replayPlan(m(), plan("(assign j1 press1)\n(run press1)\n(assign j2 lathe2)\n(power-all)\n(run lathe2)"));
    // (run press1) fires the alarm (j2 urgent, not done, not on press1); power-all clears it again
    expect(r.valid).toBe(true);
    const bad = replayPlan(m(), plan("(power-all)\n(assign j2 lathe2)\n(run lathe2)\n(assign j1 press1)\n(run press1)\n(power-down shared-lathe)"));
    expect(bad.error).toMatchObject({ kind: "goal", literal: "(not (alarm))" });
  });
});
