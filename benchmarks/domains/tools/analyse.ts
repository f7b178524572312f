// Prints the exact figures of generated instances from the scenario's own explicit model:
// reachable states, cheapest plan, shortest plan. Usage:
//   npx tsx benchmarks/domains/tools/analyse.ts SCENARIO [--size S] [--seeds A..B] [--PARAM N ...]
import { SIZE_NAMES, resolveParams, scenarioByName, type SizeName } from "../index.js";
import { StateCapError } from "../lib/explicit.js";
import { analyseInstance } from "./figures.js";

const [name, ...rest] = process.argv.slice(2);
if (!name) {
  process.stderr.write("usage: analyse.ts SCENARIO [--size S] [--seeds A..B] [--cap N] [--PARAM N ...]\n");
  process.exit(2);
}
const sc = scenarioByName(name);
let size: SizeName = "small";
let seeds: [number, number] = [1, 1];
let cap = 2_000_000;
const overrides: Record<string, number> = {};
for (let i = 0; i < rest.length; i += 2) {
  const flag = rest[i].replace(/^--/, "");
  const v = rest[i + 1];
  if (flag === "size" && (SIZE_NAMES as readonly string[]).includes(v)) size = v as SizeName;
  else if (flag === "seeds") {
    const m = /^(\d+)(?:\.\.(\d+))?$/.exec(v);
    if (!m) throw new Error(`--seeds A..B, got ${v}`);
    seeds = [Number(m[1]), Number(m[2] ?? m[1])];
  } else if (flag === "cap") cap = Number(v);
  else overrides[flag] = Number(v);
}
for (let seed = seeds[0]; seed <= seeds[1]; seed++) {
  const p = resolveParams(sc, size, seed, overrides);
  let f: ReturnType<typeof analyseInstance>;
  try {
    f = analyseInstance(sc, p, cap);
  } catch (e) {
    if (!(e instanceof StateCapError)) throw e;
    process.stdout.write(`seed ${seed}: ${e.message} (raise --cap)\n`);
    continue;
  }
  process.stdout.write(
    `seed ${seed}: states ${f.states} optimal ${f.optimalCost} (len ${f.optimalLength}) shortest ${f.shortestLength}` +
      ` cheapest@shortest ${f.cheapestAtShortestLength} longer=${f.cheapestLongerThanShortest} ${f.seconds.toFixed(2)}s\n`,
  );
}
