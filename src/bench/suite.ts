// Reads a benchmark suite: a JSON file of (domain, problem, configuration) entries, generator
// entries (scenario + size + seed) and included directories, or a directory tree of PDDL.
// Every mistake is a PlumblineError naming the suite file and line:col.
import { existsSync, statSync } from "node:fs";
import { basename, dirname, resolve } from "node:path";
import { PlumblineError } from "../util/errors.js";
import { readText } from "../util/files.js";
import { parseJsonSource, type Json } from "./json-source.js";
import { instancesInDirectory } from "./suite-dir.js";
import { scenarioNames, SIZE_WORDS, type GeneratorSpec } from "./generate.js";

export interface InstanceSpec {
  /** Unique display name, e.g. "harbour/problem-02" or "harbour/small-s3". */
  instance: string;
  /** Group for per-domain tables. */
  domain: string;
  /** Absolute paths (filled in by materialiseGenerated for generator entries). */
  domainFile: string;
  problemFile: string;
  /** Configurations named by the entry; null = the suite's or the command line's. */
  configurations: string[] | null;
  generator?: GeneratorSpec;
}

export interface Suite {
  name: string;
  file: string;
  kind: "json" | "directory";
  instances: InstanceSpec[];
  configurations: string[] | null;
  timeLimit: number | null;
  memoryLimit: number | null;
  /** Things skipped on the way (unpaired problem files, ...). */
  warnings: string[];
}

const ENTRY_KEYS = new Set(["domain", "problem", "name", "group", "configuration", "configurations", "scenario", "size", "seed", "seeds", "params", "directory"]);
const SUITE_KEYS = new Set(["name", "description", "configurations", "timeLimit", "memoryLimit", "entries"]);

/** Loads a suite from a JSON file or a directory; `known` lists the valid configuration names. */
export function loadSuite(path: string, known: readonly string[]): Suite {
  const abs = resolve(path);
  if (!existsSync(abs)) throw new PlumblineError("io", `cannot read suite ${path}: no such file or directory`);
  if (statSync(abs).isDirectory()) {
    const { instances, warnings } = instancesInDirectory(abs, basename(abs));
    if (instances.length === 0) throw new PlumblineError("semantic", `${path}: no problems found (expected folders holding domain.pddl and problem files, or domain-NN.pddl/problem-NN.pddl pairs)`);
    return { name: basename(abs), file: abs, kind: "directory", instances: instances.map((i) => ({ ...i, configurations: null })), configurations: null, timeLimit: null, memoryLimit: null, warnings };
  }
  return parseSuite(readText(abs), abs, known, path);
}

/** Parses suite JSON text; relative paths are resolved against the file's folder. */
export function parseSuite(text: string, file: string, known: readonly string[], displayName = file): Suite {
  const src = parseJsonSource(text, displayName);
  const root = src.value;
  const base = dirname(resolve(file));
  const err = (container: object, key: string | number | undefined, msg: string): never => {
    throw new PlumblineError("semantic", msg, src.posOf(container, key));
  };
  const keyErr = (container: object, key: string, msg: string): never => {
    throw new PlumblineError("semantic", msg, src.keyPosOf(container, key));
  };
  let entries: Json[];
  let top: { [k: string]: Json } | null = null;
  if (Array.isArray(root)) entries = root;
  else if (root !== null && typeof root === "object") {
    top = root;
    for (const k of Object.keys(top)) if (!SUITE_KEYS.has(k)) keyErr(top, k, `unknown suite key "${k}" (expected one of ${[...SUITE_KEYS].join(", ")})`);
    if (!Array.isArray(top.entries)) return err(top, "entries" in top ? "entries" : undefined, `expected "entries": an array of suite entries`);
    entries = top.entries;
  } else return err({}, undefined, "expected a suite object { \"entries\": [...] } or an array of entries");

  const configList = (container: { [k: string]: Json }, key: string): string[] => {
    const v = container[key];
    const names = typeof v === "string" ? [v] : Array.isArray(v) && v.every((x) => typeof x === "string") && v.length > 0 ? (v as string[]) : err(container, key, `expected "${key}" to be a configuration name or a non-empty list of names`);
    for (const n of names) if (!known.includes(n)) err(container, key, `unknown configuration "${n}" (known: ${known.join(", ")})`);
    return names;
  };
  const posNumber = (container: { [k: string]: Json }, key: string): number | null => {
    if (!(key in container)) return null;
    const v = container[key];
    if (typeof v !== "number" || !(v > 0)) err(container, key, `expected "${key}" to be a positive number`);
    return v as number;
  };

  const suite: Suite = {
    name: top && typeof top.name === "string" ? top.name : basename(file).replace(/\.json$/i, ""),
    file: resolve(file),
    kind: "json",
    instances: [],
    configurations: top && "configurations" in top ? configList(top, "configurations") : null,
    timeLimit: top ? posNumber(top, "timeLimit") : null,
    memoryLimit: top ? posNumber(top, "memoryLimit") : null,
    warnings: [],
  };

  entries.forEach((entry, index) => {
    if (entry === null || typeof entry !== "object" || Array.isArray(entry)) return err((entries as object), index, `entry ${index + 1}: expected an object`);
    const e = entry;
    for (const k of Object.keys(e)) if (!ENTRY_KEYS.has(k)) keyErr(e, k, `entry ${index + 1}: unknown key "${k}" (expected domain/problem, scenario/size/seed(s)/params, or directory, with optional configuration(s), name, group)`);
    if ("configuration" in e && "configurations" in e) err(e, "configurations", `entry ${index + 1}: give "configuration" or "configurations", not both`);
    const configs = "configuration" in e ? configList(e, "configuration") : "configurations" in e ? configList(e, "configurations") : null;
    const str = (key: string): string => (typeof e[key] === "string" && (e[key] as string).length > 0 ? (e[key] as string) : err(e, key in e ? key : undefined, `entry ${index + 1}: expected "${key}" to be a non-empty string`));
    const fileAt = (key: string): string => {
      const p = resolve(base, str(key));
      if (!existsSync(p) || !statSync(p).isFile()) err(e, key, `entry ${index + 1}: ${key} file ${str(key)} not found (paths are relative to the suite file)`);
      return p;
    };
    const kinds = ["problem" in e || "domain" in e, "scenario" in e, "directory" in e].filter(Boolean).length;
    if (kinds !== 1) err(e, undefined, `entry ${index + 1}: expected exactly one of domain+problem, scenario, or directory`);

    if ("directory" in e) {
      const dir = resolve(base, str("directory"));
      if (!existsSync(dir) || !statSync(dir).isDirectory()) err(e, "directory", `entry ${index + 1}: directory ${str("directory")} not found`);
      const found = instancesInDirectory(dir, typeof e.group === "string" ? e.group : basename(dir));
      if (found.instances.length === 0) err(e, "directory", `entry ${index + 1}: no problems found under ${str("directory")}`);
      suite.warnings.push(...found.warnings);
      for (const i of found.instances) suite.instances.push({ ...i, configurations: configs });
    } else if ("scenario" in e) {
      const scenario = str("scenario");
      const names = scenarioNames();
      if (!names.includes(scenario)) err(e, "scenario", `entry ${index + 1}: unknown scenario "${scenario}" (known: ${names.join(", ") || "none found under benchmarks/domains"})`);
      const size = "size" in e ? str("size") : "small";
      if (!SIZE_WORDS.includes(size)) err(e, "size", `entry ${index + 1}: size must be one of ${SIZE_WORDS.join(", ")}, found "${size}"`);
      if ("seed" in e && "seeds" in e) err(e, "seeds", `entry ${index + 1}: give "seed" or "seeds", not both`);
      const seedOk = (v: Json) => typeof v === "number" && Number.isInteger(v) && v >= 0;
      const seeds: number[] = "seeds" in e ? (Array.isArray(e.seeds) && e.seeds.length > 0 && e.seeds.every(seedOk) ? (e.seeds as number[]) : err(e, "seeds", `entry ${index + 1}: expected "seeds" to be a non-empty list of non-negative integers`)) : "seed" in e ? (seedOk(e.seed) ? [e.seed as number] : err(e, "seed", `entry ${index + 1}: expected "seed" to be a non-negative integer`)) : [1];
      const params: Record<string, number> = {};
      if ("params" in e) {
        const p = e.params;
        if (p === null || typeof p !== "object" || Array.isArray(p)) return err(e, "params", `entry ${index + 1}: expected "params" to be an object of integer generator parameters`);
        for (const [k, v] of Object.entries(p)) {
          if (typeof v !== "number" || !Number.isInteger(v)) err(p, k, `entry ${index + 1}: parameter "${k}" must be an integer`);
          params[k] = v as number;
        }
      }
      const suffix = Object.keys(params)
        .sort()
        .map((k) => `-${k}${params[k]}`)
        .join("");
      for (const seed of seeds) {
        const stem = `${size}-s${seed}${suffix}`;
        suite.instances.push({
          instance: typeof e.name === "string" && seeds.length === 1 ? e.name : `${scenario}/${stem}`,
          domain: typeof e.group === "string" ? e.group : scenario,
          domainFile: "",
          problemFile: "",
          configurations: configs,
          generator: { scenario, size, seed, params, stem, where: `${displayName}:${src.posOf(e).line}:${src.posOf(e).col}` },
        });
      }
    } else {
      const domainFile = fileAt("domain");
      const problemFile = fileAt("problem");
      const group = typeof e.group === "string" ? e.group : basename(dirname(domainFile));
      suite.instances.push({ instance: typeof e.name === "string" ? e.name : `${group}/${basename(problemFile).replace(/\.pddl$/i, "")}`, domain: group, domainFile, problemFile, configurations: configs });
    }
  });
  if (suite.instances.length === 0) throw new PlumblineError("semantic", `${displayName}: the suite has no entries`);
  suite.instances = dedupe(suite.instances);
  return suite;
}

/** Same files twice: merge their configurations; different files under one name: number them. */
function dedupe(list: InstanceSpec[]): InstanceSpec[] {
  const out: InstanceSpec[] = [];
  const byName = new Map<string, InstanceSpec>();
  for (const i of list) {
    const same = out.find((o) => sameSource(o, i));
    if (same) {
      same.configurations = same.configurations === null || i.configurations === null ? null : [...new Set([...same.configurations, ...i.configurations])];
      continue;
    }
    let name = i.instance;
    for (let k = 2; byName.has(name); k++) name = `${i.instance}#${k}`;
    const copy = { ...i, instance: name };
    byName.set(name, copy);
    out.push(copy);
  }
  return out;
}

function sameSource(a: InstanceSpec, b: InstanceSpec): boolean {
  if (a.generator || b.generator) return !!a.generator && !!b.generator && a.instance === b.instance && a.generator.stem === b.generator.stem && a.generator.scenario === b.generator.scenario;
  return a.domainFile === b.domainFile && a.problemFile === b.problemFile;
}
