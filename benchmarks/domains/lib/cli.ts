// The command line every scenario generator shares: `--size`, `--seed`, one flag per size
// parameter, `--out FILE` (written atomically) or stdout. Run with `npx tsx .../generate.ts`.
import { pathToFileURL } from "node:url";
import { writeFileAtomic } from "../../../src/util/files.js";
import { SIZE_NAMES, resolveParams, type Scenario, type SizeName } from "./scenario.js";

/** True when the module with this import.meta.url is the script node was started with. */
export function isMain(metaUrl: string): boolean {
  const entry = process.argv[1];
  return entry !== undefined && pathToFileURL(entry).href === metaUrl;
}

export function usage(sc: Scenario): string {
  const lines = [
    `usage: npx tsx benchmarks/domains/${sc.name}/generate.ts [--size S] [--seed N] [--PARAM N ...] [--out FILE]`,
    ``,
    sc.summary,
    ``,
    `  --size S     preset for the size parameters: ${SIZE_NAMES.join(", ")} (default small)`,
    `  --seed N     seed of the pseudo-random choices (default 1); same parameters + seed = same file`,
    `  --out FILE   write the problem to FILE instead of stdout`,
  ];
  for (const p of sc.params) lines.push(`  --${p.name.padEnd(11)} ${p.help} (${p.min}..${p.max})`);
  lines.push(``, `presets:`);
  for (const s of SIZE_NAMES) lines.push(`  ${s.padEnd(7)} ${Object.entries(sc.sizes[s]).map(([k, v]) => `--${k} ${v}`).join(" ")}`);
  return lines.join("\n") + "\n";
}

/** Parses argv and returns the problem text and where to write it; throws on bad flags. */
export function parseGeneratorArgs(sc: Scenario, argv: string[]): { text: string; out: string | null } | { help: string } {
  let size: SizeName = "small";
  let seed = 1;
  let out: string | null = null;
  const overrides: Record<string, number> = {};
  const known = new Set(sc.params.map((p) => p.name));
  for (let i = 0; i < argv.length; i++) {
    const flag = argv[i];
    if (flag === "--help" || flag === "-h") return { help: usage(sc) };
    const value = argv[i + 1];
    if (!flag.startsWith("--") || value === undefined) throw new Error(`expected --FLAG VALUE, found "${argv.slice(i).join(" ")}"`);
    i++;
    const name = flag.slice(2);
    if (name === "size") {
      if (!(SIZE_NAMES as readonly string[]).includes(value)) throw new Error(`--size must be one of ${SIZE_NAMES.join(", ")}, got "${value}"`);
      size = value as SizeName;
    } else if (name === "out") out = value;
    else if (name === "seed" || known.has(name)) {
      if (!/^\d+$/.test(value)) throw new Error(`--${name} expects a non-negative integer, got "${value}"`);
      if (name === "seed") seed = Number(value);
      else overrides[name] = Number(value);
    } else throw new Error(`unknown flag --${name} (see --help)`);
  }
  const params = resolveParams(sc, size, seed, overrides);
  return { text: sc.toPddl(sc.makeInstance(params)), out };
}

/** Entry point of a generate.ts script. */
export function runGenerator(sc: Scenario, argv: string[]): void {
  try {
    const r = parseGeneratorArgs(sc, argv);
    if ("help" in r) process.stdout.write(r.help);
    else if (r.out) writeFileAtomic(r.out, r.text);
    else process.stdout.write(r.text);
  } catch (e) {
    process.stderr.write(`${sc.name} generator: ${(e as Error).message}\n`);
    process.exitCode = 2;
  }
}
