// The `horizon` and `measure` commands end to end on a small PDDL model written here: JSON
// keys, exit codes for bad options and for the state cap, and human-readable output.
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { afterAll, describe, expect, it } from "vitest";
import { cli } from "../support/cli.js";

// A corridor c0..c5 walked for free once a door is unlocked (cost 1); flying c0 → c5 costs 2.
const DOMAIN = `(define (domain corridor)
  (:requirements :strips :typing :negative-preconditions :action-costs)
  (:types cell)
  (:predicates (open) (at ?c - cell) (next ?a ?b - cell) (far ?a ?b - cell))
  (:functions (total-cost) - number)
  (:action unlock :parameters () :precondition (not (open))
    :effect (and (open) (increase (total-cost) 1)))
  (:action walk :parameters (?a ?b - cell) :precondition (and (open) (at ?a) (next ?a ?b))
    :effect (and (not (at ?a)) (at ?b)))
  (:action fly :parameters (?a ?b - cell) :precondition (and (at ?a) (far ?a ?b))
    :effect (and (not (at ?a)) (at ?b) (increase (total-cost) 2))))
`;
const PROBLEM = `(define (problem six) (:domain corridor)
  (:objects c0 c1 c2 c3 c4 c5 - cell)
  (:init (at c0) (next c0 c1) (next c1 c2) (next c2 c3) (next c3 c4) (next c4 c5) (far c0 c5) (= (total-cost) 0))
  (:goal (at c5))
  (:metric minimize (total-cost)))
`;

const dir = mkdtempSync(join(tmpdir(), "plumbline-horizon-"));
const D = join(dir, "domain.pddl");
const P = join(dir, "problem.pddl");
writeFileSync(D, DOMAIN);
writeFileSync(P, PROBLEM);
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe("plumbline horizon", () => {
  it("reports every method with its derivation and the winner (JSON)", async () => {
    const r = await cli(["horizon", D, P, "--json"]);
    expect(r.code).toBe(0);
    const j = r.json();
    expect(j.methods.map((m: { method: string }) => m.method)).toEqual(["cost", "optimal-length", "zero-cost", "compositional", "reachable-states"]);
    expect(j.methods.find((m: { method: string }) => m.method === "cost").value).toBeNull(); // zero-cost walks
    expect(typeof j.upperCost).toBe("number"); // from the first plan
    expect(j.horizon).toBeGreaterThanOrEqual(6); // the only cheapest plan has 6 actions (worked by hand)
    expect(j.methods.some((m: { method: string; value: unknown }) => m.method === j.winner && m.value === j.horizon)).toBe(true);
  });

  it("takes --cost-below and explains itself in plain text", async () => {
    const r = await cli(["horizon", D, P, "--cost-below", "2"]);
    expect(r.code).toBe(0);
    expect(r.stdout).toMatch(/upper cost C\s+2/);
    expect(r.stdout).toMatch(/horizon\s+\d+ steps \(method: /);
    const inf = await cli(["horizon", D, P, "--cost-below", "inf", "--json"]);
    expect(inf.json().upperCost).toBe("Infinity");
    expect(inf.json().winner).not.toBe("cost");
  });

  it("turns the exact search off with --max-optimal-states 0 and names every number in plain text", async () => {
    const off = await cli(["horizon", D, P, "--cost-below", "2", "--max-optimal-states", "0", "--json"]);
    expect(off.code).toBe(0);
    const exact = off.json().methods.find((m: { method: string }) => m.method === "optimal-length");
    expect(exact.value).toBeNull();
    expect(exact.derivation.notApplicable).toMatch(/disabled/);
    // still a completeness threshold: the only plan of cost < 2 has 6 actions (worked by hand)
    expect(off.json().horizon).toBeGreaterThanOrEqual(6);
    const on = await cli(["horizon", D, P, "--cost-below", "2"]);
    expect(on.stdout).toMatch(/optimal-length\s+6\s+fewest actions among plans of the optimal cost 1/); // worked by hand
    expect(on.stdout).not.toMatch(/undefined/);
    const text = await cli(["horizon", D, P, "--cost-below", "2", "--max-optimal-states", "0"]);
    expect(text.stdout).toMatch(/zero-cost\s+\d+\s+k = \d+ positive-cost actions/);
    expect(text.stdout).not.toMatch(/undefined/);
    expect((await cli(["horizon", D, P, "--max-optimal-states", "-1"])).code).toBe(2);
  });

  it("rejects a bad --cost-below with exit code 2 and no stack trace", async () => {
    const r = await cli(["horizon", D, P, "--cost-below", "cheap"]);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/--cost-below/);
    expect(r.stderr).not.toMatch(/\n\s+at /);
  });
});

describe("plumbline measure", () => {
  it("gives exact measures of a small model", async () => {
    const r = await cli(["measure", D, P, "--json"]);
    expect(r.code).toBe(0);
    const j = r.json();
    expect(j.states).toBe(8); // worked by hand: 2 states with the door shut, 6 with it open
    expect(j.optimal).toEqual({ cost: 1, length: 6 }); // worked by hand
    expect(j.diameter.exact).toBe(true);
    for (const k of ["diameter", "subsetDiameter", "sublistDiameter", "recurrenceDiameter", "traversalDiameter"]) expect(j[k]).toHaveProperty("value");
  });

  it("stops with exit code 3 and a clear message past --max-reachable-states", async () => {
    const r = await cli(["measure", D, P, "--max-reachable-states", "3"]);
    expect(r.code).toBe(3);
    expect(r.stderr).toMatch(/more than 3 reachable states/);
    const bad = await cli(["measure", D, P, "--max-reachable-states", "many"]);
    expect(bad.code).toBe(2);
  });
});
