// Every error path of the domain parser: the message says what was expected and what was
// found, and the position (file:line:col) points at the offending text (marked « below).
import { describe, it } from "vitest";
import { parseDomain } from "../../src/pddl/index.js";
import { expectPlumblineError, marked } from "./marker.js";

const HEAD = `(define (domain d)
  (:requirements :typing :action-costs)
  (:types place thing)
  (:predicates (at ?t - thing ?p - place) (link ?a ?b - place))
  (:functions (total-cost) - number (dist ?a ?b - place) - number)
`;

/** A domain with one action whose text is `action`. */
const withAction = (action: string) => `${HEAD}  ${action})`;

type Case = [label: string, src: string, code: string, message: RegExp];

const CASES: Case[] = [
  ["empty file", "«", "parse", /^expected '\(define \(domain NAME\) …\)', found end of file$/],
  ["not define", "«(defin (domain d))", "parse", /expected '\(define \(domain NAME\) …\)', found '\(defin …\)'/],
  ["content after define", "(define (domain d))\n«(extra)", "parse", /expected end of file after the \(define …\) block, found '\(extra …\)'/],
  ["problem given as domain", "(define («problem p))", "parse", /expected 'domain', found 'problem'/],
  ["missing domain name", "(define (domain «))", "parse", /expected the domain name, found '\)'/],
  ["unclosed parenthesis", "(define (domain d)\n  (:predicates (p)\n«", "parse", /expected '\)' to close the '\(' opened at 2:3, found end of file/],
  ["stray closing parenthesis", "(define (domain d))«)", "parse", /unexpected '\)' with no matching '\('/],
  ["bad character", "(define (domain «d#1))", "parse", /unexpected character '#' in 'd#1'/],
  ["bare question mark", "(define (domain d) (:predicates (p «?)))", "parse", /expected a variable name after '\?', found '\?'/],
  ["section is not a keyword", "(define (domain d) («predicates (p)))", "parse", /expected a section keyword such as ':action', found 'predicates'/],
  ["unknown section", "(define (domain d) («:predicate (p)))", "parse", /expected a domain section \(:requirements, .*\), found ':predicate'/],
  ["durative action", "(define (domain d) («:durative-action a))", "unsupported", /durative actions \(:durative-action\) are not supported/],
  ["derived predicate", "(define (domain d) («:derived (p) (q)))", "unsupported", /derived predicates \(:derived\) are not supported/],
  ["unknown requirement", "(define (domain d) (:requirements :strips «:stirps))", "parse", /unknown requirement ':stirps'; expected one of :strips/],
  ["numeric fluents requirement", "(define (domain d) (:requirements «:numeric-fluents))", "unsupported", /requirement :numeric-fluents: numeric fluents are not supported/],
  ["durative requirement", "(define (domain d) (:requirements «:durative-actions))", "unsupported", /requirement :durative-actions: durative actions are not supported/],
  ["preferences requirement", "(define (domain d) (:requirements «:preferences))", "unsupported", /requirement :preferences: preferences are not supported/],
  ["requirement not a keyword", "(define (domain d) (:requirements «strips))", "parse", /expected a requirement such as ':typing', found 'strips'/],
  ["section twice", "(define (domain d) (:predicates (p)) («:predicates (q)))", "parse", /section ':predicates' appears twice \(first at 1:21\)/],
  ["type cycle", "(define (domain d) (:types «a - b b - a))", "semantic", /type hierarchy has a cycle: a - b - a/],
  ["type before name", "(define (domain d) (:types place) (:constants «- place))", "parse", /expected a constant name before '-', found '-'/],
  ["missing type after dash", "(define (domain d) (:types place) (:constants a -«))", "parse", /expected a type name or \(either …\) after '-', found '\)'/],
  ["empty either", "(define (domain d) (:types place) (:constants a - (either«)))", "parse", /expected a type name in \(either …\), found '\)'/],
  ["variable in constants", "(define (domain d) (:constants «?x))", "parse", /expected a constant name or '-', found '\?x'/],
  ["unknown type of constant", "(define (domain d) (:types place) (:constants a - «plaec))", "semantic", /unknown type 'plaec'/],
  ["duplicate predicate", "(define (domain d) (:predicates (p) «(p ?x)))", "semantic", /predicate 'p' is declared twice \(first at 1:33\)/],
  ["predicate without name", "(define (domain d) (:predicates («?x)))", "parse", /expected a predicate name, found '\?x'/],
  ["duplicate parameter in predicate", "(define (domain d) (:predicates (p ?x «?x)))", "semantic", /parameter '\?x' is declared twice/],
  ["object fluent", "(define (domain d) (:types place) (:functions (where) - «place))", "unsupported", /function type 'place': object fluents are not supported/],
  ["duplicate action", withAction("(:action a :effect (at ?t ?p)) «(:action a)").replace("(at ?t ?p)", "()"), "semantic", /action 'a' is declared twice \(first at /],
  ["unknown action key", withAction("(:action a «:vars (?x))"), "parse", /expected ':parameters', ':precondition' or ':effect', found ':vars'/],
  ["action key twice", withAction("(:action a :effect () «:effect ())"), "parse", /':effect' appears twice in action 'a'/],
  ["duplicate action parameter", withAction("(:action a :parameters (?x - place «?x - thing))"), "semantic", /parameter '\?x' is declared twice/],
  ["unknown parameter type", withAction("(:action a :parameters (?x - «plcae))"), "semantic", /unknown type 'plcae'/],
  ["unknown predicate", withAction("(:action a :parameters (?x - place) :precondition «(lnk ?x ?x))"), "semantic", /unknown predicate 'lnk'/],
  ["wrong arity", withAction("(:action a :parameters (?x - place) :precondition «(link ?x))"), "semantic", /predicate 'link' takes 2 arguments, found 1/],
  ["undeclared variable", withAction("(:action a :parameters (?x - place) :precondition (link ?x «?y))"), "semantic", /variable '\?y' is not declared here/],
  ["unknown constant", withAction("(:action a :parameters (?x - place) :precondition (link ?x «harbour))"), "semantic", /'harbour' is not a declared constant/],
  ["atom is not a formula", withAction("(:action a :precondition «link)"), "parse", /expected a precondition formula '\(…\)', found 'link'/],
  ["variable as head", withAction("(:action a :precondition («?x))"), "parse", /expected a predicate name or a connective .*, found '\?x'/],
  ["numeric comparison", withAction("(:action a :parameters (?a ?b - place) :precondition «(>= (dist ?a ?b) 3))"), "unsupported", /numeric condition '\(>= …\)': numeric fluents are not supported/],
  ["preference", withAction("(:action a :precondition «(preference p1 (and)))"), "unsupported", /preferences are not supported/],
  ["when in a condition", withAction("(:action a :precondition («when (and) (and)))"), "parse", /'when' is an effect, not a precondition condition/],
  ["not with two arguments", withAction("(:action a :parameters (?x - place) :precondition (not (link ?x ?x) «(link ?x ?x)))"), "parse", /expected '\)' to end \(not …\), found '\(link …\)'/],
  ["imply with one argument", withAction("(:action a :precondition (imply (and)«))"), "parse", /expected a second formula in \(imply …\), found '\)'/],
  ["quantifier without variables", withAction("(:action a :precondition (forall «(at ?t ?p)))").replace("«(at ?t ?p)", "«?t (and)"), "parse", /expected a variable list '\(\?x - type …\)' after 'forall', found '\?t'/],
  ["function term as argument", withAction("(:action a :parameters (?a ?b - place) :precondition (link «(dist ?a ?b) ?b))"), "unsupported", /function terms are numeric fluents, which are not supported/],
  ["or in an effect", withAction("(:action a :effect («or (and) (and)))"), "parse", /'or' is a condition, not an effect/],
  ["not of a conjunction in an effect", withAction("(:action a :effect (not «(and)))"), "parse", /expected an atom '\(predicate …\)' after 'not' in an effect, found '\(and …\)'/],
  ["decrease", withAction("(:action a :effect «(decrease (total-cost) 1))"), "unsupported", /numeric effect 'decrease': numeric fluents are not supported/],
  ["increase of another fluent", withAction("(:action a :parameters (?a ?b - place) :effect (increase «(dist ?a ?b) 1))"), "unsupported", /numeric fluent '\(dist …\)': only \(increase \(total-cost\) …\) is supported/],
  ["negative cost", withAction("(:action a :effect (increase (total-cost) «-2))"), "semantic", /action cost must be a non-negative integer, found negative -2/],
  ["fractional cost", withAction("(:action a :effect (increase (total-cost) «1.5))"), "semantic", /action cost must be a non-negative integer, found 1\.5/],
  ["arithmetic cost", withAction("(:action a :effect (increase (total-cost) «(+ 1 2)))"), "unsupported", /arithmetic cost expression '\(\+ …\)' is not supported/],
  ["unknown cost function", withAction("(:action a :effect (increase (total-cost) «(length)))"), "semantic", /unknown function 'length'/],
  ["cost function arity", withAction("(:action a :parameters (?a - place) :effect (increase (total-cost) «(dist ?a)))"), "semantic", /function 'dist' takes 2 arguments, found 1/],
  ["conditional cost", withAction("(:action a :effect (when (and) «(increase (total-cost) 1)))"), "unsupported", /inside 'forall' or 'when' \(a conditional action cost\) is not supported/],
  ["cost that is not a number", withAction("(:action a :effect (increase (total-cost) «?x))"), "parse", /expected a cost: a number or \(function \?args …\), found '\?x'/],
  ["nesting too deep", `(define (domain d) (:action a :precondition ${"(and ".repeat(498)}«(and${")".repeat(499)}))`, "parse", /lists nested more than 500 deep/],
];

describe("domain parse errors name file:line:col, what was expected and what was found", () => {
  for (const [label, src, code, message] of CASES) {
    it(label, () => {
      const m = marked(src);
      expectPlumblineError(() => parseDomain(m.text, "dom.pddl"), { code, message, file: "dom.pddl", line: m.line, col: m.col });
    });
  }
});
