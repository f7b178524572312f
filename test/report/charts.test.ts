// Charts: every SVG we write is well-formed XML whatever the data (awkward names, empty
// runs, zero times), scales give sensible ticks, and the step lines mean what they say.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { boundsChart, cactusChart, planTimelineChart, tightnessChart } from "../../src/report/charts.js";
import { linearScale, logScale, niceStep, tickLabel } from "../../src/report/scale.js";
import { esc, standaloneSvg } from "../../src/report/svg.js";
import { tightness } from "../../src/report/summary.js";
import { recordsArb, rec } from "./records.js";
import { checkWellFormed } from "./xml-check.js";

describe("scales", () => {
  it("nice steps are 1, 2 or 5 times a power of ten", () => {
    // common practice, no source (the 1-2-5 rule for axis ticks)
    expect(niceStep(10, 5)).toBe(2);
    expect(niceStep(7, 5)).toBe(2);
    expect(niceStep(100, 4)).toBe(50);
    expect(niceStep(0.9, 3)).toBeCloseTo(0.5, 12);
    fc.assert(
      fc.property(fc.double({ min: 1e-6, max: 1e9, noNaN: true }), fc.integer({ min: 1, max: 12 }), (span, n) => {
        const s = niceStep(span, n);
        const m = s / Math.pow(10, Math.floor(Math.log10(s) + 1e-9));
        expect([1, 2, 5, 10].some((k) => Math.abs(m - k) < 1e-6)).toBe(true);
        expect(s * n).toBeGreaterThanOrEqual(span * (1 - 1e-9));
      }),
    );
  });

  it("linear scales cover the data with ticks, log scales use whole decades", () => {
    const x = linearScale(3, 97, 0, 100);
    expect(x.domain[0]).toBeLessThanOrEqual(3);
    expect(x.domain[1]).toBeGreaterThanOrEqual(97);
    expect(x(x.domain[0])).toBe(0);
    expect(x(x.domain[1])).toBe(100);
    const l = logScale(0.3, 250, 0, 300);
    expect(l.ticks).toEqual([0.1, 1, 10, 100, 1000]);
    expect(l(1)).toBeCloseTo(75, 9);
    expect(l(10)).toBeCloseTo(150, 9);
    expect(tickLabel(1e6)).toBe("1e6");
    expect(tickLabel(0.25)).toBe("0.25");
  });
});

describe("SVG output", () => {
  it("escapes the five XML specials", () => {
    // source: XML 1.0 section 2.4 (& and < must be escaped; quotes inside attributes)
    expect(esc(`a<b>&"c'`)).toBe("a&lt;b&gt;&amp;&quot;c&#39;");
  });

  it("every chart is well-formed for random records", () => {
    fc.assert(
      fc.property(recordsArb, fc.double({ min: 0.01, max: 1e4, noNaN: true }), (records, limit) => {
        const configs = [...new Set(records.map((r) => r.configuration))];
        checkWellFormed(cactusChart(records, configs, limit));
        checkWellFormed(tightnessChart(tightness(records), configs));
        for (const inst of new Set(records.map((r) => r.instance))) {
          const rs = records.filter((r) => r.instance === inst);
          checkWellFormed(boundsChart(inst, rs.map((r) => ({ configuration: r.configuration, timeline: r.timeline, end: r.seconds })), rs[0].cost));
        }
      }),
      { numRuns: 120 },
    );
  });

  it("stand-alone files carry the namespace and stay well-formed", () => {
    const svg = standaloneSvg(cactusChart([rec({ instance: "a/b", configuration: "x" })], ["x"], 10));
    expect(svg.startsWith('<?xml version="1.0" encoding="UTF-8"?>\n<svg xmlns="http://www.w3.org/2000/svg" ')).toBe(true);
    checkWellFormed(svg);
  });

  it("the plan timeline has one block per step, in lanes by first argument", () => {
    const steps = [
      { name: "drive", args: ["t1", "a", "b"], cost: 3 },
      { name: "load", args: ["crane<1>", "c1", "t1"], cost: 0 },
      { name: "drive", args: ["t2", "b", "a"], cost: 4 },
    ];
    const svg = planTimelineChart(steps);
    checkWellFormed(svg);
    expect(svg.match(/<rect [^>]*class="step( zero)?"/g)).toHaveLength(3);
    expect(svg.match(/class="step zero"/g)).toHaveLength(1);
    expect(svg).toContain("action 3: (drive t2 b a), cost 4, total so far 7");
    expect(svg).toContain(">crane&lt;1&gt;</text>");
  });

  it("the coverage step line rises once per proven instance", () => {
    const rs = [1, 2, 4].map((s, i) => rec({ instance: `d/${i}`, configuration: "c", seconds: s }));
    rs.push(rec({ instance: "d/x", configuration: "c", status: "unknown", cost: null, seconds: 3 }));
    const svg = cactusChart(rs, ["c"], 10);
    const d = /<path d="([^"]+)" class="series"/.exec(svg)![1];
    const ys = [...d.matchAll(/L[\d.]+ ([\d.]+)/g)].map((m) => Number(m[1]));
    expect(new Set(ys).size).toBe(4); // levels 0, 1, 2 and 3 proven
    expect(svg).toContain("c: 3 proven optimal");
  });
});
