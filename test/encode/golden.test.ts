// Golden CNFs: each encoding on each fixture must reproduce encodings/golden/<id>.<fixture>.cnf
// byte for byte (changing an encoding is deliberate: new id or new golden), regeneration is
// deterministic, and the golden files themselves mean what the fixtures say.
import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { STEP_ENCODINGS } from "../../src/encode/index.js";
import { cheapestWithin } from "../support/reference.js";
import { encodeFixture, goldenFile, loadFixtures } from "./golden.js";
import { Oracle } from "./oracle.js";

const fixtures = loadFixtures();

/** A deliberately naive DIMACS reader, independent of the writer under test. */
function readDimacs(text: string): { numVars: number; clauses: Int32Array[]; comments: string[] } {
  const comments: string[] = [];
  const clauses: Int32Array[] = [];
  let numVars = -1;
  let declared = -1;
  for (const line of text.split("\n")) {
    if (line.startsWith("c")) comments.push(line.slice(2));
    else if (line.startsWith("p cnf ")) [numVars, declared] = line.slice(6).split(" ").map(Number);
    else if (line.trim() !== "") {
      const lits = line.trim().split(/\s+/).map(Number);
      expect(lits[lits.length - 1]).toBe(0);
      clauses.push(Int32Array.from(lits.slice(0, -1)));
    }
  }
  expect(clauses.length).toBe(declared);
  return { numVars, clauses, comments };
}

// by hand: harbour — dock (2) + load (3) + undock (1) = 6 in 3 steps; crane-yard — lift crate1 (1),
// free the crane (0), lift crate2 (1) = 2 in 3 steps. source: worked by hand from fixture.json
const handOptimum: Record<string, number> = { harbour: 6, "crane-yard": 2 };

describe("golden CNFs", () => {
  for (const fx of fixtures) {
    for (const id of STEP_ENCODINGS) {
      it(`${id} on ${fx.name} equals its golden file byte for byte`, () => {
        const golden = readFileSync(goldenFile(id, fx), "utf8");
        expect(encodeFixture(id, fx).toDimacs()).toBe(golden);
      });

      it(`${id} on ${fx.name}: the golden file has the fixture's optimum`, () => {
        const { numVars, clauses, comments } = readDimacs(readFileSync(goldenFile(id, fx), "utf8"));
        const bound = comments.find((c) => c.startsWith("bound "))!;
        const enable = Number(/enable=(\d+)/.exec(bound)![1]);
        const bits = /bits=([\d,]+)/.exec(bound)![1].split(",").map(Number);
        const assume = (B: number) => [enable, ...bits.map((b, j) => (Math.floor(B / 2 ** j) % 2 ? b : -b))];
        const oracle = new Oracle({ numVars, clauses });
        const opt = handOptimum[fx.name];
        expect(cheapestWithin(fx.task, fx.steps)).toBe(opt); // source: reference exhaustive search
        expect(oracle.solve(assume(opt))).not.toBeNull();
        expect(oracle.solve(assume(opt - 1))).toBeNull();
      });
    }
  }

  it("regenerating is deterministic (fresh copies of the task, every encoding)", () => {
    for (const fx of fixtures) {
      for (const id of STEP_ENCODINGS) {
        const a = encodeFixture(id, fx);
        const b = encodeFixture(id, structuredClone(fx));
        const text = a.toDimacs();
        expect(b.toDimacs()).toBe(text);
        const chunks: string[] = [];
        a.writeDimacs((s) => chunks.push(s));
        expect(chunks.join("")).toBe(text);
        expect(b.params).toEqual(a.params);
        expect(JSON.parse(JSON.stringify(a.params))).toEqual(a.params);
      }
    }
  });

  it("forall-2 uses a chain and cost cliques on crane-yard, forall-1 pairs only", () => {
    const yard = fixtures.find((f) => f.name === "crane-yard")!;
    expect(encodeFixture("forall-2", yard).stats.chainFamilies).toBeGreaterThan(0);
    expect(encodeFixture("forall-2", yard).stats.costCliques).toBe(3);
    expect(encodeFixture("forall-1", yard).stats.chainFamilies).toBeUndefined();
  });
});
