// Every PDDL construct plumbline reads, parsed into the syntax tree with its positions:
// requirements, type hierarchies and either, constants, predicates, cost functions, ADL
// conditions and effects, init values, goals, metric; names are case-insensitive.
import { describe, expect, it } from "vitest";
import { formulaText, modelFromTexts, parseDomain, parseProblem, type Effect, type Formula } from "../../src/pddl/index.js";

const DOMAIN = `; a comment before everything
(DEFINE (DOMAIN Harbour)            ; names are case-insensitive
  (:REQUIREMENTS :strips :typing :negative-preconditions :equality :adl :action-costs)
  (:types crane truck - machine
          machine - asset
          place)
  (:constants Main-Quay - place)
  (:predicates (at ?m - machine ?p - place) (busy ?m - machine) (road ?a ?b - place))
  (:functions (total-cost) - number
              (dist ?a ?b - place) - number)
  (:action Drive
    :parameters (?T - truck ?from ?to - place)
    :precondition (and (at ?t ?from) (road ?from ?to) (not (= ?from ?to))
                       (or (not (busy ?t)) (imply (busy ?t) (at ?t main-quay)))
                       (exists (?c - crane) (at ?c ?to))
                       (forall (?m - (either crane truck)) (not (busy ?m))))
    :effect (and (not (at ?t ?from)) (at ?t ?to)
                 (forall (?c - crane) (when (at ?c ?to) (busy ?c)))
                 (increase (total-cost) (dist ?from ?to))))
  (:action rest
    :parameters (?m - machine)
    :effect (and (not (busy ?m)) (increase (total-cost) 1)))
  (:action noop :parameters () :precondition ()))`;

const PROBLEM = `(define (problem Small) (:domain harbour)
  (:objects depot - place t1 - truck k1 k2 - crane)
  (:init (at t1 main-quay) (at k1 depot) (road main-quay depot)
         (= (dist main-quay depot) 7) (= (total-cost) 0))
  (:goal (and (at t1 depot) (not (busy k1))))
  (:metric minimize (total-cost)))`;

describe("domain constructs", () => {
  const d = parseDomain(DOMAIN, "harbour.pddl");

  it("reads name, requirements and types (lower-cased)", () => {
    expect(d.name).toBe("harbour");
    expect(d.requirements.map((r) => r.name)).toEqual([":strips", ":typing", ":negative-preconditions", ":equality", ":adl", ":action-costs"]);
    expect(d.requirements[0].pos).toEqual({ file: "harbour.pddl", line: 3, col: 18 });
    expect(d.types.map((t) => [t.name, t.parents])).toEqual([
      ["crane", ["machine"]],
      ["truck", ["machine"]],
      ["machine", ["asset"]],
      ["place", ["object"]],
    ]);
  });

  it("reads constants, predicates and functions with typed parameters", () => {
    expect(d.constants).toMatchObject([{ name: "main-quay", types: ["place"], pos: { line: 7, col: 15 } }]);
    expect(d.predicates.map((p) => [p.name, p.params.map((x) => `${x.name}:${x.types.join("|")}`)])).toEqual([
      ["at", ["?m:machine", "?p:place"]],
      ["busy", ["?m:machine"]],
      ["road", ["?a:place", "?b:place"]],
    ]);
    expect(d.functions.map((f) => [f.name, f.params.length])).toEqual([
      ["total-cost", 0],
      ["dist", 2],
    ]);
    expect(d.hasActionCosts).toBe(true);
  });

  it("reads every condition connective", () => {
    const a = d.actions[0];
    expect(a.name).toBe("drive");
    expect(a.pos).toMatchObject({ line: 11, col: 3 });
    expect(a.params.map((p) => p.name)).toEqual(["?t", "?from", "?to"]);
    const pre = a.pre as Extract<Formula, { kind: "and" }>;
    expect(pre.kind).toBe("and");
    expect(pre.args.map((x) => x.kind)).toEqual(["atom", "atom", "not", "or", "exists", "forall"]);
    expect((pre.args[2] as Extract<Formula, { kind: "not" }>).arg.kind).toBe("eq");
    const or = pre.args[3] as Extract<Formula, { kind: "or" }>;
    expect(or.args.map((x) => x.kind)).toEqual(["not", "imply"]);
    const fa = pre.args[5] as Extract<Formula, { kind: "forall" }>;
    expect(fa.vars[0].types).toEqual(["crane", "truck"]);
    expect(pre.args[0]).toMatchObject({ kind: "atom", pred: "at", pos: { line: 13, col: 24 } });
    expect(formulaText(pre.args[3])).toBe("(or (not (busy ?t)) (imply (busy ?t) (at ?t main-quay)))");
    expect(formulaText(pre.args[0], new Map([["?t", "t1"], ["?from", "depot"]]))).toBe("(at t1 depot)");
    expect(formulaText(fa)).toBe("(forall (?m - (either crane truck)) (not (busy ?m)))");
  });

  it("reads every effect form", () => {
    const eff = d.actions[0].effect as Extract<Effect, { kind: "and" }>;
    expect(eff.effects.map((e) => e.kind)).toEqual(["del", "add", "forall", "cost"]);
    const fa = eff.effects[2] as Extract<Effect, { kind: "forall" }>;
    expect(fa.body.kind).toBe("when");
    expect((eff.effects[3] as Extract<Effect, { kind: "cost" }>).amount).toMatchObject({ kind: "function", name: "dist" });
    const rest = d.actions[1].effect as Extract<Effect, { kind: "and" }>;
    expect((rest.effects[1] as Extract<Effect, { kind: "cost" }>).amount).toMatchObject({ kind: "number", value: 1 });
  });

  it("a missing precondition is null, an empty one is (and), a missing effect is empty", () => {
    expect(d.actions[1].pre).toBeNull();
    expect(d.actions[2].pre).toMatchObject({ kind: "and", args: [] });
    expect(d.actions[2].effect).toMatchObject({ kind: "and", effects: [] });
  });

  it("declares (total-cost) when the domain does not", () => {
    const d2 = parseDomain("(define (domain x) (:predicates (p)) (:action a :effect (and (p) (increase (total-cost) 2))))", "x.pddl");
    expect(d2.functions.map((f) => f.name)).toEqual(["total-cost"]);
    expect(d2.hasActionCosts).toBe(true);
  });

  it("a domain without costs has hasActionCosts false; untyped names are objects", () => {
    const d3 = parseDomain("(define (domain x) (:predicates (p ?x)) (:action a :parameters (?x) :effect (p ?x)))", "x.pddl");
    expect(d3.hasActionCosts).toBe(false);
    expect(d3.actions[0].params[0].types).toEqual(["object"]);
  });
});

describe("problem constructs and the checked model", () => {
  it("reads objects, init facts and values, goal and metric", () => {
    const p = parseProblem(PROBLEM, "small.pddl");
    expect(p.name).toBe("small");
    expect(p.domainName).toBe("harbour");
    expect(p.objects.map((o) => `${o.name}:${o.types[0]}`)).toEqual(["depot:place", "t1:truck", "k1:crane", "k2:crane"]);
    expect(p.init.map((a) => [a.pred, ...a.args].join(" "))).toEqual(["at t1 main-quay", "at k1 depot", "road main-quay depot"]);
    expect(p.initValues.map((v) => [v.fn, v.args.join(" "), v.value])).toEqual([
      ["dist", "main-quay depot", 7],
      ["total-cost", "", 0],
    ]);
    expect(p.goal).toMatchObject({ kind: "and", args: [{ kind: "atom" }, { kind: "not" }] });
    expect(p.metric).not.toBeNull();
  });

  it("resolves objects, type hierarchy (with either) and cost values", () => {
    const m = modelFromTexts(DOMAIN, "harbour.pddl", PROBLEM, "small.pddl");
    const s = m.symbols;
    expect(s.objects).toEqual(["main-quay", "depot", "t1", "k1", "k2"]);
    const names = (spec: string[]) => s.membersOf(spec).map((o) => s.objects[o]);
    expect(names(["machine"])).toEqual(["t1", "k1", "k2"]);
    expect(names(["asset"])).toEqual(["t1", "k1", "k2"]);
    expect(names(["crane", "place"])).toEqual(["main-quay", "depot", "k1", "k2"]);
    expect(names(["object"])).toEqual(s.objects);
    expect(s.isA(s.objectIndex.get("t1")!, ["crane"])).toBe(false);
    expect(s.costValues.get("dist main-quay depot")?.value).toBe(7);
    expect(s.costValues.has("total-cost")).toBe(false);
  });

  it("comments and line breaks anywhere do not matter", () => {
    const squeezed = DOMAIN.replace(/;[^\n]*/g, "").replace(/\s+/g, " ");
    const a = parseDomain(squeezed, "s.pddl");
    const b = parseDomain(DOMAIN.replace(/\n/g, " ; trailing comment\n"), "c.pddl");
    const strip = (x: unknown) => JSON.stringify(x, (k, v) => (k === "pos" || k === "typePos" || k === "file" ? undefined : v));
    expect(strip(a)).toBe(strip(parseDomain(DOMAIN, "h.pddl")));
    expect(strip(b)).toBe(strip(a));
  });
});
