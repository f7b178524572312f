// The positioned JSON reader: same values as the platform's JSON.parse on random documents,
// and errors that name the exact line:col of the first bad character.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { parseJsonSource } from "../../src/bench/json-source.js";
import { PlumblineError } from "../../src/util/errors.js";
import { errorOf as errorOfCall } from "./support.js";

const errorOf = (text: string) => errorOfCall(() => parseJsonSource(text, "s.json"));

describe("parseJsonSource", () => {
  it("reads exactly what JSON.parse reads", () => {
    // source: ECMA-404 JSON grammar, as implemented by the platform's JSON.parse (reference)
    fc.assert(
      fc.property(fc.json(), fc.constantFrom("", " ", "\n\t "), (text, pad) => {
        expect(parseJsonSource(pad + text + pad, "x.json").value).toEqual(JSON.parse(text));
      }),
      { numRuns: 300 },
    );
  });

  it("rejects what JSON.parse rejects", () => {
    // source: ECMA-404 (no trailing commas, no single quotes, no comments, no bare words)
    for (const bad of ['{"a":1,}', "[1,]", "{'a':1}", "[1] // c", "tru", '{"a" 1}', "01", "[1 2]", '"a\nb"', "-"]) {
      expect(() => JSON.parse(bad)).toThrow();
      expect(() => parseJsonSource(bad, "s.json")).toThrow(PlumblineError);
    }
  });

  it("names line and column of a syntax error", () => {
    const e = errorOf('{\n  "entries": [\n    { "seed": 1, }\n  ]\n}');
    expect(e.pos).toEqual({ file: "s.json", line: 3, col: 18 });
    expect(e.message).toMatch(/^s\.json:3:18: invalid JSON: expected a string, found '\}'/);
    expect(errorOf('{"a": 1').pos).toMatchObject({ line: 1, col: 8 });
  });

  it("refuses a key given twice in one object", () => {
    expect(errorOf('{"a": 1,\n "a": 2}').pos).toMatchObject({ line: 2, col: 2 });
  });

  it("remembers where values sit", () => {
    const src = parseJsonSource('{\n  "list": [\n    {"x": 1},\n    {"y":   2}\n  ]\n}', "p.json");
    const root = src.value as { list: Array<Record<string, number>> };
    expect(src.posOf(root.list[1])).toEqual({ file: "p.json", line: 4, col: 5 });
    expect(src.posOf(root.list[1], "y")).toEqual({ file: "p.json", line: 4, col: 13 });
    expect(src.posOf(root, "list")).toEqual({ file: "p.json", line: 2, col: 11 });
  });
});
