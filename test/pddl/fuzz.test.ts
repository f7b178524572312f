// Fuzzing the front end: random token soup and random mutations of valid models must never
// make parsing, checking, grounding or replay fail with anything but a PlumblineError.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { ground } from "../../src/ground/index.js";
import { modelFromTexts, parseDomain, parseProblem } from "../../src/pddl/index.js";
import { parsePlan, replayPlan } from "../../src/plan/index.js";
import { PlumblineError } from "../../src/util/errors.js";
import { fixture, hanoiProblem } from "../fixtures/frontend/problems.js";

const VOCAB = [
  "(", ")", "(", ")", "(", ")", "define", "domain", "problem", ":domain", ":requirements", ":strips", ":typing", ":adl",
  ":action-costs", ":types", ":constants", ":predicates", ":functions", ":action", ":parameters", ":precondition",
  ":effect", ":objects", ":init", ":goal", ":metric", "minimize", "and", "or", "not", "imply", "exists", "forall",
  "when", "either", "=", "-", "increase", "total-cost", "?x", "?y", "?t", "p", "q", "at", "a", "b", "object", "t",
  "0", "1", "-1", "2.5", ";", "\n", "#", "?", ":", "number", ":durative-action", "decrease", ">=",
];

function only(e: unknown): void {
  if (!(e instanceof PlumblineError)) throw e;
  expect(e.message.length).toBeGreaterThan(0);
}

/** Splits PDDL text into parentheses, words and whitespace, so mutations act on tokens. */
function chunks(text: string): string[] {
  return text.match(/[()]|[^\s()]+|\s+/g) ?? [];
}

const FILES: Array<{ domain: string; problem: string; plan: string }> = [
  { domain: fixture("quay/domain.pddl"), problem: fixture("quay/yard.pddl"), plan: fixture("quay/yard.plan") },
  { domain: fixture("workshop/domain.pddl"), problem: fixture("workshop/shift.pddl"), plan: "(assign j2 lathe2)\n(power-all)\n(run lathe2)\n" },
  { domain: fixture("gripper/domain.pddl"), problem: fixture("gripper/four-balls.pddl"), plan: fixture("gripper/four-balls.plan") },
  { domain: fixture("hanoi/domain.pddl"), problem: hanoiProblem(2), plan: "(move d1 d2 p2)\n" },
];

type Mutation = { kind: "delete" | "duplicate" | "replace" | "swap"; at: number; other: number; word: string };

const mutationArb: fc.Arbitrary<Mutation> = fc.record({
  kind: fc.constantFrom("delete", "duplicate", "replace", "swap"),
  at: fc.nat(),
  other: fc.nat(),
  word: fc.constantFrom(...VOCAB),
});

function mutate(text: string, ms: Mutation[]): string {
  const t = chunks(text);
  for (const m of ms) {
    if (t.length === 0) break;
    const i = m.at % t.length;
    const j = m.other % t.length;
    if (m.kind === "delete") t.splice(i, 1);
    else if (m.kind === "duplicate") t.splice(i, 0, t[i]);
    else if (m.kind === "replace") t[i] = m.word;
    else [t[i], t[j]] = [t[j], t[i]];
  }
  return t.join("");
}

describe("front-end fuzzing", () => {
  it("random token soup only ever raises PlumblineError", () => {
    const soup = fc.array(fc.oneof(fc.constantFrom(...VOCAB), fc.string({ maxLength: 4 })), { maxLength: 80 }).map((ts) => ts.join(" "));
    fc.assert(
      fc.property(soup, soup, (d, p) => {
        for (const f of [() => parseDomain(d, "d.pddl"), () => parseProblem(p, "p.pddl"), () => parsePlan(p, "plan.txt")]) {
          try {
            f();
          } catch (e) {
            only(e);
          }
        }
      }),
      { numRuns: 400 },
    );
  });

  it("a soup wrapped in a valid frame only ever raises PlumblineError", () => {
    const body = fc.array(fc.constantFrom(...VOCAB), { maxLength: 60 }).map((ts) => ts.join(" "));
    fc.assert(
      fc.property(body, body, (a, b) => {
        try {
          const m = modelFromTexts(`(define (domain d) (:predicates (p ?x) (q)) (:action act ${a}))`, "d.pddl", `(define (problem x) (:domain d) (:objects a b) ${b})`, "p.pddl");
          ground(m);
        } catch (e) {
          only(e);
        }
      }),
      { numRuns: 300 },
    );
  });

  it("mutations of valid models only ever raise PlumblineError (parse, ground, replay)", () => {
    fc.assert(
      fc.property(fc.nat(), fc.boolean(), fc.array(mutationArb, { minLength: 1, maxLength: 3 }), (which, inDomain, ms) => {
        const f = FILES[which % FILES.length];
        const domain = inDomain ? mutate(f.domain, ms) : f.domain;
        const problem = inDomain ? f.problem : mutate(f.problem, ms);
        try {
          const m = modelFromTexts(domain, "d.pddl", problem, "p.pddl");
          const task = ground(m);
          const pruned = ground(m, { relevance: true });
          // a grounded task refers only to its own facts, and pruning never adds actions
          for (const a of task.actions) for (const f of [...a.pre, ...a.preNeg, ...a.add, ...a.del]) expect(f).toBeLessThan(task.facts.length);
          expect(pruned.actions.length).toBeLessThanOrEqual(task.actions.length);
          replayPlan(m, parsePlan(f.plan, "plan.txt"), "plan.txt");
        } catch (e) {
          only(e);
        }
      }),
      { numRuns: 400 },
    );
  });

  it("mutations of a valid plan only ever raise PlumblineError", () => {
    const m = modelFromTexts(FILES[0].domain, "d.pddl", FILES[0].problem, "p.pddl");
    fc.assert(
      fc.property(fc.array(mutationArb, { minLength: 1, maxLength: 4 }), (ms) => {
        try {
          const r = replayPlan(m, parsePlan(mutate(FILES[0].plan, ms), "plan.txt"), "plan.txt");
          expect(typeof r.valid).toBe("boolean");
        } catch (e) {
          only(e);
        }
      }),
      { numRuns: 300 },
    );
  });
});
