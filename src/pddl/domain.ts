// Parses a PDDL domain file into the Domain syntax tree and checks it on its own terms
// (types, declarations, arities, variables); unsupported sections are refused by name.
import { PlumblineError, type SourcePos } from "../util/errors.js";
import { TOTAL_COST, type ActionDecl, type Domain, type Effect, type Formula, type FunctionDecl, type PredicateDecl, type Requirement, type TypeDecl, type TypedName } from "./ast.js";
import { bindVars, checkEffect, checkFormula, type CheckEnv } from "./check.js";
import { Cursor, errorAt, posOf } from "./cursor.js";
import { checkSections, readDefine, type Section } from "./define.js";
import { parseEffect } from "./effect.js";
import { parseFormula } from "./formula.js";
import { checkRequirement } from "./requirements.js";
import { parseTypedList, parseTypeSpec } from "./typed-list.js";
import { TypeTable } from "./types.js";

const REFUSED_DOMAIN_SECTIONS: Record<string, string> = {
  ":durative-action": "durative actions (:durative-action) are not supported",
  ":derived": "derived predicates (:derived) are not supported",
  ":axiom": "derived predicates (:axiom) are not supported",
  ":constraints": "state-trajectory constraints (:constraints) are not supported",
  ":process": "processes (:process) are not supported",
  ":event": "events (:event) are not supported",
};
const DOMAIN_SECTIONS = [":requirements", ":types", ":constants", ":predicates", ":functions", ":action"];

export function parseRequirements(s: Section): Requirement[] {
  const out: Requirement[] = [];
  while (!s.body.atEnd()) {
    const k = s.body.keyword("a requirement such as ':typing'");
    const pos = posOf(s.body.file, k);
    checkRequirement(k.text, pos);
    out.push({ name: k.text, pos });
  }
  return out;
}

function parsePredicates(s: Section): PredicateDecl[] {
  const out: PredicateDecl[] = [];
  while (!s.body.atEnd()) {
    const l = s.body.list("a predicate declaration '(name ?x - type …)'");
    const c = new Cursor(s.body.file, l);
    const name = c.name("a predicate name");
    const params = parseTypedList(c, "var", "a ?variable");
    out.push({ name: name.text, params, pos: posOf(s.body.file, l) });
  }
  return out;
}

function parseFunctions(s: Section): FunctionDecl[] {
  const out: FunctionDecl[] = [];
  const c = s.body;
  while (!c.atEnd()) {
    const n = c.peek();
    if (n && n.kind === "atom" && n.text === "-" && out.length > 0) {
      c.next("'-'");
      const at = c.peek();
      const types = parseTypeSpec(c);
      if (types.length !== 1 || types[0] !== "number") {
        throw new PlumblineError("unsupported", `function type '${types.join(" ")}': object fluents are not supported (functions must be '- number')`, posOf(c.file, at!));
      }
      continue;
    }
    const l = c.list("a function declaration '(name ?x - type …)'");
    const fc = new Cursor(c.file, l);
    const name = fc.name("a function name");
    const params = parseTypedList(fc, "var", "a ?variable");
    out.push({ name: name.text, params, pos: posOf(c.file, l) });
  }
  return out;
}

function parseAction(s: Section): ActionDecl {
  const c = s.body;
  const file = c.file;
  const name = c.name("an action name").text;
  let params: TypedName[] = [];
  let pre: Formula | null = null;
  let effect: Effect | null = null;
  const seen = new Set<string>();
  while (!c.atEnd()) {
    const k = c.keyword("':parameters', ':precondition' or ':effect'");
    if (seen.has(k.text)) throw errorAt(file, k, `'${k.text}' appears twice in action '${name}'`);
    seen.add(k.text);
    switch (k.text) {
      case ":parameters":
        params = parseTypedList(new Cursor(file, c.list("a parameter list '(?x - type …)'")), "var", "a ?variable");
        break;
      case ":precondition":
        pre = parseFormula(file, c.next("a precondition"), "precondition");
        break;
      case ":effect":
        effect = parseEffect(file, c.next("an effect"));
        break;
      default:
        throw errorAt(file, k, `expected ':parameters', ':precondition' or ':effect', found '${k.text}'`);
    }
  }
  const pos = posOf(file, s.list);
  return { name, params, pre, effect: effect ?? { kind: "and", effects: [], pos }, pos };
}

function hasCost(e: Effect): boolean {
  switch (e.kind) {
    case "cost":
      return true;
    case "and":
      return e.effects.some(hasCost);
    case "forall":
    case "when":
      return hasCost(e.body);
    default:
      return false;
  }
}

function dupCheck<T extends { name: string; pos: SourcePos }>(items: readonly T[], what: string): Map<string, T> {
  const m = new Map<string, T>();
  for (const it of items) {
    const old = m.get(it.name);
    if (old) throw new PlumblineError("semantic", `${what} '${it.name}' is declared twice (first at ${old.pos.line}:${old.pos.col})`, it.pos);
    m.set(it.name, it);
  }
  return m;
}

/** Everything the checks of a domain need, built once. */
export function domainEnv(d: Domain): CheckEnv {
  const types = new TypeTable(d.types);
  const predicates = dupCheck(d.predicates, "predicate");
  const functions = dupCheck(d.functions, "function");
  return { types, predicates, functions, objects: new Set(d.constants.map((c) => c.name)), objectWord: "constant" };
}

function checkDomain(d: Domain): void {
  const env = domainEnv(d);
  for (const c of d.constants) env.types.check(c.types, c.typePos ?? c.pos);
  for (const p of d.predicates) bindVars(env, p.params, new Map(), "parameter");
  for (const f of d.functions) {
    bindVars(env, f.params, new Map(), "parameter");
    if (f.name === TOTAL_COST && f.params.length > 0) throw new PlumblineError("semantic", "(total-cost) takes no arguments", f.pos);
  }
  dupCheck(d.actions, "action");
  for (const a of d.actions) {
    const scope = bindVars(env, a.params, new Map(), "parameter");
    if (a.pre) checkFormula(env, a.pre, scope);
    checkEffect(env, a.effect, scope);
  }
}

export function parseDomain(text: string, file: string): Domain {
  const frame = readDefine(text, file, "domain");
  const d: Domain = {
    file,
    name: frame.name,
    requirements: [],
    types: [],
    constants: [],
    predicates: [],
    functions: [],
    actions: [],
    hasActionCosts: false,
    pos: frame.pos,
  };
  checkSections(frame, "domain", DOMAIN_SECTIONS, REFUSED_DOMAIN_SECTIONS, [":action"]);
  for (const s of frame.sections) {
    const key = s.key.text;
    switch (key) {
      case ":requirements":
        d.requirements = parseRequirements(s);
        break;
      case ":types":
        d.types = parseTypedList(s.body, "name", "a type name").map((t): TypeDecl => ({ name: t.name, parents: t.types, pos: t.pos }));
        break;
      case ":constants":
        d.constants = parseTypedList(s.body, "name", "a constant name");
        break;
      case ":predicates":
        d.predicates = parsePredicates(s);
        break;
      case ":functions":
        d.functions = parseFunctions(s);
        break;
      case ":action":
        d.actions.push(parseAction(s));
        break;
    }
  }
  if (!d.functions.some((f) => f.name === TOTAL_COST)) {
    d.functions.push({ name: TOTAL_COST, params: [], pos: frame.pos });
  }
  checkDomain(d);
  d.hasActionCosts = d.actions.some((a) => hasCost(a.effect));
  return d;
}

