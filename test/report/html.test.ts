// The bench report page is self-contained: no scripts, no external links, styles or images,
// no http(s) URLs at all; its tables and charts are present and its SVG is well-formed.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { benchReportHtml } from "../../src/report/bench-report.js";
import { META, rec, recordsArb } from "./records.js";
import { checkWellFormed } from "./xml-check.js";


/** Every way a page could reach outside itself. */
function externalRefs(html: string): string[] {
  const found: string[] = [];
  for (const re of [/https?:\/\//gi, /<script\b/gi, /<link\b/gi, /<iframe\b/gi, /<img\b/gi, /\b(?:src|href|action|srcset|xlink:href)\s*=/gi, /url\(/gi, /@import/gi, /\/\/[a-z0-9-]+\.[a-z]{2,}/gi]) {
    for (const m of html.matchAll(re)) found.push(m[0]);
  }
  return found;
}

describe("bench report HTML", () => {
  const records = [
    rec({ instance: "harbour/a", configuration: "sat-forall", cost: 22, lowerBound: 22, horizon: 40, planLength: 14, audit: "valid", auditSeconds: 0.4, proofBytes: 12345, timeline: [{ seconds: 0.2, upper: 30, lower: 0 }, { seconds: 0.9, upper: 22, lower: 22 }] }),
    rec({ instance: "harbour/a", configuration: "astar-landmark-cut", cost: 22, lowerBound: 22, timeline: [{ seconds: 1, upper: 22, lower: 22 }] }),
    rec({ instance: "workshop/b", configuration: "sat-forall", status: "unknown", cost: null, reason: "killed: still running" }),
    rec({ instance: "workshop/b", configuration: "astar-landmark-cut", cost: 9 }),
  ];

  it("has the tables and charts a reader looks for", () => {
    const html = benchReportHtml(records, META);
    expect(html).toContain("<h2>Coverage: instances proven optimal</h2>");
    expect(html).toContain("<h2>Cost agreement</h2>");
    expect(html).toContain("No contradictions");
    expect(html).toContain('aria-label="bounds over time for harbour/a"');
    expect(html).toContain("Plans are only as good as the model");
    expect(html.match(/<svg /g)!.length).toBeGreaterThanOrEqual(3);
    for (const svg of html.match(/<svg [\s\S]*?<\/svg>/g)!) checkWellFormed(svg);
  });

  it("refers to nothing outside itself", () => {
    expect(externalRefs(benchReportHtml(records, META))).toEqual([]);
    fc.assert(
      fc.property(recordsArb, (rs) => {
        expect(externalRefs(benchReportHtml(rs, META))).toEqual([]);
      }),
      { numRuns: 40 },
    );
  });

  it("puts a red alarm first when configurations disagree", () => {
    const bad = [rec({ instance: "h/a", configuration: "sat-forall", cost: 21 }), rec({ instance: "h/a", configuration: "astar-landmark-cut", cost: 22 })];
    const html = benchReportHtml(bad, META);
    const alarm = html.indexOf('<div class="alarm" id="findings">');
    expect(alarm).toBeGreaterThan(0);
    expect(alarm).toBeLessThan(html.indexOf("<h2>Coverage"));
    expect(html).toContain("1 disagreement between configurations — this means a bug");
  });

  it("the external-reference detector itself catches what it should", () => {
    for (const bad of ['<img src="a.png">', '<a href="x">', '<script>1</script>', "background:url(x)", "see https://example.org", '<link rel="stylesheet">']) expect(externalRefs(bad).length).toBeGreaterThan(0);
  });
});
