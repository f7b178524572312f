// Every error path of the problem parser and of checking a problem against its domain:
// message and file:line:col (the « marks where the error must point).
import { describe, it } from "vitest";
import { modelFromTexts, parseProblem } from "../../src/pddl/index.js";
import { expectPlumblineError, marked } from "./marker.js";

const DOMAIN = `(define (domain d)
  (:requirements :typing :action-costs)
  (:types place thing)
  (:predicates (at ?t - thing ?p - place) (link ?a ?b - place))
  (:functions (total-cost) - number (dist ?a ?b - place) - number)
  (:action go :parameters (?t - thing ?a ?b - place)
    :precondition (and (at ?t ?a) (link ?a ?b))
    :effect (and (not (at ?t ?a)) (at ?t ?b) (increase (total-cost) (dist ?a ?b)))))`;

/** A problem whose sections are `body`. */
const prob = (body: string) => `(define (problem p) (:domain d)
  (:objects a b - place box - thing)
  ${body})`;

type Case = [label: string, src: string, code: string, message: RegExp];

const CASES: Case[] = [
  ["empty problem file", "  «", "parse", /^expected '\(define \(problem NAME\) …\)', found end of file$/],
  ["domain given as problem", "(define («domain d))", "parse", /expected 'problem', found 'domain'/],
  ["missing :domain", "«(define (problem p) (:goal (and)))", "parse", /expected a '\(:domain NAME\)' section in the problem/],
  ["missing :goal", "«(define (problem p) (:domain d))", "parse", /expected a '\(:goal …\)' section in the problem/],
  ["wrong domain name", "(define (problem p) (:domain «dd) (:goal (and)))", "semantic", /problem is for domain 'dd', but dom\.pddl defines domain 'd'/],
  ["unknown section", prob("(«:inits (at box a)) (:goal (and))"), "parse", /expected a problem section \(:domain, .*\), found ':inits'/],
  ["constraints refused", prob("(«:constraints (and)) (:goal (and))"), "unsupported", /state-trajectory constraints \(:constraints\) are not supported/],
  ["section twice", prob("(:init) («:init) (:goal (and))"), "parse", /section ':init' appears twice \(first at 3:4\)/],
  ["unknown object type", "(define (problem p) (:domain d) (:objects x - «plcae) (:goal (and)))", "semantic", /unknown type 'plcae'/],
  ["unknown predicate in init", prob("(:init «(att box a)) (:goal (and))"), "semantic", /unknown predicate 'att'/],
  ["init arity", prob("(:init «(at box)) (:goal (and))"), "semantic", /predicate 'at' takes 2 arguments, found 1/],
  ["unknown object in init", prob("(:init «(at box c)) (:goal (and))"), "semantic", /unknown object 'c'/],
  ["variable in init", prob("(:init (at box «?x)) (:goal (and))"), "parse", /expected an object name, found '\?x'/],
  ["negative init literal", prob("(:init «(not (at box a))) (:goal (and))"), "parse", /negative literals are not allowed in :init/],
  ["timed initial literal", prob("(:init «(at 10 (at box a))) (:goal (and))"), "unsupported", /timed initial literals '\(at TIME …\)' are not supported/],
  ["negative cost value", prob("(:init (= (dist a b) «-4)) (:goal (and))"), "semantic", /cost value \(dist a b\) must be a non-negative integer, found -4/],
  ["fractional cost value", prob("(:init (= (dist a b) «2.5)) (:goal (and))"), "semantic", /cost value \(dist a b\) must be a non-negative integer, found 2\.5/],
  ["cost value given twice", prob("(:init (= (dist a b) 1) «(= (dist a b) 2)) (:goal (and))"), "semantic", /\(dist a b\) is given two values \(1 at 3:24, and 2\)/],
  ["unknown function in init", prob("(:init «(= (length a) 1)) (:goal (and))"), "semantic", /unknown function 'length'/],
  ["function arity in init", prob("(:init «(= (dist a) 1)) (:goal (and))"), "semantic", /function 'dist' takes 2 arguments, found 1/],
  ["value is not a number", prob("(:init (= (dist a b) «far)) (:goal (and))"), "parse", /expected a number, found 'far'/],
  ["unknown object in goal", prob("(:goal (at box «c))"), "semantic", /unknown object 'c'/],
  ["unknown predicate in goal", prob("(:goal (and «(att box a)))"), "semantic", /unknown predicate 'att'/],
  ["free variable in goal", prob("(:goal (at box «?p))"), "semantic", /variable '\?p' is not declared here/],
  ["two goal formulas", prob("(:goal (and) «(and))"), "parse", /expected '\)' to end \(:goal …\), found '\(and …\)'/],
  ["metric maximize", prob("(:goal (and)) (:metric «maximize (total-cost))"), "unsupported", /metric 'maximize' is not supported/],
  ["metric on something else", prob("(:goal (and)) (:metric minimize «(total-time))"), "unsupported", /metric '\(total-time …\)' is not supported; only \(:metric minimize \(total-cost\)\)/],
  ["metric direction misspelt", prob("(:goal (and)) (:metric «minimise (total-cost))"), "parse", /expected 'minimize', found 'minimise'/],
];

describe("problem errors name file:line:col, what was expected and what was found", () => {
  for (const [label, src, code, message] of CASES) {
    it(label, () => {
      const m = marked(src);
      expectPlumblineError(() => modelFromTexts(DOMAIN, "dom.pddl", m.text, "prob.pddl"), { code, message, file: "prob.pddl", line: m.line, col: m.col });
    });
  }

  it("parseProblem alone does not need the domain", () => {
    const p = parseProblem(prob("(:init (at box a)) (:goal (at box b))"), "prob.pddl");
    expectPlumblineError(() => modelFromTexts(DOMAIN.replace("(domain d)", "(domain e)"), "dom.pddl", prob("(:goal (and))"), "prob.pddl"), {
      code: "semantic",
      message: /problem is for domain 'd', but dom\.pddl defines domain 'e'/,
      file: "prob.pddl",
      line: 1,
      col: 30,
    });
    void p;
  });
});
