// A domain and a problem checked against each other, plus the symbol tables (objects with
// their types, predicates, cost values) that grounding and lifted replay both read.
import { readText } from "../util/files.js";
import { PlumblineError, type SourcePos } from "../util/errors.js";
import { TOTAL_COST, type ActionDecl, type Domain, type FunctionDecl, type PredicateDecl, type Problem } from "./ast.js";
import { checkFormula, type CheckEnv } from "./check.js";
import { domainEnv, parseDomain } from "./domain.js";
import { parseProblem } from "./problem.js";
import type { TypeTable } from "./types.js";

export interface CostValue {
  value: number;
  pos: SourcePos;
}

/** Objects, types and declarations of a checked model, indexed for fast lookups. */
export class Symbols {
  /** Domain constants first (in declaration order), then problem objects. Index = object id. */
  readonly objects: string[] = [];
  readonly objectIndex = new Map<string, number>();
  /** The declared types of each object (several if declared more than once or with `either`). */
  readonly objectTypes: string[][] = [];
  readonly predicates: ReadonlyMap<string, PredicateDecl>;
  /** Predicate names in declaration order. */
  readonly predicateNames: string[];
  readonly functions: ReadonlyMap<string, FunctionDecl>;
  readonly actions: ReadonlyMap<string, ActionDecl>;
  /** Static function values from :init, keyed "fn arg1 arg2". */
  readonly costValues = new Map<string, CostValue>();
  private readonly memberCache = new Map<string, readonly number[]>();

  constructor(
    readonly types: TypeTable,
    domain: Domain,
    problem: Problem,
  ) {
    for (const o of [...domain.constants, ...problem.objects]) {
      let id = this.objectIndex.get(o.name);
      if (id === undefined) {
        id = this.objects.length;
        this.objects.push(o.name);
        this.objectIndex.set(o.name, id);
        this.objectTypes.push([]);
      }
      for (const t of o.types) if (!this.objectTypes[id].includes(t)) this.objectTypes[id].push(t);
    }
    this.predicates = new Map(domain.predicates.map((p) => [p.name, p]));
    this.predicateNames = domain.predicates.map((p) => p.name);
    this.functions = new Map(domain.functions.map((f) => [f.name, f]));
    this.actions = new Map(domain.actions.map((a) => [a.name, a]));
  }

  /** True when object `obj` (id) belongs to some type of `spec`. */
  isA(obj: number, spec: readonly string[]): boolean {
    for (const t of this.objectTypes[obj]) {
      const anc = this.types.ancestors(t);
      for (const s of spec) if (anc.has(s)) return true;
    }
    return false;
  }

  /** Ids of the objects of type `spec` (a type or an `either` list), in object order. */
  membersOf(spec: readonly string[]): readonly number[] {
    const key = spec.join(" ");
    let m = this.memberCache.get(key);
    if (!m) {
      m = [];
      for (let o = 0; o < this.objects.length; o++) if (this.isA(o, spec)) (m as number[]).push(o);
      this.memberCache.set(key, m);
    }
    return m;
  }

  costKey(fn: string, args: readonly string[]): string {
    return args.length ? `${fn} ${args.join(" ")}` : fn;
  }
}

export interface Model {
  domain: Domain;
  problem: Problem;
  domainText: string;
  problemText: string;
  domainPath: string;
  problemPath: string;
  symbols: Symbols;
}

function semantic(message: string, pos: SourcePos): PlumblineError {
  return new PlumblineError("semantic", message, pos);
}

/** Checks `problem` against `domain` and builds the symbol tables. */
export function bindProblem(domain: Domain, problem: Problem): Symbols {
  if (problem.domainName !== domain.name) {
    throw semantic(`problem is for domain '${problem.domainName}', but ${domain.file} defines domain '${domain.name}'`, problem.domainPos);
  }
  const denv = domainEnv(domain);
  for (const o of problem.objects) denv.types.check(o.types, o.typePos ?? o.pos);
  const sym = new Symbols(denv.types, domain, problem);
  const env: CheckEnv = { ...denv, objects: new Set(sym.objects), objectWord: "object" };
  for (const a of problem.init) {
    const d = sym.predicates.get(a.pred);
    if (!d) throw semantic(`unknown predicate '${a.pred}'`, a.pos);
    if (d.params.length !== a.args.length) throw semantic(`predicate '${a.pred}' takes ${d.params.length} argument${d.params.length === 1 ? "" : "s"}, found ${a.args.length}`, a.pos);
    for (const x of a.args) if (!sym.objectIndex.has(x)) throw semantic(`unknown object '${x}'`, a.pos);
  }
  for (const v of problem.initValues) {
    const f = sym.functions.get(v.fn);
    if (!f) throw semantic(`unknown function '${v.fn}'`, v.pos);
    if (f.params.length !== v.args.length) throw semantic(`function '${v.fn}' takes ${f.params.length} argument${f.params.length === 1 ? "" : "s"}, found ${v.args.length}`, v.pos);
    for (const x of v.args) if (!sym.objectIndex.has(x)) throw semantic(`unknown object '${x}'`, v.pos);
    if (v.fn === TOTAL_COST) continue; // the start value of the cost counter plays no part in plan cost
    const term = `(${sym.costKey(v.fn, v.args)})`;
    if (!Number.isInteger(v.value) || v.value < 0) throw semantic(`cost value ${term} must be a non-negative integer, found ${v.value}`, v.valuePos);
    if (!Number.isSafeInteger(v.value)) throw semantic(`cost value ${term} = ${v.value} is too large`, v.valuePos);
    const key = sym.costKey(v.fn, v.args);
    const old = sym.costValues.get(key);
    if (old && old.value !== v.value) throw semantic(`${term} is given two values (${old.value} at ${old.pos.line}:${old.pos.col}, and ${v.value})`, v.pos);
    sym.costValues.set(key, { value: v.value, pos: v.valuePos });
  }
  checkFormula(env, problem.goal, new Map());
  return sym;
}

/** Parses and checks a domain and problem given as text (file names are for messages). */
export function modelFromTexts(domainText: string, domainPath: string, problemText: string, problemPath: string): Model {
  const domain = parseDomain(domainText, domainPath);
  const problem = parseProblem(problemText, problemPath);
  const symbols = bindProblem(domain, problem);
  return { domain, problem, domainText, problemText, domainPath, problemPath, symbols };
}

/** Reads, parses and checks a domain and problem file. */
export function loadModel(domainPath: string, problemPath: string): Model {
  return modelFromTexts(readText(domainPath), domainPath, readText(problemPath), problemPath);
}
