// Parses conditions (preconditions and goals): atoms, =, not, and, or, imply, exists,
// forall; numeric comparisons and preferences are refused by name.
import { PlumblineError } from "../util/errors.js";
import type { Formula, Term, AtomFormula } from "./ast.js";
import { Cursor, errorAt, posOf } from "./cursor.js";
import { describe, type SList, type SNode } from "./sexpr.js";
import { parseTypedList } from "./typed-list.js";

const NUMERIC_COMPARISONS = new Set(["<", ">", "<=", ">="]);

export function parseTerm(c: Cursor, what = "a term (?variable or object name)"): Term {
  const n = c.peek();
  if (n && n.kind === "atom" && (n.tok === "var" || n.tok === "name")) {
    c.next(what);
    return { kind: n.tok === "var" ? "var" : "const", name: n.text, pos: posOf(c.file, n) };
  }
  if (n && n.kind === "list") {
    throw errorAt(c.file, n, `expected ${what}, found ${describe(n)} (function terms are numeric fluents, which are not supported)`, "unsupported");
  }
  throw c.fail(what, n);
}

/** `(pred t1 t2 …)` whose head has already been checked to be a name. */
export function parseAtom(file: string, l: SList): AtomFormula {
  const c = new Cursor(file, l, 1);
  const args: Term[] = [];
  while (!c.atEnd()) args.push(parseTerm(c));
  return { kind: "atom", pred: (l.items[0] as { text: string }).text, args, pos: posOf(file, l) };
}

/** Parses one condition; `where` names the section for messages ("precondition", "goal"). */
export function parseFormula(file: string, n: SNode, where: string): Formula {
  if (n.kind === "atom") throw errorAt(file, n, `expected a ${where} formula '(…)', found ${describe(n)}`);
  const pos = posOf(file, n);
  if (n.items.length === 0) return { kind: "and", args: [], pos };
  const h = n.items[0];
  if (h.kind !== "atom") throw errorAt(file, h, `expected a predicate name or a connective, found ${describe(h)}`);
  const c = new Cursor(file, n, 1);
  const sub = (what: string) => parseFormula(file, c.next(what), where);
  switch (h.tok === "name" || h.tok === "symbol" ? h.text : "") {
    case "and":
    case "or": {
      const args: Formula[] = [];
      while (!c.atEnd()) args.push(sub("a formula"));
      return { kind: h.text as "and" | "or", args, pos };
    }
    case "not": {
      const arg = sub("a formula after 'not'");
      c.end("(not …)");
      return { kind: "not", arg, pos };
    }
    case "imply": {
      const left = sub("a condition after 'imply'");
      const right = sub("a second formula in (imply …)");
      c.end("(imply …)");
      return { kind: "imply", left, right, pos };
    }
    case "exists":
    case "forall": {
      const vl = c.list(`a variable list '(?x - type …)' after '${h.text}'`);
      const vars = parseTypedList(new Cursor(file, vl), "var", "a ?variable");
      const body = sub(`a formula in (${h.text} …)`);
      c.end(`(${h.text} …)`);
      return { kind: h.text as "exists" | "forall", vars, body, pos };
    }
    case "=": {
      const left = parseTerm(c);
      const right = parseTerm(c);
      c.end("(= …)");
      return { kind: "eq", left, right, pos };
    }
    case "preference":
      throw new PlumblineError("unsupported", "preferences are not supported", pos);
    case "when":
      throw errorAt(file, h, `'when' is an effect, not a ${where} condition`);
    case "":
      break;
    default:
      if (NUMERIC_COMPARISONS.has(h.text)) {
        throw new PlumblineError("unsupported", `numeric condition '(${h.text} …)': numeric fluents are not supported`, pos);
      }
      if (h.tok === "name") return parseAtom(file, n);
  }
  throw errorAt(file, h, `expected a predicate name or a connective (and, or, not, imply, exists, forall, =), found ${describe(h)}`);
}
