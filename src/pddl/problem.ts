// Parses a PDDL problem file into the Problem syntax tree (objects, init facts and cost
// values, goal, metric); what needs the domain is checked later in model.ts.
import { PlumblineError, type SourcePos } from "../util/errors.js";
import { TOTAL_COST, type InitAtom, type InitValue, type Problem } from "./ast.js";
import { Cursor, errorAt, posOf } from "./cursor.js";
import { checkSections, readDefine } from "./define.js";
import { parseRequirements } from "./domain.js";
import { parseFormula } from "./formula.js";
import { describe, type SList } from "./sexpr.js";
import { parseTypedList } from "./typed-list.js";

const PROBLEM_SECTIONS = [":domain", ":requirements", ":objects", ":init", ":goal", ":metric"];
const REFUSED_PROBLEM_SECTIONS: Record<string, string> = {
  ":constraints": "state-trajectory constraints (:constraints) are not supported",
  ":length": "plan length constraints (:length) are not supported",
};

function parseInitEntry(file: string, l: SList, atoms: InitAtom[], values: InitValue[]): void {
  const h = l.items[0];
  const pos = posOf(file, l);
  if (!h || h.kind !== "atom") throw errorAt(file, h ?? l, `expected an initial fact '(predicate object …)', found ${describe(l)}`);
  if (h.text === "not") throw errorAt(file, l, "negative literals are not allowed in :init (every fact not listed is false)");
  if (h.text === "at" && l.items[1]?.kind === "atom" && l.items[1].tok === "number") {
    throw new PlumblineError("unsupported", "timed initial literals '(at TIME …)' are not supported", pos);
  }
  if (h.text === "=") {
    const c = new Cursor(file, l, 1);
    const f = c.list("a function term '(function object …)' after '='");
    const fc = new Cursor(file, f);
    const fn = fc.name("a function name").text;
    const args: string[] = [];
    while (!fc.atEnd()) args.push(fc.name("an object name").text);
    const v = c.next("a number");
    if (v.kind !== "atom" || v.tok !== "number") throw errorAt(file, v, `expected a number, found ${describe(v)}`);
    c.end("(= …)");
    values.push({ fn, args, value: Number(v.text), pos, valuePos: posOf(file, v) });
    return;
  }
  if (h.tok !== "name") throw errorAt(file, h, `expected a predicate name, found ${describe(h)}`);
  const c = new Cursor(file, l, 1);
  const args: string[] = [];
  while (!c.atEnd()) args.push(c.name("an object name").text);
  atoms.push({ pred: h.text, args, pos });
}

function parseMetric(c: Cursor): { pos: SourcePos } {
  const dir = c.name("'minimize'");
  if (dir.text === "maximize") throw errorAt(c.file, dir, "metric 'maximize' is not supported (plumbline minimizes (total-cost))", "unsupported");
  if (dir.text !== "minimize") throw errorAt(c.file, dir, `expected 'minimize', found '${dir.text}'`);
  const e = c.next("(total-cost)");
  const ok = e.kind === "list" && e.items.length === 1 && e.items[0].kind === "atom" && e.items[0].text === TOTAL_COST;
  if (!ok) throw errorAt(c.file, e, `metric ${describe(e)} is not supported; only (:metric minimize (total-cost))`, "unsupported");
  c.end("(:metric …)");
  return { pos: posOf(c.file, e) };
}

export function parseProblem(text: string, file: string): Problem {
  const frame = readDefine(text, file, "problem");
  const p: Problem = {
    file,
    name: frame.name,
    domainName: "",
    domainPos: frame.pos,
    requirements: [],
    objects: [],
    init: [],
    initValues: [],
    goal: { kind: "and", args: [], pos: frame.pos },
    metric: null,
    pos: frame.pos,
  };
  checkSections(frame, "problem", PROBLEM_SECTIONS, REFUSED_PROBLEM_SECTIONS);
  const present = new Set(frame.sections.map((s) => s.key.text));
  for (const s of frame.sections) {
    const key = s.key.text;
    const c = s.body;
    switch (key) {
      case ":domain": {
        const n = c.name("the domain name");
        p.domainName = n.text;
        p.domainPos = posOf(file, n);
        c.end("(:domain NAME)");
        break;
      }
      case ":requirements":
        p.requirements = parseRequirements(s);
        break;
      case ":objects":
        p.objects = parseTypedList(c, "name", "an object name");
        break;
      case ":init":
        while (!c.atEnd()) parseInitEntry(file, c.list("an initial fact '(predicate object …)'"), p.init, p.initValues);
        break;
      case ":goal":
        p.goal = parseFormula(file, c.next("a goal formula"), "goal");
        c.end("(:goal …)");
        break;
      case ":metric":
        p.metric = parseMetric(c);
        break;
    }
  }
  if (!present.has(":domain")) throw new PlumblineError("parse", "expected a '(:domain NAME)' section in the problem", frame.pos);
  if (!present.has(":goal")) throw new PlumblineError("parse", "expected a '(:goal …)' section in the problem", frame.pos);
  return p;
}
