// Architecture check: each pipeline stage imports only earlier stages, src/sat and
// src/proof stand alone, and src/proof never imports src/sat (DESIGN "The pipeline").
import { readdirSync, readFileSync, statSync } from "node:fs";
import { join, relative, resolve, dirname } from "node:path";
import { describe, expect, it } from "vitest";

const SRC = resolve(__dirname, "../../src");

// Stage order; a stage may import itself and any stage listed before it.
const ORDER = ["util", "pddl", "ground", "plan", "analyse", "search", "horizon", "measure", "encode", "optimize", "certify", "report", "bench", "cli"];
// Stand-alone modules: may import only util (and themselves).
const STANDALONE: Record<string, string[]> = { sat: ["util"], proof: ["util"] };

function files(dir: string): string[] {
  const out: string[] = [];
  for (const name of readdirSync(dir)) {
    const p = join(dir, name);
    if (statSync(p).isDirectory()) out.push(...files(p));
    else if (p.endsWith(".ts")) out.push(p);
  }
  return out;
}

function stageOf(file: string): string {
  const rel = relative(SRC, file);
  return rel.includes("/") ? rel.split("/")[0] : "(root)";
}

function allowed(from: string, to: string): boolean {
  if (from === to || to === "util") return true;
  if (from === "(root)") return true; // src/index.ts re-exports the library API
  if (from in STANDALONE) return STANDALONE[from].includes(to);
  if (to === "sat") return ORDER.indexOf(from) >= ORDER.indexOf("encode");
  if (to === "proof") return ORDER.indexOf(from) >= ORDER.indexOf("certify");
  const i = ORDER.indexOf(from);
  const j = ORDER.indexOf(to);
  return i >= 0 && j >= 0 && j <= i;
}

describe("source layering", () => {
  it("every import goes to the same or an earlier stage", () => {
    const violations: string[] = [];
    for (const f of files(SRC)) {
      const text = readFileSync(f, "utf8");
      for (const m of text.matchAll(/^\s*(?:import|export)[^'"]*from\s+["'](\.[^"']+)["']/gm)) {
        const target = resolve(dirname(f), m[1]);
        const to = stageOf(target);
        const from = stageOf(f);
        if (!allowed(from, to)) violations.push(`${relative(SRC, f)} imports ${m[1]} (${from} -> ${to})`);
      }
    }
    expect(violations).toEqual([]);
  });
});
